#pragma once
// An x-y line plot as inline SVG (no scripts, no external resources), with labelled axes and ticks.

#include <string>

#include "stackbound/render/report_renderers.hpp"

namespace stackbound::render {

// Series with no finite points are listed in the legend as "(no data)"; plot.shaded_x ranges are drawn as
// bands behind the series. Returns an <svg> element.
std::string render_svg_plot(const ReportPlot& plot, int width_px = 640, int height_px = 360);

// Escapes &, <, >, " for HTML/SVG text.
std::string escape_html(const std::string& text);

}  // namespace stackbound::render
