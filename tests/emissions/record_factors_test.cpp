// record_factors = false (sweeps) must change nothing but the AppliedFactor lists: every value is
// bit-for-bit the one computed with the factors recorded, and the lists are empty instead of filled.
#include <string>
#include <vector>

#include <gtest/gtest.h>

#include "stackbound/emissions/concentration.hpp"
#include "stackbound/emissions/emission_rate.hpp"
#include "stackbound/emissions/limit_screening.hpp"
#include "tests/support/tolerance.hpp"
#include "stackbound/units/input_error.hpp"

namespace stackbound::emissions {
namespace {

using stackbound::testing::is_close;

// Invented natural-gas flue gas (wet mole fractions): NOx 100 ppmv, H2O 17 %, O2 2.5 %, CO2 8.5 %.
StackEmissionInput natural_gas_nox(bool record_factors) {
  StackEmissionInput input;
  input.pollutant = pollutant_by_name("NOx", "test");
  input.pollutant_wet_fraction = 1e-4;
  input.h2o_wet_fraction = 0.17;
  input.o2_wet_fraction = 0.025;
  input.co2_wet_fraction = 0.085;
  input.wet_flue_gas_flow = units::moles_per_second(120.0);
  input.heat_input = units::watts(10.0e6);
  input.fd = FFactor::from_scf_per_MMBtu(FFactorKind::dry, 8710.0);  // invented round Fd
  input.reference_o2_dry_fraction = 0.03;
  input.normal = &units::normal_0C();
  input.o2_basis = O2Basis::us_epa_20_9;
  input.operating_hours_per_year = 8000.0;
  input.record_factors = record_factors;
  return input;
}

ConcentrationContext flue_context(bool record_factors) {
  ConcentrationContext context = ConcentrationContext::from_wet_flue_gas(0.17, 0.025, 0.085, O2Basis::us_epa_20_9);
  context.record_factors = record_factors;
  return context;
}

std::string message_of(void (*statement)()) {
  try {
    statement();
  } catch (const units::InputError& error) {
    return error.what();
  }
  return "(nothing thrown)";
}

// Wrong if skipping the factor lists changed any figure the runner reports, or left a list filled.
TEST(RecordFactors, StackEmissionValuesAreIdenticalAndFactorsAreSkipped) {
  const StackEmission recorded = evaluate_stack_emission(natural_gas_nox(true));
  const StackEmission skipped = evaluate_stack_emission(natural_gas_nox(false));
  EXPECT_TRUE(is_close(skipped.ppmvd.value(), recorded.ppmvd.value(), 0.0));
  EXPECT_TRUE(is_close(skipped.ppmvd_at_reference.value(), recorded.ppmvd_at_reference.value(), 0.0));
  EXPECT_TRUE(
      is_close(skipped.mg_per_Nm3_at_reference.result.value(), recorded.mg_per_Nm3_at_reference.result.value(), 0.0));
  EXPECT_TRUE(is_close(skipped.mass_rate.value(), recorded.mass_rate.value(), 0.0));
  ASSERT_TRUE(skipped.annual.has_value() && recorded.annual.has_value());
  EXPECT_TRUE(is_close(skipped.annual->value(), recorded.annual->value(), 0.0));
  EXPECT_TRUE(is_close(skipped.method19.kg_per_J, recorded.method19.kg_per_J, 0.0));
  EXPECT_TRUE(is_close(skipped.direct.kg_per_J, recorded.direct.kg_per_J, 0.0));
  EXPECT_EQ(skipped.method19.method, recorded.method19.method);
  EXPECT_TRUE(skipped.mg_per_Nm3_at_reference.factors.empty());
  EXPECT_TRUE(skipped.method19.factors.empty());
  EXPECT_FALSE(skipped.context.record_factors);
  // wet -> dry, O2 correction, molar mass, molar volume.
  EXPECT_EQ(recorded.mg_per_Nm3_at_reference.factors.size(), 4U);
  EXPECT_FALSE(recorded.method19.factors.empty());
  EXPECT_EQ(recorded.method19.factors.back().name, "Fd");
  EXPECT_TRUE(recorded.context.record_factors);
}

// Wrong if a conversion's value depended on whether its factors were written down, or if a
// recorded factor lost its detail text.
TEST(RecordFactors, ConversionsGiveIdenticalValues) {
  const Concentration nox = Concentration::from_mole_fraction(1e-4, pollutant_by_name("NOx", "p"), Moisture::wet);
  const Concentration co(35.0, pollutant_by_name("CO", "p"), parse_basis("mg/Nm3, dry, O2=3%", "b"));
  const Concentration no(12.0, pollutant_by_name("NO", "p"), parse_basis("ppmv, dry, CO2=12%", "b"));
  const Concentration no_mass(20.0, pollutant_by_name("NO", "p"), parse_basis("mg/Nm3, dry, O2=6%", "b"));
  struct Case {
    const Concentration* from;
    const char* target;
  };
  const std::vector<Case> cases = {
      {&nox, "mg/Nm3, dry, O2=15%"},           {&nox, "ppmv, dry, CO2=12%"},
      {&co, "ppmv, wet"},                      {&co, "gr/dscf, dry, O2=7%"},
      {&co, "mg/m3, dry, O2=3%, normal=20C"},  {&no, "ug/Nm3, dry, O2=3%"},
      {&no_mass, "mg/Nm3, dry, O2=6%, as NO2"}, {&no_mass, "ppbv, wet"},
  };
  for (const Case& c : cases) {
    SCOPED_TRACE(c.target);
    const Basis target = parse_basis(c.target, "target");
    const Conversion recorded = c.from->convert(target, flue_context(true));
    const Conversion skipped = c.from->convert(target, flue_context(false));
    EXPECT_TRUE(is_close(skipped.result.value(), recorded.result.value(), 0.0));
    EXPECT_TRUE(is_close(c.from->to(target, flue_context(true)).value(), recorded.result.value(), 0.0));
    EXPECT_TRUE(skipped.result.basis().same_as(recorded.result.basis()));
    EXPECT_TRUE(skipped.factors.empty());
    ASSERT_FALSE(recorded.factors.empty());
    for (const AppliedFactor& factor : recorded.factors) EXPECT_FALSE(factor.detail.empty()) << factor.name;
  }
}

// Wrong if the Method 19 forms computed differently, or kept their F-factor entries, without recording.
TEST(RecordFactors, Method19FormsGiveIdenticalValues) {
  const Concentration nox = Concentration::from_mole_fraction(1e-4, pollutant_by_name("NOx", "p"), Moisture::wet);
  const FFactor fd = FFactor::from_scf_per_MMBtu(FFactorKind::dry, 8710.0);
  const FFactor fw = FFactor::from_scf_per_MMBtu(FFactorKind::wet, 10610.0);
  const FFactor fc = FFactor::from_scf_per_MMBtu(FFactorKind::carbon, 1040.0);
  const HeatInputRate dry[2] = {method19_o2_dry(nox, fd, flue_context(true)),
                                method19_o2_dry(nox, fd, flue_context(false))};
  const HeatInputRate wet[2] = {method19_o2_wet(nox, fw, 0.01, flue_context(true)),
                                method19_o2_wet(nox, fw, 0.01, flue_context(false))};
  const HeatInputRate co2[2] = {method19_co2(nox, fc, flue_context(true)), method19_co2(nox, fc, flue_context(false))};
  for (const HeatInputRate* pair : {dry, wet, co2}) {
    SCOPED_TRACE(pair[0].method);
    EXPECT_TRUE(is_close(pair[1].kg_per_J, pair[0].kg_per_J, 0.0));
    EXPECT_EQ(pair[1].method, pair[0].method);
    EXPECT_FALSE(pair[0].factors.empty());
    EXPECT_TRUE(pair[1].factors.empty());
  }
}

// Wrong if a screening's figures or wording changed without recording, or its factor list stayed filled.
TEST(RecordFactors, ScreeningGivesIdenticalResult) {
  const Concentration nox = Concentration::from_mole_fraction(1e-4, pollutant_by_name("NOx", "p"), Moisture::wet);
  const Concentration limit(100.0, pollutant_by_name("NOx", "p"), parse_basis("mg/Nm3, dry, O2=3%", "limit"));
  const ScreeningResult recorded = screen_concentration(nox, limit, flue_context(true));
  const ScreeningResult skipped = screen_concentration(nox, limit, flue_context(false));
  EXPECT_TRUE(is_close(skipped.value, recorded.value, 0.0));
  EXPECT_TRUE(is_close(skipped.margin, recorded.margin, 0.0));
  EXPECT_TRUE(is_close(skipped.fraction_of_limit, recorded.fraction_of_limit, 0.0));
  EXPECT_EQ(skipped.wording, recorded.wording);
  EXPECT_EQ(skipped.basis, recorded.basis);
  EXPECT_TRUE(skipped.factors.empty());
  EXPECT_FALSE(recorded.factors.empty());
}

// Wrong if make_basis, which now writes the basis text only when rejecting, wrote another text.
TEST(RecordFactors, MakeBasisRejectionsKeepTheirFullMessages) {
  EXPECT_EQ(message_of([] { (void)make_basis(mole_unit("ppmv"), Moisture::wet, DiluentReference::o2(0.03)); }),
            "basis = \"ppmv, wet, O2=3%\": O2=3% on the wet basis: a concentration corrected to a reference O2 or CO2 "
            "is defined on the dry basis; write \"dry, O2=3%\"");
  EXPECT_EQ(message_of([] { (void)make_basis(mole_unit("ppmvd"), Moisture::wet, DiluentReference::as_measured()); }),
            "basis = \"ppmv, wet, as measured\": ppmvd is a dry unit; it cannot be wet");
  EXPECT_EQ(message_of([] {
              (void)make_basis(mass_unit("mg/Nm3", units::normal_20C()), Moisture::dry, DiluentReference::co2(1.5),
                               true, "limit basis");
            }),
            "limit basis = \"mg/Nm3, dry, CO2=150%, as NO2, normal=20C\": a CO2 level must be above 0 % and at most "
            "100 %");
}

// Wrong if the molar-mass message, now formed only when needed, lost its "to convert" part without recording.
TEST(RecordFactors, MissingMolarMassMessageIsUnchanged) {
  const Concentration mercury(1.0, resolve_pollutant("Hg", std::nullopt, "p"), parse_basis("ppbv, dry", "b"));
  EXPECT_THROW_WITH((void)mercury.convert(parse_basis("ug/Nm3, dry", "b"), flue_context(false)), MissingContextError,
                    "the molar mass of \"Hg\" (not a built-in pollutant) is needed to convert ppbv to ug/Nm3");
}

}  // namespace
}  // namespace stackbound::emissions
