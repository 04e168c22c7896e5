#include "stackbound/emissions/reference_o2_presets.hpp"

#include <array>
#include <string>
#include <vector>

#include <fmt/format.h>

#include "stackbound/emissions/reference_correction.hpp"
#include "stackbound/units/input_error.hpp"
#include "stackbound/units/nearest_name.hpp"

namespace stackbound::emissions {

namespace {

// Annex V Part 1 point 1 values were read in a reproduction (legislation.gov.uk copy of 2010/75/EU);
// the Annex VI values (11 % O2, 3 % for waste oil) are from memory of Annex VI Part 3/Part 6.
constexpr std::array<ReferenceO2Preset, 6> kPresets{{
    {"ied-solid", "combustion plant firing solid fuels", 0.06, "Directive 2010/75/EU, Annex V, Part 1, point 1"},
    {"ied-liquid-gaseous", "combustion plant firing liquid or gaseous fuels (not gas turbines or gas engines)", 0.03,
     "Directive 2010/75/EU, Annex V, Part 1, point 1"},
    {"ied-gas-turbine", "gas turbine (liquid or gaseous fuels)", 0.15, "Directive 2010/75/EU, Annex V, Part 1, point 1"},
    {"ied-gas-engine", "gas engine", 0.15, "Directive 2010/75/EU, Annex V, Part 1, point 1"},
    {"ied-waste-incineration", "waste incineration plant", 0.11, "Directive 2010/75/EU, Annex VI, Part 3 (from memory)"},
    {"ied-waste-oil-incineration", "incineration of waste oil", 0.03,
     "Directive 2010/75/EU, Annex VI, Part 3 (from memory)"},
}};

std::string plant_name(PlantType plant) {
  switch (plant) {
    case PlantType::boiler_or_furnace: return "boiler or furnace";
    case PlantType::gas_turbine: return "gas turbine";
    case PlantType::gas_engine: return "gas engine";
    case PlantType::waste_incinerator: return "waste incinerator";
  }
  return "plant";
}

std::string fuel_name(FuelClass fuel) {
  switch (fuel) {
    case FuelClass::solid: return "solid fuel";
    case FuelClass::liquid: return "liquid fuel";
    case FuelClass::gaseous: return "gaseous fuel";
    case FuelClass::waste: return "waste";
    case FuelClass::waste_oil: return "waste oil";
  }
  return "fuel";
}

}  // namespace

std::span<const ReferenceO2Preset> reference_o2_presets() { return kPresets; }

const ReferenceO2Preset* find_reference_o2_preset(std::string_view key) {
  for (const ReferenceO2Preset& preset : kPresets) {
    if (preset.key == key) return &preset;
  }
  return nullptr;
}

const ReferenceO2Preset& reference_o2_preset(std::string_view key, std::string_view field) {
  if (const ReferenceO2Preset* found = find_reference_o2_preset(key)) return *found;
  std::vector<std::string> keys;
  for (const ReferenceO2Preset& preset : kPresets) keys.emplace_back(preset.key);
  std::string hint;
  if (const auto suggestion = units::nearest_name(key, keys)) hint = fmt::format(" (did you mean \"{}\"?)", *suggestion);
  throw units::InputError(fmt::format("{} = \"{}\": unknown reference-O2 preset{}; accepted: {}", field, key, hint,
                                      fmt::join(keys, ", ")));
}

const ReferenceO2Preset& reference_o2_preset_for(PlantType plant, FuelClass fuel) {
  const auto refuse = [&]() -> const ReferenceO2Preset& {
    throw units::InputError(fmt::format(
        "reference O2 preset: no Directive 2010/75/EU preset for a {} firing {}; state the reference O2 of the permit",
        plant_name(plant), fuel_name(fuel)));
  };
  switch (plant) {
    case PlantType::boiler_or_furnace:
      if (fuel == FuelClass::solid) return kPresets[0];
      if (fuel == FuelClass::liquid || fuel == FuelClass::gaseous) return kPresets[1];
      return refuse();
    case PlantType::gas_turbine:
      if (fuel == FuelClass::liquid || fuel == FuelClass::gaseous) return kPresets[2];
      return refuse();
    case PlantType::gas_engine:
      if (fuel == FuelClass::liquid || fuel == FuelClass::gaseous) return kPresets[3];
      return refuse();
    case PlantType::waste_incinerator:
      if (fuel == FuelClass::waste_oil) return kPresets[5];
      return kPresets[4];
  }
  return refuse();
}

std::string ReferenceO2Choice::text() const {
  if (from_preset && preset != nullptr) {
    return fmt::format("{} % (preset {}, {}: confirm against your permit)", percent_text(o2_dry_fraction), preset->key,
                       preset->source);
  }
  if (preset != nullptr) {
    return fmt::format("{} % (stated by the user; preset {} would be {} %)", percent_text(o2_dry_fraction), preset->key,
                       percent_text(preset->o2_dry_fraction));
  }
  return fmt::format("{} % (stated by the user)", percent_text(o2_dry_fraction));
}

ReferenceO2Choice choose_reference_o2(const ReferenceO2Preset& preset, std::optional<double> user_o2_dry_fraction) {
  if (user_o2_dry_fraction) {
    // 21 % is the largest O2 basis; the conversion checks against the chosen one.
    check_o2_level(*user_o2_dry_fraction, O2Basis::eu_21, "reference O2");
    return {*user_o2_dry_fraction, &preset, false};
  }
  return {preset.o2_dry_fraction, &preset, true};
}

}  // namespace stackbound::emissions
