// The run as a pipeline of stages: run_case is the stages composed in order, a rerun keeps the
// results of the stages before the one it starts at, and run errors name field paths, which the
// loader's positions turn into file:line:column.

#include "stackbound/cases/pipeline.hpp"

#include <string>

#include <gtest/gtest.h>

#include "stackbound/cases/case_file.hpp"
#include "stackbound/cases/source_map.hpp"
#include "stackbound/cases/species_file.hpp"
#include "stackbound/units/input_error.hpp"
#include "tests/support/tolerance.hpp"

namespace stackbound::cases {
namespace {

using stackbound::testing::is_close;

std::string example(const char* name) { return std::string(STACKBOUND_SOURCE_DIR) + "/cases/examples/" + name; }

// Wrong if run_case did anything besides composing the stages: calling them by hand, in the order
// pipeline.hpp lists, must give the same numbers exactly.
TEST(Pipeline, RunCaseIsTheStagesComposedInOrder) {
  const CaseDefinition definition = load_case(example("wood_chip_boiler.yaml"));
  const core::SpeciesDatabase& db = builtin_species();
  const RunResult run = run_case(definition, db);

  const ResolvedCase resolved = resolve_stage(definition, db);
  const FiringState fired = fire_stage(definition.firing, resolved, db);
  const PostFlame post_flame = post_flame_stage(definition, resolved, fired);
  const StackGas stack = stack_stage(definition.stack, definition.report.o2_basis, resolved, fired, true);
  const EmissionFigures figures = emissions_stage(definition, resolved, fired, stack, {}, &post_flame);
  const Screening screening = screening_stage({definition, resolved, fired, stack, figures, post_flame}, db);

  EXPECT_TRUE(is_close(run.fired.temperature_K, fired.temperature_K, 0.0));
  EXPECT_TRUE(is_close(run.stack.o2_dry, stack.o2_dry, 0.0));
  EXPECT_TRUE(is_close(run.stack.actual_m3_per_s, stack.actual_m3_per_s, 0.0));
  ASSERT_EQ(run.emissions.pollutants.size(), figures.pollutants.size());
  for (std::size_t i = 0; i < figures.pollutants.size(); ++i) {
    const auto& a = run.emissions.pollutants[i].emission;
    const auto& b = figures.pollutants[i].emission;
    EXPECT_TRUE(is_close(a.mg_per_Nm3_at_reference.result.value(), b.mg_per_Nm3_at_reference.result.value(), 0.0));
    EXPECT_TRUE(is_close(a.method19.lb_per_MMBtu(), b.method19.lb_per_MMBtu(), 0.0));
    const auto& run_estimate = run.emissions.pollutants[i].estimate;
    const auto& hand_estimate = figures.pollutants[i].estimate;
    ASSERT_EQ(run_estimate.has_value(), hand_estimate.has_value());
    if (run_estimate) {
      EXPECT_TRUE(is_close(run_estimate->emission.ppmvd_at_reference.value(),
                           hand_estimate->emission.ppmvd_at_reference.value(), 0.0));
    }
  }
  EXPECT_EQ(run.screening.findings, screening.findings);
  EXPECT_EQ(run.screening.cautions, screening.cautions);
  EXPECT_TRUE(run.stages_run.resolve && run.stages_run.fire && run.stages_run.post_flame && run.stages_run.stack &&
              run.stages_run.emissions && run.stages_run.screening);
}

// Wrong if a rerun from the emissions stage ran an earlier stage, or its kept firing state and stack
// gas gave other figures than a full run of the changed case.
TEST(Pipeline, ARerunFromEmissionsKeepsTheEarlierStagesAndMatchesAFullRun) {
  const CaseDefinition base = load_case(example("gas_boiler.yaml"));
  const core::SpeciesDatabase& db = builtin_species();
  const RunResult first = run_case(base, db);
  CaseDefinition changed = base;
  changed.report.reference_o2_fraction = 0.11;
  RunOptions options;
  options.previous = &first;
  options.rerun_from = Stage::emissions;
  const RunResult rerun = run_case(changed, db, options);
  const RunResult full = run_case(changed, db);

  EXPECT_FALSE(rerun.stages_run.resolve);
  EXPECT_FALSE(rerun.stages_run.fire);
  EXPECT_FALSE(rerun.stages_run.stack);
  EXPECT_TRUE(rerun.stages_run.emissions);
  EXPECT_TRUE(rerun.stages_run.screening);
  EXPECT_TRUE(is_close(rerun.emissions.reference_o2_dry, 0.11, 0.0));
  for (std::size_t i = 0; i < full.emissions.pollutants.size(); ++i) {
    EXPECT_TRUE(is_close(rerun.emissions.pollutants[i].emission.ppmvd_at_reference.value(),
                         full.emissions.pollutants[i].emission.ppmvd_at_reference.value(), 1e-12));
  }
  ASSERT_EQ(rerun.screening.limits.size(), full.screening.limits.size());
  for (std::size_t i = 0; i < full.screening.limits.size(); ++i) {
    EXPECT_TRUE(is_close(rerun.screening.limits[i].result.value, full.screening.limits[i].result.value, 1e-12));
  }
}

// Wrong if a run error carried a file position (the run knows none) or lost its field, or if the
// loader's positions did not put the position back: the message must read as a located load error.
TEST(Pipeline, RunErrorsNameTheFieldAndTheLoadersPositionsLocateThem) {
  const std::string text =
      "case: {title: hot}\nfuel: {preset: natural_gas, feed_rate: 100 Nm3/h}\noperating_point: {excess_air: 15 %}\n"
      "firing:\n  temperature: 4000 K\nreport: {reference_o2: 3 %}\n";
  const LoadedCase loaded = parse_case_file(text, "hot.yaml");
  EXPECT_THROW_WITH(run_case(loaded.definition, builtin_species()), units::InputError,
                    "firing.temperature: temperature = 4000 K: outside the data range");
  EXPECT_THROW_WITH(with_positions(loaded.sources, [&] { return run_case(loaded.definition, builtin_species()); }),
                    units::InputError, "hot.yaml:5:16: temperature = 4000 K: outside the data range");
}

// Wrong if a message that does not begin with a recorded field path were rewritten (it would lose its
// text), or a path below a recorded field were not reported at that field.
TEST(Pipeline, OnlyMessagesThatBeginWithARecordedPathAreLocated) {
  SourceMap sources("f.yaml");
  sources.add("stack", "f.yaml:7:1");
  sources.add("fuel.gas", "f.yaml:3:8");
  EXPECT_EQ(sources.locate("stack.measured.co: no number found"), "f.yaml:7:1: no number found");
  EXPECT_EQ(sources.locate("fuel.gas: fuel.gas = \"CH5\": unknown species"), "f.yaml:3:8: fuel.gas = \"CH5\": unknown species");
  EXPECT_EQ(sources.locate("fuel.gas = \"CH5\": unknown species"), "fuel.gas = \"CH5\": unknown species");
  EXPECT_EQ(sources.locate("element amounts: every element amount is zero"),
            "element amounts: every element amount is zero");
  EXPECT_EQ(sources.locate("no colon here"), "no colon here");
}

}  // namespace
}  // namespace stackbound::cases
