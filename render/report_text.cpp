// Aligned terminal text of a report document.
#include <algorithm>
#include <cctype>

#include <fmt/format.h>

#include "stackbound/render/report_renderers.hpp"

namespace stackbound::render {

namespace {

// Display width of UTF-8 text: count code points, not bytes (degree signs, micro, subscripts).
std::size_t display_width(const std::string& text) {
  return static_cast<std::size_t>(std::count_if(text.begin(), text.end(),
                                                [](char c) { return (static_cast<unsigned char>(c) & 0xC0) != 0x80; }));
}

std::string pad(const std::string& text, std::size_t width, bool right_align) {
  const std::size_t shown = display_width(text);
  const std::string fill(width > shown ? width - shown : 0, ' ');
  return right_align ? fill + text : text + fill;
}

// Numbers right-aligned, words left-aligned.
bool looks_numeric(const std::string& cell) {
  return !cell.empty() && (std::isdigit(static_cast<unsigned char>(cell.front())) != 0 || cell.front() == '-' ||
                           cell.front() == '+' || cell.front() == '.');
}

void append_wrapped(std::string& out, const std::string& prefix, const std::string& text) {
  constexpr std::size_t kWidth = 100;
  std::string line = prefix;
  std::size_t start = 0;
  const std::string indent(display_width(prefix), ' ');
  while (start < text.size()) {
    std::size_t end = text.find(' ', start);
    if (end == std::string::npos) end = text.size();
    const std::string word = text.substr(start, end - start);
    if (display_width(line) + word.size() + 1 > kWidth && display_width(line) > indent.size()) {
      out += line + "\n";
      line = indent;
    }
    if (display_width(line) > indent.size() && line.back() != ' ') line += ' ';
    line += word;
    start = end + 1;
  }
  out += line + "\n";
}

void append_table(std::string& out, const ReportTable& table) {
  out += "\n" + table.title + "\n" + std::string(display_width(table.title), '-') + "\n";
  std::vector<std::size_t> widths(table.columns.size(), 0);
  for (std::size_t c = 0; c < table.columns.size(); ++c) widths[c] = display_width(table.columns[c]);
  for (const auto& row : table.rows) {
    for (std::size_t c = 0; c < row.size() && c < widths.size(); ++c)
      widths[c] = std::max(widths[c], display_width(row[c]));
  }
  std::string header = " ";
  for (std::size_t c = 0; c < table.columns.size(); ++c) header += " " + pad(table.columns[c], widths[c], c > 0);
  out += header + "\n";
  for (const auto& row : table.rows) {
    std::string line = " ";
    for (std::size_t c = 0; c < row.size() && c < widths.size(); ++c) {
      line += " " + pad(row[c], widths[c], c > 0 && looks_numeric(row[c]));
    }
    out += line + "\n";
  }
  for (const std::string& note : table.notes) append_wrapped(out, "  note: ", note);
}

}  // namespace

std::string render_text(const Report& report) {
  std::string out = report.title + "\n" + std::string(display_width(report.title), '=') + "\n";
  if (!report.subtitle.empty()) append_wrapped(out, "", report.subtitle);
  if (!report.headline.rows.empty()) append_table(out, report.headline);
  out += "\n";
  std::size_t label_width = 0;
  for (const auto& [label, value] : report.summary) label_width = std::max(label_width, display_width(label));
  for (const auto& [label, value] : report.summary) out += "  " + pad(label, label_width, false) + " : " + value + "\n";
  for (const ReportTable& table : report.tables) append_table(out, table);
  if (!report.flags.empty()) {
    out += "\nFindings\n--------\n";
    for (const std::string& flag : report.flags) append_wrapped(out, "  ! ", flag);
  }
  if (!report.warnings.empty()) {
    out += "\nWarnings\n--------\n";
    for (const std::string& warning : report.warnings) append_wrapped(out, "  ? ", warning);
  }
  if (!report.assumptions.empty()) {
    out += "\nAssumptions\n-----------\n";
    for (const std::string& assumption : report.assumptions) append_wrapped(out, "  - ", assumption);
  }
  if (!report.cautions.empty()) {
    out += "\nCautions\n--------\n";
    for (const std::string& caution : report.cautions) append_wrapped(out, "  * ", caution);
  }
  return out;
}

}  // namespace stackbound::render
