#include "stackbound/cases/period_averages.hpp"

#include <algorithm>
#include <bit>
#include <cmath>

#include <fmt/format.h>

namespace stackbound::cases {

namespace {

constexpr auto kQuadrant = std::chrono::minutes(15);

std::pair<std::string, std::string> reason(std::string kind, std::string text) { return {std::move(kind), std::move(text)}; }

void apply_validated(PeriodPollutant& value, const AveragingSetup& setup, std::size_t i) {
  const double mg = value.figures[static_cast<std::size_t>(FigureKey::mg_per_Nm3_at_ref_o2)];
  if (setup.rules != RuleSet::eu_ied || std::isnan(setup.limits_mg[i]) || std::isnan(setup.ci_fractions[i]) || std::isnan(mg)) return;
  // Source: Directive 2010/75/EU Annex V Part 3 (from memory): measured minus the CI fraction of the limit.
  value.validated_mg_per_Nm3_at_ref_o2 = std::max(0.0, mg - setup.ci_fractions[i] * setup.limits_mg[i]);
}

}  // namespace

HourAccumulator::HourAccumulator(const AveragingSetup& setup, SysSeconds start) : setup_(setup), start_(start) {}

void HourAccumulator::add(const RawReading& reading, const CorrectedReading* corrected, bool operating) {
  const auto quadrant = static_cast<unsigned>((reading.time - start_) / kQuadrant);
  const unsigned bit = 1U << std::min(quadrant, 3U);
  ++rows_;
  seen_ |= bit;
  if (operating) operating_seen_ |= bit;
  if (reading.calibration) calibration_ = true;
  if (corrected == nullptr) {
    ++excluded_;
    return;
  }
  if (valid_ == 0) first_valid_ = reading.time;
  last_valid_ = reading.time;
  ++valid_;
  valid_quadrants_ |= bit;
  for (std::size_t i = 0; i < setup_.pollutants.size(); ++i) {
    for (std::size_t k = 0; k < kFigureKeys; ++k) {
      const double v = corrected->figures[i][k];
      if (std::isnan(v)) continue;
      sums_[i][k] += v;
      ++counts_[i][k];
    }
  }
  if (!std::isnan(corrected->o2_dry_fraction)) {
    o2_sum_ += corrected->o2_dry_fraction * 100.0;
    ++o2_n_;
  }
  if (corrected->fo) {
    fo_sum_ += *corrected->fo;
    ++fo_n_;
  }
}

std::optional<std::pair<std::string, std::string>> HourAccumulator::invalidity(int operating_quadrants) const {
  if (rows_ == 0) return reason("no readings", "no readings in the hour (gap)");
  if (valid_ == 0) return reason("no valid readings", fmt::format("no valid readings ({} excluded)", excluded_));
  const CoverageRules& c = setup_.coverage;
  if (c.min_quadrants > 0) {
    const int valid_in_operating = std::popcount(valid_quadrants_ & ~(seen_ & ~operating_seen_) & 0xFU);
    const int needed = std::min(c.min_quadrants, operating_quadrants);
    const bool two_points = valid_ >= 2 && last_valid_ - first_valid_ >= kQuadrant;
    if (valid_in_operating < needed && !(calibration_ && two_points)) {
      return reason("missing 15-minute quadrant",
                    fmt::format("valid readings in {} of {} operating 15-minute quadrants, {} needed (40 CFR 60.13(h)(2))",
                                valid_in_operating, operating_quadrants, needed) +
                        (calibration_ ? "; calibration hour without two valid readings 15 min apart" : ""));
    }
  }
  if (c.min_hour_coverage > 0.0) {
    const double expected = 3600.0 / setup_.interval_s * operating_quadrants / 4.0;
    if (static_cast<double>(valid_) < c.min_hour_coverage * expected - 1e-9) {
      return reason("coverage below threshold", fmt::format("{} valid readings of {:.0f} expected, {:.4g} % needed", valid_,
                                                            expected, c.min_hour_coverage * 100.0));
    }
  }
  return std::nullopt;
}

ReductionPeriod HourAccumulator::finish(ReadingClock& clock) const {
  ReductionPeriod hour;
  hour.start = start_;
  hour.end = start_ + std::chrono::hours(1);
  hour.start_text = clock.text(hour.start);
  hour.end_text = clock.text(hour.end);
  // A quadrant is not operating when it has readings and all are at zero load.
  const int operating_quadrants = 4 - std::popcount(seen_ & ~operating_seen_ & 0xFU);
  hour.operating = operating_quadrants > 0;
  hour.readings = valid_;
  hour.excluded = excluded_;
  const double expected = 3600.0 / setup_.interval_s * operating_quadrants / 4.0;
  hour.missing = static_cast<std::size_t>(std::max(0.0, std::round(expected) - static_cast<double>(rows_)));
  for (std::size_t i = 0; i < setup_.pollutants.size(); ++i) {
    PeriodPollutant value{setup_.pollutants[i], {}, kNoValue};
    for (std::size_t k = 0; k < kFigureKeys; ++k) {
      value.figures[k] = counts_[i][k] > 0 ? sums_[i][k] / static_cast<double>(counts_[i][k]) : kNoValue;
    }
    apply_validated(value, setup_, i);
    hour.values.push_back(std::move(value));
  }
  if (o2_n_ > 0) hour.o2_percent_dry = o2_sum_ / static_cast<double>(o2_n_);
  if (fo_n_ > 0) hour.fo = fo_sum_ / static_cast<double>(fo_n_);
  if (!hour.operating) {
    hour.invalid_reason = "unit not operating (zero load)";
    hour.reason_kind = "not operating";
    return hour;
  }
  if (const auto why = invalidity(operating_quadrants)) {
    hour.reason_kind = why->first;
    hour.invalid_reason = why->second;
  } else {
    hour.valid = true;
  }
  return hour;
}

namespace {

// The validity of a period made of units; nullopt when valid.
std::optional<std::pair<std::string, std::string>> combined_invalidity(int valid, int invalid, const AveragingSetup& setup,
                                                                       bool hours, int nominal_hours) {
  if (valid == 0) return reason("no valid units", hours ? "no valid hours" : "no valid days");
  if (!hours) return std::nullopt;
  const CoverageRules& c = setup.coverage;
  if (setup.rules == RuleSet::eu_ied) {
    // A day: at most max_invalid_hours_per_day; shorter groups in proportion (common practice, no source).
    const int allowed = c.max_invalid_hours_per_day * std::min(nominal_hours, 24) / 24;
    if (invalid > allowed) {
      return reason("too many invalid hours", fmt::format("{} invalid hours, at most {} allowed (Directive 2010/75/EU "
                                                          "Annex V Part 3)", invalid, allowed));
    }
  }
  const double fraction = static_cast<double>(valid) / static_cast<double>(valid + invalid);
  if (fraction < c.min_valid_hours_fraction - 1e-12) {
    return reason("too few valid hours", fmt::format("valid hours {} of {} operating hours, {:.4g} % needed", valid,
                                                     valid + invalid, c.min_valid_hours_fraction * 100.0));
  }
  return std::nullopt;
}

}  // namespace

ReductionPeriod combine_periods(const std::vector<const ReductionPeriod*>& units, const AveragingSetup& setup,
                                bool units_are_hours, int nominal_hours, SysSeconds start, SysSeconds end,
                                ReadingClock& clock) {
  ReductionPeriod period;
  period.start = start;
  period.end = end;
  period.start_text = clock.text(start);
  period.end_text = clock.text(end);
  const std::size_t n_pollutants = setup.pollutants.size();
  std::vector<std::array<double, kFigureKeys + 1>> sums(n_pollutants), counts(n_pollutants);
  double o2 = 0.0, fo = 0.0;
  std::size_t o2_n = 0, fo_n = 0;
  int valid = 0, invalid = 0;
  for (const ReductionPeriod* unit : units) {
    period.excluded += unit->excluded;
    period.missing += unit->missing;
    if (!unit->operating) continue;
    period.valid_hours += units_are_hours ? (unit->valid ? 1 : 0) : unit->valid_hours;
    period.invalid_hours += units_are_hours ? (unit->valid ? 0 : 1) : unit->invalid_hours;
    if (!unit->valid) {
      ++invalid;
      continue;
    }
    ++valid;
    period.readings += unit->readings;
    for (std::size_t i = 0; i < n_pollutants; ++i) {
      for (std::size_t k = 0; k <= kFigureKeys; ++k) {
        const double v = k < kFigureKeys ? unit->values[i].figures[k] : unit->values[i].validated_mg_per_Nm3_at_ref_o2;
        if (std::isnan(v)) continue;
        sums[i][k] += v;
        counts[i][k] += 1.0;
      }
    }
    if (!std::isnan(unit->o2_percent_dry)) {
      o2 += unit->o2_percent_dry;
      ++o2_n;
    }
    if (!std::isnan(unit->fo)) {
      fo += unit->fo;
      ++fo_n;
    }
  }
  for (std::size_t i = 0; i < n_pollutants; ++i) {
    PeriodPollutant value{setup.pollutants[i], {}, kNoValue};
    for (std::size_t k = 0; k < kFigureKeys; ++k) value.figures[k] = counts[i][k] > 0 ? sums[i][k] / counts[i][k] : kNoValue;
    if (counts[i][kFigureKeys] > 0) value.validated_mg_per_Nm3_at_ref_o2 = sums[i][kFigureKeys] / counts[i][kFigureKeys];
    period.values.push_back(std::move(value));
  }
  if (o2_n > 0) period.o2_percent_dry = o2 / static_cast<double>(o2_n);
  if (fo_n > 0) period.fo = fo / static_cast<double>(fo_n);
  period.operating = valid + invalid > 0;
  if (!period.operating) {
    period.reason_kind = "not operating";
    period.invalid_reason = "unit not operating";
    return period;
  }
  if (const auto why = combined_invalidity(valid, invalid, setup, units_are_hours, nominal_hours)) {
    period.reason_kind = why->first;
    period.invalid_reason = why->second;
  } else {
    period.valid = true;
  }
  return period;
}

}  // namespace stackbound::cases
