#include "stackbound/cases/source_map.hpp"

#include <algorithm>

namespace stackbound::cases {

namespace {

// "a.b[2].c" -> "a.b[2]" -> "a.b" -> "a" -> "".
std::string_view parent_of(std::string_view path) {
  const std::size_t cut = path.find_last_of(".[");
  return cut == std::string_view::npos ? std::string_view() : path.substr(0, cut);
}

// A field path holds names, dots and indices only; "fuel.gas = \"CH5\"" (a message of its own) is none.
bool is_field_path(std::string_view text) {
  return !text.empty() && std::all_of(text.begin(), text.end(), [](char c) {
    return (c >= 'a' && c <= 'z') || (c >= 'A' && c <= 'Z') || (c >= '0' && c <= '9') || c == '_' || c == '.' ||
           c == '[' || c == ']';
  });
}

}  // namespace

SourceMap SourceMap::for_document(std::string origin) {
  SourceMap map(std::move(origin));
  map.keeps_paths_ = true;
  return map;
}

void SourceMap::add(std::string path, std::string location) {
  const auto found =
      std::find_if(entries_.begin(), entries_.end(), [&](const auto& entry) { return entry.first == path; });
  if (found != entries_.end()) {
    found->second = std::move(location);
  } else {
    entries_.emplace_back(std::move(path), std::move(location));
  }
}

std::optional<std::string> SourceMap::location_of(std::string_view path) const {
  for (std::string_view part = path; !part.empty(); part = parent_of(part)) {
    const auto found =
        std::find_if(entries_.begin(), entries_.end(), [&](const auto& entry) { return entry.first == part; });
    if (found != entries_.end()) return found->second;
  }
  return std::nullopt;
}

std::string SourceMap::locate(std::string_view message) const {
  const std::size_t colon = message.find(": ");
  if (colon == std::string_view::npos) return std::string(message);
  const std::string_view path = message.substr(0, colon);
  if (keeps_paths_) return is_field_path(path) ? origin_ + ": " + std::string(message) : std::string(message);
  const std::optional<std::string> location = is_field_path(path) ? location_of(path) : std::nullopt;
  if (!location) return std::string(message);
  return *location + std::string(message.substr(colon));
}

}  // namespace stackbound::cases
