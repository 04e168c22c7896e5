#pragma once
// Reducing analyser readings to corrected, validated averages: the library entry point of
// `stackbound reduce` (and of any other caller, such as a Python binding). Streams the readings once
// in constant memory: each row is read (readings_csv.hpp), corrected to the case's bases
// (reading_correction.hpp), added to its local hour, and hours combine into the requested periods
// (period_averages.hpp) under the chosen rule set (averaging_rules.hpp).

#include <cstddef>
#include <functional>
#include <istream>
#include <string>

#include "stackbound/cases/averaging_rules.hpp"
#include "stackbound/cases/case_definition.hpp"
#include "stackbound/cases/reduction_document.hpp"
#include "stackbound/core/species_database.hpp"

namespace stackbound::cases {

struct ReduceOptions {
  RuleSet rules = RuleSet::none;
  AveragePeriod average;                  // default: hours
  CoverageOverrides overrides;            // replace the rule set's coverage thresholds
  bool strict = false;                    // stop at the first malformed row (InputError with its line)
  std::size_t listed_problems = 5;        // malformed rows listed with their lines (all are counted)
  // Called now and then with the bytes read so far (a progress bar); may be empty.
  std::function<void(std::size_t bytes_read)> progress;
  // Called with each output period as it closes (the document holds the header fields by then), e.g. to
  // write CSV rows as they come; with keep_periods false the document's periods stay empty, so memory
  // does not grow with the number of periods. The summary is the same either way.
  std::function<void(const ReductionDocument& document, const ReductionPeriod& period)> on_period;
  bool keep_periods = true;
};

// `definition` must have a readings section (InputError naming `readings` otherwise). `origin` names
// the readings in messages ("day.csv:17: ..."). Errors of the case's own fields name field paths
// (source_map.hpp: run inside with_positions for file positions). Throws units::InputError.
ReductionDocument reduce_readings(const CaseDefinition& definition, const core::SpeciesDatabase& database,
                                  std::istream& readings, const std::string& origin, const ReduceOptions& options);

}  // namespace stackbound::cases
