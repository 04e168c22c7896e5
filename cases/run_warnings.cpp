#include "stackbound/cases/run_warnings.hpp"

#include <algorithm>
#include <string_view>

#include <fmt/format.h>

namespace stackbound::cases {

namespace {

// The fuel states a reference-O2 preset of Directive 2010/75/EU Annex V Part 1 is stated for (the
// incineration presets fit any fuel); empty: any.
std::vector<core::FuelState> states_of_preset(std::string_view key) {
  using core::FuelState;
  if (key == "ied-solid") return {FuelState::solid};
  if (key == "ied-liquid-gaseous") return {FuelState::liquid, FuelState::gas};
  if (key == "ied-gas-turbine") return {FuelState::gas, FuelState::liquid};
  if (key == "ied-gas-engine") return {FuelState::gas};
  return {};
}

std::string_view state_words(core::FuelState state) {
  switch (state) {
    case core::FuelState::gas: return "a gaseous fuel";
    case core::FuelState::liquid: return "a liquid fuel";
    case core::FuelState::solid: return "a solid fuel";
    case core::FuelState::blend: break;
  }
  return "a blend";
}

// A blend is not checked: its parts may be of several states.
void warn_plant_type(const CaseDefinition& definition, const core::Fuel& fuel, std::vector<units::Warning>& warnings) {
  const emissions::ReferenceO2Preset* preset = definition.reference_o2_preset;
  if (preset == nullptr || fuel.state() == core::FuelState::blend) return;
  const std::vector<core::FuelState> states = states_of_preset(preset->key);
  if (states.empty() || std::find(states.begin(), states.end(), fuel.state()) != states.end()) return;
  warnings.push_back({"case.plant_type", definition.plant_type,
                      fmt::format("the preset is for a {}; the fuel \"{}\" is {}: its reference O2 ({:g} %) may not be "
                                  "the permit's; check the plant type, or state report.reference_o2",
                                  preset->description, fuel.name(), state_words(fuel.state()),
                                  preset->o2_dry_fraction * 100.0)});
}

}  // namespace

void add_warning(std::vector<units::Warning>& warnings, units::Warning warning) {
  if (std::find(warnings.begin(), warnings.end(), warning) == warnings.end()) warnings.push_back(std::move(warning));
}

std::vector<units::Warning> run_warnings(const CaseDefinition& definition, const ResolvedCase& resolved) {
  std::vector<units::Warning> warnings = definition.warnings;
  warn_plant_type(definition, resolved.fuel, warnings);
  for (const units::Warning& warning : resolved.combustion.warnings) add_warning(warnings, warning);
  for (const units::Warning& warning : resolved.fuel.warnings()) add_warning(warnings, warning);
  return warnings;
}

}  // namespace stackbound::cases
