#pragma once
// The result of reducing analyser readings (reduction.hpp): averages per period with their validity,
// a summary, the rules applied with their sources, warnings and cautions. Plain data; the renderers
// (render/reduction_output.hpp) and the JSON keys (docs/report-json.md, "reduce") read it as it is.

#include <array>
#include <cstddef>
#include <limits>
#include <optional>
#include <string>
#include <string_view>
#include <utility>
#include <vector>

#include "stackbound/cases/averaging_rules.hpp"
#include "stackbound/cases/reading_clock.hpp"
#include "stackbound/cases/reading_correction.hpp"
#include "stackbound/cases/readings_csv.hpp"
#include "stackbound/emissions/fo_factor.hpp"

namespace stackbound::cases {

inline constexpr double kNoValue = std::numeric_limits<double>::quiet_NaN();

// The JSON key of a figure: "ppmvd", "ppmvd_at_ref_o2", "mg_per_Nm3_at_ref_o2", "kg_per_h",
// "iso_corrected_ppmvd_at_15_o2".
std::string_view figure_key_name(FigureKey key);

struct PeriodPollutant {
  std::string pollutant;                               // "NOx"
  std::array<double, kFigureKeys> figures{};           // by FigureKey; NaN: no value
  double validated_mg_per_Nm3_at_ref_o2 = kNoValue;    // eu-ied with a stated limit
};

struct ReductionPeriod {
  SysSeconds start{};
  SysSeconds end{};
  std::string start_text;                 // local ISO 8601 with offset
  std::string end_text;
  bool valid = false;
  bool operating = true;                  // false: the unit did not operate (no reading above zero load)
  std::string invalid_reason;             // empty when valid
  std::string reason_kind;                // short category of the reason, for the summary
  std::size_t readings = 0;               // valid readings averaged
  std::size_t excluded = 0;               // by status or zero load
  std::size_t missing = 0;                // expected at the logging interval but absent (gaps, malformed rows)
  int valid_hours = 0;                    // periods longer than an hour
  int invalid_hours = 0;
  std::vector<PeriodPollutant> values;    // in the order of the readings mapping
  double o2_percent_dry = kNoValue;
  double fo = kNoValue;
};

struct FigureStatistics {
  double max = kNoValue;
  double mean = kNoValue;
  std::size_t periods = 0;
};

// eu-ied screening tallies (Directive 2010/75/EU Annex V Part 4, from memory): counts, never a verdict.
struct EuTallies {
  std::size_t valid_days = 0, days_above_110_percent = 0;
  std::size_t months = 0, months_above_limit = 0;
  std::size_t valid_hours = 0, hours_above_200_percent = 0;
};

struct PollutantSummary {
  std::string pollutant;
  std::array<FigureStatistics, kFigureKeys> figures{};
  FigureStatistics validated;
  std::string limit_text;                 // as stated; empty without a concentration limit
  double limit_mg_per_Nm3_at_ref_o2 = kNoValue;
  std::size_t periods_compared = 0;       // valid periods compared with the limit
  std::size_t periods_above_limit = 0;    // on the validated value (eu-ied) or the measured one
  std::optional<EuTallies> eu;
};

struct FoSummary {
  std::size_t readings = 0;
  std::size_t below_range = 0, above_range = 0;
  double mean = kNoValue, min = kNoValue, max = kNoValue;
  double p05 = kNoValue, median = kNoValue, p95 = kNoValue;  // from a 0.005-wide histogram
  double expected = kNoValue;             // 0.209 Fd / Fc of the case's fuel
  std::optional<emissions::FoRange> range;
};

struct ProblemSummary {
  std::array<std::size_t, kRowProblemKinds> counts{};
  std::vector<RowProblem> first;          // the first few, in file order
  [[nodiscard]] std::size_t total() const {
    std::size_t n = 0;
    for (const std::size_t c : counts) n += c;
    return n;
  }
};

struct ReductionSummary {
  std::string first_reading, last_reading;
  std::size_t rows = 0;                   // data rows read (readings and malformed rows)
  std::size_t readings = 0;               // well-formed readings
  std::size_t valid_readings = 0;
  std::size_t missing_readings = 0;       // over the operating hours, at the logging interval
  std::size_t zero_load_readings = 0;
  std::vector<std::pair<std::string, std::size_t>> excluded_by_status;
  std::size_t hours = 0, operating_hours = 0, valid_hours = 0;
  std::vector<std::pair<std::string, std::size_t>> invalid_hours_by_reason;
  double availability_percent = kNoValue;  // valid of operating hours
  std::size_t periods = 0, valid_periods = 0;
  std::vector<PollutantSummary> pollutants;
  std::optional<FoSummary> fo;
  ProblemSummary problems;
};

struct ReductionDocument {
  std::string title;                      // the case's
  std::string case_origin, readings_origin;
  std::string zone;
  std::string rules;                      // "us-part60"
  std::string average;                    // "hour", "30d rolling"
  std::string reference_o2;               // "15 % (preset ied-gas-turbine ...)"
  double reference_o2_percent = 0.0;
  std::string o2_basis;                   // "20.9 % (US EPA practice)"
  std::string normal_conditions;          // "0 degC, 101.325 kPa ..."
  std::vector<std::string> pollutants;
  bool gas_turbine_iso = false;
  std::vector<ReductionPeriod> periods;
  ReductionSummary summary;
  std::vector<RuleNote> rules_applied;
  std::vector<std::string> warnings;
  std::vector<std::string> cautions;
};

// Whether a figure is reported for a pollutant: all but the ISO-corrected NOx, which only a gas turbine's
// NOx with mapped ambient columns has.
inline bool figure_reported(const ReductionDocument& document, std::string_view pollutant, FigureKey key) {
  return key != FigureKey::iso_corrected_ppmvd_at_15_o2 || (document.gas_turbine_iso && pollutant == "NOx");
}

}  // namespace stackbound::cases
