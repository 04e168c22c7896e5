#include "stackbound/cli/cli_support.hpp"

#include <iostream>

#include <fmt/format.h>

#include "stackbound/units/input_error.hpp"
#include "stackbound/units/plain_text.hpp"

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

void require_plain_arguments(int argc, const char* const* argv) {
  for (int i = 1; i < argc; ++i) {
    const std::string_view argument = argv[i];
    if (const std::optional<units::TextFault> fault = units::find_text_fault(argument)) {
      throw units::InputError(fmt::format("command-line argument {} \"{}\": {} (byte {}); type it as UTF-8 text", i,
                                          units::printable(argument), fault->what, fault->offset + 1));
    }
  }
}

}  // namespace stackbound::cli
