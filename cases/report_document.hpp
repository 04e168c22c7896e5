#pragma once
// The report document: the last stage of a run (and of a comparison) fills it in; the renderers in
// render/ print it as aligned text, CSV or one self-contained HTML file. JSON is built from the
// structured results instead, with its own stable keys (render/run_json.hpp).

#include <optional>
#include <string>
#include <utility>
#include <vector>

namespace stackbound::cases {

// A table whose column titles carry their units, e.g. "CO bound [ppmvd @ 3 % O2]".
struct ReportTable {
  std::string title;
  std::vector<std::string> columns;
  std::vector<std::vector<std::string>> rows;  // each row has columns.size() cells
  std::vector<std::string> notes;              // printed under the table
};

// One line series of an x-y plot; x and y have equal lengths.
struct PlotSeries {
  std::string name;
  std::vector<double> x;
  std::vector<double> y;
};

struct ReportPlot {
  std::string title;
  std::string x_label;  // with unit, e.g. "excess air [%]"
  std::string y_label;
  std::vector<PlotSeries> series;
  // Logarithmic y axis (decades): for figures spanning orders of magnitude, such as an estimate
  // beside its bound. Values <= 0 are then not drawn.
  bool log_y = false;
  // Ranges of x drawn as shaded bands behind the series (e.g. invalid averaging periods).
  std::vector<std::pair<double, double>> shaded_x{};
};

// A bar chart of one pollutant's headline figures (drawn in HTML only): one bar per figure on a
// logarithmic axis, the stated limit as a line across them.
struct ReportBarChart {
  std::string title;                                 // with the unit and basis of the bars
  std::vector<std::pair<std::string, double>> bars;  // label -> value; values <= 0 are not drawn
  std::optional<double> limit;
};

struct Report {
  std::string title;
  std::string subtitle;                                     // e.g. what kind of result this is
  ReportTable headline;                                     // printed first, when it has rows
  std::vector<ReportBarChart> headline_charts;              // drawn beside the headline in HTML
  std::vector<std::pair<std::string, std::string>> summary;  // label -> value with unit
  std::vector<ReportTable> tables;
  std::vector<ReportPlot> plots;                            // drawn in HTML only
  std::vector<std::string> flags;                           // findings that need the reader's attention
  std::vector<std::string> warnings;                        // legal but implausible input: field = "value": why
  std::vector<std::string> assumptions;
  std::vector<std::string> cautions;
};

}  // namespace stackbound::cases
