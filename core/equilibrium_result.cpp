// The result step of a TP solve: the temperature derivatives at the converged state (heat capacities,
// slopes for a later warm start), the amounts in mol, and the final element-balance checks.
#include <fmt/format.h>

#include <algorithm>
#include <cmath>
#include <limits>

#include "stackbound/core/equilibrium_steps.hpp"
#include "stackbound/units/constants.hpp"
#include "stackbound/units/input_error.hpp"

namespace stackbound::core {

namespace {

using detail::Iterate;
using detail::NewtonSystem;
using detail::TemperatureDerivatives;
using detail::Term;
using detail::TpProblem;
using detail::Vector;

constexpr double kR = units::kGasConstant_J_per_mol_K;
// A dependent balance row (restricted product list) that misses by more than this is infeasible.
constexpr double kDependentRowTolerance = 1e-9;

// The right-hand side -h of the temperature derivatives (RP-1311 eqs. 2.56-2.58 in TP form), with
// the frozen heat capacity and the enthalpy summed on the way.
Vector enthalpy_rhs(const TpProblem& problem, const Iterate& iterate, const NewtonSystem& system,
                    TemperatureDerivatives& derivatives) {
  const int nrow = system.dim - 1;
  Vector rhs_T = Vector::Zero(system.dim);
  double frozen_cp = 0.0;
  double enthalpy = 0.0;
  for (std::size_t j = 0; j < problem.gas.size(); ++j) {
    const Term& t = problem.gas[j];
    const double nh = system.n[j] * t.h;
    frozen_cp += system.n[j] * t.cp;
    enthalpy += nh;
    rhs_T[nrow] -= nh;
    for (int p = 0; p < t.count; ++p)
      rhs_T[t.row[static_cast<std::size_t>(p)]] -= t.atoms[static_cast<std::size_t>(p)] * nh;
  }
  for (std::size_t c = 0; c < problem.condensed.size(); ++c) {
    if (iterate.included[c] == 0) continue;
    const Term& t = problem.condensed[c];
    frozen_cp += iterate.nc[c] * t.cp;
    enthalpy += iterate.nc[c] * t.h;
    rhs_T[system.condensed_position[c]] = -t.h;
  }
  derivatives.frozen_cp = frozen_cp;
  derivatives.enthalpy = enthalpy;
  return rhs_T;
}

}  // namespace

// Converged: the system's matrix is the Newton matrix at the solution. The temperature derivatives
// solve the same matrix with the right-hand side -h.
detail::TemperatureDerivatives detail::temperature_derivatives(const TpProblem& problem, const Iterate& iterate,
                                                               NewtonOutcome& outcome) {
  const NewtonSystem& system = outcome.system;
  TemperatureDerivatives derivatives;
  const Vector rhs_T = enthalpy_rhs(problem, iterate, system, derivatives);
  double equilibrium_cp = derivatives.frozen_cp;
  derivatives.potential_slopes.fill(std::numeric_limits<double>::quiet_NaN());
  // The factorisation of the last Newton step serves: its matrix differs from the one at the
  // solution by the last (converged) correction, far below the accuracy a heat capacity needs.
  if (outcome.iterations == 0) {  // converged at the start: factorise the matrix at the solution
    outcome.lu.compute(system.M, problem.rows, std::exp(iterate.lnN));
  }
  if (outcome.lu.dimension() == system.dim) {
    const Vector derivative = outcome.lu.solve(rhs_T);
    if (derivative.allFinite()) {
      const double dlnN = derivative[system.dim - 1];
      derivatives.gas_moles_slope = dlnN;
      for (int r = 0; r < problem.rows; ++r) {
        derivatives.potential_slopes[problem.element_of_row[static_cast<std::size_t>(r)]] = derivative[r];
      }
      for (std::size_t j = 0; j < problem.gas.size(); ++j) {
        const Term& t = problem.gas[j];
        const double dln = plus_potentials(dlnN + t.h, t, derivative);
        equilibrium_cp += system.n[j] * t.h * dln;
      }
      for (std::size_t c = 0; c < problem.condensed.size(); ++c) {
        if (iterate.included[c] != 0) {
          equilibrium_cp += problem.condensed[c].h * derivative[system.condensed_position[c]];
        }
      }
    }
  }
  derivatives.equilibrium_cp = equilibrium_cp;
  return derivatives;
}

EquilibriumResult EquilibriumWork::make_result(const EquilibriumSolver& solver, const detail::TpProblem& problem,
                                               const detail::Iterate& iterate, const detail::NewtonOutcome& outcome,
                                               const detail::TemperatureDerivatives& derivatives) {
  const double T = problem.temperature_K;
  EquilibriumResult result;
  result.temperature_K = T;
  result.pressure_Pa = problem.pressure_Pa;
  result.species = solver.names_;
  result.species_key = solver.species_key_;
  set_amounts(solver, problem, iterate, outcome.system, result);
  result.iterations = outcome.iterations;
  result.enthalpy_J = derivatives.enthalpy * kR * T * problem.scale;
  result.frozen_heat_capacity_J_per_K = derivatives.frozen_cp * kR * problem.scale;
  result.equilibrium_heat_capacity_J_per_K = derivatives.equilibrium_cp * kR * problem.scale;
  result.element_potentials.fill(0.0);
  for (int r = 0; r < problem.rows; ++r) {
    const std::size_t ur = static_cast<std::size_t>(r);
    result.element_potentials[problem.element_of_row[ur]] = iterate.pi[ur];
  }
  result.element_potential_slopes = derivatives.potential_slopes;
  result.gas_moles_slope = derivatives.gas_moles_slope;
  check_balances(solver, problem, result);
  return result;
}

// Amounts in mol (a gas amount below the matrix floor from its ln n_j), gas mole fractions, and
// whether graphite is present.
void EquilibriumWork::set_amounts(const EquilibriumSolver& solver, const detail::TpProblem& problem,
                                  const detail::Iterate& iterate, const detail::NewtonSystem& system,
                                  EquilibriumResult& result) {
  result.moles.assign(solver.names_.size(), 0.0);
  result.mole_fractions.assign(solver.names_.size(), 0.0);
  const std::vector<Term>& gas = problem.gas;
  double gas_total = 0.0;
  for (std::size_t j = 0; j < gas.size(); ++j) {
    const bool entered = system.n[j] > 0.0 && iterate.lnn[j] - iterate.lnN > detail::kMatrixFloorLogFraction;
    const double moles = (entered ? system.n[j] : std::exp(iterate.lnn[j])) * problem.scale;
    result.moles[gas[j].candidate] = moles;
    gas_total += moles;
  }
  for (std::size_t j = 0; j < gas.size(); ++j) {
    result.mole_fractions[gas[j].candidate] = result.moles[gas[j].candidate] / gas_total;
  }
  for (std::size_t c = 0; c < problem.condensed.size(); ++c) {
    const std::size_t candidate = problem.condensed[c].candidate;
    const double moles = iterate.included[c] != 0 ? iterate.nc[c] * problem.scale : 0.0;
    result.moles[candidate] = moles;
    if (moles > 0.0 && solver.names_[candidate] == "C(gr)") result.graphite_present = true;
  }
  result.total_gas_moles = gas_total;
}

// Element balances of the reported amounts, every active element (dependent rows included): a
// dependent row that misses means the products cannot hold the feed (InputError); an independent
// one that misses is a numerical failure (ConvergenceError).
void EquilibriumWork::check_balances(const EquilibriumSolver& solver, const detail::TpProblem& problem,
                                     EquilibriumResult& result) {
  ElementAmounts products;
  for (const std::vector<Term>* terms : {&problem.gas, &problem.condensed}) {
    for (const Term& t : *terms) {
      const Candidate& c = solver.candidates_[t.candidate];
      for (int e = 0; e < c.element_count; ++e) {
        const std::size_t k = c.elements[static_cast<std::size_t>(e)];
        products.moles[k] += c.atoms[k] * result.moles[t.candidate];
      }
    }
  }
  result.element_residual = 0.0;
  double dependent_residual = 0.0;
  for (std::size_t k = 0; k < kElementCount; ++k) {
    if (!problem.active[k]) continue;
    const double miss = std::abs(products.moles[k] - problem.b.moles[k]) / problem.b.moles[k];
    result.element_residual = std::max(result.element_residual, miss);
    if (!problem.independent[k]) dependent_residual = std::max(dependent_residual, miss);
  }
  if (dependent_residual > kDependentRowTolerance) {
    throw units::InputError(fmt::format(
        "species = \"{}\": these products cannot hold the feed's elements in its proportions (elements {}); "
        "add products that can",
        fmt::join(solver.names_, ","), detail::element_list(problem.active)));
  }
  if (!(result.element_residual <= 1e3 * solver.options_.element_tolerance)) {
    throw ConvergenceError("element balances not met at the end", result.iterations, result.element_residual,
                           problem.temperature_K, problem.pressure_Pa);
  }
}

}  // namespace stackbound::core
