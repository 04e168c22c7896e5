// The post-flame stage of a run (cases/stage_post_flame.hpp): its estimate and ceiling beside the
// equilibrium bound, wired into run_case() and kept by sweeps that do not reach it.

#include "stackbound/cases/stage_post_flame.hpp"

#include <stdexcept>
#include <string>
#include <vector>

#include <gtest/gtest.h>
#include <nlohmann/json.hpp>

#include "stackbound/cases/case_file.hpp"
#include "stackbound/core/adiabatic_flame.hpp"
#include "stackbound/cases/pipeline.hpp"
#include "stackbound/cases/source_map.hpp"
#include "stackbound/cases/species_file.hpp"
#include "stackbound/cases/sweep.hpp"
#include "stackbound/units/input_error.hpp"
#include "tests/support/run_binary.hpp"
#include "tests/support/tolerance.hpp"

namespace stackbound::cases {
namespace {

using stackbound::testing::is_close;

std::string example(const char* name) { return std::string(STACKBOUND_SOURCE_DIR) + "/cases/examples/" + name; }

const PollutantBound& pollutant(const RunResult& run, std::string_view name) {
  for (const PollutantBound& p : run.emissions.pollutants) {
    if (p.name == name) return p;
  }
  throw std::runtime_error("pollutant not reported: " + std::string(name));
}

// Wrong if an estimate exceeded its ceiling on any basis of any example (the ceiling would then not be
// one), or a pollutant the stage covers had no estimate or ceiling.
TEST(PostFlameStage, EstimateIsAtMostTheCeilingInEveryExample) {
  for (const char* name : {"gas_boiler.yaml", "gas_turbine.yaml", "oil_heater.yaml", "wood_chip_boiler.yaml"}) {
    const RunResult run = run_case(load_case(example(name)), builtin_species());
    for (const char* species : {"CO", "NO", "NOx"}) {
      const PollutantBound& p = pollutant(run, species);
      ASSERT_TRUE(p.estimate.has_value() && p.ceiling.has_value()) << name << " " << species;
      EXPECT_LE(p.estimate->wet_mole_fraction, p.ceiling->wet_mole_fraction) << name << " " << species;
      EXPECT_LE(p.estimate->emission.ppmvd_at_reference.value(), p.ceiling->emission.ppmvd_at_reference.value())
          << name << " " << species;
      EXPECT_LE(p.estimate->emission.mass_rate.value(), p.ceiling->emission.mass_rate.value()) << name << " " << species;
      EXPECT_GE(p.estimate->wet_mole_fraction, 0.0) << name << " " << species;
    }
  }
}

// Wrong if thermal NO over 20 ms at 1750 K came out near the equilibrium NO of the natural-gas boiler:
// NO forms slowly at that temperature, so the kinetic estimate must lie far (here over 10 times) below
// the bound. Also wrong if natural gas (no fuel-bound nitrogen) were given fuel NO, or the bound moved.
TEST(PostFlameStage, GasBoilerNoEstimateIsWellBelowTheBound) {
  const CaseDefinition definition = load_case(example("gas_boiler.yaml"));
  const RunResult run = run_case(definition, builtin_species());
  const PollutantBound& no = pollutant(run, "NO");
  ASSERT_TRUE(no.estimate.has_value());
  EXPECT_LT(no.estimate->emission.ppmvd_at_reference.value(), 0.1 * no.emission.ppmvd_at_reference.value());
  EXPECT_GT(no.estimate->wet_mole_fraction, 0.0);
  EXPECT_EQ(run.post_flame.fuel_nitrogen.origin, ConversionOrigin::no_fuel_nitrogen);
  EXPECT_EQ(run.post_flame.fuel_nitrogen.estimate_wet_mole_fraction, 0.0);
  EXPECT_TRUE(is_close(no.wet_mole_fraction, run.fired.equilibrium.mole_fraction("NO"), 0.0));
  // The unstated defaults are stated as assumptions: residence time, cooling target and time.
  EXPECT_EQ(run.post_flame.assumptions.size(), 3u);
}

// Wrong if with no cooling the CO burnout moved CO away from the firing-state equilibrium: a hold at
// the firing temperature relaxes CO toward the same equilibrium it starts at.
TEST(PostFlameStage, ZeroCoolingTimeKeepsTheFiringStateCo) {
  CaseDefinition definition = load_case(example("gas_boiler.yaml"));
  definition.post_flame.cooling_time_s = 0.0;
  const RunResult run = run_case(definition, builtin_species());
  const PollutantBound& co = pollutant(run, "CO");
  ASSERT_TRUE(co.estimate.has_value());
  EXPECT_TRUE(is_close(co.estimate->wet_mole_fraction, run.fired.equilibrium.mole_fraction("CO"), 1e-9));
  EXPECT_TRUE(is_close(co.estimate->emission.ppmvd_at_reference.value(), co.emission.ppmvd_at_reference.value(), 1e-9));
}

// Wrong if cooling did not burn CO out below the frozen firing-state value of the bound.
TEST(PostFlameStage, CoolingBurnsCoBelowTheBound) {
  const RunResult run = run_case(load_case(example("gas_boiler.yaml")), builtin_species());
  const PollutantBound& co = pollutant(run, "CO");
  ASSERT_TRUE(co.estimate.has_value());
  EXPECT_LT(co.estimate->wet_mole_fraction, co.wet_mole_fraction);
}

// Wrong if a reference-O2 sweep reran the post-flame stage (it reads nothing the reference O2
// changes: its path equilibria would be solved again per point for nothing), or the kept post-flame
// results gave other estimates than a full run of the same point.
TEST(PostFlameStage, AReferenceO2SweepKeepsThePostFlameStage) {
  const CaseDefinition base = load_case(example("gas_boiler.yaml"));
  const std::vector<VarySpec> vary{parse_vary("reference_o2=0%:15%:4")};
  std::vector<SweepPoint> points;
  SweepOptions options;
  options.threads = 1;
  run_sweep(base, vary, builtin_species(), [&](const SweepPoint& p) { points.push_back(p); }, options);
  ASSERT_EQ(points.size(), 4u);
  std::size_t post_flame_runs = 0;
  for (const SweepPoint& point : points) {
    ASSERT_TRUE(point.result.has_value()) << point.error;
    post_flame_runs += point.result->stages_run.post_flame ? 1u : 0u;
    CaseDefinition single = base;
    apply_parameter(single, SweepParameter::reference_o2, point.values[0]);
    const RunResult alone = run_case(single, builtin_species());
    for (const char* name : {"CO", "NO", "NOx"}) {
      ASSERT_TRUE(pollutant(*point.result, name).estimate.has_value()) << name;
      EXPECT_TRUE(is_close(pollutant(*point.result, name).estimate->emission.ppmvd_at_reference.value(),
                           pollutant(alone, name).estimate->emission.ppmvd_at_reference.value(), 1e-12))
          << name << " at point " << point.index;
    }
  }
  EXPECT_EQ(post_flame_runs, 1u);
  EXPECT_EQ(first_stage_reading(SweepParameter::reference_o2), Stage::emissions);
  EXPECT_LT(Stage::post_flame, Stage::emissions);
}

// Wrong if a temperature sweep kept a post-flame result computed at another firing temperature.
TEST(PostFlameStage, AFiringTemperatureSweepRerunsThePostFlameStage) {
  const CaseDefinition base = load_case(example("gas_boiler.yaml"));
  std::vector<SweepPoint> points;
  SweepOptions options;
  options.threads = 1;
  run_sweep(base, {parse_vary("firing_temperature=1600K:1800K:3")}, builtin_species(),
            [&](const SweepPoint& p) { points.push_back(p); }, options);
  ASSERT_EQ(points.size(), 3u);
  for (const SweepPoint& point : points) {
    ASSERT_TRUE(point.result.has_value()) << point.error;
    EXPECT_TRUE(point.result->stages_run.post_flame);
    EXPECT_TRUE(is_close(point.result->post_flame.path.firing_temperature.value(), point.values[0], 0.0));
  }
}

// Wrong if an oil without a stated conversion did not take its class's typical band (marked typical),
// or a stated conversion were not used as stated.
TEST(PostFlameStage, FuelNitrogenConversionIsStatedOrTheTypicalBand) {
  CaseDefinition definition = load_case(example("oil_heater.yaml"));
  const RunResult typical = run_case(definition, builtin_species());
  const FuelNitrogenPart& n = typical.post_flame.fuel_nitrogen;
  if (n.no.fuel_nitrogen_mol_per_kg > 0.0) {
    EXPECT_EQ(n.origin, ConversionOrigin::typical_band);
    ASSERT_TRUE(n.band.has_value());
    EXPECT_EQ(n.band->band.status, "typical");
    EXPECT_TRUE(is_close(n.no.conversion_fraction, n.band->band.high_fraction, 0.0));
  }
  definition.fuel.nitrogen_conversion = 0.25;
  const RunResult stated = run_case(definition, builtin_species());
  EXPECT_EQ(stated.post_flame.fuel_nitrogen.origin, ConversionOrigin::stated);
  EXPECT_TRUE(is_close(stated.post_flame.fuel_nitrogen.no.conversion_fraction, 0.25, 0.0));
}

// Wrong if the case file's post-flame fields were not read, or bad values were accepted without a
// message naming the field.
TEST(PostFlameStage, CaseFileFieldsAreReadAndChecked) {
  const std::string head =
      "case: {title: t}\nfuel: {preset: natural_gas, feed_rate: 1 MW}\noperating_point: {excess_air: 15 %}\n";
  const CaseDefinition read = parse_case(head +
                                             "firing: {temperature: 1800 K, residence_time: 50 ms}\n"
                                             "post_flame: {cooling_to: 600 K, cooling_time: 0.5 s}\n"
                                             "report: {reference_o2: 3 %}\n",
                                         "t.yaml");
  EXPECT_TRUE(is_close(read.firing.residence_time_s, 0.05, 1e-15));
  EXPECT_TRUE(read.firing.residence_time_stated);
  ASSERT_TRUE(read.post_flame.cooling_to_K.has_value());
  EXPECT_TRUE(is_close(*read.post_flame.cooling_to_K, 600.0, 1e-15));
  EXPECT_TRUE(is_close(read.post_flame.cooling_time_s, 0.5, 1e-15));
  struct Bad {
    std::string text;
    const char* fragment;
  };
  const Bad bad[] = {
      {"firing: {temperature: 1800 K, residence_time: -1 ms}\n", "firing.residence_time"},
      {"firing: {temperature: 1800 K, residence_time: 1 h}\n", "firing.residence_time"},
      {"firing: {temperature: 1800 K}\npost_flame: {cooling_time: 2 h}\n", "post_flame.cooling_time"},
      {"firing: {temperature: 1800 K}\npost_flame: {cooling_rate: 2}\n", "cooling_rate"},
  };
  for (const Bad& b : bad) {
    try {
      (void)parse_case(head + b.text + "report: {reference_o2: 3 %}\n", "t.yaml");
      ADD_FAILURE() << "accepted: " << b.text;
    } catch (const units::InputError& error) {
      EXPECT_NE(std::string(error.what()).find(b.fragment), std::string::npos) << error.what();
    }
  }
}

// Wrong if the run JSON lacked the documented post_flame keys, an estimate or ceiling had other keys
// than the bound (docs/report-json.md), or printed other numbers than the library's run.
TEST(PostFlameStage, RunJsonCarriesEstimateCeilingAndThePostFlameObject) {
  const auto run = testing::run_stackbound({"run", example("oil_heater.yaml"), "--format", "json"});
  ASSERT_EQ(run.exit_code, 0) << run.err;
  const nlohmann::json json = nlohmann::json::parse(run.out);
  const nlohmann::json& post = json.at("post_flame");
  for (const char* key : {"residence_time_s", "residence_time_stated", "firing_temperature_K", "pressure_Pa", "cooling",
                          "rate_sources", "thermal_no", "co_burnout", "fuel_nitrogen", "no_split",
                          "highest_equilibrium_wet_mole_fraction", "assumptions", "prompt_no"}) {
    EXPECT_TRUE(post.contains(key)) << key;
  }
  EXPECT_EQ(post.at("prompt_no").get<std::string>(), "not computed");
  const RunResult library = run_case(load_case(example("oil_heater.yaml")), builtin_species());
  for (const char* name : {"CO", "NO", "NOx"}) {
    const nlohmann::json& bound = json.at("emissions").at(name);
    for (const char* kind : {"estimate", "ceiling"}) {
      const nlohmann::json& figure = bound.at(kind);
      ASSERT_TRUE(figure.is_object()) << name << " " << kind;
      EXPECT_EQ(figure.size() + 2, bound.size()) << name << " " << kind;
      for (const auto& item : figure.items()) EXPECT_TRUE(bound.contains(item.key())) << item.key();
    }
    EXPECT_TRUE(is_close(bound.at("estimate").at("ppmvd_at_ref_o2").get<double>(),
                         pollutant(library, name).estimate->emission.ppmvd_at_reference.value(), 1e-12, 1e-300))
        << name;
  }
}

// Wrong if a cooling target outside the species data ran, or its message did not name the field at
// its position in the file.
TEST(PostFlameStage, CoolingTargetOutsideTheDataIsRefusedAtItsPosition) {
  const std::string text =
      "case: {title: t}\nfuel: {preset: natural_gas, feed_rate: 1 MW}\noperating_point: {excess_air: 15 %}\n"
      "firing: {temperature: 1800 K}\npost_flame: {cooling_to: 50 K}\nreport: {reference_o2: 3 %}\n";
  const LoadedCase loaded = parse_case_file(text, "t.yaml");
  try {
    (void)with_positions(loaded.sources, [&] { return run_case(loaded.definition, builtin_species()); });
    ADD_FAILURE() << "a cooling target of 50 K was accepted";
  } catch (const units::InputError& error) {
    EXPECT_NE(std::string(error.what()).find("t.yaml:5:"), std::string::npos) << error.what();
    EXPECT_NE(std::string(error.what()).find("50 K"), std::string::npos) << error.what();
  }
}

// Wrong if the gas turbine's primary zone were not at the adiabatic temperature of the fuel with its
// share of the air: an HP solve of the same feed, assembled here from the fuel's gas species and the
// oxidant's composition at their own temperatures (core/adiabatic_flame.hpp), must give the same
// temperature. Also wrong if the share did not follow from the stated equivalence ratio.
TEST(PostFlameStage, GasTurbinePrimaryZoneIsAtTheAdiabaticTemperatureOfItsMixture) {
  const CaseDefinition definition = load_case(example("gas_turbine.yaml"));
  ASSERT_TRUE(definition.firing.primary_zone.has_value());
  const RunResult run = run_case(definition, builtin_species());
  ASSERT_TRUE(run.post_flame.primary_zone.has_value());
  const PrimaryZonePart& zone = *run.post_flame.primary_zone;
  const core::CombustionResult& c = run.resolved.combustion;
  EXPECT_TRUE(is_close(zone.zone.air_share, c.equivalence_ratio() / *definition.firing.primary_zone->equivalence_ratio,
                       1e-14));
  core::FeedStream fuel{{}, c.fuel_temperature()};
  for (const auto& [formula, moles] : run.resolved.fuel.gas_mol_per_kg()) fuel.species.push_back({formula, moles});
  core::FeedStream air{{}, c.oxidant_temperature()};
  for (std::size_t i = 0; i < core::kOxidantSpeciesCount; ++i) {
    const double x = run.resolved.oxidant.mole_fractions()[i];
    if (x > 0.0) air.species.push_back({std::string(core::kOxidantSpeciesNames[i]), x * zone.zone.air_share * c.oxidant_mol_per_kg});
  }
  const std::vector<core::FeedStream> streams{fuel, air};
  core::AdiabaticFlameOptions options;
  options.pressure = units::pascals(run.fired.pressure_Pa);
  const core::EquilibriumResult hp = core::adiabatic_flame(builtin_species(), streams, options);
  EXPECT_TRUE(is_close(zone.zone.temperature().value(), hp.temperature_K, 1e-8)) << zone.zone.temperature().value()
                                                                                 << " K against " << hp.temperature_K;
  // Hotter than the mixed-out gas, where the post-flame path starts.
  EXPECT_GT(zone.zone.temperature().value(), run.fired.temperature_K + 300.0);
}

// Wrong if the primary zone's NO did not enter the path (the estimate would be the near-zero NO of the
// mixed-out gas) or was carried in at the zone's own mole fraction instead of diluted by the rest of
// the air; or if its equilibrium NO and CO were left out of the ceiling.
TEST(PostFlameStage, PrimaryZoneNoIsCarriedIntoTheMixedGas) {
  const CaseDefinition with_zone = load_case(example("gas_turbine.yaml"));
  CaseDefinition without_zone = with_zone;
  without_zone.firing.primary_zone.reset();
  const RunResult zoned = run_case(with_zone, builtin_species());
  const RunResult plain = run_case(without_zone, builtin_species());
  const PrimaryZonePart& zone = *zoned.post_flame.primary_zone;
  const double dilution = zone.zone.equilibrium.total_gas_moles / zoned.fired.equilibrium.total_gas_moles;
  EXPECT_GT(dilution, 0.3);
  EXPECT_LT(dilution, 0.9);
  EXPECT_TRUE(is_close(zone.no_carried, zone.zone.thermal_no.no_mole_fraction * dilution, 1e-14));
  ASSERT_TRUE(zoned.post_flame.thermal_no.has_value());
  EXPECT_TRUE(is_close(zoned.post_flame.thermal_no->initial_no_mole_fraction, zone.no_carried, 0.0));
  EXPECT_GT(pollutant(zoned, "NO").estimate->wet_mole_fraction, 10.0 * pollutant(plain, "NO").estimate->wet_mole_fraction);
  EXPECT_GE(pollutant(zoned, "NO").ceiling->wet_mole_fraction, zone.no_equilibrium_carried);
  EXPECT_GE(pollutant(zoned, "CO").ceiling->wet_mole_fraction, zone.co_carried);
  // The bound stays the frozen equilibrium of the mixed-out firing state.
  EXPECT_TRUE(is_close(pollutant(zoned, "NO").wet_mole_fraction, pollutant(plain, "NO").wet_mole_fraction, 0.0));
}

// Wrong if a primary zone were accepted where it cannot mean anything (a stated firing temperature, a
// zone leaner than the whole mixture, no residence time, a zone losing more heat than the flame) or
// its message did not name the field.
TEST(PostFlameStage, PrimaryZoneFieldsAreChecked) {
  const std::string head =
      "case: {title: t}\nfuel: {preset: natural_gas, feed_rate: 1 MW}\noperating_point: {excess_air: 200 %}\n";
  struct Bad {
    std::string firing;
    const char* message;
  };
  const Bad bad[] = {
      {"{temperature: 1800 K, primary_zone: {equivalence_ratio: 0.6, residence_time: 5 ms}}",
       "firing.primary_zone: needs firing.adiabatic: true"},
      {"{adiabatic: true, primary_zone: {equivalence_ratio: 0.6}}", "firing.primary_zone: missing required key \"residence_time\""},
      {"{adiabatic: true, primary_zone: {equivalence_ratio: 0.6, air_share: 50 %, residence_time: 5 ms}}",
       "firing.primary_zone"},
      {"{adiabatic: true, heat_loss: 5 %, primary_zone: {air_share: 50 %, residence_time: 5 ms, heat_loss: 10 %}}",
       "firing.primary_zone.heat_loss"},
      {"{adiabatic: true, primary_zone: {equivalence_ratio: 0.2, residence_time: 5 ms}}",
       "firing.primary_zone.equivalence_ratio: equivalence_ratio = 0.2 is leaner than the whole mixture"},
  };
  for (const Bad& b : bad) {
    try {
      (void)run_case(parse_case(head + "firing: " + b.firing + "\nreport: {reference_o2: 3 %}\n", "t.yaml"),
                     builtin_species());
      ADD_FAILURE() << "accepted: " << b.firing;
    } catch (const units::InputError& error) {
      EXPECT_NE(std::string(error.what()).find(b.message), std::string::npos) << error.what();
    }
  }
}

// Wrong if the run JSON lacked the primary zone or the zones in order (primary, hold, cooling).
TEST(PostFlameStage, RunJsonNamesTheZones) {
  const auto run = testing::run_stackbound({"run", example("gas_turbine.yaml"), "--format", "json"});
  ASSERT_EQ(run.exit_code, 0) << run.err;
  const nlohmann::json post = nlohmann::json::parse(run.out).at("post_flame");
  ASSERT_EQ(post.at("zones").size(), 3u);
  EXPECT_EQ(post.at("zones")[0].at("zone"), "primary");
  EXPECT_EQ(post.at("zones")[1].at("zone"), "hold");
  EXPECT_EQ(post.at("zones")[2].at("zone"), "cooling");
  EXPECT_GT(post.at("primary_zone").at("temperature_K").get<double>(), 1800.0);
  EXPECT_TRUE(is_close(post.at("primary_zone").at("residence_time_s").get<double>(), 0.008, 1e-15));
}

}  // namespace
}  // namespace stackbound::cases
