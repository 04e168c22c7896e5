// Cost of the post-flame kinetics (budget: the post-flame stage with default settings <= 200 us median
// per case, one core). A case: 20 ms hold at the firing temperature, then linear cooling to
// 1000 K over 1 s in 20 steps (21 equilibrium solves, the first cold), thermal NO and CO burnout along
// it. The firing temperature cycles over 1800-2000 K so that no state is reused. Feed: methane with
// dry air at 15 % excess air, an invented demonstration mixture. Median:
//   stackbound_bench --benchmark_filter=BM_PostFlame --benchmark_repetitions=15 --benchmark_report_aggregates_only=true
#include <benchmark/benchmark.h>

#include <vector>

#include "stackbound/cases/case_file.hpp"
#include "stackbound/cases/pipeline.hpp"
#include "stackbound/cases/species_file.hpp"
#include "stackbound/core/co_burnout.hpp"
#include "stackbound/core/element_amounts.hpp"
#include "stackbound/core/equilibrium.hpp"
#include "stackbound/core/post_flame.hpp"
#include "stackbound/core/thermal_no.hpp"

namespace {

namespace core = stackbound::core;
namespace units = stackbound::units;

// See equilibrium_bench.cpp: the const overload keeps GCC from clobbering the value in place.
void keep(const double& value) { benchmark::DoNotOptimize(value); }

struct Problem {
  core::ElementAmounts b;
  core::EquilibriumSolver solver;
  Problem()
      : b(core::element_amounts(stackbound::cases::builtin_species(),
                                std::vector<core::SpeciesAmount>{{"CH4", 1.0}, {"O2", 2.3}, {"N2", 8.648}})),
        solver(stackbound::cases::builtin_species(), b) {}
};

core::PostFlamePath default_path(double firing_K) {
  core::PostFlamePath path;
  path.firing_temperature = units::kelvin(firing_K);
  path.final_temperature = units::kelvin(1000.0);
  path.hold_time = units::seconds(0.020);
  path.cooling_time = units::seconds(1.0);
  path.cooling_steps = 20;
  return path;
}

// The whole case: the path's equilibria, then both rate models along it.
void BM_PostFlameThermalNoAndCoBurnout(benchmark::State& state) {
  const Problem problem;
  double firing_K = 1800.0;
  for (auto _ : state) {
    const core::PostFlameHistory history = core::post_flame_history(problem.solver, problem.b, default_path(firing_K));
    keep(core::thermal_no_along(history).no_mole_fraction);
    keep(core::co_burnout_along(history).co_mole_fraction);
    firing_K = firing_K >= 2000.0 ? 1800.0 : firing_K + 7.0;
  }
}
BENCHMARK(BM_PostFlameThermalNoAndCoBurnout)->Unit(benchmark::kMicrosecond);

// The rate models alone on a solved history (the share of the case that is not equilibrium solving).
void BM_PostFlameRateModelsOnly(benchmark::State& state) {
  const Problem problem;
  const core::PostFlameHistory history = core::post_flame_history(problem.solver, problem.b, default_path(1900.0));
  for (auto _ : state) {
    keep(core::thermal_no_along(history).no_mole_fraction);
    keep(core::co_burnout_along(history).co_mole_fraction);
  }
}
BENCHMARK(BM_PostFlameRateModelsOnly)->Unit(benchmark::kMicrosecond);

// The post-flame stage of a case run as the gas-turbine example states it: a primary zone (an HP solve
// and its thermal NO), then the hold and the default cooling path (the same as above) on the mixed gas.
void BM_PostFlameStageGasTurbineWithPrimaryZone(benchmark::State& state) {
  namespace sb = stackbound::cases;
  const sb::CaseDefinition definition =
      sb::load_case(std::string(STACKBOUND_SOURCE_DIR) + "/cases/examples/gas_turbine.yaml");
  const sb::ResolvedCase resolved = sb::resolve_stage(definition, sb::builtin_species());
  const sb::FiringState fired = sb::fire_stage(definition.firing, resolved, sb::builtin_species());
  for (auto _ : state) {
    const sb::PostFlame post = sb::post_flame_stage(definition, resolved, fired);
    keep(post.primary_zone->no_carried);
  }
}
BENCHMARK(BM_PostFlameStageGasTurbineWithPrimaryZone)->Unit(benchmark::kMicrosecond);

}  // namespace
