#pragma once
// A horizontal bar chart as inline SVG (no scripts, no external resources): one bar per figure on a
// logarithmic axis (the figures of one pollutant span orders of magnitude), whole decades as ticks,
// the stated limit as a dashed line. Bars of values <= 0 or not finite are listed as "(not drawn)".

#include <string>

#include "stackbound/render/report_renderers.hpp"

namespace stackbound::render {

// Returns an <svg> element.
std::string render_svg_bar_chart(const cases::ReportBarChart& chart, int width_px = 560);

}  // namespace stackbound::render
