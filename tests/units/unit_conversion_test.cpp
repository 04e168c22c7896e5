// Unit conversions against the defining values of the units, round trips through the parser and
// the printer, and the normal-volume and heat-input units engineers use on permits.

#include <array>
#include <charconv>
#include <set>
#include <string>

#include <gtest/gtest.h>

#include "tests/support/tolerance.hpp"
#include "stackbound/units/input_error.hpp"
#include "stackbound/units/quantity_parser.hpp"

namespace stackbound::units {
namespace {

using D = Dimension;
using stackbound::testing::is_close;
using stackbound::testing::kExact;
using stackbound::testing::kRoundTrip;

// Defining values written out here, independently of units/constants.hpp, so that a wrong
// constant there cannot also make the expectation wrong.
// Source: CODATA 2018 (exact in the 2019 SI), molar gas constant.
constexpr double kR = 8.314462618;
// Source: International Yard and Pound Agreement (1959): 1 ft = 0.3048 m, 1 lb = 0.45359237 kg.
constexpr double kCubicFoot_m3 = 0.3048 * 0.3048 * 0.3048;
// Source: NIST SP 811 (2008), Appendix B: lbf = lb x 9.80665 m/s2, in = 0.0254 m.
constexpr double kPsi_Pa = 0.45359237 * 9.80665 / (0.0254 * 0.0254);

double si(std::string_view text, Dimension dimension) { return parse_quantity(text, "test", {dimension}).value_si; }

// --- Defining values ----------------------------------------------------------------------------

// Wrong if the standard atmosphere were off (every normal volume and 1 atm feed would shift).
TEST(UnitConversion, StandardAtmosphereIsItsDefiningValue) {
  // Source: 10th CGPM (1954), Resolution 4: 1 atm = 101 325 Pa.
  EXPECT_TRUE(is_close(si("1 atm", D::pressure), 101325.0, kExact));
}

// Wrong if the pound, the pound-mole or the ton were off (every lb/h and t/yr figure would shift).
TEST(UnitConversion, MassUnitsAreTheirDefiningValues) {
  // Source: International Yard and Pound Agreement (1959): 1 lb = 0.453 592 37 kg.
  EXPECT_TRUE(is_close(si("1 lb", D::mass), 0.45359237, kExact));
  EXPECT_TRUE(is_close(si("1 lbmol", D::amount), 453.59237, kExact));
  // Source: SI Brochure, 9th ed., Table 8: 1 t = 1000 kg.
  EXPECT_TRUE(is_close(si("1 t", D::mass), 1000.0, kExact));
}

// Wrong if the Btu were another Btu (thermochemical, 59 degF ...): MMBtu-based rates would shift.
TEST(UnitConversion, BritishThermalUnitIsTheInternationalTableBtu) {
  // Source: 5th International Conference on the Properties of Steam (London, 1956): 1 Btu(IT) = 1055.055 852 62 J.
  EXPECT_TRUE(is_close(si("1 Btu", D::energy), 1055.05585262, kExact));
  EXPECT_TRUE(is_close(si("1 MMBtu", D::energy), 1055.05585262e6, kExact));
}

// Wrong if the normal cubic metre did not use the ideal-gas molar volume at 0 degC, 101.325 kPa.
TEST(UnitConversion, NormalCubicMetreIsTheIdealGasMolarVolumeAtZeroCelsius) {
  // Source: CODATA 2018, molar volume of ideal gas at 273.15 K, 101.325 kPa: 22.413 969 54 L/mol.
  const double molar_volume_L_per_mol = 1000.0 / si("1 Nm3", D::amount);
  EXPECT_TRUE(is_close(molar_volume_L_per_mol, 22.41396954, 1e-9));
  // 1000 L / 22.413 97 L/mol = 44.6150 mol (derived from the value above).
  EXPECT_TRUE(is_close(si("1 Nm3", D::amount), 44.6150, 1e-5));
}

// --- Round trips --------------------------------------------------------------------------------

// Wrong if any unit's printing factor or offset were not the inverse of its parsing one.
TEST(UnitConversion, ParseThenConvertBackIsTheIdentityForEveryUnit) {
  for (const UnitDefinition& unit : unit_table()) {
    for (const double value : {0.5, 1.2345, 987.654, 3.25e6}) {
      std::array<char, 64> buffer{};
      const auto end = std::to_chars(buffer.data(), buffer.data() + buffer.size(), value).ptr;
      const std::string text = std::string(buffer.data(), end) + " " + std::string(unit.symbol);
      const ParsedQuantity parsed = parse_quantity(text, "round trip", {unit.dimension});
      EXPECT_EQ(parsed.unit, &unit) << text;
      EXPECT_TRUE(is_close(convert_from_si(parsed.value_si, unit.dimension, unit.symbol), value, kRoundTrip)) << text;
    }
  }
}

// Wrong if two table entries shared a symbol: the second would never be reachable.
TEST(UnitConversion, EveryUnitSymbolIsUnique) {
  std::set<std::string_view> seen;
  for (const UnitDefinition& unit : unit_table()) EXPECT_TRUE(seen.insert(unit.symbol).second) << unit.symbol;
  EXPECT_GT(seen.size(), 90u);  // the table as documented in quantity_parser.hpp
}

// Wrong if a normal-volume unit forgot which reference conditions it stands for.
TEST(UnitConversion, EveryNormalVolumeUnitNamesItsConditions) {
  for (const UnitDefinition& unit : unit_table()) {
    const std::string_view s = unit.symbol;
    const bool normal_volume =
        s.find("Nm3") != s.npos || s.find("Sm3") != s.npos || s.find("scf") != s.npos || s.find("dscm") != s.npos;
    EXPECT_EQ(unit.normal != nullptr, normal_volume) << s;
  }
}

// --- Printing -----------------------------------------------------------------------------------

// Wrong if format_quantity printed in SI, dropped the unit, or ignored the digit count.
TEST(UnitConversion, FormatQuantityPrintsInTheNamedUnit) {
  // 1 kg/s x 3600 s/h / 1000 kg/t = 3.6 t/h (definitions).
  EXPECT_TRUE(is_close(convert_from_si(1.0, D::mass_flow, "t/h"), 3.6, kExact));
  EXPECT_EQ(format_quantity(1.0, D::mass_flow, "t/h"), "3.6 t/h");
  EXPECT_EQ(format_quantity(101325.0, D::pressure, "kPa"), "101.325 kPa");
  EXPECT_EQ(format_quantity(273.15, D::temperature, "degC"), "0 degC");
  EXPECT_EQ(format_quantity(1.0 / 3.0, D::fraction, "%", 3), "33.3 %");
  EXPECT_EQ(format_quantity(288.7055555555555, D::temperature, "degF"), "60 degF");
}

// Wrong if printing in an unknown unit, or one of another dimension, produced a number.
TEST(UnitConversion, ConvertingToAnUnknownOrWrongUnitIsRefused) {
  EXPECT_THROW_WITH((void)convert_from_si(1.0, D::mass_flow, "t/hr"), InputError,
                    "unit \"t/hr\": not a mass flow unit; accepted units: kg/s, kg/h");
  EXPECT_THROW_WITH((void)format_quantity(1.0, D::mass_flow, "kg"), InputError, "unit \"kg\": not a mass flow unit");
}

// --- Temperature scales -------------------------------------------------------------------------

// Wrong if an offset scale were treated as a factor only, or the Fahrenheit offset were off.
TEST(UnitConversion, TemperatureOffsetsMatchTheirDefinitions) {
  // Source: SI Brochure, 9th ed.: t/degC = T/K - 273.15. Fahrenheit: t/degF = 1.8 t/degC + 32 (definition).
  EXPECT_TRUE(is_close(si("0 degC", D::temperature), 273.15, kExact));
  EXPECT_TRUE(is_close(si("60 degF", D::temperature), 288.705556, 0.0, 5e-7));
  EXPECT_TRUE(is_close(si("68 degF", D::temperature), 293.15, kExact));
  EXPECT_TRUE(is_close(si("32 degF", D::temperature), 273.15, kExact));
  EXPECT_TRUE(is_close(si("-40 degF", D::temperature), si("-40 degC", D::temperature), kExact));
  // Rankine: absolute, 1 degR = 5/9 K; 491.67 degR = 273.15 K.
  EXPECT_TRUE(is_close(si("491.67 degR", D::temperature), 273.15, kExact));
  EXPECT_TRUE(is_close(convert_from_si(1800.0, D::temperature, "degC"), 1526.85, kExact));
}

// --- Pressure units -----------------------------------------------------------------------------

// Wrong if psi or inHg had the wrong factor: US standard conditions would not match 1 atm.
TEST(UnitConversion, PsiaAndInchesOfMercuryMatchTheStandardAtmosphere) {
  // 14.696 psia is the US rounding of 1 atm; 101 325.35 Pa, 3.5e-6 above it (derived from NIST SP 811).
  EXPECT_TRUE(is_close(si("14.696 psia", D::pressure), 101325.0, 1e-5));
  EXPECT_TRUE(is_close(si("14.696 psia", D::pressure), 14.696 * kPsi_Pa, kExact));
  // Source: NIST SP 811 (2008), Appendix B: conventional inHg = 3386.389 Pa; 29.92 inHg = 101.32 kPa
  // (the "29.92 inHg" of US EPA standard conditions, 40 CFR 60.2).
  EXPECT_TRUE(is_close(si("29.92 inHg", D::pressure), 101320.0, 1e-5));
  // Source: NIST SP 811 (2008), Appendix B: conventional mmHg = 133.322 387 415 Pa; 760 mmHg = 1 atm.
  EXPECT_TRUE(is_close(si("760 mmHg", D::pressure), 101325.0, 1e-6));
}

// --- Normal volumes -----------------------------------------------------------------------------

// Wrong if scf did not refer to 60 degF and 14.696 psia (US gas industry).
TEST(UnitConversion, StandardCubicFootIsAtSixtyFahrenheitAndOneAtmosphere) {
  // Ideal gas n = p V / (R T) at 60 degF = 288.705 556 K, 14.696 psia (derived from the defining values above).
  const double temperature_K = (60.0 - 32.0) / 1.8 + 273.15;
  const double mol_per_scf = 14.696 * kPsi_Pa * kCubicFoot_m3 / (kR * temperature_K);
  EXPECT_TRUE(is_close(si("1 scf", D::amount), mol_per_scf, 1e-12));
  EXPECT_TRUE(is_close(si("1 scf", D::amount), 1.195291, 1e-6));
  EXPECT_TRUE(is_close(si("1 MMscf", D::amount), 1e6 * mol_per_scf, 1e-12));
  // 1 MMscfd = 1e6 scf per 86 400 s.
  EXPECT_TRUE(is_close(parse_quantity("1 MMscfd", "q", {D::molar_flow}).value_si, 1e6 * mol_per_scf / 86400.0, 1e-12));
  EXPECT_TRUE(is_close(parse_quantity("60 scfh", "q", {D::molar_flow}).value_si,
                       parse_quantity("1 scfm", "q", {D::molar_flow}).value_si, 1e-12));
}

// Wrong if dscf (US EPA) were taken at 60 degF instead of 68 degF.
TEST(UnitConversion, DryStandardCubicFootIsAtSixtyEightFahrenheit) {
  // 68 degF = 293.15 K, 101.325 kPa (40 CFR 60.2 standard conditions); n = p V / (R T), derived.
  const double mol_per_dscf = 101325.0 * kCubicFoot_m3 / (kR * 293.15);
  EXPECT_TRUE(is_close(si("1 dscf", D::amount), mol_per_dscf, 1e-12));
  EXPECT_TRUE(si("1 dscf", D::amount) < si("1 scf", D::amount));  // warmer reference: fewer moles per cubic foot
  // Source: 40 CFR Part 75 Appendix F, section 3.3.1 (conversion constant K for NOx as NO2 at 68 degF,
  // 29.92 inHg): 1 ppm = 1.194e-7 lb/scf. Ours: 1e-6 x mol per dscf x 46.005 g/mol (IUPAC atomic
  // weights), in lb. Tolerance: half a unit in the last printed digit, 0.0005/1.194 = 4.2e-4.
  const double kg_per_dscf_per_ppm = 1e-6 * si("1 dscf", D::amount) * 46.005e-3;
  EXPECT_TRUE(is_close(convert_from_si(kg_per_dscf_per_ppm, D::mass, "lb"), 1.194e-7, 4.2e-4));
}

// Wrong if mg/Nm3 were not a mass per normal cubic metre at 0 degC, 101.325 kPa.
TEST(UnitConversion, MilligramsPerNormalCubicMetreFollowFromTheMolarVolume) {
  // 1 ppm NO2 is 1e-6 mol per mol of gas, i.e. 46.005e-9 kg per mol; in mg/Nm3 that is
  // M / V_m = 46.005 / 22.413 97 = 2.0525 (derived; M from IUPAC atomic weights).
  EXPECT_TRUE(is_close(convert_from_si(46.005e-9, D::mass_per_amount, "mg/Nm3"), 2.0525, 1e-4));
  EXPECT_TRUE(is_close(si("1000 ug/Nm3", D::mass_per_amount), si("1 mg/Nm3", D::mass_per_amount), 1e-12));
  // 1 gr = 1/7000 lb (International Yard and Pound Agreement, 1959).
  EXPECT_TRUE(is_close(si("7000 gr/dscf", D::mass_per_amount), si("1 lb/dscf", D::mass_per_amount), 1e-12));
}

// Wrong if Sm3 (15 degC) and Nm3 (0 degC) were the same amount of gas.
TEST(UnitConversion, StandardAndNormalCubicMetresDifferByTheirTemperatures) {
  // Equal pressure: n(Sm3)/n(Nm3) = 273.15/288.15 (ideal gas, definitions).
  EXPECT_TRUE(is_close(si("1 Sm3", D::amount) / si("1 Nm3", D::amount), 273.15 / 288.15, 1e-12));
  EXPECT_TRUE(is_close(si("1 dscm", D::amount) / si("1 Nm3", D::amount), 273.15 / 293.15, 1e-12));
}

// --- Heat input, energy per amount, time --------------------------------------------------------

// Wrong if MMBtu/h were not 1e6 Btu(IT) per hour.
TEST(UnitConversion, HeatInputUnits) {
  // 1.055 055 852 62e9 J / 3600 s = 293.071 kW (derived from the Btu(IT) definition).
  EXPECT_TRUE(is_close(si("1 MMBtu/h", D::power), 293071.07, 1e-8));
  EXPECT_TRUE(is_close(convert_from_si(293071.0701722222, D::power, "kW"), 293.071, 1e-6));
  EXPECT_TRUE(is_close(si("1 MMBtu/hr", D::power), si("1 MMBtu/h", D::power), kExact));
  EXPECT_TRUE(is_close(si("3.412141633 Btu/h", D::power), 1.0, 1e-9));
}

// Wrong if a heating value per normal volume were not per amount of gas at the named conditions.
TEST(UnitConversion, HeatingValuePerNormalVolumeIsPerMole) {
  // 1 MJ/Nm3 = 1e6 J per 44.615 mol (derived from the molar volume above).
  EXPECT_TRUE(is_close(si("1 MJ/Nm3", D::molar_energy), 1e6 / si("1 Nm3", D::amount), 1e-12));
  EXPECT_TRUE(is_close(si("1 Btu/scf", D::molar_energy), 1055.05585262 / si("1 scf", D::amount), 1e-12));
}

// Wrong if t/yr did not use 8760 h a year (the permit convention stated in quantity_parser.cpp).
TEST(UnitConversion, TonnesPerYearUseEightThousandSevenHundredSixtyHours) {
  // 8760 h/yr: common practice in annual permit totals, no source.
  EXPECT_TRUE(is_close(si("8760 t/yr", D::mass_flow), si("1 t/h", D::mass_flow), 1e-12));
  EXPECT_TRUE(is_close(si("1 lb/h", D::mass_flow), 0.45359237 / 3600.0, kExact));
}

// Wrong if a millisecond were not 1e-3 s (the SI prefix), the unit of flame residence times.
TEST(UnitConversion, MillisecondIsOneThousandthOfASecond) {
  EXPECT_TRUE(is_close(si("20 ms", D::time), 0.020, kExact));
  EXPECT_TRUE(is_close(si("20ms", D::time), si("0.02 s", D::time), kExact));
}

}  // namespace
}  // namespace stackbound::units
