#pragma once
// Pieces shared by the command-line subcommands: global options, formats. (Output files:
// cli/output_file.hpp; option values shared with the Python module: cases/option_values.hpp.)

#include <cstdio>
#include <stdexcept>
#include <string>
#include <string_view>
#include <vector>

#include <CLI/CLI.hpp>

#include "stackbound/cases/source_map.hpp"
#include "stackbound/cli/output_file.hpp"
#include "stackbound/core/species_database.hpp"
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

// Refuses (units::InputError) a command-line argument that is not plain text (units/plain_text.hpp):
// an invalid byte or a control character would otherwise reach a report or a JSON document.
void require_plain_arguments(int argc, const char* const* argv);

// Prints each warning on stderr as 'stackbound: warning: FILE:LINE:COLUMN: field = "value": message',
// at the field's position in `sources` (else the file's name).
void print_warnings(const std::vector<units::Warning>& warnings, const cases::SourceMap& sources);

}  // namespace stackbound::cli
