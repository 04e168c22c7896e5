#include "stackbound/cases/fuel_file.hpp"

#include <vector>

#include <fmt/format.h>

#include "stackbound/cases/fuel_spec.hpp"
#include "stackbound/cases/input_file.hpp"
#include "stackbound/units/input_error.hpp"

namespace stackbound::cases {

namespace {
using units::Dimension;
}  // namespace

core::Fuel fuel_from_yaml(const YamlField& fuel, const core::SpeciesDatabase& database) {
  return build_fuel(read_fuel_spec(fuel, false), database);
}

FuelFile parse_fuel_file(std::string_view text, const std::string& origin, const core::SpeciesDatabase& database) {
  const YamlField root = YamlField::load(text, origin);
  root.allow_only({"fuel"});
  const YamlField fuel = root.required("fuel");
  FuelFile file{fuel_from_yaml(fuel, database), std::nullopt, "", std::nullopt};
  if (const auto rate = fuel.optional("feed_rate")) {
    file.feed_rate = rate->quantity({Dimension::mass_flow, Dimension::molar_flow, Dimension::power});
    file.feed_rate_text = rate->text();
    if (!(file.feed_rate->value_si > 0.0)) rate->fail("must be > 0");
  }
  if (const auto t = fuel.optional("temperature")) file.temperature_K = t->quantity_si(Dimension::temperature);
  return file;
}

FuelFile read_fuel_file(const std::string& path, const core::SpeciesDatabase& database) {
  return parse_fuel_file(read_input_file(path, "FILE", "fuel file"), path, database);
}

}  // namespace stackbound::cases
