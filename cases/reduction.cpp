#include "stackbound/cases/reduction.hpp"

#include <algorithm>
#include <cmath>
#include <deque>
#include <map>

#include <fmt/format.h>

#include "stackbound/cases/period_averages.hpp"
#include "stackbound/cases/reading_correction.hpp"
#include "stackbound/cases/readings_csv.hpp"
#include "stackbound/cases/stage_resolve.hpp"
#include "stackbound/emissions/concentration.hpp"
#include "stackbound/emissions/reference_o2_presets.hpp"
#include "stackbound/units/input_error.hpp"

namespace stackbound::cases {

namespace em = stackbound::emissions;

std::string_view figure_key_name(FigureKey key) {
  switch (key) {
    case FigureKey::ppmvd: return "ppmvd";
    case FigureKey::ppmvd_at_ref_o2: return "ppmvd_at_ref_o2";
    case FigureKey::mg_per_Nm3_at_ref_o2: return "mg_per_Nm3_at_ref_o2";
    case FigureKey::kg_per_h: return "kg_per_h";
    case FigureKey::iso_corrected_ppmvd_at_15_o2: break;
  }
  return "iso_corrected_ppmvd_at_15_o2";
}

namespace {

constexpr std::size_t kProgressEvery = 65536;
constexpr double kFoBinWidth = 0.005;
constexpr std::size_t kFoBins = 600;  // 0 ... 3

// Fo statistics in constant memory: sums, extremes and a histogram for the percentiles.
class FoTally {
 public:
  void add(double fo, const std::optional<em::FoRange>& range) {
    ++summary_.readings;
    sum_ += fo;
    summary_.min = summary_.readings == 1 ? fo : std::min(summary_.min, fo);
    summary_.max = summary_.readings == 1 ? fo : std::max(summary_.max, fo);
    const auto bin = static_cast<std::size_t>(std::clamp(fo / kFoBinWidth, 0.0, static_cast<double>(kFoBins - 1)));
    ++bins_[bin];
    if (range && fo < range->low) ++summary_.below_range;
    if (range && fo > range->high) ++summary_.above_range;
  }
  [[nodiscard]] FoSummary finish(double expected, const std::optional<em::FoRange>& range) const {
    FoSummary out = summary_;
    out.expected = expected;
    out.range = range;
    if (out.readings == 0) return out;
    out.mean = sum_ / static_cast<double>(out.readings);
    out.p05 = percentile(0.05);
    out.median = percentile(0.50);
    out.p95 = percentile(0.95);
    return out;
  }

 private:
  [[nodiscard]] double percentile(double q) const {
    const double target = q * static_cast<double>(summary_.readings);
    double seen = 0.0;
    for (std::size_t i = 0; i < kFoBins; ++i) {
      seen += static_cast<double>(bins_[i]);
      if (seen >= target) return (static_cast<double>(i) + 0.5) * kFoBinWidth;
    }
    return summary_.max;
  }
  FoSummary summary_;
  double sum_ = 0.0;
  std::array<std::size_t, kFoBins> bins_{};
};

struct ReferenceChoice {
  double o2 = 0.0;
  std::string text;
};

ReferenceChoice reference_o2(const CaseDefinition& definition) {
  const std::optional<double>& stated = definition.report.reference_o2_fraction;
  if (definition.reference_o2_preset != nullptr) {
    const em::ReferenceO2Choice choice = em::choose_reference_o2(*definition.reference_o2_preset, stated);
    return {choice.o2_dry_fraction, choice.text()};
  }
  if (!stated) throw units::InputError("report.reference_o2: needs case.plant_type or an explicit O2, e.g. reference_o2: 3 %");
  return {*stated, fmt::format("{} % (stated in the case file)", em::percent_text(*stated))};
}

// The stated concentration limits at the reference O2 in mg/Nm3; CI fractions for eu-ied.
AveragingSetup averaging_setup(const CaseDefinition& definition, const ReadingsSpec& spec, const ReduceOptions& options,
                               double reference_o2, std::vector<std::string>& limit_texts,
                               std::vector<std::string>& warnings) {
  AveragingSetup setup;
  setup.rules = options.rules;
  setup.coverage = coverage_rules(options.rules, options.overrides);
  setup.interval_s = spec.interval_s;
  const em::Basis mg_at_ref = em::make_basis(em::mass_unit("mg/Nm3", *definition.report.normal), em::Moisture::dry,
                                             em::DiluentReference::o2(reference_o2));
  em::ConcentrationContext context;
  context.o2_basis = definition.report.o2_basis;
  for (const PollutantReading& p : spec.pollutants) {
    setup.pollutants.push_back(p.pollutant.name);
    double limit = kNoValue;
    std::string text;
    for (const LimitSpec& l : definition.report.limits) {
      if (l.pollutant != p.pollutant.name) continue;
      const auto* concentration = std::get_if<em::Concentration>(&l.limit);
      if (concentration == nullptr) {
        warnings.push_back(fmt::format("{} limit {} is a rate: periods are compared with concentration limits only",
                                       l.pollutant, l.text));
        continue;
      }
      try {
        const em::Concentration own{concentration->value(), p.pollutant, concentration->basis(), "report.limits"};
        limit = own.to(mg_at_ref, context).value();
        text = l.text;
      } catch (const em::MissingContextError& error) {
        warnings.push_back(fmt::format("{} limit {} cannot be put at the reference O2: {}", l.pollutant, l.text, error.what()));
      }
    }
    setup.limits_mg.push_back(limit);
    limit_texts.push_back(text);
    const std::optional<double> ci = options.rules == RuleSet::eu_ied ? confidence_interval_fraction(p.pollutant.name) : std::nullopt;
    setup.ci_fractions.push_back(ci ? *ci : kNoValue);
    if (options.rules == RuleSet::eu_ied && ci && std::isnan(limit)) {
      warnings.push_back(fmt::format("{}: no concentration limit stated in report.limits, so no validated average "
                                     "(the confidence interval is a fraction of the limit)", p.pollutant.name));
    }
  }
  return setup;
}

void add_statistic(FigureStatistics& stat, double v) {
  if (std::isnan(v)) return;
  stat.max = stat.periods == 0 ? v : std::max(stat.max, v);
  stat.mean = stat.periods == 0 ? v : stat.mean + (v - stat.mean) / static_cast<double>(stat.periods + 1);
  ++stat.periods;
}

}  // namespace

namespace {

// Takes closed hours in order and builds the requested periods, the day and month tallies and the
// hour statistics of the summary.
class PeriodSink {
 public:
  PeriodSink(const AveragingSetup& setup, const ReduceOptions& options, ReadingClock& clock, ReductionDocument& document)
      : setup_(setup), options_(options), average_(options.average), clock_(clock), document_(document) {
    for (const std::string& name : setup.pollutants) {
      PollutantSummary summary;
      summary.pollutant = name;
      if (setup.rules == RuleSet::eu_ied) summary.eu = EuTallies{};
      document_.summary.pollutants.push_back(std::move(summary));
    }
  }

  void add_hour(ReductionPeriod hour) {
    tally_hour(hour);
    const SysSeconds day = clock_.day_start(hour.start);
    if (!day_hours_.empty() && day != day_start_) close_day();
    if (day_hours_.empty()) day_start_ = day;
    if (average_.unit == AveragePeriod::Unit::hour) route_hour(hour);
    day_hours_.push_back(std::move(hour));
  }

  void finish() {
    if (!day_hours_.empty()) close_day();
    if (!group_.empty() && !average_.rolling) close_group(group_end_);
    if (!month_days_.empty()) close_month();
  }

 private:
  void output(ReductionPeriod period) {
    ReductionSummary& s = document_.summary;
    ++s.periods;
    if (period.valid) {
      ++s.valid_periods;
      for (std::size_t i = 0; i < setup_.pollutants.size(); ++i) {
        PollutantSummary& p = s.pollutants[i];
        const PeriodPollutant& v = period.values[i];
        for (std::size_t k = 0; k < kFigureKeys; ++k) add_statistic(p.figures[k], v.figures[k]);
        add_statistic(p.validated, v.validated_mg_per_Nm3_at_ref_o2);
        const double limit = setup_.limits_mg[i];
        const double compared = setup_.rules == RuleSet::eu_ied ? v.validated_mg_per_Nm3_at_ref_o2
                                                                : v.figures[static_cast<std::size_t>(FigureKey::mg_per_Nm3_at_ref_o2)];
        if (!std::isnan(limit) && !std::isnan(compared)) {
          ++p.periods_compared;
          if (compared > limit) ++p.periods_above_limit;
        }
      }
    }
    if (options_.on_period) options_.on_period(document_, period);
    if (options_.keep_periods) document_.periods.push_back(std::move(period));
  }

  void tally_hour(const ReductionPeriod& hour) {
    ReductionSummary& s = document_.summary;
    ++s.hours;
    if (!hour.operating) return;
    ++s.operating_hours;
    s.missing_readings += hour.missing;
    if (hour.valid) {
      ++s.valid_hours;
    } else {
      ++invalid_reasons_[hour.reason_kind];
    }
    if (!hour.valid || !document_.summary.pollutants[0].eu) return;
    for (std::size_t i = 0; i < setup_.pollutants.size(); ++i) {
      EuTallies& eu = *s.pollutants[i].eu;
      const double v = hour.values[i].validated_mg_per_Nm3_at_ref_o2;
      if (std::isnan(v)) continue;
      ++eu.valid_hours;
      if (v > 2.0 * setup_.limits_mg[i]) ++eu.hours_above_200_percent;
    }
  }

  // Hour-based outputs: each hour, groups of N hours within the local day, or a rolling window.
  void route_hour(const ReductionPeriod& hour) {
    if (average_.count == 1 && !average_.rolling) {
      output(hour);
      return;
    }
    if (average_.rolling) {
      window_.push_back(hour);
      if (window_.size() > static_cast<std::size_t>(average_.count)) window_.pop_front();
      output_window(true);
      return;
    }
    const SysSeconds day = clock_.day_start(hour.start);
    const auto step = std::chrono::hours(average_.count);
    const SysSeconds start = day + ((hour.start - day) / step) * step;
    if (!group_.empty() && start != group_start_) close_group(group_end_);
    if (group_.empty()) {
      group_start_ = start;
      group_end_ = std::min(start + step, clock_.next_day_start(day));
    }
    group_.push_back(hour);
  }

  void output_window(bool hours) {
    std::vector<const ReductionPeriod*> units;
    for (const ReductionPeriod& u : window_) units.push_back(&u);
    output(combine_periods(units, setup_, hours, hours ? average_.count : 24, window_.front().start, window_.back().end, clock_));
  }

  void close_group(SysSeconds end) {
    std::vector<const ReductionPeriod*> units;
    for (const ReductionPeriod& u : group_) units.push_back(&u);
    const bool hours = average_.unit == AveragePeriod::Unit::hour;
    output(combine_periods(units, setup_, hours, hours ? average_.count : 24, group_start_, end, clock_));
    group_.clear();
  }

  void close_day() {
    std::vector<const ReductionPeriod*> units;
    for (const ReductionPeriod& u : day_hours_) units.push_back(&u);
    ReductionPeriod day = combine_periods(units, setup_, true, 24, day_start_, clock_.next_day_start(day_start_), clock_);
    day_hours_.clear();
    tally_day(day);
    route_day(day);
  }

  void tally_day(const ReductionPeriod& day) {
    const SysSeconds month = clock_.month_start(day.start);
    if (!month_days_.empty() && month != month_start_) close_month();
    if (month_days_.empty()) month_start_ = month;
    month_days_.push_back(day);
    if (!day.valid) return;
    for (std::size_t i = 0; i < setup_.pollutants.size(); ++i) {
      auto& eu = document_.summary.pollutants[i].eu;
      const double v = day.values[i].validated_mg_per_Nm3_at_ref_o2;
      if (!eu || std::isnan(v)) continue;
      ++eu->valid_days;
      if (v > 1.1 * setup_.limits_mg[i]) ++eu->days_above_110_percent;
    }
  }

  void route_day(const ReductionPeriod& day) {
    if (average_.unit != AveragePeriod::Unit::day) return;
    if (average_.count == 1 && !average_.rolling) {
      output(day);
      return;
    }
    if (average_.rolling) {
      window_.push_back(day);
      if (window_.size() > static_cast<std::size_t>(average_.count)) window_.pop_front();
      output_window(false);
      return;
    }
    if (group_.empty()) group_start_ = day.start;
    group_.push_back(day);
    if (group_.size() == static_cast<std::size_t>(average_.count)) close_group(day.end);
    else group_end_ = day.end;
  }

  void close_month() {
    std::vector<const ReductionPeriod*> units;
    for (const ReductionPeriod& u : month_days_) units.push_back(&u);
    ReductionPeriod month = combine_periods(units, setup_, false, 24, month_start_, clock_.next_month_start(month_start_), clock_);
    month_days_.clear();
    for (std::size_t i = 0; i < setup_.pollutants.size() && month.valid; ++i) {
      auto& eu = document_.summary.pollutants[i].eu;
      const double v = month.values[i].validated_mg_per_Nm3_at_ref_o2;
      if (!eu || std::isnan(v)) continue;
      ++eu->months;
      if (v > setup_.limits_mg[i]) ++eu->months_above_limit;
    }
    if (average_.unit == AveragePeriod::Unit::month) output(std::move(month));
  }

 public:
  std::map<std::string, std::size_t> invalid_reasons_;

 private:
  const AveragingSetup& setup_;
  const ReduceOptions& options_;
  const AveragePeriod& average_;
  ReadingClock& clock_;
  ReductionDocument& document_;
  std::vector<ReductionPeriod> day_hours_;
  SysSeconds day_start_{};
  std::vector<ReductionPeriod> month_days_;
  SysSeconds month_start_{};
  std::vector<ReductionPeriod> group_;
  SysSeconds group_start_{}, group_end_{};
  std::deque<ReductionPeriod> window_;
};

}  // namespace

namespace {

void note_problem(ReductionSummary& summary, RowProblem problem, const std::string& origin, const ReduceOptions& options) {
  if (options.strict) {
    throw units::InputError(fmt::format("{}:{}: {}: {} (--strict stops at the first malformed row)", origin, problem.line,
                                        row_problem_name(problem.kind), problem.detail));
  }
  ++summary.problems.counts[static_cast<std::size_t>(problem.kind)];
  if (summary.problems.first.size() < options.listed_problems) summary.problems.first.push_back(std::move(problem));
}

std::vector<std::string> reduction_cautions() {
  return {
      "Screening figures: averages, validity and counts above a limit are computed by the stated rules for checking and "
      "planning; they are not a compliance determination. The permit, the applicable regulation and the competent "
      "authority decide which rules, thresholds and data substitutions apply.",
      "The corrected values are only as good as the analysers: calibration, drift and QA records (Fo, span and zero "
      "checks) must be reviewed by a qualified person before any figure is reported.",
      "Rules marked 'from memory' were not checked against the regulation's text here; confirm them in the current "
      "official text before relying on them.",
  };
}

void finish_warnings(ReductionDocument& document, const ReadingsSpec& spec, const ReadingCorrector& corrector) {
  ReductionSummary& s = document.summary;
  if (s.problems.total() > 0) {
    document.warnings.push_back(fmt::format("{} malformed rows excluded from the averages (see summary.bad_rows)", s.problems.total()));
  }
  if (s.fo && s.fo->range && s.fo->below_range + s.fo->above_range > 0) {
    document.warnings.push_back(fmt::format("Fo outside the {} range {:.3f}-{:.3f} in {} of {} readings: check the O2 and CO2 "
                                            "analysers (US EPA Method 3B, from memory)",
                                            s.fo->range->fuel, s.fo->range->low, s.fo->range->high,
                                            s.fo->below_range + s.fo->above_range, s.fo->readings));
  }
  if (corrector.gas_turbine_iso()) {
    if (!spec.source(ReadingSlot::ambient_humidity)) {
      document.warnings.push_back("gas-turbine ISO correction: no ambient humidity mapped, the ISO humidity 0.00633 kg/kg is assumed");
    }
    if (!spec.reference_inlet_pressure_Pa) {
      document.warnings.push_back(
          "gas-turbine ISO correction: no combustor inlet pressure mapped (readings.inlet_pressure and "
          "readings.reference_inlet_pressure), the pressure term is taken as 1");
    }
  }
  if (s.operating_hours > 0 && s.valid_hours == 0) document.warnings.push_back("no valid hour in the readings");
}

}  // namespace

ReductionDocument reduce_readings(const CaseDefinition& definition, const core::SpeciesDatabase& database,
                                  std::istream& readings, const std::string& origin, const ReduceOptions& options) {
  if (!definition.readings) {
    throw units::InputError(fmt::format("{}: the case file has no readings section (docs/case-file.md, \"readings\")", definition.origin));
  }
  const ReadingsSpec& spec = *definition.readings;
  ReductionDocument document;
  document.title = definition.title;
  document.case_origin = definition.origin;
  document.readings_origin = origin;
  document.zone = spec.time.zone;
  document.rules = std::string(rule_set_name(options.rules));
  document.average = options.average.text();
  const ReferenceChoice reference = reference_o2(definition);
  document.reference_o2 = reference.text;
  document.reference_o2_percent = reference.o2 * 100.0;
  document.o2_basis = em::o2_basis_description(definition.report.o2_basis);
  document.normal_conditions = std::string(definition.report.normal->description);
  std::vector<std::string> limit_texts;
  const AveragingSetup setup = averaging_setup(definition, spec, options, reference.o2, limit_texts, document.warnings);
  document.pollutants = setup.pollutants;
  const CoverageRules coverage = setup.coverage;
  document.rules_applied = rule_notes(options.rules, coverage, options.overrides);
  document.cautions = reduction_cautions();

  const ResolvedCase resolved = resolve_stage(definition, database);
  const bool fo_mapped = spec.source(ReadingSlot::o2) && spec.source(ReadingSlot::co2);
  const std::optional<em::FoRange> fo_range =
      spec.fo_range ? spec.fo_range : (definition.fuel.fuel.kind == FuelKind::preset ? em::fo_range_for_preset(definition.fuel.fuel.preset) : std::nullopt);
  const ReadingCorrector corrector(definition, spec, reference.o2);
  document.gas_turbine_iso = corrector.gas_turbine_iso();

  ReadingsCsvReader reader(spec, definition.report.o2_basis, readings, origin);
  ReadingClock& clock = reader.clock();
  PeriodSink sink(setup, options, clock, document);
  ReductionSummary& summary = document.summary;
  std::vector<std::size_t> excluded_counts(spec.status ? spec.status->exclude.size() : 0, 0);
  FoTally fo;
  std::optional<HourAccumulator> hour;
  SysSeconds last_time{};
  RawReading reading;
  RowProblem problem;
  const bool load_mapped = spec.source(ReadingSlot::load).has_value();
  for (ReadingsCsvReader::Next next; (next = reader.next(reading, problem)) != ReadingsCsvReader::Next::end;) {
    if (++summary.rows % kProgressEvery == 0 && options.progress) options.progress(reader.bytes_read());
    if (next == ReadingsCsvReader::Next::problem) {
      note_problem(summary, std::move(problem), origin, options);
      continue;
    }
    const bool operating = !load_mapped || reading.values[static_cast<std::size_t>(ReadingSlot::load)] > 0.0;
    std::optional<CorrectedReading> corrected;
    if (reading.status < 0 && operating) {
      try {
        corrected = corrector.correct(reading);
      } catch (const units::InputError& error) {
        note_problem(summary, {RowProblemKind::impossible_value, reading.line, error.what()}, origin, options);
        continue;
      }
    }
    ++summary.readings;
    if (summary.readings == 1) summary.first_reading = clock.text(reading.time);
    last_time = reading.time;
    const SysSeconds start = clock.hour_start(reading.time);
    if (hour && hour->start() != start) {
      sink.add_hour(hour->finish(clock));
      for (SysSeconds gap = hour->start() + std::chrono::hours(1); gap < start; gap += std::chrono::hours(1)) {
        sink.add_hour(HourAccumulator(setup, gap).finish(clock));
      }
      hour.reset();
    }
    if (!hour) hour.emplace(setup, start);
    hour->add(reading, corrected ? &*corrected : nullptr, operating);
    if (reading.status >= 0) ++excluded_counts[static_cast<std::size_t>(reading.status)];
    if (!operating) ++summary.zero_load_readings;
    if (corrected) ++summary.valid_readings;
    if (corrected && corrected->fo) fo.add(*corrected->fo, fo_range);
  }
  if (summary.readings > 0) summary.last_reading = clock.text(last_time);
  if (hour) sink.add_hour(hour->finish(clock));
  sink.finish();
  if (options.progress) options.progress(reader.bytes_read());

  for (std::size_t i = 0; i < excluded_counts.size(); ++i) summary.excluded_by_status.emplace_back(spec.status->exclude[i], excluded_counts[i]);
  for (const auto& [kind, count] : sink.invalid_reasons_) summary.invalid_hours_by_reason.emplace_back(kind, count);
  if (summary.operating_hours > 0) {
    summary.availability_percent = 100.0 * static_cast<double>(summary.valid_hours) / static_cast<double>(summary.operating_hours);
  }
  for (std::size_t i = 0; i < setup.pollutants.size(); ++i) {
    summary.pollutants[i].limit_text = limit_texts[i];
    summary.pollutants[i].limit_mg_per_Nm3_at_ref_o2 = setup.limits_mg[i];
  }
  if (fo_mapped) {
    const core::FFactors& f = resolved.combustion.f_factors;
    summary.fo = fo.finish(em::expected_fo(f.fd_m3_per_J, f.fc_m3_per_J), fo_range);
  }
  finish_warnings(document, spec, corrector);
  return document;
}

}  // namespace stackbound::cases
