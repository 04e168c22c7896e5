#include "stackbound/units/quantity_parser.hpp"

#include <algorithm>
#include <array>
#include <cctype>
#include <charconv>
#include <cmath>
#include <vector>

#include "stackbound/units/constants.hpp"
#include "stackbound/units/input_error.hpp"
#include "stackbound/units/nearest_name.hpp"
#include "stackbound/units/plain_text.hpp"

namespace stackbound::units {

namespace {

using D = Dimension;
constexpr double kHour_s = 3600.0;
constexpr double kDay_s = 86400.0;
// A year of 8760 h (365 days) for annual totals; common practice in permit arithmetic, no source.
constexpr double kYear_s = 8760.0 * kHour_s;
constexpr double kPoundMole_mol = kPound_kg * 1000.0;
constexpr double kCubicFoot_m3 = kFoot_m * kFoot_m * kFoot_m;
// Grain = 1/7000 lb. Source: International Yard and Pound Agreement (1959).
constexpr double kGrain_kg = kPound_kg / 7000.0;
constexpr double kFahrenheitOffset_K = kCelsiusOffset_K - 32.0 * 5.0 / 9.0;

// The normal-volume units resolve to moles through the molar volume of their conditions, which
// needs a division at start-up; the table is therefore built once, then read only.
// Long because it is the unit table itself, one line a unit; splitting it would only scatter the list.
std::vector<UnitDefinition> build_table() {
  const NormalConditions* n0 = &normal_0C();
  const NormalConditions* n15 = &normal_15C();
  const NormalConditions* n20 = &normal_20C();
  const NormalConditions* n60 = &normal_60F();
  const double nm3 = 1.0 / n0->molar_volume_m3_per_mol();          // mol per Nm3 (0 degC)
  const double sm3 = 1.0 / n15->molar_volume_m3_per_mol();         // mol per Sm3 (15 degC)
  const double scf = kCubicFoot_m3 / n60->molar_volume_m3_per_mol();  // mol per scf (60 degF)
  const double dscf = kCubicFoot_m3 / n20->molar_volume_m3_per_mol(); // mol per dscf (68 degF, EPA)
  const double dscm = 1.0 / n20->molar_volume_m3_per_mol();        // mol per dscm (20 degC, EPA)
  const double K0 = kCelsiusOffset_K;
  return {
      // temperature (absolute)
      {"K", D::temperature, 1.0},
      {"degC", D::temperature, 1.0, K0},
      {"°C", D::temperature, 1.0, K0},
      {"degF", D::temperature, 5.0 / 9.0, kFahrenheitOffset_K},
      {"°F", D::temperature, 5.0 / 9.0, kFahrenheitOffset_K},
      {"degR", D::temperature, 5.0 / 9.0},
      // pressure (absolute)
      {"Pa", D::pressure, 1.0},
      {"hPa", D::pressure, 1e2},
      {"kPa", D::pressure, 1e3},
      {"MPa", D::pressure, 1e6},
      {"bar", D::pressure, 1e5},
      {"mbar", D::pressure, 1e2},
      {"atm", D::pressure, kStandardAtmosphere_Pa},
      {"psia", D::pressure, kPsi_Pa},
      {"inHg", D::pressure, kInchMercury_Pa},
      {"mmHg", D::pressure, 133.322387415},  // conventional mmHg. Source: NIST SP 811, Appendix B.
      // fraction
      {"%", D::fraction, 1e-2},
      {"ppm", D::fraction, 1e-6},
      {"ppmv", D::fraction, 1e-6},
      {"ppb", D::fraction, 1e-9},
      {"ppbv", D::fraction, 1e-9},
      // mass
      {"kg", D::mass, 1.0},
      {"g", D::mass, 1e-3},
      {"t", D::mass, 1e3},
      {"lb", D::mass, kPound_kg},
      // amount (normal volumes are amounts of gas)
      {"mol", D::amount, 1.0},
      {"kmol", D::amount, 1e3},
      {"lbmol", D::amount, kPoundMole_mol},
      {"Nm3", D::amount, nm3, 0.0, n0},
      {"Sm3", D::amount, sm3, 0.0, n15},
      {"scf", D::amount, scf, 0.0, n60},
      {"Mscf", D::amount, 1e3 * scf, 0.0, n60},
      {"MMscf", D::amount, 1e6 * scf, 0.0, n60},
      {"dscf", D::amount, dscf, 0.0, n20},
      {"dscm", D::amount, dscm, 0.0, n20},
      // energy
      {"J", D::energy, 1.0},
      {"kJ", D::energy, 1e3},
      {"MJ", D::energy, 1e6},
      {"GJ", D::energy, 1e9},
      {"TJ", D::energy, 1e12},
      {"kWh", D::energy, 3.6e6},
      {"MWh", D::energy, 3.6e9},
      {"GWh", D::energy, 3.6e12},
      {"Btu", D::energy, kBtuIT_J},
      {"MMBtu", D::energy, 1e6 * kBtuIT_J},
      // power
      {"W", D::power, 1.0},
      {"kW", D::power, 1e3},
      {"MW", D::power, 1e6},
      {"GW", D::power, 1e9},
      {"Btu/h", D::power, kBtuIT_J / kHour_s},
      {"MMBtu/h", D::power, 1e6 * kBtuIT_J / kHour_s},
      {"MMBtu/hr", D::power, 1e6 * kBtuIT_J / kHour_s},
      // time
      {"s", D::time, 1.0},
      {"ms", D::time, 1e-3},  // SI prefix milli (residence times of flames)
      {"min", D::time, 60.0},
      {"h", D::time, kHour_s},
      {"hr", D::time, kHour_s},
      {"d", D::time, kDay_s},
      {"yr", D::time, kYear_s},
      // mass flow
      {"kg/s", D::mass_flow, 1.0},
      {"kg/h", D::mass_flow, 1.0 / kHour_s},
      {"kg/hr", D::mass_flow, 1.0 / kHour_s},
      {"g/s", D::mass_flow, 1e-3},
      {"t/h", D::mass_flow, 1e3 / kHour_s},
      {"t/d", D::mass_flow, 1e3 / kDay_s},
      {"t/yr", D::mass_flow, 1e3 / kYear_s},
      {"lb/h", D::mass_flow, kPound_kg / kHour_s},
      {"lb/hr", D::mass_flow, kPound_kg / kHour_s},
      {"lb/s", D::mass_flow, kPound_kg},
      // molar flow (normal-volume flows are molar flows)
      {"mol/s", D::molar_flow, 1.0},
      {"kmol/h", D::molar_flow, 1e3 / kHour_s},
      {"kmol/s", D::molar_flow, 1e3},
      {"lbmol/h", D::molar_flow, kPoundMole_mol / kHour_s},
      {"Nm3/h", D::molar_flow, nm3 / kHour_s, 0.0, n0},
      {"Nm3/s", D::molar_flow, nm3, 0.0, n0},
      {"Sm3/h", D::molar_flow, sm3 / kHour_s, 0.0, n15},
      {"Sm3/d", D::molar_flow, sm3 / kDay_s, 0.0, n15},
      {"scfm", D::molar_flow, scf / 60.0, 0.0, n60},
      {"scfh", D::molar_flow, scf / kHour_s, 0.0, n60},
      {"MMscfd", D::molar_flow, 1e6 * scf / kDay_s, 0.0, n60},
      {"dscfm", D::molar_flow, dscf / 60.0, 0.0, n20},
      // heating values and other energy per mass
      {"J/kg", D::specific_energy, 1.0},
      {"kJ/kg", D::specific_energy, 1e3},
      {"MJ/kg", D::specific_energy, 1e6},
      {"GJ/t", D::specific_energy, 1e6},
      {"Btu/lb", D::specific_energy, kBtuIT_J / kPound_kg},
      // energy per amount of gas
      {"J/mol", D::molar_energy, 1.0},
      {"kJ/mol", D::molar_energy, 1e3},
      {"kJ/kmol", D::molar_energy, 1.0},
      {"MJ/kmol", D::molar_energy, 1e3},
      {"MJ/Nm3", D::molar_energy, 1e6 / nm3, 0.0, n0},
      {"kWh/Nm3", D::molar_energy, 3.6e6 / nm3, 0.0, n0},
      {"MJ/Sm3", D::molar_energy, 1e6 / sm3, 0.0, n15},
      {"Btu/scf", D::molar_energy, kBtuIT_J / scf, 0.0, n60},
      // mass per amount: molar masses and concentrations per normal volume of gas
      {"g/mol", D::mass_per_amount, 1e-3},
      {"kg/kmol", D::mass_per_amount, 1e-3},
      {"kg/mol", D::mass_per_amount, 1.0},
      {"mg/Nm3", D::mass_per_amount, 1e-6 / nm3, 0.0, n0},
      {"ug/Nm3", D::mass_per_amount, 1e-9 / nm3, 0.0, n0},
      {"g/Nm3", D::mass_per_amount, 1e-3 / nm3, 0.0, n0},
      {"mg/Sm3", D::mass_per_amount, 1e-6 / sm3, 0.0, n15},
      {"mg/dscm", D::mass_per_amount, 1e-6 / dscm, 0.0, n20},
      {"gr/dscf", D::mass_per_amount, kGrain_kg / dscf, 0.0, n20},
      {"lb/dscf", D::mass_per_amount, kPound_kg / dscf, 0.0, n20},
  };
}

const std::vector<UnitDefinition>& table() {
  static const std::vector<UnitDefinition> units = build_table();
  return units;
}

std::string quoted(std::string_view field, std::string_view text) {
  return std::string(field) + " = \"" + printable(text) + "\"";
}

std::string accepted_units(std::initializer_list<Dimension> accepted) {
  std::string list;
  for (const Dimension dimension : accepted) {
    if (dimension == D::dimensionless) {
      if (!list.empty()) list += ", ";
      list += "a bare number";
      continue;
    }
    for (const UnitDefinition& unit : table()) {
      if (unit.dimension == dimension) {
        if (!list.empty()) list += ", ";
        list += unit.symbol;
      }
    }
  }
  return list;
}

std::string expected_text(std::initializer_list<Dimension> accepted) {
  std::string text;
  std::size_t i = 0;
  for (const Dimension dimension : accepted) {
    if (i > 0) text += i + 1 == accepted.size() ? " or " : ", ";
    text += dimension_name(dimension);
    ++i;
  }
  return text;
}

[[noreturn]] void reject(std::string_view field, std::string_view text, const std::string& problem,
                         std::initializer_list<Dimension> accepted) {
  throw InputError(quoted(field, text) + ": " + problem + "; expected " + expected_text(accepted) +
                   "; accepted units: " + accepted_units(accepted));
}

constexpr std::string_view kSpace = " \t\r\n\f\v";
// Characters that can make up a decimal number ("-1.25e+3"); no unit symbol starts with one of them.
constexpr std::string_view kNumberCharacters = "0123456789.+-eE";
constexpr std::string_view kNumberStart = "0123456789.+-";
constexpr std::string_view kDigits = "0123456789";

// A number for messages, with 6 significant digits: "-26.85".
std::string fmt_number(double value) {
  std::array<char, 32> buffer{};
  const auto result = std::to_chars(buffer.data(), buffer.data() + buffer.size(), value, std::chars_format::general, 6);
  return std::string(buffer.data(), result.ptr);
}

std::string_view trim(std::string_view text) {
  const auto first = text.find_first_not_of(kSpace);
  if (first == std::string_view::npos) return {};
  const auto last = text.find_last_not_of(kSpace);
  return text.substr(first, last - first + 1);
}

bool starts_with_ignoring_case(std::string_view text, std::string_view prefix) {
  if (text.size() < prefix.size()) return false;
  for (std::size_t i = 0; i < prefix.size(); ++i) {
    if (std::tolower(static_cast<unsigned char>(text[i])) != prefix[i]) return false;
  }
  return true;
}

std::string without_spaces(std::string_view text) {
  std::string compact;
  for (const char c : text) {
    if (kSpace.find(c) == std::string_view::npos) compact += c;
  }
  return compact;
}

bool contains(std::initializer_list<Dimension> accepted, Dimension dimension) {
  return std::find(accepted.begin(), accepted.end(), dimension) != accepted.end();
}

const UnitDefinition* find_unit(std::string_view symbol) {
  for (const UnitDefinition& unit : table()) {
    if (unit.symbol == symbol) return &unit;
  }
  return nullptr;
}

}  // namespace

std::string_view dimension_name(Dimension dimension) {
  switch (dimension) {
    case D::dimensionless: return "a plain number";
    case D::fraction: return "a fraction (% or ppm)";
    case D::temperature: return "a temperature";
    case D::temperature_difference: return "a temperature difference";
    case D::pressure: return "an absolute pressure";
    case D::mass: return "a mass";
    case D::amount: return "an amount of gas";
    case D::energy: return "an energy";
    case D::power: return "a power (heat input)";
    case D::time: return "a time";
    case D::mass_flow: return "a mass flow";
    case D::molar_flow: return "a molar or normal-volume flow";
    case D::specific_energy: return "an energy per mass";
    case D::molar_energy: return "an energy per amount of gas";
    case D::mass_per_amount: return "a mass per amount of gas";
  }
  return "a quantity";
}

std::span<const UnitDefinition> unit_table() { return table(); }

namespace {

// The leading decimal number of `body` (the trimmed `text`): its run of number characters, which must
// be one number, finite and in range; rejects the text otherwise.
struct LeadingNumber {
  double value = 0.0;
  std::string_view token;  // the characters of the number
};
LeadingNumber leading_number(std::string_view body, std::string_view text, std::string_view field,
                             std::initializer_list<Dimension> accepted) {
  const std::string_view unsigned_body = body.substr(body.front() == '+' || body.front() == '-' ? 1 : 0);
  if (starts_with_ignoring_case(unsigned_body, "nan") || starts_with_ignoring_case(unsigned_body, "inf")) {
    reject(field, text, "not a finite number", accepted);
  }
  const std::string_view token = body.substr(0, std::min(body.find_first_not_of(kNumberCharacters), body.size()));
  if (token.find_first_of(kDigits) == std::string_view::npos) reject(field, text, "no number found", accepted);
  if (token.size() < body.size() && body[token.size()] == ',') {
    const std::string_view with_commas = body.substr(0, body.find_first_not_of("0123456789.+-eE,"));
    reject(field, text,
           "malformed number \"" + std::string(with_commas) +
               "\": write the decimal point as \".\" and no thousands separators",
           accepted);
  }
  const std::string malformed = "malformed number \"" + std::string(token) + "\"";
  // from_chars takes a leading '-' but not '+', and must not be handed "+-5".
  const std::size_t start = token.front() == '+' ? 1 : 0;
  if (start == 1 && token.size() > 1 && (token[1] == '+' || token[1] == '-')) reject(field, text, malformed, accepted);
  double number = 0.0;
  const auto [end, error] = std::from_chars(token.data() + start, token.data() + token.size(), number);
  if (error == std::errc::invalid_argument || end != token.data() + token.size()) {
    reject(field, text, malformed, accepted);
  }
  if (error == std::errc::result_out_of_range) {
    reject(field, text,
           "the number \"" + std::string(token) +
               "\" is out of range (a magnitude between about 1e-308 and 1e308, or 0, is needed)",
           accepted);
  }
  if (!std::isfinite(number)) reject(field, text, "not a finite number", accepted);
  return {number, token};
}

// Mistakes whose nearest symbol would change the meaning get their own message: a temperature scale
// written as a letter ("1477 C" is degC, not K), and an actual volume flow ("m3/h"), which is an
// amount of gas only at a stated temperature and pressure. (A decimal comma, "12,5 %", is a malformed
// number: leading_number says to write the decimal point.)
void reject_meaning_changing_slips(std::string_view symbol, std::string_view token, std::string_view text,
                                   std::string_view field, std::initializer_list<Dimension> accepted) {
  if (contains(accepted, D::temperature) && (symbol == "C" || symbol == "F")) {
    reject(field, text,
           "unknown unit \"" + std::string(symbol) + "\" (did you mean \"deg" + std::string(symbol) + "\"? write \"" +
               std::string(token) + " deg" + std::string(symbol) + "\")",
           accepted);
  }
  const std::string compact = without_spaces(symbol);
  static constexpr std::array<std::string_view, 8> kActualFlows{"m3/h", "m3/s", "m3/hr", "m3/min",
                                                                "m\u00b3/h", "m\u00b3/s", "acfm", "ft3/min"};
  if (contains(accepted, D::molar_flow) &&
      std::find(kActualFlows.begin(), kActualFlows.end(), compact) != kActualFlows.end()) {
    reject(field, text,
           "\"" + compact + "\" is an actual volume flow: it is an amount of gas only at the temperature and pressure "
           "of the meter; convert the reading with them to a normal-volume flow (e.g. Nm3/h at 0 degC, 101.325 kPa) "
           "or give a mass flow; m3/h is not Nm3/h",
           accepted);
  }
}

// Rejects `symbol`, which is no unit, with the likeliest reason: a second number after `token`, a
// unit written with spaces, text after a unit, or an unknown symbol (with the nearest accepted one).
[[noreturn]] void reject_unknown_unit(std::string_view symbol, std::string_view token, std::string_view text,
                                      std::string_view field, std::initializer_list<Dimension> accepted) {
  reject_meaning_changing_slips(symbol, token, text, field, accepted);
  const std::string_view first_word = symbol.substr(0, std::min(symbol.find_first_of(kSpace), symbol.size()));
  const std::string_view after_first = trim(symbol.substr(first_word.size()));
  if (kNumberStart.find(first_word.front()) != std::string_view::npos) {
    reject(field, text,
           "found a second number \"" + std::string(first_word) + "\" after \"" + std::string(token) +
               "\"; write one number followed by one unit",
           accepted);
  }
  const std::string compact = without_spaces(symbol);
  if (const UnitDefinition* spaced = find_unit(compact); spaced != nullptr && contains(accepted, spaced->dimension)) {
    reject(field, text,
           "unknown unit \"" + printable(symbol) + "\" (did you mean \"" + compact +
               "\"? unit symbols are written without spaces)",
           accepted);
  }
  if (!after_first.empty() && find_unit(first_word) != nullptr) {
    reject(field, text,
           "unexpected text \"" + printable(after_first) + "\" after the unit \"" + std::string(first_word) + "\"",
           accepted);
  }
  std::vector<std::string> candidates;
  for (const Dimension dimension : accepted) {
    for (const UnitDefinition& u : table()) {
      if (u.dimension == dimension) candidates.emplace_back(u.symbol);
    }
  }
  std::string problem = "unknown unit \"" + printable(symbol) + "\"";
  if (const auto suggestion = nearest_name(symbol, candidates)) problem += " (did you mean \"" + *suggestion + "\"?)";
  reject(field, text, problem, accepted);
}

// `number` in `unit` converted to SI; rejected if not finite, or at or below zero for an absolute
// temperature or pressure.
double checked_si_value(double number, const UnitDefinition& unit, std::string_view text, std::string_view field,
                        std::initializer_list<Dimension> accepted) {
  const double si = number * unit.factor_to_si + unit.offset_si;
  if (!std::isfinite(si)) reject(field, text, "the value is out of range once converted to SI units", accepted);
  if (unit.dimension == D::temperature && si <= 0.0) {
    reject(field, text, fmt_number(si) + " K is at or below absolute zero; a temperature must be above 0 K", accepted);
  }
  if (unit.dimension == D::pressure && si <= 0.0) {
    reject(field, text,
           fmt_number(si) +
               " Pa is not above 0 Pa; an absolute pressure must be positive (gauge pressures are not accepted)",
           accepted);
  }
  return si;
}

}  // namespace

ParsedQuantity parse_quantity(std::string_view text, std::string_view field,
                              std::initializer_list<Dimension> accepted) {
  const std::string_view body = trim(text);
  if (body.empty()) reject(field, text, "the text is empty", accepted);

  // The number is the leading run of number characters; all of it must be one decimal number.
  const LeadingNumber number = leading_number(body, text, field, accepted);

  // The unit: the rest, one symbol, nothing after it.
  const std::string_view symbol = trim(body.substr(number.token.size()));
  if (symbol.empty()) {
    if (contains(accepted, D::dimensionless)) return {number.value, D::dimensionless, nullptr};
    reject(field, text, "a unit is required", accepted);
  }
  const UnitDefinition* unit = find_unit(symbol);
  if (unit == nullptr) reject_unknown_unit(symbol, number.token, text, field, accepted);
  if (!contains(accepted, unit->dimension)) {
    reject(field, text, "\"" + std::string(symbol) + "\" is " + std::string(dimension_name(unit->dimension)), accepted);
  }
  return {checked_si_value(number.value, *unit, text, field, accepted), unit->dimension, unit};
}

Temperature parse_temperature(std::string_view text, std::string_view field) {
  return kelvin(parse_quantity(text, field, {D::temperature}).value_si);
}

Pressure parse_pressure(std::string_view text, std::string_view field) {
  return pascals(parse_quantity(text, field, {D::pressure}).value_si);
}

double parse_fraction(std::string_view text, std::string_view field) {
  return parse_quantity(text, field, {D::fraction}).value_si;
}

Time parse_time(std::string_view text, std::string_view field) {
  return seconds(parse_quantity(text, field, {D::time}).value_si);
}

Power parse_power(std::string_view text, std::string_view field) {
  return watts(parse_quantity(text, field, {D::power}).value_si);
}

double convert_from_si(double value_si, Dimension dimension, std::string_view unit_symbol) {
  const UnitDefinition* unit = find_unit(unit_symbol);
  if (unit == nullptr || unit->dimension != dimension) {
    throw InputError("unit \"" + std::string(unit_symbol) + "\": not " + std::string(dimension_name(dimension)) +
                     " unit; accepted units: " + accepted_units({dimension}));
  }
  return (value_si - unit->offset_si) / unit->factor_to_si;
}

std::string format_quantity(double value_si, Dimension dimension, std::string_view unit_symbol, int significant) {
  const double value = convert_from_si(value_si, dimension, unit_symbol);
  std::array<char, 64> buffer{};
  const int digits = std::clamp(significant, 1, 17);
  const auto result =
      std::to_chars(buffer.data(), buffer.data() + buffer.size(), value, std::chars_format::general, digits);
  return std::string(buffer.data(), result.ptr) + " " + std::string(unit_symbol);
}

}  // namespace stackbound::units
