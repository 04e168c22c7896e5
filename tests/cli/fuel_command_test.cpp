// The fuel file reader, and `stackbound fuel` run as a user runs it: the built binary, its stdout,
// stderr and exit code.

#include <string>
#include <vector>

#include <gtest/gtest.h>

#include <nlohmann/json.hpp>

#include "stackbound/cases/fuel_file.hpp"
#include "stackbound/cases/species_file.hpp"
#include "stackbound/core/combustion.hpp"
#include "stackbound/core/fuel_presets.hpp"
#include "tests/support/run_binary.hpp"
#include "tests/support/tolerance.hpp"
#include "stackbound/units/input_error.hpp"

namespace stackbound::cases {
namespace {

using stackbound::testing::is_close;

const core::SpeciesDatabase& db() { return builtin_species(); }

using stackbound::testing::ProcessResult;
using stackbound::testing::run_stackbound;

// ---------------------------------------------------------------------------------------------------
// Fuel files

// Wrong if a fuel file's gas were read differently from the same gas given in the library.
TEST(FuelFile, GasFileGivesTheSameFuelAsTheLibrary) {
  const FuelFile file = parse_fuel_file(
      "fuel:\n  name: site gas\n  gas: {CH4: 93 %, C2H6: 4 %, CO2: 1 %, N2: 2 %}\n  feed_rate: 850 Nm3/h\n"
      "  temperature: 15 degC\n",
      "site.yaml", db());
  core::GasFuelSpec spec;
  spec.composition_percent = {{"CH4", 93.0}, {"C2H6", 4.0}, {"CO2", 1.0}, {"N2", 2.0}};
  const core::Fuel expected = core::Fuel::gas(spec, db());
  EXPECT_EQ(file.fuel.name(), "site gas");
  EXPECT_TRUE(is_close(file.fuel.hhv_J_per_kg(), expected.hhv_J_per_kg(), 1e-14));
  ASSERT_TRUE(file.feed_rate.has_value());
  EXPECT_EQ(file.feed_rate->dimension, units::Dimension::molar_flow);
  ASSERT_TRUE(file.temperature_K.has_value());
  EXPECT_TRUE(is_close(*file.temperature_K, 288.15, 1e-14));
}

// Wrong if an ultimate analysis with its basis, LHV and moisture were misread.
TEST(FuelFile, UltimateAnalysisWithBasisAndLowerHeatingValue) {
  const FuelFile file = parse_fuel_file(
      "fuel:\n  ultimate: {C: 75 %, H: 5 %, O: 6.7 %, N: 1.5 %, S: 2.3 %, ash: 9.5 %, moisture: 8 %}\n"
      "  ultimate_basis: dry\n  heating_value: 30.3 MJ/kg\n  heating_value_basis: LHV\n  specific_heat: 1.3\n",
      "coal.yaml", db());
  core::CondensedFuelSpec spec;
  spec.analysis = {75.0, 5.0, 6.7, 1.5, 2.3, 9.5, 8.0, core::AnalysisBasis::dry};
  spec.heating_value = core::MeasuredHeatingValue{core::HeatingValueKind::lower, 30.3e6, core::AnalysisBasis::dry};
  const core::Fuel expected = core::Fuel::condensed(spec, db());
  EXPECT_TRUE(is_close(file.fuel.hhv_J_per_kg(), expected.hhv_J_per_kg(), 1e-14));
  EXPECT_TRUE(is_close(file.fuel.moisture_mass_fraction(), 0.08, 1e-14));
  EXPECT_TRUE(file.fuel.sensible_heat_known());
}

// Wrong if a blend's parts, fractions or basis were misread.
TEST(FuelFile, BlendByHeatInput) {
  const FuelFile file = parse_fuel_file(
      "fuel:\n  name: cofiring\n  blend_by: heat\n  blend:\n    - {preset: natural_gas, fraction: 30 %}\n"
      "    - {preset: bituminous_coal, fraction: 70 %}\n",
      "blend.yaml", db());
  const core::Fuel expected = core::Fuel::blend(
      "cofiring", {{core::preset_fuel("natural_gas", db()), 30.0}, {core::preset_fuel("bituminous_coal", db()), 70.0}},
      core::BlendBasis::heat_input);
  EXPECT_TRUE(is_close(file.fuel.hhv_J_per_kg(), expected.hhv_J_per_kg(), 1e-14));
  EXPECT_EQ(file.fuel.state(), core::FuelState::blend);
}

// Wrong if file errors lacked the file, line, column and field, or if core errors lost the location.
TEST(FuelFile, ErrorsNameTheFileLineAndField) {
  EXPECT_THROW_WITH(parse_fuel_file("fuel:\n  gas: {CH4: 93 %, C2H6: 4 %}\n", "f.yaml", db()), units::InputError,
                    "f.yaml:2:8: fuel.gas: the mole percentages sum to 97 %");
  EXPECT_THROW_WITH(parse_fuel_file("fuel:\n  gas: {CH4: 90 %, Xe: 10 %}\n", "f.yaml", db()), units::InputError,
                    "f.yaml:2:8: fuel.gas = \"Xe\": unknown species");
  EXPECT_THROW_WITH(parse_fuel_file("fuel:\n  ultimate: {C: 75 %, H: 5 %, O: 20 %}\n", "f.yaml", db()),
                    units::InputError, "fuel.heating_value: missing");
  EXPECT_THROW_WITH(parse_fuel_file("fuel:\n  preset: natural_gas\n  gass: {}\n", "f.yaml", db()), units::InputError,
                    "f.yaml:3:3: fuel: unknown key \"gass\" (did you mean \"gas\"?)");
  EXPECT_THROW_WITH(parse_fuel_file("fuel:\n  preset: coal\n", "f.yaml", db()), units::InputError,
                    "f.yaml:2:11: fuel.preset = \"coal\": unknown fuel preset");
  EXPECT_THROW_WITH(read_fuel_file("/nonexistent/fuel.yaml", db()), units::InputError,
                    "FILE = \"/nonexistent/fuel.yaml\": no such fuel file");
}

// ---------------------------------------------------------------------------------------------------
// The command

// Wrong if the JSON lacked a documented key or printed values other than the library's.
TEST(FuelCommand, JsonCarriesTheDocumentedKeysWithLibraryValues) {
  const ProcessResult run = run_stackbound(
      {"fuel", "--gas", "CH4 93 %, C2H6 4 %, CO2 1 %, N2 2 %", "--excess-air", "15%", "--format", "json"});
  ASSERT_EQ(run.exit_code, 0) << run.err;
  EXPECT_EQ(run.err, "");
  const nlohmann::json json = nlohmann::json::parse(run.out);
  core::GasFuelSpec spec;
  spec.composition_percent = {{"CH4", 93.0}, {"C2H6", 4.0}, {"CO2", 1.0}, {"N2", 2.0}};
  const core::Fuel fuel = core::Fuel::gas(spec, db());
  const core::CombustionResult r = core::burn(fuel, core::Oxidant{}, core::OperatingPoint::with_excess_air(0.15), db());
  EXPECT_TRUE(is_close(json.at("hhv_MJ_per_kg").get<double>(), fuel.hhv_J_per_kg() * 1e-6, 1e-12));
  EXPECT_TRUE(is_close(json.at("lhv_MJ_per_kg").get<double>(), fuel.lhv_J_per_kg() * 1e-6, 1e-12));
  EXPECT_TRUE(is_close(json.at("stoichiometric_air_kg_per_kg").get<double>(), r.stoichiometric_air_kg_per_kg, 1e-12));
  EXPECT_TRUE(is_close(json.at("Fd_dscf_per_MMBtu").get<double>(), r.f_factors.fd_dscf_per_MMBtu(), 1e-12));
  EXPECT_TRUE(is_close(json.at("Fw_wscf_per_MMBtu").get<double>(), r.f_factors.fw_wscf_per_MMBtu(), 1e-12));
  EXPECT_TRUE(is_close(json.at("Fc_scf_per_MMBtu").get<double>(), r.f_factors.fc_scf_per_MMBtu(), 1e-12));
  EXPECT_TRUE(is_close(json.at("water_dew_point_K").get<double>(), *r.water_dew_point_K, 1e-12));
  EXPECT_TRUE(is_close(json.at("flue_gas_dry").at("O2").get<double>(), r.flue_o2_dry, 1e-12));
  EXPECT_TRUE(is_close(json.at("flue_gas_wet").at("H2O").get<double>(), r.moisture_fraction, 1e-12));
  EXPECT_FALSE(json.at("flue_gas_dry").contains("H2O"));
  double sum = 0.0;
  for (const auto& item : json.at("flue_gas_wet").items()) sum += item.value().get<double>();
  EXPECT_TRUE(is_close(sum, 1.0, 1e-12));
}

// Wrong if --flue-o2 did not solve for the excess air, or --rate were not resolved.
TEST(FuelCommand, FlueO2AndRate) {
  const ProcessResult run = run_stackbound(
      {"fuel", "--preset", "natural_gas", "--flue-o2", "3 %", "--rate", "25 MMBtu/h", "--format", "json"});
  ASSERT_EQ(run.exit_code, 0) << run.err;
  const nlohmann::json json = nlohmann::json::parse(run.out);
  EXPECT_TRUE(is_close(json.at("flue_gas_dry").at("O2").get<double>(), 0.03, 1e-10));
  EXPECT_TRUE(is_close(json.at("feed").at("heat_input_hhv_MW").get<double>(), 25.0 * 1.05505585262e9 / 3600.0 * 1e-6, 1e-12));
}

// Wrong if the text output lost its units, the closing caution, or the preset's source.
TEST(FuelCommand, TextShowsUnitsSourceAndCaution) {
  const ProcessResult run = run_stackbound({"fuel", "--preset", "wood_chips", "--excess-air", "40%"});
  ASSERT_EQ(run.exit_code, 0) << run.err;
  for (const char* fragment : {"MJ/kg", "kg/kg", "Nm3/kg fuel", "dscf/MMBtu", "m3/GJ", "degC",
                               "typical values for clean wood chips", "complete-combustion estimates",
                               "licensed practice govern"}) {
    EXPECT_NE(run.out.find(fragment), std::string::npos) << fragment;
  }
}

// Wrong if the certificate notation of --gas and --ultimate did not give the fuel of the same
// percentages in the library.
TEST(FuelCommand, AnalysisNotationGivesTheLibraryFuel) {
  const ProcessResult gas = run_stackbound({"fuel", "--gas", "CH4 95%, C2H6 3 %, N2 2 %", "--format", "json"});
  ASSERT_EQ(gas.exit_code, 0) << gas.err;
  core::GasFuelSpec spec;
  spec.composition_percent = {{"CH4", 95.0}, {"C2H6", 3.0}, {"N2", 2.0}};
  const core::Fuel expected_gas = core::Fuel::gas(spec, db());
  EXPECT_TRUE(is_close(nlohmann::json::parse(gas.out).at("hhv_MJ_per_kg").get<double>(),
                       expected_gas.hhv_J_per_kg() * 1e-6, 1e-12));

  const ProcessResult solid =
      run_stackbound({"fuel", "--ultimate", "C 75 %, H 5 %, N 1.5 %, S 2.3 %, ash 9.5 %, moisture 8 %",
                      "--analysis-basis", "dry", "--hhv", "31.4 MJ/kg", "--format", "json"});
  ASSERT_EQ(solid.exit_code, 0) << solid.err;
  core::CondensedFuelSpec condensed;
  condensed.analysis.basis = core::AnalysisBasis::dry;
  condensed.analysis.carbon_percent = 75.0;
  condensed.analysis.hydrogen_percent = 5.0;
  condensed.analysis.nitrogen_percent = 1.5;
  condensed.analysis.sulfur_percent = 2.3;
  condensed.analysis.ash_percent = 9.5;
  condensed.analysis.moisture_percent = 8.0;
  condensed.heating_value =
      core::MeasuredHeatingValue{core::HeatingValueKind::higher, 31.4e6, core::AnalysisBasis::dry};
  const core::Fuel expected_solid = core::Fuel::condensed(condensed, db());
  const nlohmann::json json = nlohmann::json::parse(solid.out);
  EXPECT_TRUE(is_close(json.at("hhv_MJ_per_kg").get<double>(), expected_solid.hhv_J_per_kg() * 1e-6, 1e-12));
  EXPECT_TRUE(is_close(json.at("fuel").at("as_fired_mass_percent").at("moisture").get<double>(), 8.0, 1e-12));
  EXPECT_TRUE(is_close(json.at("fuel").at("as_fired_mass_percent").at("O").get<double>(),
                       expected_solid.as_fired_analysis().oxygen_percent, 1e-12));
}

// Wrong if bad input ran on, crashed, or failed without naming the field.
TEST(FuelCommand, BadInputExitsWithCodeTwoNamingTheField) {
  struct Case {
    std::vector<std::string> arguments;
    const char* fragment;
  };
  const Case cases[] = {
      {{"fuel", "--gas", "CH4 80 %, C2H6 4 %"}, "--gas: the mole percentages sum to 84 %"},
      {{"fuel", "--gas", "CH4 96 %, Ethane 4 %"},
       "--gas = \"CH4 96 %, Ethane 4 %\": item 2 \"Ethane 4 %\" (column 11): unknown species \"Ethane\""},
      {{"fuel", "--gas", "CH4 96 %, c2h6 4 %"}, "unknown species \"c2h6\"; did you mean \"C2H6\"?"},
      {{"fuel", "--gas", "CH4 104 %, N2 0 %"}, "--gas.CH4 = 104 %: must be <= 100 %"},
      {{"fuel", "--gas", "CH4 95 %, N2 -5 %"}, "the percentage \"-5\" is negative"},
      {{"fuel", "--gas", "CH4 95, N2 5 %"}, "item 1 \"CH4 95\" (column 1): the \"%\" is missing: write \"CH4 95 %\""},
      {{"fuel", "--gas", "CH4 95 %, N2 5 %,"}, "item 3 is empty: nothing after the last \",\""},
      {{"fuel", "--gas", "CH4 95 %, N2 3 %, CH4 2 %"}, "CH4 is already item 1"},
      {{"fuel", "--gas", "C(gr) 100 %"}, "C(gr) is a condensed species"},
      {{"fuel", "--gas", "CH4=95, C2H6=3, N2=2"},
       "--gas = \"CH4=95, C2H6=3, N2=2\": the NAME=PERCENT form is not accepted; write \"CH4 95 %, C2H6 3 %, N2 2 %\""},
      {{"fuel", "--gas", "CH4 100 %", "--flue-o2", "21%"}, "--flue-o2 = 21 % (dry): the flue O2 must be"},
      {{"fuel", "--ultimate", "C 75 %, H 5 %, O 20 %"}, "--ultimate: a liquid or solid fuel needs a heating value"},
      {{"fuel", "--ultimate", "C 75 %, H 5 %, O 30 %", "--estimate", "boie"},
       "ultimate-analysis percentages (C, H, O, N, S, ash, moisture) sum to 110 %"},
      {{"fuel", "--ultimate", "C=75, H=5, O=20", "--estimate", "boie"},
       "--ultimate = \"C=75, H=5, O=20\": the NAME=PERCENT form is not accepted; write \"C 75 %, H 5 %, O 20 %\""},
      {{"fuel", "--ultimate", "C 75 %, Ash 5 %, O 20 %", "--estimate", "boie"},
       "item 2 \"Ash 5 %\" (column 9): unknown component \"Ash\"; did you mean \"ash\"?"},
      {{"fuel", "--preset", "bituminous_coal", "--rate", "100 Nm3/h"}, "--rate = \"100 Nm3/h\""},
      {{"fuel"}, "give exactly one fuel"},
  };
  for (const Case& c : cases) {
    const ProcessResult run = run_stackbound(c.arguments);
    EXPECT_EQ(run.exit_code, 2) << c.fragment;
    EXPECT_NE(run.err.find(c.fragment), std::string::npos) << run.err;
    EXPECT_EQ(run.out, "");
  }
}

}  // namespace
}  // namespace stackbound::cases
