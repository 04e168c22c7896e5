#include "stackbound/cli/cli_support.hpp"

namespace stackbound::cli {

CLI::Option* add_format_option(CLI::App& command, std::string& format, const std::vector<std::string>& accepted) {
  format = accepted.front();
  return command.add_option("--format", format, "Output format")
      ->check(CLI::IsMember(accepted))
      ->default_str(accepted.front())
      ->capture_default_str();
}

}  // namespace stackbound::cli
