// Sweeps of full case runs on both cores: points per second and peak memory, for grids of growing
// size (memory must not grow with the number of points). DESIGN section 7: 10^6 points <= 15 s.
// The 10^6-point run is the benchmark `BM_SweepGasBoiler_1e6` (about 15 s); run them with
//   build/bench/stackbound_bench --benchmark_filter=BM_SweepGasBoiler
#include <sys/resource.h>

#include <cmath>
#include <string>

#include <benchmark/benchmark.h>

#include "stackbound/cases/case_file.hpp"
#include "stackbound/cases/species_file.hpp"
#include "stackbound/cases/sweep.hpp"

namespace {

double peak_rss_MB() {
  rusage usage{};
  getrusage(RUSAGE_SELF, &usage);
  return static_cast<double>(usage.ru_maxrss) / 1024.0;  // Linux reports kB
}

// A square grid of excess air x firing temperature with about `points` points.
void BM_SweepGasBoiler(benchmark::State& state) {
  namespace sb = stackbound::cases;
  const sb::CaseDefinition base = sb::load_case(std::string(STACKBOUND_SOURCE_DIR) + "/cases/examples/gas_boiler.yaml");
  const auto side = static_cast<long>(std::lround(std::sqrt(static_cast<double>(state.range(0)))));
  const std::vector<sb::VarySpec> vary{sb::parse_vary("excess_air=2%:60%:" + std::to_string(side)),
                                       sb::parse_vary("firing_temperature=1400K:2200K:" + std::to_string(side))};
  const auto& database = sb::builtin_species();
  std::size_t points = 0;
  std::size_t failed = 0;
  for (auto _ : state) {
    double checksum = 0.0;
    failed += sb::run_sweep(base, vary, database, [&](const sb::SweepPoint& p) {
      if (p.result) checksum += p.result->fired.temperature_K;
      ++points;
    });
    benchmark::DoNotOptimize(checksum);
  }
  state.SetItemsProcessed(static_cast<int64_t>(points));
  state.counters["points"] = static_cast<double>(side * side);
  state.counters["failed"] = static_cast<double>(failed);
  state.counters["peak_rss_MB"] = peak_rss_MB();
  state.counters["s_per_1e6_points"] =
      benchmark::Counter(static_cast<double>(points) / 1e6, benchmark::Counter::kIsRate | benchmark::Counter::kInvert);
}
BENCHMARK(BM_SweepGasBoiler)->Arg(10000)->Arg(100000)->Unit(benchmark::kMillisecond)->UseRealTime()->Iterations(1);
BENCHMARK(BM_SweepGasBoiler)->Name("BM_SweepGasBoiler_1e6")->Arg(1000000)->Unit(benchmark::kMillisecond)->UseRealTime()->Iterations(1);

}  // namespace
