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

}  // namespace
}  // namespace stackbound::units
