// Warnings: input that is legal but looks wrong runs, and every output says so with the field, the
// value as written and why (docs/case-file.md, "Warnings"). Each case of issue 12's list of silent
// mistakes is checked here by its exact text, in the run's result and as the program prints it.

#include "stackbound/cases/run_warnings.hpp"

#include <filesystem>
#include <fstream>
#include <string>
#include <vector>

#include <fmt/format.h>
#include <gtest/gtest.h>
#include <nlohmann/json.hpp>

#include "stackbound/cases/case_file.hpp"
#include "stackbound/cases/pipeline.hpp"
#include "stackbound/cases/species_file.hpp"
#include "tests/support/run_binary.hpp"

namespace stackbound::cases {
namespace {

namespace fs = std::filesystem;
using stackbound::testing::run_stackbound;

// A plain case with no warnings; each test replaces one piece of it.
constexpr const char* kPlainCase =
    "case:\n"
    "  title: Warning test (invented)\n"
    "  plant_type: ied-liquid-gaseous\n"
    "fuel:\n"
    "  preset: natural_gas\n"
    "  feed_rate: 100 Nm3/h\n"
    "operating_point:\n"
    "  excess_air: 15 %\n"
    "firing:\n"
    "  temperature: 1800 K\n"
    "stack:\n"
    "  temperature: 150 degC\n"
    "  measured:\n"
    "    o2: 3 %, dry\n"
    "    co: 20 ppm, dry\n"
    "report:\n"
    "  reference_o2: 3 %\n"
    "  limits:\n"
    "    - pollutant: CO\n"
    "      limit: 100 mg/Nm3, dry, O2=3%\n";

std::string replaced(std::string text, const std::string& from, const std::string& to) {
  const std::size_t at = text.find(from);
  if (at == std::string::npos) {
    ADD_FAILURE() << "test setup: \"" << from << "\" not in the case";
    return text;
  }
  return text.replace(at, from.size(), to);
}

std::vector<units::Warning> warnings_of(const std::string& text) {
  LoadedCase loaded = parse_case_file(text, "w.yaml");
  return run_case(std::move(loaded.definition), builtin_species()).screening.warnings;
}

// Wrong if the plain case warned: every test below would then see a warning it did not cause.
TEST(Warnings, APlainCaseHasNone) { EXPECT_TRUE(warnings_of(kPlainCase).empty()); }

// Wrong if a flue O2 of "0.03 %" (a fraction 0.03 = 3 % typed as a percent) ran in silence.
TEST(Warnings, AFlueO2BelowAFifthOfAPercentLooksLikeAFraction) {
  const std::vector<units::Warning> warnings =
      warnings_of(replaced(kPlainCase, "excess_air: 15 %", "flue_o2: 0.03 %"));
  ASSERT_EQ(warnings.size(), 1U);
  EXPECT_EQ(warnings[0], (units::Warning{"operating_point.flue_o2", "0.03 %",
                                         "below 0.21 % O2, near-stoichiometric firing; if 0.03 is a fraction, write "
                                         "\"3 %\"; used as 0.03 % O2"}));
}

// Wrong if the same slip in a measured O2 ran in silence.
TEST(Warnings, AMeasuredO2BelowAFifthOfAPercentLooksLikeAFraction) {
  const std::vector<units::Warning> warnings = warnings_of(replaced(kPlainCase, "o2: 3 %, dry", "o2: 0.03 %, dry"));
  ASSERT_FALSE(warnings.empty());
  EXPECT_EQ(warnings[0], (units::Warning{"stack.measured.o2", "0.03 %, dry",
                                         "below 0.21 % O2, near-stoichiometric firing; if 0.03 is a fraction, write "
                                         "\"3 %\"; used as 0.03 % O2"}));
}

// Wrong if a wet measured value with no measured moisture were made dry with the model's moisture
// without saying so (and which moisture).
TEST(Warnings, AWetMeasuredValueWithoutMoistureSaysTheModelsMoistureWasUsed) {
  LoadedCase loaded = parse_case_file(replaced(kPlainCase, "co: 20 ppm, dry", "co: 20 ppm, wet"), "w.yaml");
  const RunResult run = run_case(std::move(loaded.definition), builtin_species());
  ASSERT_EQ(run.screening.warnings.size(), 1U);
  EXPECT_EQ(run.screening.warnings[0],
            (units::Warning{"stack.measured.co", "20 ppm, wet",
                            fmt::format("a wet value and no stack.measured.moisture: made dry with the model's "
                                        "moisture ({:.2f} % H2O); state the measured moisture to use it instead",
                                        run.stack.h2o_wet * 100.0)}));
}

// Wrong if a stated moisture did not silence the warning, or were not the one used: 20 ppm wet at
// 10 % moisture is 20 / 0.9 ppm dry at the measured O2, whatever the model's moisture is.
TEST(Warnings, AStatedMoistureIsTheOneAWetValueIsMadeDryWith) {
  const std::string text = replaced(kPlainCase, "co: 20 ppm, dry", "co: 20 ppm, wet\n    moisture: 10 %");
  LoadedCase loaded = parse_case_file(text, "w.yaml");
  const RunResult run = run_case(std::move(loaded.definition), builtin_species());
  EXPECT_TRUE(run.screening.warnings.empty());
  bool found = false;
  for (const MeasuredComparison& row : run.screening.measured) {
    if (row.quantity != "CO") continue;
    found = true;
    EXPECT_NEAR(row.measured, 20.0 / 0.9, 1e-9);  // at 3 % O2 measured and reference: no O2 factor
  }
  EXPECT_TRUE(found);
}

// Wrong if a firing temperature below the stack temperature (a unit slip, "120 degC" for 1200)
// ran in silence.
TEST(Warnings, AFiringTemperatureBelowTheStackTemperatureIsWarned) {
  const std::vector<units::Warning> warnings =
      warnings_of(replaced(kPlainCase, "temperature: 1800 K", "temperature: 400 K"));
  ASSERT_EQ(warnings.size(), 1U);
  EXPECT_EQ(warnings[0], (units::Warning{"firing.temperature", "400 K",
                                         "400.00 K is below the stack temperature (423.15 K): a flame or furnace is "
                                         "hotter than its stack; check the value and its unit"}));
}

// Wrong if a limit with no reference O2 were screened at the run's flue O2 without a word.
TEST(Warnings, ALimitWithoutReferenceO2SaysItIsScreenedAtTheFlueO2) {
  LoadedCase loaded =
      parse_case_file(replaced(kPlainCase, "limit: 100 mg/Nm3, dry, O2=3%", "limit: 100 ppm, dry"), "w.yaml");
  const RunResult run = run_case(std::move(loaded.definition), builtin_species());
  ASSERT_EQ(run.screening.warnings.size(), 1U);
  EXPECT_EQ(run.screening.warnings[0],
            (units::Warning{"report.limits[0].limit", "100 ppm, dry",
                            fmt::format("no reference O2 stated: screened at the flue O2 of this run ({:.2f} %, dry), "
                                        "not at a permit's reference level; write the permit's, e.g. \"100 ppm, "
                                        "dry, O2=3%\"",
                                        run.stack.o2_dry * 100.0)}));
}

// Wrong if a plant type that does not fit the fuel (wood chips under the gas-turbine preset) ran
// without a word, or were refused (a permit may well apply that preset; the user must confirm it).
TEST(Warnings, APlantTypeThatDoesNotFitTheFuelIsWarned) {
  std::string text = replaced(kPlainCase, "plant_type: ied-liquid-gaseous", "plant_type: ied-gas-turbine");
  text = replaced(text, "preset: natural_gas\n  feed_rate: 100 Nm3/h", "preset: wood_chips\n  feed_rate: 4 MW");
  text = replaced(text, "excess_air: 15 %", "excess_air: 50 %");
  text = replaced(text, "    o2: 3 %, dry\n", "");
  const std::vector<units::Warning> warnings = warnings_of(text);
  ASSERT_EQ(warnings.size(), 1U);
  EXPECT_EQ(warnings[0], (units::Warning{"case.plant_type", "ied-gas-turbine",
                                         "the preset is for a gas turbine (liquid or gaseous fuels); the fuel \"wood "
                                         "chips\" is a solid fuel: its reference O2 (15 %) may not be the permit's; "
                                         "check the plant type, or state report.reference_o2"}));
  // The converse: a gas under the solid-fuel preset.
  const std::vector<units::Warning> gas_solid =
      warnings_of(replaced(kPlainCase, "plant_type: ied-liquid-gaseous", "plant_type: ied-solid"));
  ASSERT_EQ(gas_solid.size(), 1U);
  EXPECT_EQ(gas_solid[0].message,
            "the preset is for a combustion plant firing solid fuels; the fuel \"natural gas\" is a gaseous fuel: its "
            "reference O2 (6 %) may not be the permit's; check the plant type, or state report.reference_o2");
}

fs::path scratch_dir() {
  const fs::path dir = fs::temp_directory_path() / ("stackbound_warnings_test_" + std::to_string(::getpid()));
  fs::create_directories(dir);
  return dir;
}

// Wrong if the program kept a warning from stderr, from the text report or from the JSON `warnings`
// list (objects with field, value and message), or failed the run over it.
TEST(Warnings, TheProgramPrintsThemOnStderrInTheReportAndInJson) {
  const fs::path dir = scratch_dir();
  const fs::path file = dir / "w.yaml";
  std::ofstream(file) << replaced(kPlainCase, "excess_air: 15 %", "flue_o2: 0.03 %");
  const std::string expected =
      "operating_point.flue_o2 = \"0.03 %\": below 0.21 % O2, near-stoichiometric firing; if 0.03 is a fraction, "
      "write \"3 %\"; used as 0.03 % O2";
  const auto text = run_stackbound({"run", file.string()});
  EXPECT_EQ(text.exit_code, 0) << text.err;
  EXPECT_EQ(text.err, "stackbound: warning: " + file.string() + ":8:12: " + expected + "\n");
  EXPECT_NE(text.out.find("Warnings\n--------\n  ? operating_point.flue_o2 = \"0.03 %\": below 0.21 % O2"),
            std::string::npos)
      << text.out;
  const auto json = run_stackbound({"run", file.string(), "--format", "json"});
  ASSERT_EQ(json.exit_code, 0) << json.err;
  const nlohmann::json warnings = nlohmann::json::parse(json.out).at("warnings");
  ASSERT_EQ(warnings.size(), 1U);
  EXPECT_EQ(warnings[0].at("field"), "operating_point.flue_o2");
  EXPECT_EQ(warnings[0].at("value"), "0.03 %");
  EXPECT_EQ(warnings[0].at("message"),
            "below 0.21 % O2, near-stoichiometric firing; if 0.03 is a fraction, write \"3 %\"; used as 0.03 % O2");
  const auto sweep = run_stackbound({"sweep", file.string(), "--vary", "reference_o2=3%:6%:2"});
  EXPECT_EQ(sweep.exit_code, 0) << sweep.err;
  EXPECT_EQ(sweep.err, "stackbound: warning: " + file.string() + ":8:12: " + expected + "\n");
  const auto compared = run_stackbound({"compare", file.string(), file.string()});
  EXPECT_EQ(compared.exit_code, 0) << compared.err;
  EXPECT_EQ(compared.err, "stackbound: warning: " + file.string() + ": " + expected + "\nstackbound: warning: " +
                              file.string() + ": " + expected + "\n");
  fs::remove_all(dir);
}

}  // namespace
}  // namespace stackbound::cases
