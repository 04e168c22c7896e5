#include "stackbound/cases/equilibrium_query.hpp"

#include <cmath>

#include <fmt/format.h>

#include "stackbound/cases/option_values.hpp"
#include "stackbound/core/adiabatic_flame.hpp"
#include "stackbound/core/composition_notation.hpp"
#include "stackbound/core/element_amounts.hpp"
#include "stackbound/core/post_flame.hpp"
#include "stackbound/units/constants.hpp"
#include "stackbound/units/input_error.hpp"
#include "stackbound/units/quantity_parser.hpp"

namespace stackbound::cases {

namespace {

// Longest --residence-time accepted: far beyond any furnace, so a larger value is taken as a mistake
// in the unit. Our choice, no source.
constexpr double kMaximumResidenceTime_s = 3600.0;

// --residence-time parsed and checked at the edge: a finite time, 0 s ... 1 h.
std::optional<units::Time> residence_time_option(const std::string& text) {
  if (text.empty()) return std::nullopt;
  const units::Time time = units::parse_time(text, "--residence-time");
  const double seconds = time.value();
  if (!(std::isfinite(seconds) && seconds >= 0.0 && seconds <= kMaximumResidenceTime_s)) {
    throw units::InputError(
        fmt::format("--residence-time = \"{}\" ({:g} s): must be a finite time from 0 s to {:g} s (1 h)", text, seconds,
                    kMaximumResidenceTime_s));
  }
  return time;
}

// Solver messages name their fields plainly ("species = ..."); on the command line they are options.
[[noreturn]] void rethrow_as_option(const units::InputError& error) {
  const std::string message = error.what();
  for (const char* field : {"species", "temperature", "pressure"}) {
    if (message.rfind(field, 0) == 0) throw units::InputError("--" + message);
  }
  throw error;
}

void check_mode(const EquilibriumQuery& query) {
  if (query.adiabatic && !query.temperature.empty()) {
    throw units::InputError(fmt::format(
        "--temperature = \"{}\": give either --temperature (fixed T) or --adiabatic, not both", query.temperature));
  }
  if (!query.adiabatic && query.temperature.empty()) {
    throw units::InputError("--temperature: missing; give --temperature (e.g. 1800K) or --adiabatic");
  }
  if (!query.adiabatic && !query.feed_temperature.empty()) {
    throw units::InputError(
        fmt::format("--feed-temperature = \"{}\": applies only with --adiabatic", query.feed_temperature));
  }
  if (!query.adiabatic && !query.heat_loss.empty()) {
    throw units::InputError(fmt::format("--heat-loss = \"{}\": applies only with --adiabatic", query.heat_loss));
  }
}

}  // namespace

EquilibriumAnswer solve_equilibrium_query(const EquilibriumQuery& query, const core::SpeciesDatabase& database) {
  EquilibriumAnswer answer;
  answer.adiabatic = query.adiabatic;
  answer.feed = core::parse_reactants(query.feed, "--feed", database);
  const core::ElementAmounts b = core::element_amounts(database, answer.feed, "--feed");
  const double pressure_Pa = query.pressure.empty()
                                 ? units::kStandardAtmosphere_Pa
                                 : checked_pressure(query.pressure, "--pressure", kFiringPressure).value();
  check_mode(query);
  const std::optional<units::Time> residence_time = residence_time_option(query.residence_time);
  std::vector<std::string> candidates;
  if (!query.species.empty()) {
    candidates = split_list(query.species, "--species");
    for (const std::string& name : candidates) (void)database.at(name, "--species");
  }

  answer.feed_temperature_K = units::kReferenceTemperature_K;
  try {
    const core::EquilibriumSolver solver(database, b, candidates);
    if (query.adiabatic) {
      if (!query.feed_temperature.empty()) {
        answer.feed_temperature_K = units::parse_temperature(query.feed_temperature, "--feed-temperature").value();
      }
      const double loss = query.heat_loss.empty() ? 0.0 : units::parse_fraction(query.heat_loss, "--heat-loss");
      if (loss < 0.0 || loss >= 1.0) {
        throw units::InputError(
            fmt::format("--heat-loss = \"{}\": must be at least 0 % and below 100 %", query.heat_loss));
      }
      const units::Energy enthalpy =
          core::feed_enthalpy(database, answer.feed, units::kelvin(answer.feed_temperature_K), "--feed-temperature");
      const units::Energy heating_value =
          loss > 0.0 ? core::feed_heating_value(database, answer.feed, core::HeatingValueKind::higher, "--feed")
                     : units::joules(0.0);
      answer.result =
          solver.solve_hp(b, core::hp_target_enthalpy(enthalpy, loss, heating_value), units::pascals(pressure_Pa));
    } else {
      const double temperature_K = units::parse_temperature(query.temperature, "--temperature").value();
      answer.result = solver.solve_tp(b, units::kelvin(temperature_K), units::pascals(pressure_Pa));
    }
  } catch (const units::InputError& error) {
    rethrow_as_option(error);
  }
  // Thermal NO at the solved state: the fixed T, or with --adiabatic the adiabatic flame temperature.
  if (residence_time) {
    try {
      answer.thermal_no =
          core::thermal_no(core::post_flame_gas(answer.result), *residence_time, {.field = "--residence-time"});
    } catch (const units::InputError& error) {
      throw units::InputError(fmt::format("--residence-time = \"{}\": {}", query.residence_time, error.what()));
    }
  }
  return answer;
}

}  // namespace stackbound::cases
