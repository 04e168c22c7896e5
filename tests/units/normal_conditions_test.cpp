#include "stackbound/units/normal_conditions.hpp"

#include <gtest/gtest.h>

#include "tests/support/tolerance.hpp"
#include "stackbound/units/input_error.hpp"

namespace stackbound::units {
namespace {

using stackbound::testing::is_close;

// Wrong if the gas constant or the 0 degC / 1 atm preset were off.
TEST(NormalConditions, MolarVolumeAtZeroCelsiusMatchesCodata) {
  // Source: CODATA 2018, molar volume of ideal gas (273.15 K, 101.325 kPa) = 22.413 969 54 L/mol.
  EXPECT_TRUE(is_close(normal_0C().molar_volume_m3_per_mol() * 1e3, 22.41396954, 1e-9));
}

// Wrong if a normal volume were treated as a volume rather than an amount.
TEST(NormalConditions, NormalVolumeConvertsBetweenConditionsThroughAmount) {
  const NormalVolume one = NormalVolume::from_cubic_metres(1.0, normal_0C());
  // Ideal gas: V2/V1 = T2/T1 at equal pressure. 293.15/273.15 from the definitions.
  EXPECT_TRUE(is_close(one.cubic_metres(normal_20C()), 293.15 / 273.15, stackbound::testing::kRoundTrip));
  EXPECT_TRUE(is_close(one.cubic_metres(normal_0C()), 1.0, stackbound::testing::kRoundTrip));
}

// Wrong if an unknown key were silently mapped to a default.
TEST(NormalConditions, UnknownKeyIsRefusedWithTheAcceptedKeys) {
  EXPECT_THROW_WITH(normal_conditions_by_key("25C", "--normal"), InputError,
                    "--normal = \"25C\": unknown normal conditions; accepted: 0C, 15C, 20C, 60F, IED");
}

// Wrong if normal conditions stated as a temperature and a pressure were refused, read in the wrong
// order, or gave another molar volume than R T / p; or if a slip in them were accepted.
TEST(NormalConditions, StatedTemperatureAndPressure) {
  const auto stated = stated_normal_conditions("25 degC, 101.325 kPa", "report.normal_conditions");
  EXPECT_DOUBLE_EQ(stated->conditions().temperature_K, 298.15);
  EXPECT_DOUBLE_EQ(stated->conditions().pressure_Pa, 101325.0);
  EXPECT_EQ(stated->conditions().description, "25 degC, 101.325 kPa (stated)");
  const auto reversed = stated_normal_conditions("1 atm, 298.15 K", "n");
  EXPECT_DOUBLE_EQ(reversed->conditions().molar_volume_m3_per_mol(), stated->conditions().molar_volume_m3_per_mol());
  EXPECT_THROW_WITH((void)stated_normal_conditions("25 degC, 101.325", "report.normal_conditions"), InputError,
                    "report.normal_conditions = \"101.325\": a unit is required");
  EXPECT_THROW_WITH((void)stated_normal_conditions("25 degC, 30 degC", "n"), InputError,
                    "n = \"25 degC, 30 degC\": give one temperature and one pressure, e.g. \"25 degC, 101.325 kPa\"");
  EXPECT_THROW_WITH((void)stated_normal_conditions("250 degC, 1 atm", "n"), InputError,
                    "n = \"250 degC, 1 atm\": the temperature must be between 250 K and 350 K");
}

}  // namespace
}  // namespace stackbound::units
