#pragma once
// A sweep as one HTML page: keeps the numbers it plots (not the full results) and draws CO, NO,
// firing temperature and flue O2 against the first varied parameter, one line for each combination
// of the others (at most 6 a plot), with a table of the first points.

#include <cstddef>
#include <map>
#include <string>
#include <vector>

#include "stackbound/cases/provenance.hpp"
#include "stackbound/cases/report_document.hpp"
#include "stackbound/cases/run_metrics.hpp"
#include "stackbound/cases/sweep.hpp"

namespace stackbound::render {

// HTML holds every point for its plots; beyond this a CSV is the right output.
inline constexpr std::size_t kSweepHtmlMaxPoints = 100000;
// Points listed in the HTML table.
inline constexpr std::size_t kSweepHtmlMaxTableRows = 400;

class SweepHtmlCollector {
 public:
  // `vary` must outlive the collector.
  explicit SweepHtmlCollector(const std::vector<cases::VarySpec>& vary) : vary_(vary) {}

  void add(const cases::SweepPoint& point);
  cases::Report document(const cases::CaseDefinition& definition, const cases::Provenance& provenance) const;

 private:
  struct Row {
    std::vector<double> values;
    std::map<std::string, double> metrics;
    std::string error;
  };

  std::vector<cases::PlotSeries> series_for(const std::string& key, const std::string& name_prefix = "") const;
  cases::ReportPlot three_figure_plot(const std::string& pollutant, const std::string& x_label) const;
  cases::ReportTable points_table() const;

  const std::vector<cases::VarySpec>& vary_;
  std::vector<Row> rows_;
  std::vector<cases::MetricColumn> columns_;
  std::string reference_o2_ = "reference O2";
  std::size_t failed_ = 0;
};

}  // namespace stackbound::render
