#pragma once
// The `reduce` request of the front ends (the command line's options, the Python module's keyword
// arguments) turned into the library's ReduceOptions (reduction.hpp), and the readings file opened as
// the command line opens it. Every text is parsed and checked here, once; errors name the command-line
// option ("--min-hour-coverage = ...").

#include <cstddef>
#include <fstream>
#include <optional>
#include <string>

#include "stackbound/cases/reduction.hpp"

namespace stackbound::cases {

// Option values as given; empty texts and nullopt mean not given (the rule set's thresholds apply).
struct ReduceQuery {
  std::string rules = "none";            // --rules: us-part60, eu-ied or none
  std::string average = "hour";          // --average: hour, day, month, Nh, Nd, optionally "... rolling"
  bool strict = false;                   // --strict
  std::size_t listed_problems = 5;       // --list-bad-rows
  std::optional<int> min_quadrants;      // --min-quadrants (0-4)
  std::string min_hour_coverage;         // --min-hour-coverage ("75 %")
  std::optional<int> max_invalid_hours;  // --max-invalid-hours (0-24)
  std::string min_valid_hours;           // --min-valid-hours ("75 %")
};

// The options of the query; throws units::InputError naming the option.
ReduceOptions reduce_options(const ReduceQuery& query);

// A readings file opened for streaming, with its size in bytes (for a progress bar).
struct ReadingsFile {
  std::ifstream stream;
  std::size_t size = 0;
};

// Opens a regular file; InputError 'READINGS = "<path>": no such file' (not a regular file, cannot be
// read) otherwise.
ReadingsFile open_readings_file(const std::string& path);

}  // namespace stackbound::cases
