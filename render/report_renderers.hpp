#pragma once
// Renderers of the report document (cases/report_document.hpp): terminal text, CSV and HTML.

#include <string>

#include "stackbound/cases/report_document.hpp"

namespace stackbound::render {

using cases::PlotSeries;
using cases::Report;
using cases::ReportBarChart;
using cases::ReportPlot;
using cases::ReportTable;

// Aligned terminal text: summary as "label: value", tables with aligned columns.
std::string render_text(const Report& report);

// CSV (RFC 4180 quoting): one block per table, a title line, a header line, the rows; summary,
// flags and cautions as "#"-prefixed comment lines at the top.
std::string render_csv(const Report& report);

// One self-contained, print-friendly HTML page (inline CSS, inline SVG plots, no scripts, no
// external resources).
std::string render_html(const Report& report);

// Renders in one of "text", "csv", "html".
std::string render_report(const Report& report, const std::string& format);

}  // namespace stackbound::render
