#include "stackbound/cli/cli_support.hpp"

#include <algorithm>
#include <iostream>

#include <fmt/format.h>

#include "stackbound/units/input_error.hpp"
#include "stackbound/units/quantity_parser.hpp"

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

units::Pressure checked_pressure(std::string_view text, std::string_view option, const cases::PlausibleRange& range) {
  const units::Pressure pressure = units::parse_pressure(text, option);
  if (const auto problem = cases::outside(pressure.value(), range)) {
    throw units::InputError(fmt::format("{} = \"{}\": {}", option, text, *problem));
  }
  return pressure;
}

std::vector<std::string> split_list(std::string_view text, std::string_view option) {
  std::vector<std::string> items;
  std::size_t start = 0;
  while (start <= text.size()) {
    const std::size_t comma = std::min(text.find(',', start), text.size());
    std::string item(text.substr(start, comma - start));
    const auto first = item.find_first_not_of(" \t");
    const auto last = item.find_last_not_of(" \t");
    item = first == std::string::npos ? "" : item.substr(first, last - first + 1);
    if (item.empty()) {
      throw units::InputError(fmt::format("{} = \"{}\": empty item in the comma-separated list", option, text));
    }
    items.push_back(item);
    start = comma + 1;
  }
  return items;
}

}  // namespace stackbound::cli
