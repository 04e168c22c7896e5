// Cost of the post-flame kinetics (budget: thermal NO + CO burnout along a default path <= 200 us
// median per case, one core). A case: 20 ms hold at the firing temperature, then linear cooling to
// 1000 K over 1 s in 20 steps (21 equilibrium solves, the first cold), thermal NO and CO burnout along
// it. The firing temperature cycles over 1800-2000 K so that no state is reused. Feed: methane with
// dry air at 15 % excess air, an invented demonstration mixture. Median:
//   stackbound_bench --benchmark_filter=BM_PostFlame --benchmark_repetitions=15 --benchmark_report_aggregates_only=true
#include <benchmark/benchmark.h>

#include <vector>

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

}  // namespace
