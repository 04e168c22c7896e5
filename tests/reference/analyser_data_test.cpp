// Analyser-data reduction against the published rules (40 CFR 60.13(h)(2), Directive 2010/75/EU
// Annex V, US EPA Method 3B, 40 CFR 60.335(b)(1)), each by a hand calculation from the rule's text.

#include <gtest/gtest.h>

#include <cmath>

#include <fmt/format.h>

#include "stackbound/cases/case_file.hpp"
#include "stackbound/cases/species_file.hpp"
#include "stackbound/cases/stage_resolve.hpp"
#include "stackbound/emissions/fo_factor.hpp"
#include "stackbound/emissions/gas_turbine_iso.hpp"
#include "tests/support/published_check.hpp"
#include "tests/support/reduction_case.hpp"
#include "tests/support/tolerance.hpp"

namespace stackbound::cases {
namespace {

using stackbound::testing::basic_readings;
using stackbound::testing::is_close;
using stackbound::testing::record_published_check;
using stackbound::testing::reduce_text;
using stackbound::testing::reduction_case_text;

constexpr auto kPpmvd = static_cast<std::size_t>(FigureKey::ppmvd);
const std::string kHeader = "time,O2,NOx,status\n";

std::string row(int minute, double nox) { return fmt::format("2026-06-15T10:{:02}:00Z,3.0,{},OK\n", minute, nox); }

// Wrong if an hour missing a 15-minute quadrant counted as valid, or one with a reading in each
// quadrant were refused, or the hour's average were not the mean of its valid readings.
TEST(UsPart60, HourNeedsAValidReadingInEachQuadrant) {
  ReduceOptions options;
  options.rules = RuleSet::us_part60;
  const std::string text = reduction_case_text(basic_readings());
  // Valid readings in quadrants 1-3 only (10:00, 10:20, 10:35); the fourth has only a fault reading (excluded).
  const std::string three = kHeader + row(0, 10) + row(20, 20) + row(35, 30) + "2026-06-15T10:50:00Z,3.0,99,FAULT\n";
  const ReductionDocument invalid = reduce_text(text, three, options);
  ASSERT_EQ(invalid.periods.size(), 1U);
  // Source: 40 CFR 60.13(h)(2) (from memory): one valid data point in each 15-minute quadrant of an operating hour.
  EXPECT_FALSE(invalid.periods[0].valid);
  EXPECT_NE(invalid.periods[0].invalid_reason.find("3 of 4"), std::string::npos) << invalid.periods[0].invalid_reason;
  // The same hour with one valid reading in the fourth quadrant: valid, average (10+20+30+40)/4 = 25 ppmvd
  // (the fault reading of 99 ppm excluded).
  const std::string four = kHeader + row(0, 10) + row(20, 20) + row(35, 30) + row(50, 40) + "2026-06-15T10:55:00Z,3.0,99,FAULT\n";
  const ReductionDocument valid = reduce_text(text, four, options);
  ASSERT_EQ(valid.periods.size(), 1U);
  EXPECT_TRUE(valid.periods[0].valid) << valid.periods[0].invalid_reason;
  EXPECT_EQ(valid.periods[0].readings, 4U);
  const double mean = valid.periods[0].values[0].figures[kPpmvd];
  record_published_check({"us-part60 hourly NOx average, 4 quadrants", "readings 10, 20, 30, 40 ppmvd, one fault excluded",
                          "25 ppmvd (hand calculation)", "40 CFR 60.13(h)(2) (from memory)", "1e-12 relative (arithmetic)",
                          mean});
  EXPECT_TRUE(is_close(mean, 25.0, 1e-12));
}

// Wrong if the eu-ied validated average did not subtract 20 % of the NOx limit from the measured hour.
TEST(EuIed, ValidatedNoxHourIsMeasuredMinusTwentyPercentOfTheLimit) {
  // NOx stated directly in mg/Nm3 at the reference O2: 70 and 90 mg/Nm3 alternating, 80 mg/Nm3 on average.
  const std::string readings =
      "  time: {column: time}\n  nox: {column: NOx, unit: mg/Nm3, basis: \"dry, O2=3%\"}\n";
  std::string csv = "time,NOx\n";
  for (int m = 0; m < 60; ++m) csv += fmt::format("2026-06-15T10:{:02}:00Z,{}\n", m, m % 2 == 0 ? 70.0 : 90.0);
  ReduceOptions options;
  options.rules = RuleSet::eu_ied;
  const ReductionDocument doc = reduce_text(reduction_case_text(readings), csv, options);
  ASSERT_EQ(doc.periods.size(), 1U);
  ASSERT_TRUE(doc.periods[0].valid) << doc.periods[0].invalid_reason;
  const PeriodPollutant& nox = doc.periods[0].values[0];
  EXPECT_TRUE(is_close(nox.figures[static_cast<std::size_t>(FigureKey::mg_per_Nm3_at_ref_o2)], 80.0, 1e-12));
  // Source: Directive 2010/75/EU Annex V Part 3 (from memory); 13. BImSchV (2021) Anlage 4 Nr. 1 (stored copy):
  // NOx confidence interval 20 % of the limit, 100 mg/Nm3 -> 80 - 20 = 60 mg/Nm3.
  record_published_check({"eu-ied validated hourly NOx", "measured 80 mg/Nm3 at 3 % O2, limit 100 mg/Nm3",
                          "60 mg/Nm3 (hand calculation)", "Directive 2010/75/EU Annex V Part 3 (from memory); 13. BImSchV Anlage 4",
                          "1e-12 relative (arithmetic)", nox.validated_mg_per_Nm3_at_ref_o2});
  EXPECT_TRUE(is_close(nox.validated_mg_per_Nm3_at_ref_o2, 60.0, 1e-12));
}

// Wrong if the Fo of our own complete-combustion flue gas of methane disagreed with 0.209 Fd/Fc, i.e.
// if the Fo formula, the F-factors or the flue O2/CO2 were inconsistent.
TEST(Fo, PureMethaneFlueGasEqualsPointTwoZeroNineFdOverFc) {
  const CaseDefinition definition = parse_case(reduction_case_text(basic_readings()), "test.yaml");
  const ResolvedCase resolved = resolve_stage(definition, builtin_species());
  const core::CombustionResult& c = resolved.combustion;
  const std::optional<double> fo = emissions::fo_ratio(c.flue_o2_dry, c.flue_co2_dry);
  ASSERT_TRUE(fo.has_value());
  const double expected = emissions::expected_fo(c.f_factors.fd_m3_per_J, c.f_factors.fc_m3_per_J);
  // Source: US EPA Method 3B (40 CFR 60 App. A-2) / Method 19, Fo = 0.209 Fd/Fc (from memory). Our air
  // holds 20.95 % O2 and a little CO2 (1976 standard atmosphere), the formula assumes 20.9 % and none:
  // 0.5 % relative allowed for that.
  record_published_check({"Fo of methane flue gas vs 0.209 Fd/Fc", "CH4, 15 % excess air, complete combustion",
                          fmt::format("{:.4f} (0.209 Fd/Fc of the same fuel)", expected),
                          "US EPA Method 3B / Method 19 (from memory)",
                          "0.5 % relative (20.95 % O2 and CO2 in our air vs 20.9 % and none in the formula)", *fo});
  EXPECT_TRUE(is_close(*fo, expected, 0.005));
  // The natural-gas range of Method 3B (1.600-1.836, from memory) holds methane's Fo.
  const auto range = emissions::find_fo_range("natural-gas");
  ASSERT_TRUE(range.has_value());
  EXPECT_GT(*fo, range->low);
  EXPECT_LT(*fo, range->high);
}

// Wrong if the ISO correction were not exactly 1 at the ISO day, or moved the wrong way: a hot day
// lowers the corrected NOx ((288/T)^1.53), humid air raises it (exp(19 (H - 0.00633))).
TEST(GasTurbineIso, IsExactlyOneAtIsoAndMovesTheRightWay) {
  using emissions::GasTurbineAmbient;
  const GasTurbineAmbient iso{units::kelvin(288.0), emissions::kIsoHumidityRatio, units::pascals(1.4e6), units::pascals(1.4e6)};
  // Source: 40 CFR 60.335(b)(1) (from memory, high confidence): every term is 1 at the ISO day.
  const double at_iso = emissions::gas_turbine_iso_factor(iso);
  record_published_check({"gas-turbine NOx ISO factor at the ISO day", "288 K, H = 0.00633 kg/kg, P_o = P_r",
                          "1 exactly", "40 CFR 60.335(b)(1) (from memory)", "exact", at_iso});
  EXPECT_EQ(at_iso, 1.0);
  GasTurbineAmbient hot = iso;
  hot.ambient_temperature = units::kelvin(308.0);
  const double hot_factor = emissions::gas_turbine_iso_factor(hot);
  EXPECT_LT(hot_factor, 1.0);
  EXPECT_TRUE(is_close(hot_factor, std::pow(288.0 / 308.0, 1.53), 1e-14));
  GasTurbineAmbient humid = iso;
  humid.humidity_ratio_kg_per_kg = 0.015;
  EXPECT_GT(emissions::gas_turbine_iso_factor(humid), 1.0);
  EXPECT_TRUE(is_close(emissions::gas_turbine_iso_factor(humid), std::exp(19.0 * (0.015 - 0.00633)), 1e-14));
  GasTurbineAmbient low_inlet = iso;
  low_inlet.observed_inlet_pressure = units::pascals(1.2e6);
  EXPECT_TRUE(is_close(emissions::gas_turbine_iso_factor(low_inlet), std::sqrt(1.4 / 1.2), 1e-14));
}

}  // namespace
}  // namespace stackbound::cases
