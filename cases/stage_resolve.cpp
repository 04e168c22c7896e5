#include "stackbound/cases/stage_resolve.hpp"

#include "stackbound/cases/fuel_spec.hpp"
#include "stackbound/cases/source_map.hpp"

namespace stackbound::cases {

namespace {

core::Oxidant build_oxidant(const AirSpec& air) {
  core::OxidantOptions options;
  options.temperature = units::kelvin(air.temperature_K);
  if (air.relative_humidity) {
    options.humidity = core::Humidity::relative(*air.relative_humidity, units::kelvin(air.ambient_temperature_K),
                                                units::pascals(air.ambient_pressure_Pa));
  } else if (air.humidity_ratio_kg_per_kg) {
    options.humidity = core::Humidity::ratio(*air.humidity_ratio_kg_per_kg);
  }
  options.enriched_o2_fraction = air.o2_fraction;
  return core::Oxidant(options);
}

core::OperatingPoint build_operating_point(const CaseDefinition& definition) {
  const OperatingSpec& spec = definition.operating;
  core::OperatingPoint op;
  switch (spec.mode) {
    case OperatingMode::excess_air:
      op = core::OperatingPoint::with_excess_air(spec.value);
      break;
    case OperatingMode::lambda:
      op = core::OperatingPoint::with_air_ratio(spec.value, "operating_point.lambda");
      break;
    case OperatingMode::equivalence_ratio:
      op = core::OperatingPoint::with_equivalence_ratio(spec.value, "operating_point.equivalence_ratio");
      break;
    case OperatingMode::flue_o2:
      op = core::OperatingPoint::with_flue_o2(spec.value, spec.flue_o2_dry ? core::GasBasis::dry : core::GasBasis::wet);
      break;
  }
  op.fuel_temperature = units::kelvin(definition.fuel.temperature_K);
  op.flue_pressure = units::pascals(definition.stack.pressure_Pa);
  return op;
}

}  // namespace

ResolvedCase resolve_stage(const CaseDefinition& definition, const core::SpeciesDatabase& database,
                           const core::Fuel* built_fuel) {
  core::Fuel fuel = built_fuel != nullptr ? *built_fuel : build_fuel(definition.fuel.fuel, database);
  core::Oxidant oxidant = at_field("air", [&] { return build_oxidant(definition.air); });
  const std::string_view operating = operating_field(definition.operating.mode);
  core::OperatingPoint op = at_field(operating, [&] { return build_operating_point(definition); });
  core::CombustionResult combustion = at_field(operating, [&] { return core::burn(fuel, oxidant, op, database); });
  const core::FuelFeed feed = at_field("fuel.feed_rate", [&] {
    return core::resolve_feed(fuel, definition.fuel.feed_rate, definition.fuel.heat_input_basis, "fuel.feed_rate");
  });
  core::CombustionRates rates = core::rates(combustion, feed);
  FFactorsUsed f_factors = at_field("report.f_factors", [&] {
    return choose_f_factors(definition.report.f_factors, definition.fuel.fuel, combustion.f_factors);
  });
  // Moved into the result: the locals above are not const for that reason only.
  return {std::move(fuel),       std::move(oxidant), std::move(op), std::move(combustion),
          std::move(rates),      std::move(f_factors)};
}

}  // namespace stackbound::cases
