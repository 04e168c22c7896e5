#pragma once
// Text such as "1.2 t/h", "60 degF", "14.7 psia", "850 Nm3/h", "3 %", "2.5 MMBtu/h" parsed into an
// SI value of the dimension the caller expects. Anything else is an InputError whose message names
// the field, the text and the units that would have been accepted, e.g.
//   firing.pressure = "3 kg": "kg" is a mass; expected an absolute pressure; accepted units: Pa, hPa, kPa, ...
//
// Normal-volume units (Nm3, Sm3, scf, dscf ...) are amounts of gas: "850 Nm3/h" is a molar flow and
// "38 MJ/Nm3" an energy per mole. Each such unit names its reference conditions (see unit_table()).

#include <initializer_list>
#include <span>
#include <string>
#include <string_view>

#include "stackbound/units/normal_conditions.hpp"
#include "stackbound/units/quantities.hpp"

namespace stackbound::units {

enum class Dimension {
  dimensionless,      // "0.85", "1.15" (SI value is the number)
  fraction,           // "3 %", "350 ppm" ; SI value is the fraction (0.03); a bare number is refused
  temperature,        // K, degC, degF, degR ; absolute, SI value in K
  temperature_difference,  // "delta_K" style is not parsed; reserved for printing
  pressure,           // Pa, kPa, MPa, bar, mbar, atm, psia, inHg, mmHg ; SI value in Pa
  mass,               // kg, g, t, lb ; kg
  amount,             // mol, kmol, lbmol, Nm3, Sm3, scf ... ; mol
  energy,             // J, kJ, MJ, GJ, kWh, MWh, Btu, MMBtu ; J
  power,              // W, kW, MW, GW, Btu/h, MMBtu/h ; W
  time,               // s, min, h, d, yr ; s
  mass_flow,          // kg/s, kg/h, t/h, t/d, lb/h, lb/s ; kg/s
  molar_flow,         // mol/s, kmol/h, lbmol/h, Nm3/h, Sm3/h, scfm, scfh, MMscfd ... ; mol/s
  specific_energy,    // J/kg, kJ/kg, MJ/kg, Btu/lb ; J/kg (heating value by mass)
  molar_energy,       // J/mol, kJ/mol, MJ/Nm3, Btu/scf ; J/mol (heating value per amount of gas)
  mass_per_amount,    // g/mol, kg/kmol, mg/Nm3, g/Nm3, ug/Nm3, gr/dscf ; kg/mol (concentration per amount of gas)
};

// Human name of a dimension for messages: "a temperature", "a mass flow" ...
std::string_view dimension_name(Dimension dimension);

struct UnitDefinition {
  std::string_view symbol;             // as written in text, case-sensitive: "kg/h", "degC", "Nm3/h"
  Dimension dimension;
  double factor_to_si;                 // SI = value * factor_to_si + offset_si
  double offset_si = 0.0;              // only temperature scales have an offset
  const NormalConditions* normal = nullptr;  // for normal-volume units: the conditions they name
};

// All units the parser accepts, in the order they are listed in messages.
std::span<const UnitDefinition> unit_table();

struct ParsedQuantity {
  double value_si = 0.0;
  Dimension dimension = Dimension::dimensionless;
  const UnitDefinition* unit = nullptr;  // nullptr for a bare number
};

// Parses `text` as a number followed by a unit of one of the `accepted` dimensions.
// A bare number is accepted only where `accepted` holds dimensionless: a fraction needs "%" or "ppm".
// The whole text must be one decimal number (point, not comma) and at most one unit symbol; blanks
// around them are ignored. Temperatures must be above 0 K and pressures above 0 Pa (absolute).
// Throws InputError: '<field> = "<text>": <what is wrong>; expected <dimension>; accepted units: <list>'.
ParsedQuantity parse_quantity(std::string_view text, std::string_view field,
                              std::initializer_list<Dimension> accepted);

// Typed shortcuts for the common single-dimension fields.
Temperature parse_temperature(std::string_view text, std::string_view field);
Pressure parse_pressure(std::string_view text, std::string_view field);
double parse_fraction(std::string_view text, std::string_view field);  // "3 %" -> 0.03
Time parse_time(std::string_view text, std::string_view field);
Power parse_power(std::string_view text, std::string_view field);

// The value of an SI number in the named unit (which must have the given dimension), e.g.
// convert_from_si(1.0, Dimension::mass_flow, "t/h") == 3.6. Throws InputError for an unknown unit
// or a unit of another dimension.
double convert_from_si(double value_si, Dimension dimension, std::string_view unit_symbol);

// "12.3 t/h": the value in the unit, with `significant` significant digits.
std::string format_quantity(double value_si, Dimension dimension, std::string_view unit_symbol,
                            int significant = 6);

}  // namespace stackbound::units
