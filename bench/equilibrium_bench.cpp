// Cost of the equilibrium solver (DESIGN section 7 budget: TP <= 10 us median from a cold start,
// <= 3 us warm-started; HP <= 60 us median, one core). Feeds are invented demonstration mixtures.
#include <benchmark/benchmark.h>

#include <vector>

#include "stackbound/cases/species_file.hpp"
#include "stackbound/core/adiabatic_flame.hpp"
#include "stackbound/core/element_amounts.hpp"
#include "stackbound/core/equilibrium.hpp"

namespace {

namespace core = stackbound::core;

constexpr double kAtm_Pa = 101325.0;

// Keeps a result alive through the const overload of DoNotOptimize: the non-const overload's "+m,r"
// asm constraint let GCC 12 clobber a double member in place (seen as zeroed warm starts).
void keep(const double& value) { benchmark::DoNotOptimize(value); }

// Stoichiometric methane with dry air (O2 + 3.76 N2 + Ar trace): invented demonstration feed.
std::vector<core::SpeciesAmount> methane_air() { return {{"CH4", 1.0}, {"O2", 2.0}, {"N2", 7.44}, {"Ar", 0.089}}; }

// Coal-like C/H/O/N/S feed with air, about 35 % excess air: an invented demonstration feed
// (6 mol C as graphite and methane, 3 mol H, 0.1 mol N from ammonia, 0.05 mol S from H2S, moisture).
std::vector<core::SpeciesAmount> coal_like() {
  return {{"C(gr)", 5.5}, {"CH4", 0.5}, {"H2O", 0.3},  {"NH3", 0.1},
          {"H2S", 0.05},  {"O2", 9.0},  {"N2", 33.84}, {"Ar", 0.40}};
}

struct Problem {
  core::ElementAmounts b;
  core::EquilibriumSolver solver;
  double enthalpy_J;
  explicit Problem(const std::vector<core::SpeciesAmount>& feed)
      : b(core::element_amounts(stackbound::cases::builtin_species(), feed)),
        solver(stackbound::cases::builtin_species(), b),
        enthalpy_J(core::feed_enthalpy(stackbound::cases::builtin_species(), feed, stackbound::units::kelvin(298.15))
                       .value()) {}
};

// Cold start: each solve starts from the uniform initial estimate. T cycles over 1200-2400 K so
// that no state is reused.
void tp_cold(benchmark::State& state, const std::vector<core::SpeciesAmount>& feed) {
  const Problem problem(feed);
  double temperature_K = 1200.0;
  int iterations = 0;
  for (auto _ : state) {
    const core::EquilibriumResult result = problem.solver.solve_tp(problem.b, stackbound::units::kelvin(temperature_K),
                                                                   stackbound::units::pascals(kAtm_Pa));
    iterations += result.iterations;
    keep(result.total_gas_moles);
    temperature_K = temperature_K >= 2400.0 ? 1200.0 : temperature_K + 7.0;
  }
  state.counters["newton_iterations"] = benchmark::Counter(iterations, benchmark::Counter::kAvgIterations);
}

// Warm start: each solve is seeded with the previous result, 7 K away (a sweep).
void tp_warm(benchmark::State& state, const std::vector<core::SpeciesAmount>& feed) {
  const Problem problem(feed);
  double temperature_K = 1200.0;
  core::EquilibriumResult previous =
      problem.solver.solve_tp(problem.b, stackbound::units::kelvin(temperature_K), stackbound::units::pascals(kAtm_Pa));
  int iterations = 0;
  for (auto _ : state) {
    temperature_K = temperature_K >= 2400.0 ? 1200.0 : temperature_K + 7.0;
    core::EquilibriumResult result = problem.solver.solve_tp(problem.b, stackbound::units::kelvin(temperature_K),
                                                             stackbound::units::pascals(kAtm_Pa), &previous);
    iterations += result.iterations;
    keep(result.total_gas_moles);
    previous = std::move(result);
  }
  state.counters["newton_iterations"] = benchmark::Counter(iterations, benchmark::Counter::kAvgIterations);
}

void BM_TpMethaneAirCold(benchmark::State& state) { tp_cold(state, methane_air()); }
void BM_TpMethaneAirWarm(benchmark::State& state) { tp_warm(state, methane_air()); }
void BM_TpCoalLikeCold(benchmark::State& state) { tp_cold(state, coal_like()); }
void BM_TpCoalLikeWarm(benchmark::State& state) { tp_warm(state, coal_like()); }
BENCHMARK(BM_TpMethaneAirCold);
BENCHMARK(BM_TpMethaneAirWarm);
BENCHMARK(BM_TpCoalLikeCold);
BENCHMARK(BM_TpCoalLikeWarm);

// HP (adiabatic flame) of stoichiometric methane-air from 298.15 K, 1 atm.
void BM_HpMethaneAirCold(benchmark::State& state) {
  const Problem problem(methane_air());
  int iterations = 0;
  for (auto _ : state) {
    const core::EquilibriumResult result = problem.solver.solve_hp(
        problem.b, stackbound::units::joules(problem.enthalpy_J), stackbound::units::pascals(kAtm_Pa));
    iterations += result.iterations;
    keep(result.temperature_K);
  }
  state.counters["newton_iterations"] = benchmark::Counter(iterations, benchmark::Counter::kAvgIterations);
}
BENCHMARK(BM_HpMethaneAirCold);

// HP warm-started from the previous flame while the feed's enthalpy steps (a preheat sweep).
void BM_HpMethaneAirWarm(benchmark::State& state) {
  const Problem problem(methane_air());
  core::EquilibriumResult previous = problem.solver.solve_hp(problem.b, stackbound::units::joules(problem.enthalpy_J),
                                                             stackbound::units::pascals(kAtm_Pa));
  double extra_J = 0.0;
  int iterations = 0;
  for (auto _ : state) {
    extra_J = extra_J >= 40000.0 ? 0.0 : extra_J + 1000.0;
    core::EquilibriumResult result =
        problem.solver.solve_hp(problem.b, stackbound::units::joules(problem.enthalpy_J + extra_J),
                                stackbound::units::pascals(kAtm_Pa), &previous);
    iterations += result.iterations;
    keep(result.temperature_K);
    previous = std::move(result);
  }
  state.counters["newton_iterations"] = benchmark::Counter(iterations, benchmark::Counter::kAvgIterations);
}
BENCHMARK(BM_HpMethaneAirWarm);

}  // namespace
