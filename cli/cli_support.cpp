#include "stackbound/cli/cli_support.hpp"

#include <iostream>

#include <fmt/format.h>

namespace stackbound::cli {

CLI::Option* add_format_option(CLI::App& command, std::string& format, const std::vector<std::string>& accepted) {
  format = accepted.front();
  return command.add_option("--format", format, "Output format")
      ->check(CLI::IsMember(accepted))
      ->default_str(accepted.front())
      ->capture_default_str();
}

void print_warnings(const std::vector<units::Warning>& warnings, const cases::SourceMap& sources) {
  for (const units::Warning& warning : warnings) {
    const std::string where = sources.location_of(warning.field).value_or(sources.origin());
    std::cerr << fmt::format("stackbound: warning: {}: {}\n", where, units::warning_text(warning));
  }
}

}  // namespace stackbound::cli
