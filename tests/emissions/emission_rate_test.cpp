#include "stackbound/emissions/emission_rate.hpp"

#include <gtest/gtest.h>

#include "tests/support/tolerance.hpp"
#include "stackbound/units/constants.hpp"
#include "stackbound/units/input_error.hpp"
#include "stackbound/units/quantity_parser.hpp"

namespace stackbound::emissions {
namespace {

using stackbound::testing::is_close;

// An invented flue gas: 1 mol/s of CH4 burnt completely with dry air of 20.9 % O2 and 79.1 % N2 at
// 15 % excess air, with an invented heating value. The trace pollutant is kept out of the balance.
// Method 19's O2 form is exact for this gas, so it must equal the direct mass rate / heat input.
struct InventedMethaneFlue {
  double heating_value_J_per_mol = 890.0e3;  // invented round number
  double excess = 0.15;
  double o2_supplied = 2.0 * (1.0 + excess);
  double n2 = o2_supplied * 79.1 / 20.9;
  double co2 = 1.0;
  double h2o = 2.0;
  double o2 = o2_supplied - 2.0;
  double dry = co2 + o2 + n2;
  double wet = dry + h2o;
  double no_mol_per_s = 2.5e-4;  // invented trace of NO
  double fd_mol_per_J = (co2 + 2.0 * 79.1 / 20.9) / heating_value_J_per_mol;  // dry products at 0 % excess air
  double fc_mol_per_J = co2 / heating_value_J_per_mol;
  double fw_mol_per_J = (co2 + h2o + 2.0 * 79.1 / 20.9) / heating_value_J_per_mol;

  [[nodiscard]] ConcentrationContext context() const {
    return ConcentrationContext::from_wet_flue_gas(h2o / wet, o2 / wet, co2 / wet, O2Basis::us_epa_20_9);
  }
  [[nodiscard]] Concentration nox_wet() const {
    return Concentration::from_mole_fraction(no_mol_per_s / wet, pollutant_by_name("NOx", "p"), Moisture::wet);
  }
  [[nodiscard]] double direct_kg_per_J() const { return no_mol_per_s * no2_molar_mass_kg_per_mol() / heating_value_J_per_mol; }
};

// Wrong if the mass rate were not concentration times flow on the same basis.
TEST(EmissionRate, MassRateIsConcentrationTimesFlow) {
  const Concentration co = Concentration::from_mole_fraction(100e-6, pollutant_by_name("CO", "p"), Moisture::wet);
  const units::MassFlow rate = mass_rate(co, {units::moles_per_second(1000.0), Moisture::wet}, {});
  EXPECT_TRUE(is_close(rate.value(), 100e-6 * 1000.0 * 0.028010, 1e-12));
}

// Wrong if a normal-volume flow and a mg/Nm3 concentration did not give mg/h = (mg/Nm3)(Nm3/h).
TEST(EmissionRate, NormalVolumeFlowTimesMassConcentration) {
  const units::MolarFlow flow =
      units::moles_per_second(units::parse_quantity("10000 Nm3/h", "flow", {units::Dimension::molar_flow}).value_si);
  const Concentration dust(50.0, resolve_pollutant("dust", std::nullopt, "p"), parse_basis("mg/Nm3, dry", "b"));
  const units::MassFlow rate = mass_rate(dust, {flow, Moisture::dry}, {});
  EXPECT_TRUE(is_close(units::convert_from_si(rate.value(), units::Dimension::mass_flow, "kg/h"), 0.5, 1e-12));
}

// Wrong if a concentration at a reference O2 were multiplied by the actual flow without undoing the correction.
TEST(EmissionRate, MassRateUndoesTheReferenceCorrection) {
  const Concentration co(100.0, pollutant_by_name("CO", "p"), parse_basis("ppmv, dry, O2=3%", "b"));
  ConcentrationContext context;
  context.o2_dry_fraction = 0.08;
  const units::MassFlow rate = mass_rate(co, {units::moles_per_second(100.0), Moisture::dry}, context);
  EXPECT_TRUE(is_close(rate.value(), 100e-6 * (20.9 - 8.0) / (20.9 - 3.0) * 100.0 * 0.028010, 1e-12));
  EXPECT_THROW_WITH((void)mass_rate(co, {units::moles_per_second(100.0), Moisture::dry}, {}), MissingContextError,
                    "measured O2");
}

// Wrong if annual mass ignored the operating hours or accepted more hours than a year has.
TEST(EmissionRate, AnnualMassUsesOperatingHours) {
  const units::MassFlow one_kg_per_h = units::kilograms_per_second(1.0 / 3600.0);
  EXPECT_TRUE(is_close(annual_mass(one_kg_per_h, 8000.0).value(), 8000.0, 1e-12));
  EXPECT_THROW_WITH((void)annual_mass(one_kg_per_h, 9000.0), units::InputError, "at most 8784 h/yr");
  EXPECT_THROW_WITH((void)annual_mass(one_kg_per_h, 0.0), units::InputError, "operating hours = 0 h/yr");
}

// Wrong if Method 19's O2-based form disagreed with mass rate / heat input for a gas where it is exact.
TEST(EmissionRate, Method19OxygenFormEqualsDirectRateForAirAtTwentyPointNine) {
  const InventedMethaneFlue flue;
  const HeatInputRate rate = method19_o2_dry(flue.nox_wet(), FFactor{FFactorKind::dry, flue.fd_mol_per_J}, flue.context());
  EXPECT_TRUE(is_close(rate.kg_per_J, flue.direct_kg_per_J(), 1e-12));
}

// Wrong if the CO2-based form disagreed with the direct rate (the CO2 comes only from the fuel).
TEST(EmissionRate, Method19CarbonDioxideFormEqualsDirectRate) {
  const InventedMethaneFlue flue;
  const HeatInputRate rate = method19_co2(flue.nox_wet(), FFactor{FFactorKind::carbon, flue.fc_mol_per_J}, flue.context());
  EXPECT_TRUE(is_close(rate.kg_per_J, flue.direct_kg_per_J(), 1e-12));
}

// Wrong if the wet Fw form disagreed with the direct rate for dry combustion air (B_wa = 0).
TEST(EmissionRate, Method19WetFormEqualsDirectRateForDryAir) {
  const InventedMethaneFlue flue;
  const HeatInputRate rate =
      method19_o2_wet(flue.nox_wet(), FFactor{FFactorKind::wet, flue.fw_mol_per_J}, 0.0, flue.context());
  EXPECT_TRUE(is_close(rate.kg_per_J, flue.direct_kg_per_J(), 1e-12));
}

// Wrong if a concentration already at a reference O2 needed the measured O2, or got the wrong factor.
TEST(EmissionRate, Method19FromAConcentrationAtReferenceO2) {
  const Concentration nox(30.0, pollutant_by_name("NOx", "p"), parse_basis("ppmv, dry, O2=3%", "b"));
  const FFactor fd = FFactor::from_scf_per_MMBtu(FFactorKind::dry, 8710.0);
  const HeatInputRate rate = method19_o2_dry(nox, fd, {});
  const double c_kg_per_mol = 30e-6 * no2_molar_mass_kg_per_mol();
  EXPECT_TRUE(is_close(rate.kg_per_J, c_kg_per_mol * fd.gas_mol_per_J * 20.9 / (20.9 - 3.0), 1e-12));
}

// Wrong if the per-heat-input units were converted with the wrong Btu or pound.
TEST(EmissionRate, HeatInputRateUnits) {
  const HeatInputRate rate{1e-12, "test", {}};  // 1 g/GJ = 1e-3 kg / 1e9 J
  EXPECT_TRUE(is_close(rate.g_per_GJ(), 1.0, 1e-15));
  EXPECT_TRUE(is_close(rate.ng_per_J(), 1.0, 1e-15));
  EXPECT_TRUE(is_close(rate.lb_per_MMBtu(), 1e-12 / units::kPound_kg * 1e6 * units::kBtuIT_J, 1e-15));
}

// Wrong if the per-output rate did not divide by the efficiency, or mg/kWh were mis-scaled.
TEST(EmissionRate, PerUsefulOutputDividesByEfficiency) {
  const HeatInputRate rate{10e-12, "test", {}};  // 10 g/GJ of heat input
  const OutputRate output = per_useful_output(rate, 0.4);
  // 10 g/GJ / 0.4 = 25 g/GJ of output = 25 mg/MJ = 90 mg/kWh.
  EXPECT_TRUE(is_close(output.mg_per_kWh(), 90.0, 1e-12));
  EXPECT_TRUE(is_close(output.g_per_MWh(), 90.0, 1e-12));
  const OutputRate direct = per_useful_output(units::kilograms_per_second(1e-3), units::watts(1e6));
  EXPECT_TRUE(is_close(direct.mg_per_kWh(), 3600.0, 1e-12));
  EXPECT_THROW_WITH((void)per_useful_output(rate, 1.2), units::InputError, "efficiency = 120 %");
  EXPECT_THROW_WITH((void)per_useful_output(rate, 0.0), units::InputError, "must be above 0 %");
}

// Wrong if F-factor text were misread or a wet volume accepted for Fd.
TEST(EmissionRate, ParsesFFactorText) {
  const FFactor a = parse_f_factor("8710 dscf/MMBtu", FFactorKind::dry, "fd");
  EXPECT_TRUE(is_close(a.scf_per_MMBtu(), 8710.0, 1e-13));
  const FFactor b = parse_f_factor("2.3377e-7 dscm/J", FFactorKind::dry, "fd");
  EXPECT_TRUE(is_close(b.scm_per_J(), 2.3377e-7, 1e-13));
  // 1 scf/MMBtu = 0.028316846592 m3 / 1.05505585262e9 J
  EXPECT_TRUE(is_close(a.scm_per_J(), 8710.0 * 0.028316846592 / 1.05505585262e9, 1e-13));
  EXPECT_THROW_WITH((void)parse_f_factor("8710 wscf/MMBtu", FFactorKind::dry, "fd"), units::InputError,
                    "\"wscf\" is not the volume of Fd (Fd is dry gas: dscf or dscm)");
  EXPECT_THROW_WITH((void)parse_f_factor("-5 dscf/MMBtu", FFactorKind::dry, "fd"), units::InputError,
                    "an F-factor must be above 0");
  EXPECT_THROW_WITH((void)parse_f_factor("8710", FFactorKind::dry, "fd"), units::InputError, "a unit is required");
  EXPECT_THROW_WITH((void)parse_f_factor("8710 dscf/kWh", FFactorKind::dry, "fd"), units::InputError,
                    "unknown energy unit \"kWh\"");
}

// Wrong if the wrong kind of F-factor were accepted by an equation.
TEST(EmissionRate, EquationRefusesTheWrongFFactor) {
  const InventedMethaneFlue flue;
  EXPECT_THROW_WITH((void)method19_o2_dry(flue.nox_wet(), FFactor{FFactorKind::carbon, flue.fc_mol_per_J}, flue.context()),
                    units::InputError, "needs Fd, not Fc");
}

// Wrong if the runner's one-call path disagreed with the individual conversions.
TEST(EmissionRate, EvaluateStackEmissionGivesConsistentFigures) {
  const InventedMethaneFlue flue;
  StackEmissionInput input;
  input.pollutant = pollutant_by_name("NOx", "p");
  input.pollutant_wet_fraction = flue.no_mol_per_s / flue.wet;
  input.h2o_wet_fraction = flue.h2o / flue.wet;
  input.o2_wet_fraction = flue.o2 / flue.wet;
  input.co2_wet_fraction = flue.co2 / flue.wet;
  input.wet_flue_gas_flow = units::moles_per_second(flue.wet);
  input.heat_input = units::watts(flue.heating_value_J_per_mol);
  input.fd = FFactor{FFactorKind::dry, flue.fd_mol_per_J};
  input.reference_o2_dry_fraction = 0.03;
  input.normal = &units::normal_eu_ied();
  input.operating_hours_per_year = 8000.0;
  const StackEmission out = evaluate_stack_emission(input);
  const double x_dry = flue.no_mol_per_s / flue.dry;
  const double o2_dry_percent = 100.0 * flue.o2 / flue.dry;
  EXPECT_TRUE(is_close(out.ppmvd.value(), x_dry * 1e6, 1e-12));
  EXPECT_TRUE(is_close(out.ppmvd_at_reference.value(), x_dry * 1e6 * 17.9 / (20.9 - o2_dry_percent), 1e-12));
  EXPECT_TRUE(is_close(out.mg_per_Nm3_at_reference.result.value(),
                       out.ppmvd_at_reference.value() * 46.005 / (units::normal_eu_ied().molar_volume_m3_per_mol() * 1e3),
                       1e-12));
  EXPECT_TRUE(is_close(out.mass_rate.value(), flue.no_mol_per_s * no2_molar_mass_kg_per_mol(), 1e-12));
  EXPECT_TRUE(is_close(out.method19.kg_per_J, out.direct.kg_per_J, 1e-12));
  ASSERT_TRUE(out.annual.has_value());
  EXPECT_TRUE(is_close(out.annual->value(), out.mass_rate.value() * 8000.0 * 3600.0, 1e-12));
}

}  // namespace
}  // namespace stackbound::emissions
