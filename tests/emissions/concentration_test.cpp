#include "stackbound/emissions/concentration.hpp"

#include <string>
#include <vector>

#include <gtest/gtest.h>

#include "tests/support/tolerance.hpp"
#include "stackbound/units/input_error.hpp"

namespace stackbound::emissions {
namespace {

using stackbound::testing::is_close;
using stackbound::testing::kRoundTrip;

Concentration make(double value, const char* pollutant, const char* basis) {
  return Concentration(value, pollutant_by_name(pollutant, "pollutant"), parse_basis(basis, "basis"));
}

double convert(const Concentration& c, const char* target, const ConcentrationContext& context = {}) {
  return c.to(parse_basis(target, "target"), context).value();
}

ConcentrationContext stack_context() {
  ConcentrationContext context;
  context.moisture_fraction = 0.11;
  context.o2_dry_fraction = 0.072;
  context.co2_dry_fraction = 0.095;
  return context;
}

// Wrong if ppmv -> mg/Nm3 did not use M / V_m at 0 degC (V_m = R T/p, R from CODATA 2018).
TEST(Concentration, PpmToMilligramsPerNormalCubicMetreUsesMolarMassOverMolarVolume) {
  const double molar_volume_L = 8.314462618 * 273.15 / 101325.0 * 1e3;
  EXPECT_TRUE(is_close(convert(make(100.0, "CO", "ppmv, dry"), "mg/Nm3, dry"), 100.0 * 28.010 / molar_volume_L, 1e-12));
}

// Wrong if wet -> dry did not divide by (1 - B_ws).
TEST(Concentration, WetToDryDividesByOneMinusMoisture) {
  ConcentrationContext context;
  context.moisture_fraction = 0.2;
  EXPECT_TRUE(is_close(convert(make(100.0, "CO", "ppmv, wet"), "ppmv, dry", context), 125.0, 1e-14));
  EXPECT_TRUE(is_close(convert(make(125.0, "CO", "ppmv, dry"), "ppmv, wet", context), 100.0, 1e-14));
}

// Wrong if the O2 correction were not (20.9 - ref)/(20.9 - meas) on the default US EPA basis.
TEST(Concentration, O2CorrectionFromStatedLevelNeedsNoMeasuredO2) {
  EXPECT_TRUE(is_close(convert(make(100.0, "NOx", "ppmv, dry, O2=7.2%"), "ppmv, dry, O2=3%"),
                       100.0 * (20.9 - 3.0) / (20.9 - 7.2), 1e-14));
}

// Wrong if "as measured" were corrected without the measured O2 from the context.
TEST(Concentration, AsMeasuredUsesTheContextO2) {
  EXPECT_TRUE(is_close(convert(make(100.0, "NOx", "ppmvd"), "ppmv, dry, O2=3%", stack_context()),
                       100.0 * (20.9 - 3.0) / (20.9 - 7.2), 1e-14));
}

// Wrong if the EU basis (21 %) were ignored when selected.
TEST(Concentration, EuO2BasisUsesTwentyOne) {
  ConcentrationContext context;
  context.o2_basis = O2Basis::eu_21;
  EXPECT_TRUE(is_close(convert(make(100.0, "NOx", "ppmv, dry, O2=7.2%"), "ppmv, dry, O2=3%", context),
                       100.0 * 18.0 / 13.8, 1e-14));
}

// Wrong if a CO2 correction were not CO2_ref / CO2_meas.
TEST(Concentration, Co2CorrectionScalesWithTheCo2Ratio) {
  EXPECT_TRUE(is_close(convert(make(50.0, "SO2", "ppmv, dry, CO2=9%"), "ppmv, dry, CO2=12%"), 50.0 * 12.0 / 9.0, 1e-14));
  EXPECT_TRUE(is_close(convert(make(50.0, "SO2", "ppmvd"), "ppmv, dry, CO2=12%", stack_context()), 50.0 * 12.0 / 9.5, 1e-14));
}

// Wrong if going from an O2 level to a CO2 level did not pass through the measured O2 and CO2.
TEST(Concentration, O2LevelToCo2LevelPassesThroughTheMeasuredGas) {
  const double expected = 40.0 * (20.9 - 7.2) / (20.9 - 3.0) * 12.0 / 9.5;
  EXPECT_TRUE(is_close(convert(make(40.0, "CO", "ppmv, dry, O2=3%"), "ppmv, dry, CO2=12%", stack_context()), expected,
                       1e-14));
}

// Wrong if a change of normal conditions needed the molar mass, or did not scale with T (ideal gas, same p).
TEST(Concentration, NormalConditionsChangeWithoutMolarMass) {
  const Pollutant unknown = resolve_pollutant("PM10", std::nullopt, "pollutant");
  const Concentration dust(10.0, unknown, parse_basis("mg/Nm3, dry", "b"));
  EXPECT_TRUE(is_close(dust.to(parse_basis("mg/m3, dry, normal=20C", "b"), {}).value(), 10.0 * 273.15 / 293.15, 1e-14));
}

// Wrong if NO expressed as NO2 did not scale with M(NO2)/M(NO).
TEST(Concentration, NitricOxideExpressedAsNitrogenDioxide) {
  const double ratio = no2_molar_mass_kg_per_mol() / pollutant_by_name("NO", "p").molar_mass_kg_per_mol;
  EXPECT_TRUE(is_close(convert(make(10.0, "NO", "mg/Nm3, dry"), "mg/Nm3, dry, as NO2"), 10.0 * ratio, 1e-14));
  // A mole fraction is the same whichever mass convention.
  EXPECT_TRUE(is_close(convert(make(10.0, "NO", "ppmv, dry"), "ppmv, dry, as NO2"), 10.0, 1e-15));
}

// Wrong if NOx could be stated by another molar mass than that of NO2.
TEST(Concentration, NoxIsAlwaysExpressedAsNo2) {
  const Concentration nox = make(20.0, "NOx", "ppmv, dry");
  EXPECT_TRUE(nox.basis().as_no2);
  EXPECT_TRUE(nox.to(parse_basis("mg/Nm3, dry", "b"), {}).basis().as_no2);
}

// Wrong if at measured O2 equal to the reference the value changed at all.
TEST(Concentration, MeasuredO2EqualToReferenceLeavesValueUnchanged) {
  ConcentrationContext context;
  context.o2_dry_fraction = 0.03;
  for (const O2Basis basis : {O2Basis::us_epa_20_9, O2Basis::eu_21}) {
    context.o2_basis = basis;
    const Conversion c = make(73.25, "CO", "ppmvd").convert(parse_basis("ppmv, dry, O2=3%", "b"), context);
    EXPECT_TRUE(is_close(c.result.value(), 73.25, stackbound::testing::kExact));
    ASSERT_EQ(c.factors.size(), 1U);
    EXPECT_TRUE(is_close(c.factors[0].value, 1.0, stackbound::testing::kExact));
  }
}

// Wrong if the factors reported did not name what was applied, or their product were not the result.
TEST(Concentration, FactorsAreNamedAndReproduceTheResult) {
  const Conversion c = make(35.0, "CO", "ppmv, wet").convert(parse_basis("mg/Nm3, dry, O2=3%", "b"), stack_context());
  std::vector<std::string> names;
  for (const AppliedFactor& f : c.factors) names.push_back(f.name);
  EXPECT_EQ(names, (std::vector<std::string>{"dry/wet factor", "O2 correction factor", "molar mass", "molar volume"}));
  // ppmv * (g/mol) / (L/mol) = mg/m3
  const double product = 35.0 * c.factors[0].value * c.factors[1].value * c.factors[2].value / c.factors[3].value;
  EXPECT_TRUE(is_close(c.result.value(), product, 1e-14));
  EXPECT_EQ(c.factors[2].unit, "g/mol");
  EXPECT_EQ(c.factors[3].unit, "L/mol");
}

// Wrong if a conversion depended on the path taken (A -> C differs from A -> B -> C).
TEST(Concentration, ConversionIsPathIndependent) {
  const Concentration start = make(42.0, "SO2", "ppmv, wet");
  const ConcentrationContext context = stack_context();
  const double direct = convert(start, "gr/dscf, O2=7%", context);
  const double via = convert(start.to(parse_basis("ug/m3, dry, CO2=12%, normal=60F", "b"), context), "gr/dscf, O2=7%",
                             context);
  EXPECT_TRUE(is_close(via, direct, kRoundTrip));
}

// Wrong if the wet-gas context did not convert O2 and CO2 to the dry basis.
TEST(Concentration, ContextFromWetFlueGas) {
  const ConcentrationContext context = ConcentrationContext::from_wet_flue_gas(0.18, 0.025, 0.085, O2Basis::eu_21);
  EXPECT_TRUE(is_close(*context.o2_dry_fraction, 0.025 / 0.82, 1e-15));
  EXPECT_TRUE(is_close(*context.co2_dry_fraction, 0.085 / 0.82, 1e-15));
  EXPECT_TRUE(is_close(*context.moisture_fraction, 0.18, 1e-15));
  EXPECT_THROW_WITH((void)ConcentrationContext::from_wet_flue_gas(0.7, 0.2, 0.2, O2Basis::eu_21), units::InputError,
                    "sum above 1");
  EXPECT_THROW_WITH((void)ConcentrationContext::from_wet_flue_gas(1.0, 0.0, std::nullopt, O2Basis::eu_21),
                    units::InputError, "flue gas H2O (wet) = 1");
}

// Wrong if a missing piece of context were not named, or the wrong piece were blamed.
TEST(Concentration, MissingContextIsNamed) {
  const auto piece_of = [](const Concentration& c, const char* target, const ConcentrationContext& context) {
    try {
      (void)c.to(parse_basis(target, "b"), context);
    } catch (const MissingContextError& error) {
      return error.piece();
    }
    ADD_FAILURE() << "no MissingContextError for " << target;
    return ContextPiece::moisture;
  };
  EXPECT_EQ(piece_of(make(1.0, "CO", "ppmv, wet"), "ppmv, dry", {}), ContextPiece::moisture);
  EXPECT_EQ(piece_of(make(1.0, "CO", "ppmvd"), "ppmv, dry, O2=3%", {}), ContextPiece::measured_o2);
  EXPECT_EQ(piece_of(make(1.0, "CO", "ppmvd"), "ppmv, dry, CO2=12%", {}), ContextPiece::measured_co2);
  const Concentration mercury(1.0, resolve_pollutant("Hg", std::nullopt, "p"), parse_basis("ppbv, dry", "b"));
  EXPECT_EQ(piece_of(mercury, "ug/Nm3, dry", {}), ContextPiece::molar_mass);
  EXPECT_THROW_WITH((void)make(1.0, "CO", "ppmv, wet").to(parse_basis("ppmv, dry", "b"), {}), MissingContextError,
                    "the stack-gas moisture (H2O mole fraction of the wet gas) is needed");
  EXPECT_THROW_WITH((void)make(1.0, "CO", "ppmvd").to(parse_basis("ppmv, dry, O2=3%", "b"), {}), MissingContextError,
                    "the measured O2 (dry) is needed to convert from as measured to O2=3%");
  EXPECT_THROW_WITH((void)mercury.to(parse_basis("ug/Nm3, dry", "b"), {}), MissingContextError,
                    "the molar mass of \"Hg\" (not a built-in pollutant) is needed to convert ppbv to ug/Nm3");
}

// Wrong if a pollutant with a user-given molar mass could not be converted to mass.
TEST(Concentration, UserMolarMassEnablesMassConversion) {
  const Concentration mercury(2.0, resolve_pollutant("Hg", 0.20059, "p"), parse_basis("ppbv, dry", "b"));
  const double molar_volume_L = 8.314462618 * 273.15 / 101325.0 * 1e3;
  EXPECT_TRUE(is_close(mercury.to(parse_basis("ug/Nm3, dry", "b"), {}).value(), 2.0 * 200.59 / molar_volume_L, 1e-12));
}

// Impossible combinations and out-of-range context, each with its message.
// Wrong if any passed, which would give a number for a meaningless request.
TEST(Concentration, ImpossibleRequestsAreRefused) {
  EXPECT_THROW_WITH((void)make(1.0, "CO", "mg/Nm3, dry, as NO2"), units::InputError,
                    "\"as NO2\" applies to NO, NO2 and NOx only, not to CO");
  EXPECT_THROW_WITH((void)make(-3.0, "CO", "ppmvd"), units::InputError, "a concentration must be a finite number >= 0");
  EXPECT_THROW_WITH((void)make(2e6, "CO", "ppmvd"), units::InputError, "a mole fraction cannot exceed 100 %");
  ConcentrationContext context;
  context.o2_dry_fraction = 0.209;
  EXPECT_THROW_WITH((void)convert(make(1.0, "CO", "ppmvd"), "ppmv, dry, O2=3%", context), units::InputError,
                    "measured O2 = 20.9 %: at or above the O2 basis 20.9 % (US EPA practice)");
  context.o2_dry_fraction = 0.05;
  context.moisture_fraction = 1.0;
  EXPECT_THROW_WITH((void)convert(make(1.0, "CO", "ppmv, wet"), "ppmvd", context), units::InputError,
                    "moisture = 100 %: the H2O fraction of the wet gas must be >= 0 % and below 100 %");
  EXPECT_THROW_WITH((void)resolve_pollutant("CO", 0.044, "POLLUTANT"), units::InputError,
                    "POLLUTANT = \"CO\": built in with molar mass 28.010 g/mol");
  EXPECT_THROW_WITH((void)resolve_pollutant("C O", std::nullopt, "POLLUTANT"), units::InputError, "not a pollutant name");
}

// Wrong if the text form dropped the unit, the pollutant or the basis.
TEST(Concentration, TextCarriesUnitPollutantAndBasis) {
  EXPECT_EQ(make(35.0, "CO", "ppmv, dry, O2=7.2%").text(), "35 ppmv CO (dry, O2=7.2%)");
  EXPECT_EQ(make(42.5, "NOx", "mg/Nm3, dry, O2=3%").text(), "42.5 mg/Nm3 NOx (dry, O2=3%, as NO2, normal=0C)");
}

}  // namespace
}  // namespace stackbound::emissions
