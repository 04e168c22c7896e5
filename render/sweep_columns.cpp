#include "stackbound/render/sweep_columns.hpp"

#include <algorithm>
#include <cmath>
#include <limits>
#include <stdexcept>

#include <fmt/format.h>

#include "stackbound/render/finite_figures.hpp"

namespace stackbound::render {

using namespace stackbound::cases;

std::string sweep_parameter_key(SweepParameter parameter) {
  const std::string_view unit = sweep_parameter_unit(parameter);
  return "vary_" + std::string(sweep_parameter_name(parameter)) + "_" + (unit == "%" ? "percent" : std::string(unit));
}

SweepColumnsCollector::SweepColumnsCollector(const std::vector<VarySpec>& vary, std::size_t points)
    : vary_(vary), reserved_(points) {
  columns_.point.reserve(points);
  columns_.status.reserve(points);
  columns_.error.reserve(points);
  for (const VarySpec& spec : vary) {
    columns_.numbers.push_back({sweep_parameter_key(spec.parameter), {}});
    columns_.numbers.back().values.reserve(points);
  }
}

void SweepColumnsCollector::add(const SweepPoint& point) {
  constexpr double kNoFigure = std::numeric_limits<double>::quiet_NaN();
  const std::size_t done = columns_.point.size();
  if (point.result && result_columns_.empty()) {
    // The result columns start at the first point that ran; earlier failed points get NaN.
    const bool reference_o2_varies = std::any_of(
        vary_.begin(), vary_.end(), [](const VarySpec& v) { return v.parameter == SweepParameter::reference_o2; });
    result_columns_ = run_metric_columns(*point.result, reference_o2_varies);
    for (const MetricColumn& column : result_columns_) {
      columns_.numbers.push_back({column.key, std::vector<double>(done, kNoFigure)});
      columns_.numbers.back().values.reserve(reserved_);
    }
  }
  columns_.point.push_back(static_cast<std::int64_t>(point.index + 1));
  for (std::size_t k = 0; k < vary_.size(); ++k) {
    columns_.numbers[k].values.push_back(sweep_parameter_display(vary_[k].parameter, point.values[k]));
  }
  if (point.result) {
    const std::vector<double> values = run_metric_values(*point.result);
    if (values.size() != result_columns_.size()) {
      throw std::logic_error("sweep columns: a point has a different number of result figures than the first");
    }
    for (std::size_t m = 0; m < values.size(); ++m) {
      if (!std::isfinite(values[m]) && !is_missing(result_columns_[m], values[m])) {
        throw NonFiniteFigure(
            fmt::format("sweep point {}: figure {} of the row is not finite", point.index + 1, m + 1));
      }
      columns_.numbers[vary_.size() + m].values.push_back(values[m]);
    }
  } else {
    for (std::size_t m = 0; m < result_columns_.size(); ++m) {
      columns_.numbers[vary_.size() + m].values.push_back(kNoFigure);
    }
  }
  columns_.status.emplace_back(point.result ? "ok" : "failed");
  columns_.error.push_back(point.result ? std::string() : point.error);
}

SweepColumns SweepColumnsCollector::finish() && { return std::move(columns_); }

}  // namespace stackbound::render
