#include "stackbound/core/adiabatic_flame.hpp"

#include <fmt/format.h>

#include <algorithm>
#include <cmath>

#include "stackbound/core/elements.hpp"
#include "stackbound/core/fuel.hpp"
#include "stackbound/units/input_error.hpp"

namespace stackbound::core {

namespace {
constexpr double kR = units::kGasConstant_J_per_mol_K;
constexpr double kColdStartTemperature_K = 2000.0;

double enthalpy_298_J_per_mol(const Species& species) {
  const double T = units::kReferenceTemperature_K;
  return kR * T * species.h_over_RT(units::kelvin(T));
}

const Species& required(const SpeciesDatabase& db, std::string_view formula, std::string_view field) {
  const Species* species = db.find(formula);
  if (species == nullptr) {
    throw units::InputError(fmt::format(
        "{}: the heating value needs the complete-combustion product {} in the species data", field, formula));
  }
  return *species;
}
}  // namespace

// ---------------------------------------------------------------------------------------------------
// HP equilibrium: safeguarded Newton on T.

EquilibriumResult EquilibriumSolver::solve_hp(const ElementAmounts& b, units::Energy target_enthalpy,
                                              units::Pressure pressure, const EquilibriumResult* warm_start) const {
  const double target_enthalpy_J = target_enthalpy.value();
  const double pressure_Pa = pressure.value();
  if (!std::isfinite(target_enthalpy_J)) {
    throw units::InputError(fmt::format("target enthalpy = {:g} J: must be a finite number", target_enthalpy_J));
  }
  const double low_limit_K = min_temperature_K_;
  const double high_limit_K = max_temperature_K_;
  // The first temperature at or above T that every candidate's data covers (records that start at
  // 300 K admit 298.15 K but not the gap between).
  const auto covered = [this](double T) {
    for (const Candidate& c : candidates_) {
      if (!c.species->covers(units::kelvin(T))) T = std::max(T, c.species->range().low.value());
    }
    return T;
  };
  double T = kColdStartTemperature_K;
  if (warm_start != nullptr && std::isfinite(warm_start->temperature_K)) T = warm_start->temperature_K;
  T = covered(std::clamp(T, low_limit_K, high_limit_K));

  double bracket_low_K = low_limit_K;
  double bracket_high_K = high_limit_K;
  bool low_evaluated = false;
  bool high_evaluated = false;
  int iterations = 0;
  EquilibriumResult previous;
  const EquilibriumResult* seed = warm_start;
  for (int step = 1; step <= options_.max_temperature_iterations; ++step) {
    EquilibriumResult current = solve_tp(b, units::kelvin(T), pressure, seed);
    iterations += current.iterations;
    const double excess_J = current.enthalpy_J - target_enthalpy_J;
    if (excess_J > 0.0) {
      bracket_high_K = T;
      high_evaluated = true;
    } else {
      bracket_low_K = T;
      low_evaluated = true;
    }
    double cp = current.equilibrium_heat_capacity_J_per_K;
    if (!(cp > 0.0) || !std::isfinite(cp)) cp = current.frozen_heat_capacity_J_per_K;
    const double newton_K = -excess_J / cp;
    const bool bracket_closed =
        low_evaluated && high_evaluated && bracket_high_K - bracket_low_K <= options_.temperature_tolerance_K;
    if (std::abs(newton_K) <= options_.temperature_tolerance_K || bracket_closed) {
      current.iterations = iterations;
      current.temperature_iterations = step;
      return current;
    }
    if (T >= high_limit_K && excess_J < 0.0) {
      throw units::InputError(fmt::format(
          "target enthalpy = {:g} J: the products would be hotter than {:g} K, the upper end of the species "
          "data (products' enthalpy there {:g} J)",
          target_enthalpy_J, high_limit_K, current.enthalpy_J));
    }
    if (T <= low_limit_K && excess_J > 0.0) {
      throw units::InputError(fmt::format(
          "target enthalpy = {:g} J: the products would be colder than {:g} K, the lower end of the species "
          "data (products' enthalpy there {:g} J)",
          target_enthalpy_J, low_limit_K, current.enthalpy_J));
    }
    double next = T + newton_K;
    if (next >= bracket_high_K) {
      next = high_evaluated ? 0.5 * (bracket_low_K + bracket_high_K) : high_limit_K;
    } else if (next <= bracket_low_K) {
      next = low_evaluated ? 0.5 * (bracket_low_K + bracket_high_K) : low_limit_K;
    }
    previous = std::move(current);
    seed = &previous;
    T = covered(next);
  }
  throw ConvergenceError(fmt::format("adiabatic temperature not found in {} Newton steps on T (bracket {:g}-{:g} K)",
                                     options_.max_temperature_iterations, bracket_low_K, bracket_high_K),
                         iterations, previous.element_residual, T, pressure_Pa);
}

// ---------------------------------------------------------------------------------------------------
// Heating values and the HP target.

units::Energy feed_heating_value(const SpeciesDatabase& db, std::span<const SpeciesAmount> feed, HeatingValueKind basis,
                                 std::string_view field) {
  (void)element_amounts(db, feed, field);  // validates names and amounts
  double total_J = 0.0;
  for (const SpeciesAmount& entry : feed) {
    if (entry.moles == 0.0) continue;
    const Species& species = db.at(entry.formula, field);
    const double c = species.atoms_of("C");
    const double h = species.atoms_of("H");
    const double o = species.atoms_of("O");
    const double n = species.atoms_of("N");
    const double s = species.atoms_of("S");
    const double oxygen_demand = c + h / 4 + s - o / 2;  // mol O2 per mol species
    double products_J = 0.0;
    if (c > 0.0) products_J += c * enthalpy_298_J_per_mol(required(db, "CO2", field));
    if (h > 0.0) products_J += h / 2 * enthalpy_298_J_per_mol(required(db, "H2O", field));
    if (s > 0.0) products_J += s * enthalpy_298_J_per_mol(required(db, "SO2", field));
    if (n > 0.0) products_J += n / 2 * enthalpy_298_J_per_mol(required(db, "N2", field));
    if (oxygen_demand != 0.0) products_J -= oxygen_demand * enthalpy_298_J_per_mol(required(db, "O2", field));
    double released_J = enthalpy_298_J_per_mol(species) - products_J;
    if (released_J <= 0.0) continue;  // nothing to burn (O2, N2, CO2, H2O, Ar, ...)
    if (basis == HeatingValueKind::higher) released_J += h / 2 * kWaterVaporisationEnthalpy298_J_per_mol;
    total_J += entry.moles * released_J;
  }
  return units::joules(total_J);
}

units::Energy hp_target_enthalpy(units::Energy feed_enthalpy, double heat_loss_fraction, units::Energy heating_value) {
  const double feed_enthalpy_J = feed_enthalpy.value();
  const double heating_value_J = heating_value.value();
  if (!std::isfinite(heat_loss_fraction) || heat_loss_fraction < 0.0 || heat_loss_fraction >= 1.0) {
    throw units::InputError(fmt::format(
        "heat loss = {:g}: must be a fraction of the heating value in [0, 1) (e.g. 0.05 for 5 %)", heat_loss_fraction));
  }
  if (!std::isfinite(heating_value_J) || heating_value_J < 0.0) {
    throw units::InputError(fmt::format("heating value = {:g} J: must be a finite number >= 0 J", heating_value_J));
  }
  if (!std::isfinite(feed_enthalpy_J)) {
    throw units::InputError(fmt::format("feed enthalpy = {:g} J: must be a finite number", feed_enthalpy_J));
  }
  return units::joules(feed_enthalpy_J - heat_loss_fraction * heating_value_J);
}

EquilibriumResult adiabatic_flame(const SpeciesDatabase& db, std::span<const FeedStream> streams,
                                  const AdiabaticFlameOptions& options) {
  if (streams.empty()) {
    throw units::InputError("feed: no reactant streams; give at least one species with a positive amount");
  }
  ElementAmounts b;
  double enthalpy_J = 0.0;
  double heating_value_J = 0.0;
  for (const FeedStream& stream : streams) {
    b.add(element_amounts(db, stream.species));
    enthalpy_J += feed_enthalpy(db, stream.species, stream.temperature).value();
    if (options.heat_loss_fraction != 0.0) {
      heating_value_J += feed_heating_value(db, stream.species, options.heating_value_kind).value();
    }
  }
  const units::Energy target =
      hp_target_enthalpy(units::joules(enthalpy_J), options.heat_loss_fraction, units::joules(heating_value_J));
  const EquilibriumSolver solver(db, b, options.candidates);
  return solver.solve_hp(b, target, options.pressure);
}

}  // namespace stackbound::core
