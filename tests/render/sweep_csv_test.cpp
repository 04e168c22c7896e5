// The sweep CSV writer: rows are written as points arrive, failed points keep their place, and the
// header takes its result columns from the first point that ran (naming no single reference O2 when
// the sweep varies it).

#include <gtest/gtest.h>

#include <string>
#include <string_view>
#include <vector>

#include "stackbound/cases/case_file.hpp"
#include "stackbound/cases/species_file.hpp"
#include "stackbound/render/sweep_csv.hpp"

namespace stackbound::render {
namespace {

using namespace stackbound::cases;

std::vector<std::string> lines_of(const std::string& text) {
  std::vector<std::string> lines;
  std::size_t start = 0;
  while (start < text.size()) {
    const std::size_t end = text.find('\n', start);
    lines.push_back(text.substr(start, end - start));
    start = end + 1;
  }
  return lines;
}

// Fields of one CSV line, commas inside quotes not counted.
std::size_t field_count(const std::string& line) {
  std::size_t fields = 1;
  bool quoted = false;
  for (const char c : line) {
    if (c == '"') quoted = !quoted;
    if (c == ',' && !quoted) ++fields;
  }
  return fields;
}

// A failed first point must not lose the result columns nor shift the later rows.
TEST(SweepCsv, FailedFirstPointWaitsForTheHeaderOfTheFirstPointThatRan) {
  const CaseDefinition definition = load_case(std::string(STACKBOUND_SOURCE_DIR) + "/cases/examples/gas_boiler.yaml");
  const std::vector<VarySpec> vary{parse_vary("excess_air=10%:20%:2")};
  std::string out;
  SweepCsvWriter writer([&out](std::string_view text) { out += text; }, vary);
  SweepPoint failed{0, {0.10}, std::nullopt, "invented failure, with a comma"};
  writer.add(failed);
  EXPECT_EQ(out.find("point,"), std::string::npos) << "header written before any point ran";
  CaseDefinition second = definition;
  apply_parameter(second, vary[0].parameter, 0.20);
  writer.add(SweepPoint{1, {0.20}, run_case(second, builtin_species()), ""});
  writer.finish();

  std::vector<std::string> rows;
  for (const std::string& line : lines_of(out)) {
    if (!line.starts_with("#")) rows.push_back(line);
  }
  ASSERT_EQ(rows.size(), 3U);
  EXPECT_TRUE(rows[0].starts_with("point,excess_air [%],status,")) << rows[0];
  EXPECT_TRUE(rows[0].ends_with(",error")) << rows[0];
  EXPECT_TRUE(rows[1].starts_with("1,10,failed,")) << rows[1];
  EXPECT_TRUE(rows[1].ends_with(",\"invented failure, with a comma\"")) << rows[1];
  EXPECT_TRUE(rows[2].starts_with("2,20,ok,")) << rows[2];
  EXPECT_EQ(field_count(rows[2]), field_count(rows[0])) << "a row has a different number of columns from the header";
  EXPECT_EQ(field_count(rows[1]), field_count(rows[0])) << "the failed row's error is not in the error column";
}

// Wrong if a sweep of the reference O2 labelled its columns with the first point's O2, which the
// later rows are not at.
TEST(SweepCsv, AReferenceO2SweepNamesNoSingleO2InItsHeader) {
  CaseDefinition definition = load_case(std::string(STACKBOUND_SOURCE_DIR) + "/cases/examples/gas_boiler.yaml");
  const std::vector<VarySpec> vary{parse_vary("reference_o2=3%:15%:2")};
  std::string out;
  SweepCsvWriter writer([&out](std::string_view text) { out += text; }, vary);
  apply_parameter(definition, vary[0].parameter, 0.03);
  writer.add(SweepPoint{0, {0.03}, run_case(definition, builtin_species()), ""});
  writer.finish();
  EXPECT_NE(out.find("CO bound [ppmvd @ reference O2]"), std::string::npos) << out;
  EXPECT_EQ(out.find("@ 3 % O2"), std::string::npos) << out;
}

}  // namespace
}  // namespace stackbound::render
