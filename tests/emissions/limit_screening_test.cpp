#include "stackbound/emissions/limit_screening.hpp"

#include <algorithm>
#include <cctype>
#include <string>

#include <gtest/gtest.h>

#include "tests/support/tolerance.hpp"
#include "stackbound/units/input_error.hpp"

namespace stackbound::emissions {
namespace {

using stackbound::testing::is_close;

std::string lowercase(std::string text) {
  std::transform(text.begin(), text.end(), text.begin(), [](unsigned char c) { return static_cast<char>(std::tolower(c)); });
  return text;
}

Concentration make(double value, const char* pollutant, const char* basis) {
  return Concentration(value, pollutant_by_name(pollutant, "pollutant"), parse_basis(basis, "basis"));
}

// Wrong if the wording claimed compliance, or did not say it screens against the stated limit.
void expect_screening_wording(const ScreeningResult& result) {
  const std::string wording = lowercase(result.wording);
  EXPECT_NE(wording.find("screening against the stated limit"), std::string::npos) << result.wording;
  EXPECT_EQ(wording.find("compliant"), std::string::npos) << result.wording;
  EXPECT_NE(wording.find("not a compliance determination"), std::string::npos) << result.wording;
}

// Wrong if the value were not converted to the limit's basis before comparing.
TEST(LimitScreening, ConvertsTheValueToTheLimitBasis) {
  ConcentrationContext context;
  context.o2_dry_fraction = 0.072;
  const Concentration value = make(35.0, "CO", "ppmvd");
  const Concentration limit = make(100.0, "CO", "mg/Nm3, dry, O2=3%");
  const ScreeningResult result = screen_concentration(value, limit, context);
  const double converted = value.to(limit.basis(), context).value();
  EXPECT_TRUE(is_close(result.value, converted, 1e-15));
  EXPECT_TRUE(is_close(result.margin, 100.0 - converted, 1e-13));
  EXPECT_TRUE(is_close(result.fraction_of_limit, converted / 100.0, 1e-15));
  EXPECT_EQ(result.outcome, ScreeningOutcome::below_limit);
  EXPECT_EQ(result.unit, "mg/Nm3");
  EXPECT_EQ(result.basis, "dry, O2=3%, normal=0C");
  EXPECT_FALSE(result.factors.empty());
  expect_screening_wording(result);
}

// Wrong if a value above the limit were reported below it, or its wording changed tone.
TEST(LimitScreening, ValueAboveTheLimit) {
  const ScreeningResult result =
      screen_concentration(make(60.0, "NOx", "ppmv, dry, O2=15%"), make(50.0, "NOx", "ppmv, dry, O2=15%"), {});
  EXPECT_EQ(result.outcome, ScreeningOutcome::above_limit);
  EXPECT_TRUE(is_close(result.margin, -10.0, 1e-14));
  EXPECT_NE(result.wording.find("above it by 10 ppmv"), std::string::npos) << result.wording;
  expect_screening_wording(result);
}

// Wrong if equality within rounding were called above or below.
TEST(LimitScreening, ValueAtTheLimit) {
  const ScreeningResult result = screen_concentration(make(50.0, "CO", "ppmvd"), make(50.0, "CO", "ppmvd"), {});
  EXPECT_EQ(result.outcome, ScreeningOutcome::at_limit);
  expect_screening_wording(result);
}

// Wrong if a limit for another pollutant or a zero limit were accepted.
TEST(LimitScreening, RefusesMismatchedOrZeroLimits) {
  EXPECT_THROW_WITH((void)screen_concentration(make(1.0, "CO", "ppmvd"), make(1.0, "NOx", "ppmvd"), {}), units::InputError,
                    "a limit for NOx cannot screen a concentration of CO");
  EXPECT_THROW_WITH((void)screen_concentration(make(1.0, "CO", "ppmvd"), make(0.0, "CO", "ppmvd"), {}), units::InputError,
                    "a limit must be above 0");
}

// Wrong if rate limits were read in the wrong unit.
TEST(LimitScreening, ParsesRateLimits) {
  const RateLimit kg = parse_rate_limit("10 kg/h", "limit");
  EXPECT_EQ(kg.kind, RateKind::mass_flow);
  EXPECT_TRUE(is_close(kg.value_si, 10.0 / 3600.0, 1e-15));
  const RateLimit lb = parse_rate_limit("0.1 lb/MMBtu", "limit");
  EXPECT_EQ(lb.kind, RateKind::per_heat_input);
  EXPECT_TRUE(is_close(lb.value_si, 0.1 * 0.45359237 / 1.05505585262e9, 1e-14));
  EXPECT_EQ(parse_rate_limit("250 mg/kWh", "limit").kind, RateKind::per_useful_output);
  EXPECT_THROW_WITH((void)parse_rate_limit("10 mg/Nm3", "limit"), units::InputError,
                    "limit = \"10 mg/Nm3\": unknown rate unit \"mg/Nm3\"");
  EXPECT_THROW_WITH((void)parse_rate_limit("0 kg/h", "limit"), units::InputError, "a limit must be a finite number above 0");
}

// Wrong if a rate were screened against a limit of another kind, or mis-scaled.
TEST(LimitScreening, ScreensRatesInTheLimitUnit) {
  const ScreeningResult mass = screen_mass_rate(units::kilograms_per_second(2.0 / 3600.0), parse_rate_limit("5 kg/h", "l"));
  EXPECT_TRUE(is_close(mass.value, 2.0, 1e-13));
  EXPECT_TRUE(is_close(mass.margin, 3.0, 1e-13));
  expect_screening_wording(mass);
  const HeatInputRate heat{30e-12, "test", {}};  // 30 g/GJ
  const ScreeningResult per_heat = screen_heat_input_rate(heat, parse_rate_limit("25 g/GJ", "l"));
  EXPECT_EQ(per_heat.outcome, ScreeningOutcome::above_limit);
  EXPECT_TRUE(is_close(per_heat.fraction_of_limit, 1.2, 1e-13));
  EXPECT_THROW_WITH((void)screen_heat_input_rate(heat, parse_rate_limit("5 kg/h", "l")), units::InputError,
                    "is a mass rate, but the value screened is a rate per heat input");
}

}  // namespace
}  // namespace stackbound::emissions
