#include "stackbound/cases/case_file.hpp"

#include <cmath>

#include <fmt/format.h>

#include "stackbound/cases/fuel_spec.hpp"
#include "stackbound/cases/input_file.hpp"
#include "stackbound/cases/yaml_reader.hpp"
#include "stackbound/units/input_error.hpp"

namespace stackbound::cases {

namespace {

using units::Dimension;

SourceText source_text(const YamlField& field) { return {field.text(), field.location(), field.path()}; }

double fraction_in(const YamlField& field, double low, double high, const char* rule) {
  const double fraction = field.quantity_si(Dimension::fraction);
  if (!(fraction >= low && fraction <= high)) field.fail(rule);
  return fraction;
}

double temperature_K(const YamlField& field) { return field.quantity_si(Dimension::temperature); }
double pressure_Pa(const YamlField& field) { return field.quantity_si(Dimension::pressure); }

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

FuelFeedSpec fuel_feed(const YamlField& fuel) {
  FuelFeedSpec feed;
  feed.fuel = read_fuel_spec(fuel, false);
  const YamlField rate = fuel.required("feed_rate");
  feed.feed_rate = rate.quantity({Dimension::mass_flow, Dimension::molar_flow, Dimension::power});
  if (feed.feed_rate.value_si <= 0.0) rate.fail("must be > 0");
  feed.feed_rate_text = source_text(rate);
  if (const auto t = fuel.optional("temperature")) feed.temperature_K = temperature_K(*t);
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
  if (const auto t = air->optional("ambient_temperature")) spec.ambient_temperature_K = temperature_K(*t);
  if (const auto p = air->optional("ambient_pressure")) spec.ambient_pressure_Pa = pressure_Pa(*p);
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
  spec.location = value.location();
  if (kind == "excess_air") {
    spec.mode = OperatingMode::excess_air;
    spec.value = value.quantity_si(Dimension::fraction);
    if (!(spec.value > -0.75 && spec.value <= 10.0)) value.fail("must be between -75 % and 1000 %");
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

FiringSpec firing_spec(const YamlField& firing) {
  firing.allow_only({"temperature", "adiabatic", "heat_loss", "pressure", "species"});
  FiringSpec spec;
  spec.location = firing.location();
  if (const auto adiabatic = firing.optional("adiabatic")) spec.adiabatic = adiabatic->boolean();
  if (spec.adiabatic) {
    if (firing.has("temperature")) firing.fail("give either temperature or adiabatic: true, not both");
    if (const auto loss = firing.optional("heat_loss")) {
      spec.heat_loss_fraction = fraction_in(*loss, 0.0, 0.9, "must be between 0 % and 90 % of the heat input");
    }
  } else {
    spec.temperature_K = temperature_K(firing.required("temperature"));
    spec.location = firing.required("temperature").location();
    if (firing.has("heat_loss")) firing.required("heat_loss").fail("applies only with adiabatic: true");
  }
  if (const auto p = firing.optional("pressure")) spec.pressure_Pa = pressure_Pa(*p);
  if (const auto species = firing.optional("species")) spec.species = string_list(*species);
  return spec;
}

StackSpec stack_spec(const std::optional<YamlField>& stack) {
  StackSpec spec;
  if (!stack) return spec;
  stack->allow_only({"temperature", "pressure", "measured"});
  if (const auto t = stack->optional("temperature")) spec.temperature_K = temperature_K(*t);
  if (const auto p = stack->optional("pressure")) spec.pressure_Pa = pressure_Pa(*p);
  if (const auto measured = stack->optional("measured")) {
    measured->allow_only({"o2", "co", "no", "nox", "moisture"});
    if (const auto v = measured->optional("o2")) spec.measured.o2 = source_text(*v);
    if (const auto v = measured->optional("co")) spec.measured.co = source_text(*v);
    if (const auto v = measured->optional("no")) spec.measured.no = source_text(*v);
    if (const auto v = measured->optional("nox")) spec.measured.nox = source_text(*v);
    if (const auto v = measured->optional("moisture")) {
      spec.measured.moisture = source_text(*v);
      (void)fraction_in(*v, 0.0, 0.99, "must be between 0 % and 99 %");
    }
  }
  return spec;
}

ReportSpec report_spec(const std::optional<YamlField>& report) {
  ReportSpec spec;
  if (!report) return spec;
  report->allow_only({"reference_o2", "o2_basis", "normal_conditions", "pollutants", "operating_hours", "limits"});
  if (const auto ref = report->optional("reference_o2")) {
    spec.reference_o2_location = ref->location();
    if (ref->is_scalar() && ref->text() == "preset") {
      spec.reference_o2_fraction.reset();
    } else {
      spec.reference_o2_fraction = fraction_in(*ref, 0.0, 0.2, "must be 'preset' or an O2 between 0 % and 20 %");
    }
  }
  if (const auto basis = report->optional("o2_basis")) spec.o2_basis_percent = basis->choice({"20.9", "21"}) == "21" ? 21.0 : 20.9;
  if (const auto normal = report->optional("normal_conditions")) {
    spec.normal_conditions = normal->choice({"0C", "15C", "20C", "60F", "IED"});
  }
  if (const auto pollutants = report->optional("pollutants")) spec.pollutants = string_list(*pollutants);
  if (const auto hours = report->optional("operating_hours")) {
    spec.operating_hours_h = hours->quantity_si(Dimension::time) / 3600.0;
    if (!(spec.operating_hours_h > 0.0 && spec.operating_hours_h <= 8784.0)) hours->fail("must be between 0 h and 8784 h a year");
  }
  if (const auto limits = report->optional("limits")) {
    if (!limits->is_sequence()) limits->fail("expected a list of {pollutant, limit}");
    for (std::size_t i = 0; i < limits->size(); ++i) {
      const YamlField limit = limits->element(i);
      limit.allow_only({"pollutant", "limit"});
      spec.limits.push_back({limit.required("pollutant").text(), source_text(limit.required("limit"))});
    }
  }
  return spec;
}

}  // namespace

CaseDefinition parse_case(std::string_view text, const std::string& origin) {
  const YamlField root = YamlField::load(text, origin);
  root.allow_only({"case", "fuel", "air", "operating_point", "firing", "stack", "report"});
  CaseDefinition definition;
  definition.origin = origin;
  const YamlField info = root.required("case");
  info.allow_only({"title", "description", "plant_type"});
  definition.title = info.required("title").text();
  if (const auto description = info.optional("description")) definition.description = description->text();
  if (const auto plant = info.optional("plant_type")) {
    definition.plant_type = plant->text();
    definition.plant_type_location = plant->location();
  }
  definition.fuel = fuel_feed(root.required("fuel"));
  definition.air = air_spec(root.optional("air"));
  definition.operating = operating_spec(root.required("operating_point"));
  definition.firing = firing_spec(root.required("firing"));
  definition.stack = stack_spec(root.optional("stack"));
  definition.report = report_spec(root.optional("report"));
  return definition;
}

CaseDefinition load_case(const std::string& path) {
  return parse_case(read_input_file(path, "CASE", "case file"), path);
}

}  // namespace stackbound::cases
