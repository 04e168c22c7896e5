#include "stackbound/cases/stage_post_flame.hpp"

#include <fmt/format.h>

#include <algorithm>
#include <cmath>

#include "stackbound/cases/source_map.hpp"
#include "stackbound/units/input_error.hpp"

namespace stackbound::cases {

namespace {

// The temperature the gas cools to, and which field (or default) gives it.
struct CoolingTarget {
  double temperature_K = 0.0;
  std::string origin;
};

CoolingTarget cooling_target(const CaseDefinition& definition) {
  if (definition.post_flame.cooling_to_K) return {*definition.post_flame.cooling_to_K, "post_flame.cooling_to"};
  if (definition.stack.temperature_stated) return {definition.stack.temperature_K, "stack.temperature"};
  return {definition.stack.temperature_K,
          fmt::format("the default stack temperature ({:.2f} K)", definition.stack.temperature_K)};
}

core::PostFlamePath path_of(const CaseDefinition& definition, const FiringState& fired, const CoolingTarget& target,
                            const core::EquilibriumSolver& solver) {
  const double T = target.temperature_K;
  if (!(std::isfinite(T) && T >= solver.min_temperature().value() && T <= solver.max_temperature().value())) {
    const std::string field = definition.post_flame.cooling_to_K ? "post_flame.cooling_to" : "stack.temperature";
    throw units::InputError(fmt::format("{0}: {0} = {1:g} K: the post-flame gas cools to it, so it must lie within "
                                        "the species data range {2:g}-{3:g} K",
                                        field, T, solver.min_temperature().value(), solver.max_temperature().value()));
  }
  core::PostFlamePath path;
  path.firing_temperature = units::kelvin(fired.temperature_K);
  path.hold_time = units::seconds(definition.firing.residence_time_s);
  path.final_temperature = units::kelvin(T);
  path.cooling_time = units::seconds(definition.post_flame.cooling_time_s);
  path.pressure = units::pascals(fired.pressure_Pa);
  path.field = "post_flame";
  return path;
}

// Fuel-N NO: the stated conversion, else the upper end of the class's typical band, else 100 %.
FuelNitrogenPart fuel_nitrogen_part(const CaseDefinition& definition, const ResolvedCase& resolved) {
  const core::Fuel& fuel = resolved.fuel;
  const core::FlueGas& flue = resolved.combustion.flue;
  FuelNitrogenPart part;
  const double nitrogen = core::fuel_bound_nitrogen_mol_per_kg(fuel);
  const std::optional<double>& stated = definition.fuel.nitrogen_conversion;
  const std::optional<core::FuelNitrogenClass> fuel_class =
      definition.fuel.fuel.kind == FuelKind::preset ? core::fuel_nitrogen_class_of_preset(definition.fuel.fuel.preset)
                                                    : std::nullopt;
  if (stated) {
    part.origin = ConversionOrigin::stated;
    part.no = at_field("fuel.nitrogen_conversion", [&] {
      return core::fuel_nitrogen_no(fuel, *stated, "stated in the case file (fuel.nitrogen_conversion)");
    });
  } else if (!(nitrogen > 0.0)) {
    part.origin = ConversionOrigin::no_fuel_nitrogen;
    part.no = core::fuel_nitrogen_no(fuel, 0.0, "no fuel-bound nitrogen");
  } else if (fuel_class) {
    part.origin = ConversionOrigin::typical_band;
    part.band = core::fuel_nitrogen_no_band(fuel, *fuel_class);
    part.no = part.band->high;
  } else {
    part.origin = ConversionOrigin::ceiling;
    part.no = core::fuel_nitrogen_no(fuel, 1.0, "no typical band for this fuel in our sources: 100 % (the ceiling)");
  }
  part.estimate_wet_mole_fraction = core::fuel_no_mole_fraction(part.no.no_estimate_mol_per_kg, flue, core::GasBasis::wet);
  part.ceiling_wet_mole_fraction = core::fuel_no_mole_fraction(part.no.no_ceiling_mol_per_kg, flue, core::GasBasis::wet);
  return part;
}

// The primary zone of firing.primary_zone, its share of the oxidant from the stated equivalence ratio
// or share, and what it carries into the mixed gas of the firing state.
PrimaryZonePart primary_zone_part(const PrimaryZoneCaseSpec& stated, const ResolvedCase& resolved,
                                  const FiringState& fired) {
  const double overall = resolved.combustion.equivalence_ratio();
  PrimaryZonePart part;
  core::PrimaryZoneSpec spec;
  spec.field = "firing.primary_zone";
  if (stated.equivalence_ratio) {
    part.share_origin = "firing.primary_zone.equivalence_ratio";
    if (!(*stated.equivalence_ratio >= overall)) {
      throw units::InputError(fmt::format(
          "{}: {} = {:g} is leaner than the whole mixture ({:.4g}): the primary zone cannot take more than all "
          "of the oxidant",
          part.share_origin, "equivalence_ratio", *stated.equivalence_ratio, overall));
    }
    spec.air_share = overall / *stated.equivalence_ratio;
  } else {
    part.share_origin = "firing.primary_zone.air_share";
    spec.air_share = *stated.air_share;
  }
  spec.residence_time = units::seconds(stated.residence_time_s);
  spec.heat_loss_fraction = stated.heat_loss_fraction;
  part.residence_time_s = stated.residence_time_s;
  part.zone = at_field("firing.primary_zone", [&] {
    return core::primary_zone(*fired.solver, resolved.combustion, spec, units::pascals(fired.pressure_Pa));
  });
  const double mixed = fired.equilibrium.total_gas_moles;
  part.no_carried = part.zone.carried_into(part.zone.thermal_no.no_mole_fraction, mixed);
  part.no_equilibrium_carried = part.zone.carried_into(part.zone.equilibrium.mole_fraction("NO"), mixed);
  part.co_carried = part.zone.carried_into(part.zone.equilibrium.mole_fraction("CO"), mixed);
  return part;
}

std::vector<std::string> assumptions_of(const CaseDefinition& definition, const PostFlame& post) {
  std::vector<std::string> notes;
  if (!definition.firing.residence_time_stated) {
    notes.push_back(fmt::format("Residence time at the firing temperature {:g} ms (default; firing.residence_time)",
                                definition.firing.residence_time_s * 1e3));
  }
  if (!definition.post_flame.cooling_to_K) {
    notes.push_back(fmt::format("Post-flame cooling to {:.2f} K, {} (default; post_flame.cooling_to)",
                                post.path.final_temperature.value(), post.cooling_to_origin));
  }
  if (!definition.post_flame.cooling_time_stated) {
    notes.push_back(fmt::format("Post-flame cooling time {:g} s, linear (default; post_flame.cooling_time)",
                                definition.post_flame.cooling_time_s));
  }
  if (definition.firing.primary_zone && !definition.firing.primary_zone->heat_loss_stated) {
    notes.push_back("Primary zone adiabatic: no heat lost in the zone (default; firing.primary_zone.heat_loss)");
  }
  const FuelNitrogenPart& n = post.fuel_nitrogen;
  if (n.origin == ConversionOrigin::typical_band) {
    notes.push_back(fmt::format("Fuel-nitrogen conversion {:g} %, the upper end of the typical band {:g}-{:g} % "
                                "(typical, not measured; fuel.nitrogen_conversion; band: {})",
                                n.no.conversion_fraction * 100.0, n.band->band.low_fraction * 100.0,
                                n.band->band.high_fraction * 100.0, n.band->band.source));
  } else if (n.origin == ConversionOrigin::ceiling) {
    notes.push_back("Fuel-nitrogen conversion 100 %: no typical band for this fuel, the estimate is the ceiling "
                    "(fuel.nitrogen_conversion)");
  }
  return notes;
}

}  // namespace

std::string_view to_string(ConversionOrigin origin) {
  switch (origin) {
    case ConversionOrigin::stated: return "stated";
    case ConversionOrigin::typical_band: return "typical";
    case ConversionOrigin::ceiling: return "ceiling (no typical band)";
    case ConversionOrigin::no_fuel_nitrogen: break;
  }
  return "no fuel nitrogen";
}

PostFlame post_flame_stage(const CaseDefinition& definition, const ResolvedCase& resolved, const FiringState& fired) {
  const core::EquilibriumSolver& solver = *fired.solver;
  core::ElementAmounts b;
  b.moles = resolved.combustion.reactant_element_mol_per_kg;
  PostFlame post;
  const CoolingTarget target = cooling_target(definition);
  post.path = path_of(definition, fired, target, solver);
  post.cooling_to_origin = target.origin;
  const core::PostFlameHistory history =
      at_field("post_flame", [&] { return core::post_flame_history(solver, b, post.path); });
  for (const core::PostFlameNode& node : history.nodes) {
    post.highest_equilibrium_no = std::max(post.highest_equilibrium_no, node.gas.no);
    post.highest_equilibrium_co = std::max(post.highest_equilibrium_co, node.gas.co);
  }
  core::ThermalNoOptions no_options;
  core::CoBurnoutOptions co_options;
  if (definition.firing.primary_zone) {
    post.primary_zone = primary_zone_part(*definition.firing.primary_zone, resolved, fired);
    post.highest_equilibrium_no = std::max(post.highest_equilibrium_no, post.primary_zone->no_equilibrium_carried);
    post.highest_equilibrium_co = std::max(post.highest_equilibrium_co, post.primary_zone->co_carried);
    no_options.initial_no_mole_fraction = post.primary_zone->no_carried;
    co_options.initial_co_mole_fraction = post.primary_zone->co_carried;
  }
  post.highest_equilibrium_nox =
      std::max(post.highest_equilibrium_no,
               fired.equilibrium.mole_fraction("NO") + fired.equilibrium.mole_fraction("NO2"));
  if (history.firing().has_nitrogen_chemistry && history.firing().no > 0.0 && history.firing().n2 > 0.0) {
    post.thermal_no = core::thermal_no_along(history, no_options);
  }
  if (history.firing().has_carbon_monoxide) post.co = core::co_burnout_along(history, co_options);
  post.fuel_nitrogen = fuel_nitrogen_part(definition, resolved);
  post.assumptions = assumptions_of(definition, post);
  return post;
}

bool post_flame_covers(std::string_view pollutant) {
  return pollutant == "NO" || pollutant == "NOx" || pollutant == "CO";
}

std::optional<double> PostFlame::estimate_wet_fraction(std::string_view pollutant) const {
  if (pollutant == "CO") return co ? std::optional<double>(co->co_mole_fraction) : std::nullopt;
  if (pollutant != "NO" && pollutant != "NOx") return std::nullopt;
  if (!thermal_no) return std::nullopt;
  return thermal_no->no_mole_fraction + fuel_nitrogen.estimate_wet_mole_fraction;
}

std::optional<double> PostFlame::ceiling_wet_fraction(std::string_view pollutant) const {
  if (pollutant == "CO") return co ? std::optional<double>(std::max(highest_equilibrium_co, co->co_mole_fraction)) : std::nullopt;
  if (pollutant != "NO" && pollutant != "NOx") return std::nullopt;
  if (!thermal_no) return std::nullopt;
  const double kinetic = thermal_no->no_mole_fraction + fuel_nitrogen.ceiling_wet_mole_fraction;
  return std::max(pollutant == "NO" ? highest_equilibrium_no : highest_equilibrium_nox, kinetic);
}

}  // namespace stackbound::cases
