#pragma once
// The headline numbers of a run as named columns with units, shared by sweeps and comparisons.
// Columns (names and units) and values are separate, so a sweep formats its header once.

#include <string>
#include <vector>

#include "stackbound/cases/pipeline.hpp"

namespace stackbound::cases {

struct MetricColumn {
  std::string key;     // stable JSON key, e.g. "CO_mg_per_Nm3_at_ref_o2"
  std::string header;  // with unit, e.g. "CO bound [mg/Nm3 @ 3 % O2]"
};

// Firing temperature, excess air, flue O2 and moisture, heat input, stack flow, then for each
// pollutant ppmvd, ppmvd and mg/Nm3 at the reference O2, kg/h and lb/MMBtu. The headers name the
// run's reference O2, or "the reference O2" when `reference_o2_varies` (a sweep of it).
std::vector<MetricColumn> run_metric_columns(const RunResult& result, bool reference_o2_varies = false);

// The values of those columns, in the same order.
std::vector<double> run_metric_values(const RunResult& result);

}  // namespace stackbound::cases
