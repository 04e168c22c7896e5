// The headline's bar chart: one bar per drawable figure on a log axis, the limit as a line, and no
// output that breaks the page for values that cannot be drawn.

#include "stackbound/render/svg_bar_chart.hpp"

#include <gtest/gtest.h>

#include <cmath>
#include <limits>
#include <string>

namespace stackbound::render {
namespace {

std::size_t count_of(const std::string& text, const std::string& what) {
  std::size_t count = 0;
  for (std::size_t at = text.find(what); at != std::string::npos; at = text.find(what, at + 1)) ++count;
  return count;
}

// Wrong if a figure lost its bar, the limit its line, or the axis did not span the figures' decades.
TEST(SvgBarChart, OneBarPerFigureAndTheLimitAsALine) {
  const ReportBarChart chart{
      "NOx [mg/Nm3, dry, O2=3%]", {{"estimate", 0.8}, {"ceiling", 2774.0}, {"measured", 127.0}}, 100.0};
  const std::string svg = render_svg_bar_chart(chart);
  EXPECT_EQ(svg.rfind("<svg", 0), 0U);
  EXPECT_EQ(svg.substr(svg.size() - 6), "</svg>");
  EXPECT_EQ(count_of(svg, "<rect"), 3U);
  EXPECT_NE(svg.find("stated limit 100</text>"), std::string::npos);
  EXPECT_NE(svg.find(">1e-2</text>"), std::string::npos);  // a decade below the smallest figure
  EXPECT_NE(svg.find(">1e4</text>"), std::string::npos);   // the decade above the largest
  EXPECT_NE(svg.find("stroke-dasharray"), std::string::npos);
}

// Wrong if a zero, negative, NaN or infinite figure drew a bar (log of it) or put nan/inf into the SVG.
TEST(SvgBarChart, FiguresThatCannotBeDrawnAreNamedNotDrawn) {
  const ReportBarChart chart{"CO [mg/Nm3]",
                             {{"estimate", 0.0},
                              {"ceiling", -1.0},
                              {"bound", std::numeric_limits<double>::quiet_NaN()},
                              {"measured", std::numeric_limits<double>::infinity()}},
                             std::nullopt};
  const std::string svg = render_svg_bar_chart(chart);
  EXPECT_EQ(count_of(svg, "<rect"), 0U);
  EXPECT_EQ(count_of(svg, "(not drawn)"), 4U);
  EXPECT_EQ(svg.find("nan"), std::string::npos);
  EXPECT_EQ(svg.find("inf"), std::string::npos);
}

// Wrong if a title with markup characters were written into the SVG unescaped.
TEST(SvgBarChart, TitleIsEscaped) {
  const std::string svg = render_svg_bar_chart({"<NOx> & co", {{"bound", 1.0}}, std::nullopt});
  EXPECT_NE(svg.find("&lt;NOx&gt; &amp; co"), std::string::npos);
  EXPECT_EQ(svg.find("<NOx>"), std::string::npos);
}

}  // namespace
}  // namespace stackbound::render
