#include "stackbound/cases/species_file.hpp"


#include <fmt/format.h>
#include <yaml-cpp/yaml.h>

#include "stackbound/cases/input_file.hpp"
#include "stackbound/cases/yaml_document.hpp"
#include "stackbound/units/input_error.hpp"

namespace stackbound::cases {

namespace detail {
extern const std::string_view kBuiltinSpeciesYaml;
}

namespace {

[[noreturn]] void fail(std::string_view origin, const YAML::Node& node, const std::string& field,
                       const std::string& rule) {
  const YAML::Mark mark = node.Mark();
  throw units::InputError(fmt::format("{}:{}:{}: {}: {}", origin, mark.line + 1, mark.column + 1, field, rule));
}

double number_at(std::string_view origin, const YAML::Node& node, const std::string& field) {
  if (!node || !node.IsScalar()) fail(origin, node, field, "expected a number");
  try {
    return node.as<double>();
  } catch (const YAML::Exception&) {
    fail(origin, node, field, fmt::format("\"{}\" is not a number", node.Scalar()));
  }
}

core::Nasa7 coefficients_at(std::string_view origin, const YAML::Node& node, const std::string& field) {
  if (!node || !node.IsSequence() || node.size() != 7) {
    fail(origin, node, field, "expected a list of 7 NASA coefficients [a1, ..., a7]");
  }
  core::Nasa7 a{};
  for (std::size_t i = 0; i < 7; ++i) a[i] = number_at(origin, node[i], fmt::format("{}[{}]", field, i));
  return a;
}

core::Species species_from(std::string_view origin, const YAML::Node& node, std::size_t index) {
  const std::string where = fmt::format("species[{}]", index);
  if (!node.IsMap()) fail(origin, node, where, "expected a mapping with formula, composition, phase, ...");
  static const char* const kKeys[] = {"formula", "composition", "phase", "range_K",
                                      "below_mid", "above_mid", "source", "origin"};
  for (const auto& entry : node) {
    const std::string key = entry.first.Scalar();
    if (std::find(std::begin(kKeys), std::end(kKeys), key) == std::end(kKeys)) {
      fail(origin, entry.first, where + "." + key,
           "unknown key; accepted: formula, composition, phase, range_K, below_mid, above_mid, source, origin");
    }
  }
  core::SpeciesRecord record;
  const YAML::Node formula = node["formula"];
  if (!formula || !formula.IsScalar()) fail(origin, node, where + ".formula", "missing (a chemical formula)");
  record.formula = formula.Scalar();
  const std::string field = fmt::format("species {}", record.formula);

  const YAML::Node composition = node["composition"];
  if (!composition || !composition.IsMap() || composition.size() == 0) {
    fail(origin, composition ? composition : node, field + ".composition", "expected a mapping element: count");
  }
  for (const auto& entry : composition) {
    record.composition.push_back(
        {entry.first.Scalar(),
         number_at(origin, entry.second, field + ".composition." + entry.first.Scalar())});
  }

  const YAML::Node phase = node["phase"];
  const std::string phase_text = phase && phase.IsScalar() ? phase.Scalar() : "";
  if (phase_text == "gas") {
    record.phase = core::Phase::gas;
  } else if (phase_text == "condensed") {
    record.phase = core::Phase::condensed;
  } else {
    fail(origin, phase ? phase : node, field + ".phase", fmt::format("\"{}\": accepted: gas, condensed", phase_text));
  }

  const YAML::Node range = node["range_K"];
  if (!range || !range.IsMap()) fail(origin, range ? range : node, field + ".range_K", "expected {low, mid, high}");
  record.range = {units::kelvin(number_at(origin, range["low"], field + ".range_K.low")),
                  units::kelvin(number_at(origin, range["mid"], field + ".range_K.mid")),
                  units::kelvin(number_at(origin, range["high"], field + ".range_K.high"))};
  record.below_mid = coefficients_at(origin, node["below_mid"], field + ".below_mid");
  record.above_mid = coefficients_at(origin, node["above_mid"], field + ".above_mid");
  const YAML::Node source = node["source"];
  if (!source || !source.IsScalar() || source.Scalar().empty()) {
    fail(origin, source ? source : node, field + ".source", "missing: every record names its published source");
  }
  record.source = source.Scalar();
  if (const YAML::Node note = node["origin"]) record.origin = note.Scalar();
  try {
    return core::Species(std::move(record));
  } catch (const units::InputError& error) {
    fail(origin, node, where, error.what());
  }
}

}  // namespace

std::vector<core::Species> parse_species_yaml(std::string_view text, std::string_view origin) {
  const YAML::Node root = load_yaml_document(text, origin);
  if (!root.IsMap() || !root["species"] || !root["species"].IsSequence()) {
    throw units::InputError(fmt::format("{}: expected a top-level key `species:` holding a list of records", origin));
  }
  std::vector<core::Species> species;
  std::size_t index = 0;
  for (const YAML::Node& node : root["species"]) species.push_back(species_from(origin, node, index++));
  return species;
}

std::vector<core::Species> read_species_file(const std::string& path) {
  return parse_species_yaml(read_input_file(path, "--species-file", "species file"), path);
}

const core::SpeciesDatabase& builtin_species() {
  // Parsed once, then immutable.
  static const core::SpeciesDatabase database(parse_species_yaml(detail::kBuiltinSpeciesYaml, "built-in species data"));
  return database;
}

core::SpeciesDatabase species_database(const std::string& user_file) {
  if (user_file.empty()) return builtin_species();
  return builtin_species().with(read_species_file(user_file));
}

}  // namespace stackbound::cases
