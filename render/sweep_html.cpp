#include "stackbound/render/sweep_html.hpp"

#include <algorithm>
#include <cmath>

#include <fmt/format.h>

#include "stackbound/cases/run_document.hpp"
#include "stackbound/emissions/cautions.hpp"
#include "stackbound/emissions/reference_correction.hpp"

namespace stackbound::render {

using namespace stackbound::cases;

void SweepHtmlCollector::add(const SweepPoint& point) {
  Row row{point.values, {}, point.error};
  if (point.result) {
    if (columns_.empty()) {
      const bool varied = std::any_of(vary_.begin(), vary_.end(),
                                      [](const VarySpec& v) { return v.parameter == SweepParameter::reference_o2; });
      columns_ = run_metric_columns(*point.result, varied);
      reference_o2_ = varied ? "reference O2" : emissions::percent_text(point.result->emissions.reference_o2_dry) + " % O2";
    }
    const std::vector<double> values = run_metric_values(*point.result);
    for (std::size_t k = 0; k < values.size() && k < columns_.size(); ++k) {
      if (!is_missing(columns_[k], values[k])) row.metrics[columns_[k].key] = values[k];
    }
  } else {
    ++failed_;
  }
  rows_.push_back(std::move(row));
}

Report SweepHtmlCollector::document(const CaseDefinition& definition, const Provenance& provenance) const {
  Report report;
  report.title = "Sweep: " + definition.title;
  report.subtitle = fmt::format("CO and NO figures are the {} of each point: screening estimates from chemical "
                                "equilibrium, not measurements and not compliance determinations.",
                                kBoundStatement);
  report.summary.emplace_back("Case file", definition.origin);
  for (auto& row : provenance_summary(provenance)) report.summary.push_back(std::move(row));
  for (const VarySpec& v : vary_) report.summary.emplace_back("Varied", v.text);
  report.summary.emplace_back("Points", fmt::format("{} ({} failed)", rows_.size(), failed_));
  const std::string x_label = sweep_parameter_label(vary_.front().parameter);
  const auto plot = [&](const std::string& title, const std::string& y_label, const std::string& key) {
    return ReportPlot{title, x_label, y_label, series_for(key)};
  };
  for (const std::string pollutant : {"CO", "NO", "NOx"}) {
    const bool reported = std::any_of(columns_.begin(), columns_.end(), [&](const MetricColumn& c) {
      return c.key == pollutant + "_estimate_ppmvd_at_ref_o2";
    });
    if (reported) report.plots.push_back(three_figure_plot(pollutant, x_label));
  }
  report.plots.push_back(plot("Firing (flame) temperature", "temperature [K]", "firing_temperature_K"));
  report.plots.push_back(plot("Flue-gas O2", "O2 [% dry]", "flue_o2_dry_percent"));
  report.tables.push_back(points_table());
  if (failed_ > 0) report.flags.push_back(fmt::format("{} points failed; their rows say why.", failed_));
  for (const emissions::Caution c : sweep_cautions(definition, vary_))
    report.cautions.emplace_back(emissions::caution(c).text);
  return report;
}

ReportTable SweepHtmlCollector::points_table() const {
  ReportTable table;
  table.title = "Points";
  table.columns.push_back("point");
  for (const VarySpec& v : vary_) table.columns.push_back(sweep_parameter_label(v.parameter));
  for (const MetricColumn& column : columns_) table.columns.push_back(column.header);
  table.columns.push_back("error");
  for (std::size_t i = 0; i < rows_.size() && i < kSweepHtmlMaxTableRows; ++i) {
    std::vector<std::string> cells{std::to_string(i + 1)};
    for (std::size_t k = 0; k < vary_.size(); ++k) {
      cells.push_back(fmt::format("{:.6g}", sweep_parameter_display(vary_[k].parameter, rows_[i].values[k])));
    }
    for (const MetricColumn& column : columns_) {
      const auto found = rows_[i].metrics.find(column.key);
      cells.push_back(found == rows_[i].metrics.end() ? "-" : fmt::format("{:.5g}", found->second));
    }
    cells.push_back(rows_[i].error);
    table.rows.push_back(std::move(cells));
  }
  if (rows_.size() > kSweepHtmlMaxTableRows) {
    table.notes.push_back(
        fmt::format("First {} of {} points shown; use --format csv for all.", kSweepHtmlMaxTableRows, rows_.size()));
  }
  return table;
}

// Estimate, ceiling and bound of one pollutant at the reference O2 together, on a log axis (they can lie
// orders of magnitude apart); with a second parameter, the lines of its first two values only.
ReportPlot SweepHtmlCollector::three_figure_plot(const std::string& pollutant, const std::string& x_label) const {
  ReportPlot plot{fmt::format("{}: estimate, ceiling and equilibrium bound at {}", pollutant, reference_o2_), x_label,
                  fmt::format("{} [ppmvd @ {}]", pollutant, reference_o2_), {}, true};
  for (const std::string kind : {"estimate", "ceiling", "bound"}) {
    const std::string key = kind == "bound" ? pollutant + "_ppmvd_at_ref_o2" : pollutant + "_" + kind + "_ppmvd_at_ref_o2";
    std::vector<PlotSeries> lines = series_for(key, pollutant + " " + kind);
    if (lines.size() > 2) lines.resize(2);
    for (PlotSeries& s : lines) plot.series.push_back(std::move(s));
  }
  return plot;
}

// One series per combination of the parameters after the first (at most 6 lines a plot), named
// `name` and the values of those parameters; "" names it by the key's pollutant.
std::vector<PlotSeries> SweepHtmlCollector::series_for(const std::string& key, const std::string& name_prefix) const {
  std::map<std::vector<double>, PlotSeries> by_rest;
  for (const Row& row : rows_) {
    const std::vector<double> rest(row.values.begin() + 1, row.values.end());
    auto [it, inserted] = by_rest.try_emplace(rest);
    if (inserted) {
      std::string name = name_prefix.empty() ? key.substr(0, key.find('_')) : name_prefix;
      for (std::size_t k = 1; k < vary_.size(); ++k) {
        name += fmt::format(", {} = {:.4g} {}", sweep_parameter_name(vary_[k].parameter),
                            sweep_parameter_display(vary_[k].parameter, row.values[k]),
                            sweep_parameter_unit(vary_[k].parameter));
      }
      it->second.name = name;
    }
    const auto found = row.metrics.find(key);
    it->second.x.push_back(sweep_parameter_display(vary_.front().parameter, row.values.front()));
    it->second.y.push_back(found == row.metrics.end() ? std::nan("") : found->second);
  }
  std::vector<PlotSeries> series;
  for (auto& [rest, s] : by_rest) {
    if (series.size() == 6) break;
    series.push_back(std::move(s));
  }
  return series;
}

}  // namespace stackbound::render
