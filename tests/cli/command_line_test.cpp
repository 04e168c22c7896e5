// The command line itself: --version, every output's provenance, and parse errors that exit 2 and
// name what was wrong.

#include <gtest/gtest.h>

#include <nlohmann/json.hpp>
#include <string>

#include "stackbound/cases/case_file.hpp"
#include "stackbound/version.hpp"
#include "tests/support/run_binary.hpp"

namespace stackbound::cli {
namespace {

using testing::run_stackbound;

std::string example(const char* name) { return std::string(STACKBOUND_SOURCE_DIR) + "/cases/examples/" + name; }

// Wrong if --version printed anything but the build's version, or exited non-zero.
TEST(CommandLine, VersionPrintsTheBuildsVersion) {
  const auto run = run_stackbound({"--version"});
  EXPECT_EQ(run.exit_code, 0) << run.err;
  EXPECT_EQ(run.out, "stackbound " + std::string(kVersion) + "\n");
}

// Wrong if an output of a run, a sweep or a comparison lacked the version, the run time or the case
// file's SHA-256.
TEST(CommandLine, EveryOutputCarriesItsProvenance) {
  const std::string sha = cases::load_case(example("gas_boiler.yaml")).source_sha256;
  const std::string version = std::string("stackbound ") + kVersion;
  for (const char* format : {"text", "csv", "html"}) {
    const auto run = run_stackbound({"run", example("gas_boiler.yaml"), "--format", format});
    ASSERT_EQ(run.exit_code, 0) << run.err;
    EXPECT_NE(run.out.find(sha), std::string::npos) << format;
    EXPECT_NE(run.out.find(version), std::string::npos) << format;
    EXPECT_NE(run.out.find("Run at"), std::string::npos) << format;
  }
  const auto json_run = run_stackbound({"run", example("gas_boiler.yaml"), "--format", "json"});
  ASSERT_EQ(json_run.exit_code, 0) << json_run.err;
  const nlohmann::json provenance = nlohmann::json::parse(json_run.out)["provenance"];
  EXPECT_EQ(provenance["version"], kVersion);
  EXPECT_EQ(provenance["case_sha256"], sha);
  EXPECT_EQ(provenance["run_at"].get<std::string>().size(), 20U);  // 2026-12-03T18:49:07Z

  const auto sweep = run_stackbound({"sweep", example("gas_boiler.yaml"), "--vary", "excess_air=10%:20%:2"});
  ASSERT_EQ(sweep.exit_code, 0) << sweep.err;
  EXPECT_NE(sweep.out.find("\n# provenance: " + version + ", run at "), std::string::npos);
  EXPECT_NE(sweep.out.find(sha), std::string::npos);
  const auto sweep_html =
      run_stackbound({"sweep", example("gas_boiler.yaml"), "--vary", "excess_air=10%:20%:2", "--format", "html"});
  ASSERT_EQ(sweep_html.exit_code, 0) << sweep_html.err;
  EXPECT_NE(sweep_html.out.find(sha), std::string::npos);

  const std::string wood_sha = cases::load_case(example("wood_chip_boiler.yaml")).source_sha256;
  const auto compare =
      run_stackbound({"compare", example("gas_boiler.yaml"), example("wood_chip_boiler.yaml"), "--format", "json"});
  ASSERT_EQ(compare.exit_code, 0) << compare.err;
  const nlohmann::json c = nlohmann::json::parse(compare.out);
  EXPECT_EQ(c["provenance"]["version"], kVersion);
  EXPECT_EQ(c["provenance"]["case_sha256"], nlohmann::json({sha, wood_sha}));
  EXPECT_EQ(c["cases"][1]["case_sha256"], wood_sha);
  const auto compare_text = run_stackbound({"compare", example("gas_boiler.yaml"), example("wood_chip_boiler.yaml")});
  ASSERT_EQ(compare_text.exit_code, 0) << compare_text.err;
  EXPECT_NE(compare_text.out.find(wood_sha), std::string::npos);
  EXPECT_NE(compare_text.out.find(version), std::string::npos);
}

// Wrong if a command-line mistake exited with anything but 2, or did not say what was wrong.
TEST(CommandLine, ParseErrorsExit2AndNameWhatWasWrong) {
  const struct {
    std::vector<std::string> arguments;
    std::string message;
  } cases[] = {
      {{}, "A subcommand is required"},
      {{"frobnicate"},
       "stackbound: error: unknown command \"frobnicate\"; the commands are run, species, sweep, compare, "
       "equilibrium, convert, fuel, reduce (stackbound --help)"},
      {{"run"}, "CASE is required"},
      {{"run", "x.yaml", "--format", "pdf"}, "--format: pdf not in {text,json,csv,html}"},
      {{"run", "--bogus", "x.yaml"}, "The following argument was not expected: --bogus"},
      {{"sweep", "x.yaml"}, "--vary is required"},
  };
  for (const auto& c : cases) {
    const auto run = run_stackbound(c.arguments);
    EXPECT_EQ(run.exit_code, 2) << c.message;
    EXPECT_NE(run.err.find(c.message), std::string::npos) << "stderr was: " << run.err;
    EXPECT_EQ(run.out, "") << c.message;
  }
}

}  // namespace
}  // namespace stackbound::cli
