#pragma once
// The headline numbers of a run as named columns with units, shared by sweeps and comparisons.
// Columns (names and units) and values are separate, so a sweep formats its header once.

#include <cmath>
#include <limits>
#include <string>
#include <vector>

#include "stackbound/cases/pipeline.hpp"

namespace stackbound::cases {

struct MetricColumn {
  std::string key;     // stable JSON key, e.g. "CO_mg_per_Nm3_at_ref_o2"
  std::string header;  // with unit, e.g. "CO bound [mg/Nm3 @ 3 % O2]"
  // True for the post-flame estimate and ceiling: a run may have none (the products lack the species
  // the kinetics need), and its value is then kMissingFigure, written as an empty cell or null.
  bool may_be_missing = false;
};

// The value of a may_be_missing column that a run does not have (NaN; every other figure is finite).
inline constexpr double kMissingFigure = std::numeric_limits<double>::quiet_NaN();
[[nodiscard]] inline bool is_missing(const MetricColumn& column, double value) {
  return column.may_be_missing && std::isnan(value);
}

// Firing temperature, excess air, flue O2 and moisture, heat input, stack flow, then for each
// pollutant ppmvd, ppmvd and mg/Nm3 at the reference O2, kg/h and lb/MMBtu of the bound, then for
// NO, NOx and CO (the pollutants of the post-flame stage) the estimate and the ceiling at the reference
// O2 (ppmvd, mg/Nm3) and in kg/h. The headers name the run's reference O2, or "the reference O2" when
// `reference_o2_varies` (a sweep of it).
std::vector<MetricColumn> run_metric_columns(const RunResult& result, bool reference_o2_varies = false);

// The values of those columns, in the same order.
std::vector<double> run_metric_values(const RunResult& result);

}  // namespace stackbound::cases
