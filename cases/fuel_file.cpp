#include "cases/fuel_file.hpp"

#include <fstream>
#include <sstream>
#include <vector>

#include <fmt/format.h>

#include "core/fuel_presets.hpp"
#include "units/input_error.hpp"

namespace stackbound::cases {

namespace {

using units::Dimension;

// Runs `build`, prefixing errors raised by the core layer with the location of `node`.
template <typename Build>
auto located(const YamlField& node, Build build) {
  try {
    return build();
  } catch (const units::InputError& error) {
    const std::string message = error.what();
    if (message.rfind(node.origin(), 0) == 0) throw;
    throw units::InputError(fmt::format("{}: {}", node.location(), message));
  }
}

double percent_of(const YamlField& value) {
  const double fraction = value.quantity_si(Dimension::fraction);
  return fraction * 100.0;
}

std::vector<std::pair<std::string, double>> percentages(const YamlField& mapping) {
  std::vector<std::pair<std::string, double>> items;
  for (const auto& [key, value] : mapping.entries()) items.emplace_back(key, percent_of(value));
  if (items.empty()) mapping.fail("lists no components");
  return items;
}

core::Fuel build(const YamlField& fuel, const core::SpeciesDatabase& database, bool part) {
  if (part) {
    fuel.allow_only({"name", "preset", "gas", "gas_basis", "ultimate", "ultimate_basis", "state", "heating_value",
                     "heating_value_basis", "heating_value_correlation", "specific_heat", "fraction"});
  } else {
    fuel.allow_only({"name", "preset", "gas", "gas_basis", "ultimate", "ultimate_basis", "state", "heating_value",
                     "heating_value_basis", "heating_value_correlation", "specific_heat", "blend", "blend_by",
                     "feed_rate", "temperature"});
  }
  const std::string kind = part ? fuel.one_of({"preset", "gas", "ultimate"}) : fuel.one_of({"preset", "gas", "ultimate", "blend"});
  const std::optional<YamlField> name = fuel.optional("name");
  const std::string path = fuel.path();

  if (kind == "preset") {
    const YamlField preset = fuel.required("preset");
    const core::Fuel built = located(preset, [&] { return core::preset_fuel(preset.text(), database, preset.path()); });
    return name ? built.with_name(name->text()) : built;
  }
  if (kind == "gas") {
    const YamlField gas = fuel.required("gas");
    core::GasFuelSpec spec;
    spec.name = name ? name->text() : "gas fuel";
    spec.composition_percent = percentages(gas);
    if (const auto basis = fuel.optional("gas_basis")) {
      spec.basis = basis->choice({"mole", "mass"}) == "mass" ? core::CompositionBasis::mass : core::CompositionBasis::mole;
    }
    spec.field = gas.path();
    return located(gas, [&] { return core::Fuel::gas(spec, database); });
  }
  if (kind == "ultimate") {
    const YamlField ultimate = fuel.required("ultimate");
    ultimate.allow_only({"C", "H", "O", "N", "S", "ash", "moisture"});
    core::CondensedFuelSpec spec;
    spec.name = name ? name->text() : "fuel";
    spec.field = path;
    core::UltimateAnalysis& a = spec.analysis;
    for (const auto& [key, value] : ultimate.entries()) {
      const double percent = percent_of(value);
      if (key == "C") a.carbon_percent = percent;
      if (key == "H") a.hydrogen_percent = percent;
      if (key == "O") a.oxygen_percent = percent;
      if (key == "N") a.nitrogen_percent = percent;
      if (key == "S") a.sulfur_percent = percent;
      if (key == "ash") a.ash_percent = percent;
      if (key == "moisture") a.moisture_percent = percent;
    }
    if (const auto basis = fuel.optional("ultimate_basis")) {
      const std::string b = basis->choice({"as_received", "dry", "dry_ash_free"});
      a.basis = b == "dry" ? core::AnalysisBasis::dry
                : b == "dry_ash_free" ? core::AnalysisBasis::dry_ash_free
                                      : core::AnalysisBasis::as_received;
    }
    if (const auto state = fuel.optional("state")) {
      spec.state = state->choice({"solid", "liquid"}) == "liquid" ? core::FuelState::liquid : core::FuelState::solid;
    }
    if (const auto hv = fuel.optional("heating_value")) {
      if (fuel.has("heating_value_correlation")) hv->fail("give a measured heating_value or a correlation, not both");
      core::MeasuredHeatingValue measured;
      measured.value_J_per_kg = hv->quantity_si(Dimension::specific_energy);
      measured.basis = a.basis;
      if (const auto kind_field = fuel.optional("heating_value_basis")) {
        measured.kind = kind_field->choice({"HHV", "LHV"}) == "LHV" ? core::HeatingValueKind::lower
                                                                    : core::HeatingValueKind::higher;
      }
      spec.heating_value = measured;
    } else if (const auto correlation = fuel.optional("heating_value_correlation")) {
      spec.estimate = correlation->choice({"channiwala_parikh", "boie"}) == "boie"
                          ? core::HeatingValueCorrelation::boie
                          : core::HeatingValueCorrelation::channiwala_parikh;
    }
    if (const auto cp = fuel.optional("specific_heat")) {
      // Plain number in kJ/(kg K), as in case files (the unit parser has no specific-heat units).
      const double kJ = cp->number();
      if (!(kJ > 0.0 && kJ < 10.0)) cp->fail("must be a plain number in kJ/(kg K) between 0 and 10");
      spec.specific_heat_J_per_kg_K = kJ * 1e3;
    }
    return located(fuel, [&] { return core::Fuel::condensed(spec, database); });
  }
  const YamlField blend = fuel.required("blend");
  if (!blend.is_sequence() || blend.size() < 2) blend.fail("expected a list of two or more fuels, each with a fraction");
  std::vector<core::BlendPart> parts;
  for (std::size_t i = 0; i < blend.size(); ++i) {
    const YamlField component = blend.element(i);
    parts.push_back({build(component, database, true), percent_of(component.required("fraction"))});
  }
  core::BlendBasis basis = core::BlendBasis::mass;
  if (const auto by = fuel.optional("blend_by")) {
    const std::string b = by->choice({"mass", "mole", "heat"});
    basis = b == "mole" ? core::BlendBasis::mole : b == "heat" ? core::BlendBasis::heat_input : core::BlendBasis::mass;
  }
  return located(blend, [&] {
    return core::Fuel::blend(name ? name->text() : "fuel blend", parts, basis, blend.path());
  });
}

}  // namespace

core::Fuel fuel_from_yaml(const YamlField& fuel, const core::SpeciesDatabase& database) {
  return build(fuel, database, false);
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
  std::ifstream in(path);
  if (!in) throw units::InputError(fmt::format("FILE = \"{}\": cannot open the fuel file", path));
  std::ostringstream text;
  text << in.rdbuf();
  return parse_fuel_file(text.str(), path, database);
}

}  // namespace stackbound::cases
