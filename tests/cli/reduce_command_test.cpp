// The `stackbound reduce` command, run as a process on the invented demo day and on small files.

#include <algorithm>
#include <filesystem>
#include <iterator>
#include <fstream>
#include <string>

#include <gtest/gtest.h>
#include <nlohmann/json.hpp>

#include "tests/support/run_binary.hpp"
#include "tests/support/tolerance.hpp"

namespace {

using stackbound::testing::is_close;
using stackbound::testing::run_stackbound;

const std::string kCase = std::string(STACKBOUND_SOURCE_DIR) + "/cases/examples/gas_turbine.yaml";
const std::string kDay = std::string(STACKBOUND_SOURCE_DIR) + "/cases/examples/gas_turbine_readings.csv";

// Wrong if a JSON key the issue spells out were renamed or missing (other tools read them).
TEST(ReduceCommand, JsonKeysAreTheContract) {
  const auto r = run_stackbound({"reduce", kCase, kDay, "--rules", "eu-ied", "--format", "json"});
  ASSERT_EQ(r.exit_code, 0) << r.err;
  const nlohmann::json out = nlohmann::json::parse(r.out);
  for (const char* key : {"periods", "summary", "rules", "warnings"}) EXPECT_TRUE(out.contains(key)) << key;
  ASSERT_EQ(out.at("periods").size(), 24U);
  const nlohmann::json& hour = out.at("periods").at(0);
  for (const char* key : {"start", "end", "valid", "invalid_reason", "readings", "values"}) EXPECT_TRUE(hour.contains(key)) << key;
  for (const char* key : {"ppmvd", "ppmvd_at_ref_o2", "mg_per_Nm3_at_ref_o2", "kg_per_h", "validated_mg_per_Nm3_at_ref_o2",
                          "iso_corrected_ppmvd_at_15_o2"}) {
    EXPECT_TRUE(hour.at("values").at("NOx").contains(key)) << key;
  }
  for (const auto& rule : out.at("rules")) EXPECT_FALSE(rule.at("source").get<std::string>().empty()) << rule.dump();
}

// Wrong if the demo day's invalid hours (the fault and the outage) were not found by the quadrant rule,
// or the calibration hour were refused although it has two valid readings 15 minutes apart.
TEST(ReduceCommand, DemoDayInvalidHoursUnderUsPart60) {
  const auto r = run_stackbound({"reduce", kCase, kDay, "--rules", "us-part60", "--format", "json"});
  ASSERT_EQ(r.exit_code, 0) << r.err;
  const nlohmann::json out = nlohmann::json::parse(r.out);
  std::vector<std::string> invalid;
  for (const auto& p : out.at("periods")) {
    if (!p.at("valid").get<bool>()) invalid.push_back(p.at("start").get<std::string>());
  }
  EXPECT_EQ(invalid, (std::vector<std::string>{"2026-06-15T13:00:00-06:00", "2026-06-15T14:00:00-06:00",
                                               "2026-06-15T20:00:00-06:00"}));
  EXPECT_EQ(out.at("summary").at("bad_rows").at("total"), 4);
  EXPECT_EQ(out.at("summary").at("fo").at("above_range"), 120);  // the two hours of CO2 drift
}

// The per-reading correction must equal `stackbound convert` for the same value (1e-12): a file with
// one reading of NOx 40 ppm dry at 10 % O2, against convert at the case's bases (15 % O2, 20.9 %, 0 degC).
TEST(ReduceCommand, OneReadingEqualsConvert) {
  const auto dir = std::filesystem::temp_directory_path() / "stackbound_reduce_test";
  std::filesystem::create_directories(dir);
  const auto csv = dir / "one.csv";
  std::ofstream(csv) << "time,O2,CO2,CO,NOx,H2O,flow,load,T_amb,RH,status\n"
                        "2026-06-15T10:00:00-06:00,10.0,5.5,3.0,40,8.0,300000,41,15,60,OK\n";
  const auto r = run_stackbound({"reduce", kCase, csv.string(), "--format", "json"});
  ASSERT_EQ(r.exit_code, 0) << r.err;
  const double reduced = nlohmann::json::parse(r.out).at("periods").at(0).at("values").at("NOx").at("mg_per_Nm3_at_ref_o2");
  const auto c = run_stackbound({"convert", "40 ppm", "NOx", "--from", "dry", "--to", "mg/Nm3, dry, O2=15%", "--o2", "10%",
                                 "--o2-basis", "20.9", "--format", "json"});
  ASSERT_EQ(c.exit_code, 0) << c.err;
  const double converted = nlohmann::json::parse(c.out).at("value");
  EXPECT_TRUE(is_close(reduced, converted, 1e-12));
  std::filesystem::remove_all(dir);
}

// Wrong if a row holding a NUL and an invalid byte stopped the JSON report (an internal error before):
// the row is counted as not a number and its bytes are shown escaped.
TEST(ReduceCommand, ARowOfControlBytesIsCountedAndShownEscapedInJson) {
  using namespace std::string_literals;
  const auto dir = std::filesystem::temp_directory_path() / "stackbound_reduce_bytes_test";
  std::filesystem::create_directories(dir);
  const auto csv = dir / "bytes.csv";
  std::ofstream(csv, std::ios::binary) << "time,O2,CO2,CO,NOx,H2O,flow,load,T_amb,RH,status\n"
                                          "2026-06-15T10:00:00-06:00,10.0,5.5,3.0,40,8.0,300000,41,15,60,OK\n"
                                       << "2026-06-15T10:01:00-06:00,10.0,5.5,3.0,4\0\xff,8.0,300000,41,15,60,OK\n"s;
  const auto r = run_stackbound({"reduce", kCase, csv.string(), "--format", "json"});
  ASSERT_EQ(r.exit_code, 0) << r.err;
  const nlohmann::json bad_rows = nlohmann::json::parse(r.out).at("summary").at("bad_rows");
  EXPECT_NE(bad_rows.dump().find(R"(column NOx = \"4\\x00\\xff\": not a number)"), std::string::npos) << bad_rows.dump();
  std::filesystem::remove_all(dir);
}

// Wrong if --strict went past the first bad row of the demo (line 556, "---"), or an option were not checked.
TEST(ReduceCommand, StrictAndBadOptionsExitTwoWithTheReason) {
  const auto strict = run_stackbound({"reduce", kCase, kDay, "--strict"});
  EXPECT_EQ(strict.exit_code, 2);
  EXPECT_NE(strict.err.find("gas_turbine_readings.csv:556: not_a_number"), std::string::npos) << strict.err;
  EXPECT_TRUE(strict.out.empty());
  const auto average = run_stackbound({"reduce", kCase, kDay, "--average", "7h"});
  EXPECT_EQ(average.exit_code, 2);
  EXPECT_NE(average.err.find("--average = \"7h\""), std::string::npos) << average.err;
  const auto rules = run_stackbound({"reduce", kCase, kDay, "--rules", "part60"});
  EXPECT_EQ(rules.exit_code, 2);
  EXPECT_NE(rules.err.find("accepted: us-part60, eu-ied, none"), std::string::npos) << rules.err;
}

// Wrong if the CSV written row by row to a file (constant memory) differed from the CSV on stdout.
TEST(ReduceCommand, CsvToAFileEqualsStandardOutput) {
  const auto dir = std::filesystem::temp_directory_path() / "stackbound_reduce_csv_test";
  std::filesystem::create_directories(dir);
  const auto file = dir / "day.csv";
  const auto to_file = run_stackbound({"reduce", kCase, kDay, "--rules", "us-part60", "--output", file.string()});
  ASSERT_EQ(to_file.exit_code, 0) << to_file.err;
  const auto to_stdout = run_stackbound({"reduce", kCase, kDay, "--rules", "us-part60"});
  ASSERT_EQ(to_stdout.exit_code, 0) << to_stdout.err;
  std::ifstream in(file);
  const std::string written((std::istreambuf_iterator<char>(in)), std::istreambuf_iterator<char>());
  EXPECT_EQ(written, to_stdout.out);
  EXPECT_EQ(std::count(written.begin(), written.end(), '\n'), 25);  // header and 24 hours
  std::filesystem::remove_all(dir);
}

// Wrong if the HTML page lost its time-series plots or the shading of invalid periods.
TEST(ReduceCommand, HtmlHasPlotsWithInvalidPeriodsShaded) {
  const auto r = run_stackbound({"reduce", kCase, kDay, "--rules", "us-part60", "--format", "html"});
  ASSERT_EQ(r.exit_code, 0) << r.err;
  EXPECT_NE(r.out.find("<svg"), std::string::npos);
  EXPECT_NE(r.out.find("shaded: invalid periods"), std::string::npos);
  EXPECT_NE(r.out.find("40 CFR 60.13(h)(2)"), std::string::npos);
}

}  // namespace
