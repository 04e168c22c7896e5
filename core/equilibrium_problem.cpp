// The problem step of a TP solve: the checks of T, P and the element amounts, the balance rows, and
// the usable species with their dimensionless properties at T.
#include <fmt/format.h>

#include <algorithm>
#include <cmath>
#include <limits>

#include "stackbound/core/elements.hpp"
#include "stackbound/core/equilibrium_steps.hpp"
#include "stackbound/units/constants.hpp"
#include "stackbound/units/input_error.hpp"

namespace stackbound::core {

namespace {

// A species below e^-60 of every balance it enters is left out of the Newton matrix.
constexpr double kNegligibleLogShare = -60.0;

void nasa7_properties(const std::array<double, 7>& a, double T, double lnT, double& g, double& h, double& cp) {
  const double T2 = T * T;
  const double T3 = T2 * T;
  const double T4 = T3 * T;
  cp = a[0] + a[1] * T + a[2] * T2 + a[3] * T3 + a[4] * T4;
  h = a[0] + a[1] * T / 2 + a[2] * T2 / 3 + a[3] * T3 / 4 + a[4] * T4 / 5 + a[5] / T;
  const double s = a[0] * lnT + a[1] * T + a[2] * T2 / 2 + a[3] * T3 / 3 + a[4] * T4 / 4 + a[6];
  g = h - s;
}

}  // namespace

detail::TpProblem EquilibriumWork::make_problem(const EquilibriumSolver& solver, const ElementAmounts& b_in, double T,
                                                double P) {
  solver.check_temperature(T);
  if (!std::isfinite(P) || P <= 0.0) {
    throw units::InputError(fmt::format("pressure = {:g} Pa: must be a finite pressure > 0 Pa", P));
  }
  detail::TpProblem problem;
  problem.temperature_K = T;
  problem.pressure_Pa = P;
  problem.active = active_elements(solver, b_in, problem.scale);
  problem.b = b_in;
  set_rows(solver, problem);
  set_species_at_temperature(solver, problem);
  if (problem.gas.empty()) {
    throw units::InputError(fmt::format("element amounts: with the elements {} present, no gas product remains",
                                        detail::element_list(problem.active)));
  }
  return problem;
}

// Active elements: those with a positive amount; `scale` = their sum, mol.
std::array<bool, kElementCount> EquilibriumWork::active_elements(const EquilibriumSolver& solver,
                                                                 const ElementAmounts& b_in, double& scale) {
  std::array<bool, kElementCount> active{};
  scale = 0.0;
  for (std::size_t k = 0; k < kElementCount; ++k) {
    const double amount = b_in.moles[k];
    if (!std::isfinite(amount) || amount < 0.0) {
      throw units::InputError(fmt::format("element amounts: {} = {}: must be a finite number >= 0 mol",
                                          known_elements()[k].symbol, amount));
    }
    if (amount > 0.0 && !solver.element_allowed_[k]) {
      throw units::InputError(
          fmt::format("element amounts: {} = {:g} mol, but this solver was built for the elements {} only",
                      known_elements()[k].symbol, amount, detail::element_list(solver.element_allowed_)));
    }
    active[k] = amount > 0.0;
    scale += amount;
  }
  if (!(scale > 0.0) || !std::isfinite(scale)) {
    throw units::InputError("element amounts: every element amount is zero; the feed holds no atoms");
  }
  return active;
}

// Rows: the independent ones among the active elements, with their amounts per mole of feed atoms.
void EquilibriumWork::set_rows(const EquilibriumSolver& solver, detail::TpProblem& problem) {
  problem.independent =
      problem.active == solver.element_allowed_ ? solver.independent_all_ : solver.independent_rows(problem.active);
  int E = 0;
  for (std::size_t k = 0; k < kElementCount; ++k) {
    problem.row_of[k] = -1;
    if (problem.independent[k]) {
      problem.row_of[k] = E;
      problem.element_of_row[static_cast<std::size_t>(E)] = k;
      ++E;
    }
  }
  problem.rows = E;
  for (std::size_t r = 0; r < static_cast<std::size_t>(E); ++r) {
    problem.bs[r] = problem.b.moles[problem.element_of_row[r]] / problem.scale;
    problem.ln_bs[r] = std::log(problem.bs[r]);
  }
}

// Active species (no element with zero amount) with their properties at T, and the amount below
// which each is negligible in every balance it enters.
void EquilibriumWork::set_species_at_temperature(const EquilibriumSolver& solver, detail::TpProblem& problem) {
  const double T = problem.temperature_K;
  const double lnT = std::log(T);
  const double lnP = std::log(problem.pressure_Pa / units::kStandardStatePressure_Pa);
  if (problem.active == solver.element_allowed_) {
    problem.gas = solver.tables_->gas;
    problem.condensed = solver.tables_->condensed;
  } else {
    solver.build_terms(problem.active, problem.row_of, problem.gas, problem.condensed);
  }
  for (std::vector<detail::Term>* terms : {&problem.gas, &problem.condensed}) {
    for (detail::Term& term : *terms) {
      const Candidate& c = solver.candidates_[term.candidate];
      nasa7_properties(T < c.mid_K ? c.below_mid : c.above_mid, T, lnT, term.g, term.h, term.cp);
      if (c.gas) term.g += lnP;
      term.negligible_ln_moles =
          term.count > 0 ? std::numeric_limits<double>::infinity() : -std::numeric_limits<double>::infinity();
      for (int p = 0; p < term.count; ++p) {
        const std::size_t up = static_cast<std::size_t>(p);
        term.negligible_ln_moles =
            std::min(term.negligible_ln_moles,
                     problem.ln_bs[static_cast<std::size_t>(term.row[up])] - term.log_atoms[up] + kNegligibleLogShare);
      }
    }
  }
}

}  // namespace stackbound::core
