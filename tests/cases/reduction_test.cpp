// The readings section and the reduction of analyser readings: load errors at their file positions,
// per-reading correction by the emissions conversions, bad rows counted by kind with their lines,
// gaps, daylight-saving transitions, periods longer than an hour.

#include <gtest/gtest.h>

#include <algorithm>
#include <cmath>

#include <fmt/format.h>

#include "stackbound/cases/reading_correction.hpp"
#include "stackbound/emissions/concentration.hpp"
#include "stackbound/units/input_error.hpp"
#include "tests/support/reduction_case.hpp"
#include "tests/support/tolerance.hpp"

namespace stackbound::cases {
namespace {

using stackbound::testing::basic_readings;
using stackbound::testing::is_close;
using stackbound::testing::reduce_text;
using stackbound::testing::reduction_case_text;
namespace em = stackbound::emissions;

constexpr std::size_t kNox = 0;  // the only pollutant of basic_readings
constexpr auto kMg = static_cast<std::size_t>(FigureKey::mg_per_Nm3_at_ref_o2);
constexpr auto kPpmvd = static_cast<std::size_t>(FigureKey::ppmvd);

// `count` one-minute rows from `first` (UTC "2026-06-15T10:00:00Z" style), O2 3 %, NOx `nox` ppm, OK.
std::string minute_rows(int first_minute, int count, double nox, const std::string& status = "OK") {
  std::string rows;
  for (int m = first_minute; m < first_minute + count; ++m) {
    rows += fmt::format("2026-06-15T{:02}:{:02}:00Z,3.0,{},{}\n", m / 60, m % 60, nox, status);
  }
  return rows;
}

const std::string kHeader = "time,O2,NOx,status\n";

// Wrong if the section's shape were not checked at load, or its errors lost their file position.
TEST(ReadingsSection, WetColumnWithoutMoistureIsRefusedAtItsPosition) {
  const std::string text = reduction_case_text(
      "  time: {column: time}\n  o2: {column: O2, basis: dry}\n  nox: {column: NOx, unit: ppm, basis: wet}\n");
  EXPECT_THROW_WITH(parse_case(text, "test.yaml"), units::InputError, "test.yaml:21:");
  EXPECT_THROW_WITH(parse_case(text, "test.yaml"), units::InputError, "column NOx is wet and needs the moisture");
}

// Wrong if a misspelt key or a missing basis passed silently.
TEST(ReadingsSection, UnknownKeysAndMissingBasisAreNamed) {
  EXPECT_THROW_WITH(parse_case(reduction_case_text("  time: {column: time}\n  nox: {column: NOx, unit: ppm, bass: dry}\n"),
                               "test.yaml"),
                    units::InputError, "bass");
  EXPECT_THROW_WITH(parse_case(reduction_case_text("  time: {column: time}\n  o2: {column: O2}\n  nox: {column: NOx}\n"),
                               "test.yaml"),
                    units::InputError, "readings.nox");
}

// Wrong if a wet flow's mass rate were computed without the moisture (it needs the dry flow).
TEST(ReadingsSection, WetFlowWithoutMoistureIsRefused) {
  EXPECT_THROW_WITH(parse_case(reduction_case_text(basic_readings() + "  flow: {column: Q, unit: Nm3/h}\n"), "test.yaml"),
                    units::InputError, "a wet flow needs the moisture");
}

// Wrong if the mass rate were not concentration x molar mass (NO2 for NOx) x dry flow: 100 ppm NOx in
// a dry flow of 22 413.97 Nm3/h at 0 degC (1000 kmol/h) is 1e-4 x M(NO2) x 1e6 mol/h.
TEST(ReadingCorrection, MassRateFromADryFlow) {
  const CaseDefinition definition =
      parse_case(reduction_case_text(basic_readings() + "  flow: {column: Q, unit: Nm3/h, basis: dry}\n"), "test.yaml");
  const ReadingCorrector corrector(definition, *definition.readings, 0.03);
  RawReading reading;
  reading.values[static_cast<std::size_t>(ReadingSlot::o2)] = 0.05;
  reading.values[static_cast<std::size_t>(ReadingSlot::nox)] = 100.0;
  // The column's unit: 22 413.97 Nm3/h at 0 degC read as 1000 kmol/h (mol/s in the reading).
  const double flow_mol_per_s = 22413.969545 * definition.readings->source(ReadingSlot::flow)->scale;
  EXPECT_TRUE(is_close(flow_mol_per_s * 3600.0, 1e6, 1e-6));
  reading.values[static_cast<std::size_t>(ReadingSlot::flow)] = flow_mol_per_s;
  const double kg_per_h = corrector.correct(reading).figures[kNox][static_cast<std::size_t>(FigureKey::kg_per_h)];
  EXPECT_TRUE(is_close(kg_per_h, 1e-4 * em::no2_molar_mass_kg_per_mol() * flow_mol_per_s * 3600.0, 1e-12));
}

// Wrong if a mapped column missing from the CSV header were not named with the columns there are.
TEST(ReadingsCsv, MissingColumnNamesTheHeader) {
  EXPECT_THROW_WITH(reduce_text(reduction_case_text(basic_readings()), "time,O2,status\n"), units::InputError,
                    "test.csv:1: readings.nox.column = \"NOx\": no such column in the header; the columns are time, O2, status");
}

// The per-reading O2 correction must be the emissions layer's own conversion, the one `convert` runs
// (cli/convert_command.cpp calls Concentration::convert): identical to 1e-12. Wrong if the reduction
// had its own correction formula or O2 basis.
TEST(ReadingCorrection, EqualsConvertForTheSameValue) {
  const CaseDefinition definition = parse_case(reduction_case_text(basic_readings()), "test.yaml");
  const ReadingCorrector corrector(definition, *definition.readings, 0.03);
  RawReading reading;
  reading.values[static_cast<std::size_t>(ReadingSlot::o2)] = 0.105;
  reading.values[static_cast<std::size_t>(ReadingSlot::nox)] = 42.5;
  const CorrectedReading corrected = corrector.correct(reading);
  em::ConcentrationContext context;
  context.o2_dry_fraction = 0.105;
  context.o2_basis = em::O2Basis::eu_21;
  const em::Concentration measured(42.5, em::pollutant_by_name("NOx", "t"), em::parse_basis("ppmv, dry", "t"));
  const double ppm_ref = measured.convert(em::parse_basis("ppmv, dry, O2=3%", "t"), context).result.value();
  const double mg_ref =
      measured.convert(em::parse_basis("mg/Nm3, dry, O2=3%", "t", &units::normal_0C()), context).result.value();
  EXPECT_TRUE(is_close(corrected.figures[kNox][static_cast<std::size_t>(FigureKey::ppmvd_at_ref_o2)], ppm_ref, 1e-12));
  EXPECT_TRUE(is_close(corrected.figures[kNox][kMg], mg_ref, 1e-12));
  // By hand: 42.5 (21 - 3)/(21 - 10.5) = 72.857...; the correction must actually have been applied.
  EXPECT_TRUE(is_close(ppm_ref, 42.5 * 18.0 / 10.5, 1e-12));
}

// Wrong if a kind of bad row were dropped silently, miscounted, or listed at the wrong line.
TEST(ReadingsCsv, EveryMalformedRowKindIsCountedWithItsLine) {
  const std::string csv = kHeader +                      // line 1
                          "2026-03-29T01:00:00,3.0,50,OK\n"  // 2 fine
                          "2026-03-29T01:01:00,3.0,OK\n"     // 3 field_count
                          "2026-03-29T01:02:00,3.0,abc,OK\n" // 4 not_a_number
                          "2026-03-29T01:03:00,,50,OK\n"     // 5 empty_value
                          "29/03/2026 01:04,3.0,50,OK\n"     // 6 bad_time
                          "2026-03-29T02:30:00,3.0,50,OK\n"  // 7 nonexistent_time (Europe/Berlin spring gap)
                          "2026-03-29T01:10:00,3.0,50,OK\n"  // 8 fine
                          "2026-03-29T01:05:00,3.0,50,OK\n"  // 9 out_of_order
                          "2026-03-29T01:10:00,3.0,50,OK\n"  // 10 duplicate_time
                          "2026-03-29T01:11:00,25,50,OK\n"   // 11 impossible_value (O2 above 21 %)
                          "2026-03-29T01:12:00,3.0,-4,OK\n"; // 12 impossible_value (negative ppm)
  ReduceOptions options;
  options.listed_problems = 20;
  const ReductionDocument doc = reduce_text(reduction_case_text(basic_readings("Europe/Berlin")), csv, options);
  const ProblemSummary& p = doc.summary.problems;
  const std::vector<std::pair<RowProblemKind, std::size_t>> expected{
      {RowProblemKind::field_count, 3},  {RowProblemKind::not_a_number, 4},   {RowProblemKind::empty_value, 5},
      {RowProblemKind::bad_time, 6},     {RowProblemKind::nonexistent_time, 7}, {RowProblemKind::out_of_order, 9},
      {RowProblemKind::duplicate_time, 10}, {RowProblemKind::impossible_value, 11}, {RowProblemKind::impossible_value, 12}};
  ASSERT_EQ(p.first.size(), expected.size());
  for (std::size_t i = 0; i < expected.size(); ++i) {
    EXPECT_EQ(p.first[i].kind, expected[i].first) << p.first[i].detail;
    EXPECT_EQ(p.first[i].line, expected[i].second) << p.first[i].detail;
  }
  for (std::size_t k = 0; k < kRowProblemKinds; ++k) {
    EXPECT_EQ(p.counts[k], static_cast<RowProblemKind>(k) == RowProblemKind::impossible_value ? 2U : 1U)
        << row_problem_name(static_cast<RowProblemKind>(k));
  }
  EXPECT_EQ(doc.summary.readings, 2U);
  EXPECT_EQ(doc.summary.rows, 11U);
}

// Wrong if hostile rows crashed the reader, slipped into the averages, or made a figure non-finite.
TEST(ReadingsCsv, HostileRowsAreCountedNeverAveraged) {
  const std::string csv = kHeader + minute_rows(600, 1, 40) +
                          "2026-06-15T10:01:00Z,3.0,1e308,OK\n"
                          "2026-06-15T10:02:00Z,3.0,inf,OK\n"
                          "2026-06-15T10:03:00Z,3.0,nan,OK\n"
                          "2026-06-15T10:04:00Z,3.0,2e6,OK\n"  // a mole fraction above 1
                          "2026-06-15T10:05:00Z,3.0,\x01\xff,OK\n"
                          "2026-02-30T10:06:00Z,3.0,40,OK\n"
                          "2026-06-15T10:07:00+25:00,3.0,40,OK\n"
                          "\"2026-06-15T10:08:00Z\",\"3.0\",\"41\",\"OK\"\n";
  const ReductionDocument doc = reduce_text(reduction_case_text(basic_readings()), csv);
  EXPECT_EQ(doc.summary.problems.total(), 7U);
  EXPECT_EQ(doc.summary.valid_readings, 2U);  // the first row and the quoted one
  ASSERT_EQ(doc.periods.size(), 1U);
  EXPECT_TRUE(is_close(doc.periods[0].values[kNox].figures[kPpmvd], 40.5, 1e-12));
  for (const double v : doc.periods[0].values[kNox].figures) EXPECT_TRUE(std::isnan(v) || std::isfinite(v)) << v;
  const auto control_row = std::find_if(doc.summary.problems.first.begin(), doc.summary.problems.first.end(),
                                        [](const RowProblem& p) { return p.line == 7; });
  ASSERT_NE(control_row, doc.summary.problems.first.end());
  EXPECT_EQ(control_row->detail, "column NOx = \"\\x01\\xff\": not a number")
      << "the bytes are shown escaped: raw, they stopped the JSON report";
  EXPECT_THROW_WITH(reduce_text(reduction_case_text(basic_readings()), ""), units::InputError, "no header row");
}

// Wrong if --strict went on past a bad row, or did not name its file and line.
TEST(ReadingsCsv, StrictStopsAtTheFirstMalformedRow) {
  ReduceOptions options;
  options.strict = true;
  EXPECT_THROW_WITH(reduce_text(reduction_case_text(basic_readings()),
                                kHeader + minute_rows(600, 2, 40) + "2026-06-15T10:02:00Z,3.0,x,OK\n", options),
                    units::InputError, "test.csv:4: not_a_number: column NOx = \"x\": not a number");
}

// The rows of one local day at one-minute steps, written in local time without an offset, as a
// logger on local time writes them: the spring night skips 02:00-02:59, the autumn night repeats it.
std::string local_day_rows(const std::string& date, int repeated_hour, int skipped_hour) {
  std::string rows;
  for (int h = 0; h < 24; ++h) {
    if (h == skipped_hour) continue;
    for (int pass = 0; pass < (h == repeated_hour ? 2 : 1); ++pass) {
      for (int m = 0; m < 60; ++m) rows += fmt::format("{}T{:02}:{:02}:00,3.0,40,OK\n", date, h, m);
    }
  }
  return rows;
}

// Wrong if an hour were counted twice or lost at a daylight-saving transition: the spring day has 23
// local hours, the autumn day 25, each with its 60 readings. (Europe/Berlin: 2026-03-29 02:00 -> 03:00,
// 2026-10-25 03:00 -> 02:00; from the system's tzdata.)
TEST(ReductionTime, DaylightSavingTransitionsKeepEveryHourOnce) {
  const std::string text = reduction_case_text(basic_readings("Europe/Berlin"));
  for (const auto& [date, repeated, skipped, hours] :
       std::vector<std::tuple<std::string, int, int, int>>{{"2026-03-29", -1, 2, 23}, {"2026-10-25", 2, -1, 25}}) {
    const ReductionDocument doc = reduce_text(text, kHeader + local_day_rows(date, repeated, skipped));
    EXPECT_EQ(doc.summary.problems.total(), 0U) << date;
    ASSERT_EQ(doc.periods.size(), static_cast<std::size_t>(hours)) << date;
    for (std::size_t i = 0; i < doc.periods.size(); ++i) {
      EXPECT_EQ(doc.periods[i].readings, 60U) << date << " hour " << doc.periods[i].start_text;
      EXPECT_TRUE(doc.periods[i].valid) << doc.periods[i].start_text;
      if (i > 0) {
        EXPECT_EQ(doc.periods[i].start - doc.periods[i - 1].start, std::chrono::hours(1));
      }
    }
    ReduceOptions day;
    day.average = parse_average_period("day", "t");
    const ReductionDocument daily = reduce_text(text, kHeader + local_day_rows(date, repeated, skipped), day);
    ASSERT_EQ(daily.periods.size(), 1U);
    EXPECT_EQ(daily.periods[0].valid_hours, hours) << date;
    EXPECT_EQ(daily.periods[0].readings, static_cast<std::size_t>(60 * hours));
    EXPECT_EQ(daily.periods[0].end - daily.periods[0].start, std::chrono::hours(hours));
  }
  // The autumn repeat is told apart by order: the second 02:00 is an hour after the first.
  const ReductionDocument doc = reduce_text(text, kHeader + local_day_rows("2026-10-25", 2, -1));
  EXPECT_EQ(doc.periods[2].start_text, "2026-10-25T02:00:00+02:00");
  EXPECT_EQ(doc.periods[3].start_text, "2026-10-25T02:00:00+01:00");
}

// Wrong if a gap vanished instead of becoming missing readings and invalid hours.
TEST(ReductionGaps, HoursWithoutRowsAreInvalidAndCountedMissing) {
  const ReductionDocument doc =
      reduce_text(reduction_case_text(basic_readings()), kHeader + minute_rows(600, 60, 40) + minute_rows(780, 60, 40));
  ASSERT_EQ(doc.periods.size(), 4U);  // 10:00, 11:00 and 12:00 (gap), 13:00
  EXPECT_FALSE(doc.periods[1].valid);
  EXPECT_EQ(doc.periods[1].invalid_reason, "no readings in the hour (gap)");
  EXPECT_EQ(doc.summary.missing_readings, 120U);
  EXPECT_TRUE(is_close(doc.summary.availability_percent, 50.0, 1e-12));
}

// Wrong if day averages were not the mean of the valid hours, or eu-ied's day rule were not applied.
TEST(ReductionPeriods, EuIedDayIsInvalidWithMoreThanThreeInvalidHours) {
  // 20 valid hours at 40 ppm, then 4 hours with only faults.
  const std::string csv = kHeader + minute_rows(0, 20 * 60, 40) + minute_rows(20 * 60, 4 * 60, 40, "FAULT");
  ReduceOptions options;
  options.rules = RuleSet::eu_ied;
  options.average = parse_average_period("day", "t");
  const ReductionDocument doc = reduce_text(reduction_case_text(basic_readings()), csv, options);
  ASSERT_EQ(doc.periods.size(), 1U);
  EXPECT_FALSE(doc.periods[0].valid);
  EXPECT_EQ(doc.periods[0].invalid_hours, 4);
  options.overrides.max_invalid_hours_per_day = 4;
  const ReductionDocument relaxed = reduce_text(reduction_case_text(basic_readings()), csv, options);
  EXPECT_TRUE(relaxed.periods[0].valid);
  EXPECT_TRUE(is_close(relaxed.periods[0].values[kNox].figures[kPpmvd], 40.0, 1e-12));
}

// Wrong if rolling averages did not run over the last N valid units.
TEST(ReductionPeriods, RollingHoursAverageTheWindow) {
  const std::string csv = kHeader + minute_rows(0, 60, 10) + minute_rows(60, 60, 20) + minute_rows(120, 60, 60);
  ReduceOptions options;
  options.average = parse_average_period("2h rolling", "t");
  const ReductionDocument doc = reduce_text(reduction_case_text(basic_readings()), csv, options);
  ASSERT_EQ(doc.periods.size(), 3U);
  EXPECT_TRUE(is_close(doc.periods[0].values[kNox].figures[kPpmvd], 10.0, 1e-12));
  EXPECT_TRUE(is_close(doc.periods[1].values[kNox].figures[kPpmvd], 15.0, 1e-12));
  EXPECT_TRUE(is_close(doc.periods[2].values[kNox].figures[kPpmvd], 40.0, 1e-12));
}

// Wrong if an averaging period outside the accepted forms were taken.
TEST(AveragingRules, PeriodTextIsParsedOrRefused) {
  EXPECT_EQ(parse_average_period("30d rolling", "--average").text(), "30d rolling");
  EXPECT_EQ(parse_average_period("8h", "--average").count, 8);
  EXPECT_THROW_WITH(parse_average_period("7h", "--average"), units::InputError, "--average = \"7h\": accepted: hour");
  EXPECT_THROW_WITH(parse_rule_set("part60", "--rules"), units::InputError, "accepted: us-part60, eu-ied, none");
}

}  // namespace
}  // namespace stackbound::cases
