#include "stackbound/core/fuel.hpp"

#include <gtest/gtest.h>

#include "stackbound/cases/species_file.hpp"
#include "stackbound/core/elements.hpp"
#include "stackbound/core/fuel_presets.hpp"
#include "tests/support/tolerance.hpp"
#include "stackbound/units/constants.hpp"
#include "stackbound/units/input_error.hpp"

namespace stackbound::core {
namespace {

using stackbound::testing::is_close;

const SpeciesDatabase& db() { return cases::builtin_species(); }

double weight_kg(const char* symbol) { return element_by_symbol(symbol).atomic_weight_g_per_mol * 1e-3; }
double h298(const char* formula) {
  return units::kGasConstant_J_per_mol_K * 298.15 * db().at(formula).h_over_RT(units::kelvin(298.15));
}

Fuel gas(std::vector<std::pair<std::string, double>> composition, CompositionBasis basis = CompositionBasis::mole) {
  GasFuelSpec spec;
  spec.composition_percent = std::move(composition);
  spec.basis = basis;
  return Fuel::gas(spec, db());
}

// A coal-like analysis, dry basis, used in several tests (invented figures).
UltimateAnalysis dry_coal() {
  UltimateAnalysis a;
  a.basis = AnalysisBasis::dry;
  a.carbon_percent = 70.0;
  a.hydrogen_percent = 4.8;
  a.oxygen_percent = 9.0;
  a.nitrogen_percent = 1.4;
  a.sulfur_percent = 1.8;
  a.ash_percent = 13.0;
  a.moisture_percent = 10.0;
  return a;
}

CondensedFuelSpec coal_spec(UltimateAnalysis analysis, double hhv_MJ_per_kg, AnalysisBasis hv_basis,
                            HeatingValueKind kind = HeatingValueKind::higher) {
  CondensedFuelSpec spec;
  spec.name = "coal";
  spec.analysis = analysis;
  spec.heating_value = MeasuredHeatingValue{kind, hhv_MJ_per_kg * 1e6, hv_basis};
  spec.field = "fuel";
  return spec;
}

bool has_warning_containing(const std::vector<units::Warning>& warnings, const std::string& fragment) {
  for (const units::Warning& warning : warnings) {
    const std::string w = units::warning_text(warning);
    if (w.find(fragment) != std::string::npos) return true;
  }
  return false;
}

// Wrong if ElementMoles were indexed differently from known_elements() (the equilibrium solver's order).
TEST(Fuel, ElementAmountsFollowTheKnownElementsOrder) {
  const Fuel fuel = gas({{"CH4", 50.0}, {"H2S", 10.0}, {"N2", 20.0}, {"Ar", 10.0}, {"He", 5.0}, {"CO2", 5.0}});
  const double total_mol = 1.0 / *fuel.molar_mass_kg_per_mol();  // mol of gas per kg
  const ElementMoles& e = fuel.element_mol_per_kg();
  EXPECT_TRUE(is_close(e[element_index("C")], total_mol * (0.50 + 0.05), 1e-12));
  EXPECT_TRUE(is_close(e[element_index("H")], total_mol * (0.50 * 4 + 0.10 * 2), 1e-12));
  EXPECT_TRUE(is_close(e[element_index("O")], total_mol * 0.05 * 2, 1e-12));
  EXPECT_TRUE(is_close(e[element_index("N")], total_mol * 0.20 * 2, 1e-12));
  EXPECT_TRUE(is_close(e[element_index("S")], total_mol * 0.10, 1e-12));
  EXPECT_TRUE(is_close(e[element_index("Ar")], total_mol * 0.10, 1e-12));
  EXPECT_TRUE(is_close(e[element_index("He")], total_mol * 0.05, 1e-12));
}

// Wrong if a near-100 % sum were refused, or normalised without telling the user.
TEST(GasFuel, SmallSumDifferenceIsNormalisedWithAWarning) {
  const Fuel off = gas({{"CH4", 94.5}, {"C2H6", 5.0}});  // 99.5 %
  const Fuel exact = gas({{"CH4", 94.5 / 0.995}, {"C2H6", 5.0 / 0.995}});
  EXPECT_TRUE(is_close(off.hhv_J_per_kg(), exact.hhv_J_per_kg(), 1e-12));
  EXPECT_TRUE(has_warning_containing(off.warnings(), "fuel.gas = \"99.5 %\": the mole percentages sum to 99.5 %; normalised to 100 %"));
  EXPECT_TRUE(exact.warnings().empty());
}

// Wrong if a composition far from 100 % (a missing component) were silently normalised.
TEST(GasFuel, LargeSumDifferenceIsAnErrorNamingTheField) {
  EXPECT_THROW_WITH(gas({{"CH4", 93.0}, {"C2H6", 4.0}, {"CO2", 1.0}}), units::InputError,
                    "fuel.gas: the mole percentages sum to 98 %, which is more than 1 percentage point from 100 %");
  EXPECT_THROW_WITH(gas({{"CH4", 0.93}, {"C2H6", 0.07}}), units::InputError, "they look like fractions: give percent");
}

// Wrong if unknown, condensed, repeated or negative components were accepted.
TEST(GasFuel, BadComponentsAreErrorsNamingTheFieldAndValue) {
  EXPECT_THROW_WITH(gas({{"CH5", 100.0}}), units::InputError, "fuel.gas = \"CH5\": unknown species; did you mean \"CH4\"?");
  EXPECT_THROW_WITH(gas({{"C(gr)", 100.0}}), units::InputError, "C(gr) is a condensed species");
  EXPECT_THROW_WITH(gas({{"CH4", 50.0}, {"CH4", 50.0}}), units::InputError, "fuel.gas = \"CH4\": listed twice");
  EXPECT_THROW_WITH(gas({{"CH4", 102.0}, {"N2", -2.0}}), units::InputError, "fuel.gas.CH4 = 102 %: must be <= 100 %");
  EXPECT_THROW_WITH(gas({{"CH4", 98.0}, {"N2", -2.0}}), units::InputError, "fuel.gas.N2 = -2 %: must be >= 0 %");
  EXPECT_THROW_WITH(gas({{"N2", 79.0}, {"O2", 21.0}}), units::InputError, "fuel.gas: this gas does not burn");
  EXPECT_THROW_WITH(gas({}), units::InputError, "fuel.gas: empty composition");
}

// Wrong if mass percentages were treated as mole percentages.
TEST(GasFuel, MassBasisGivesTheSameFuelAsTheEquivalentMoleBasis) {
  const double m_ch4 = db().at("CH4").molar_mass_kg_per_mol();
  const double m_c2h6 = db().at("C2H6").molar_mass_kg_per_mol();
  const double mol_ch4 = 60.0 / m_ch4, mol_c2h6 = 40.0 / m_c2h6;
  const Fuel by_mass = gas({{"CH4", 60.0}, {"C2H6", 40.0}}, CompositionBasis::mass);
  const Fuel by_mole = gas({{"CH4", 100.0 * mol_ch4 / (mol_ch4 + mol_c2h6)}, {"C2H6", 100.0 * mol_c2h6 / (mol_ch4 + mol_c2h6)}});
  EXPECT_TRUE(is_close(by_mass.hhv_J_per_kg(), by_mole.hhv_J_per_kg(), 1e-12));
  EXPECT_TRUE(is_close(*by_mass.molar_mass_kg_per_mol(), *by_mole.molar_mass_kg_per_mol(), 1e-12));
}

// Wrong if a gas's heating values were not those of its own species data: HHV - LHV is the
// vaporisation enthalpy of the water formed, and the HHV closes the 298.15 K energy balance.
TEST(GasFuel, HeatingValuesCloseTheEnergyBalanceOfTheSpeciesData) {
  const Fuel fuel = gas({{"CH4", 80.0}, {"C2H6", 10.0}, {"H2S", 2.0}, {"CO", 3.0}, {"N2", 5.0}});
  const ElementMoles& e = fuel.element_mol_per_kg();
  const double C = e[0], H = e[1], O = e[2], N = e[3], S = e[4];
  const double o2 = C + H / 4 + S - O / 2;
  const double h_liquid_water = h298("H2O") - 44004.0;  // JANAF H-063/H-064 difference, kJ->J
  const double products = C * h298("CO2") + H / 2 * h_liquid_water + S * h298("SO2") + N / 2 * h298("N2");
  const double hhv = fuel.enthalpy(units::kelvin(298.15), db()).value() + o2 * h298("O2") - products;
  EXPECT_TRUE(is_close(fuel.hhv_J_per_kg(), hhv, 1e-10));
  EXPECT_TRUE(is_close(fuel.hhv_J_per_kg() - fuel.lhv_J_per_kg(), H / 2 * 44004.0, 1e-10));
}

// Wrong if a blend of gases by mole were not the same gas as the combined composition.
TEST(FuelBlend, MoleBlendOfGasesIsTheCombinedGas) {
  const Fuel ng = gas({{"CH4", 95.0}, {"N2", 5.0}});
  const Fuel h2 = gas({{"H2", 100.0}});
  const Fuel blend = Fuel::blend("NG + H2", {{ng, 70.0}, {h2, 30.0}}, BlendBasis::mole);
  const Fuel combined = gas({{"CH4", 66.5}, {"N2", 3.5}, {"H2", 30.0}});
  EXPECT_EQ(blend.state(), FuelState::gas);
  EXPECT_TRUE(is_close(blend.hhv_J_per_kg(), combined.hhv_J_per_kg(), 1e-12));
  EXPECT_TRUE(is_close(*blend.molar_mass_kg_per_mol(), *combined.molar_mass_kg_per_mol(), 1e-12));
  EXPECT_TRUE(is_close(blend.enthalpy(units::kelvin(500.0), db()).value(),
                       combined.enthalpy(units::kelvin(500.0), db()).value(), 1e-12));
}

// Wrong if heat-input fractions were taken as mass fractions: the parts must deliver the stated heat shares.
TEST(FuelBlend, HeatInputFractionsAreSharesOfTheHhv) {
  const Fuel ng = preset_fuel("natural_gas", db());
  const Fuel coal = preset_fuel("bituminous_coal", db());
  const Fuel blend = Fuel::blend("cofiring", {{ng, 20.0}, {coal, 80.0}}, BlendBasis::heat_input);
  // mass of each part per kg of blend: w_i = f_i/HHV_i / sum(f_j/HHV_j); heat share = w_i HHV_i / HHV_blend
  const double a = 0.2 / ng.hhv_J_per_kg(), b = 0.8 / coal.hhv_J_per_kg();
  const double w_ng = a / (a + b);
  EXPECT_TRUE(is_close(w_ng * ng.hhv_J_per_kg() / blend.hhv_J_per_kg(), 0.2, 1e-12));
  EXPECT_EQ(blend.state(), FuelState::blend);
  EXPECT_FALSE(blend.molar_mass_kg_per_mol().has_value());
  EXPECT_TRUE(is_close(blend.ash_mass_fraction(), (1.0 - w_ng) * coal.ash_mass_fraction(), 1e-12));
}

// Wrong if a mass blend did not weight every per-kg property by mass.
TEST(FuelBlend, MassBlendWeightsPerKilogramProperties) {
  const Fuel oil = preset_fuel("distillate_oil_no2", db());
  const Fuel wood = preset_fuel("wood_chips", db());
  const Fuel blend = Fuel::blend("oil + wood", {{oil, 25.0}, {wood, 75.0}}, BlendBasis::mass);
  EXPECT_TRUE(is_close(blend.hhv_J_per_kg(), 0.25 * oil.hhv_J_per_kg() + 0.75 * wood.hhv_J_per_kg(), 1e-12));
  EXPECT_TRUE(is_close(blend.lhv_J_per_kg(), 0.25 * oil.lhv_J_per_kg() + 0.75 * wood.lhv_J_per_kg(), 1e-12));
  EXPECT_TRUE(is_close(blend.enthalpy(units::kelvin(330.0), db()).value(),
                       0.25 * oil.enthalpy(units::kelvin(330.0), db()).value() +
                           0.75 * wood.enthalpy(units::kelvin(330.0), db()).value(),
                       1e-12));
  EXPECT_TRUE(is_close(blend.moisture_mass_fraction(), 0.75 * 0.40, 1e-12));
}

// Wrong if mole fractions were accepted for fuels without a molar mass, or bad fractions passed.
TEST(FuelBlend, BadBlendsAreErrorsNamingTheField) {
  const Fuel ng = preset_fuel("natural_gas", db());
  const Fuel coal = preset_fuel("bituminous_coal", db());
  EXPECT_THROW_WITH(Fuel::blend("x", {{ng, 50.0}, {coal, 50.0}}, BlendBasis::mole), units::InputError,
                    "fuel.blend.basis = mole: mole fractions apply to gas fuels only");
  EXPECT_THROW_WITH(Fuel::blend("x", {{ng, 60.0}, {coal, 30.0}}, BlendBasis::mass), units::InputError,
                    "fuel.blend: the mass fractions sum to 90 %");
  EXPECT_THROW_WITH(Fuel::blend("x", {{ng, 110.0}, {coal, -10.0}}, BlendBasis::mass), units::InputError,
                    "fuel.blend[0] (natural gas) fraction = 110 %: must be <= 100 %");
}

// Wrong if the three bases of an ultimate analysis did not describe the same as-received fuel.
TEST(CondensedFuel, AsReceivedDryAndDafBasesDescribeTheSameFuel) {
  const UltimateAnalysis dry = dry_coal();
  const double M = 0.10, A_dry = 0.13;
  UltimateAnalysis ar = dry;
  ar.basis = AnalysisBasis::as_received;
  for (double* x : {&ar.carbon_percent, &ar.hydrogen_percent, &ar.nitrogen_percent, &ar.sulfur_percent, &ar.ash_percent}) {
    *x *= (1.0 - M);
  }
  ar.oxygen_percent = *dry.oxygen_percent * (1.0 - M);
  UltimateAnalysis daf = dry;
  daf.basis = AnalysisBasis::dry_ash_free;
  for (double* x : {&daf.carbon_percent, &daf.hydrogen_percent, &daf.nitrogen_percent, &daf.sulfur_percent}) {
    *x /= (1.0 - A_dry);
  }
  daf.oxygen_percent = *dry.oxygen_percent / (1.0 - A_dry);
  daf.ash_percent = 13.0;  // dry basis, as documented for daf analyses

  const Fuel f_dry = Fuel::condensed(coal_spec(dry, 28.0, AnalysisBasis::dry), db());
  const Fuel f_ar = Fuel::condensed(coal_spec(ar, 28.0 * (1.0 - M), AnalysisBasis::as_received), db());
  const Fuel f_daf = Fuel::condensed(coal_spec(daf, 28.0 / (1.0 - A_dry), AnalysisBasis::dry_ash_free), db());
  for (const Fuel* f : {&f_ar, &f_daf}) {
    EXPECT_TRUE(is_close(f->hhv_J_per_kg(), f_dry.hhv_J_per_kg(), 1e-12));
    EXPECT_TRUE(is_close(f->ash_mass_fraction(), A_dry * (1.0 - M), 1e-12));
    EXPECT_TRUE(is_close(f->moisture_mass_fraction(), M, 1e-12));
    for (std::size_t k = 0; k < 7; ++k) {
      EXPECT_TRUE(is_close(f->element_mol_per_kg()[k], f_dry.element_mol_per_kg()[k], 1e-12, 1e-15)) << k;
    }
  }
  EXPECT_TRUE(is_close(f_dry.hhv_J_per_kg(), 28.0e6 * 0.9, 1e-12));
}

// Wrong if an LHV were converted without the water formed from the fuel's hydrogen and moisture.
TEST(CondensedFuel, LowerHeatingValueConvertsWithTheWaterFormed) {
  const UltimateAnalysis dry = dry_coal();
  const Fuel from_hhv = Fuel::condensed(coal_spec(dry, 28.0, AnalysisBasis::dry), db());
  const double water_per_kg_dry = 0.048 * (2 * weight_kg("H") + weight_kg("O")) / (2 * weight_kg("H"));
  const double latent_J_per_kg = 44004.0 / (2 * weight_kg("H") + weight_kg("O"));
  const double lhv_dry = 28.0e6 - latent_J_per_kg * water_per_kg_dry;
  const Fuel from_lhv = Fuel::condensed(coal_spec(dry, lhv_dry * 1e-6, AnalysisBasis::dry, HeatingValueKind::lower), db());
  EXPECT_TRUE(is_close(from_lhv.hhv_J_per_kg(), from_hhv.hhv_J_per_kg(), 1e-12));
  // As received, the LHV also loses the evaporation of the moisture (10 %).
  EXPECT_TRUE(is_close(from_hhv.lhv_J_per_kg(), lhv_dry * 0.9 - latent_J_per_kg * 0.10, 1e-12));
}

// Wrong if the enthalpy of formation did not reproduce the HHV: burning the as-received fuel at
// 298.15 K to CO2, liquid H2O (including the moisture, which enters as liquid water), SO2 and N2
// must release exactly the HHV.
TEST(CondensedFuel, EnthalpyOfFormationReproducesTheHhv) {
  const Fuel fuel = Fuel::condensed(coal_spec(dry_coal(), 28.0, AnalysisBasis::dry), db());
  const ElementMoles& e = fuel.element_mol_per_kg();
  const double C = e[0], H = e[1], O = e[2], N = e[3], S = e[4];
  const double h_liquid_water = -285.830e3;  // NIST-JANAF 4th ed., H-063, Delta_f H H2O(l) at 298.15 K
  const double products = C * h298("CO2") + H / 2 * h_liquid_water + S * h298("SO2") + N / 2 * h298("N2");
  const double released =
      fuel.enthalpy(units::kelvin(298.15), db()).value() + (C + H / 4 + S - O / 2) * h298("O2") - products;
  // The data's H2O(g) differs from JANAF's by 1.4 J/mol, a relative 2e-6 of the HHV at most.
  EXPECT_TRUE(is_close(released, fuel.hhv_J_per_kg(), 1e-5));
}

// Wrong if the specific heat were ignored, or applied when none was given.
TEST(CondensedFuel, SensibleHeatUsesTheGivenSpecificHeatOnly) {
  CondensedFuelSpec spec = coal_spec(dry_coal(), 28.0, AnalysisBasis::dry);
  const Fuel without = Fuel::condensed(spec, db());
  spec.specific_heat_J_per_kg_K = 1500.0;
  const Fuel with = Fuel::condensed(spec, db());
  EXPECT_TRUE(
      is_close(with.enthalpy(units::kelvin(358.15), db()).value() - with.enthalpy(units::kelvin(298.15), db()).value(),
               1500.0 * 60.0, 1e-9));
  EXPECT_TRUE(is_close(without.enthalpy(units::kelvin(358.15), db()).value(),
                       without.enthalpy(units::kelvin(298.15), db()).value(), 1e-15));
  EXPECT_FALSE(without.sensible_heat_known());
  EXPECT_TRUE(with.sensible_heat_known());
}

// Wrong if oxygen by difference were not 100 minus the rest of the basis sum.
TEST(CondensedFuel, OxygenByDifference) {
  UltimateAnalysis a = dry_coal();
  a.oxygen_percent.reset();
  const Fuel by_difference = Fuel::condensed(coal_spec(a, 28.0, AnalysisBasis::dry), db());
  const Fuel explicit_o = Fuel::condensed(coal_spec(dry_coal(), 28.0, AnalysisBasis::dry), db());
  EXPECT_TRUE(is_close(by_difference.element_mol_per_kg()[2], explicit_o.element_mol_per_kg()[2], 1e-12));
  a.carbon_percent = 80.0;  // the rest now sums to 101 %
  EXPECT_THROW_WITH(Fuel::condensed(coal_spec(a, 28.0, AnalysisBasis::dry), db()), units::InputError,
                    "fuel.ultimate.O: oxygen by difference would be -1 %");
}

// Wrong if a liquid or solid fuel without a heating value were accepted (its energy balance would be void).
TEST(CondensedFuel, MissingHeatingValueIsAnErrorNamingTheField) {
  CondensedFuelSpec spec = coal_spec(dry_coal(), 28.0, AnalysisBasis::dry);
  spec.heating_value.reset();
  EXPECT_THROW_WITH(Fuel::condensed(spec, db()), units::InputError,
                    "fuel.heating_value: missing; a liquid or solid fuel needs a measured heating value");
  spec.heating_value = MeasuredHeatingValue{HeatingValueKind::higher, 28e6, AnalysisBasis::dry};
  spec.estimate = HeatingValueCorrelation::boie;
  EXPECT_THROW_WITH(Fuel::condensed(spec, db()), units::InputError, "not both");
  spec.estimate.reset();
  spec.heating_value->value_J_per_kg = -1.0;
  EXPECT_THROW_WITH(Fuel::condensed(spec, db()), units::InputError, "fuel.heating_value = -1e-06 MJ/kg");
}

// Wrong if bad analyses were accepted: negative or non-finite components, sums off 100 %,
// moisture leaving no fuel, nothing combustible.
TEST(CondensedFuel, BadAnalysesAreErrorsNamingTheField) {
  UltimateAnalysis a = dry_coal();
  a.hydrogen_percent = -4.8;
  EXPECT_THROW_WITH(Fuel::condensed(coal_spec(a, 28.0, AnalysisBasis::dry), db()), units::InputError,
                    "fuel.ultimate.H = -4.8 %: must be >= 0 %");
  a = dry_coal();
  a.carbon_percent = 60.0;
  EXPECT_THROW_WITH(Fuel::condensed(coal_spec(a, 28.0, AnalysisBasis::dry), db()), units::InputError,
                    "fuel.ultimate: the dry ultimate-analysis percentages (C, H, O, N, S, ash) sum to 90 %");
  a = dry_coal();
  a.moisture_percent = 100.0;
  EXPECT_THROW_WITH(Fuel::condensed(coal_spec(a, 28.0, AnalysisBasis::dry), db()), units::InputError,
                    "leave no fuel");
  UltimateAnalysis inert;
  inert.oxygen_percent = 50.0;
  inert.ash_percent = 50.0;
  EXPECT_THROW_WITH(Fuel::condensed(coal_spec(inert, 1.0, AnalysisBasis::as_received), db()), units::InputError,
                    "nothing in this fuel burns");
}

// Wrong if an HHV on the wrong basis (a common slip) passed without a word.
TEST(CondensedFuel, HeatingValueFarFromTheCorrelationRaisesAWarning) {
  const Fuel plausible = Fuel::condensed(coal_spec(dry_coal(), 28.0, AnalysisBasis::dry), db());
  const Fuel implausible = Fuel::condensed(coal_spec(dry_coal(), 18.0, AnalysisBasis::dry), db());
  EXPECT_FALSE(has_warning_containing(plausible.warnings(), "differs by"));
  EXPECT_TRUE(has_warning_containing(implausible.warnings(), "check the heating value's basis and unit"));
}

// Wrong if an estimated heating value were not named as such, with its correlation, or were computed
// on the wrong basis (the correlations give the dry HHV).
TEST(CondensedFuel, EstimatedHeatingValueIsNamedAndOnTheDryBasis) {
  CondensedFuelSpec spec = coal_spec(dry_coal(), 28.0, AnalysisBasis::dry);
  spec.heating_value.reset();
  spec.estimate = HeatingValueCorrelation::channiwala_parikh;
  const Fuel fuel = Fuel::condensed(spec, db());
  // 0.3491 C + 1.1783 H + 0.1005 S - 0.1034 O - 0.0151 N - 0.0211 A, dry mass %, MJ/kg
  const double dry_MJ = 0.3491 * 70.0 + 1.1783 * 4.8 + 0.1005 * 1.8 - 0.1034 * 9.0 - 0.0151 * 1.4 - 0.0211 * 13.0;
  EXPECT_TRUE(is_close(fuel.hhv_J_per_kg(), dry_MJ * 1e6 * 0.9, 1e-12));
  EXPECT_NE(fuel.heating_value_method().find("Channiwala & Parikh (2002)"), std::string::npos);
  EXPECT_TRUE(has_warning_containing(fuel.warnings(), "is an estimate"));
}

// Wrong if a preset lacked its provenance, or a typo in a preset name got no suggestion.
TEST(FuelPresets, EveryPresetBuildsAndNamesItsSource) {
  EXPECT_GE(fuel_presets().size(), 6u);
  for (const FuelPreset& preset : fuel_presets()) {
    const Fuel fuel = preset_fuel(preset.key, db());
    EXPECT_FALSE(fuel.source().empty()) << preset.key;
    EXPECT_NE(fuel.source().find("typical"), std::string::npos) << preset.key;
    EXPECT_GT(fuel.hhv_J_per_kg(), fuel.lhv_J_per_kg()) << preset.key;
    EXPECT_TRUE(fuel.warnings().empty()) << preset.key << ": " << (fuel.warnings().empty() ? "" : units::warning_text(fuel.warnings()[0]));
  }
  EXPECT_THROW_WITH((void)preset_fuel("natural-gas", db(), "fuel.preset"), units::InputError,
                    "fuel.preset = \"natural-gas\": unknown fuel preset; did you mean \"natural_gas\"?");
}

}  // namespace
}  // namespace stackbound::core
