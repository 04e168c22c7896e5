// The `stackbound convert` command, run as a process.

#include <sys/wait.h>

#include <array>
#include <cstdio>
#include <string>

#include <gtest/gtest.h>
#include <nlohmann/json.hpp>

#include "tests/support/tolerance.hpp"

namespace {

using stackbound::testing::is_close;

struct ProcessResult {
  int exit_code = -1;
  std::string output;
};

// Runs the program with `arguments` (already shell-quoted); `streams` chooses what is captured.
ProcessResult run_stackbound(const std::string& arguments, const std::string& streams = "2>&1") {
  const std::string command = std::string(STACKBOUND_BINARY) + " " + arguments + " " + streams;
  ProcessResult result;
  FILE* pipe = popen(command.c_str(), "r");
  if (pipe == nullptr) return result;
  std::array<char, 4096> buffer{};
  std::size_t n = 0;
  while ((n = fread(buffer.data(), 1, buffer.size(), pipe)) > 0) result.output.append(buffer.data(), n);
  const int status = pclose(pipe);
  result.exit_code = WIFEXITED(status) ? WEXITSTATUS(status) : -1;
  return result;
}

// Wrong if the example of the issue did not give 35 ppm * 17.9/13.7 * 28.010 / 22.41397 mg/Nm3.
TEST(ConvertCommand, IssueExampleAsJson) {
  const ProcessResult r = run_stackbound("convert \"35 ppm\" CO --from \"dry, O2=7.2%\" --to \"mg/Nm3, dry, O2=3%\" --format json", "2>/dev/null");
  ASSERT_EQ(r.exit_code, 0) << r.output;
  const nlohmann::json out = nlohmann::json::parse(r.output);
  const double expected = 35.0 * (20.9 - 3.0) / (20.9 - 7.2) * 28.010 / (8.314462618 * 273.15 / 101325.0 * 1e3);
  EXPECT_TRUE(is_close(out.at("value").get<double>(), expected, 1e-12));
  EXPECT_EQ(out.at("unit"), "mg/Nm3");
  EXPECT_EQ(out.at("basis"), "mg/Nm3, dry, O2=3%, normal=0C");
  std::vector<std::string> names;
  for (const auto& f : out.at("factors")) names.push_back(f.at("name").get<std::string>());
  EXPECT_EQ(names, (std::vector<std::string>{"O2 correction factor", "molar mass", "molar volume"}));
}

// Wrong if the text form printed a number without its unit.
TEST(ConvertCommand, TextFormCarriesUnits) {
  const ProcessResult r = run_stackbound("convert \"35 ppm\" CO --from \"dry, O2=7.2%\" --to \"mg/Nm3, dry, O2=3%\"");
  ASSERT_EQ(r.exit_code, 0) << r.output;
  EXPECT_NE(r.output.find("35 ppmv CO (dry, O2=7.2%)"), std::string::npos) << r.output;
  EXPECT_NE(r.output.find("= 57.1472 mg/Nm3 CO (dry, O2=3%, normal=0C)"), std::string::npos) << r.output;
  EXPECT_NE(r.output.find("28.01 g/mol"), std::string::npos) << r.output;
  EXPECT_NE(r.output.find("22.414 L/mol"), std::string::npos) << r.output;
  EXPECT_NE(r.output.find("1.30657 (ratio)"), std::string::npos) << r.output;
}

// Wrong if --moisture, --normal and --o2-basis were not applied.
TEST(ConvertCommand, ContextOptionsAreApplied) {
  const ProcessResult r = run_stackbound("convert \"100 ppmvw\" NOx --to \"mg/Nm3, dry, O2=15%\" --moisture 10% --o2 12% --normal IED "
                    "--o2-basis 21 --format json",
                    "2>/dev/null");
  ASSERT_EQ(r.exit_code, 0) << r.output;
  const nlohmann::json out = nlohmann::json::parse(r.output);
  const double molar_volume_L = 8.314462618 * 273.15 / 101300.0 * 1e3;
  const double expected = 100.0 / 0.9 * (21.0 - 15.0) / (21.0 - 12.0) * 46.005 / molar_volume_L;
  EXPECT_TRUE(is_close(out.at("value").get<double>(), expected, 1e-12));
  EXPECT_TRUE(is_close(out.at("context").at("o2_basis_percent").get<double>(), 21.0, 1e-15));
  EXPECT_EQ(out.at("normal_conditions").at("key"), "IED");
}

// Wrong if a preset used in a basis were not flagged for confirmation against the permit.
TEST(ConvertCommand, PresetIsShownForConfirmation) {
  const ProcessResult r = run_stackbound("convert \"20 ppmvd\" NOx --from \"O2=ied-gas-turbine\" --to mg/Nm3");
  ASSERT_EQ(r.exit_code, 0) << r.output;
  EXPECT_NE(r.output.find("preset ied-gas-turbine"), std::string::npos) << r.output;
  EXPECT_NE(r.output.find("confirm it against your permit"), std::string::npos) << r.output;
}

// Wrong if a missing piece of context did not exit non-zero naming the piece and the option.
TEST(ConvertCommand, MissingContextNamesTheOption) {
  const ProcessResult r = run_stackbound("convert \"35 ppm\" CO --from wet --to \"ppmv, dry\"");
  EXPECT_EQ(r.exit_code, 2);
  EXPECT_NE(r.output.find("stack-gas moisture"), std::string::npos) << r.output;
  EXPECT_NE(r.output.find("--moisture"), std::string::npos) << r.output;
  const ProcessResult m = run_stackbound("convert \"2 ppbv\" Hg --from dry --to ug/Nm3");
  EXPECT_EQ(m.exit_code, 2);
  EXPECT_NE(m.output.find("--molar-mass"), std::string::npos) << m.output;
  const ProcessResult ok = run_stackbound("convert \"2 ppbv\" Hg --from dry --to ug/Nm3 --molar-mass \"200.59 g/mol\"");
  EXPECT_EQ(ok.exit_code, 0) << ok.output;
}

// Wrong if bad input crashed, printed NaN or exited 0.
TEST(ConvertCommand, BadInputExitsWithAMessage) {
  for (const char* arguments : {"convert \"35 ppm\" CO --from \"dry, O2=7.2\" --to mg/Nm3",
                                "convert \"abc\" CO --from dry --to mg/Nm3",
                                "convert \"35 ppm\" CO --from dry --to mg/Nm3 --o2 21%",
                                "convert \"35 ppm\" CO --from dry --to mg/Nm3 --o2-basis 20",
                                "convert \"35 ppm\" CO --from dry --to mg/Nm3 --normal 25C",
                                "convert \"35\" CO --from dry --to mg/Nm3",
                                "convert \"35 mg/Nm3\" CO --from ppmv --to ppmv"}) {
    SCOPED_TRACE(arguments);
    const ProcessResult r = run_stackbound(arguments);
    EXPECT_EQ(r.exit_code, 2) << r.output;
    EXPECT_NE(r.output.find("stackbound: error:"), std::string::npos) << r.output;
    EXPECT_EQ(r.output.find("nan"), std::string::npos) << r.output;
  }
}

// Wrong if --help lacked the examples.
TEST(ConvertCommand, HelpShowsExamples) {
  const ProcessResult r = run_stackbound("convert --help");
  EXPECT_EQ(r.exit_code, 0);
  EXPECT_NE(r.output.find("stackbound convert \"35 ppm\" CO --from \"dry, O2=7.2%\" --to \"mg/Nm3, dry, O2=3%\""),
            std::string::npos)
      << r.output;
  EXPECT_NE(r.output.find("--o2-basis"), std::string::npos);
}

}  // namespace
