// `stackbound equilibrium` run as a user runs it: the built binary, its stdout, stderr and exit code.
// Feeds are invented test mixtures.

#include <gtest/gtest.h>

#include <nlohmann/json.hpp>
#include <string>
#include <vector>

#include "stackbound/cases/species_file.hpp"
#include "stackbound/core/adiabatic_flame.hpp"
#include "stackbound/core/element_amounts.hpp"
#include "stackbound/core/equilibrium.hpp"
#include "stackbound/core/post_flame.hpp"
#include "stackbound/core/thermal_no.hpp"
#include "tests/support/run_binary.hpp"
#include "tests/support/tolerance.hpp"
#include "stackbound/units/constants.hpp"

namespace stackbound::cases {
namespace {

using stackbound::testing::is_close;
using stackbound::testing::ProcessResult;
using stackbound::testing::run_stackbound;

// Wrong if the command printed values other than the library's, or missed a documented JSON key.
TEST(EquilibriumCommand, JsonCarriesTheLibraryResult) {
  const ProcessResult run = run_stackbound({"equilibrium", "--feed", "CH4 + 2.4 O2 + 9.03 N2", "--temperature", "1800K",
                                            "--pressure", "2 bar", "--format", "json"});
  ASSERT_EQ(run.exit_code, 0) << run.err;
  EXPECT_EQ(run.err, "");
  const nlohmann::json json = nlohmann::json::parse(run.out);
  const std::vector<core::SpeciesAmount> feed{{"CH4", 1.0}, {"O2", 2.4}, {"N2", 9.03}};
  const core::ElementAmounts b = core::element_amounts(builtin_species(), feed);
  const core::EquilibriumResult expected =
      core::EquilibriumSolver(builtin_species(), b).solve_tp(b, units::kelvin(1800.0), units::pascals(2e5));
  EXPECT_TRUE(is_close(json.at("temperature_K").get<double>(), 1800.0, 1e-15));
  EXPECT_TRUE(is_close(json.at("pressure_Pa").get<double>(), 2e5, 1e-15));
  EXPECT_TRUE(is_close(json.at("total_moles").get<double>(), expected.total_gas_moles, 1e-12));
  EXPECT_EQ(json.at("iterations").get<int>(), expected.iterations);
  EXPECT_LE(json.at("element_residual").get<double>(), 1e-10);
  EXPECT_FALSE(json.at("graphite_present").get<bool>());
  for (const char* name : {"CO2", "H2O", "NO", "OH", "CO", "O2", "N2", "C(gr)"}) {
    EXPECT_TRUE(is_close(json.at("mole_fractions").at(name).get<double>(), expected.mole_fraction(name), 1e-12, 1e-300))
        << name;
    EXPECT_TRUE(is_close(json.at("moles").at(name).get<double>(), expected.moles_of(name), 1e-12, 1e-300)) << name;
  }
  EXPECT_EQ(json.at("mole_fractions").size(), expected.species.size());
}

// Wrong if --adiabatic did not solve HP from the feed temperature, or --species did not restrict.
TEST(EquilibriumCommand, AdiabaticFromTheFeedTemperatureWithRestrictedProducts) {
  const ProcessResult run =
      run_stackbound({"equilibrium", "--feed", "H2 + 0.5 O2 + 1.88 N2", "--adiabatic", "--feed-temperature", "400K",
                      "--species", "H2O,H2,O2,OH,H,O,N2", "--format", "json"});
  ASSERT_EQ(run.exit_code, 0) << run.err;
  const nlohmann::json json = nlohmann::json::parse(run.out);
  EXPECT_EQ(json.at("mole_fractions").size(), 7u);
  EXPECT_FALSE(json.at("mole_fractions").contains("NO"));
  const std::vector<core::SpeciesAmount> feed{{"H2", 1.0}, {"O2", 0.5}, {"N2", 1.88}};
  const core::ElementAmounts b = core::element_amounts(builtin_species(), feed);
  const core::EquilibriumSolver solver(builtin_species(), b, {"H2O", "H2", "O2", "OH", "H", "O", "N2"});
  const core::EquilibriumResult expected =
      solver.solve_hp(b, core::feed_enthalpy(builtin_species(), feed, units::kelvin(400.0)),
                      units::pascals(units::kStandardAtmosphere_Pa));
  EXPECT_NEAR(json.at("temperature_K").get<double>(), expected.temperature_K, 1e-6);
  EXPECT_TRUE(is_close(json.at("feed_temperature_K").get<double>(), 400.0, 1e-15));
  EXPECT_EQ(json.at("mode").get<std::string>(), "adiabatic");
}

// Wrong if a heat loss did not lower the flame temperature.
TEST(EquilibriumCommand, HeatLossLowersTheAdiabaticTemperature) {
  const auto temperature = [](std::vector<std::string> extra) {
    std::vector<std::string> arguments{"equilibrium", "--feed",   "CH4 + 2 O2 + 7.52 N2",
                                       "--adiabatic", "--format", "json"};
    arguments.insert(arguments.end(), extra.begin(), extra.end());
    const ProcessResult run = run_stackbound(arguments);
    EXPECT_EQ(run.exit_code, 0) << run.err;
    return nlohmann::json::parse(run.out).at("temperature_K").get<double>();
  };
  EXPECT_LT(temperature({"--heat-loss", "10%"}), temperature({}) - 50.0);
}

// Wrong if the text report lost its header lines, its table or the note on what the numbers are.
TEST(EquilibriumCommand, TextReportHasHeaderTableAndNote) {
  const ProcessResult run = run_stackbound({"equilibrium", "--feed", "CH4 + 0.6 O2 + 2.3 N2", "--temperature", "700K"});
  ASSERT_EQ(run.exit_code, 0) << run.err;
  for (const char* fragment : {"Temperature 700.00 K", "Pressure 101325 Pa (1 atm)", "Newton iterations",
                               "element-balance residual", "graphite present", "species", "mole fraction",
                               "moles [mol]", "C(gr)", "(condensed)", "an equilibrium bound, not a measurement"}) {
    EXPECT_NE(run.out.find(fragment), std::string::npos) << fragment << "\n" << run.out;
  }
}

// Wrong if --help lacked the examples the design asks every command to show.
TEST(EquilibriumCommand, HelpShowsExamples) {
  const ProcessResult run = run_stackbound({"equilibrium", "--help"});
  EXPECT_EQ(run.exit_code, 0);
  EXPECT_NE(run.out.find("Examples:"), std::string::npos);
  EXPECT_NE(run.out.find("stackbound equilibrium --feed \"CH4 + 2.4 O2 + 9.03 N2\" --temperature 1800K"),
            std::string::npos);
}

// Wrong if the reactant notation (omitted coefficient, leading-point decimal, exponent, C(gr)) did
// not reach the solver as the amounts written.
TEST(EquilibriumCommand, ReactantNotationGivesTheFeedAmounts) {
  const ProcessResult run = run_stackbound(
      {"equilibrium", "--feed", "C(gr) + .5 O2 + 1e-3 NO+2 N2", "--temperature", "1500K", "--format", "json"});
  ASSERT_EQ(run.exit_code, 0) << run.err;
  const nlohmann::json feed = nlohmann::json::parse(run.out).at("feed_moles");
  EXPECT_EQ(feed.size(), 4u);
  EXPECT_EQ(feed.at("C(gr)").get<double>(), 1.0);
  EXPECT_EQ(feed.at("O2").get<double>(), 0.5);
  EXPECT_EQ(feed.at("NO").get<double>(), 1e-3);
  EXPECT_EQ(feed.at("N2").get<double>(), 2.0);
}

// Wrong if bad input were answered, or its message did not name the option and the value.
TEST(EquilibriumCommand, BadInputIsAnErrorNamingTheOption) {
  struct Case {
    std::vector<std::string> arguments;
    const char* fragment;
  };
  const Case cases[] = {
      {{"--feed", "CH4 + x O2", "--temperature", "1800K"},
       "--feed = \"CH4 + x O2\": term 2 \"x O2\" (column 7): two formulas in one term: write \"x + O2\""},
      {{"--feed", "CH5 + 2 O2", "--temperature", "1800K"},
       "--feed = \"CH5 + 2 O2\": term 1 \"CH5\" (column 1): unknown species \"CH5\"; did you mean \"CH4\"?"},
      {{"--feed", "CH4 + -1 O2", "--temperature", "1800K"}, "the coefficient \"-1\" must be > 0 mol"},
      {{"--feed", "0 CH4", "--temperature", "1800K"}, "the coefficient \"0\" must be > 0 mol"},
      {{"--feed", "CH4 + 2O2", "--temperature", "1800K"}, "must be followed by a blank: write \"2 O2\""},
      {{"--feed", "CH4 + 2 O2 +", "--temperature", "1800K"}, "term 3 is empty: nothing after the last \"+\""},
      {{"--feed", "CH4 + O2 + CH4", "--temperature", "1800K"}, "CH4 is already term 1"},
      {{"--feed", "CH4=1, O2=2.4", "--temperature", "1800K"},
       "--feed = \"CH4=1, O2=2.4\": the NAME=AMOUNT form is not accepted; write \"CH4 + 2.4 O2\""},
      {{"--feed", "CH4 + 2 O2", "--temperature", "5000K"}, "--temperature = 5000 K: outside the data range"},
      {{"--feed", "CH4 + 2 O2", "--temperature", "1800K", "--species", "CO2,O2"},
       "--species = \"CO2,O2\": no product contains H"},
      {{"--feed", "CO", "--temperature", "1800K", "--species", "CO2,O2"},
       "cannot hold the feed's elements in its proportions"},
      {{"--feed", "CH4 + 2 O2"}, "--temperature: missing"},
      {{"--feed", "CH4 + 2 O2", "--temperature", "1800K", "--adiabatic"}, "not both"},
      {{"--feed", "CH4 + 2 O2", "--temperature", "1800K", "--feed-temperature", "400K"},
       "--feed-temperature = \"400K\": applies only with --adiabatic"},
      {{"--feed", "CH4 + 2 O2", "--adiabatic", "--heat-loss", "120%"}, "--heat-loss = \"120%\""},
  };
  for (const Case& c : cases) {
    std::vector<std::string> arguments{"equilibrium"};
    arguments.insert(arguments.end(), c.arguments.begin(), c.arguments.end());
    const ProcessResult run = run_stackbound(arguments);
    EXPECT_EQ(run.exit_code, 2) << c.fragment;
    EXPECT_EQ(run.out, "") << c.fragment;
    EXPECT_NE(run.err.find(c.fragment), std::string::npos) << "expected: " << c.fragment << "\nstderr: " << run.err;
  }
}

// Wrong if --residence-time did not add the documented thermal_no keys, or printed values other than
// the core function's for the same feed, T, P and time.
TEST(EquilibriumCommand, ThermalNoCarriesTheCoreResult) {
  const ProcessResult run = run_stackbound({"equilibrium", "--feed", "CH4 + 2.4 O2 + 9.03 N2", "--temperature", "1900K",
                                            "--pressure", "2 bar", "--residence-time", "20ms", "--format", "json"});
  ASSERT_EQ(run.exit_code, 0) << run.err;
  const nlohmann::json no = nlohmann::json::parse(run.out).at("thermal_no");
  const std::vector<core::SpeciesAmount> feed{{"CH4", 1.0}, {"O2", 2.4}, {"N2", 9.03}};
  const core::ElementAmounts b = core::element_amounts(builtin_species(), feed);
  const core::ThermalNoResult expected =
      core::thermal_no(core::EquilibriumSolver(builtin_species(), b), b, units::kelvin(1900.0), units::pascals(2e5),
                       units::seconds(0.020));
  EXPECT_TRUE(is_close(no.at("residence_time_s").get<double>(), 0.020, 1e-15));
  EXPECT_TRUE(is_close(no.at("no_mole_fraction").get<double>(), expected.no_mole_fraction, 1e-12, 1e-300));
  EXPECT_TRUE(is_close(no.at("no_equilibrium_mole_fraction").get<double>(), expected.no_equilibrium_mole_fraction,
                       1e-12, 1e-300));
  EXPECT_TRUE(is_close(no.at("initial_rate_mole_fraction_per_s").get<double>(),
                       expected.initial_rate_mole_fraction_per_s, 1e-12, 1e-300));
  EXPECT_EQ(no.at("rate_constants").get<std::string>(), expected.rate_constants);
  EXPECT_GT(expected.no_mole_fraction, 0.0);
  EXPECT_LT(expected.no_mole_fraction, expected.no_equilibrium_mole_fraction);
}

// Wrong if with --adiabatic thermal NO were not computed at the adiabatic flame temperature.
TEST(EquilibriumCommand, ThermalNoWithAdiabaticIsAtTheFlameTemperature) {
  const ProcessResult run = run_stackbound({"equilibrium", "--feed", "CH4 + 2.4 O2 + 9.03 N2", "--adiabatic",
                                            "--residence-time", "0.05 s", "--format", "json"});
  ASSERT_EQ(run.exit_code, 0) << run.err;
  const nlohmann::json json = nlohmann::json::parse(run.out);
  EXPECT_EQ(json.at("thermal_no").at("temperature_K").get<double>(), json.at("temperature_K").get<double>());
  EXPECT_GT(json.at("thermal_no").at("no_mole_fraction").get<double>(), 0.0);
}

// Wrong if the text output lost the thermal NO lines, their units or the caution on what they are.
TEST(EquilibriumCommand, ThermalNoTextHasUnitsAndCaution) {
  const ProcessResult run = run_stackbound(
      {"equilibrium", "--feed", "CH4 + 2.4 O2 + 9.03 N2", "--temperature", "1900K", "--residence-time", "20ms"});
  ASSERT_EQ(run.exit_code, 0) << run.err;
  for (const char* fragment : {"Thermal NO after a residence time of 0.02 s at 1900.00 K", "ppmv",
                               "1/s (mole fraction per second)", "rate constants", "Hanson",
                               "kinetic estimate with equilibrium O and OH", "prompt NO is not computed"}) {
    EXPECT_NE(run.out.find(fragment), std::string::npos) << fragment << "\n" << run.out;
  }
}

// Wrong if a bad residence time were answered, or the message did not name the option and value.
TEST(EquilibriumCommand, BadResidenceTimeIsAnErrorNamingTheOption) {
  struct Case {
    std::vector<std::string> arguments;
    const char* fragment;
  };
  const Case cases[] = {
      {{"--residence-time", "-5ms"}, "--residence-time = \"-5ms\" (-0.005 s): must be a finite time from 0 s"},
      {{"--residence-time", "2h"}, "--residence-time = \"2h\" (7200 s): must be a finite time from 0 s to 3600 s"},
      {{"--residence-time", "20"}, "--residence-time"},
      {{"--residence-time", "20 K"}, "--residence-time"},
      {{"--residence-time", "nan s"}, "--residence-time"},
  };
  for (const Case& c : cases) {
    std::vector<std::string> arguments{"equilibrium", "--feed", "CH4 + 2.4 O2 + 9.03 N2", "--temperature", "1900K"};
    arguments.insert(arguments.end(), c.arguments.begin(), c.arguments.end());
    const ProcessResult run = run_stackbound(arguments);
    EXPECT_EQ(run.exit_code, 2) << c.fragment;
    EXPECT_EQ(run.out, "") << c.fragment;
    EXPECT_NE(run.err.find(c.fragment), std::string::npos) << "expected: " << c.fragment << "\nstderr: " << run.err;
  }
  const ProcessResult no_nitrogen =
      run_stackbound({"equilibrium", "--feed", "CH4 + 2 O2", "--temperature", "1900K", "--residence-time", "20ms"});
  EXPECT_EQ(no_nitrogen.exit_code, 2);
  EXPECT_NE(no_nitrogen.err.find("--residence-time = \"20ms\": species: thermal NO needs"), std::string::npos)
      << no_nitrogen.err;
}

}  // namespace
}  // namespace stackbound::cases
