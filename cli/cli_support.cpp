#include "stackbound/cli/cli_support.hpp"

#include <filesystem>
#include <iostream>

#include <fmt/format.h>

#include "stackbound/units/input_error.hpp"

namespace stackbound::cli {

OutputStream::OutputStream(const std::string& path) : path_(path), to_stdout_(path.empty() || path == "-") {
  if (to_stdout_) return;
  temporary_ = path_ + ".partial";
  file_ = std::fopen(temporary_.c_str(), "wb");
  if (file_ == nullptr) throw units::InputError(fmt::format("--output = \"{}\": cannot write there", path_));
}

OutputStream::~OutputStream() {
  if (file_ != nullptr) std::fclose(file_);
  if (!to_stdout_ && !committed_) std::remove(temporary_.c_str());
}

void OutputStream::write(std::string_view text) {
  if (to_stdout_) {
    std::cout << text;
    return;
  }
  if (std::fwrite(text.data(), 1, text.size(), file_) != text.size()) {
    throw units::InputError(fmt::format("--output = \"{}\": writing failed", path_));
  }
}

void OutputStream::commit() {
  if (to_stdout_) {
    std::cout.flush();
    return;
  }
  const bool closed = std::fclose(file_) == 0;
  file_ = nullptr;
  std::error_code error;
  if (closed) std::filesystem::rename(temporary_, path_, error);
  if (!closed || error) throw units::InputError(fmt::format("--output = \"{}\": cannot write the file", path_));
  committed_ = true;
}

void write_output(const std::string& path, std::string_view content) {
  OutputStream out(path);
  out.write(content);
  out.commit();
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

}  // namespace stackbound::cli
