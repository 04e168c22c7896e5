#include "stackbound/units/quantity_parser.hpp"

#include <cmath>
#include <random>
#include <string>
#include <vector>

#include <gtest/gtest.h>

#include "tests/support/tolerance.hpp"
#include "stackbound/units/input_error.hpp"

namespace stackbound::units {
namespace {

using D = Dimension;
using stackbound::testing::is_close;

constexpr const char* kTemperatureUnits = "accepted units: K, degC, °C, degF, °F, degR";
constexpr const char* kPressureUnits = "accepted units: Pa, hPa, kPa, MPa, bar, mbar, atm, psia, inHg, mmHg";

// --- Well-formed text ---------------------------------------------------------------------------

// Wrong if the number reader lost a sign, an exponent or a leading '+', or if a unit written
// right after the number ("300K") or surrounding blanks and a stray line end were refused.
TEST(QuantityParser, ReadsSignsExponentsGluedUnitsAndSurroundingBlanks) {
  EXPECT_TRUE(is_close(parse_temperature("300K", "t").value(), 300.0, stackbound::testing::kExact));
  EXPECT_TRUE(is_close(parse_temperature("  1.5e3 K \n", "t").value(), 1500.0, stackbound::testing::kExact));
  EXPECT_TRUE(is_close(parse_temperature("+25 degC", "t").value(), 298.15, stackbound::testing::kExact));
  EXPECT_TRUE(is_close(parse_temperature("-40 degC", "t").value(), 233.15, stackbound::testing::kExact));
  EXPECT_TRUE(is_close(parse_fraction("2.5E-1 %", "o2"), 0.0025, stackbound::testing::kExact));
  EXPECT_TRUE(is_close(parse_fraction(".5 %", "o2"), 0.005, stackbound::testing::kExact));
  EXPECT_TRUE(is_close(parse_pressure("1\tatm", "p").value(), 101325.0, stackbound::testing::kExact));
}

// Wrong if the degree sign written as a character were not the same unit as "degC".
TEST(QuantityParser, DegreeSignAndAsciiSpellingAreTheSameScale) {
  EXPECT_TRUE(is_close(parse_temperature("150 °C", "t").value(), parse_temperature("150 degC", "t").value(),
                       stackbound::testing::kExact));
  EXPECT_TRUE(is_close(parse_temperature("150 °F", "t").value(), parse_temperature("150 degF", "t").value(),
                       stackbound::testing::kExact));
}

// Wrong if a field that takes several dimensions did not report which one it found.
TEST(QuantityParser, FieldsWithSeveralDimensionsReportTheOneFound) {
  const std::initializer_list<Dimension> feed = {D::mass_flow, D::molar_flow, D::power};
  const ParsedQuantity mass = parse_quantity("1.2 t/h", "fuel.rate", feed);
  EXPECT_EQ(mass.dimension, D::mass_flow);
  EXPECT_TRUE(is_close(mass.value_si, 1200.0 / 3600.0, 1e-15));
  ASSERT_NE(mass.unit, nullptr);
  EXPECT_EQ(mass.unit->symbol, "t/h");
  EXPECT_EQ(parse_quantity("850 Nm3/h", "fuel.rate", feed).dimension, D::molar_flow);
  EXPECT_EQ(parse_quantity("2.5 MMBtu/h", "fuel.rate", feed).dimension, D::power);
}

// Wrong if a bare number were refused where a plain number is allowed, or given a unit.
TEST(QuantityParser, BareNumberIsAcceptedOnlyWhereAPlainNumberIsAllowed) {
  const ParsedQuantity lambda = parse_quantity("1.15", "firing.lambda", {D::dimensionless});
  EXPECT_EQ(lambda.dimension, D::dimensionless);
  EXPECT_EQ(lambda.unit, nullptr);
  EXPECT_TRUE(is_close(lambda.value_si, 1.15, stackbound::testing::kExact));
  EXPECT_THROW_WITH(parse_fraction("3", "firing.o2"), InputError,
                    "firing.o2 = \"3\": a unit is required; expected a fraction (% or ppm); accepted units: %, ppm");
}

// Wrong if a unit symbol began with a character of a number ("e", "E", a digit, a sign or a point):
// the parser reads the number as the leading run of such characters, so "5eV" would be misread.
TEST(QuantityParser, NoUnitSymbolStartsWithANumberCharacter) {
  for (const UnitDefinition& unit : unit_table()) {
    ASSERT_FALSE(unit.symbol.empty());
    EXPECT_EQ(std::string_view("0123456789.+-eE").find(unit.symbol.front()), std::string_view::npos) << unit.symbol;
  }
}

// --- Malformed and wrong-dimension text: each with its message ----------------------------------

// Wrong if the message lost any of its four parts: field and text, the problem, the expected
// dimension and the accepted units (checked whole, once).
TEST(QuantityParserErrors, MessageNamesFieldTextProblemDimensionAndAcceptedUnits) {
  try {
    (void)parse_temperature("", "firing.temperature");
    FAIL() << "empty text was accepted";
  } catch (const InputError& error) {
    EXPECT_EQ(std::string(error.what()),
              "firing.temperature = \"\": the text is empty; expected a temperature; accepted units: K, degC, °C, "
              "degF, °F, degR");
  }
  try {
    (void)parse_pressure("3 kg", "firing.pressure");
    FAIL() << "a mass was accepted as a pressure";
  } catch (const InputError& error) {
    EXPECT_EQ(std::string(error.what()),
              "firing.pressure = \"3 kg\": \"kg\" is a mass; expected an absolute pressure; accepted units: Pa, hPa, "
              "kPa, MPa, bar, mbar, atm, psia, inHg, mmHg");
  }
}

// Wrong if blank text were read as zero or a default.
TEST(QuantityParserErrors, EmptyAndBlankTextAreRefused) {
  EXPECT_THROW_WITH(parse_temperature("", "t"), InputError, "t = \"\": the text is empty; expected a temperature");
  EXPECT_THROW_WITH(parse_temperature("  ", "t"), InputError, "t = \"  \": the text is empty");
  EXPECT_THROW_WITH(parse_temperature("\t\n", "t"), InputError, "t = \"\\t\\n\": the text is empty");
}

// Wrong if a unit alone, or a sign alone, were read as a number.
TEST(QuantityParserErrors, TextWithoutANumberIsRefused) {
  EXPECT_THROW_WITH(parse_temperature("K", "t"), InputError, "t = \"K\": no number found; expected a temperature");
  EXPECT_THROW_WITH(parse_quantity("kg/h", "fuel.rate", {D::mass_flow}), InputError,
                    "fuel.rate = \"kg/h\": no number found; expected a mass flow");
  EXPECT_THROW_WITH(parse_temperature("- 5 K", "t"), InputError, "t = \"- 5 K\": no number found");
}

// Wrong if NaN or infinity could enter a calculation through text.
TEST(QuantityParserErrors, NotANumberAndInfinityAreRefused) {
  EXPECT_THROW_WITH(parse_temperature("NaN K", "t"), InputError, "t = \"NaN K\": not a finite number");
  EXPECT_THROW_WITH(parse_quantity("nan", "lambda", {D::dimensionless}), InputError,
                    "lambda = \"nan\": not a finite number; expected a plain number; accepted units: a bare number");
  EXPECT_THROW_WITH(parse_pressure("inf Pa", "p"), InputError, "p = \"inf Pa\": not a finite number");
  EXPECT_THROW_WITH(parse_temperature("-Infinity degC", "t"), InputError, "not a finite number");
}

// Wrong if an unknown unit were silently ignored or gave no hint of the likely intended one.
TEST(QuantityParserErrors, UnknownUnitGetsADidYouMean) {
  EXPECT_THROW_WITH(parse_quantity("3 kgg", "m", {D::mass}), InputError,
                    "m = \"3 kgg\": unknown unit \"kgg\" (did you mean \"kg\"?); expected a mass; accepted units: kg, "
                    "g, t, lb");
  EXPECT_THROW_WITH(parse_quantity("350 mg/m3", "limit", {D::mass_per_amount}), InputError,
                    "unknown unit \"mg/m3\" (did you mean \"mg/Nm3\"?)");
  // A gauge pressure is a different quantity: refused, pointing at the absolute unit.
  EXPECT_THROW_WITH(parse_pressure("12 psig", "p"), InputError,
                    std::string("p = \"12 psig\": unknown unit \"psig\" (did you mean \"psia\"?); expected an absolute "
                                "pressure; ") +
                        kPressureUnits);
  EXPECT_THROW_WITH(parse_temperature("300 Kelvin", "t"), InputError,
                    "unknown unit \"Kelvin\"; expected a temperature");
}

// Wrong if "kg / h" were read as a mass followed by junk, without pointing at "kg/h".
TEST(QuantityParserErrors, UnitWrittenWithSpacesIsRefusedWithTheCompactSymbol) {
  EXPECT_THROW_WITH(parse_quantity("5 kg / h", "fuel.rate", {D::mass_flow}), InputError,
                    "fuel.rate = \"5 kg / h\": unknown unit \"kg / h\" (did you mean \"kg/h\"? unit symbols are "
                    "written without spaces); expected a mass flow");
}

// Wrong if a unit of another dimension were accepted (or converted) for a field.
TEST(QuantityParserErrors, WrongDimensionIsRefusedNamingTheDimensionFound) {
  EXPECT_THROW_WITH(
      parse_temperature("5 kPa", "t"), InputError,
      std::string("t = \"5 kPa\": \"kPa\" is an absolute pressure; expected a temperature; ") + kTemperatureUnits);
  EXPECT_THROW_WITH(parse_quantity("5 MJ", "fuel.rate", {D::mass_flow, D::molar_flow, D::power}), InputError,
                    "fuel.rate = \"5 MJ\": \"MJ\" is an energy; expected a mass flow, a molar or normal-volume flow or "
                    "a power (heat input)");
  EXPECT_THROW_WITH(parse_quantity("0.85 %", "lambda", {D::dimensionless}), InputError,
                    "lambda = \"0.85 %\": \"%\" is a fraction (% or ppm); expected a plain number; accepted units: a "
                    "bare number");
}

// Wrong if a number without its unit were taken in some assumed unit.
TEST(QuantityParserErrors, BareNumberWhereAUnitIsRequiredIsRefused) {
  EXPECT_THROW_WITH(parse_pressure("101325", "p"), InputError,
                    "p = \"101325\": a unit is required; expected an absolute pressure");
  EXPECT_THROW_WITH(parse_temperature("1800", "t"), InputError,
                    "t = \"1800\": a unit is required; expected a temperature");
}

// Wrong if a temperature at or below 0 K could reach the thermodynamics.
TEST(QuantityParserErrors, TemperatureAtOrBelowAbsoluteZeroIsRefused) {
  EXPECT_THROW_WITH(
      parse_temperature("-300 degC", "t"), InputError,
      std::string("t = \"-300 degC\": -26.85 K is at or below absolute zero; a temperature must be above 0 "
                  "K; expected a temperature; ") +
          kTemperatureUnits);
  EXPECT_THROW_WITH(parse_temperature("-460 degF", "t"), InputError, "-0.183333 K is at or below absolute zero");
  EXPECT_THROW_WITH(parse_temperature("0 K", "t"), InputError, "t = \"0 K\": 0 K is at or below absolute zero");
  EXPECT_THROW_WITH(parse_temperature("-273.15 degC", "t"), InputError, "is at or below absolute zero");
}

// Wrong if a gauge reading or a sign slip gave a zero or negative absolute pressure.
TEST(QuantityParserErrors, NegativeOrZeroAbsolutePressureIsRefused) {
  EXPECT_THROW_WITH(parse_pressure("-5 psia", "stack.pressure"), InputError,
                    "stack.pressure = \"-5 psia\": -34473.8 Pa is not above 0 Pa; an absolute pressure must be "
                    "positive (gauge pressures are not accepted); expected an absolute pressure");
  EXPECT_THROW_WITH(parse_pressure("0 bar", "p"), InputError, "p = \"0 bar\": 0 Pa is not above 0 Pa");
}

// Wrong if text after the unit were dropped silently ("300 K abc" read as 300 K).
TEST(QuantityParserErrors, TrailingTextAfterTheUnitIsRefused) {
  EXPECT_THROW_WITH(parse_temperature("300 K abc", "t"), InputError,
                    "t = \"300 K abc\": unexpected text \"abc\" after the unit \"K\"; expected a temperature");
  EXPECT_THROW_WITH(parse_fraction("3 % %", "o2"), InputError,
                    "o2 = \"3 % %\": unexpected text \"%\" after the unit \"%\"; expected a fraction (% or ppm)");
  EXPECT_THROW_WITH(parse_temperature("300 K\tK", "t"), InputError,
                    "t = \"300 K\\tK\": unexpected text \"K\" after the unit \"K\"");
  EXPECT_THROW_WITH(parse_temperature("300 K)", "t"), InputError, "unknown unit \"K)\" (did you mean \"K\"?)");
}

// Wrong if "1 2 K" were read as 1 K or 12 K.
TEST(QuantityParserErrors, TwoNumbersAreRefused) {
  EXPECT_THROW_WITH(parse_temperature("1 2 K", "t"), InputError,
                    "t = \"1 2 K\": found a second number \"2\" after \"1\"; write one number followed by one unit");
  EXPECT_THROW_WITH(parse_quantity("1.5 -3 kg", "m", {D::mass}), InputError,
                    "found a second number \"-3\" after \"1.5\"");
}

// Wrong if a malformed number were read up to its first oddity ("1.2.3" as 1.2, "--5" as 5,
// "+-5" as -5, "1e" as 1).
TEST(QuantityParserErrors, MalformedNumbersAreRefusedWhole) {
  EXPECT_THROW_WITH(parse_quantity("1.2.3 kg", "m", {D::mass}), InputError,
                    "m = \"1.2.3 kg\": malformed number \"1.2.3\"; expected a mass; accepted units: kg, g, t, lb");
  EXPECT_THROW_WITH(parse_temperature("--5 K", "t"), InputError, "t = \"--5 K\": malformed number \"--5\"");
  EXPECT_THROW_WITH(parse_temperature("+-5 K", "t"), InputError, "t = \"+-5 K\": malformed number \"+-5\"");
  EXPECT_THROW_WITH(parse_temperature("1e K", "t"), InputError, "t = \"1e K\": malformed number \"1e\"");
  EXPECT_THROW_WITH(parse_temperature("1.5e3.2 K", "t"), InputError, "malformed number \"1.5e3.2\"");
  EXPECT_THROW_WITH(parse_temperature("5-3 K", "t"), InputError, "malformed number \"5-3\"");
}

// Wrong if a decimal comma were read as the end of the number ("1,5" as 1).
TEST(QuantityParserErrors, DecimalCommaAndThousandsSeparatorsAreRefused) {
  EXPECT_THROW_WITH(parse_quantity("1,5 t/h", "fuel.rate", {D::mass_flow}), InputError,
                    "fuel.rate = \"1,5 t/h\": malformed number \"1,5\": write the decimal point as \".\" and no "
                    "thousands separators; expected a mass flow");
  EXPECT_THROW_WITH(parse_quantity("1,000.5 kg/h", "fuel.rate", {D::mass_flow}), InputError,
                    "malformed number \"1,000.5\"");
}

// Wrong if a number beyond the range of a double became infinity or zero without a word.
TEST(QuantityParserErrors, NumbersOutOfRangeAreRefused) {
  EXPECT_THROW_WITH(parse_pressure("1e999 Pa", "p"), InputError,
                    "p = \"1e999 Pa\": the number \"1e999\" is out of range (a magnitude between about 1e-308 and "
                    "1e308, or 0, is needed); expected an absolute pressure");
  EXPECT_THROW_WITH(parse_quantity("-1e999 kg", "m", {D::mass}), InputError, "the number \"-1e999\" is out of range");
  EXPECT_THROW_WITH(parse_quantity("1e-999 kg", "m", {D::mass}), InputError, "the number \"1e-999\" is out of range");
  // Finite as written, but infinite in SI units: 1e308 MMBtu is about 1e317 J.
  EXPECT_THROW_WITH(parse_quantity("1e308 MMBtu", "e", {D::energy}), InputError,
                    "e = \"1e308 MMBtu\": the value is out of range once converted to SI units; expected an energy");
}

// Wrong if a control character in the text (from a file) broke the one-line message.
TEST(QuantityParserErrors, ControlCharactersAreShownEscaped) {
  EXPECT_THROW_WITH(parse_temperature(std::string("3\x01 K"), "t"), InputError, "t = \"3\\x01 K\": unknown unit");
}

// Wrong if any text could crash the parser or let a non-finite value through: a fixed-seed
// sample of strings built from number characters, unit fragments, signs and blanks.
TEST(QuantityParserErrors, ArbitraryTextEitherParsesToAFiniteValueOrThrowsInputError) {
  const std::vector<std::string> pieces = {"0",   "1",   "9", ".", "e",     "E",      "+",  "-",   " ",
                                           "\t",  ",",   "%", "K", "degC",  "kg",     "/h", "Nm3", "psia",
                                           "nan", "inf", "x", "°", "1e308", "1e-320", "t/h"};
  std::mt19937 generator(20240601u);
  std::uniform_int_distribution<std::size_t> pick(0, pieces.size() - 1);
  std::uniform_int_distribution<int> length(0, 6);
  const std::initializer_list<Dimension> all = {D::dimensionless, D::fraction,  D::temperature, D::pressure,
                                                D::mass,          D::mass_flow, D::amount};
  int parsed = 0;
  for (int i = 0; i < 20000; ++i) {
    std::string text;
    for (int n = length(generator); n > 0; --n) text += pieces[pick(generator)];
    try {
      const ParsedQuantity quantity = parse_quantity(text, "fuzz", all);
      ASSERT_TRUE(std::isfinite(quantity.value_si)) << "text \"" << text << "\"";
      ++parsed;
    } catch (const InputError& error) {
      ASSERT_EQ(std::string(error.what()).rfind("fuzz = \"", 0), 0u) << error.what();
    }
  }
  EXPECT_GT(parsed, 0);  // the sample does contain valid text, so the loop tested both branches
}

// Wrong if a suggestion changed the meaning: "1477 C" is degC (not K), "m3/h" an actual volume flow
// that is never offered as Nm3/h, and a decimal comma is answered with the decimal point to write.
TEST(QuantityParser, SuggestionsKeepTheMeaning) {
  EXPECT_THROW_WITH(parse_temperature("1477 C", "firing.temperature"), InputError,
                    "firing.temperature = \"1477 C\": unknown unit \"C\" (did you mean \"degC\"? write \"1477 degC\")");
  EXPECT_THROW_WITH(parse_temperature("300 F", "t"), InputError, "(did you mean \"degF\"? write \"300 degF\")");
  EXPECT_THROW_WITH(parse_quantity("1150 m3/h", "fuel.feed_rate", {D::mass_flow, D::molar_flow, D::power}), InputError,
                    "fuel.feed_rate = \"1150 m3/h\": \"m3/h\" is an actual volume flow: it is an amount of gas only at "
                    "the temperature and pressure of the meter; convert the reading with them to a normal-volume flow "
                    "(e.g. Nm3/h at 0 degC, 101.325 kPa) or give a mass flow; m3/h is not Nm3/h");
  try {
    (void)parse_quantity("1150 m3/h", "fuel.feed_rate", {D::molar_flow});
    ADD_FAILURE() << "m3/h accepted";
  } catch (const InputError& error) {
    EXPECT_EQ(std::string(error.what()).find("did you mean"), std::string::npos) << error.what();
  }
  EXPECT_THROW_WITH(parse_quantity("12,5 %", "operating_point.flue_o2", {D::fraction}), InputError,
                    "operating_point.flue_o2 = \"12,5 %\": malformed number \"12,5\": write the decimal point as "
                    "\".\" and no thousands separators");
}

}  // namespace
}  // namespace stackbound::units
