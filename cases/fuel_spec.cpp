#include "stackbound/cases/fuel_spec.hpp"

#include <fmt/format.h>
#include <fmt/ranges.h>

#include <algorithm>

#include "stackbound/core/composition_notation.hpp"
#include "stackbound/core/fuel_presets.hpp"
#include "stackbound/units/input_error.hpp"

namespace stackbound::cases {

namespace {

using units::Dimension;

// A composition written as one text ("CH4 93 %, C2H6 4 %", the command line's notation, or the former
// "CH4=93, C2H6=4") is refused with the mapping to write instead: in a file, compositions are YAML
// mappings.
void refuse_text_composition(const YamlField& node, std::string_view example) {
  if (!node.is_scalar()) return;
  const std::string text = node.text();
  std::vector<std::string> entries;
  std::size_t start = 0;
  while (start <= text.size() && !text.empty()) {
    const std::size_t end = std::min(text.find(',', start), text.size());
    const std::string item = text.substr(start, end - start);
    start = end + 1;
    std::string entry;
    if (const std::size_t equals = item.find('='); equals != std::string::npos) {
      const auto trim = [](std::string s) {
        s.erase(0, std::min(s.find_first_not_of(" \t"), s.size()));
        s.erase(std::min(s.find_last_not_of(" \t%") + 1, s.size()));
        return s;
      };
      const std::string name = trim(item.substr(0, equals));
      const std::string value = trim(item.substr(equals + 1));
      if (!name.empty() && !value.empty()) entry = fmt::format("{}: {} %", name, value);
    } else {
      try {
        for (const auto& [name, percent] : core::parse_analysis(item, node.path())) {
          entry = fmt::format("{}: {} %", name, percent);
        }
      } catch (const units::InputError&) {
        entry.clear();
      }
    }
    if (entry.empty()) node.fail(fmt::format("expected a mapping of percentages, e.g. {}", example));
    entries.push_back(entry);
  }
  if (entries.empty()) node.fail(fmt::format("expected a mapping of percentages, e.g. {}", example));
  node.fail(fmt::format("a composition in a file is a YAML mapping: write {{{}}}", fmt::join(entries, ", ")));
}

std::vector<GasComponent> percentages(const YamlField& mapping) {
  std::vector<GasComponent> items;
  for (const auto& [key, value] : mapping.entries()) {
    const double fraction = value.quantity_si(Dimension::fraction);
    if (fraction < 0.0) value.fail("must be >= 0 %");
    items.push_back({key, fraction * 100.0});
  }
  if (items.empty()) mapping.fail("lists no components");
  return items;
}

}  // namespace

FuelSpec read_fuel_spec(const YamlField& fuel, bool blend_part) {
  if (blend_part) {
    fuel.allow_only({"name", "preset", "gas", "gas_basis", "ultimate", "ultimate_basis", "state", "heating_value",
                     "heating_value_basis", "heating_value_correlation", "specific_heat", "fraction"});
  } else {
    fuel.allow_only({"name", "preset", "gas", "gas_basis", "ultimate", "ultimate_basis", "state", "heating_value",
                     "heating_value_basis", "heating_value_correlation", "specific_heat", "blend", "blend_by",
                     "feed_rate", "temperature"});
  }
  FuelSpec spec;
  spec.location = fuel.location();
  spec.field = fuel.path();
  const std::string kind =
      blend_part ? fuel.one_of({"preset", "gas", "ultimate"}) : fuel.one_of({"preset", "gas", "ultimate", "blend"});
  const YamlField kind_node = fuel.required(kind);
  spec.kind_location = kind_node.location();
  if (const auto name = fuel.optional("name")) spec.name = name->text();
  if (kind == "preset") {
    spec.preset = kind_node.text();
  } else if (kind == "gas") {
    refuse_text_composition(kind_node, "{CH4: 93 %, C2H6: 4 %, CO2: 1 %, N2: 2 %}");
    spec.gas = percentages(kind_node);
    if (const auto basis = fuel.optional("gas_basis")) spec.gas_basis = basis->choice({"mole", "mass"});
  } else if (kind == "ultimate") {
    refuse_text_composition(kind_node, "{C: 75 %, H: 5 %, O: 6.7 %, N: 1.5 %, S: 2.3 %, ash: 9.5 %, moisture: 8 %}");
    kind_node.allow_only({"C", "H", "O", "N", "S", "ash", "moisture"});
    spec.ultimate = percentages(kind_node);
    if (const auto basis = fuel.optional("ultimate_basis")) {
      spec.ultimate_basis = basis->choice({"as_received", "dry", "dry_ash_free"});
    }
    if (const auto state = fuel.optional("state")) spec.state = state->choice({"solid", "liquid"});
    if (const auto correlation = fuel.optional("heating_value_correlation")) {
      if (fuel.has("heating_value")) correlation->fail("give a measured heating_value or a correlation, not both");
      spec.heating_value_correlation = correlation->choice({"channiwala_parikh", "boie"});
    }
    if (const auto cp = fuel.optional("specific_heat")) {
      // Plain number in kJ/(kg K): the unit parser has no specific-heat units.
      const double kJ = cp->number();
      if (!(kJ > 0.0 && kJ < 10.0)) cp->fail("must be a plain number in kJ/(kg K) between 0 and 10");
      spec.specific_heat_J_per_kg_K = kJ * 1e3;
    }
  } else {
    if (!kind_node.is_sequence() || kind_node.size() < 2) {
      kind_node.fail("expected a list of two or more fuels, each with a fraction");
    }
    for (std::size_t i = 0; i < kind_node.size(); ++i) {
      const YamlField component = kind_node.element(i);
      FuelSpec part = read_fuel_spec(component, true);
      const YamlField fraction = component.required("fraction");
      const double value = fraction.quantity_si(Dimension::fraction);
      if (!(value >= 0.0 && value <= 1.0)) fraction.fail("must be between 0 % and 100 %");
      spec.blend.emplace_back(std::move(part), value);
    }
    if (const auto by = fuel.optional("blend_by")) spec.blend_by = by->choice({"mass", "mole", "heat"});
  }
  if (const auto hv = fuel.optional("heating_value")) {
    spec.heating_value_J_per_kg = hv->quantity_si(Dimension::specific_energy);
    if (*spec.heating_value_J_per_kg <= 0.0) hv->fail("must be > 0");
  }
  if (const auto basis = fuel.optional("heating_value_basis")) spec.heating_value_basis = basis->choice({"HHV", "LHV"});
  return spec;
}

core::Fuel build_fuel(const FuelSpec& spec, const core::SpeciesDatabase& database) {
  const std::string& field = spec.field;
  if (!spec.preset.empty()) {
    const core::Fuel fuel =
        with_location(spec.kind_location, [&] { return core::preset_fuel(spec.preset, database, field + ".preset"); });
    return spec.name.empty() ? fuel : fuel.with_name(spec.name);
  }
  if (!spec.gas.empty()) {
    core::GasFuelSpec gas;
    gas.name = spec.name.empty() ? "gas fuel" : spec.name;
    for (const GasComponent& c : spec.gas) gas.composition_percent.emplace_back(c.formula, c.percent);
    gas.basis = spec.gas_basis == "mass" ? core::CompositionBasis::mass : core::CompositionBasis::mole;
    gas.field = field + ".gas";
    return with_location(spec.kind_location, [&] { return core::Fuel::gas(gas, database); });
  }
  if (!spec.ultimate.empty()) {
    core::CondensedFuelSpec fuel;
    fuel.name = spec.name.empty() ? "fuel" : spec.name;
    fuel.state = spec.state == "liquid" ? core::FuelState::liquid : core::FuelState::solid;
    core::UltimateAnalysis& a = fuel.analysis;
    for (const GasComponent& c : spec.ultimate) {
      if (c.formula == "C") a.carbon_percent = c.percent;
      if (c.formula == "H") a.hydrogen_percent = c.percent;
      if (c.formula == "O") a.oxygen_percent = c.percent;
      if (c.formula == "N") a.nitrogen_percent = c.percent;
      if (c.formula == "S") a.sulfur_percent = c.percent;
      if (c.formula == "ash") a.ash_percent = c.percent;
      if (c.formula == "moisture") a.moisture_percent = c.percent;
    }
    a.basis = spec.ultimate_basis == "dry"            ? core::AnalysisBasis::dry
              : spec.ultimate_basis == "dry_ash_free" ? core::AnalysisBasis::dry_ash_free
                                                      : core::AnalysisBasis::as_received;
    if (spec.heating_value_J_per_kg) {
      fuel.heating_value = core::MeasuredHeatingValue{
          spec.heating_value_basis == "LHV" ? core::HeatingValueKind::lower : core::HeatingValueKind::higher,
          *spec.heating_value_J_per_kg, a.basis};
    } else if (spec.heating_value_correlation == "channiwala_parikh") {
      fuel.estimate = core::HeatingValueCorrelation::channiwala_parikh;
    } else if (spec.heating_value_correlation == "boie") {
      fuel.estimate = core::HeatingValueCorrelation::boie;
    }
    fuel.specific_heat_J_per_kg_K = spec.specific_heat_J_per_kg_K;
    fuel.field = field;
    return with_location(spec.location, [&] { return core::Fuel::condensed(fuel, database); });
  }
  std::vector<core::BlendPart> parts;
  for (const auto& [part, fraction] : spec.blend) parts.push_back({build_fuel(part, database), fraction * 100.0});
  const core::BlendBasis basis = spec.blend_by == "mole"   ? core::BlendBasis::mole
                                 : spec.blend_by == "heat" ? core::BlendBasis::heat_input
                                                           : core::BlendBasis::mass;
  return with_location(spec.kind_location, [&] {
    return core::Fuel::blend(spec.name.empty() ? "fuel blend" : spec.name, parts, basis, field + ".blend");
  });
}

}  // namespace stackbound::cases
