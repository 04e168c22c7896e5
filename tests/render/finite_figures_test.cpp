// The last check before output: no NaN or infinity is ever printed, in any format.

#include <gtest/gtest.h>

#include <limits>

#include "stackbound/render/finite_figures.hpp"
#include "stackbound/render/report_renderers.hpp"

namespace stackbound::render {
namespace {

// Wrong if a NaN in a JSON document were printed (the JSON library writes it as null, silently).
TEST(FiniteFigures, JsonNaNIsRefusedWithItsPath) {
  const nlohmann::json document = {{"co", {{"ppmvd", std::numeric_limits<double>::quiet_NaN()}}}};
  try {
    (void)json_text(document);
    FAIL() << "a NaN was written";
  } catch (const NonFiniteFigure& error) {
    EXPECT_STREQ(error.what(), "the figure at JSON path $.co.ppmvd is not finite");
  }
}

// Wrong if an infinity inside an array slipped through, or if finite documents were refused.
TEST(FiniteFigures, JsonInfinityInAnArrayIsRefusedAndFiniteDocumentsPass) {
  const nlohmann::json bad = {{"values", {1.0, std::numeric_limits<double>::infinity()}}};
  EXPECT_THROW((void)json_text(bad), NonFiniteFigure);
  const nlohmann::json good = {{"values", {1.0, 2.5}}, {"name", "nan-free"}};
  EXPECT_EQ(json_text(good), good.dump(2) + "\n");
}

// Wrong if a printed "nan" or "-inf" in a table cell reached a text, CSV or HTML report, or if a word
// that merely contains the letters ("information", "infrared") were taken for one.
TEST(FiniteFigures, ReportCellsWithPrintedNonFiniteNumbersAreRefused) {
  cases::Report report;
  report.title = "t";
  report.summary = {{"note", "see the information below; infrared not used"}};
  report.tables.push_back({"figures", {"CO [ppmvd]"}, {{"12.5"}}, {}});
  EXPECT_NO_THROW(require_finite_figures(report));
  report.tables[0].rows.push_back({"-inf"});
  EXPECT_THROW((void)render_report(report, "text"), NonFiniteFigure);
  report.tables[0].rows.back() = {"nan"};
  EXPECT_THROW((void)render_report(report, "csv"), NonFiniteFigure);
  EXPECT_THROW((void)render_report(report, "html"), NonFiniteFigure);
}

}  // namespace
}  // namespace stackbound::render
