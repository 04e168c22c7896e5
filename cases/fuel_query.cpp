#include "stackbound/cases/fuel_query.hpp"

#include <fmt/format.h>

#include "stackbound/cases/option_values.hpp"
#include "stackbound/cases/plausible_ranges.hpp"
#include "stackbound/units/constants.hpp"
#include "stackbound/units/input_error.hpp"
#include "stackbound/units/quantity_parser.hpp"

namespace stackbound::cases {

namespace {

using units::Dimension;

// The command line checks its choices before they get here; other front ends pass any text.
void check_choice(const std::string& value, std::string_view option, std::string_view first, std::string_view second) {
  if (value != first && value != second) {
    throw units::InputError(
        fmt::format("{} = \"{}\": not an accepted value; accepted: {}, {}", option, value, first, second));
  }
}

core::Oxidant build_oxidant(const FuelConditions& o) {
  core::OxidantOptions options;
  options.temperature_field = "--air-temperature";
  options.enrichment_field = "--o2-enrichment";
  if (!o.air_temperature.empty())
    options.temperature = units::parse_temperature(o.air_temperature, "--air-temperature");
  if (!o.relative_humidity.empty() && !o.humidity_ratio.empty()) {
    throw units::InputError("--relative-humidity, --humidity-ratio: give one of them, not both");
  }
  if (!o.relative_humidity.empty()) {
    const double rh = units::parse_fraction(o.relative_humidity, "--relative-humidity");
    const units::Temperature ambient = o.ambient_temperature.empty()
                                           ? units::kelvin(288.15)
                                           : units::parse_temperature(o.ambient_temperature, "--ambient-temperature");
    const units::Pressure pressure = o.ambient_pressure.empty()
                                         ? units::pascals(units::kStandardAtmosphere_Pa)
                                         : checked_pressure(o.ambient_pressure, "--ambient-pressure", kAmbientPressure);
    options.humidity = core::Humidity::relative(rh, ambient, pressure, "--relative-humidity");
  } else if (!o.ambient_temperature.empty() || !o.ambient_pressure.empty()) {
    throw units::InputError(
        "--ambient-temperature, --ambient-pressure: they state where --relative-humidity was "
        "measured; give --relative-humidity too");
  }
  if (!o.humidity_ratio.empty()) {
    options.humidity = core::Humidity::ratio(
        units::parse_quantity(o.humidity_ratio, "--humidity-ratio", {Dimension::dimensionless}).value_si,
        "--humidity-ratio");
  }
  if (!o.o2_enrichment.empty()) {
    options.enriched_o2_fraction = units::parse_fraction(o.o2_enrichment, "--o2-enrichment");
  }
  return core::Oxidant(options);
}

core::OperatingPoint build_operating_point(const FuelConditions& o, std::optional<double> file_temperature_K) {
  const int given = !o.excess_air.empty() + !o.lambda.empty() + !o.phi.empty() + !o.flue_o2.empty();
  if (given > 1) {
    throw units::InputError("--excess-air, --lambda, --phi, --flue-o2: give one of them, not several");
  }
  core::OperatingPoint op = core::OperatingPoint::with_excess_air(0.0, "--excess-air");
  if (!o.excess_air.empty()) {
    op = core::OperatingPoint::with_excess_air(units::parse_fraction(o.excess_air, "--excess-air"), "--excess-air");
  } else if (!o.lambda.empty()) {
    op = core::OperatingPoint::with_air_ratio(
        units::parse_quantity(o.lambda, "--lambda", {Dimension::dimensionless}).value_si, "--lambda");
  } else if (!o.phi.empty()) {
    op = core::OperatingPoint::with_equivalence_ratio(
        units::parse_quantity(o.phi, "--phi", {Dimension::dimensionless}).value_si, "--phi");
  } else if (!o.flue_o2.empty()) {
    op = core::OperatingPoint::with_flue_o2(units::parse_fraction(o.flue_o2, "--flue-o2"),
                                            o.flue_o2_basis == "wet" ? core::GasBasis::wet : core::GasBasis::dry,
                                            "--flue-o2");
  }
  if (!o.fuel_temperature.empty()) {
    op.fuel_temperature = units::parse_temperature(o.fuel_temperature, "--fuel-temperature");
  } else if (file_temperature_K) {
    op.fuel_temperature = units::kelvin(*file_temperature_K);
  }
  op.fuel_temperature_field = "--fuel-temperature";
  if (!o.pressure.empty()) op.flue_pressure = checked_pressure(o.pressure, "--pressure", kStackPressure);
  return op;
}

std::string operating_point_text(const FuelConditions& o, const core::CombustionResult& r) {
  std::string how = "stoichiometric (no operating point given)";
  if (!o.excess_air.empty()) how = fmt::format("given as excess air {}", o.excess_air);
  if (!o.lambda.empty()) how = fmt::format("given as lambda {}", o.lambda);
  if (!o.phi.empty()) how = fmt::format("given as phi {}", o.phi);
  if (!o.flue_o2.empty()) how = fmt::format("solved from flue O2 {} ({})", o.flue_o2, o.flue_o2_basis);
  return how + fmt::format("; excess air {:.2f} %, lambda {:.4f}, phi {:.4f}", r.excess_air() * 100.0, r.air_ratio,
                           r.equivalence_ratio());
}

}  // namespace

FuelAnswer burn_fuel_query(const FuelFile& supply, const FuelConditions& conditions,
                           const core::SpeciesDatabase& database) {
  check_choice(conditions.flue_o2_basis, "--flue-o2-basis", "dry", "wet");
  check_choice(conditions.heat_basis, "--heat-basis", "hhv", "lhv");
  const core::Oxidant oxidant = build_oxidant(conditions);
  const core::OperatingPoint op = build_operating_point(conditions, supply.temperature_K);
  const core::CombustionResult result = core::burn(supply.fuel, oxidant, op, database);
  const core::HeatInputBasis basis =
      conditions.heat_basis == "lhv" ? core::HeatInputBasis::lhv : core::HeatInputBasis::hhv;
  std::optional<core::CombustionRates> rates;
  if (!conditions.rate.empty()) {
    const units::ParsedQuantity rate = units::parse_quantity(
        conditions.rate, "--rate", {Dimension::mass_flow, Dimension::molar_flow, Dimension::power});
    if (const auto problem = outside(rate.value_si, feed_range(rate.dimension))) {
      throw units::InputError(fmt::format("--rate = \"{}\": {}", conditions.rate, *problem));
    }
    rates = core::rates(result, core::resolve_feed(supply.fuel, rate, basis, "--rate"));
  } else if (supply.feed_rate) {
    rates = core::rates(result, core::resolve_feed(supply.fuel, *supply.feed_rate, basis, "fuel.feed_rate"));
  }
  return {supply.fuel, oxidant, result, rates, operating_point_text(conditions, result)};
}

}  // namespace stackbound::cases
