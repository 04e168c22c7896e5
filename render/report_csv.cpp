// CSV of a report document: comment lines, then one block per table.
#include <string>
#include <vector>

#include "stackbound/render/csv_cell.hpp"
#include "stackbound/render/report_renderers.hpp"

namespace stackbound::render {

namespace {

std::string csv_line(const std::vector<std::string>& cells) {
  std::string line;
  for (std::size_t i = 0; i < cells.size(); ++i) {
    if (i > 0) line += ',';
    line += csv_cell(cells[i]);
  }
  return line + "\n";
}

}  // namespace

std::string render_csv(const Report& report) {
  std::string out = csv_line({"# " + report.title});
  if (!report.subtitle.empty()) out += csv_line({"# " + report.subtitle});
  for (const auto& [label, value] : report.summary) out += csv_line({"# " + label, value});
  for (const std::string& flag : report.flags) out += csv_line({"# finding: " + flag});
  for (const std::string& warning : report.warnings) out += csv_line({"# warning: " + warning});
  for (const std::string& caution : report.cautions) out += csv_line({"# caution: " + caution});
  for (const ReportTable& table : report.tables) {
    out += "\n" + csv_line({"# " + table.title});
    out += csv_line(table.columns);
    for (const auto& row : table.rows) out += csv_line(row);
  }
  return out;
}

}  // namespace stackbound::render
