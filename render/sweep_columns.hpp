#pragma once
// A sweep as columns, for front ends that hand a table to a data-frame library (the Python module):
// one entry per point in grid order, numbers in the units of the CSV columns (sweep_csv.hpp), which
// are built from the same values. Columns: "point" (1, 2, ...), one "vary_<parameter>_<unit>" per
// --vary ("vary_excess_air_percent", "vary_air_preheat_K", "vary_pressure_kPa"), the result columns
// under their stable keys (run_metrics.hpp; NaN where a point failed or has no post-flame figure),
// "status" ("ok" or "failed") and "error" (why a point failed, else empty).

#include <cstddef>
#include <cstdint>
#include <string>
#include <vector>

#include "stackbound/cases/run_metrics.hpp"
#include "stackbound/cases/sweep.hpp"

namespace stackbound::render {

struct NumberColumn {
  std::string key;
  std::vector<double> values;
};

struct SweepColumns {
  std::vector<std::int64_t> point;    // 1-based point numbers
  std::vector<NumberColumn> numbers;  // the varied parameters, then the results
  std::vector<std::string> status;
  std::vector<std::string> error;
};

class SweepColumnsCollector {
 public:
  // `vary` must outlive the collector; `points` is the grid's size (memory is reserved for it).
  SweepColumnsCollector(const std::vector<cases::VarySpec>& vary, std::size_t points);

  void add(const cases::SweepPoint& point);
  // The columns, all of the same length (the points added). A figure that is not finite (other than a
  // missing post-flame figure) is a NonFiniteFigure (finite_figures.hpp), as in the CSV.
  [[nodiscard]] SweepColumns finish() &&;

 private:
  const std::vector<cases::VarySpec>& vary_;
  std::size_t reserved_;
  SweepColumns columns_;
  std::vector<cases::MetricColumn> result_columns_;  // empty until the first point that ran
};

// "vary_excess_air_percent": the column key of a varied parameter.
std::string sweep_parameter_key(cases::SweepParameter parameter);

}  // namespace stackbound::render
