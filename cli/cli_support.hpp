#pragma once
// Pieces shared by the command-line subcommands: global options, output writing, formats.

#include <cstdio>
#include <stdexcept>
#include <string>
#include <string_view>
#include <vector>

#include <CLI/CLI.hpp>

#include "stackbound/core/species_database.hpp"

namespace stackbound::cli {

// Options that every subcommand sees.
struct GlobalOptions {
  std::string species_file;  // --species-file: extra species records (YAML), added to the built-in data
};

// Writes `content` to `path` whole or not at all (temporary file beside it, then rename), or to
// stdout when `path` is empty or "-". Throws units::InputError naming the path on failure.
void write_output(const std::string& path, std::string_view content);

// A stream that goes to stdout, or to a file that appears whole or not at all: the text goes to a
// temporary file beside the target, renamed over it by commit(); without commit() (an exception,
// a failure) the temporary file is removed.
class OutputStream {
 public:
  explicit OutputStream(const std::string& path);
  OutputStream(const OutputStream&) = delete;
  OutputStream& operator=(const OutputStream&) = delete;
  ~OutputStream();
  void write(std::string_view text);
  void commit();

 private:
  std::string path_;
  std::string temporary_;
  std::FILE* file_ = nullptr;
  bool to_stdout_ = false;
  bool committed_ = false;
};

// Thrown by commands that finished but with some failed parts (a sweep with failed points): main()
// prints it and exits with code 4.
class PartialFailure : public std::runtime_error {
 public:
  using std::runtime_error::runtime_error;
};

// Registers `--format` with the accepted values and the default; the help text lists them.
CLI::Option* add_format_option(CLI::App& command, std::string& format, const std::vector<std::string>& accepted);

// Splits "CO2,CO, O2" into trimmed names; empty items are an InputError naming the option.
std::vector<std::string> split_list(std::string_view text, std::string_view option);

}  // namespace stackbound::cli
