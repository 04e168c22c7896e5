#pragma once
// Pieces shared by the command-line subcommands: global options, formats, lists. (Output files:
// cli/output_file.hpp.)

#include <cstdio>
#include <stdexcept>
#include <string>
#include <string_view>
#include <vector>

#include <CLI/CLI.hpp>

#include "stackbound/cases/plausible_ranges.hpp"
#include "stackbound/cases/source_map.hpp"
#include "stackbound/cli/output_file.hpp"
#include "stackbound/core/species_database.hpp"
#include "stackbound/units/quantities.hpp"
#include "stackbound/units/warning.hpp"

namespace stackbound::cli {

// Options that every subcommand sees.
struct GlobalOptions {
  std::string species_file;  // --species-file: extra species records (YAML), added to the built-in data
};

// Thrown by commands that finished but with some failed parts (a sweep with failed points): main()
// prints it and exits with code 4.
class PartialFailure : public std::runtime_error {
 public:
  using std::runtime_error::runtime_error;
};

// Registers `--format` with the accepted values and the default; the help text lists them.
CLI::Option* add_format_option(CLI::App& command, std::string& format, const std::vector<std::string>& accepted);

// A pressure option parsed and checked against the range the tool accepts for it (plausible_ranges.hpp);
// InputError '<option> = "<text>": outside ...' otherwise.
units::Pressure checked_pressure(std::string_view text, std::string_view option, const cases::PlausibleRange& range);

// Prints each warning on stderr as 'stackbound: warning: FILE:LINE:COLUMN: field = "value": message',
// at the field's position in `sources` (else the file's name).
void print_warnings(const std::vector<units::Warning>& warnings, const cases::SourceMap& sources);

// Splits "CO2,CO, O2" into trimmed names; empty items are an InputError naming the option.
std::vector<std::string> split_list(std::string_view text, std::string_view option);

}  // namespace stackbound::cli
