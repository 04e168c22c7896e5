#include "stackbound/cases/fuel_file.hpp"

#include <vector>

#include <fmt/format.h>

#include "stackbound/cases/fuel_spec.hpp"
#include "stackbound/cases/input_file.hpp"
#include "stackbound/cases/plausible_ranges.hpp"
#include "stackbound/cases/source_map.hpp"
#include "stackbound/cases/yaml_reader.hpp"
#include "stackbound/units/input_error.hpp"

namespace stackbound::cases {

namespace {

using units::Dimension;

FuelFile read_fuel(const YamlField& root, const SourceMap& sources, const core::SpeciesDatabase& database) {
  root.allow_only({"fuel"});
  const YamlField fuel = root.required("fuel");
  const FuelSpec spec = read_fuel_spec(fuel, false);
  // What the species data refuse is reported at the position of the field concerned.
  FuelFile file{with_positions(sources, [&] { return build_fuel(spec, database); }), std::nullopt, "", std::nullopt};
  if (const auto rate = fuel.optional("feed_rate")) {
    file.feed_rate = rate->quantity({Dimension::mass_flow, Dimension::molar_flow, Dimension::power});
    file.feed_rate_text = rate->text();
    if (!(file.feed_rate->value_si > 0.0)) rate->fail("must be > 0");
    if (const auto problem = outside(file.feed_rate->value_si, feed_range(file.feed_rate->dimension))) {
      rate->fail(*problem);
    }
  }
  if (const auto t = fuel.optional("temperature")) file.temperature_K = t->quantity_si(Dimension::temperature);
  return file;
}

}  // namespace

FuelFile parse_fuel_file(std::string_view text, const std::string& origin, const core::SpeciesDatabase& database) {
  SourceMap sources(origin);
  const YamlField root = YamlField::load(text, origin, &sources);
  return read_fuel(root, sources, database);
}

FuelFile read_fuel_document(const YAML::Node& document, const std::string& origin,
                            const core::SpeciesDatabase& database) {
  if (!document.IsMap()) throw units::InputError(origin + ": a fuel document must be a mapping with the key fuel");
  const SourceMap sources = SourceMap::for_document(origin);
  return read_fuel(YamlField(document, origin, "", nullptr), sources, database);
}

FuelFile read_fuel_file(const std::string& path, const core::SpeciesDatabase& database) {
  return parse_fuel_file(read_input_file(path, "FILE", "fuel file"), path, database);
}

}  // namespace stackbound::cases
