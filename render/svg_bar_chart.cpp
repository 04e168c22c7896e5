#include "stackbound/render/svg_bar_chart.hpp"

#include <fmt/format.h>

#include <algorithm>
#include <cmath>

#include "stackbound/render/svg_plot.hpp"

namespace stackbound::render {

namespace {

constexpr int kLabelWidth = 90;  // bar labels, left of the axis
constexpr int kRowHeight = 22;
constexpr int kTop = 26;     // the title
constexpr int kBottom = 40;  // the tick labels and the limit's label
constexpr int kRight = 70;   // the value printed after the longest bar

bool drawable(double value) { return std::isfinite(value) && value > 0.0; }

}  // namespace

std::string render_svg_bar_chart(const cases::ReportBarChart& chart, int width_px) {
  double low = chart.limit && drawable(*chart.limit) ? *chart.limit : HUGE_VAL;
  double high = chart.limit && drawable(*chart.limit) ? *chart.limit : -HUGE_VAL;
  for (const auto& [label, value] : chart.bars) {
    if (!drawable(value)) continue;
    low = std::min(low, value);
    high = std::max(high, value);
  }
  if (!(low <= high)) low = high = 1.0;
  // Whole decades, at least one, with the smallest value a decade above the axis' start so it shows.
  const int first_decade = static_cast<int>(std::floor(std::log10(low))) - 1;
  const int last_decade = std::max(static_cast<int>(std::ceil(std::log10(high))), first_decade + 1);
  const int plot_width = width_px - kLabelWidth - kRight;
  const auto x_of = [&](double value) {
    const double t = (std::log10(value) - first_decade) / (last_decade - first_decade);
    return kLabelWidth + std::clamp(t, 0.0, 1.0) * plot_width;
  };
  const int rows = static_cast<int>(chart.bars.size());
  const int height = kTop + rows * kRowHeight + kBottom;
  std::string svg = fmt::format(
      "<svg xmlns=\"http://www.w3.org/2000/svg\" width=\"{}\" height=\"{}\" viewBox=\"0 0 {} {}\" role=\"img\" "
      "font-family=\"sans-serif\" font-size=\"11\">\n<title>{}</title>\n<text x=\"4\" y=\"15\" "
      "font-weight=\"600\">{}</text>\n",
      width_px, height, width_px, height, escape_html(chart.title), escape_html(chart.title));
  const int axis_y = kTop + rows * kRowHeight;
  for (int d = first_decade; d <= last_decade; ++d) {
    const double x = x_of(std::pow(10.0, d));
    svg += fmt::format("<line x1=\"{:.1f}\" y1=\"{}\" x2=\"{:.1f}\" y2=\"{}\" stroke=\"#ddd\"/>\n", x, kTop, x, axis_y);
    svg += fmt::format("<text x=\"{:.1f}\" y=\"{}\" text-anchor=\"middle\">1e{}</text>\n", x, axis_y + 14, d);
  }
  for (int i = 0; i < rows; ++i) {
    const auto& [label, value] = chart.bars[static_cast<std::size_t>(i)];
    const int y = kTop + i * kRowHeight;
    svg += fmt::format("<text x=\"4\" y=\"{}\">{}</text>\n", y + 15, escape_html(label));
    if (!drawable(value)) {
      svg += fmt::format("<text x=\"{}\" y=\"{}\">(not drawn)</text>\n", kLabelWidth + 4, y + 15);
      continue;
    }
    const double x = x_of(value);
    const char* colour = label == "measured" ? "#b03a2e" : "#1f4e79";
    svg += fmt::format("<rect x=\"{}\" y=\"{}\" width=\"{:.1f}\" height=\"{}\" fill=\"{}\"/>\n", kLabelWidth, y + 4,
                       x - kLabelWidth, kRowHeight - 8, colour);
    svg += fmt::format("<text x=\"{:.1f}\" y=\"{}\">{:.4g}</text>\n", x + 4, y + 15, value);
  }
  if (chart.limit && drawable(*chart.limit)) {
    const double x = x_of(*chart.limit);
    svg += fmt::format(
        "<line x1=\"{:.1f}\" y1=\"{}\" x2=\"{:.1f}\" y2=\"{}\" stroke=\"#7b241c\" stroke-width=\"2\" "
        "stroke-dasharray=\"5,3\"/>\n<text x=\"{:.1f}\" y=\"{}\" fill=\"#7b241c\" text-anchor=\"middle\">stated limit "
        "{:.4g}</text>\n",
        x, kTop, x, axis_y + 18, x, axis_y + 30, *chart.limit);
  }
  svg += "<line x1=\"" + std::to_string(kLabelWidth) + "\" y1=\"" + std::to_string(axis_y) + "\" x2=\"" +
         std::to_string(kLabelWidth + plot_width) + "\" y2=\"" + std::to_string(axis_y) + "\" stroke=\"#333\"/>\n";
  svg += "</svg>";
  return svg;
}

}  // namespace stackbound::render
