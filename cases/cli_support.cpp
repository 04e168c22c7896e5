#include "cases/cli_support.hpp"

#include <cstdio>
#include <filesystem>
#include <fstream>
#include <iostream>

#include <fmt/format.h>

#include "units/input_error.hpp"

namespace stackbound::cases {

void write_output(const std::string& path, std::string_view content) {
  if (path.empty() || path == "-") {
    std::cout << content;
    std::cout.flush();
    return;
  }
  namespace fs = std::filesystem;
  const fs::path target(path);
  const fs::path temporary = target.parent_path() / (target.filename().string() + ".partial");
  {
    std::ofstream out(temporary, std::ios::binary | std::ios::trunc);
    if (!out) throw units::InputError(fmt::format("--output = \"{}\": cannot write there", path));
    out.write(content.data(), static_cast<std::streamsize>(content.size()));
    out.close();
    if (!out) {
      std::error_code ignored;
      fs::remove(temporary, ignored);
      throw units::InputError(fmt::format("--output = \"{}\": writing failed", path));
    }
  }
  std::error_code error;
  fs::rename(temporary, target, error);
  if (error) {
    fs::remove(temporary, error);
    throw units::InputError(fmt::format("--output = \"{}\": cannot replace the file", path));
  }
}

CLI::Option* add_format_option(CLI::App& command, std::string& format, const std::vector<std::string>& accepted) {
  format = accepted.front();
  return command.add_option("--format", format, "Output format")
      ->check(CLI::IsMember(accepted))
      ->default_str(accepted.front())
      ->capture_default_str();
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

}  // namespace stackbound::cases
