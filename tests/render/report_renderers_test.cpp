// The renderers of the report document: CSV quoting, the text layout of findings and cautions, and the
// HTML page being self-contained. These are what every run, comparison and sweep output goes through.

#include <gtest/gtest.h>

#include "stackbound/render/svg_plot.hpp"

#include <string>

#include "stackbound/render/csv_cell.hpp"
#include "stackbound/render/report_renderers.hpp"

namespace stackbound::render {
namespace {

Report invented_report() {
  Report report;
  report.title = "Invented report";
  report.summary.emplace_back("Flue O2", "3.0 % dry");
  report.tables.push_back(ReportTable{"Figures", {"quantity", "value [ppmvd]"}, {{"CO, \"bound\"", "12.5"}}, {}});
  report.flags.push_back("Measured CO above the bound");
  report.cautions.push_back("Permits govern.");
  return report;
}

// A cell with a comma or quote that is not quoted would shift every later column of a spreadsheet.
TEST(Csv, CellsWithCommasQuotesOrLineBreaksAreQuotedAndQuotesDoubled) {
  EXPECT_EQ(csv_cell("12.5"), "12.5");
  EXPECT_EQ(csv_cell("a,b"), "\"a,b\"");
  EXPECT_EQ(csv_cell("say \"hi\""), "\"say \"\"hi\"\"\"");
  EXPECT_EQ(csv_cell("two\nlines"), "\"two\nlines\"");
}

// The CSV must carry findings and cautions as comments above the table, and the table whole.
TEST(Csv, ReportHasCommentLinesThenTitleHeaderAndRows) {
  const std::string csv = render_csv(invented_report());
  EXPECT_EQ(csv.rfind("# Invented report\n", 0), 0U);
  EXPECT_NE(csv.find("# finding: Measured CO above the bound\n"), std::string::npos);
  EXPECT_NE(csv.find("# caution: Permits govern.\n"), std::string::npos);
  EXPECT_NE(csv.find("\n# Figures\nquantity,value [ppmvd]\n\"CO, \"\"bound\"\"\",12.5\n"), std::string::npos);
}

// The terminal text must show the summary, the findings and the cautions under their headings.
TEST(Text, ShowsSummaryFindingsAndCautions) {
  const std::string text = render_text(invented_report());
  EXPECT_NE(text.find("Flue O2"), std::string::npos);
  EXPECT_NE(text.find("3.0 % dry"), std::string::npos);
  EXPECT_NE(text.find("! Measured CO above the bound"), std::string::npos);
  EXPECT_NE(text.find("Cautions\n--------\n  * Permits govern."), std::string::npos);
}

// An HTML report must open offline: no scripts and no external resources; text must be escaped.
TEST(Html, PageIsSelfContainedAndEscapesText) {
  const std::string html = render_html(invented_report());
  EXPECT_EQ(html.find("<script"), std::string::npos);
  EXPECT_EQ(html.find("http://"), std::string::npos);
  EXPECT_EQ(html.find("https://"), std::string::npos);
  EXPECT_NE(html.find("CO, &quot;bound&quot;"), std::string::npos);
}

// render_report dispatches on the format name; a wrong mapping would print the wrong format.
TEST(Formats, RenderReportPicksTheNamedFormat) {
  const Report report = invented_report();
  EXPECT_EQ(render_report(report, "csv"), render_csv(report));
  EXPECT_EQ(render_report(report, "html"), render_html(report));
  EXPECT_EQ(render_report(report, "text"), render_text(report));
}

// Wrong if a log axis did not label decades, drew a value <= 0 (it has no logarithm), or placed a
// decade above the next: an estimate 1000 times below its bound would then vanish into the axis.
TEST(SvgPlot, LogAxisLabelsDecadesAndSkipsValuesThatAreNotPositive) {
  cases::ReportPlot plot{"t", "x [%]", "NO [ppmvd]", {{"NO estimate", {1, 2, 3, 4}, {0.2, 3.0, 0.0, 800.0}}}, true};
  const std::string svg = render_svg_plot(plot);
  for (const char* label : {">0.1<", ">1<", ">10<", ">100<", ">1000<", "(log scale)"}) {
    EXPECT_NE(svg.find(label), std::string::npos) << label;
  }
  std::size_t circles = 0;
  for (std::size_t at = svg.find("<circle"); at != std::string::npos; at = svg.find("<circle", at + 1)) ++circles;
  EXPECT_EQ(circles, 3U);
  const auto y_of = [&](const char* label) {
    const std::size_t at = svg.rfind(" y=\"", svg.find(label));
    return std::stod(svg.substr(at + 4));
  };
  EXPECT_GT(y_of(">1<"), y_of(">10<"));  // SVG y grows downwards
  EXPECT_NEAR(y_of(">1<") - y_of(">10<"), y_of(">10<") - y_of(">100<"), 0.2);
}

}  // namespace
}  // namespace stackbound::render
