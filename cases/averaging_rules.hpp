#pragma once
// The rule sets that decide which averages of analyser readings are valid, and how they are
// validated, with the source of every rule (docs/reduce.md lists them):
//   us-part60  40 CFR 60.13(h)(2) (from memory): an hour is valid with at least one valid reading in each
//              15-minute quadrant in which the unit operates; an hour with calibration or maintenance
//              needs two valid readings at least 15 minutes apart; calibration, maintenance and fault
//              readings are left out. Longer periods: valid with valid hours for at least 75 % of the
//              operating hours (subpart-specific, e.g. 40 CFR 60.1260(b)-(c), stored copy).
//   eu-ied     Directive 2010/75/EU Annex V Part 3 (from memory): validated average = measured average
//              minus the 95 % confidence interval fraction of the limit (CO 10 %, SO2 20 %, NOx 20 %, dust
//              30 %; the same in 13. BImSchV Anlage 4 Nr. 1, stored copy); a day with more than three
//              invalid hours is invalid. Hour coverage 2/3 of the readings: common practice, no source.
//   none       plain averages: a period is valid with one valid reading.

#include <optional>
#include <string>
#include <string_view>
#include <vector>

namespace stackbound::cases {

enum class RuleSet { us_part60, eu_ied, none };
std::string_view rule_set_name(RuleSet rules);                       // "us-part60", "eu-ied", "none"
RuleSet parse_rule_set(std::string_view text, std::string_view field);  // InputError otherwise

// The periods averages are reported for.
struct AveragePeriod {
  enum class Unit { hour, day, month };
  Unit unit = Unit::hour;
  int count = 1;          // hours or days per period (months: 1)
  bool rolling = false;   // a window of `count` units ending at each unit
  [[nodiscard]] std::string text() const;  // "hour", "8h", "day", "30d rolling", "month"
};
// "hour", "day", "month", "Nh" (N dividing 24), "Nd", each optionally followed by " rolling"
// ("30d rolling", "24h rolling"; not for months). InputError naming `field` otherwise.
AveragePeriod parse_average_period(std::string_view text, std::string_view field);

// Coverage thresholds of a rule set; each may be overridden (the output says so).
struct CoverageRules {
  int min_quadrants = 4;                  // us-part60: quadrants needing a valid reading (of those operating)
  double min_hour_coverage = 0.0;         // fraction of an hour's expected readings that must be valid
  int max_invalid_hours_per_day = 24;     // eu-ied: 3
  double min_valid_hours_fraction = 0.0;  // of operating hours, for periods longer than an hour
};
struct CoverageOverrides {
  std::optional<int> min_quadrants;
  std::optional<double> min_hour_coverage;
  std::optional<int> max_invalid_hours_per_day;
  std::optional<double> min_valid_hours_fraction;
  [[nodiscard]] bool any() const {
    return min_quadrants || min_hour_coverage || max_invalid_hours_per_day || min_valid_hours_fraction;
  }
};
CoverageRules coverage_rules(RuleSet rules, const CoverageOverrides& overrides);

// eu-ied: the 95 % confidence interval of a single measured result as a fraction of the limit; nullopt
// for a pollutant the rule does not list.
std::optional<double> confidence_interval_fraction(std::string_view pollutant);

// A rule as the output names it.
struct RuleNote {
  std::string name;    // "hour validity"
  std::string text;    // what it does, with its thresholds
  std::string source;  // "40 CFR 60.13(h)(2) (from memory)"
};
std::vector<RuleNote> rule_notes(RuleSet rules, const CoverageRules& coverage, const CoverageOverrides& overrides);

}  // namespace stackbound::cases
