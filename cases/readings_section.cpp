#include "stackbound/cases/readings_section.hpp"

#include <algorithm>
#include <string>
#include <string_view>

#include <fmt/format.h>

#include "stackbound/emissions/basis.hpp"
#include "stackbound/units/quantity_parser.hpp"

namespace stackbound::cases {

namespace {

namespace em = stackbound::emissions;
using units::Dimension;

struct SlotRule {
  std::string_view key;
  ReadingSlot slot;
  std::string_view default_unit;  // empty: the unit is required
  Dimension dimension;
};

// The non-pollutant quantities, their default units and what they measure.
constexpr SlotRule kScalarSlots[] = {
    {"o2", ReadingSlot::o2, "%", Dimension::fraction},
    {"co2", ReadingSlot::co2, "%", Dimension::fraction},
    {"moisture", ReadingSlot::moisture, "%", Dimension::fraction},
    {"flow", ReadingSlot::flow, "", Dimension::molar_flow},
    {"load", ReadingSlot::load, "", Dimension::power},
    {"ambient_temperature", ReadingSlot::ambient_temperature, "degC", Dimension::temperature},
    {"ambient_pressure", ReadingSlot::ambient_pressure, "kPa", Dimension::pressure},
    {"ambient_humidity", ReadingSlot::ambient_humidity, "%", Dimension::fraction},
    {"inlet_pressure", ReadingSlot::inlet_pressure, "", Dimension::pressure},
};

struct PollutantRule {
  std::string_view key;
  ReadingSlot slot;
  std::string_view pollutant;
};
constexpr PollutantRule kPollutantSlots[] = {
    {"co", ReadingSlot::co, "CO"}, {"no", ReadingSlot::no, "NO"}, {"nox", ReadingSlot::nox, "NOx"},
    {"so2", ReadingSlot::so2, "SO2"}};

// `column: NAME` or `value: QUANTITY` (exactly one), as a source in the slot's unit.
ReadingSource source_of(const YamlField& field, std::string_view key) {
  ReadingSource source;
  source.key = std::string(key);
  source.field = field.path();
  if (!field.is_map()) field.fail("expected a mapping such as {column: NAME} or {value: 17 %}");
  const std::string which = field.one_of({"column", "value"});
  if (which == "column") {
    source.column = field.required("column").text();
    if (source.column.empty()) field.required("column").fail("must name a column of the readings file");
  }
  return source;
}

// A unit scale and offset (si = raw * scale + offset) for `unit` of `dimension`.
void set_unit(ReadingSource& source, const YamlField& at, const std::string& unit, Dimension dimension) {
  const units::ParsedQuantity one = at.located([&] { return units::parse_quantity("1 " + unit, at.path(), {dimension}); });
  source.offset = one.unit != nullptr ? one.unit->offset_si : 0.0;
  source.scale = one.value_si - source.offset;
  source.unit = unit;
}

bool dry_basis(const YamlField& field, bool default_dry) {
  const auto basis = field.optional("basis");
  if (!basis) return default_dry;
  return basis->choice({"dry", "wet"}) == "dry";
}

// The unit an error message suggests for a slot without a default unit.
std::string_view example_unit(ReadingSlot slot) {
  if (slot == ReadingSlot::flow) return "Nm3/h";
  if (slot == ReadingSlot::load) return "MW";
  return "kPa";  // inlet pressure
}

void scalar_slot(ReadingsSpec& spec, const YamlField& field, const SlotRule& rule) {
  ReadingSource source = source_of(field, rule.key);
  const auto unit_field = field.optional("unit");
  const auto value = field.optional("value");
  if (!unit_field && !value && rule.default_unit.empty()) {
    field.fail(fmt::format("needs a unit, e.g. unit: {}", example_unit(rule.slot)));
  }
  const std::string unit = unit_field ? unit_field->text() : std::string(rule.default_unit);
  if (value) {
    // A stated constant carries its own unit (load: a power or a fraction).
    source.constant = value->located([&] {
      return rule.slot == ReadingSlot::load
                 ? units::parse_quantity(value->text(), value->path(), {Dimension::power, Dimension::fraction}).value_si
                 : units::parse_quantity(value->text(), value->path(), {rule.dimension}).value_si;
    });
  } else if (rule.slot == ReadingSlot::load) {
    // Load as a power (MW) or a fraction (%).
    const units::ParsedQuantity probe = (unit_field ? *unit_field : field).located(
        [&] { return units::parse_quantity("1 " + unit, field.path() + ".unit", {Dimension::power, Dimension::fraction}); });
    set_unit(source, unit_field ? *unit_field : field, unit, probe.dimension);
  } else {
    set_unit(source, unit_field ? *unit_field : field, unit, rule.dimension);
  }
  if (rule.slot == ReadingSlot::o2) spec.o2_dry = dry_basis(field, true);
  if (rule.slot == ReadingSlot::co2) spec.co2_dry = dry_basis(field, true);
  if (rule.slot == ReadingSlot::flow) spec.flow_dry = dry_basis(field, false);
  spec.sources[static_cast<std::size_t>(rule.slot)] = std::move(source);
}

void pollutant_slot(ReadingsSpec& spec, const YamlField& field, const PollutantRule& rule,
                    const units::NormalConditions& normal) {
  field.allow_only({"column", "unit", "basis"});
  ReadingSource source = source_of(field, rule.key);
  const std::string unit = field.optional("unit") ? field.required("unit").text() : std::string("ppm");
  const std::string basis_text = field.optional("basis") ? field.required("basis").text() : std::string();
  if (basis_text.empty()) field.fail("needs basis: dry or basis: wet (and optionally a diluent level, dry, O2=15%)");
  const YamlField at = field.optional("basis") ? field.required("basis") : field;
  const em::Basis basis = at.located([&] {
    const em::PartialBasis from_unit = em::parse_partial_basis(unit, field.path() + ".unit");
    const em::PartialBasis from_basis = em::parse_partial_basis(basis_text, field.path() + ".basis");
    const em::PartialBasis merged =
        em::merge_partial_bases(from_unit, field.path() + ".unit", from_basis, field.path() + ".basis");
    return em::complete_basis(merged, field.path(), &normal);
  });
  source.unit = unit;
  spec.pollutants.push_back({rule.slot, em::pollutant_by_name(rule.pollutant, field.path()), basis});
  spec.sources[static_cast<std::size_t>(rule.slot)] = std::move(source);
}

ReadingTimeSpec time_spec(const YamlField& field) {
  field.allow_only({"column", "zone", "format"});
  ReadingTimeSpec spec;
  spec.column = field.required("column").text();
  if (const auto zone = field.optional("zone")) spec.zone = zone->text();
  if (const auto format = field.optional("format")) {
    spec.format = format->text();
    if (spec.format.find('%') == std::string::npos) {
      format->fail("expected a date::parse format such as \"%d.%m.%Y %H:%M\" (ISO 8601 needs no format)");
    }
  }
  return spec;
}

std::vector<std::string> text_list(const YamlField& field) {
  std::vector<std::string> items;
  if (field.is_scalar()) return {field.text()};
  if (!field.is_sequence()) field.fail("expected a list such as [CAL, MAINT, FAULT]");
  for (std::size_t i = 0; i < field.size(); ++i) items.push_back(field.element(i).text());
  return items;
}

ReadingStatusSpec status_spec(const YamlField& field) {
  field.allow_only({"column", "exclude", "calibration"});
  ReadingStatusSpec spec;
  spec.column = field.required("column").text();
  if (const auto exclude = field.optional("exclude")) spec.exclude = text_list(*exclude);
  if (const auto calibration = field.optional("calibration")) {
    spec.calibration = text_list(*calibration);
    for (std::size_t i = 0; i < spec.calibration.size(); ++i) {
      if (std::find(spec.exclude.begin(), spec.exclude.end(), spec.calibration[i]) == spec.exclude.end()) {
        (calibration->is_sequence() ? calibration->element(i) : *calibration)
            .fail("a calibration status must also be listed under exclude");
      }
    }
  }
  return spec;
}

void misc_keys(ReadingsSpec& spec, const YamlField& readings) {
  if (const auto interval = readings.optional("interval")) {
    spec.interval_s = interval->quantity_si(Dimension::time);
    if (!(spec.interval_s >= 1.0 && spec.interval_s <= 900.0)) interval->fail("must be between 1 s and 15 min");
  }
  if (const auto delimiter = readings.optional("delimiter")) {
    const std::string text = delimiter->text();
    if (text.size() != 1 || (text[0] != ',' && text[0] != ';' && text[0] != '\t')) {
      delimiter->fail("accepted: \",\", \";\" or a tab");
    }
    spec.delimiter = text[0];
  }
  if (const auto range = readings.optional("fo_range")) {
    std::vector<std::string> keys;
    for (const em::FoRange& r : em::fo_ranges()) keys.emplace_back(r.key);
    spec.fo_range = em::find_fo_range(range->text());
    if (!spec.fo_range) range->fail(fmt::format("accepted: {}", fmt::join(keys, ", ")));
  }
  if (const auto p = readings.optional("reference_inlet_pressure")) {
    spec.reference_inlet_pressure_Pa = p->quantity_si(Dimension::pressure);
  }
}

// A wet reading needs the moisture; a reading as measured needs the O2 to be corrected to the reference.
void check_context(const ReadingsSpec& spec, const YamlField& readings) {
  const bool has_moisture = spec.source(ReadingSlot::moisture).has_value();
  const auto needs = [&](std::string_view key, const std::string& problem) { readings.required(key).fail(problem); };
  const std::string moisture_hint = "; map readings.moisture: {column: H2O} or {value: 12 %}";
  if (spec.source(ReadingSlot::o2) && !spec.o2_dry && !has_moisture) needs("o2", "a wet O2 column needs the moisture" + moisture_hint);
  if (spec.source(ReadingSlot::co2) && !spec.co2_dry && !has_moisture) needs("co2", "a wet CO2 column needs the moisture" + moisture_hint);
  if (spec.source(ReadingSlot::flow) && !spec.flow_dry && !has_moisture) {
    needs("flow", "a wet flow needs the moisture to give the dry flow of the mass rates" + moisture_hint);
  }
  for (const PollutantReading& p : spec.pollutants) {
    const std::string key = spec.source(p.slot)->key;
    if (p.basis.moisture == em::Moisture::wet && !has_moisture) {
      needs(key, fmt::format("column {} is wet and needs the moisture{}", spec.source(p.slot)->column, moisture_hint));
    }
    if (p.basis.reference.kind() == em::DiluentReference::Kind::as_measured && !spec.source(ReadingSlot::o2)) {
      needs(key, fmt::format("column {} is as measured: correcting it to the reference O2 needs the measured O2; map "
                             "readings.o2: {{column: O2, basis: dry}}",
                             spec.source(p.slot)->column));
    }
  }
}

}  // namespace

ReadingsSpec readings_section(const YamlField& readings, const units::NormalConditions& normal) {
  readings.allow_only({"time", "o2", "co2", "co", "no", "nox", "so2", "moisture", "flow", "load", "status",
                       "ambient_temperature", "ambient_pressure", "ambient_humidity", "inlet_pressure", "interval",
                       "delimiter", "fo_range", "reference_inlet_pressure"});
  ReadingsSpec spec;
  spec.time = time_spec(readings.required("time"));
  for (const SlotRule& rule : kScalarSlots) {
    if (const auto field = readings.optional(rule.key)) {
      field->allow_only({"column", "value", "unit", "basis"});
      scalar_slot(spec, *field, rule);
    }
  }
  for (const PollutantRule& rule : kPollutantSlots) {
    if (const auto field = readings.optional(rule.key)) pollutant_slot(spec, *field, rule, normal);
  }
  if (spec.pollutants.empty()) readings.fail("maps no pollutant: map at least one of co, no, nox, so2");
  if (const auto status = readings.optional("status")) spec.status = status_spec(*status);
  misc_keys(spec, readings);
  check_context(spec, readings);
  if (spec.reference_inlet_pressure_Pa && !spec.source(ReadingSlot::inlet_pressure)) {
    readings.required("reference_inlet_pressure").fail("needs inlet_pressure (the observed combustor-inlet pressure)");
  }
  return spec;
}

}  // namespace stackbound::cases
