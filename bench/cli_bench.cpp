// `stackbound run` of a demo case from process start to exit (DESIGN section 7: <= 50 ms), text and
// HTML output, measured as a user runs it (fork + exec + wait).
#include <cstdlib>
#include <string>

#include <benchmark/benchmark.h>

namespace {

void BM_RunDemoCaseProcess(benchmark::State& state, const char* format) {
  const std::string command = std::string("'") + STACKBOUND_BINARY + "' run '" + STACKBOUND_SOURCE_DIR +
                              "/cases/examples/gas_boiler.yaml' --format " + format + " >/dev/null";
  for (auto _ : state) {
    if (std::system(command.c_str()) != 0) {
      state.SkipWithError("stackbound run failed");
      break;
    }
  }
}
BENCHMARK_CAPTURE(BM_RunDemoCaseProcess, text, "text")->Unit(benchmark::kMillisecond)->UseRealTime();
BENCHMARK_CAPTURE(BM_RunDemoCaseProcess, html, "html")->Unit(benchmark::kMillisecond)->UseRealTime();

}  // namespace
