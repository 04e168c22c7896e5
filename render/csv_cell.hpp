#pragma once
// RFC 4180 quoting of one CSV cell: quoted when it holds a comma, a quote or a line break.

#include <string>
#include <string_view>

namespace stackbound::render {

inline std::string csv_cell(std::string_view cell) {
  if (cell.find_first_of(",\"\n") == std::string_view::npos) return std::string(cell);
  std::string quoted = "\"";
  for (const char c : cell) {
    if (c == '"') quoted += '"';
    quoted += c;
  }
  return quoted + "\"";
}

}  // namespace stackbound::render
