#include "stackbound/cases/input_file.hpp"

#include <filesystem>
#include <fstream>
#include <iterator>
#include <system_error>

#include <fmt/format.h>

#include "stackbound/units/input_error.hpp"

namespace stackbound::cases {

std::string read_input_file(const std::string& path, std::string_view field, std::string_view kind) {
  namespace fs = std::filesystem;
  const auto refuse = [&](std::string_view problem) {
    throw units::InputError(fmt::format("{} = \"{}\": {}", field, path, problem));
  };
  std::error_code error;
  const fs::file_status status = fs::status(path, error);
  if (error || !fs::exists(status)) refuse(fmt::format("no such {}", kind));
  if (fs::is_directory(status)) refuse(fmt::format("is a directory; give the {} itself", kind));
  if (!fs::is_regular_file(status)) refuse(fmt::format("is not a regular file (a device or a pipe); give a {}", kind));
  const std::uintmax_t size = fs::file_size(path, error);
  if (error) refuse(fmt::format("cannot read the {}: {}", kind, error.message()));
  if (size > kMaxInputFileBytes) {
    refuse(fmt::format("the {} is {} bytes, more than the {} bytes (1 MiB) an input file may hold", kind, size,
                       kMaxInputFileBytes));
  }
  std::ifstream in(path, std::ios::binary);
  if (!in) refuse(fmt::format("cannot open the {}", kind));
  std::string text(static_cast<std::size_t>(size), '\0');
  in.read(text.data(), static_cast<std::streamsize>(text.size()));
  if (in.gcount() != static_cast<std::streamsize>(text.size()) || in.bad()) {
    refuse(fmt::format("cannot read the {}", kind));
  }
  return text;
}

}  // namespace stackbound::cases
