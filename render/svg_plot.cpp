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

std::string render_svg_plot(const ReportPlot& plot, int width_px, int height_px) {
  Range xr;
  Range yr;
  for (const PlotSeries& s : plot.series) {
    for (std::size_t i = 0; i < std::min(s.x.size(), s.y.size()); ++i) {
      if (std::isfinite(s.x[i]) && std::isfinite(s.y[i])) {
        xr.include(s.x[i]);
        yr.include(s.y[i]);
      }
    }
  }
  xr = padded(xr);
  yr = padded(yr);
  const double left = 78;
  const double right = 16;
  const double top = 34;
  const double bottom = 52 + 18.0 * static_cast<double>(plot.series.size() > 1 ? plot.series.size() : 0);
  const double plot_w = width_px - left - right;
  const double plot_h = height_px - top - bottom;
  const auto px = [&](double x) { return left + (x - xr.low) / (xr.high - xr.low) * plot_w; };
  const auto py = [&](double y) { return top + plot_h - (y - yr.low) / (yr.high - yr.low) * plot_h; };

  std::string svg = fmt::format(
      R"(<svg xmlns="http://www.w3.org/2000/svg" width="{0}" height="{1}" viewBox="0 0 {0} {1}" role="img" aria-label="{2}">)"
      "\n",
      width_px, height_px, escape_html(plot.title));
  svg += fmt::format(R"(<text x="{}" y="18" font-size="14" font-weight="bold" text-anchor="middle">{}</text>)" "\n",
                     left + plot_w / 2, escape_html(plot.title));
  svg += fmt::format(R"(<rect x="{}" y="{}" width="{}" height="{}" fill="none" stroke="#444"/>)" "\n", left, top, plot_w,
                     plot_h);
  const double xstep = tick_step(xr.high - xr.low, 6);
  for (double t = std::ceil(xr.low / xstep) * xstep; t <= xr.high + xstep * 1e-9; t += xstep) {
    svg += fmt::format(R"(<line x1="{0:.1f}" y1="{1}" x2="{0:.1f}" y2="{2}" stroke="#ddd"/>)"
                       R"(<text x="{0:.1f}" y="{3}" font-size="11" text-anchor="middle">{4}</text>)" "\n",
                       px(t), top, top + plot_h, top + plot_h + 15, tick_label(t, xstep));
  }
  const double ystep = tick_step(yr.high - yr.low, 5);
  for (double t = std::ceil(yr.low / ystep) * ystep; t <= yr.high + ystep * 1e-9; t += ystep) {
    svg += fmt::format(R"(<line x1="{1}" y1="{0:.1f}" x2="{2}" y2="{0:.1f}" stroke="#ddd"/>)"
                       R"(<text x="{3}" y="{4:.1f}" font-size="11" text-anchor="end">{5}</text>)" "\n",
                       py(t), left, left + plot_w, left - 6, py(t) + 4, tick_label(t, ystep));
  }
  svg += fmt::format(R"(<text x="{}" y="{}" font-size="12" text-anchor="middle">{}</text>)" "\n", left + plot_w / 2,
                     top + plot_h + 34, escape_html(plot.x_label));
  svg += fmt::format(R"svg(<text x="16" y="{0}" font-size="12" text-anchor="middle" transform="rotate(-90 16 {0})">{1}</text>)svg"
                     "\n",
                     top + plot_h / 2, escape_html(plot.y_label));
  for (std::size_t k = 0; k < plot.series.size(); ++k) {
    const PlotSeries& s = plot.series[k];
    const char* colour = kColours[k % kColours.size()];
    std::string points;
    std::size_t shown = 0;
    for (std::size_t i = 0; i < std::min(s.x.size(), s.y.size()); ++i) {
      if (!std::isfinite(s.x[i]) || !std::isfinite(s.y[i])) continue;
      points += fmt::format("{:.1f},{:.1f} ", px(s.x[i]), py(s.y[i]));
      svg += fmt::format(R"(<circle cx="{:.1f}" cy="{:.1f}" r="2.5" fill="{}"/>)", px(s.x[i]), py(s.y[i]), colour);
      ++shown;
    }
    if (shown > 1) svg += fmt::format(R"(<polyline fill="none" stroke="{}" stroke-width="2" points="{}"/>)", colour, points);
    svg += "\n";
    if (plot.series.size() > 1) {
      const double ly = top + plot_h + 50 + 18.0 * static_cast<double>(k);
      svg += fmt::format(R"(<line x1="{0}" y1="{1}" x2="{2}" y2="{1}" stroke="{3}" stroke-width="2"/>)"
                         R"(<text x="{4}" y="{5}" font-size="11">{6}</text>)" "\n",
                         left, ly, left + 24, colour, left + 30, ly + 4,
                         escape_html(shown == 0 ? s.name + " (no data)" : s.name));
    } else if (shown == 0) {
      svg += fmt::format(R"(<text x="{}" y="{}" font-size="12" text-anchor="middle">(no data)</text>)" "\n",
                         left + plot_w / 2, top + plot_h / 2);
    }
  }
  svg += "</svg>\n";
  return svg;
}

}  // namespace stackbound::render
