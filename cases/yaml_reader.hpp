#pragma once
// Reading a case file with located errors. A YamlField wraps one YAML node with the file it came
// from and its field path ("fuel.feed_rate"); every error it raises reads
//   boiler.yaml:14:18: operating_point.excess_air = "-5 %": must be >= 0 %
// Unknown keys are refused with the nearest valid key suggested. A document loaded with a SourceMap
// records there the position of every field read from it, for errors found later (source_map.hpp).

#include <initializer_list>
#include <optional>
#include <string>
#include <string_view>
#include <vector>

#include <yaml-cpp/yaml.h>

#include "stackbound/cases/source_map.hpp"
#include "stackbound/units/input_error.hpp"
#include "stackbound/units/quantity_parser.hpp"

namespace stackbound::cases {

class YamlField {
 public:
  YamlField(YAML::Node node, std::string origin, std::string path, SourceMap* sources = nullptr);

  // Parses a whole document; YAML syntax errors become InputError with file:line:column. With
  // `sources`, every field read through the result (and its children) is recorded there.
  static YamlField load(std::string_view text, const std::string& origin, SourceMap* sources = nullptr);

  [[nodiscard]] const std::string& path() const { return path_; }
  [[nodiscard]] const std::string& origin() const { return origin_; }
  [[nodiscard]] bool is_map() const { return node_.IsMap(); }
  [[nodiscard]] bool is_sequence() const { return node_.IsSequence(); }
  [[nodiscard]] bool is_scalar() const { return node_.IsScalar(); }
  [[nodiscard]] bool has(std::string_view key) const;
  [[nodiscard]] std::size_t size() const { return node_.size(); }
  // "file:line:column" of this node; the origin alone for a node built in memory.
  [[nodiscard]] std::string location() const;

  // Refuses any key not in `allowed` (this node must be a mapping), suggesting the nearest.
  void allow_only(std::initializer_list<std::string_view> allowed) const;
  // Exactly one of `keys` must be present; returns it.
  [[nodiscard]] std::string one_of(std::initializer_list<std::string_view> keys) const;

  [[nodiscard]] YamlField required(std::string_view key) const;           // missing -> error
  [[nodiscard]] std::optional<YamlField> optional(std::string_view key) const;
  [[nodiscard]] YamlField element(std::size_t index) const;               // of a sequence
  [[nodiscard]] std::vector<std::pair<std::string, YamlField>> entries() const;  // of a mapping, in file order

  // Scalars.
  [[nodiscard]] std::string text() const;                                  // any scalar, as written
  [[nodiscard]] std::string choice(std::initializer_list<std::string_view> accepted) const;
  [[nodiscard]] bool boolean() const;                                      // true/false
  [[nodiscard]] units::ParsedQuantity quantity(std::initializer_list<units::Dimension> accepted) const;
  [[nodiscard]] double quantity_si(units::Dimension dimension) const { return quantity({dimension}).value_si; }
  [[nodiscard]] double number() const;                                     // a plain number

  // Throws InputError "<location>: <path> = "<value>": <problem>" (value omitted for non-scalars).
  [[noreturn]] void fail(const std::string& problem) const;

  // Runs `parse` (a parser of another layer, which names the field but knows no file); an InputError
  // it throws is rethrown with this field's location in front.
  template <typename Parse>
  auto located(Parse&& parse) const -> decltype(parse()) {
    try {
      return parse();
    } catch (const units::InputError& error) {
      throw units::InputError(location() + ": " + error.what());
    }
  }

 private:
  // A child field, recorded in sources_.
  [[nodiscard]] YamlField child(YAML::Node node, std::string path) const;

  YAML::Node node_;
  std::string origin_;
  std::string path_;
  SourceMap* sources_ = nullptr;  // the loading caller's record of positions; not owned
};

}  // namespace stackbound::cases
