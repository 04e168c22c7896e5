// `stackbound species` run as a user runs it: the built binary, its stdout, stderr and exit code.

#include <sys/wait.h>
#include <unistd.h>

#include <array>
#include <cstdio>
#include <cstdlib>
#include <filesystem>
#include <fstream>
#include <iterator>
#include <map>
#include <sstream>
#include <string>
#include <vector>

#include <gtest/gtest.h>

#include <nlohmann/json.hpp>

#include "stackbound/cases/species_file.hpp"
#include "tests/support/run_binary.hpp"
#include "tests/support/tolerance.hpp"
#include "stackbound/units/constants.hpp"
#include "stackbound/units/quantity_parser.hpp"

namespace stackbound::cases {
namespace {

using stackbound::testing::is_close;
using stackbound::testing::ProcessResult;
using stackbound::testing::run_stackbound;

// Wrong if the command printed values other than the library's (unit slip, wrong key, wrong
// temperature parsing, rounding in the JSON output).
TEST(SpeciesCommand, JsonValuesAreTheLibraryValues) {
  struct Case {
    const char* name;
    const char* temperature_text;
    double temperature_K;
  };
  const Case cases[] = {
      {"CO2", "1500 K", 1500.0}, {"NO", "2000K", 2000.0},     {"H2O", "1500 degC", 1773.15}, {"OH", "3000 K", 3000.0},
      {"C(gr)", "800 K", 800.0}, {"SO2", "298.15 K", 298.15},  // a 300 K record at the standard-temperature allowance
  };
  constexpr double R = units::kGasConstant_J_per_mol_K;
  for (const Case& c : cases) {
    const ProcessResult run = run_stackbound({"species", c.name, "--temperature", c.temperature_text, "--format", "json"});
    ASSERT_EQ(run.exit_code, 0) << c.name << ": " << run.err;
    EXPECT_EQ(run.err, "");
    const nlohmann::json json = nlohmann::json::parse(run.out);
    const core::Species& species = builtin_species().at(c.name);
    const double T = c.temperature_K;
    EXPECT_EQ(json.at("name").get<std::string>(), c.name);
    EXPECT_TRUE(is_close(json.at("temperature_K").get<double>(), T, 1e-14)) << c.name;
    // JSON numbers are written with round-trip precision, so only arithmetic rounding may differ.
    EXPECT_TRUE(is_close(json.at("cp_J_per_mol_K").get<double>(), R * species.cp_over_R(units::kelvin(T)), 1e-12))
        << c.name;
    EXPECT_TRUE(is_close(json.at("h_J_per_mol").get<double>(), R * T * species.h_over_RT(units::kelvin(T)), 1e-12))
        << c.name;
    EXPECT_TRUE(is_close(json.at("s_J_per_mol_K").get<double>(), R * species.s_over_R(units::kelvin(T)), 1e-12))
        << c.name;
    EXPECT_TRUE(is_close(json.at("g_J_per_mol").get<double>(), R * T * species.g_over_RT(units::kelvin(T)), 1e-12))
        << c.name;
    // And g = h - T s holds in what the user reads.
    EXPECT_TRUE(is_close(json.at("g_J_per_mol").get<double>(),
                         json.at("h_J_per_mol").get<double>() - T * json.at("s_J_per_mol_K").get<double>(), 1e-9, 1e-6))
        << c.name;
  }
}

// Wrong if the default temperature were not the standard temperature 298.15 K.
TEST(SpeciesCommand, DefaultTemperatureIsTheStandardTemperature) {
  const ProcessResult run = run_stackbound({"species", "CO2", "--format", "json"});
  ASSERT_EQ(run.exit_code, 0) << run.err;
  const nlohmann::json json = nlohmann::json::parse(run.out);
  EXPECT_TRUE(is_close(json.at("temperature_K").get<double>(), 298.15, 1e-14));
  EXPECT_TRUE(is_close(json.at("pressure_Pa").get<double>(), 1e5, 1e-14));
}

// Wrong if the listing lost species, or printed a molar mass, range or source other than the data's.
TEST(SpeciesCommand, TextListingShowsEverySpeciesWithMolarMassRangeAndSource) {
  const ProcessResult run = run_stackbound({"species"});
  ASSERT_EQ(run.exit_code, 0) << run.err;
  std::map<std::string, std::vector<std::string>> lines;  // formula -> the other columns
  std::istringstream stream(run.out);
  std::string line;
  while (std::getline(stream, line)) {
    std::istringstream words(line);
    std::string formula;
    words >> formula;
    if (builtin_species().find(formula) == nullptr) continue;  // header and footer
    std::vector<std::string>& columns = lines[formula];
    for (std::string word; words >> word;) columns.push_back(word);
  }
  EXPECT_EQ(lines.size(), 40u);
  EXPECT_NE(run.out.find("40 species."), std::string::npos);
  for (const core::Species& species : builtin_species().all()) {
    ASSERT_EQ(lines.count(species.formula()), 1u) << species.formula();
    const std::vector<std::string>& columns = lines.at(species.formula());
    ASSERT_EQ(columns.size(), 5u) << species.formula();  // M, T_low, T_high, phase, source
    EXPECT_TRUE(is_close(std::stod(columns[0]), species.molar_mass_kg_per_mol() * 1e3, 0.0, 5e-6)) << species.formula();
    EXPECT_TRUE(is_close(std::stod(columns[1]), species.range().low.value(), 0.0, 5e-3)) << species.formula();
    EXPECT_TRUE(is_close(std::stod(columns[2]), species.range().high.value(), 0.0, 5e-3)) << species.formula();
    EXPECT_EQ(columns[3], species.is_gas() ? "gas" : "condensed");
    EXPECT_EQ(columns[4], species.source());
  }
}

// Wrong if the JSON listing lost a species or a field a program reading it needs.
TEST(SpeciesCommand, JsonListingHasEverySpeciesWithMolarMassRangeAndSource) {
  const ProcessResult run = run_stackbound({"species", "--format", "json"});
  ASSERT_EQ(run.exit_code, 0) << run.err;
  const nlohmann::json list = nlohmann::json::parse(run.out);
  ASSERT_TRUE(list.is_array());
  ASSERT_EQ(list.size(), 40u);
  for (const nlohmann::json& entry : list) {
    const core::Species& species = builtin_species().at(entry.at("name").get<std::string>());
    EXPECT_TRUE(is_close(entry.at("molar_mass_g_per_mol").get<double>(), species.molar_mass_kg_per_mol() * 1e3, 1e-14));
    const auto range = entry.at("temperature_range_K").get<std::vector<double>>();
    ASSERT_EQ(range.size(), 3u);
    EXPECT_TRUE(is_close(range[0], species.range().low.value(), 1e-14));
    EXPECT_TRUE(is_close(range[2], species.range().high.value(), 1e-14));
    EXPECT_EQ(entry.at("source").get<std::string>(), species.source());
    EXPECT_FALSE(entry.at("composition").empty());
  }
}

// Wrong if a mistyped name gave output, exit code 0, or a message without a suggestion.
TEST(SpeciesCommand, UnknownNameFailsWithTheMessageOnStderr) {
  const ProcessResult run = run_stackbound({"species", "co2"});
  EXPECT_EQ(run.exit_code, 2);
  EXPECT_EQ(run.out, "");
  EXPECT_NE(run.err.find("stackbound: error: NAME = \"co2\": unknown species; did you mean \"CO2\"?"),
            std::string::npos)
      << run.err;
}

// Wrong if a bad temperature reached the thermodynamics or failed without the parser's message.
TEST(SpeciesCommand, BadTemperatureFailsWithTheParserMessage) {
  const ProcessResult wrong_unit = run_stackbound({"species", "CO2", "--temperature", "5 kg"});
  EXPECT_EQ(wrong_unit.exit_code, 2);
  EXPECT_EQ(wrong_unit.out, "");
  EXPECT_NE(wrong_unit.err.find("--temperature = \"5 kg\": \"kg\" is a mass; expected a temperature"),
            std::string::npos)
      << wrong_unit.err;

  const ProcessResult outside = run_stackbound({"species", "CO2", "--temperature", "4000 K"});
  EXPECT_EQ(outside.exit_code, 2);
  EXPECT_NE(outside.err.find("species CO2: temperature 4000 K is outside its data range 200-3500 K"), std::string::npos)
      << outside.err;

  const ProcessResult no_name = run_stackbound({"species", "--temperature", "1500 K"});
  EXPECT_NE(no_name.exit_code, 0);
  EXPECT_NE(no_name.err.find("--temperature needs a species NAME"), std::string::npos) << no_name.err;
}

}  // namespace
}  // namespace stackbound::cases
