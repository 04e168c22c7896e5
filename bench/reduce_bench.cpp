// Reduction of analyser readings (cases/reduction.hpp): a year of one-minute readings (525 600 rows,
// 8 columns) parsed, corrected and averaged to hours and to days. Target (issue 13): <= 1 s on one
// core, >= 10^6 rows/s. Peak memory for 10^7 rows is measured on the program with a generated file:
//   bench/make-readings 10000000 /tmp/readings.csv
//   /usr/bin/time -v build/stackbound reduce bench/reduce_case.yaml /tmp/readings.csv --average day
//   build/bench/stackbound_bench --benchmark_filter=BM_Reduce
#include <cmath>
#include <istream>
#include <streambuf>
#include <string>

#include <benchmark/benchmark.h>
#include <fmt/format.h>

#include "stackbound/cases/case_file.hpp"
#include "stackbound/cases/reduction.hpp"
#include "stackbound/cases/species_file.hpp"

namespace {

namespace sb = stackbound::cases;

// Reads a string in place (no copy per iteration).
class StringBuffer : public std::streambuf {
 public:
  explicit StringBuffer(std::string& text) { setg(text.data(), text.data(), text.data() + text.size()); }
};

// A year from 2025-01-01 00:00 UTC at one-minute steps: time, O2, CO2, CO, NOx, H2O, flow, status.
std::string year_of_readings() {
  std::string csv = "time,O2,CO2,CO,NOx,H2O,flow,status\n";
  csv.reserve(525600 * 70);
  for (int minute = 0; minute < 525600; ++minute) {
    const int day = minute / 1440, h = (minute / 60) % 24, m = minute % 60;
    const int month_days[] = {31, 28, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31};
    int month = 0, d = day;
    while (d >= month_days[month]) d -= month_days[month++];
    const double wave = std::sin(minute * 0.001);
    fmt::format_to(std::back_inserter(csv), "2025-{:02}-{:02}T{:02}:{:02}:00Z,{:.2f},{:.2f},{:.1f},{:.1f},{:.2f},{:.0f},{}\n",
                   month + 1, d + 1, h, m, 3.0 + 0.3 * wave, 10.5 - 0.2 * wave, 12.0 + 2.0 * wave, 60.0 + 5.0 * wave,
                   17.0 + 0.5 * wave, 52000.0 + 800.0 * wave, minute % 1440 < 15 ? "CAL" : "OK");
  }
  return csv;
}

void BM_ReduceYear(benchmark::State& state, const char* average) {
  const sb::CaseDefinition definition = sb::load_case(std::string(STACKBOUND_SOURCE_DIR) + "/bench/reduce_case.yaml");
  std::string csv = year_of_readings();
  sb::ReduceOptions options;
  options.rules = sb::RuleSet::us_part60;
  options.average = sb::parse_average_period(average, "average");
  std::size_t periods = 0;
  for (auto _ : state) {
    StringBuffer buffer(csv);
    std::istream input(&buffer);
    const sb::ReductionDocument document = sb::reduce_readings(definition, sb::builtin_species(), input, "year.csv", options);
    periods = document.periods.size();
    benchmark::DoNotOptimize(periods);
  }
  state.counters["rows_per_s"] = benchmark::Counter(525600.0 * static_cast<double>(state.iterations()), benchmark::Counter::kIsRate);
  state.counters["periods"] = static_cast<double>(periods);
}

BENCHMARK_CAPTURE(BM_ReduceYear, hourly, "hour")->Unit(benchmark::kMillisecond)->Repetitions(5)->ReportAggregatesOnly(true);
BENCHMARK_CAPTURE(BM_ReduceYear, daily, "day")->Unit(benchmark::kMillisecond)->Repetitions(5)->ReportAggregatesOnly(true);

}  // namespace
