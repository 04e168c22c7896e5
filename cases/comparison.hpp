#pragma once
// Cases side by side: each run against the first (absolute and relative differences), as numbers and
// as a report document.

#include <optional>
#include <string>
#include <vector>

#include "stackbound/cases/report_document.hpp"
#include "stackbound/cases/run_metrics.hpp"
#include "stackbound/cases/pipeline.hpp"
#include "stackbound/cases/provenance.hpp"

namespace stackbound::cases {

struct Comparison {
  std::vector<RunResult> runs;
  std::vector<MetricColumn> columns;         // of the first run
  std::vector<std::vector<double>> values;   // per run, in the columns' order
  std::vector<std::string> flags;
  std::vector<std::string> cautions;         // of every case, once each, in the order of all_cautions()
};

// Runs every case file (run errors reported at their file positions); throws units::InputError when
// the cases list different pollutants.
Comparison compare(const std::vector<std::string>& files, const core::SpeciesDatabase& database);

// Relative difference against the first case; none when the first is zero.
std::optional<double> relative_difference(double value, double first);

// The side-by-side table, the flags of every case, and the cautions.
// `provenance`: the tool version and run time (its case_sha256 is not used: each case row names its own).
Report comparison_document(const Comparison& comparison, const Provenance& provenance);

}  // namespace stackbound::cases
