#pragma once
// Averages of corrected readings over local hours, and of hours over longer periods, with the
// validity the rule set gives them (averaging_rules.hpp). Hours are the base unit: each reading adds to
// its hour; an hour closes into a ReductionPeriod; hours combine into days, groups of hours, groups of
// days, months or rolling windows. Memory is bounded by one hour and one output period (a rolling
// window keeps its units' averages).

#include <cstddef>
#include <deque>
#include <optional>
#include <string>
#include <vector>

#include "stackbound/cases/averaging_rules.hpp"
#include "stackbound/cases/reduction_document.hpp"

namespace stackbound::cases {

// What the averages need beyond the readings.
struct AveragingSetup {
  RuleSet rules = RuleSet::none;
  CoverageRules coverage;
  double interval_s = 60.0;
  std::vector<std::string> pollutants;           // in mapping order
  std::vector<double> limits_mg;                 // per pollutant, NaN without a limit
  std::vector<double> ci_fractions;              // per pollutant, NaN where the rule set has none
};

class HourAccumulator {
 public:
  HourAccumulator(const AveragingSetup& setup, SysSeconds start);
  [[nodiscard]] SysSeconds start() const { return start_; }
  // A well-formed reading of this hour; `corrected` is empty for an excluded one.
  void add(const RawReading& reading, const CorrectedReading* corrected, bool operating);
  // The hour's average and validity.
  [[nodiscard]] ReductionPeriod finish(ReadingClock& clock) const;

 private:
  [[nodiscard]] std::optional<std::pair<std::string, std::string>> invalidity(int operating_quadrants) const;

  const AveragingSetup& setup_;
  SysSeconds start_;
  std::size_t rows_ = 0, valid_ = 0, excluded_ = 0;
  unsigned seen_ = 0, operating_seen_ = 0, valid_quadrants_ = 0;  // bit per 15-minute quadrant
  bool calibration_ = false;
  SysSeconds first_valid_{}, last_valid_{};
  std::array<std::array<double, kFigureKeys>, kMaxReadingPollutants> sums_{};
  std::array<std::array<std::size_t, kFigureKeys>, kMaxReadingPollutants> counts_{};
  double o2_sum_ = 0.0, fo_sum_ = 0.0;
  std::size_t o2_n_ = 0, fo_n_ = 0;
};

// Combines consecutive unit periods (hours or days) into one: mean of the valid units. `validity`
// of the combined period follows `unit_is_hour` and the rule set.
ReductionPeriod combine_periods(const std::vector<const ReductionPeriod*>& units, const AveragingSetup& setup,
                                bool units_are_hours, int nominal_hours, SysSeconds start, SysSeconds end,
                                ReadingClock& clock);

}  // namespace stackbound::cases
