// The main job end to end: every demo case in every format, the JSON contract, the wording and
// cautions, and the runner against the same computation made by hand through the library.

#include "stackbound/cases/pipeline.hpp"

#include <filesystem>
#include <fstream>
#include <regex>
#include <string>

#include <gtest/gtest.h>

#include <nlohmann/json.hpp>

#include "stackbound/cases/case_file.hpp"
#include "stackbound/cases/run_document.hpp"
#include "stackbound/cases/species_file.hpp"
#include "stackbound/core/fuel_presets.hpp"
#include "stackbound/emissions/cautions.hpp"
#include "tests/support/run_binary.hpp"
#include "tests/support/tolerance.hpp"

namespace stackbound::cases {
namespace {

namespace fs = std::filesystem;
using stackbound::testing::is_close;
using stackbound::testing::run_stackbound;

const char* const kExamples[] = {"gas_boiler.yaml", "oil_heater.yaml", "wood_chip_boiler.yaml", "gas_turbine.yaml"};

std::string example(const char* name) { return std::string(STACKBOUND_SOURCE_DIR) + "/cases/examples/" + name; }

// Wrong if a demo case failed in any format, or the JSON lost a contract key (other tools read them).
TEST(Runner, EveryExampleRunsInEveryFormat) {
  for (const char* name : kExamples) {
    for (const char* format : {"text", "json", "csv", "html"}) {
      const auto run = run_stackbound({"run", example(name), "--format", format});
      ASSERT_EQ(run.exit_code, 0) << name << " " << format << ": " << run.err;
      EXPECT_NE(run.out.find(kBoundStatement), std::string::npos) << name << " " << format;
      if (std::string(format) == "json") {
        const nlohmann::json json = nlohmann::json::parse(run.out);
        for (const char* key : {"case", "firing", "equilibrium", "emissions", "reference_o2_percent", "cautions"}) {
          EXPECT_TRUE(json.contains(key)) << name << ": " << key;
        }
        EXPECT_TRUE(json["firing"].contains("temperature_K"));
        EXPECT_TRUE(json["firing"].contains("pressure_Pa"));
        EXPECT_TRUE(json["equilibrium"]["mole_fractions"].is_object());
        for (const char* pollutant : {"CO", "NO", "NOx"}) {
          for (const char* key : {"ppmvd", "ppmvd_at_ref_o2", "mg_per_Nm3_at_ref_o2", "kg_per_h", "lb_per_MMBtu"}) {
            EXPECT_TRUE(json["emissions"][pollutant][key].is_number()) << name << ": " << pollutant << "." << key;
          }
        }
        EXPECT_TRUE(json["cautions"].is_array());
        EXPECT_GE(json["cautions"].size(), 8u);
      }
    }
  }
}

// Wrong if the HTML report (the one that goes into a memo) lost the bound wording or any caution.
TEST(Runner, HtmlReportCarriesTheBoundWordingAndEveryCaution) {
  const auto run = run_stackbound({"run", example("wood_chip_boiler.yaml"), "--format", "html"});
  ASSERT_EQ(run.exit_code, 0) << run.err;
  EXPECT_EQ(run.out.rfind("<!DOCTYPE html>", 0), 0u);
  EXPECT_NE(run.out.find("equilibrium bound at the stated firing conditions"), std::string::npos);
  EXPECT_EQ(run.out.find("<script"), std::string::npos) << "the page must be self-contained and script-free";
  for (const emissions::Caution c : emissions::standard_cautions()) {
    EXPECT_NE(run.out.find(std::string(emissions::caution(c).text).substr(0, 60)), std::string::npos)
        << emissions::caution(c).key;
  }
  // The wood-chip example uses the IED solid-fuel preset: the "confirm against your permit" caution must show.
  EXPECT_NE(run.out.find("confirm against your permit"), std::string::npos);
}

// Wrong if --output wrote something other than what stdout shows, or left a temporary file.
TEST(Runner, OutputFileHoldsExactlyTheReport) {
  const fs::path output = fs::temp_directory_path() / ("stackbound_runner_test_" + std::to_string(::getpid()) + ".csv");
  const auto to_file = run_stackbound({"run", example("gas_boiler.yaml"), "--format", "csv", "--output", output.string()});
  const auto to_stdout = run_stackbound({"run", example("gas_boiler.yaml"), "--format", "csv"});
  ASSERT_EQ(to_file.exit_code, 0) << to_file.err;
  std::ifstream in(output);
  const std::string written((std::istreambuf_iterator<char>(in)), std::istreambuf_iterator<char>());
  // The two runs may fall in different seconds: only their provenance's run time may differ.
  const std::regex run_time(R"(\d{4}-\d\d-\d\dT\d\d:\d\d:\d\dZ)");
  EXPECT_EQ(std::regex_replace(written, run_time, "RUN_AT"), std::regex_replace(to_stdout.out, run_time, "RUN_AT"));
  EXPECT_FALSE(fs::exists(output.string() + ".partial"));
  fs::remove(output);
}

// Wrong if the runner wired a step differently from the library it claims to use: the same case
// computed by hand through core/ and emissions/ must give identical numbers.
TEST(Runner, CaseFileAndLibraryCallsGiveIdenticalNumbers) {
  const CaseDefinition definition = load_case(example("oil_heater.yaml"));
  const core::SpeciesDatabase& db = builtin_species();
  const RunResult run = run_case(definition, db);

  const core::Fuel fuel = core::preset_fuel("distillate_oil_no2", db);
  core::OxidantOptions air;
  air.temperature = units::kelvin(293.15);
  air.humidity = core::Humidity::relative(0.70, units::kelvin(293.15), units::pascals(101325.0));
  const core::Oxidant oxidant(air);
  core::OperatingPoint op = core::OperatingPoint::with_flue_o2(0.035, core::GasBasis::dry);
  op.fuel_temperature = units::kelvin(313.15);
  const core::CombustionResult combustion = core::burn(fuel, oxidant, op, db);
  core::ElementAmounts elements;
  elements.moles = combustion.reactant_element_mol_per_kg;
  const core::EquilibriumSolver solver(db, elements);
  const core::EquilibriumResult eq = solver.solve_tp(elements, units::kelvin(1620.0), units::pascals(101325.0));
  const core::FuelFeed feed = core::resolve_feed(fuel, "0.65 t/h");
  emissions::StackEmissionInput input{
      .pollutant = emissions::pollutant_by_name("NOx", "test"),
      .pollutant_wet_fraction = eq.mole_fraction("NO") + eq.mole_fraction("NO2"),
      .h2o_wet_fraction = eq.mole_fraction("H2O"),
      .o2_wet_fraction = eq.mole_fraction("O2"),
      .co2_wet_fraction = eq.mole_fraction("CO2"),
      .wet_flue_gas_flow = units::moles_per_second(eq.total_gas_moles * feed.mass_flow_kg_per_s),
      .heat_input = units::watts(feed.heat_input_hhv_W),
      .fd = emissions::FFactor::from_scm_per_J(emissions::FFactorKind::dry, combustion.f_factors.fd_m3_per_J),
      .reference_o2_dry_fraction = 0.03,
      .normal = &units::normal_20C(),
      .o2_basis = emissions::O2Basis::us_epa_20_9,
      .operating_hours_per_year = 7500.0,
  };
  const emissions::StackEmission by_hand = emissions::evaluate_stack_emission(input);

  const auto nox = std::find_if(run.emissions.pollutants.begin(), run.emissions.pollutants.end(), [](const auto& p) { return p.name == "NOx"; });
  ASSERT_NE(nox, run.emissions.pollutants.end());
  EXPECT_TRUE(is_close(run.fired.temperature_K, eq.temperature_K, 0.0));
  EXPECT_TRUE(is_close(nox->emission.ppmvd.value(), by_hand.ppmvd.value(), 0.0));
  EXPECT_TRUE(is_close(nox->emission.ppmvd_at_reference.value(), by_hand.ppmvd_at_reference.value(), 0.0));
  EXPECT_TRUE(is_close(nox->emission.mg_per_Nm3_at_reference.result.value(),
                       by_hand.mg_per_Nm3_at_reference.result.value(), 0.0));
  EXPECT_TRUE(is_close(nox->emission.mass_rate.value(), by_hand.mass_rate.value(), 0.0));
  EXPECT_TRUE(is_close(nox->emission.method19.lb_per_MMBtu(), by_hand.method19.lb_per_MMBtu(), 0.0));
}

// Wrong if the JSON printed by the program differed from the library's numbers (rounding, unit slips).
TEST(Runner, JsonOutputEqualsTheLibraryResult) {
  const RunResult run = run_case(load_case(example("gas_boiler.yaml")), builtin_species());
  const auto printed = run_stackbound({"run", example("gas_boiler.yaml"), "--format", "json"});
  ASSERT_EQ(printed.exit_code, 0) << printed.err;
  const nlohmann::json json = nlohmann::json::parse(printed.out);
  for (const PollutantBound& p : run.emissions.pollutants) {
    EXPECT_TRUE(is_close(json["emissions"][p.name]["ppmvd_at_ref_o2"].get<double>(),
                         p.emission.ppmvd_at_reference.value(), 1e-15));
    EXPECT_TRUE(is_close(json["emissions"][p.name]["kg_per_h"].get<double>(), p.emission.mass_rate.value() * 3600.0,
                         1e-15));
  }
  EXPECT_TRUE(is_close(json["firing"]["temperature_K"].get<double>(), 1750.0, 1e-15));
  EXPECT_TRUE(is_close(json["reference_o2_percent"].get<double>(), 3.0, 1e-15));
}

// Wrong if the two routes to lb/MMBtu disagreed for plain (humid) air: Method 19 with the fuel's Fd
// and the mass balance describe the same flue gas, so they must agree closely (Fd is defined with
// dry air; humidity leaves the dry basis unchanged).
TEST(Runner, Method19AndMassBalanceAgreeForAir) {
  const RunResult run = run_case(load_case(example("gas_boiler.yaml")), builtin_species());
  for (const PollutantBound& p : run.emissions.pollutants) {
    EXPECT_TRUE(is_close(p.emission.method19.kg_per_J, p.emission.direct.kg_per_J, 0.01)) << p.name;
  }
}

// Wrong if a measured CO far above the equilibrium bound were not flagged as incomplete combustion.
TEST(Runner, MeasuredCoFarAboveTheBoundIsFlaggedAsIncompleteCombustion) {
  const RunResult run = run_case(load_case(example("wood_chip_boiler.yaml")), builtin_species());
  const auto co = std::find_if(run.screening.measured.begin(), run.screening.measured.end(), [](const auto& m) { return m.quantity == "CO"; });
  ASSERT_NE(co, run.screening.measured.end());
  EXPECT_GT(co->measured, kCoAboveBoundFactor * co->model);
  EXPECT_NE(co->finding.find("incomplete combustion"), std::string::npos);
}

// Wrong if a measured O2 that the stated operating point cannot give went unflagged, or a
// consistent one were flagged.
TEST(Runner, MeasuredO2InconsistentWithTheOperatingPointIsFlagged) {
  std::ifstream in(example("gas_boiler.yaml"));
  std::string text((std::istreambuf_iterator<char>(in)), std::istreambuf_iterator<char>());
  const RunResult consistent = run_case(parse_case(text, "gas_boiler.yaml"), builtin_species());
  ASSERT_FALSE(consistent.screening.measured.empty());
  EXPECT_EQ(consistent.screening.measured.front().quantity, "O2");
  EXPECT_EQ(consistent.screening.measured.front().finding, "");
  text.replace(text.find("o2: 3.0 %, dry"), 14, "o2: 6.0 %, dry");
  const RunResult inconsistent = run_case(parse_case(text, "gas_boiler.yaml"), builtin_species());
  EXPECT_NE(inconsistent.screening.measured.front().finding.find("differs from the"), std::string::npos);
}

}  // namespace
}  // namespace stackbound::cases
