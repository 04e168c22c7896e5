// The HTML page of a reduction: a Report (cases/report_document.hpp) rendered by render_html, with a
// time-series plot per pollutant (values at the reference O2 against the stated limit, invalid
// periods shaded) and the Fo of each period against the fuel's range.
#include <cmath>

#include <fmt/format.h>

#include "stackbound/render/reduction_output.hpp"
#include "stackbound/render/report_renderers.hpp"

namespace stackbound::render {

using namespace stackbound::cases;

namespace {

constexpr std::size_t kMaxTableRows = 400;

std::string figure(double v, std::string_view unit) {
  return std::isfinite(v) ? fmt::format("{:.4g} {}", v, unit) : std::string("-");
}

double hours_since(const ReductionDocument& document, const ReductionPeriod& period) {
  return std::chrono::duration<double, std::ratio<3600>>(period.start - document.periods.front().start).count();
}

std::vector<std::pair<double, double>> invalid_spans(const ReductionDocument& document) {
  std::vector<std::pair<double, double>> spans;
  for (const ReductionPeriod& p : document.periods) {
    if (p.valid || !p.operating) continue;
    const double from = hours_since(document, p);
    spans.emplace_back(from, from + std::chrono::duration<double, std::ratio<3600>>(p.end - p.start).count());
  }
  return spans;
}

ReportPlot pollutant_plot(const ReductionDocument& document, std::size_t i) {
  const PollutantSummary& summary = document.summary.pollutants[i];
  ReportPlot plot;
  plot.title = fmt::format("{} per {} at {:.4g} % O2 (from {})", summary.pollutant, document.average,
                           document.reference_o2_percent, document.summary.first_reading);
  plot.x_label = "time since the first period [h]";
  plot.y_label = fmt::format("{} [mg/Nm3, dry, {:.4g} % O2]", summary.pollutant, document.reference_o2_percent);
  PlotSeries measured{"measured average", {}, {}}, validated{"validated average (eu-ied)", {}, {}}, limit{"stated limit", {}, {}};
  for (const ReductionPeriod& p : document.periods) {
    const double x = hours_since(document, p);
    const PeriodPollutant& v = p.values[i];
    measured.x.push_back(x);
    measured.y.push_back(v.figures[static_cast<std::size_t>(FigureKey::mg_per_Nm3_at_ref_o2)]);
    validated.x.push_back(x);
    validated.y.push_back(v.validated_mg_per_Nm3_at_ref_o2);
    if (std::isfinite(summary.limit_mg_per_Nm3_at_ref_o2)) {
      limit.x.push_back(x);
      limit.y.push_back(summary.limit_mg_per_Nm3_at_ref_o2);
    }
  }
  plot.series.push_back(std::move(measured));
  if (document.rules == "eu-ied") plot.series.push_back(std::move(validated));
  if (!limit.x.empty()) plot.series.push_back(std::move(limit));
  plot.shaded_x = invalid_spans(document);
  return plot;
}

std::optional<ReportPlot> fo_plot(const ReductionDocument& document) {
  const auto& fo = document.summary.fo;
  if (!fo) return std::nullopt;
  ReportPlot plot{"Fo of each period (US EPA Method 3B)", "time since the first period [h]", "Fo [1]", {}, false, {}};
  PlotSeries mean{"Fo, period mean", {}, {}}, low{"range low", {}, {}}, high{"range high", {}, {}}, expected{"expected 0.209 Fd/Fc", {}, {}};
  for (const ReductionPeriod& p : document.periods) {
    const double x = hours_since(document, p);
    mean.x.push_back(x);
    mean.y.push_back(p.fo);
    expected.x.push_back(x);
    expected.y.push_back(fo->expected);
    if (fo->range) {
      low.x.push_back(x);
      low.y.push_back(fo->range->low);
      high.x.push_back(x);
      high.y.push_back(fo->range->high);
    }
  }
  plot.series = {mean, expected};
  if (fo->range) {
    plot.series.push_back(std::move(low));
    plot.series.push_back(std::move(high));
  }
  plot.shaded_x = invalid_spans(document);
  return plot;
}

ReportTable periods_table(const ReductionDocument& document) {
  ReportTable table;
  table.title = fmt::format("Periods ({})", document.average);
  table.columns = {"start", "valid", "readings"};
  for (const std::string& p : document.pollutants) {
    table.columns.push_back(p + " mg/Nm3 at ref O2");
    if (document.rules == "eu-ied") table.columns.push_back(p + " validated");
  }
  table.columns.push_back("invalid because");
  for (std::size_t r = 0; r < document.periods.size() && r < kMaxTableRows; ++r) {
    const ReductionPeriod& period = document.periods[r];
    std::vector<std::string> row{period.start_text, period.valid ? "yes" : "no", std::to_string(period.readings)};
    for (const PeriodPollutant& v : period.values) {
      row.push_back(figure(v.figures[static_cast<std::size_t>(FigureKey::mg_per_Nm3_at_ref_o2)], ""));
      if (document.rules == "eu-ied") row.push_back(figure(v.validated_mg_per_Nm3_at_ref_o2, ""));
    }
    row.push_back(period.invalid_reason);
    table.rows.push_back(std::move(row));
  }
  if (document.periods.size() > kMaxTableRows) {
    table.notes.push_back(fmt::format("First {} of {} periods; the CSV and JSON outputs list all.", kMaxTableRows, document.periods.size()));
  }
  return table;
}

void add_summary(Report& report, const ReductionDocument& document) {
  const ReductionSummary& s = document.summary;
  report.summary = {{"Case file", document.case_origin},
                    {"Readings", fmt::format("{} ({} rows, {} to {})", document.readings_origin, s.rows, s.first_reading, s.last_reading)},
                    {"Rule set", document.rules},
                    {"Averages", document.average},
                    {"Reference O2", document.reference_o2},
                    {"O2 basis", document.o2_basis},
                    {"Normal conditions", document.normal_conditions},
                    {"Data availability", fmt::format("{} % ({} valid of {} operating hours)", figure(s.availability_percent, "").substr(0, 8),
                                                      s.valid_hours, s.operating_hours)},
                    {"Readings", fmt::format("{} valid of {}; {} missing at the logging interval; {} malformed rows",
                                             s.valid_readings, s.readings, s.missing_readings, s.problems.total())}};
  for (const auto& [kind, count] : s.invalid_hours_by_reason) report.summary.emplace_back("Invalid hours: " + kind, std::to_string(count));
  for (const auto& [status, count] : s.excluded_by_status) report.summary.emplace_back("Excluded: status " + status, fmt::format("{} readings", count));
  for (const PollutantSummary& p : s.pollutants) {
    const FigureStatistics& mg = p.figures[static_cast<std::size_t>(FigureKey::mg_per_Nm3_at_ref_o2)];
    report.summary.emplace_back(p.pollutant + " at ref O2", fmt::format("max {}, mean {} over {} valid periods", figure(mg.max, "mg/Nm3"),
                                                                        figure(mg.mean, "mg/Nm3"), mg.periods));
    if (!p.limit_text.empty()) {
      report.flags.push_back(fmt::format("{}: {} of {} valid periods above the stated limit {} (screening count, not a compliance "
                                         "determination; the permit governs)",
                                         p.pollutant, p.periods_above_limit, p.periods_compared, p.limit_text));
    }
  }
  if (s.fo) {
    report.summary.emplace_back("Fo", fmt::format("{} readings, median {:.3f}, 5-95 % {:.3f}-{:.3f}, expected {:.3f}; {} below and {} above the range",
                                                  s.fo->readings, s.fo->median, s.fo->p05, s.fo->p95, s.fo->expected,
                                                  s.fo->below_range, s.fo->above_range));
  }
}

}  // namespace

std::string render_reduction_html(const ReductionDocument& document) {
  Report report;
  report.title = "Analyser data: " + document.title;
  report.subtitle = "Corrected and averaged monitor readings for screening; not a compliance determination.";
  add_summary(report, document);
  if (!document.periods.empty()) {
    for (std::size_t i = 0; i < document.pollutants.size(); ++i) report.plots.push_back(pollutant_plot(document, i));
    if (auto plot = fo_plot(document)) report.plots.push_back(std::move(*plot));
  }
  report.tables.push_back(periods_table(document));
  ReportTable rules{"Rules applied", {"rule", "what it does", "source"}, {}, {}};
  for (const RuleNote& r : document.rules_applied) rules.rows.push_back({r.name, r.text, r.source});
  report.tables.push_back(std::move(rules));
  ReportTable bad{"Malformed rows (first few)", {"line", "kind", "detail"}, {}, {}};
  for (const RowProblem& p : document.summary.problems.first) bad.rows.push_back({std::to_string(p.line), std::string(row_problem_name(p.kind)), p.detail});
  if (!bad.rows.empty()) report.tables.push_back(std::move(bad));
  for (const std::string& w : document.warnings) report.flags.push_back(w);
  report.cautions = document.cautions;
  return render_html(report);
}

}  // namespace stackbound::render
