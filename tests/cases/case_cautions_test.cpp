// The cautions a run, a sweep and a comparison carry: each where it applies, once.

#include <gtest/gtest.h>

#include <algorithm>
#include <set>
#include <string>
#include <vector>

#include "stackbound/cases/case_file.hpp"
#include "stackbound/cases/comparison.hpp"
#include "stackbound/cases/input_file.hpp"
#include "stackbound/cases/pipeline.hpp"
#include "stackbound/cases/species_file.hpp"
#include "stackbound/cases/sweep.hpp"

namespace stackbound::cases {
namespace {

namespace em = stackbound::emissions;

std::string example(const char* name) { return std::string(STACKBOUND_SOURCE_DIR) + "/cases/examples/" + name; }

bool carries(const RunResult& run, std::string_view key) {
  const std::vector<std::string>& keys = run.screening.caution_keys;
  return std::find(keys.begin(), keys.end(), key) != keys.end();
}

// Wrong if a caution were printed twice, or its text and key lists fell out of step.
TEST(CaseCautions, EachCautionOnceWithItsKey) {
  for (const char* name : {"gas_boiler.yaml", "oil_heater.yaml", "wood_chip_boiler.yaml", "gas_turbine.yaml"}) {
    const RunResult run = run_case(load_case(example(name)), builtin_species());
    const std::vector<std::string>& keys = run.screening.caution_keys;
    EXPECT_EQ(std::set<std::string>(keys.begin(), keys.end()).size(), keys.size()) << name;
    ASSERT_EQ(run.screening.cautions.size(), keys.size()) << name;
    for (std::size_t i = 0; i < keys.size(); ++i) {
      const auto entry = std::find_if(em::all_cautions().begin(), em::all_cautions().end(),
                                      [&](const em::CautionText& c) { return c.key == keys[i]; });
      ASSERT_NE(entry, em::all_cautions().end()) << keys[i];
      EXPECT_EQ(run.screening.cautions[i], entry->text) << name;
    }
    // Every run reports kg/h and t/yr figures of the bound.
    EXPECT_TRUE(carries(run, "not_potential_to_emit")) << name;
  }
}

// Wrong if the fuel-nitrogen caution were missing for a fuel with bound nitrogen (wood), or shown
// for natural gas, whose nitrogen is N2 and forms no fuel NO.
TEST(CaseCautions, FuelNitrogenOnlyForAFuelWithBoundNitrogen) {
  const RunResult wood = run_case(load_case(example("wood_chip_boiler.yaml")), builtin_species());
  EXPECT_GT(wood.post_flame.fuel_nitrogen.no.fuel_nitrogen_mol_per_kg, 0.0);
  EXPECT_TRUE(carries(wood, "fuel_nitrogen_unbounded"));
  const RunResult gas = run_case(load_case(example("gas_boiler.yaml")), builtin_species());
  EXPECT_EQ(gas.post_flame.fuel_nitrogen.no.fuel_nitrogen_mol_per_kg, 0.0);
  EXPECT_FALSE(carries(gas, "fuel_nitrogen_unbounded"));
}

// Wrong if a gas turbine without its primary zone were not told it needs one, or one with it were.
TEST(CaseCautions, GasTurbineWithoutPrimaryZoneIsToldItNeedsOne) {
  const RunResult with_zone = run_case(load_case(example("gas_turbine.yaml")), builtin_species());
  EXPECT_FALSE(carries(with_zone, "primary_zone_needed"));
  std::string text = read_input_file(example("gas_turbine.yaml"), "case", "case file");
  const std::string zone = "  primary_zone:\n    equivalence_ratio: 0.6\n    residence_time: 8 ms\n";
  ASSERT_NE(text.find(zone), std::string::npos);
  text.erase(text.find(zone), zone.size());
  const RunResult without = run_case(parse_case(text, "gas_turbine.yaml"), builtin_species());
  EXPECT_TRUE(carries(without, "primary_zone_needed"));
  EXPECT_EQ(em::caution(em::Caution::primary_zone_needed).text,
            "A gas turbine forms its NO in the primary zone, far hotter than the mixed gas of the stated firing "
            "conditions; without that zone (firing.primary_zone) the estimate follows the mixed gas only and can lie "
            "far below the turbine's NOx. State the primary zone from the combustor's data.");
  // A boiler is no gas turbine.
  const RunResult boiler = run_case(load_case(example("gas_boiler.yaml")), builtin_species());
  EXPECT_FALSE(carries(boiler, "primary_zone_needed"));
}

// Wrong if the CO caution appeared where no CO is reported, or were missing where it is.
TEST(CaseCautions, CoCautionOnlyWhenCoIsReported) {
  const RunResult turbine = run_case(load_case(example("gas_turbine.yaml")), builtin_species());
  const RunResult boiler = run_case(load_case(example("gas_boiler.yaml")), builtin_species());
  const auto reports_co = [](const RunResult& run) {
    const auto& p = run.definition.report.pollutants;
    return std::any_of(p.begin(), p.end(), [](const em::Pollutant& x) { return x.name == "CO"; });
  };
  EXPECT_EQ(carries(turbine, "co_well_mixed_only"), reports_co(turbine));
  EXPECT_TRUE(reports_co(boiler));
  EXPECT_TRUE(carries(boiler, "co_well_mixed_only"));
}

// Wrong if a sweep of excess air at a stated firing temperature did not say that the temperature
// stays fixed, or a sweep at the adiabatic temperature (which follows the change) said it.
TEST(CaseCautions, SweepAtAStatedFiringTemperatureSaysTheTemperatureStaysFixed) {
  const auto has_fixed = [](const std::vector<em::Caution>& cautions) {
    return std::find(cautions.begin(), cautions.end(), em::Caution::sweep_fixed_temperature) != cautions.end();
  };
  const CaseDefinition stated = load_case(example("gas_boiler.yaml"));
  EXPECT_TRUE(has_fixed(sweep_cautions(stated, {parse_vary("excess_air=5%:45%:9")})));
  EXPECT_FALSE(has_fixed(sweep_cautions(stated, {parse_vary("firing_temperature=1500K:1900K:3")})));
  const CaseDefinition adiabatic = load_case(example("wood_chip_boiler.yaml"));
  EXPECT_FALSE(has_fixed(sweep_cautions(adiabatic, {parse_vary("air_preheat=20degC:320degC:7")})));
  EXPECT_EQ(sweep_cautions(adiabatic, {parse_vary("air_preheat=20degC:320degC:7")}).size(),
            em::standard_cautions().size());
}

// Wrong if a comparison printed only the first case's cautions (the second one's fuel nitrogen
// caution lost) or printed one twice.
TEST(CaseCautions, ComparisonCarriesTheCautionsOfEveryCaseOnce) {
  const Comparison c = compare({example("gas_boiler.yaml"), example("wood_chip_boiler.yaml")}, builtin_species());
  const std::string fuel_n(em::caution(em::Caution::fuel_nitrogen_unbounded).text);
  EXPECT_EQ(std::count(c.cautions.begin(), c.cautions.end(), fuel_n), 1);
  EXPECT_EQ(std::set<std::string>(c.cautions.begin(), c.cautions.end()).size(), c.cautions.size());
}

}  // namespace
}  // namespace stackbound::cases
