#pragma once
// Reference O2 levels by plant type and fuel, as written in Directive 2010/75/EU (Industrial
// Emissions Directive, IED): Annex V Part 1 (combustion plants: solid fuels 6 %, liquid and gaseous
// fuels 3 %, gas turbines and gas engines 15 %) and Annex VI (waste incineration 11 %, waste oil 3 %).
// They are PRESETS: the permit of the plant decides. Every use is overridable by an explicit value and
// is shown in the output with the instruction to confirm it against the permit.

#include <optional>
#include <span>
#include <string>
#include <string_view>

namespace stackbound::emissions {

enum class PlantType { boiler_or_furnace, gas_turbine, gas_engine, waste_incinerator };
enum class FuelClass { solid, liquid, gaseous, waste, waste_oil };

struct ReferenceO2Preset {
  std::string_view key;          // used in basis text ("O2=ied-solid") and case files
  std::string_view description;  // "combustion plant firing solid fuels"
  double o2_dry_fraction;        // 0.06 for 6 %
  std::string_view source;       // "Directive 2010/75/EU, Annex V, Part 1, point 1"
};

// All presets, in a fixed order: ied-solid, ied-liquid-gaseous, ied-gas-turbine, ied-gas-engine,
// ied-waste-incineration, ied-waste-oil-incineration.
std::span<const ReferenceO2Preset> reference_o2_presets();

// nullopt if the key is unknown.
const ReferenceO2Preset* find_reference_o2_preset(std::string_view key);

// Throws units::InputError naming the field, the key, a did-you-mean and the accepted keys.
const ReferenceO2Preset& reference_o2_preset(std::string_view key, std::string_view field);

// The preset for a plant type and fuel; throws units::InputError for a combination the annexes do
// not cover (e.g. a gas turbine firing solid fuel), naming both.
const ReferenceO2Preset& reference_o2_preset_for(PlantType plant, FuelClass fuel);

// The reference O2 actually used: the user's value when given, otherwise the preset. `from_preset`
// tells reports to print the "confirm against your permit" caution.
struct ReferenceO2Choice {
  double o2_dry_fraction = 0.0;
  const ReferenceO2Preset* preset = nullptr;  // the preset offered (may be overridden)
  bool from_preset = false;                   // true when the value is the preset's, not the user's
  // "6 % (preset ied-solid, Directive 2010/75/EU, Annex V, Part 1, point 1: confirm against your permit)"
  // or "5 % (stated by the user; preset ied-solid would be 6 %)".
  [[nodiscard]] std::string text() const;
};
ReferenceO2Choice choose_reference_o2(const ReferenceO2Preset& preset, std::optional<double> user_o2_dry_fraction);

}  // namespace stackbound::emissions
