// Sweeps and comparisons: rows equal single runs, physical trends hold, bad specs are refused, and a
// failing point is reported in its row while the sweep goes on.

#include "stackbound/cases/sweep.hpp"

#include <algorithm>
#include <sstream>
#include <string>

#include <gtest/gtest.h>

#include <nlohmann/json.hpp>

#include "stackbound/cases/case_file.hpp"
#include "stackbound/cases/species_file.hpp"
#include "tests/support/run_binary.hpp"
#include "tests/support/tolerance.hpp"
#include "stackbound/units/input_error.hpp"

namespace stackbound::cases {
namespace {

using stackbound::testing::is_close;
using stackbound::testing::run_stackbound;

std::string example(const char* name) { return std::string(STACKBOUND_SOURCE_DIR) + "/cases/examples/" + name; }

const PollutantBound& bound(const RunResult& run, const std::string& name) {
  const auto found = std::find_if(run.emissions.pollutants.begin(), run.emissions.pollutants.end(), [&](const auto& p) { return p.name == name; });
  if (found == run.emissions.pollutants.end()) throw std::runtime_error("no pollutant " + name);
  return *found;
}

// How many points of a sweep ran each stage (the others kept the previous point's result).
struct StageCounts {
  std::size_t resolve = 0;
  std::size_t fire = 0;
  std::size_t stack = 0;
  std::size_t emissions = 0;
};

StageCounts stages_run(const std::vector<SweepPoint>& points) {
  StageCounts counts;
  for (const SweepPoint& point : points) {
    if (!point.result) continue;
    const StagesRun& run = point.result->stages_run;
    counts.resolve += run.resolve ? 1 : 0;
    counts.fire += run.fire ? 1 : 0;
    counts.stack += run.stack ? 1 : 0;
    counts.emissions += run.emissions ? 1 : 0;
  }
  return counts;
}

std::vector<SweepPoint> collect(const CaseDefinition& base, const std::vector<VarySpec>& vary, unsigned threads) {
  std::vector<SweepPoint> points;
  SweepOptions options;
  options.threads = threads;
  options.batch_points = 4;  // several batches, so warm starts cross batch boundaries
  run_sweep(base, vary, builtin_species(), [&](const SweepPoint& p) { points.push_back(p); }, options);
  return points;
}

// Wrong if a sweep's warm starts, threads or batching changed the numbers, or the grid order were not
// the documented one (last --vary fastest).
TEST(Sweep, RowsEqualTheSamePointsRunOneAtATime) {
  const CaseDefinition base = load_case(example("gas_boiler.yaml"));
  const std::vector<VarySpec> vary{parse_vary("excess_air=5%:45%:5"), parse_vary("firing_temperature=1600K:1900K:3")};
  const std::vector<SweepPoint> points = collect(base, vary, 2);
  ASSERT_EQ(points.size(), 15u);
  for (std::size_t i = 0; i < points.size(); ++i) {
    ASSERT_TRUE(points[i].result.has_value()) << points[i].error;
    EXPECT_EQ(points[i].index, i);
    EXPECT_TRUE(is_close(points[i].values[0], vary[0].values[i / 3], 0.0));
    EXPECT_TRUE(is_close(points[i].values[1], vary[1].values[i % 3], 0.0));
    CaseDefinition single = base;
    apply_parameter(single, SweepParameter::excess_air, points[i].values[0]);
    apply_parameter(single, SweepParameter::firing_temperature, points[i].values[1]);
    const RunResult alone = run_case(single, builtin_species());
    for (const char* name : {"CO", "NO", "NOx"}) {
      // Warm and cold starts converge to the same solution within the solver's tolerance.
      EXPECT_TRUE(is_close(bound(*points[i].result, name).emission.ppmvd_at_reference.value(),
                           bound(alone, name).emission.ppmvd_at_reference.value(), 1e-8, 1e-12))
          << name << " at point " << i;
    }
  }
}

// Wrong if a reference-O2 sweep solved an equilibrium (or re-resolved the case) per point: the
// reference O2 is read first by the emissions stage, so one worker fires once and every later point
// keeps the firing state and stack gas, across batch boundaries too. Also wrong if the kept results
// gave other figures than a full run of the same point.
TEST(Sweep, AReferenceO2SweepFiresOnceAndMatchesFullRuns) {
  const CaseDefinition base = load_case(example("gas_boiler.yaml"));
  const std::vector<VarySpec> vary{parse_vary("reference_o2=0%:15%:10")};
  const std::vector<SweepPoint> points = collect(base, vary, 1);
  ASSERT_EQ(points.size(), 10u);
  const StageCounts counts = stages_run(points);
  EXPECT_EQ(counts.resolve, 1u);
  EXPECT_EQ(counts.fire, 1u);
  EXPECT_EQ(counts.stack, 1u);
  EXPECT_EQ(counts.emissions, 10u);
  for (const SweepPoint& point : points) {
    ASSERT_TRUE(point.result.has_value()) << point.error;
    CaseDefinition single = base;
    apply_parameter(single, SweepParameter::reference_o2, point.values[0]);
    const RunResult alone = run_case(single, builtin_species());
    EXPECT_TRUE(is_close(point.result->emissions.reference_o2_dry, point.values[0], 0.0));
    for (const char* name : {"CO", "NO", "NOx"}) {
      EXPECT_TRUE(is_close(bound(*point.result, name).emission.ppmvd_at_reference.value(),
                           bound(alone, name).emission.ppmvd_at_reference.value(), 1e-12))
          << name << " at point " << point.index;
      EXPECT_TRUE(is_close(bound(*point.result, name).emission.mg_per_Nm3_at_reference.result.value(),
                           bound(alone, name).emission.mg_per_Nm3_at_reference.result.value(), 1e-12))
          << name << " at point " << point.index;
    }
  }
}

// Wrong if a temperature sweep kept a firing state it must recompute (one fire stage per point), or
// re-resolved the fuel and operating point, which the firing temperature does not change.
TEST(Sweep, ATemperatureSweepFiresAtEveryPointAndResolvesOnce) {
  const CaseDefinition base = load_case(example("gas_boiler.yaml"));
  const std::vector<SweepPoint> points = collect(base, {parse_vary("firing_temperature=1500K:1900K:9")}, 1);
  const StageCounts counts = stages_run(points);
  EXPECT_EQ(counts.resolve, 1u);
  EXPECT_EQ(counts.fire, 9u);
  EXPECT_EQ(counts.emissions, 9u);
}

// Wrong if a two-parameter grid re-ran the resolve stage where only the faster (temperature)
// parameter changed, or kept it where the excess air changed; with two workers each starts afresh.
TEST(Sweep, AGridReResolvesOnlyWhereTheExcessAirChanges) {
  const CaseDefinition base = load_case(example("gas_boiler.yaml"));
  const std::vector<VarySpec> vary{parse_vary("excess_air=5%:45%:3"), parse_vary("firing_temperature=1600K:1900K:4")};
  const StageCounts one_worker = stages_run(collect(base, vary, 1));
  EXPECT_EQ(one_worker.resolve, 3u);
  EXPECT_EQ(one_worker.fire, 12u);
  SweepOptions options;
  options.threads = 2;
  options.batch_points = 12;  // one batch: worker 1 takes points 0-5, worker 2 points 6-11
  std::vector<SweepPoint> points;
  run_sweep(base, vary, builtin_species(), [&](const SweepPoint& p) { points.push_back(p); }, options);
  // Worker 1: excess air 5 % (new), 25 % (changed); worker 2: 25 % (its first point), 45 % (changed).
  EXPECT_EQ(stages_run(points).resolve, 4u);
}

// Wrong if the point after a failed one took stages from the failed point (it has none) instead of
// from the last point that ran, or re-fired although it differs from that point in the reference O2
// only; or if the kept firing state gave other figures than a full run.
TEST(Sweep, APointAfterAFailureKeepsTheStagesOfTheLastPointThatRan) {
  const CaseDefinition base = load_case(example("gas_boiler.yaml"));
  // 4000 K lies outside the species data (3500 K): points 1 and 3 fail.
  const std::vector<VarySpec> vary{parse_vary("reference_o2=3%:6%:2"), parse_vary("firing_temperature=3000K:4000K:2")};
  const std::vector<SweepPoint> points = collect(base, vary, 1);
  ASSERT_EQ(points.size(), 4u);
  ASSERT_TRUE(points[0].result.has_value()) << points[0].error;
  EXPECT_FALSE(points[1].result.has_value());
  ASSERT_TRUE(points[2].result.has_value()) << points[2].error;
  EXPECT_FALSE(points[3].result.has_value());
  EXPECT_TRUE(points[0].result->stages_run.fire);
  EXPECT_FALSE(points[2].result->stages_run.resolve);
  EXPECT_FALSE(points[2].result->stages_run.fire);
  EXPECT_TRUE(points[2].result->stages_run.emissions);
  CaseDefinition single = base;
  apply_parameter(single, SweepParameter::reference_o2, 0.06);
  apply_parameter(single, SweepParameter::firing_temperature, 3000.0);
  const RunResult alone = run_case(single, builtin_species());
  EXPECT_TRUE(is_close(bound(*points[2].result, "NO").emission.ppmvd_at_reference.value(),
                       bound(alone, "NO").emission.ppmvd_at_reference.value(), 1e-12));
}

// Wrong if the equilibrium NO bound did not rise with firing temperature at fixed excess air:
// N2 + O2 = 2 NO is endothermic (about +180 kJ/mol), so by van 't Hoff its K grows with T.
TEST(Sweep, NoBoundRisesWithFiringTemperature) {
  const CaseDefinition base = load_case(example("gas_boiler.yaml"));
  const auto points = collect(base, {parse_vary("firing_temperature=1300K:2100K:9")}, 2);
  for (std::size_t i = 1; i < points.size(); ++i) {
    EXPECT_GT(bound(*points[i].result, "NO").emission.ppmvd_at_reference.value(),
              bound(*points[i - 1].result, "NO").emission.ppmvd_at_reference.value())
        << "between points " << i - 1 << " and " << i;
  }
}

// Wrong if the CO bound did not fall as excess air rises at fixed temperature near stoichiometric:
// more O2 pushes CO + 1/2 O2 = CO2 toward CO2 (x_CO ~ x_CO2 / (K sqrt(x_O2 P))).
TEST(Sweep, CoBoundFallsAsExcessAirRises) {
  const CaseDefinition base = load_case(example("gas_boiler.yaml"));
  const auto points = collect(base, {parse_vary("excess_air=1%:30%:8")}, 1);
  for (std::size_t i = 1; i < points.size(); ++i) {
    EXPECT_LT(bound(*points[i].result, "CO").emission.ppmvd_at_reference.value(),
              bound(*points[i - 1].result, "CO").emission.ppmvd_at_reference.value())
        << "between points " << i - 1 << " and " << i;
  }
}

// Wrong if the adiabatic flame temperature did not peak near phi = 1: leaner mixtures heat excess
// air, richer ones release less heat; with dissociation the peak sits slightly rich of stoichiometric.
TEST(Sweep, AdiabaticFlameTemperaturePeaksNearStoichiometric) {
  CaseDefinition base = load_case(example("gas_boiler.yaml"));
  base.firing.adiabatic = true;
  base.firing.heat_loss_fraction = 0.0;
  const auto points = collect(base, {parse_vary("excess_air=-20%:40%:31")}, 2);
  std::size_t hottest = 0;
  for (std::size_t i = 0; i < points.size(); ++i) {
    ASSERT_TRUE(points[i].result.has_value()) << points[i].error;
    if (points[i].result->fired.temperature_K > points[hottest].result->fired.temperature_K) hottest = i;
  }
  const double excess_air_at_peak = points[hottest].values[0];
  EXPECT_GE(excess_air_at_peak, -0.10);
  EXPECT_LE(excess_air_at_peak, 0.02);
}

// Wrong if a bad --vary spec were accepted or reported without saying what is wrong.
TEST(Sweep, BadVarySpecsAreRefusedWithTheirRule) {
  EXPECT_THROW_WITH(parse_vary("excess_ar=5%:45%:9"), units::InputError,
                    "--vary = \"excess_ar=5%:45%:9\": unknown parameter \"excess_ar\" (did you mean \"excess_air\"?)");
  EXPECT_THROW_WITH(parse_vary("excess_air=5%:45%:0"), units::InputError, "a range needs 2 or more points");
  EXPECT_THROW_WITH(parse_vary("excess_air=5%:45%:1"), units::InputError, "a range needs 2 or more points");
  EXPECT_THROW_WITH(parse_vary("excess_air=45%:5%:9"), units::InputError, "FROM must be below TO (the range is reversed");
  EXPECT_THROW_WITH(parse_vary("excess_air=5:45:9"), units::InputError, "--vary excess_air FROM = \"5\": a unit is required");
  EXPECT_THROW_WITH(parse_vary("air_preheat=20%:300%:4"), units::InputError, "is a fraction");
  EXPECT_THROW_WITH(parse_vary("excess_air=5%:45%"), units::InputError, "expected FROM:TO:STEPS");
  EXPECT_THROW_WITH(parse_vary("excess_air"), units::InputError, "expected PARAM=FROM:TO:STEPS");
  EXPECT_THROW_WITH(parse_vary("excess_air=5%:45%:nine"), units::InputError, "STEPS = \"nine\" must be a whole number");
  const CaseDefinition stated = load_case(example("gas_boiler.yaml"));
  EXPECT_THROW_WITH(check_sweep(stated, {parse_vary("heat_loss=5%:20%:4")}), units::InputError,
                    "heat_loss applies only to cases with firing.adiabatic: true");
  EXPECT_THROW_WITH(check_sweep(stated, {parse_vary("blend_fraction=10%:90%:5")}), units::InputError,
                    "the case's fuel is not a blend");
  EXPECT_THROW_WITH(check_sweep(stated, {parse_vary("excess_air=5%:45%:3"), parse_vary("flue_o2=2%:4%:3")}),
                    units::InputError, "excess_air and flue_o2 both set the operating point");
  EXPECT_THROW_WITH(check_sweep(stated, {parse_vary("reference_o2=25%:30%:2")}), units::InputError,
                    "--vary reference_o2 = 25 %: must be between 0 % and 20 %");
}

// Wrong if one failing point stopped the sweep, lost its parameters, or the exit code hid the failure.
TEST(Sweep, AFailingPointIsReportedInItsRowAndTheSweepGoesOn) {
  const auto run = run_stackbound({"sweep", example("gas_boiler.yaml"), "--vary", "firing_temperature=3000K:4000K:5"});
  EXPECT_EQ(run.exit_code, 4) << run.err;
  EXPECT_NE(run.err.find("2 of 5 sweep points failed"), std::string::npos) << run.err;
  std::istringstream lines(run.out);
  std::string line;
  std::vector<std::string> rows;
  while (std::getline(lines, line)) {
    if (!line.empty() && line.front() != '#') rows.push_back(line);
  }
  ASSERT_EQ(rows.size(), 6u);  // header + 5 points
  EXPECT_EQ(rows[0].rfind("point,firing_temperature [K],status,firing temperature [K]", 0), 0u) << rows[0];
  EXPECT_EQ(rows[1].rfind("1,3000,ok,", 0), 0u) << rows[1];
  EXPECT_EQ(rows[4].rfind("4,3750,failed,", 0), 0u) << rows[4];
  EXPECT_NE(rows[4].find("outside the data range"), std::string::npos) << rows[4];
  EXPECT_EQ(rows[5].rfind("5,4000,failed,", 0), 0u) << rows[5];
}

// Wrong if the HTML sweep lost its plots' axis units or the bound wording.
TEST(Sweep, HtmlHasLabelledPlotsAndTheBoundWording) {
  const auto run = run_stackbound({"sweep", example("gas_boiler.yaml"), "--vary", "excess_air=8%:15%:8", "--format", "html"});
  ASSERT_EQ(run.exit_code, 0) << run.err;
  EXPECT_NE(run.out.find("<svg"), std::string::npos);
  EXPECT_NE(run.out.find("excess_air [%]"), std::string::npos);
  EXPECT_NE(run.out.find("CO [ppmvd @ 3 % O2]"), std::string::npos);
  EXPECT_NE(run.out.find("temperature [K]"), std::string::npos);
  EXPECT_NE(run.out.find("equilibrium bound at the stated firing conditions"), std::string::npos);
}

// Wrong if compare reported differences that are not value(B) - value(A), differenced figures on
// different reference bases, or lost a case.
TEST(Compare, DifferencesAreAgainstTheFirstCase) {
  const auto run = run_stackbound({"compare", example("gas_boiler.yaml"), example("gas_turbine.yaml"), "--format", "json"});
  ASSERT_EQ(run.exit_code, 0) << run.err;
  const nlohmann::json json = nlohmann::json::parse(run.out);
  ASSERT_EQ(json["cases"].size(), 2u);
  const auto& a = json["cases"][0];
  const auto& b = json["cases"][1];
  for (const auto& [key, value] : b["values"].items()) {
    if (key.ends_with("_at_ref_o2")) {
      // The two cases are at 3 % and 15 % reference O2: figures at their reference O2 are on different
      // bases and are not differenced.
      EXPECT_TRUE(b["difference_from_first"][key]["absolute"].is_null()) << key;
      continue;
    }
    const double first = a["values"][key].get<double>();
    EXPECT_TRUE(is_close(b["difference_from_first"][key]["absolute"].get<double>(), value.get<double>() - first, 1e-12, 1e-12))
        << key;
    EXPECT_TRUE(is_close(a["difference_from_first"][key]["absolute"].get<double>(), 0.0, 0.0, 0.0)) << key;
  }
  EXPECT_FALSE(json["cautions"].empty());
}

// Wrong if compare left out the kinetic estimate and ceiling beside the bound, or printed other
// numbers for them than a run of the same case.
TEST(Compare, CarriesTheEstimateAndTheCeiling) {
  const auto run = run_stackbound({"compare", example("gas_boiler.yaml"), example("gas_turbine.yaml"), "--format", "json"});
  ASSERT_EQ(run.exit_code, 0) << run.err;
  const nlohmann::json json = nlohmann::json::parse(run.out);
  const RunResult turbine = run_case(load_case(example("gas_turbine.yaml")), builtin_species());
  for (const PollutantBound& p : turbine.emissions.pollutants) {
    const nlohmann::json& values = json["cases"][1]["values"];
    ASSERT_TRUE(values.contains(p.name + "_estimate_ppmvd_at_ref_o2")) << p.name;
    EXPECT_TRUE(is_close(values[p.name + "_estimate_ppmvd_at_ref_o2"].get<double>(),
                         p.estimate->emission.ppmvd_at_reference.value(), 1e-12, 1e-300))
        << p.name;
    EXPECT_TRUE(is_close(values[p.name + "_ceiling_kg_per_h"].get<double>(), p.ceiling->emission.mass_rate.value() * 3600.0,
                         1e-12, 1e-300))
        << p.name;
  }
}

}  // namespace
}  // namespace stackbound::cases
