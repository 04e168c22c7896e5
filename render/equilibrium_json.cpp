#include "stackbound/render/equilibrium_json.hpp"

namespace stackbound::render {

namespace {

nlohmann::json thermal_no_json(const core::ThermalNoResult& no) {
  return {{"residence_time_s", no.residence_time_s},
          {"no_mole_fraction", no.no_mole_fraction},
          {"no_equilibrium_mole_fraction", no.no_equilibrium_mole_fraction},
          {"initial_rate_mole_fraction_per_s", no.initial_rate_mole_fraction_per_s},
          {"rate_constants", no.rate_constants},
          {"temperature_K", no.temperature_K},
          {"pressure_Pa", no.pressure_Pa},
          {"rate_constants_within_stated_range", no.rate_constants_within_stated_range},
          {"note", cases::kThermalNoCaution}};
}

}  // namespace

nlohmann::json equilibrium_json(const cases::EquilibriumAnswer& answer) {
  const core::EquilibriumResult& result = answer.result;
  nlohmann::json fractions = nlohmann::json::object();
  nlohmann::json moles = nlohmann::json::object();
  for (std::size_t i = 0; i < result.species.size(); ++i) {
    fractions[result.species[i]] = result.mole_fractions[i];
    moles[result.species[i]] = result.moles[i];
  }
  nlohmann::json feed_json = nlohmann::json::object();
  for (const core::SpeciesAmount& entry : answer.feed) {
    feed_json[entry.formula] = feed_json.value(entry.formula, 0.0) + entry.moles;
  }
  nlohmann::json out = {{"mode", answer.adiabatic ? "adiabatic" : "fixed_temperature"},
                        {"temperature_K", result.temperature_K},
                        {"pressure_Pa", result.pressure_Pa},
                        {"feed_moles", feed_json},
                        {"total_moles", result.total_gas_moles},
                        {"total_moles_basis", "gas phase"},
                        {"mole_fractions", fractions},
                        {"mole_fraction_basis", "gas phase (condensed species 0)"},
                        {"moles", moles},
                        {"iterations", result.iterations},
                        {"element_residual", result.element_residual},
                        {"graphite_present", result.graphite_present},
                        {"enthalpy_J", result.enthalpy_J},
                        {"note", cases::kEquilibriumBoundNote}};
  if (answer.adiabatic) {
    out["feed_temperature_K"] = answer.feed_temperature_K;
    out["temperature_iterations"] = result.temperature_iterations;
  }
  if (answer.thermal_no) out["thermal_no"] = thermal_no_json(*answer.thermal_no);
  return out;
}

}  // namespace stackbound::render
