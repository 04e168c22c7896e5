#include "stackbound/emissions/pollutant.hpp"

#include <gtest/gtest.h>

#include "tests/support/tolerance.hpp"
#include "stackbound/units/input_error.hpp"

namespace stackbound::emissions {
namespace {

// Wrong if NOx mass were computed with the NO molar mass instead of NO2 (40 CFR 60.2: NOx "as NO2").
TEST(Pollutant, NoxIsExpressedAsNitrogenDioxide) {
  const Pollutant nox = pollutant_by_name("NOx", "pollutant");
  EXPECT_TRUE(nox.expressed_as_no2);
  EXPECT_TRUE(stackbound::testing::is_close(nox.molar_mass_kg_per_mol, pollutant_by_name("NO2", "p").molar_mass_kg_per_mol,
                                            1e-15));
}

TEST(Pollutant, UnknownNameListsTheKnownOnes) {
  EXPECT_THROW_WITH((void)pollutant_by_name("Hg", "limits[0].pollutant"), units::InputError,
                    "limits[0].pollutant = \"Hg\": unknown pollutant; known: CO, NO, NO2, NOx");
}

}  // namespace
}  // namespace stackbound::emissions
