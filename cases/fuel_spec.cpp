#include "stackbound/cases/fuel_spec.hpp"

#include <fmt/format.h>
#include <fmt/ranges.h>

#include <algorithm>

#include "stackbound/cases/source_map.hpp"
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

core::GasFuelSpec gas_spec(const YamlField& fuel, const YamlField& composition, const std::string& name) {
  core::GasFuelSpec gas;
  gas.name = name.empty() ? "gas fuel" : name;
  for (const GasComponent& c : percentages(composition)) gas.composition_percent.emplace_back(c.formula, c.percent);
  if (const auto basis = fuel.optional("gas_basis")) {
    gas.basis = basis->choice({"mole", "mass"}) == "mass" ? core::CompositionBasis::mass : core::CompositionBasis::mole;
  }
  gas.field = fuel.path() + ".gas";
  return gas;
}

core::UltimateAnalysis ultimate_analysis(const YamlField& fuel, const YamlField& analysis) {
  analysis.allow_only({"C", "H", "O", "N", "S", "ash", "moisture"});
  core::UltimateAnalysis a;
  for (const GasComponent& c : percentages(analysis)) {
    if (c.formula == "C") a.carbon_percent = c.percent;
    if (c.formula == "H") a.hydrogen_percent = c.percent;
    if (c.formula == "O") a.oxygen_percent = c.percent;
    if (c.formula == "N") a.nitrogen_percent = c.percent;
    if (c.formula == "S") a.sulfur_percent = c.percent;
    if (c.formula == "ash") a.ash_percent = c.percent;
    if (c.formula == "moisture") a.moisture_percent = c.percent;
  }
  if (const auto basis = fuel.optional("ultimate_basis")) {
    const std::string choice = basis->choice({"as_received", "dry", "dry_ash_free"});
    a.basis = choice == "dry"            ? core::AnalysisBasis::dry
              : choice == "dry_ash_free" ? core::AnalysisBasis::dry_ash_free
                                         : core::AnalysisBasis::as_received;
  }
  return a;
}

// The heating value keys, checked for every kind of fuel (a preset or gas fuel ignores them).
std::optional<core::MeasuredHeatingValue> heating_value(const YamlField& fuel, core::AnalysisBasis basis) {
  std::optional<core::MeasuredHeatingValue> measured;
  if (const auto hv = fuel.optional("heating_value")) {
    measured = core::MeasuredHeatingValue{core::HeatingValueKind::higher, hv->quantity_si(Dimension::specific_energy), basis};
    if (measured->value_J_per_kg <= 0.0) hv->fail("must be > 0");
  }
  if (const auto kind = fuel.optional("heating_value_basis")) {
    const bool lower = kind->choice({"HHV", "LHV"}) == "LHV";
    if (measured) measured->kind = lower ? core::HeatingValueKind::lower : core::HeatingValueKind::higher;
  }
  return measured;
}

core::CondensedFuelSpec condensed_spec(const YamlField& fuel, const YamlField& analysis, const std::string& name) {
  core::CondensedFuelSpec spec;
  spec.name = name.empty() ? "fuel" : name;
  spec.analysis = ultimate_analysis(fuel, analysis);
  if (const auto state = fuel.optional("state")) {
    spec.state = state->choice({"solid", "liquid"}) == "liquid" ? core::FuelState::liquid : core::FuelState::solid;
  }
  if (const auto correlation = fuel.optional("heating_value_correlation")) {
    if (fuel.has("heating_value")) correlation->fail("give a measured heating_value or a correlation, not both");
    spec.estimate = correlation->choice({"channiwala_parikh", "boie"}) == "boie"
                        ? core::HeatingValueCorrelation::boie
                        : core::HeatingValueCorrelation::channiwala_parikh;
  }
  if (const auto cp = fuel.optional("specific_heat")) {
    // Plain number in kJ/(kg K): the unit parser has no specific-heat units.
    const double kJ = cp->number();
    if (!(kJ > 0.0 && kJ < 10.0)) cp->fail("must be a plain number in kJ/(kg K) between 0 and 10");
    spec.specific_heat_J_per_kg_K = kJ * 1e3;
  }
  spec.field = fuel.path();
  return spec;
}

std::vector<BlendComponent> blend_components(const YamlField& list) {
  if (!list.is_sequence() || list.size() < 2) list.fail("expected a list of two or more fuels, each with a fraction");
  std::vector<BlendComponent> parts;
  for (std::size_t i = 0; i < list.size(); ++i) {
    const YamlField component = list.element(i);
    FuelSpec part = read_fuel_spec(component, true);
    const YamlField fraction = component.required("fraction");
    const double value = fraction.quantity_si(Dimension::fraction);
    if (!(value >= 0.0 && value <= 1.0)) fraction.fail("must be between 0 % and 100 %");
    parts.push_back({std::move(part), value});
  }
  return parts;
}

// Keys that describe one kind of fuel are refused with another: they would change nothing.
void refuse_keys_of_other_kind(const YamlField& fuel, const std::string& kind) {
  const std::pair<const char*, const char*> owned[] = {
      {"gas_basis", "gas"},           {"ultimate_basis", "ultimate"}, {"state", "ultimate"},
      {"heating_value", "ultimate"},  {"heating_value_correlation", "ultimate"},
      {"specific_heat", "ultimate"},  {"blend_by", "blend"}};
  for (const auto& [key, owner] : owned) {
    if (kind == owner) continue;
    if (const auto node = fuel.optional(key)) {
      node->fail(fmt::format("applies only with {}.{}, not with {}.{}", fuel.path(), owner, fuel.path(), kind));
    }
  }
}

}  // namespace

bool heating_value_basis_applies(const FuelSpec& spec) {
  return spec.kind == FuelKind::ultimate && spec.condensed.heating_value.has_value();
}

FuelSpec read_fuel_spec(const YamlField& fuel, bool blend_part) {
  if (blend_part) {
    fuel.allow_only({"name", "preset", "gas", "gas_basis", "ultimate", "ultimate_basis", "state", "heating_value",
                     "heating_value_basis", "heating_value_correlation", "specific_heat", "fraction"});
  } else {
    fuel.allow_only({"name", "preset", "gas", "gas_basis", "ultimate", "ultimate_basis", "state", "heating_value",
                     "heating_value_basis", "heating_value_correlation", "specific_heat", "blend", "blend_by",
                     "feed_rate", "temperature", "nitrogen_conversion"});
  }
  FuelSpec spec;
  spec.field = fuel.path();
  const std::string kind =
      blend_part ? fuel.one_of({"preset", "gas", "ultimate"}) : fuel.one_of({"preset", "gas", "ultimate", "blend"});
  const YamlField kind_node = fuel.required(kind);
  if (const auto name = fuel.optional("name")) spec.name = name->text();
  if (kind == "preset") {
    spec.kind = FuelKind::preset;
    spec.preset = kind_node.text();
  } else if (kind == "gas") {
    spec.kind = FuelKind::gas;
    refuse_text_composition(kind_node, "{CH4: 93 %, C2H6: 4 %, CO2: 1 %, N2: 2 %}");
    spec.gas = gas_spec(fuel, kind_node, spec.name);
  } else if (kind == "ultimate") {
    spec.kind = FuelKind::ultimate;
    refuse_text_composition(kind_node, "{C: 75 %, H: 5 %, O: 6.7 %, N: 1.5 %, S: 2.3 %, ash: 9.5 %, moisture: 8 %}");
    spec.condensed = condensed_spec(fuel, kind_node, spec.name);
  } else {
    spec.kind = FuelKind::blend;
    spec.blend = blend_components(kind_node);
    if (const auto by = fuel.optional("blend_by")) {
      const std::string choice = by->choice({"mass", "mole", "heat"});
      spec.blend_by = choice == "mole" ? core::BlendBasis::mole
                      : choice == "heat" ? core::BlendBasis::heat_input
                                         : core::BlendBasis::mass;
    }
  }
  refuse_keys_of_other_kind(fuel, kind);
  const auto measured = heating_value(fuel, spec.condensed.analysis.basis);
  if (spec.kind == FuelKind::ultimate) spec.condensed.heating_value = measured;
  // A blend part's heating_value_basis can only be that of its heating_value (a heat-input feed is
  // the whole fuel's: fuel.heating_value_basis, checked with the feed in case_file.cpp).
  if (const auto basis = fuel.optional("heating_value_basis"); basis && blend_part && !heating_value_basis_applies(spec)) {
    basis->fail(fmt::format("states the basis of {}.heating_value, which this part does not have (the basis of a "
                            "heat-input feed_rate is fuel.heating_value_basis)",
                            fuel.path()));
  }
  return spec;
}

core::Fuel build_fuel(const FuelSpec& spec, const core::SpeciesDatabase& database) {
  switch (spec.kind) {
    case FuelKind::preset: {
      const std::string field = spec.field + ".preset";
      const core::Fuel fuel = at_field(field, [&] { return core::preset_fuel(spec.preset, database, field); });
      return spec.name.empty() ? fuel : fuel.with_name(spec.name);
    }
    case FuelKind::gas: return at_field(spec.gas.field, [&] { return core::Fuel::gas(spec.gas, database); });
    case FuelKind::ultimate: return at_field(spec.field, [&] { return core::Fuel::condensed(spec.condensed, database); });
    case FuelKind::blend: break;
  }
  std::vector<core::BlendPart> parts;
  for (const BlendComponent& part : spec.blend) parts.push_back({build_fuel(part.fuel, database), part.fraction * 100.0});
  const std::string field = spec.field + ".blend";
  return at_field(field, [&] { return core::Fuel::blend(spec.name.empty() ? "fuel blend" : spec.name, parts, spec.blend_by, field); });
}

}  // namespace stackbound::cases
