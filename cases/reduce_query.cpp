#include "stackbound/cases/reduce_query.hpp"

#include <sys/stat.h>

#include <fmt/format.h>

#include "stackbound/units/input_error.hpp"
#include "stackbound/units/quantity_parser.hpp"

namespace stackbound::cases {

namespace {

std::optional<double> optional_fraction(const std::string& text, std::string_view option) {
  if (text.empty()) return std::nullopt;
  const double fraction = units::parse_fraction(text, option);
  if (!(fraction >= 0.0 && fraction <= 1.0)) {
    throw units::InputError(fmt::format("{} = \"{}\": must be between 0 % and 100 %", option, text));
  }
  return fraction;
}

std::optional<int> optional_count(std::optional<int> value, std::string_view option, int high) {
  if (value && (*value < 0 || *value > high)) {
    throw units::InputError(fmt::format("{} = {}: must be 0 to {}", option, *value, high));
  }
  return value;
}

}  // namespace

ReduceOptions reduce_options(const ReduceQuery& query) {
  ReduceOptions options;
  options.rules = parse_rule_set(query.rules, "--rules");
  options.average = parse_average_period(query.average, "--average");
  options.strict = query.strict;
  options.listed_problems = query.listed_problems;
  options.overrides.min_quadrants = optional_count(query.min_quadrants, "--min-quadrants", 4);
  options.overrides.max_invalid_hours_per_day = optional_count(query.max_invalid_hours, "--max-invalid-hours", 24);
  options.overrides.min_hour_coverage = optional_fraction(query.min_hour_coverage, "--min-hour-coverage");
  options.overrides.min_valid_hours_fraction = optional_fraction(query.min_valid_hours, "--min-valid-hours");
  return options;
}

ReadingsFile open_readings_file(const std::string& path) {
  struct stat info {};
  if (::stat(path.c_str(), &info) != 0) throw units::InputError(fmt::format("READINGS = \"{}\": no such file", path));
  if (!S_ISREG(info.st_mode)) throw units::InputError(fmt::format("READINGS = \"{}\": not a regular file", path));
  ReadingsFile file{std::ifstream(path, std::ios::binary), static_cast<std::size_t>(info.st_size)};
  if (!file.stream) throw units::InputError(fmt::format("READINGS = \"{}\": cannot be read", path));
  return file;
}

}  // namespace stackbound::cases
