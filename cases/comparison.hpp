#pragma once
// Cases side by side: each run against the first (absolute and relative differences), as numbers and
// as a report document.

#include <optional>
#include <string>
#include <vector>

#include "stackbound/cases/pipeline.hpp"
#include "stackbound/cases/provenance.hpp"
#include "stackbound/cases/report_document.hpp"
#include "stackbound/cases/run_metrics.hpp"

namespace stackbound::cases {

// Cases are aligned on the union of their figures: a column a case lacks (a pollutant it does not
// report) is may_be_missing and holds kMissingFigure for it. Each case keeps its own reference basis;
// when the bases differ, the figures at the reference O2 are shown each on its case's basis (named in
// `bases`) and not differenced, and a flag says so.
struct Comparison {
  std::vector<RunResult> runs;
  std::vector<MetricColumn> columns;         // the union, in the order the cases list them
  std::vector<std::vector<double>> values;   // per run, in the columns' order
  std::vector<std::string> bases;            // per run: "@ 3 % O2 (20.9 % air), normal 0C"
  bool bases_differ = false;
  std::vector<std::string> flags;
  std::vector<std::string> cautions;  // of every case, once each, in the order of all_cautions()
};

// Runs every case file (run errors reported at their file positions) and aligns their figures.
Comparison compare(const std::vector<std::string>& files, const core::SpeciesDatabase& database);

// True for the columns whose values depend on the reference basis (figures at the reference O2).
[[nodiscard]] bool depends_on_reference_basis(const MetricColumn& column);

// Relative difference against the first case; none when the first is zero.
std::optional<double> relative_difference(double value, double first);

// The side-by-side table, the flags of every case, and the cautions.
// `provenance`: the tool version and run time (its case_sha256 is not used: each case row names its own).
Report comparison_document(const Comparison& comparison, const Provenance& provenance);

}  // namespace stackbound::cases
