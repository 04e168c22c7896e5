#include "stackbound/cases/averaging_rules.hpp"

#include <charconv>

#include <fmt/format.h>

#include "stackbound/units/input_error.hpp"

namespace stackbound::cases {

std::string_view rule_set_name(RuleSet rules) {
  switch (rules) {
    case RuleSet::us_part60: return "us-part60";
    case RuleSet::eu_ied: return "eu-ied";
    case RuleSet::none: break;
  }
  return "none";
}

RuleSet parse_rule_set(std::string_view text, std::string_view field) {
  if (text == "us-part60") return RuleSet::us_part60;
  if (text == "eu-ied") return RuleSet::eu_ied;
  if (text == "none") return RuleSet::none;
  throw units::InputError(fmt::format("{} = \"{}\": accepted: us-part60, eu-ied, none", field, text));
}

std::string AveragePeriod::text() const {
  std::string base;
  if (unit == Unit::month) base = "month";
  else if (count == 1 && !rolling) base = unit == Unit::hour ? "hour" : "day";
  else base = fmt::format("{}{}", count, unit == Unit::hour ? "h" : "d");
  return rolling ? base + " rolling" : base;
}

AveragePeriod parse_average_period(std::string_view text, std::string_view field) {
  const auto refuse = [&]() -> AveragePeriod {
    throw units::InputError(fmt::format(
        "{} = \"{}\": accepted: hour, day, month, Nh (N dividing 24: 1 2 3 4 6 8 12 24), Nd (N from 1 to 366), "
        "each but month optionally followed by \"rolling\" (e.g. \"30d rolling\")",
        field, text));
  };
  AveragePeriod period;
  std::string_view rest = text;
  while (!rest.empty() && rest.back() == ' ') rest.remove_suffix(1);
  constexpr std::string_view kRolling = "rolling";
  if (rest.size() > kRolling.size() && rest.substr(rest.size() - kRolling.size()) == kRolling) {
    period.rolling = true;
    rest.remove_suffix(kRolling.size());
    while (!rest.empty() && rest.back() == ' ') rest.remove_suffix(1);
  }
  if (rest == "hour") return period;
  if (rest == "day" || rest == "month") {
    period.unit = rest == "day" ? AveragePeriod::Unit::day : AveragePeriod::Unit::month;
    if (period.unit == AveragePeriod::Unit::month && period.rolling) refuse();
    return period;
  }
  if (rest.size() < 2) refuse();
  const char suffix = rest.back();
  const std::string_view number = rest.substr(0, rest.size() - 1);
  const auto parsed = std::from_chars(number.data(), number.data() + number.size(), period.count);
  if (parsed.ec != std::errc() || parsed.ptr != number.data() + number.size() || period.count < 1) refuse();
  if (suffix == 'h') {
    if (24 % period.count != 0 && !period.rolling) refuse();
    if (period.count > 24 * 366) refuse();
  } else if (suffix == 'd') {
    period.unit = AveragePeriod::Unit::day;
    if (period.count > 366) refuse();
  } else {
    refuse();
  }
  return period;
}

CoverageRules coverage_rules(RuleSet rules, const CoverageOverrides& overrides) {
  CoverageRules coverage;
  switch (rules) {
    case RuleSet::us_part60:
      coverage.min_valid_hours_fraction = 0.75;
      break;
    case RuleSet::eu_ied:
      coverage.min_quadrants = 0;
      coverage.min_hour_coverage = 2.0 / 3.0;
      coverage.max_invalid_hours_per_day = 3;
      break;
    case RuleSet::none:
      coverage.min_quadrants = 0;
      break;
  }
  if (overrides.min_quadrants) coverage.min_quadrants = *overrides.min_quadrants;
  if (overrides.min_hour_coverage) coverage.min_hour_coverage = *overrides.min_hour_coverage;
  if (overrides.max_invalid_hours_per_day) coverage.max_invalid_hours_per_day = *overrides.max_invalid_hours_per_day;
  if (overrides.min_valid_hours_fraction) coverage.min_valid_hours_fraction = *overrides.min_valid_hours_fraction;
  return coverage;
}

std::optional<double> confidence_interval_fraction(std::string_view pollutant) {
  // Source: Directive 2010/75/EU Annex V Part 3 (from memory for the numbering); 13. BImSchV (2021)
  // Anlage 4 Nr. 1 (stored copy).
  if (pollutant == "CO") return 0.10;
  if (pollutant == "SO2") return 0.20;
  if (pollutant == "NOx" || pollutant == "NO2") return 0.20;
  if (pollutant == "dust") return 0.30;
  return std::nullopt;
}

std::vector<RuleNote> rule_notes(RuleSet rules, const CoverageRules& c, const CoverageOverrides& overrides) {
  std::vector<RuleNote> notes;
  notes.push_back({"excluded readings",
                   "readings whose status is listed under readings.status.exclude (calibration, maintenance, fault) and "
                   "readings at zero load are left out of every average; malformed rows are excluded and counted",
                   rules == RuleSet::us_part60 ? "40 CFR 60.13(h)(2) (from memory)" : "common practice, no source"});
  if (rules == RuleSet::us_part60) {
    notes.push_back({"hour validity",
                     fmt::format("an hour is valid with at least one valid reading in each of {} 15-minute quadrants in "
                                 "which the unit operates (fewer when it operates in fewer); an hour with calibration or "
                                 "maintenance needs at least two valid readings at least 15 minutes apart",
                                 c.min_quadrants),
                     "40 CFR 60.13(h)(2) (from memory); 60.13(e)(2) one cycle per 15 minutes (stored copy)"});
    notes.push_back({"longer periods",
                     fmt::format("valid with valid hours for at least {:.4g} % of the operating hours; the average is the "
                                 "mean of the valid hours",
                                 c.min_valid_hours_fraction * 100.0),
                     "subpart-specific, e.g. 40 CFR 60.1260(b)-(c) (stored copy): check the subpart and the permit"});
  } else if (rules == RuleSet::eu_ied) {
    notes.push_back({"hour validity",
                     fmt::format("an hour is valid with valid readings for at least {:.4g} % of its expected readings",
                                 c.min_hour_coverage * 100.0),
                     "common practice, no source: the permit or national rules set it"});
    notes.push_back({"validated averages",
                     "validated hourly average = measured average minus the 95 % confidence interval as a fraction of the "
                     "stated limit: CO 10 %, SO2 20 %, NOx 20 %, dust 30 % (not below 0); daily and longer validated "
                     "averages are means of the validated hourly averages",
                     "Directive 2010/75/EU Annex V Part 3 (from memory); 13. BImSchV (2021) Anlage 4 Nr. 1 (stored copy)"});
    notes.push_back({"day validity",
                     fmt::format("a day with more than {} invalid operating hours is invalid", c.max_invalid_hours_per_day),
                     "Directive 2010/75/EU Annex V Part 3 (from memory)"});
    notes.push_back({"screening tallies",
                     "validated daily averages above 110 % of the limit, validated monthly averages above the limit, "
                     "validated hourly averages above 200 % of the limit (95 % of the year's hours must be at or below): "
                     "counts for screening, not a compliance verdict",
                     "Directive 2010/75/EU Annex V Part 4 (from memory)"});
  } else {
    notes.push_back({"validity", "plain averages of the valid readings: a period is valid with one valid reading",
                     "no rule set (--rules none)"});
  }
  notes.push_back({"averaging", "each reading is corrected first (dry, reference O2, mg/Nm3), then averaged arithmetically",
                   "common practice, no source"});
  if (overrides.any()) {
    notes.push_back({"overridden thresholds", "coverage thresholds set on the command line replace the rule set's",
                     "user setting"});
  }
  return notes;
}

}  // namespace stackbound::cases
