#include "stackbound/cases/case_file.hpp"

#include <fmt/format.h>

#include <algorithm>
#include <array>
#include <cmath>

#include "stackbound/cases/fuel_spec.hpp"
#include "stackbound/cases/input_file.hpp"
#include "stackbound/cases/plausible_ranges.hpp"
#include "stackbound/cases/readings_section.hpp"
#include "stackbound/cases/sha256.hpp"
#include "stackbound/cases/yaml_reader.hpp"
#include "stackbound/emissions/basis.hpp"
#include "stackbound/emissions/published_f_factors.hpp"
#include "stackbound/units/input_error.hpp"

namespace stackbound::cases {

namespace em = stackbound::emissions;

std::string_view operating_field(OperatingMode mode) {
  switch (mode) {
    case OperatingMode::excess_air: return "operating_point.excess_air";
    case OperatingMode::lambda: return "operating_point.lambda";
    case OperatingMode::equivalence_ratio: return "operating_point.equivalence_ratio";
    case OperatingMode::flue_o2: break;
  }
  return "operating_point.flue_o2";
}

namespace {

using units::Dimension;

constexpr std::array<std::string_view, 8> kSections{"case",   "fuel",       "air",   "operating_point",
                                                   "firing", "post_flame", "stack", "report"};

double fraction_in(const YamlField& field, double low, double high, const char* rule) {
  const double fraction = field.quantity_si(Dimension::fraction);
  if (!(fraction >= low && fraction <= high)) field.fail(rule);
  return fraction;
}

double temperature_K(const YamlField& field) { return field.quantity_si(Dimension::temperature); }
double pressure_Pa(const YamlField& field, const PlausibleRange& range) {
  const double value = field.quantity_si(Dimension::pressure);
  if (const auto problem = outside(value, range)) field.fail(*problem);
  return value;
}

double time_s(const YamlField& field, const PlausibleRange& range) {
  const double value = field.quantity_si(Dimension::time);
  if (!std::isfinite(value) || value < 0.0) field.fail("must be a finite time >= 0 s");
  if (const auto problem = outside(value, range)) field.fail(*problem);
  return value;
}

std::vector<std::string> string_list(const YamlField& field) {
  std::vector<std::string> items;
  if (field.is_scalar()) {
    items.push_back(field.text());
    return items;
  }
  if (!field.is_sequence() || field.size() == 0) field.fail("expected a list such as [CO, NO, NOx]");
  for (std::size_t i = 0; i < field.size(); ++i) items.push_back(field.element(i).text());
  return items;
}

// "35 ppm, dry, O2=3%" -> a concentration of `pollutant` on that basis (normal conditions, when the
// text names none, those of the report).
em::Concentration stated_concentration(const YamlField& field, const em::Pollutant& pollutant,
                                       const units::NormalConditions& normal) {
  return field.located([&] {
    const std::string text = field.text();
    const em::StatedValue stated = em::split_stated_value(text, field.path());
    const em::Basis basis = em::parse_basis(stated.rest, field.path(), &normal);
    return em::Concentration(stated.number, pollutant, basis, field.path());
  });
}

FuelFeedSpec fuel_feed(const YamlField& fuel) {
  FuelFeedSpec feed;
  feed.fuel = read_fuel_spec(fuel, false);
  const YamlField rate = fuel.required("feed_rate");
  feed.feed_rate = rate.quantity({Dimension::mass_flow, Dimension::molar_flow, Dimension::power});
  if (feed.feed_rate.value_si <= 0.0) rate.fail("must be > 0");
  if (const auto problem = outside(feed.feed_rate.value_si, feed_range(feed.feed_rate.dimension))) rate.fail(*problem);
  // heating_value_basis states the basis of a heat-input feed (every fuel kind) and of a measured
  // heating value; with neither it would change nothing, so it is refused.
  if (const auto basis = fuel.optional("heating_value_basis")) {
    const bool lower = basis->choice({"HHV", "LHV"}) == "LHV";
    if (feed.feed_rate.dimension == Dimension::power) {
      feed.heat_input_basis = lower ? core::HeatInputBasis::lhv : core::HeatInputBasis::hhv;
    } else if (!heating_value_basis_applies(feed.fuel)) {
      basis->fail(fmt::format("states the basis of a heat-input fuel.feed_rate (\"12 MW\") or of fuel.heating_value; "
                              "this case has neither (feed_rate \"{}\" is not a heat input)",
                              rate.text()));
    }
  }
  if (const auto t = fuel.optional("temperature")) feed.temperature_K = temperature_K(*t);
  if (const auto f = fuel.optional("nitrogen_conversion")) {
    feed.nitrogen_conversion = fraction_in(*f, 0.0, 1.0, "must be between 0 % and 100 % of the fuel-bound nitrogen");
  }
  return feed;
}

AirSpec air_spec(const std::optional<YamlField>& air) {
  AirSpec spec;
  if (!air) return spec;
  air->allow_only({"temperature", "relative_humidity", "ambient_temperature", "ambient_pressure", "humidity_ratio",
                   "o2_enrichment"});
  if (const auto t = air->optional("temperature")) spec.temperature_K = temperature_K(*t);
  if (air->has("relative_humidity") && air->has("humidity_ratio")) {
    air->fail("give relative_humidity or humidity_ratio, not both");
  }
  if (const auto rh = air->optional("relative_humidity")) {
    spec.relative_humidity = fraction_in(*rh, 0.0, 1.0, "must be between 0 % and 100 %");
  }
  // The ambient state is that of the relative humidity; without one it would change nothing.
  for (const char* key : {"ambient_temperature", "ambient_pressure"}) {
    if (const auto node = air->optional(key); node && !spec.relative_humidity) {
      node->fail("applies only with air.relative_humidity (the ambient state at which it is stated)");
    }
  }
  if (const auto t = air->optional("ambient_temperature")) spec.ambient_temperature_K = temperature_K(*t);
  if (const auto p = air->optional("ambient_pressure")) spec.ambient_pressure_Pa = pressure_Pa(*p, kAmbientPressure);
  if (const auto w = air->optional("humidity_ratio")) {
    spec.humidity_ratio_kg_per_kg = w->number();
    if (!(*spec.humidity_ratio_kg_per_kg >= 0.0 && *spec.humidity_ratio_kg_per_kg < 0.5)) {
      w->fail("must be a number of kg water per kg dry air between 0 and 0.5");
    }
  }
  if (const auto o2 = air->optional("o2_enrichment")) {
    spec.o2_fraction = fraction_in(*o2, 0.2, 1.0, "the O2 content of the enriched oxidant must be between 20 % and 100 %");
  }
  return spec;
}

OperatingSpec operating_spec(const YamlField& op) {
  op.allow_only({"excess_air", "lambda", "equivalence_ratio", "flue_o2", "flue_o2_basis"});
  OperatingSpec spec;
  const std::string kind = op.one_of({"excess_air", "lambda", "equivalence_ratio", "flue_o2"});
  const YamlField value = op.required(kind);
  if (kind == "excess_air") {
    spec.mode = OperatingMode::excess_air;
    spec.value = value.quantity_si(Dimension::fraction);
    if (!(spec.value > -0.75 && spec.value <= 10.0)) value.fail("must be above -75 % (a mixture 4 times richer than stoichiometric) and at most 1000 %");
  } else if (kind == "lambda") {
    spec.mode = OperatingMode::lambda;
    spec.value = value.number();
    if (!(spec.value >= 0.25 && spec.value <= 11.0)) value.fail("must be between 0.25 and 11");
  } else if (kind == "equivalence_ratio") {
    spec.mode = OperatingMode::equivalence_ratio;
    spec.value = value.number();
    if (!(spec.value >= 0.09 && spec.value <= 4.0)) value.fail("must be between 0.09 and 4");
  } else {
    spec.mode = OperatingMode::flue_o2;
    spec.value = fraction_in(value, 0.0, 1.0, "must be between 0 % and 100 %");
  }
  if (const auto basis = op.optional("flue_o2_basis")) {
    if (kind != "flue_o2") basis->fail("applies only with flue_o2");
    spec.flue_o2_dry = basis->choice({"dry", "wet"}) == "dry";
  }
  return spec;
}

PrimaryZoneCaseSpec primary_zone_spec(const YamlField& zone, const FiringSpec& firing) {
  zone.allow_only({"equivalence_ratio", "air_share", "residence_time", "heat_loss"});
  if (!firing.adiabatic) {
    zone.fail("needs firing.adiabatic: true (the remaining oxidant mixes in at constant enthalpy, so the mixed "
              "state is the adiabatic state of the whole mixture)");
  }
  PrimaryZoneCaseSpec spec;
  const std::string kind = zone.one_of({"equivalence_ratio", "air_share"});
  const YamlField value = zone.required(kind);
  if (kind == "equivalence_ratio") {
    spec.equivalence_ratio = value.number();
    if (!(*spec.equivalence_ratio >= 0.09 && *spec.equivalence_ratio <= 4.0)) value.fail("must be between 0.09 and 4");
  } else {
    spec.air_share = fraction_in(value, 1e-3, 1.0, "must be between 0.1 % and 100 % of the oxidant");
  }
  spec.residence_time_s = time_s(zone.required("residence_time"), kResidenceTime);
  if (const auto loss = zone.optional("heat_loss")) {
    spec.heat_loss_fraction = fraction_in(*loss, 0.0, firing.heat_loss_fraction,
                                          "must be between 0 % and firing.heat_loss (the zone loses part of the "
                                          "whole flame's loss, the rest is lost after mixing)");
    spec.heat_loss_stated = true;
  }
  return spec;
}

FiringSpec firing_spec(const YamlField& firing) {
  firing.allow_only({"temperature", "adiabatic", "heat_loss", "pressure", "species", "residence_time", "primary_zone"});
  FiringSpec spec;
  if (const auto adiabatic = firing.optional("adiabatic")) spec.adiabatic = adiabatic->boolean();
  if (spec.adiabatic) {
    if (firing.has("temperature")) firing.fail("give either temperature or adiabatic: true, not both");
    if (const auto loss = firing.optional("heat_loss")) {
      spec.heat_loss_fraction = fraction_in(*loss, 0.0, 0.9, "must be between 0 % and 90 % of the heat input");
    }
  } else {
    spec.temperature_K = temperature_K(firing.required("temperature"));
    if (firing.has("heat_loss")) firing.required("heat_loss").fail("applies only with adiabatic: true");
  }
  if (const auto p = firing.optional("pressure")) spec.pressure_Pa = pressure_Pa(*p, kFiringPressure);
  if (const auto species = firing.optional("species")) spec.species = string_list(*species);
  if (const auto time = firing.optional("residence_time")) {
    spec.residence_time_s = time_s(*time, kResidenceTime);
    spec.residence_time_stated = true;
  }
  if (const auto zone = firing.optional("primary_zone")) spec.primary_zone = primary_zone_spec(*zone, spec);
  return spec;
}

PostFlameSpec post_flame_spec(const std::optional<YamlField>& post_flame) {
  PostFlameSpec spec;
  if (!post_flame) return spec;
  post_flame->allow_only({"cooling_to", "cooling_time"});
  if (const auto t = post_flame->optional("cooling_to")) spec.cooling_to_K = temperature_K(*t);
  if (const auto time = post_flame->optional("cooling_time")) {
    spec.cooling_time_s = time_s(*time, kCoolingTime);
    spec.cooling_time_stated = true;
  }
  return spec;
}

std::optional<MeasuredValue> measured_value(const YamlField& measured, std::string_view key, std::string_view pollutant,
                                            const units::NormalConditions& normal) {
  const auto field = measured.optional(key);
  if (!field) return std::nullopt;
  const em::Pollutant stated = em::pollutant_by_name(pollutant, field->path());
  return MeasuredValue{stated_concentration(*field, stated, normal), field->text()};
}

MeasuredSpec measured_spec(const YamlField& measured, const units::NormalConditions& normal) {
  measured.allow_only({"o2", "co", "no", "nox", "moisture"});
  MeasuredSpec spec;
  spec.o2 = measured_value(measured, "o2", "O2", normal);
  spec.co = measured_value(measured, "co", "CO", normal);
  spec.no = measured_value(measured, "no", "NO", normal);
  spec.nox = measured_value(measured, "nox", "NOx", normal);
  if (const auto v = measured.optional("moisture")) {
    spec.moisture = MeasuredFraction{fraction_in(*v, 0.0, 0.99, "must be between 0 % and 99 %"), v->text()};
  }
  return spec;
}

StackSpec stack_spec(const std::optional<YamlField>& stack, const units::NormalConditions& normal) {
  StackSpec spec;
  if (!stack) return spec;
  stack->allow_only({"temperature", "pressure", "measured"});
  if (const auto t = stack->optional("temperature")) {
    spec.temperature_K = temperature_K(*t);
    spec.temperature_stated = true;
  }
  if (const auto p = stack->optional("pressure")) spec.pressure_Pa = pressure_Pa(*p, kStackPressure);
  if (const auto measured = stack->optional("measured")) spec.measured = measured_spec(*measured, normal);
  return spec;
}

// The report's normal conditions: a preset by key, or stated ("25 degC, 101.325 kPa"), then owned by
// `stated`.
struct ReportNormal {
  const units::NormalConditions* conditions = &units::normal_0C();
  std::shared_ptr<const units::StatedNormalConditions> stated;
};

// Read before the rest of the report: the measured values in `stack` are on its normal conditions.
ReportNormal normal_conditions(const std::optional<YamlField>& report) {
  const auto normal = report ? report->optional("normal_conditions") : std::nullopt;
  if (!normal) return {};
  const std::string text = normal->text();
  if (text.find(',') != std::string::npos) {
    ReportNormal stated;
    stated.stated = normal->located([&] { return units::stated_normal_conditions(text, "report.normal_conditions"); });
    stated.conditions = &stated.stated->conditions();
    return stated;
  }
  const std::string key = normal->choice({"0C", "15C", "20C", "60F", "IED"});
  return {&normal->located([&]() -> const units::NormalConditions& {
            return units::normal_conditions_by_key(key, "report.normal_conditions");
          }),
          nullptr};
}

// A concentration unit ("mg/Nm3", "ppm") makes a concentration limit; anything else is a rate.
LimitSpec limit_spec(const YamlField& limit, const ReportSpec& report) {
  limit.allow_only({"pollutant", "limit"});
  const std::string pollutant = limit.required("pollutant").text();
  const YamlField value = limit.required("limit");
  const auto reported = std::find_if(report.pollutants.begin(), report.pollutants.end(),
                                     [&](const em::Pollutant& p) { return p.name == pollutant; });
  if (reported == report.pollutants.end()) {
    std::vector<std::string> names;
    for (const em::Pollutant& p : report.pollutants) names.push_back(p.name);
    throw units::InputError(fmt::format("{}: report.limits: pollutant \"{}\" is not among report.pollutants ({})",
                                        value.location(), pollutant, fmt::join(names, ", ")));
  }
  const std::string text = value.text();
  const std::string rest = value.located([&] { return em::split_stated_value(text, value.path()).rest; });
  // The unit is the first word: "mg/Nm3, dry, O2=3%", "ppmvd @ 3% O2".
  const auto first = rest.find_first_not_of(" \t");
  const std::string unit = first == std::string::npos ? "" : rest.substr(first, rest.find_first_of(", \t@", first) - first);
  if (!unit.empty() && em::find_concentration_unit(unit)) {
    return {pollutant, text, stated_concentration(value, *reported, *report.normal)};
  }
  const em::RateLimit rate = value.located([&] { return em::parse_rate_limit(text, value.path()); });
  if (rate.kind == em::RateKind::per_useful_output) {
    value.fail("a limit per useful output needs an efficiency, which a case file does not state; give the limit as "
               "a concentration, a mass rate or per heat input");
  }
  return {pollutant, text, rate};
}

// `computed`, `published`, {published: KEY} or {Fd: "8710 dscf/MMBtu", Fw: ..., Fc: ...}.
FFactorSpec f_factor_spec(const YamlField& field) {
  FFactorSpec spec;
  if (field.is_scalar()) {
    spec.choice = field.choice({"computed", "published"}) == "published" ? FFactorChoice::published
                                                                         : FFactorChoice::computed;
    return spec;
  }
  field.allow_only({"published", "Fd", "Fw", "Fc"});
  if (const auto key = field.optional("published")) {
    if (field.has("Fd") || field.has("Fw") || field.has("Fc")) field.fail("give published or Fd/Fw/Fc, not both");
    spec.choice = FFactorChoice::published;
    spec.table_key = key->text();
    if (em::find_published_f_factors(spec.table_key) == nullptr) {
      std::vector<std::string_view> keys;
      for (const em::PublishedFFactors& entry : em::published_f_factors()) keys.push_back(entry.key);
      key->fail(fmt::format("not an entry of Method 19 Table 19-2; accepted: {}", fmt::join(keys, ", ")));
    }
    return spec;
  }
  spec.choice = FFactorChoice::stated;
  const auto read = [&](const char* name, em::FFactorKind kind) -> std::optional<em::FFactor> {
    const auto node = field.optional(name);
    if (!node) return std::nullopt;
    return node->located([&] { return em::parse_f_factor(node->text(), kind, node->path()); });
  };
  spec.fd = read("Fd", em::FFactorKind::dry);
  spec.fw = read("Fw", em::FFactorKind::wet);
  spec.fc = read("Fc", em::FFactorKind::carbon);
  if (!spec.fd) field.fail("needs Fd (the F-factor Method 19 uses with the flue O2), e.g. {Fd: 8710 dscf/MMBtu}");
  return spec;
}

// Reference O2: a stated value, or "preset" (the plant type's preset).
std::optional<double> reference_o2(const YamlField& ref) {
  if (ref.is_scalar() && ref.text() == "preset") return std::nullopt;
  return fraction_in(ref, 0.0, 0.2, "must be 'preset' or an O2 between 0 % and 20 %");
}

ReportSpec report_spec(const YamlField& report, const ReportNormal& normal) {
  ReportSpec spec;
  report.allow_only(
      {"reference_o2", "o2_basis", "normal_conditions", "pollutants", "operating_hours", "limits", "f_factors"});
  if (const auto f = report.optional("f_factors")) spec.f_factors = f_factor_spec(*f);
  if (const auto ref = report.optional("reference_o2")) spec.reference_o2_fraction = reference_o2(*ref);
  if (const auto basis = report.optional("o2_basis")) {
    spec.o2_basis = basis->choice({"20.9", "21"}) == "21" ? em::O2Basis::eu_21 : em::O2Basis::us_epa_20_9;
  }
  spec.normal = normal.conditions;
  spec.stated_normal = normal.stated;
  if (const auto pollutants = report.optional("pollutants")) {
    const std::vector<std::string> names = string_list(*pollutants);
    spec.pollutants.clear();
    for (std::size_t i = 0; i < names.size(); ++i) {
      const YamlField item = pollutants->is_sequence() ? pollutants->element(i) : *pollutants;
      spec.pollutants.push_back(item.located([&] { return em::pollutant_by_name(names[i], "report.pollutants"); }));
    }
  }
  if (const auto hours = report.optional("operating_hours")) {
    spec.operating_hours_h = hours->quantity_si(Dimension::time) / 3600.0;
    if (!(spec.operating_hours_h > 0.0 && spec.operating_hours_h <= 8784.0)) {
      hours->fail("must be more than 0 h and at most 8784 h (a leap year)");
    }
  }
  if (const auto limits = report.optional("limits")) {
    if (!limits->is_sequence()) limits->fail("expected a list of {pollutant, limit}");
    for (std::size_t i = 0; i < limits->size(); ++i) spec.limits.push_back(limit_spec(limits->element(i), spec));
  }
  return spec;
}

// An O2 between 0 and kLowO2Percent percent as written is more likely a fraction typed as a percent
// ("0.03 %" for 3 %) than a flue gas (common practice, no source: lean firing reads 1 % and more).
constexpr double kLowO2Percent = 0.21;

void warn_low_o2(const std::string& field, const std::string& text, double fraction, std::vector<units::Warning>& warnings) {
  const double percent = fraction * 100.0;
  if (!(percent > 0.0 && percent < kLowO2Percent)) return;
  warnings.push_back({field, text, fmt::format("below {} % O2, near-stoichiometric firing; if {:g} is a fraction, write "
                                               "\"{:g} %\"; used as {:g} % O2",
                                               kLowO2Percent, percent, percent * 100.0, percent)});
}

// Values that load but look wrong: each becomes a warning naming the field and the value.
std::vector<units::Warning> load_warnings(const CaseDefinition& definition, const YamlField& root) {
  std::vector<units::Warning> warnings;
  if (definition.operating.mode == OperatingMode::flue_o2) {
    warn_low_o2("operating_point.flue_o2", root.required("operating_point").required("flue_o2").text(),
                definition.operating.value, warnings);
  }
  if (const auto& o2 = definition.stack.measured.o2; o2 && !o2->value.basis().unit.is_mass()) {
    warn_low_o2("stack.measured.o2", o2->text, o2->value.value() * o2->value.basis().unit.factor, warnings);
  }
  const FiringSpec& firing = definition.firing;
  if (!firing.adiabatic && firing.temperature_K < definition.stack.temperature_K) {
    warnings.push_back({"firing.temperature", root.required("firing").required("temperature").text(),
                        fmt::format("{:.2f} K is below the stack temperature ({:.2f} K{}): a flame or furnace is "
                                    "hotter than its stack; check the value and its unit",
                                    firing.temperature_K, definition.stack.temperature_K,
                                    definition.stack.temperature_stated ? "" : ", the default 150 degC")});
  }
  return warnings;
}

// "preset" (stated, or the default) needs a plant type with a reference-O2 preset.
void check_reference_o2(const CaseDefinition& definition, const std::optional<YamlField>& report) {
  if (definition.reference_o2_preset != nullptr || definition.report.reference_o2_fraction) return;
  const std::string problem = "needs case.plant_type (a reference-O2 preset key) or an explicit O2, e.g. reference_o2: 3 %";
  if (const auto ref = report ? report->optional("reference_o2") : std::nullopt) ref->fail(problem);
  throw units::InputError(fmt::format("{}: report.reference_o2 = \"preset\": {}", definition.origin, problem));
}

// Reads the case from its root mapping; `loaded` holds the source map `root` records into.
void read_case(const YamlField& root, const std::string& origin, LoadedCase& loaded) {
  root.allow_only({"case", "fuel", "air", "operating_point", "firing", "post_flame", "stack", "report", "readings"});
  CaseDefinition& definition = loaded.definition;
  definition.origin = origin;
  const YamlField info = root.required("case");
  info.allow_only({"title", "description", "plant_type"});
  definition.title = info.required("title").text();
  if (const auto description = info.optional("description")) definition.description = description->text();
  if (const auto plant = info.optional("plant_type")) {
    definition.plant_type = plant->text();
    definition.reference_o2_preset =
        plant->located([&] { return &em::reference_o2_preset(definition.plant_type, "case.plant_type"); });
  }
  definition.fuel = fuel_feed(root.required("fuel"));
  definition.air = air_spec(root.optional("air"));
  definition.operating = operating_spec(root.required("operating_point"));
  definition.firing = firing_spec(root.required("firing"));
  definition.post_flame = post_flame_spec(root.optional("post_flame"));
  const std::optional<YamlField> report = root.optional("report");
  const ReportNormal normal = normal_conditions(report);
  definition.stack = stack_spec(root.optional("stack"), *normal.conditions);
  if (report) definition.report = report_spec(*report, normal);
  check_reference_o2(definition, report);
  definition.warnings = load_warnings(definition, root);
  if (const auto readings = root.optional("readings")) {
    definition.readings = readings_section(*readings, *definition.report.normal);
  }
  // A section left out is the file's: errors about its defaults are reported at the file.
  for (const std::string_view section : kSections) {
    if (!loaded.sources.location_of(section)) loaded.sources.add(std::string(section), origin);
  }
}

}  // namespace

LoadedCase parse_case_file(std::string_view text, const std::string& origin) {
  LoadedCase loaded{CaseDefinition{}, SourceMap(origin)};
  read_case(YamlField::load(text, origin, &loaded.sources), origin, loaded);
  loaded.definition.source_sha256 = sha256_hex(text);
  return loaded;
}

LoadedCase read_case_document(const YAML::Node& document, const std::string& origin) {
  if (!document.IsMap()) {
    throw units::InputError(fmt::format("{}: the case must be a mapping of sections (case, fuel, air, "
                                        "operating_point, firing, stack, report)",
                                        origin));
  }
  LoadedCase loaded{CaseDefinition{}, SourceMap::for_document(origin)};
  read_case(YamlField(document, origin, "", &loaded.sources), origin, loaded);
  loaded.definition.source_sha256 = sha256_hex(YAML::Dump(document));  // of the case as YAML text
  return loaded;
}

LoadedCase load_case_file(const std::string& path) {
  return parse_case_file(read_input_file(path, "CASE", "case file"), path);
}

CaseDefinition parse_case(std::string_view text, const std::string& origin) {
  return parse_case_file(text, origin).definition;
}

CaseDefinition load_case(const std::string& path) { return load_case_file(path).definition; }

}  // namespace stackbound::cases
