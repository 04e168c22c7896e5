#include "stackbound/emissions/reference_correction.hpp"

#include <gtest/gtest.h>

#include "tests/support/tolerance.hpp"
#include "stackbound/units/input_error.hpp"

namespace stackbound::emissions {
namespace {

using stackbound::testing::is_close;

// Wrong if the US EPA form were not (20.9 - O2_ref)/(20.9 - O2_meas) (40 CFR 60; DESIGN section 5).
TEST(ReferenceCorrection, UsEpaFormUsesTwentyPointNine) {
  EXPECT_TRUE(is_close(o2_correction_factor(0.072, 0.03, O2Basis::us_epa_20_9), 17.9 / 13.7, 1e-15));
}

// Wrong if the EU form were not (21 - O2_ref)/(21 - O2_meas) (Directive 2010/75/EU Annex VI Part 7, from memory).
TEST(ReferenceCorrection, EuFormUsesTwentyOne) {
  EXPECT_TRUE(is_close(o2_correction_factor(0.08, 0.11, O2Basis::eu_21), 10.0 / 13.0, 1e-15));
}

// Wrong if equal levels changed the value.
TEST(ReferenceCorrection, EqualLevelsGiveExactlyOne) {
  for (const double level : {0.0, 0.03, 0.06, 0.11, 0.15, 0.2}) {
    EXPECT_TRUE(is_close(o2_correction_factor(level, level, O2Basis::us_epa_20_9), 1.0, 0.0, 0.0));
    EXPECT_TRUE(is_close(o2_correction_factor(level, level, O2Basis::eu_21), 1.0, 0.0, 0.0));
  }
  EXPECT_TRUE(is_close(co2_correction_factor(0.12, 0.12), 1.0, 0.0, 0.0));
}

// Wrong if an O2 level at or above the O2 basis (division by zero or sign change) were accepted.
TEST(ReferenceCorrection, LevelAtOrAboveTheBasisIsRefused) {
  EXPECT_THROW_WITH((void)o2_correction_factor(0.209, 0.03, O2Basis::us_epa_20_9), units::InputError,
                    "measured O2 = 20.9 %: at or above the O2 basis 20.9 % (US EPA practice)");
  EXPECT_THROW_WITH((void)o2_correction_factor(0.21, 0.03, O2Basis::eu_21), units::InputError,
                    "measured O2 = 21 %: at or above the O2 basis 21 % (EU practice)");
  EXPECT_THROW_WITH((void)o2_correction_factor(0.25, 0.03, O2Basis::eu_21), units::InputError, "at or above the O2 basis");
  EXPECT_THROW_WITH((void)o2_correction_factor(0.05, 0.2095, O2Basis::us_epa_20_9), units::InputError,
                    "reference O2 = 20.95 %: at or above");
  EXPECT_THROW_WITH((void)o2_correction_factor(-0.01, 0.03, O2Basis::eu_21), units::InputError, "must be >= 0 %");
  // 20.95 % is below 21 %: accepted on the EU basis only.
  EXPECT_TRUE(is_close(o2_correction_factor(0.2095, 0.03, O2Basis::eu_21), 18.0 / 0.05, 1e-12));
}

// Wrong if the CO2 correction were inverted or a zero CO2 divided by zero.
TEST(ReferenceCorrection, Co2CorrectionIsTheRatioOfLevels) {
  EXPECT_TRUE(is_close(co2_correction_factor(0.08, 0.12), 1.5, 1e-15));
  EXPECT_THROW_WITH((void)co2_correction_factor(0.0, 0.12), units::InputError, "measured CO2 = 0 %: must be above 0 %");
}

// Wrong if --o2-basis accepted something other than 20.9 and 21.
TEST(ReferenceCorrection, O2BasisOptionAcceptsOnlyTheTwoPractices) {
  EXPECT_EQ(parse_o2_basis("20.9", "--o2-basis"), O2Basis::us_epa_20_9);
  EXPECT_EQ(parse_o2_basis("21 %", "--o2-basis"), O2Basis::eu_21);
  EXPECT_THROW_WITH((void)parse_o2_basis("20.95", "--o2-basis"), units::InputError,
                    "--o2-basis = \"20.95\": unknown O2 basis; accepted: 20.9 (US EPA practice), 21 (EU practice)");
}

// Wrong if the written-out correction did not show the numbers used.
TEST(ReferenceCorrection, TextShowsTheFormula) {
  EXPECT_EQ(o2_correction_text(0.072, 0.03, O2Basis::us_epa_20_9),
            "(20.9 - 3)/(20.9 - 7.2), O2 in % dry, O2 basis 20.9 % (US EPA practice)");
  EXPECT_EQ(percent_text(0.072), "7.2");
}

}  // namespace
}  // namespace stackbound::emissions
