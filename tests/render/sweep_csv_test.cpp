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

#include <fmt/format.h>

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
  SweepCsvWriter writer([&out](std::string_view text) { out += text; }, vary, sweep_cautions(definition, vary),
                        make_provenance(definition, {}));
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
  SweepCsvWriter writer([&out](std::string_view text) { out += text; }, vary, sweep_cautions(definition, vary),
                        make_provenance(definition, {}));
  apply_parameter(definition, vary[0].parameter, 0.03);
  writer.add(SweepPoint{0, {0.03}, run_case(definition, builtin_species()), ""});
  writer.finish();
  EXPECT_NE(out.find("CO bound [ppmvd @ reference O2]"), std::string::npos) << out;
  EXPECT_EQ(out.find("@ 3 % O2"), std::string::npos) << out;
}

// Splits a CSV line into its cells (quoted cells unquoted; the rows tested here double no quotes).
std::vector<std::string> cells_of(const std::string& line) {
  std::vector<std::string> cells(1);
  bool quoted = false;
  for (const char c : line) {
    if (c == '"') {
      quoted = !quoted;
    } else if (c == ',' && !quoted) {
      cells.emplace_back();
    } else {
      cells.back() += c;
    }
  }
  return cells;
}

std::vector<std::string> data_rows(const std::string& text) {
  std::vector<std::string> rows;
  for (const std::string& line : lines_of(text)) {
    if (!line.starts_with("#")) rows.push_back(line);
  }
  return rows;
}

// Wrong if a sweep row's estimate and ceiling columns were missing or held other numbers than the
// run of the same point (the sweep would then not show what the report shows).
TEST(SweepCsv, EstimateAndCeilingColumnsCarryTheRunsFigures) {
  CaseDefinition definition = load_case(std::string(STACKBOUND_SOURCE_DIR) + "/cases/examples/gas_boiler.yaml");
  const std::vector<VarySpec> vary{parse_vary("excess_air=10%:20%:2")};
  apply_parameter(definition, vary[0].parameter, 0.10);
  const RunResult run = run_case(definition, builtin_species());
  std::string out;
  SweepCsvWriter writer([&out](std::string_view text) { out += text; }, vary, sweep_cautions(definition, vary),
                        make_provenance(definition, {}));
  writer.add(SweepPoint{0, {0.10}, run, ""});
  writer.finish();
  const std::vector<std::string> rows = data_rows(out);
  ASSERT_EQ(rows.size(), 2U);
  const std::vector<std::string> header = cells_of(rows[0]);
  const std::vector<std::string> values = cells_of(rows[1]);
  ASSERT_EQ(header.size(), values.size());
  const auto cell = [&](const std::string& title) -> std::string {
    for (std::size_t i = 0; i < header.size(); ++i) {
      if (header[i] == title) return values[i];
    }
    return "(no column " + title + ")";
  };
  for (const PollutantBound& p : run.emissions.pollutants) {
    ASSERT_TRUE(p.estimate && p.ceiling) << p.name;
    EXPECT_DOUBLE_EQ(std::stod(cell(p.name + " estimate [ppmvd @ 3 % O2]")), std::stod(fmt::format(
        "{:.8g}", p.estimate->emission.ppmvd_at_reference.value()))) << p.name;
    EXPECT_DOUBLE_EQ(std::stod(cell(p.name + " ceiling [kg/h]")),
                     std::stod(fmt::format("{:.8g}", p.ceiling->emission.mass_rate.value() * 3600.0))) << p.name;
  }
}

// Wrong if a point without kinetics (the products lack NO, so no thermal NO) wrote NaN, failed, or
// shifted its row instead of leaving its estimate and ceiling cells empty.
TEST(SweepCsv, AnEstimateAPointDoesNotHaveIsAnEmptyCell) {
  CaseDefinition definition = load_case(std::string(STACKBOUND_SOURCE_DIR) + "/cases/examples/gas_boiler.yaml");
  definition.firing.species = {"CO2", "H2O", "N2", "O2", "CO", "Ar"};
  const std::vector<VarySpec> vary{parse_vary("excess_air=10%:20%:2")};
  const RunResult run = run_case(definition, builtin_species());
  ASSERT_FALSE(run.post_flame.thermal_no.has_value());
  std::string out;
  SweepCsvWriter writer([&out](std::string_view text) { out += text; }, vary, sweep_cautions(definition, vary),
                        make_provenance(definition, {}));
  writer.add(SweepPoint{0, {0.10}, run, ""});
  writer.finish();
  const std::vector<std::string> rows = data_rows(out);
  ASSERT_EQ(rows.size(), 2U);
  const std::vector<std::string> header = cells_of(rows[0]);
  const std::vector<std::string> values = cells_of(rows[1]);
  ASSERT_EQ(header.size(), values.size());
  std::size_t empty = 0;
  for (std::size_t i = 0; i < header.size(); ++i) {
    if (header[i].starts_with("NO estimate") || header[i].starts_with("NO ceiling")) {
      EXPECT_EQ(values[i], "") << header[i];
      ++empty;
    }
    EXPECT_EQ(values[i].find("nan"), std::string::npos) << header[i];
  }
  EXPECT_EQ(empty, 6U);
}

}  // namespace
}  // namespace stackbound::render
