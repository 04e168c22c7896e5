#include "stackbound/emissions/basis.hpp"

#include <algorithm>
#include <regex>
#include <array>
#include <cctype>
#include <charconv>
#include <cmath>
#include <vector>

#include <fmt/format.h>

#include "stackbound/emissions/reference_correction.hpp"
#include "stackbound/units/constants.hpp"
#include "stackbound/units/input_error.hpp"
#include "stackbound/units/nearest_name.hpp"

namespace stackbound::emissions {

namespace {

// International foot cubed, m3, and the grain (1/7000 lb). Source: International Yard and Pound Agreement (1959).
constexpr double kCubicFoot_m3 = units::kFoot_m * units::kFoot_m * units::kFoot_m;
constexpr double kGrain_kg = units::kPound_kg / 7000.0;

struct MoleSymbol {
  std::string_view symbol;     // as written (compared case-insensitively)
  std::string_view canonical;  // "ppmv", "ppbv", "%"
  double factor;
  std::optional<Moisture> moisture;
};

constexpr std::array<MoleSymbol, 14> kMoleSymbols{{
    {"ppm", "ppmv", 1e-6, std::nullopt},
    {"ppmv", "ppmv", 1e-6, std::nullopt},
    {"ppmvd", "ppmv", 1e-6, Moisture::dry},
    {"ppmdv", "ppmv", 1e-6, Moisture::dry},
    {"ppmvw", "ppmv", 1e-6, Moisture::wet},
    {"ppmwv", "ppmv", 1e-6, Moisture::wet},
    {"ppb", "ppbv", 1e-9, std::nullopt},
    {"ppbv", "ppbv", 1e-9, std::nullopt},
    {"ppbvd", "ppbv", 1e-9, Moisture::dry},
    {"ppbvw", "ppbv", 1e-9, Moisture::wet},
    {"%", "%", 1e-2, std::nullopt},
    {"%v", "%", 1e-2, std::nullopt},
    {"%vol", "%", 1e-2, std::nullopt},
    {"vol%", "%", 1e-2, std::nullopt},
}};

struct MassPart {
  std::string_view symbol;
  double kg;
};
constexpr std::array<MassPart, 7> kMassParts{{
    {"ng", 1e-12}, {"ug", 1e-9}, {"mg", 1e-6}, {"g", 1e-3}, {"kg", 1.0}, {"gr", kGrain_kg}, {"lb", units::kPound_kg},
}};

struct VolumePart {
  std::string_view symbol;
  double m3;
  NormalRule rule;
  std::optional<Moisture> moisture;
  int fixed;  // 15 or 20 for the fixed conditions, 0 otherwise
};
constexpr std::array<VolumePart, 7> kVolumeParts{{
    {"Nm3", 1.0, NormalRule::default_0C, std::nullopt, 0},
    {"m3", 1.0, NormalRule::must_be_named, std::nullopt, 0},
    {"Sm3", 1.0, NormalRule::fixed, std::nullopt, 15},
    // 40 CFR 60.2: standard conditions 293 K (68 degF), 101.3 kPa (29.92 inHg); "d" = dry.
    {"dscm", 1.0, NormalRule::fixed, Moisture::dry, 20},
    {"dscf", kCubicFoot_m3, NormalRule::fixed, Moisture::dry, 20},
    {"scf", kCubicFoot_m3, NormalRule::fixed, std::nullopt, 20},
    {"ft3", kCubicFoot_m3, NormalRule::must_be_named, std::nullopt, 0},
}};

constexpr std::string_view kAcceptedItems =
    "accepted items (comma-separated): a unit (ppmv, ppmvd, ppmvw, ppbv, %, mg/Nm3, ug/Nm3, g/Nm3, mg/m3, mg/Sm3, "
    "mg/dscm, ng/dscm, gr/dscf, lb/dscf, lb/scf ...), wet, dry, as measured, O2=<level>%, O2=<preset>, "
    "CO2=<level>%, as NO2, normal=<0C|15C|20C|60F|IED>";

std::string lowercase(std::string_view text) {
  std::string result(text);
  std::transform(result.begin(), result.end(), result.begin(),
                 [](unsigned char c) { return static_cast<char>(std::tolower(c)); });
  return result;
}

std::string_view trim(std::string_view text) {
  const auto first = text.find_first_not_of(" \t");
  if (first == std::string_view::npos) return {};
  const auto last = text.find_last_not_of(" \t");
  return text.substr(first, last - first + 1);
}

std::string replace_all(std::string text, std::string_view from, std::string_view to) {
  std::size_t at = 0;
  while ((at = text.find(from, at)) != std::string::npos) {
    text.replace(at, from.size(), to);
    at += to.size();
  }
  return text;
}

// "µg/Nm³" -> "ug/Nm3"; "mg/Nm^3" -> "mg/Nm3".
std::string normalise_symbol(std::string_view symbol) {
  std::string text(symbol);
  if (text.find_first_of("^\xC2\xCE") == std::string::npos) return text;  // nothing to replace (the usual case)
  text = replace_all(text, "\xC2\xB3", "3");  // superscript three
  text = replace_all(text, "^3", "3");
  text = replace_all(text, "\xC2\xB5", "u");  // micro sign
  text = replace_all(text, "\xCE\xBC", "u");  // Greek small mu
  return text;
}

// "ppmvd" for ppmv with an implied dry basis; the symbol otherwise.
std::string unit_as_written(const ConcentrationUnit& unit) {
  if (!unit.is_mass() && unit.implied_moisture && unit.symbol != "%") {
    return unit.symbol + (*unit.implied_moisture == Moisture::dry ? "d" : "w");
  }
  return unit.symbol;
}

const units::NormalConditions* fixed_conditions(int fixed) {
  if (fixed == 15) return &units::normal_15C();
  if (fixed == 20) return &units::normal_20C();
  return nullptr;
}

[[noreturn]] void reject(std::string_view field, std::string_view text, const std::string& problem) {
  throw units::InputError(fmt::format("{} = \"{}\": {}", field, text, problem));
}

std::vector<std::string> known_words() {
  std::vector<std::string> words = {"wet", "dry", "as measured", "as NO2", "O2=", "CO2=", "normal="};
  for (const MoleSymbol& m : kMoleSymbols) words.emplace_back(m.symbol);
  for (const MassPart& m : kMassParts) {
    for (const VolumePart& v : kVolumeParts) words.push_back(fmt::format("{}/{}", m.symbol, v.symbol));
  }
  return words;
}

// Rates and other quantities that users sometimes put where a concentration basis belongs.
bool looks_like_rate(std::string_view symbol) {
  static const std::array<std::string_view, 14> rates = {"lb/MMBtu", "g/GJ", "ng/J", "mg/MJ", "mg/kWh", "g/MWh", "kg/h",
                                                          "lb/h", "t/yr", "g/s", "kg/s", "lb/hr", "t/h", "kg/hr"};
  return std::find(rates.begin(), rates.end(), symbol) != rates.end();
}

// Parses a level such as "3%", "3 %", "7.25%"; returns the fraction.
double parse_level(std::string_view level_text, std::string_view gas, std::string_view field, std::string_view text) {
  const std::string_view body = trim(level_text);
  if (body.empty()) reject(field, text, fmt::format("{}= needs a level, e.g. {}=3%", gas, gas));
  double number = 0.0;
  const auto [end, error] = std::from_chars(body.data(), body.data() + body.size(), number);
  if (error != std::errc() || end == body.data()) {
    reject(field, text, fmt::format("{} level \"{}\" is not a number with %, e.g. {}=3%", gas, body, gas));
  }
  const std::string_view rest = trim(body.substr(static_cast<std::size_t>(end - body.data())));
  if (rest.empty()) {
    reject(field, text, fmt::format("{} level \"{}\" needs a % sign ({}={}% for {} percent by volume)", gas, body, gas,
                                    body, body));
  }
  if (rest != "%") reject(field, text, fmt::format("{} level \"{}\": write the level in % by volume, e.g. {}=3%", gas, body, gas));
  if (!std::isfinite(number)) reject(field, text, fmt::format("{} level is not a finite number", gas));
  return number / 100.0;
}

void set_once(auto& slot, auto value, std::string_view what, std::string_view field, std::string_view text) {
  if (slot) reject(field, text, fmt::format("{} is given twice", what));
  slot = value;
}

void apply_item(PartialBasis& basis, std::string_view item, std::string_view field, std::string_view text) {
  const std::string lower = lowercase(item);
  std::string compact;  // lower case, no blanks
  for (const char c : lower) {
    if (c != ' ' && c != '\t') compact += c;
  }
  if (compact == "wet" || compact == "dry") {
    const Moisture moisture = compact == "wet" ? Moisture::wet : Moisture::dry;
    if (basis.moisture && *basis.moisture != moisture) reject(field, text, "both wet and dry are given; state one");
    set_once(basis.moisture, moisture, "wet/dry", field, text);
    return;
  }
  if (compact == "asmeasured") {
    if (basis.reference) reject(field, text, fmt::format("\"as measured\" contradicts {}", basis.reference->text()));
    basis.reference = DiluentReference::as_measured();
    return;
  }
  if (compact == "asno2") {
    set_once(basis.as_no2, true, "\"as NO2\"", field, text);
    return;
  }
  const auto equals = compact.find('=');
  if (equals != std::string::npos) {
    const std::string key = compact.substr(0, equals);
    const std::string_view original_value = trim(item.substr(item.find('=') + 1));
    if (key == "o2" || key == "co2") {
      const std::string gas = key == "o2" ? "O2" : "CO2";
      if (basis.reference) {
        reject(field, text, fmt::format("{} contradicts {}: a basis has one diluent level", item,
                                        basis.reference->text()));
      }
      // A preset key is a name: it starts with a letter and has no % sign ("O2=ied-solid").
      const bool numeric = original_value.empty() ||
                           !std::isalpha(static_cast<unsigned char>(original_value.front())) ||
                           original_value.find('%') != std::string_view::npos;
      if (key == "o2" && !numeric) {
        basis.reference = DiluentReference::o2_preset(reference_o2_preset(original_value, fmt::format("{} O2 preset", field)));
        return;
      }
      const double level = parse_level(original_value, gas, field, text);
      if (key == "o2") {
        if (level < 0.0) reject(field, text, fmt::format("O2={}%: an O2 level must be >= 0 %", percent_text(level)));
        if (level >= 0.21) {
          reject(field, text, fmt::format("O2={}%: an O2 level must be below the O2 content of air (20.9 % or 21 %)",
                                          percent_text(level)));
        }
        basis.reference = DiluentReference::o2(level);
      } else {
        if (level <= 0.0 || level > 1.0) {
          reject(field, text, fmt::format("CO2={}%: a CO2 level must be above 0 % and at most 100 %", percent_text(level)));
        }
        basis.reference = DiluentReference::co2(level);
      }
      return;
    }
    if (key == "normal") {
      if (basis.normal != nullptr) reject(field, text, "normal= is given twice");
      const std::string_view key_text = original_value;
      basis.normal = &units::normal_conditions_by_key(key_text, fmt::format("{} normal", field));
      return;
    }
    reject(field, text, fmt::format("unknown item \"{}\"; {}", item, kAcceptedItems));
  }
  if (const auto unit = find_concentration_unit(item)) {
    if (basis.unit) reject(field, text, fmt::format("two units: \"{}\" and \"{}\"; give one", basis.unit->symbol, item));
    basis.unit = *unit;
    return;
  }
  const std::string symbol = normalise_symbol(item);
  if (looks_like_rate(symbol)) {
    reject(field, text, fmt::format("\"{}\" is an emission rate, not a concentration basis; {}", item, kAcceptedItems));
  }
  if (item.find_first_of(" \t;") != std::string_view::npos) {
    reject(field, text, fmt::format("unknown item \"{}\": items are separated by commas, e.g. \"ppmv, dry, O2=3%\"", item));
  }
  std::string hint;
  if (const auto suggestion = units::nearest_name(item, known_words())) hint = fmt::format(" (did you mean \"{}\"?)", *suggestion);
  reject(field, text, fmt::format("unknown item \"{}\"{}; {}", item, hint, kAcceptedItems));
}

const units::NormalConditions* resolve_normal(const ConcentrationUnit& unit, const units::NormalConditions* named,
                                              const units::NormalConditions* default_normal, std::string_view field,
                                              std::string_view written) {
  switch (unit.normal_rule) {
    case NormalRule::not_applicable:
      if (named != nullptr) {
        reject(field, written, fmt::format("normal={} does not apply to {}: normal conditions belong to mass-per-volume "
                                           "units (mg/Nm3, mg/m3 ...)", named->key, unit.symbol));
      }
      return nullptr;
    case NormalRule::fixed:
      if (named != nullptr && named != unit.normal) {
        reject(field, written, fmt::format("{} is defined at {} ({}); it cannot be at normal={}", unit.symbol,
                                           unit.normal->key, unit.normal->description, named->key));
      }
      return unit.normal;
    case NormalRule::default_0C:
      if (named != nullptr) return named;
      if (default_normal != nullptr) return default_normal;
      return &units::normal_0C();
    case NormalRule::must_be_named:
      if (named != nullptr) return named;
      if (default_normal != nullptr) return default_normal;
      reject(field, written, fmt::format("{} is a volume at unstated conditions; name them, e.g. \"{}, normal=20C\" "
                                         "(accepted: 0C, 15C, 20C, 60F, IED)", unit.symbol, unit.symbol));
  }
  return nullptr;
}

}  // namespace

std::string_view moisture_name(Moisture moisture) { return moisture == Moisture::wet ? "wet" : "dry"; }

double ConcentrationUnit::kg_per_mol_per_unit() const {
  // Invariant: a mass unit is resolved before use (make_basis, mass_unit).
  return factor * normal->molar_volume_m3_per_mol() / volume_m3;
}

bool ConcentrationUnit::same_as(const ConcentrationUnit& other) const {
  return symbol == other.symbol && normal == other.normal;
}

std::string DiluentReference::text() const {
  switch (kind_) {
    case Kind::as_measured: return "as measured";
    case Kind::o2: return fmt::format("O2={}%", percent_text(dry_fraction_));
    case Kind::co2: return fmt::format("CO2={}%", percent_text(dry_fraction_));
  }
  return "as measured";
}

std::string Basis::text() const {
  std::string text = fmt::format("{}, {}, {}", unit.symbol, moisture_name(moisture), reference.text());
  if (as_no2) text += ", as NO2";
  if (unit.is_mass() && unit.normal != nullptr) text += fmt::format(", normal={}", unit.normal->key);
  return text;
}

bool Basis::same_as(const Basis& other) const {
  return unit.same_as(other.unit) && moisture == other.moisture && reference.same_as(other.reference) &&
         as_no2 == other.as_no2;
}

std::optional<ConcentrationUnit> find_concentration_unit(std::string_view symbol_text) {
  const std::string symbol = normalise_symbol(trim(symbol_text));
  const std::string lower = lowercase(symbol);
  for (const MoleSymbol& m : kMoleSymbols) {
    if (lower == m.symbol) {
      ConcentrationUnit unit;
      unit.symbol = m.canonical;
      unit.kind = UnitKind::mole_fraction;
      unit.factor = m.factor;
      unit.implied_moisture = m.moisture;
      return unit;
    }
  }
  const auto slash = symbol.find('/');
  if (slash == std::string::npos) return std::nullopt;
  const std::string_view mass = std::string_view(symbol).substr(0, slash);
  const std::string_view volume = std::string_view(symbol).substr(slash + 1);
  const auto m = std::find_if(kMassParts.begin(), kMassParts.end(), [&](const MassPart& p) { return p.symbol == mass; });
  const auto v = std::find_if(kVolumeParts.begin(), kVolumeParts.end(), [&](const VolumePart& p) { return p.symbol == volume; });
  if (m == kMassParts.end() || v == kVolumeParts.end()) return std::nullopt;
  ConcentrationUnit unit;
  unit.symbol.append(m->symbol).append("/").append(v->symbol);
  unit.kind = UnitKind::mass_per_normal_volume;
  unit.factor = m->kg;
  unit.volume_m3 = v->m3;
  unit.normal_rule = v->rule;
  unit.normal = fixed_conditions(v->fixed);
  unit.implied_moisture = v->moisture;
  return unit;
}

ConcentrationUnit mole_unit(std::string_view symbol) {
  const auto unit = find_concentration_unit(symbol);
  if (!unit || unit->is_mass()) {
    throw units::InputError(fmt::format("mole unit = \"{}\": not a mole-fraction unit; accepted: ppmv, ppbv, %", symbol));
  }
  return *unit;
}

ConcentrationUnit mass_unit(std::string_view symbol, const units::NormalConditions& normal) {
  auto unit = find_concentration_unit(symbol);
  if (!unit || !unit->is_mass()) {
    throw units::InputError(fmt::format(
        "mass unit = \"{}\": not a mass-per-normal-volume unit; accepted: mg/Nm3, ug/Nm3, g/Nm3, mg/m3, mg/Sm3, mg/dscm, "
        "gr/dscf, lb/dscf, lb/scf and other {{ng, ug, mg, g, kg, gr, lb}}/{{Nm3, m3, Sm3, dscm, dscf, scf, ft3}}",
        symbol));
  }
  unit->normal = resolve_normal(*unit, &normal, nullptr, "mass unit", symbol);
  return *unit;
}

Basis make_basis(ConcentrationUnit unit, Moisture moisture, DiluentReference reference, bool as_no2,
                 std::string_view field) {
  Basis basis{std::move(unit), moisture, reference, as_no2};
  // The basis text is written only into a rejection: make_basis runs on every conversion of a sweep.
  const auto refuse = [&](const std::string& problem) { reject(field, basis.text(), problem); };
  if (basis.unit.is_mass() && basis.unit.normal == nullptr) {
    refuse(fmt::format("{} needs named normal conditions", basis.unit.symbol));
  }
  if (basis.unit.implied_moisture && *basis.unit.implied_moisture != moisture) {
    refuse(fmt::format("{} is a {} unit; it cannot be {}", unit_as_written(basis.unit),
                       moisture_name(*basis.unit.implied_moisture), moisture_name(moisture)));
  }
  if (moisture == Moisture::wet && reference.kind() != DiluentReference::Kind::as_measured) {
    refuse(fmt::format("{} on the wet basis: a concentration corrected to a reference O2 or CO2 is defined on the dry "
                       "basis; write \"dry, {}\"", reference.text(), reference.text()));
  }
  const double level = reference.dry_fraction();
  if (reference.kind() == DiluentReference::Kind::o2 && (!std::isfinite(level) || level < 0.0 || level >= 0.21)) {
    refuse("an O2 level must be >= 0 % and below the O2 content of air (20.9 % or 21 %)");
  }
  if (reference.kind() == DiluentReference::Kind::co2 && (!std::isfinite(level) || level <= 0.0 || level > 1.0)) {
    refuse("a CO2 level must be above 0 % and at most 100 %");
  }
  return basis;
}

namespace {

// The forms permits write, turned into items: "ppmvd @ 3% O2", "ppmvd at 15 % O2",
// "mg/Nm3 @ 15% O2 dry" -> "ppmvd, O2=3%", "ppmvd, O2=15%", "mg/Nm3, O2=15%, dry". Text without them
// is returned unchanged (so its errors point at what was written).
std::string items_of_permit_form(std::string_view text) {
  static const std::regex level(R"((?:@|\bat\b)\s*([0-9]+(?:\.[0-9]+)?)\s*%\s*(CO2|O2)\b)", std::regex::icase);
  static const std::regex moisture(R"(\s+(dry|wet)\b)", std::regex::icase);
  const std::string written(text);
  std::string items = std::regex_replace(written, level, ",$2=$1%,");
  if (items == written) return written;
  items = std::regex_replace(items, moisture, ",$1");
  std::vector<std::string> kept;
  std::size_t start = 0;
  while (start <= items.size()) {
    const std::size_t comma = std::min(items.find(',', start), items.size());
    const std::string_view item = trim(std::string_view(items).substr(start, comma - start));
    if (!item.empty()) kept.emplace_back(item);
    start = comma + 1;
  }
  return fmt::format("{}", fmt::join(kept, ", "));
}

}  // namespace

PartialBasis parse_partial_basis(std::string_view written, std::string_view field) {
  PartialBasis basis;
  if (trim(written).empty()) return basis;
  const std::string items = items_of_permit_form(written);
  const std::string_view text = items;
  std::size_t start = 0;
  while (start <= text.size()) {
    const std::size_t comma = std::min(text.find(',', start), text.size());
    const std::string_view item = trim(text.substr(start, comma - start));
    if (item.empty()) reject(field, written, "empty item between commas");
    apply_item(basis, item, field, written);
    start = comma + 1;
  }
  return basis;
}

PartialBasis merge_partial_bases(const PartialBasis& first, std::string_view first_field, const PartialBasis& second,
                                 std::string_view second_field) {
  const auto conflict = [&](std::string_view what, const std::string& a, const std::string& b) {
    throw units::InputError(fmt::format("{}: {} \"{}\" and {} \"{}\" disagree; give it once", what, first_field, a,
                                        second_field, b));
  };
  PartialBasis merged = first;
  if (second.unit) {
    if (merged.unit && merged.unit->symbol != second.unit->symbol) conflict("unit", merged.unit->symbol, second.unit->symbol);
    const auto first_moisture = merged.unit ? merged.unit->implied_moisture : std::nullopt;
    const auto second_moisture = second.unit->implied_moisture;
    if (first_moisture && second_moisture && *first_moisture != *second_moisture) {
      conflict("wet/dry", std::string(moisture_name(*first_moisture)), std::string(moisture_name(*second_moisture)));
    }
    if (!merged.unit || second_moisture) merged.unit = second.unit;
  }
  if (second.moisture) {
    if (merged.moisture && *merged.moisture != *second.moisture) {
      conflict("wet/dry", std::string(moisture_name(*merged.moisture)), std::string(moisture_name(*second.moisture)));
    }
    merged.moisture = second.moisture;
  }
  if (second.reference) {
    if (merged.reference && !merged.reference->same_as(*second.reference)) {
      conflict("diluent level", merged.reference->text(), second.reference->text());
    }
    merged.reference = second.reference;
  }
  if (second.normal != nullptr) {
    if (merged.normal != nullptr && merged.normal != second.normal) {
      conflict("normal conditions", std::string(merged.normal->key), std::string(second.normal->key));
    }
    merged.normal = second.normal;
  }
  if (second.as_no2) merged.as_no2 = second.as_no2;
  return merged;
}

namespace {

std::string partial_text(const PartialBasis& partial) {
  std::vector<std::string> items;
  if (partial.unit) items.push_back(unit_as_written(*partial.unit));
  if (partial.moisture) items.emplace_back(moisture_name(*partial.moisture));
  if (partial.reference) items.push_back(partial.reference->text());
  if (partial.as_no2 && *partial.as_no2) items.emplace_back("as NO2");
  if (partial.normal != nullptr) items.push_back(fmt::format("normal={}", partial.normal->key));
  return fmt::format("{}", fmt::join(items, ", "));
}

Basis finish(ConcentrationUnit unit, const units::NormalConditions* named, std::optional<Moisture> moisture,
             DiluentReference reference, bool as_no2, std::string_view field, const std::string& written,
             const units::NormalConditions* default_normal) {
  unit.normal = resolve_normal(unit, named, default_normal, field, written);
  if (!moisture) moisture = unit.implied_moisture;
  if (!moisture) {
    reject(field, written, "wet or dry is not stated; add \"wet\" or \"dry\" (or use ppmvd / ppmvw)");
  }
  if (unit.implied_moisture && *unit.implied_moisture != *moisture) {
    reject(field, written, fmt::format("{} is a {} unit; it cannot be {}", unit_as_written(unit),
                                       moisture_name(*unit.implied_moisture), moisture_name(*moisture)));
  }
  return make_basis(std::move(unit), *moisture, reference, as_no2, field);
}

}  // namespace

namespace {

Basis complete_written(const PartialBasis& partial, std::string_view field, const units::NormalConditions* default_normal,
                       const std::string& written) {
  if (!partial.unit) {
    reject(field, written, "no unit; give one, e.g. ppmv, mg/Nm3 (after the number, \"35 ppmv\", or in the basis)");
  }
  return finish(*partial.unit, partial.normal, partial.moisture,
                partial.reference.value_or(DiluentReference::as_measured()), partial.as_no2.value_or(false), field,
                written, default_normal);
}

}  // namespace

Basis complete_basis(const PartialBasis& partial, std::string_view field, const units::NormalConditions* default_normal) {
  return complete_written(partial, field, default_normal, partial_text(partial));
}

Basis complete_basis_from(const PartialBasis& partial, const Basis& inherit, std::string_view field,
                          const units::NormalConditions* default_normal) {
  const std::string written = partial_text(partial);
  ConcentrationUnit unit = partial.unit ? *partial.unit : inherit.unit;
  // The normal conditions carry over only together with the unit.
  const units::NormalConditions* named = partial.normal;
  if (!partial.unit && named == nullptr) named = inherit.unit.normal;
  // The unit's own wet/dry wins over the inherited one; an explicit one is checked against it.
  std::optional<Moisture> moisture = partial.moisture;
  if (!moisture && !(partial.unit && partial.unit->implied_moisture)) moisture = inherit.moisture;
  return finish(std::move(unit), named, moisture, partial.reference.value_or(inherit.reference),
                partial.as_no2.value_or(inherit.as_no2), field, written.empty() ? std::string("(empty)") : written,
                default_normal);
}

Basis parse_basis(std::string_view text, std::string_view field, const units::NormalConditions* default_normal) {
  return complete_written(parse_partial_basis(text, field), field, default_normal, std::string(text));
}

StatedValue split_stated_value(std::string_view text, std::string_view field) {
  const auto first = text.find_first_not_of(" \t");
  if (first == std::string_view::npos) {
    throw units::InputError(fmt::format("{} = \"\": empty; give a number with its unit, e.g. \"35 ppm\"", field));
  }
  const std::size_t start = text[first] == '+' ? first + 1 : first;
  double number = 0.0;
  const auto [end, error] = std::from_chars(text.data() + start, text.data() + text.size(), number);
  if (error == std::errc::result_out_of_range) {
    throw units::InputError(fmt::format("{} = \"{}\": the number is out of range", field, text));
  }
  if (error != std::errc() || end == text.data() + start) {
    throw units::InputError(
        fmt::format("{} = \"{}\": no number found; give a number with its unit, e.g. \"35 ppm\"", field, text));
  }
  if (!std::isfinite(number)) throw units::InputError(fmt::format("{} = \"{}\": not a finite number", field, text));
  const std::string_view rest(end, static_cast<std::size_t>(text.data() + text.size() - end));
  if (rest.size() > 1 && rest.front() == ',' && std::isdigit(static_cast<unsigned char>(rest[1])) != 0) {
    const std::string_view before(text.data() + first, static_cast<std::size_t>(end - (text.data() + first)));
    throw units::InputError(fmt::format("{} = \"{}\": a decimal comma; write a decimal point (\"{}.{}\"); commas "
                                        "separate items",
                                        field, text, before, rest.substr(1)));
  }
  return {number, std::string(rest)};
}

}  // namespace stackbound::emissions
