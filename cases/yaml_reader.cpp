#include "stackbound/cases/yaml_reader.hpp"

#include <algorithm>

#include <fmt/format.h>

#include "stackbound/cases/yaml_document.hpp"
#include "stackbound/units/input_error.hpp"
#include "stackbound/units/nearest_name.hpp"

namespace stackbound::cases {

YamlField::YamlField(YAML::Node node, std::string origin, std::string path, SourceMap* sources)
    : node_(std::move(node)), origin_(std::move(origin)), path_(std::move(path)), sources_(sources) {}

YamlField YamlField::load(std::string_view text, const std::string& origin, SourceMap* sources) {
  const YAML::Node root = load_yaml_document(text, origin);
  if (!root.IsMap()) {
    throw units::InputError(fmt::format("{}:1:1: the case file must be a YAML mapping of sections (case, fuel, air, "
                                        "operating_point, firing, stack, report)",
                                        origin));
  }
  return YamlField(root, origin, "", sources);
}

YamlField YamlField::child(YAML::Node node, std::string path) const {
  YamlField field(std::move(node), origin_, std::move(path), sources_);
  if (sources_ != nullptr) sources_->add(field.path_, field.location());
  return field;
}

bool YamlField::has(std::string_view key) const { return node_.IsMap() && node_[std::string(key)].IsDefined(); }

namespace {

// "file:line:column"; a node built in memory (not parsed from text) has no position: the origin alone.
std::string position(const std::string& origin, const YAML::Mark& mark) {
  if (mark.line < 0) return origin;
  return fmt::format("{}:{}:{}", origin, mark.line + 1, mark.column + 1);
}

}  // namespace

std::string YamlField::location() const { return position(origin_, node_.Mark()); }

void YamlField::fail(const std::string& problem) const {
  const std::string where = path_.empty() ? "(top level)" : path_;
  if (node_.IsScalar()) {
    throw units::InputError(fmt::format("{}: {} = \"{}\": {}", location(), where, node_.Scalar(), problem));
  }
  throw units::InputError(fmt::format("{}: {}: {}", location(), where, problem));
}

void YamlField::allow_only(std::initializer_list<std::string_view> allowed) const {
  if (!node_.IsMap()) fail("expected a mapping of keys");
  const std::vector<std::string> names(allowed.begin(), allowed.end());
  for (const auto& entry : node_) {
    const std::string key = entry.first.Scalar();
    if (std::find(names.begin(), names.end(), key) != names.end()) continue;
    std::string problem = fmt::format("unknown key \"{}\"", key);
    if (const auto suggestion = units::nearest_name(key, names)) problem += fmt::format(" (did you mean \"{}\"?)", *suggestion);
    problem += fmt::format("; accepted keys: {}", fmt::join(names, ", "));
    throw units::InputError(fmt::format("{}: {}: {}", position(origin_, entry.first.Mark()),
                                        path_.empty() ? "(top level)" : path_, problem));
  }
}

std::string YamlField::one_of(std::initializer_list<std::string_view> keys) const {
  std::vector<std::string> present;
  for (const std::string_view key : keys) {
    if (has(key)) present.emplace_back(key);
  }
  if (present.size() != 1) {
    fail(fmt::format("{} one of: {}", present.empty() ? "needs exactly" : "has more than", fmt::join(keys, ", ")) +
         (present.size() > 1 ? fmt::format(" (found {})", fmt::join(present, " and ")) : ""));
  }
  return present.front();
}

YamlField YamlField::required(std::string_view key) const {
  if (!node_.IsMap()) fail("expected a mapping of keys");
  if (!has(key)) fail(fmt::format("missing required key \"{}\"", key));
  return child(node_[std::string(key)], path_.empty() ? std::string(key) : path_ + "." + std::string(key));
}

std::optional<YamlField> YamlField::optional(std::string_view key) const {
  if (!has(key)) return std::nullopt;
  const YAML::Node node = node_[std::string(key)];
  if (node.IsNull()) return std::nullopt;
  return this->child(node, path_.empty() ? std::string(key) : path_ + "." + std::string(key));
}

YamlField YamlField::element(std::size_t index) const {
  if (!node_.IsSequence()) fail("expected a list");
  return child(node_[index], fmt::format("{}[{}]", path_, index));
}

std::vector<std::pair<std::string, YamlField>> YamlField::entries() const {
  if (!node_.IsMap()) fail("expected a mapping of keys");
  std::vector<std::pair<std::string, YamlField>> result;
  for (const auto& entry : node_) {
    const std::string key = entry.first.Scalar();
    result.emplace_back(key, child(entry.second, path_.empty() ? key : path_ + "." + key));
  }
  return result;
}

std::string YamlField::text() const {
  if (!node_.IsScalar()) fail("expected a single value, not a list or mapping");
  return node_.Scalar();
}

std::string YamlField::choice(std::initializer_list<std::string_view> accepted) const {
  const std::string value = text();
  for (const std::string_view option : accepted) {
    if (option == value) return value;
  }
  const std::vector<std::string> names(accepted.begin(), accepted.end());
  std::string problem = "not an accepted value";
  if (const auto suggestion = units::nearest_name(value, names)) problem += fmt::format(" (did you mean \"{}\"?)", *suggestion);
  fail(problem + fmt::format("; accepted: {}", fmt::join(names, ", ")));
}

bool YamlField::boolean() const {
  const std::string value = text();
  if (value == "true" || value == "yes") return true;
  if (value == "false" || value == "no") return false;
  fail("expected true or false");
}

units::ParsedQuantity YamlField::quantity(std::initializer_list<units::Dimension> accepted) const {
  const std::string value = text();
  try {
    return units::parse_quantity(value, path_, accepted);
  } catch (const units::InputError& error) {
    throw units::InputError(fmt::format("{}: {}", location(), error.what()));
  }
}

double YamlField::number() const { return quantity({units::Dimension::dimensionless}).value_si; }

}  // namespace stackbound::cases
