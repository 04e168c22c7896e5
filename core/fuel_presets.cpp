#include "stackbound/core/fuel_presets.hpp"

#include <array>
#include <vector>

#include <fmt/format.h>
#include <fmt/ranges.h>

#include "stackbound/units/input_error.hpp"
#include "stackbound/units/nearest_name.hpp"

namespace stackbound::core {

namespace {

constexpr std::array<FuelPreset, 6> kPresets{{
    {"natural_gas", "pipeline natural gas (mole %: CH4 94.5, C2H6 2.5, C3H8 0.4, C4H10 0.2, CO2 0.9, N2 1.5)",
     "typical values for pipeline-quality natural gas; common practice, no source"},
    {"propane", "commercial propane (mole %: C3H8 95, C2H6 2.5, C3H6 1.5, n-C4H10 1)",
     "typical values inside the HD-5 limits of GPA Standard 2140 (propane >= 90 %, propylene <= 5 %; limits from "
     "memory); the composition itself is common practice, no source"},
    {"distillate_oil_no2", "No. 2 distillate fuel oil (C 86.6, H 13.2 mass %; HHV 45.6 MJ/kg)",
     "typical values for ASTM D396 grade No. 2 distillate; common practice, no source"},
    {"residual_oil_no6", "No. 6 residual fuel oil (C 86.0, H 11.0, S 2.0 mass %; HHV 43.0 MJ/kg)",
     "typical values for ASTM D396 grade No. 6 residual oil; common practice, no source"},
    {"bituminous_coal", "high-volatile bituminous coal (dry: C 75.0, H 5.0, S 2.3, ash 9.5 %; moisture 8 %)",
     "typical values for a US high-volatile bituminous coal; common practice, no source"},
    {"wood_chips", "green wood chips (dry: C 50.0, H 6.0, O 42.8, ash 1.0 %; moisture 40 % as received)",
     "typical values for clean wood chips; common practice, no source"},
}};

Fuel build(std::string_view key, const SpeciesDatabase& db) {
  const auto gas = [&](std::string name, std::vector<std::pair<std::string, double>> composition) {
    GasFuelSpec spec;
    spec.name = std::move(name);
    spec.composition_percent = std::move(composition);
    spec.field = fmt::format("preset {}", key);
    return Fuel::gas(spec, db);
  };
  const auto condensed = [&](std::string name, FuelState state, UltimateAnalysis analysis, double hhv_MJ_per_kg,
                             AnalysisBasis hhv_basis, double cp_J_per_kg_K) {
    CondensedFuelSpec spec;
    spec.name = std::move(name);
    spec.state = state;
    spec.analysis = analysis;
    spec.heating_value = MeasuredHeatingValue{HeatingValueKind::higher, hhv_MJ_per_kg * 1e6, hhv_basis};
    spec.specific_heat_J_per_kg_K = cp_J_per_kg_K;
    spec.field = fmt::format("preset {}", key);
    return Fuel::condensed(spec, db);
  };
  // Specific heats (liquid oils about 1.9 kJ/(kg K), coal about 1.3, green wood about 2.5 with its
  // water): common practice, no source. Used only when the fuel is fired above 298.15 K.
  if (key == "natural_gas") {
    return gas("natural gas", {{"CH4", 94.5},
                               {"C2H6", 2.5},
                               {"C3H8", 0.4},
                               {"n-C4H10", 0.1},
                               {"i-C4H10", 0.1},
                               {"CO2", 0.9},
                               {"N2", 1.5}});
  }
  if (key == "propane") {
    return gas("commercial propane", {{"C3H8", 95.0}, {"C2H6", 2.5}, {"C3H6", 1.5}, {"n-C4H10", 1.0}});
  }
  if (key == "distillate_oil_no2") {
    UltimateAnalysis a;
    a.basis = AnalysisBasis::as_received;
    a.carbon_percent = 86.6;
    a.hydrogen_percent = 13.2;
    a.oxygen_percent = 0.1;
    a.nitrogen_percent = 0.05;
    a.sulfur_percent = 0.05;
    return condensed("No. 2 distillate oil", FuelState::liquid, a, 45.6, AnalysisBasis::as_received, 1900.0);
  }
  if (key == "residual_oil_no6") {
    UltimateAnalysis a;
    a.basis = AnalysisBasis::as_received;
    a.carbon_percent = 86.0;
    a.hydrogen_percent = 11.0;
    a.oxygen_percent = 0.5;
    a.nitrogen_percent = 0.3;
    a.sulfur_percent = 2.0;
    a.ash_percent = 0.1;
    a.moisture_percent = 0.1;
    return condensed("No. 6 residual oil", FuelState::liquid, a, 43.0, AnalysisBasis::as_received, 1900.0);
  }
  if (key == "bituminous_coal") {
    UltimateAnalysis a;
    a.basis = AnalysisBasis::dry;
    a.carbon_percent = 75.0;
    a.hydrogen_percent = 5.0;
    a.oxygen_percent = 6.7;
    a.nitrogen_percent = 1.5;
    a.sulfur_percent = 2.3;
    a.ash_percent = 9.5;
    a.moisture_percent = 8.0;
    return condensed("bituminous coal", FuelState::solid, a, 31.4, AnalysisBasis::dry, 1300.0);
  }
  // wood_chips
  UltimateAnalysis a;
  a.basis = AnalysisBasis::dry;
  a.carbon_percent = 50.0;
  a.hydrogen_percent = 6.0;
  a.oxygen_percent = 42.8;
  a.nitrogen_percent = 0.17;
  a.sulfur_percent = 0.03;
  a.ash_percent = 1.0;
  a.moisture_percent = 40.0;
  return condensed("wood chips", FuelState::solid, a, 20.0, AnalysisBasis::dry, 2500.0);
}

}  // namespace

std::span<const FuelPreset> fuel_presets() { return kPresets; }

Fuel preset_fuel(std::string_view key, const SpeciesDatabase& database, std::string_view field) {
  for (const FuelPreset& preset : kPresets) {
    if (preset.key == key) return build(key, database).with_source(std::string(preset.source));
  }
  std::vector<std::string> keys;
  for (const FuelPreset& preset : kPresets) keys.emplace_back(preset.key);
  std::string message = fmt::format("{} = \"{}\": unknown fuel preset", field, key);
  if (const auto suggestion = units::nearest_name(key, keys)) message += fmt::format("; did you mean \"{}\"?", *suggestion);
  message += fmt::format("; accepted: {}", fmt::join(keys, ", "));
  throw units::InputError(message);
}

}  // namespace stackbound::core
