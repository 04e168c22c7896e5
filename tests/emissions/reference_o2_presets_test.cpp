#include "stackbound/emissions/reference_o2_presets.hpp"

#include <gtest/gtest.h>

#include "tests/support/tolerance.hpp"
#include "stackbound/units/input_error.hpp"

namespace stackbound::emissions {
namespace {

using stackbound::testing::is_close;

// Wrong if a plant type and fuel mapped to the wrong annex value.
// Source: Directive 2010/75/EU Annex V Part 1 point 1 (reproduction, legislation.gov.uk copy):
// solid fuels 6 %, liquid and gaseous fuels 3 %, gas turbines and gas engines 15 %.
// Annex VI waste incineration 11 % and waste oil 3 %: from memory.
TEST(ReferenceO2Presets, PlantAndFuelMapToTheAnnexValues) {
  EXPECT_TRUE(is_close(reference_o2_preset_for(PlantType::boiler_or_furnace, FuelClass::solid).o2_dry_fraction, 0.06, 1e-15));
  EXPECT_TRUE(is_close(reference_o2_preset_for(PlantType::boiler_or_furnace, FuelClass::liquid).o2_dry_fraction, 0.03, 1e-15));
  EXPECT_TRUE(is_close(reference_o2_preset_for(PlantType::boiler_or_furnace, FuelClass::gaseous).o2_dry_fraction, 0.03, 1e-15));
  EXPECT_TRUE(is_close(reference_o2_preset_for(PlantType::gas_turbine, FuelClass::gaseous).o2_dry_fraction, 0.15, 1e-15));
  EXPECT_TRUE(is_close(reference_o2_preset_for(PlantType::gas_engine, FuelClass::liquid).o2_dry_fraction, 0.15, 1e-15));
  EXPECT_TRUE(is_close(reference_o2_preset_for(PlantType::waste_incinerator, FuelClass::waste).o2_dry_fraction, 0.11, 1e-15));
  EXPECT_TRUE(is_close(reference_o2_preset_for(PlantType::waste_incinerator, FuelClass::waste_oil).o2_dry_fraction, 0.03, 1e-15));
}

// Wrong if a combination the annexes do not cover got a value anyway.
TEST(ReferenceO2Presets, UncoveredCombinationIsRefused) {
  EXPECT_THROW_WITH((void)reference_o2_preset_for(PlantType::gas_turbine, FuelClass::solid), units::InputError,
                    "no Directive 2010/75/EU preset for a gas turbine firing solid fuel");
}

// Wrong if an unknown key were not refused with a suggestion.
TEST(ReferenceO2Presets, UnknownKeyIsRefusedWithSuggestion) {
  EXPECT_THROW_WITH((void)reference_o2_preset("ied-solids", "reference_o2"), units::InputError,
                    "reference_o2 = \"ied-solids\": unknown reference-O2 preset (did you mean \"ied-solid\"?)");
}

// Wrong if a user's value did not override the preset, or the output hid that a preset was used.
TEST(ReferenceO2Presets, UserValueOverridesAndPresetIsFlagged) {
  const ReferenceO2Preset& solid = reference_o2_preset("ied-solid", "p");
  const ReferenceO2Choice preset = choose_reference_o2(solid, std::nullopt);
  EXPECT_TRUE(preset.from_preset);
  EXPECT_TRUE(is_close(preset.o2_dry_fraction, 0.06, 1e-15));
  EXPECT_NE(preset.text().find("confirm against your permit"), std::string::npos) << preset.text();
  const ReferenceO2Choice user = choose_reference_o2(solid, 0.05);
  EXPECT_FALSE(user.from_preset);
  EXPECT_TRUE(is_close(user.o2_dry_fraction, 0.05, 1e-15));
  EXPECT_EQ(user.text(), "5 % (stated by the user; preset ied-solid would be 6 %)");
  EXPECT_THROW_WITH((void)choose_reference_o2(solid, 0.22), units::InputError, "reference O2 = 22 %");
}

// Wrong if a preset lacked its source.
TEST(ReferenceO2Presets, EveryPresetNamesItsSource) {
  for (const ReferenceO2Preset& preset : reference_o2_presets()) {
    EXPECT_NE(preset.source.find("2010/75/EU"), std::string_view::npos) << preset.key;
  }
}

}  // namespace
}  // namespace stackbound::emissions
