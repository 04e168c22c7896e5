// Cost of the thermodynamic property evaluations that the equilibrium solver's inner loop makes.
#include <benchmark/benchmark.h>

#include "stackbound/cases/species_file.hpp"

namespace {

void BM_GibbsOfAllSpecies(benchmark::State& state) {
  const auto& database = stackbound::cases::builtin_species();
  double temperature_K = 1500.0;
  for (auto _ : state) {
    double sum = 0.0;
    for (const auto& species : database.all()) sum += species.g_over_RT_unchecked(temperature_K);
    benchmark::DoNotOptimize(sum);
    temperature_K = temperature_K > 2500.0 ? 1500.0 : temperature_K + 1.0;
  }
  state.SetItemsProcessed(state.iterations() * static_cast<int64_t>(database.size()));
}
BENCHMARK(BM_GibbsOfAllSpecies);

}  // namespace
