#pragma once
// Field paths and file positions. The loader parses and checks every value of a case file itself and
// reports a bad one with its position ("boiler.yaml:14:18: ..."). What can only be found when the case
// runs (a fuel the species data cannot make, a firing temperature outside the data) is raised by the
// run naming the field path instead:
//   firing.temperature: temperature = 4000 K: outside the data range of product CO2 (200-3500 K)
// The run never sees a file position: the loader records where each field was written in a SourceMap,
// and its caller (the program, a sweep, a comparison) puts the position in place of the path:
//   boiler.yaml:9:16: temperature = 4000 K: outside the data range of product CO2 (200-3500 K)

#include <optional>
#include <string>
#include <string_view>
#include <utility>
#include <vector>

#include "stackbound/units/input_error.hpp"

namespace stackbound::cases {

// Where each field of one file was written: field path ("fuel.blend[1].gas") -> "file:line:column".
class SourceMap {
 public:
  explicit SourceMap(std::string origin) : origin_(std::move(origin)) {}
  // For a document built in memory (the Python module's dict), whose fields have no positions:
  // locate() keeps the path and puts the origin in front ("<dict>: firing.temperature: ...").
  [[nodiscard]] static SourceMap for_document(std::string origin);

  [[nodiscard]] const std::string& origin() const { return origin_; }
  // Records (or replaces) the position of `path`.
  void add(std::string path, std::string location);
  // The position of `path`, else of its nearest recorded parent ("stack.measured" for
  // "stack.measured.co", "fuel.blend" for "fuel.blend[1]"); none when no part of it is recorded.
  [[nodiscard]] std::optional<std::string> location_of(std::string_view path) const;
  // A run's message "<path>: <text>" as "<position>: <text>" (for_document(): "<origin>: <path>: <text>");
  // any other message unchanged.
  [[nodiscard]] std::string locate(std::string_view message) const;

 private:
  std::string origin_;
  bool keeps_paths_ = false;  // for_document()
  std::vector<std::pair<std::string, std::string>> entries_;  // a few dozen; searched only on errors
};

// Runs `step`; an InputError it throws is rethrown as "<path>: <message>", naming the case field the
// step works on. Used by the run's stages, which know fields but not file positions.
template <typename Step>
auto at_field(std::string_view path, Step&& step) -> decltype(step()) {
  try {
    return step();
  } catch (const units::InputError& error) {
    throw units::InputError(std::string(path) + ": " + error.what());
  }
}

// Runs `step` (a run of a loaded case); an InputError naming a field path recorded in `sources` is
// rethrown with the field's file position in place of the path.
template <typename Step>
auto with_positions(const SourceMap& sources, Step&& step) -> decltype(step()) {
  try {
    return step();
  } catch (const units::InputError& error) {
    throw units::InputError(sources.locate(error.what()));
  }
}

}  // namespace stackbound::cases
