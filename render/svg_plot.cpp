#include "stackbound/render/svg_plot.hpp"

#include <algorithm>
#include <array>
#include <cmath>
#include <limits>

#include <fmt/format.h>

namespace stackbound::render {

namespace {

struct Range {
  double low = std::numeric_limits<double>::infinity();
  double high = -std::numeric_limits<double>::infinity();
  void include(double v) {
    if (!std::isfinite(v)) return;
    low = std::min(low, v);
    high = std::max(high, v);
  }
  [[nodiscard]] bool empty() const { return !(low <= high); }
};

// "Nice" tick step (1, 2 or 5 x 10^n) giving about `count` ticks; common practice in plotting.
double tick_step(double span, int count) {
  const double raw = span / count;
  const double magnitude = std::pow(10.0, std::floor(std::log10(raw)));
  const double normalized = raw / magnitude;
  const double nice = normalized < 1.5 ? 1.0 : normalized < 3.5 ? 2.0 : normalized < 7.5 ? 5.0 : 10.0;
  return nice * magnitude;
}

Range padded(Range r) {
  if (r.empty()) return {0.0, 1.0};
  if (r.high - r.low < 1e-12 * std::max(1.0, std::abs(r.high))) {
    const double half = std::max(std::abs(r.high) * 0.05, 1e-12);
    return {r.low - half, r.high + half};
  }
  return r;
}

std::string tick_label(double v, double step) {
  if (std::abs(v) < step * 1e-9) v = 0.0;
  const int decimals = std::max(0, -static_cast<int>(std::floor(std::log10(step))));
  if (std::abs(v) >= 1e6 || (std::abs(v) > 0 && std::abs(v) < 1e-4)) return fmt::format("{:.3g}", v);
  return fmt::format("{:.{}f}", v, decimals);
}

constexpr std::array<const char*, 6> kColours{"#1f4e79", "#b03a2e", "#1e8449", "#7d3c98", "#b9770e", "#2e4053"};

}  // namespace

std::string escape_html(const std::string& text) {
  std::string out;
  out.reserve(text.size());
  for (const char c : text) {
    switch (c) {
      case '&': out += "&amp;"; break;
      case '<': out += "&lt;"; break;
      case '>': out += "&gt;"; break;
      case '"': out += "&quot;"; break;
      default: out += c;
    }
  }
  return out;
}

namespace {

// The y value as plotted: its decimal logarithm on a log axis (NaN where not positive).
double plotted_y(const ReportPlot& plot, double y) {
  if (!plot.log_y) return y;
  return y > 0.0 ? std::log10(y) : std::numeric_limits<double>::quiet_NaN();
}

struct Frame {
  double left = 78, right = 16, top = 34, bottom = 52;
  double width = 0, height = 0;  // of the plotting area
  Range x, y;                    // y as plotted
  [[nodiscard]] double px(double v) const { return left + (v - x.low) / (x.high - x.low) * width; }
  [[nodiscard]] double py(double v) const { return top + height - (v - y.low) / (y.high - y.low) * height; }
};

std::string y_ticks(const ReportPlot& plot, const Frame& f) {
  std::string svg;
  const double step = plot.log_y ? std::max(1.0, std::ceil((f.y.high - f.y.low) / 6.0)) : tick_step(f.y.high - f.y.low, 5);
  for (double t = std::ceil(f.y.low / step) * step; t <= f.y.high + step * 1e-9; t += step) {
    const std::string label = plot.log_y ? fmt::format("{:g}", std::pow(10.0, t)) : tick_label(t, step);
    svg += fmt::format(R"(<line x1="{1}" y1="{0:.1f}" x2="{2}" y2="{0:.1f}" stroke="#ddd"/>)"
                       R"(<text x="{3}" y="{4:.1f}" font-size="11" text-anchor="end">{5}</text>)" "\n",
                       f.py(t), f.left, f.left + f.width, f.left - 6, f.py(t) + 4, label);
  }
  return svg;
}

std::string axes(const ReportPlot& plot, const Frame& f) {
  std::string svg = fmt::format(R"(<text x="{}" y="18" font-size="14" font-weight="bold" text-anchor="middle">{}</text>)" "\n",
                                f.left + f.width / 2, escape_html(plot.title));
  svg += fmt::format(R"(<rect x="{}" y="{}" width="{}" height="{}" fill="none" stroke="#444"/>)" "\n", f.left, f.top, f.width,
                     f.height);
  const double xstep = tick_step(f.x.high - f.x.low, 6);
  for (double t = std::ceil(f.x.low / xstep) * xstep; t <= f.x.high + xstep * 1e-9; t += xstep) {
    svg += fmt::format(R"(<line x1="{0:.1f}" y1="{1}" x2="{0:.1f}" y2="{2}" stroke="#ddd"/>)"
                       R"(<text x="{0:.1f}" y="{3}" font-size="11" text-anchor="middle">{4}</text>)" "\n",
                       f.px(t), f.top, f.top + f.height, f.top + f.height + 15, tick_label(t, xstep));
  }
  svg += y_ticks(plot, f);
  svg += fmt::format(R"(<text x="{}" y="{}" font-size="12" text-anchor="middle">{}</text>)" "\n", f.left + f.width / 2,
                     f.top + f.height + 34, escape_html(plot.x_label));
  svg += fmt::format(R"svg(<text x="16" y="{0}" font-size="12" text-anchor="middle" transform="rotate(-90 16 {0})">{1}</text>)svg"
                     "\n",
                     f.top + f.height / 2, escape_html(plot.y_label + (plot.log_y ? " (log scale)" : "")));
  return svg;
}

std::string series_lines(const ReportPlot& plot, const Frame& f) {
  std::string svg;
  for (std::size_t k = 0; k < plot.series.size(); ++k) {
    const PlotSeries& s = plot.series[k];
    const char* colour = kColours[k % kColours.size()];
    std::string points;
    std::size_t shown = 0;
    for (std::size_t i = 0; i < std::min(s.x.size(), s.y.size()); ++i) {
      const double y = plotted_y(plot, s.y[i]);
      if (!std::isfinite(s.x[i]) || !std::isfinite(y)) continue;
      points += fmt::format("{:.1f},{:.1f} ", f.px(s.x[i]), f.py(y));
      svg += fmt::format(R"(<circle cx="{:.1f}" cy="{:.1f}" r="2.5" fill="{}"/>)", f.px(s.x[i]), f.py(y), colour);
      ++shown;
    }
    if (shown > 1) svg += fmt::format(R"(<polyline fill="none" stroke="{}" stroke-width="2" points="{}"/>)", colour, points);
    svg += "\n";
    if (plot.series.size() > 1) {
      const double ly = f.top + f.height + 50 + 18.0 * static_cast<double>(k);
      svg += fmt::format(R"(<line x1="{0}" y1="{1}" x2="{2}" y2="{1}" stroke="{3}" stroke-width="2"/>)"
                         R"(<text x="{4}" y="{5}" font-size="11">{6}</text>)" "\n",
                         f.left, ly, f.left + 24, colour, f.left + 30, ly + 4,
                         escape_html(shown == 0 ? s.name + " (no data)" : s.name));
    } else if (shown == 0) {
      svg += fmt::format(R"(<text x="{}" y="{}" font-size="12" text-anchor="middle">(no data)</text>)" "\n",
                         f.left + f.width / 2, f.top + f.height / 2);
    }
  }
  return svg;
}

// The shaded x ranges, clipped to the frame, behind the series.
std::string shaded_bands(const ReportPlot& plot, const Frame& f) {
  std::string svg;
  for (const auto& [from, to] : plot.shaded_x) {
    const double low = std::max(from, f.x.low), high = std::min(to, f.x.high);
    if (!(high > low)) continue;
    svg += fmt::format(R"(<rect x="{:.1f}" y="{}" width="{:.1f}" height="{}" fill="#e8b4b4" fill-opacity="0.45"/>)" "\n",
                       f.px(low), f.top, f.px(high) - f.px(low), f.height);
  }
  if (!svg.empty()) {
    svg += fmt::format(R"(<text x="{}" y="{}" font-size="11" text-anchor="end">shaded: invalid periods</text>)" "\n",
                       f.left + f.width - 4, f.top + 12);
  }
  return svg;
}

}  // namespace

std::string render_svg_plot(const ReportPlot& plot, int width_px, int height_px) {
  Frame f;
  for (const PlotSeries& s : plot.series) {
    for (std::size_t i = 0; i < std::min(s.x.size(), s.y.size()); ++i) {
      const double y = plotted_y(plot, s.y[i]);
      if (std::isfinite(s.x[i]) && std::isfinite(y)) {
        f.x.include(s.x[i]);
        f.y.include(y);
      }
    }
  }
  f.x = padded(f.x);
  f.y = padded(f.y);
  if (plot.log_y) f.y = {std::floor(f.y.low), std::max(std::ceil(f.y.high), std::floor(f.y.low) + 1.0)};
  f.bottom += 18.0 * static_cast<double>(plot.series.size() > 1 ? plot.series.size() : 0);
  f.width = width_px - f.left - f.right;
  f.height = height_px - f.top - f.bottom;
  std::string svg = fmt::format(
      R"(<svg xmlns="http://www.w3.org/2000/svg" width="{0}" height="{1}" viewBox="0 0 {0} {1}" role="img" aria-label="{2}">)"
      "\n",
      width_px, height_px, escape_html(plot.title));
  svg += axes(plot, f);
  svg += shaded_bands(plot, f);
  svg += series_lines(plot, f);
  svg += "</svg>\n";
  return svg;
}

}  // namespace stackbound::render
