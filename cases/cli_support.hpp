#pragma once
// Pieces shared by the command-line subcommands: global options, output writing, formats.

#include <string>
#include <string_view>
#include <vector>

#include <CLI/CLI.hpp>

#include "core/species_database.hpp"

namespace stackbound::cases {

// Options that every subcommand sees.
struct GlobalOptions {
  std::string species_file;  // --species-file: extra species records (YAML), added to the built-in data
};

// Writes `content` to `path` whole or not at all (temporary file beside it, then rename), or to
// stdout when `path` is empty or "-". Throws units::InputError naming the path on failure.
void write_output(const std::string& path, std::string_view content);

// Registers `--format` with the accepted values and the default; the help text lists them.
CLI::Option* add_format_option(CLI::App& command, std::string& format, const std::vector<std::string>& accepted);

// Splits "CO2,CO, O2" into trimmed names; empty items are an InputError naming the option.
std::vector<std::string> split_list(std::string_view text, std::string_view option);

}  // namespace stackbound::cases
