#include "stackbound/core/combustion.hpp"

#include <cmath>

#include <gtest/gtest.h>

#include "stackbound/cases/species_file.hpp"
#include "stackbound/core/fuel_presets.hpp"
#include "stackbound/core/humidity.hpp"
#include "tests/support/tolerance.hpp"
#include "stackbound/units/constants.hpp"
#include "stackbound/units/input_error.hpp"
#include "stackbound/units/normal_conditions.hpp"

namespace stackbound::core {
namespace {

using stackbound::testing::is_close;

const SpeciesDatabase& db() { return cases::builtin_species(); }

Fuel methane() {
  GasFuelSpec spec;
  spec.name = "methane";
  spec.composition_percent = {{"CH4", 100.0}};
  return Fuel::gas(spec, db());
}

double h298(std::string_view formula) {
  return units::kGasConstant_J_per_mol_K * 298.15 * db().at(formula).h_over_RT(units::kelvin(298.15));
}

Oxidant humid_enriched_air() {
  OxidantOptions options;
  options.temperature = units::kelvin(520.0);
  options.humidity = Humidity::relative(0.7, units::kelvin(303.15), units::pascals(101325.0));
  options.enriched_o2_fraction = 0.28;
  return Oxidant(options);
}

// Wrong if atoms were lost or created between the reactants and the flue gas (lean, stoichiometric,
// rich; plain, humid and enriched oxidant; gas, liquid, solid fuels).
TEST(Burn, ConservesEveryElement) {
  const std::vector<Fuel> fuels{methane(), preset_fuel("residual_oil_no6", db()), preset_fuel("wood_chips", db())};
  const std::vector<Oxidant> oxidants{Oxidant{}, humid_enriched_air()};
  for (const Fuel& fuel : fuels) {
    for (const Oxidant& oxidant : oxidants) {
      for (const double lambda : {0.8, 1.0, 1.3, 3.0}) {
        const CombustionResult r = burn(fuel, oxidant, OperatingPoint::with_air_ratio(lambda), db());
        const ElementMoles flue = r.flue.element_mol_per_kg();
        for (std::size_t k = 0; k < flue.size(); ++k) {
          EXPECT_TRUE(is_close(flue[k], r.reactant_element_mol_per_kg[k], 1e-11, 1e-12))
              << fuel.name() << " lambda " << lambda << " element " << k;
          EXPECT_TRUE(is_close(r.reactant_element_mol_per_kg[k],
                               r.fuel_element_mol_per_kg[k] + r.oxidant_element_mol_per_kg[k], 1e-14, 1e-15));
        }
      }
    }
  }
}

// Wrong if mass were lost: 1 kg fuel - ash + oxidant = flue gas.
TEST(Burn, ConservesMass) {
  const Fuel coal = preset_fuel("bituminous_coal", db());
  const CombustionResult r = burn(coal, humid_enriched_air(), OperatingPoint::with_excess_air(0.3), db());
  EXPECT_TRUE(is_close(r.flue.mass_kg_per_kg(GasBasis::wet), 1.0 - r.ash_kg_per_kg + r.oxidant_kg_per_kg, 1e-12));
}

// Wrong if the reactant enthalpy handed to the equilibrium solver were inconsistent with the HHV:
// at 298.15 K the reactants minus the complete-combustion products with liquid water is the HHV
// (lean: the excess O2, N2, Ar pass through at h ~ 0).
TEST(Burn, ReactantEnthalpyMinusProductsAtStandardTemperatureIsTheHhv) {
  for (const char* key : {"natural_gas", "distillate_oil_no2", "bituminous_coal", "wood_chips"}) {
    const Fuel fuel = preset_fuel(key, db());
    OxidantOptions options;
    options.humidity = Humidity::ratio(0.01);
    const CombustionResult r = burn(fuel, Oxidant(options), OperatingPoint::with_excess_air(0.2), db());
    double products = 0.0;
    for (std::size_t i = 0; i < kFlueSpeciesCount; ++i) {
      const auto species = static_cast<FlueSpecies>(i);
      const double h = kFlueSpeciesNames[i] == "H2O" ? h298("H2O") - 44004.0 : h298(kFlueSpeciesNames[i]);
      products += r.flue.amount(species) * h;
    }
    // The humid air's water enters as vapour but the balance condenses it: add back its latent heat.
    const double air_water = r.oxidant_mol_per_kg * Oxidant(options).water_mole_fraction();
    EXPECT_TRUE(is_close(r.reactant_enthalpy_J_per_kg - products - air_water * 44004.0, fuel.hhv_J_per_kg(), 1e-6)) << key;
  }
}

// Wrong if the excess air solved from a flue O2 did not reproduce the excess air that produced that O2
// (dry and wet, plain and humid/enriched oxidant).
TEST(Burn, ExcessAirSolvedFromFlueO2ReproducesTheExcessAir) {
  const Fuel ng = preset_fuel("natural_gas", db());
  const Fuel coal = preset_fuel("bituminous_coal", db());
  for (const Fuel* fuel : {&ng, &coal}) {
    for (const Oxidant& oxidant : {Oxidant{}, humid_enriched_air()}) {
      for (const double excess : {0.0, 0.05, 0.25, 1.5}) {
        const CombustionResult forward = burn(*fuel, oxidant, OperatingPoint::with_excess_air(excess), db());
        const double dry = resolve_air_ratio(*fuel, oxidant, OperatingPoint::with_flue_o2(forward.flue_o2_dry, GasBasis::dry));
        const double wet = resolve_air_ratio(*fuel, oxidant, OperatingPoint::with_flue_o2(forward.flue_o2_wet, GasBasis::wet));
        EXPECT_TRUE(is_close(dry, 1.0 + excess, 1e-12)) << fuel->name() << " " << excess;
        EXPECT_TRUE(is_close(wet, 1.0 + excess, 1e-12)) << fuel->name() << " " << excess;
      }
    }
  }
}

// Wrong if excess air, lambda and phi were not three views of one air ratio.
TEST(Burn, ExcessAirLambdaAndPhiAgree) {
  const Fuel fuel = methane();
  const CombustionResult a = burn(fuel, Oxidant{}, OperatingPoint::with_excess_air(0.25), db());
  const CombustionResult b = burn(fuel, Oxidant{}, OperatingPoint::with_air_ratio(1.25), db());
  const CombustionResult c = burn(fuel, Oxidant{}, OperatingPoint::with_equivalence_ratio(0.8), db());
  EXPECT_TRUE(is_close(a.oxidant_mol_per_kg, b.oxidant_mol_per_kg, 1e-14));
  EXPECT_TRUE(is_close(a.oxidant_mol_per_kg, c.oxidant_mol_per_kg, 1e-14));
  EXPECT_TRUE(is_close(c.excess_air(), 0.25, 1e-12));
  EXPECT_TRUE(is_close(a.oxidant_mol_per_kg, 1.25 * a.stoichiometric_oxidant_mol_per_kg, 1e-14));
}

// Wrong if an impossible flue O2 (at or above the oxidant's, or negative) were accepted.
TEST(Burn, FlueO2AtOrAboveTheOxidantsIsAnErrorNamingTheField) {
  const Fuel fuel = methane();
  const Oxidant air;
  EXPECT_THROW_WITH((void)resolve_air_ratio(fuel, air, OperatingPoint::with_flue_o2(0.21, GasBasis::dry, "--flue-o2")),
                    units::InputError,
                    "--flue-o2 = 21 % (dry): the flue O2 must be at least 0 % and below the oxidant's O2, 20.95 % (dry)");
  EXPECT_THROW_WITH((void)resolve_air_ratio(fuel, air, OperatingPoint::with_flue_o2(air.o2_dry(), GasBasis::dry)),
                    units::InputError, "operating_point.flue_o2");
  const Oxidant humid = humid_enriched_air();
  EXPECT_THROW_WITH((void)resolve_air_ratio(fuel, humid, OperatingPoint::with_flue_o2(humid.o2_wet(), GasBasis::wet)),
                    units::InputError, "(wet)");
  EXPECT_THROW_WITH((void)resolve_air_ratio(fuel, air, OperatingPoint::with_flue_o2(-0.01, GasBasis::dry)),
                    units::InputError, "at least 0 %");
}

// Wrong if nonsensical air ratios were accepted.
TEST(Burn, OutOfRangeAirRatiosAreErrorsNamingTheField) {
  const Fuel fuel = methane();
  EXPECT_THROW_WITH((void)burn(fuel, Oxidant{}, OperatingPoint::with_excess_air(-1.0, "--excess-air"), db()),
                    units::InputError, "--excess-air = -100 %: the air ratio lambda would be 0");
  EXPECT_THROW_WITH((void)burn(fuel, Oxidant{}, OperatingPoint::with_equivalence_ratio(0.0), db()), units::InputError,
                    "operating_point.phi = 0: the equivalence ratio phi must be above 0");
  EXPECT_THROW_WITH((void)burn(fuel, Oxidant{}, OperatingPoint::with_air_ratio(1000.0), db()), units::InputError,
                    "at most 100");
  EXPECT_THROW_WITH((void)burn(fuel, Oxidant{}, OperatingPoint::with_air_ratio(std::nan("")), db()), units::InputError,
                    "not a finite number");
}

// Wrong if sub-stoichiometric flue gas lacked CO and H2, held O2, or broke the stated water-gas-shift split.
TEST(Burn, SubStoichiometricFlueGasHoldsCoAndH2AtShiftEquilibrium) {
  const CombustionResult r = burn(methane(), Oxidant{}, OperatingPoint::with_air_ratio(0.9), db());
  const double co = r.flue.amount(FlueSpecies::CO), h2 = r.flue.amount(FlueSpecies::H2);
  const double co2 = r.flue.amount(FlueSpecies::CO2), h2o = r.flue.amount(FlueSpecies::H2O);
  EXPECT_GT(co, 0.0);
  EXPECT_GT(h2, 0.0);
  EXPECT_TRUE(is_close(r.flue.amount(FlueSpecies::O2), 0.0, 0.0, 1e-15));
  const auto g = [](const char* s) { return db().at(s).g_over_RT(units::kelvin(kDefaultShiftTemperature_K)); };
  const double K = std::exp(-(g("CO2") + g("H2") - g("CO") - g("H2O")));
  EXPECT_TRUE(is_close(co2 * h2 / (co * h2o), K, 1e-9));
  bool warned = false;
  for (const units::Warning& w : r.warnings) warned = warned || w.message.find("water-gas-shift") != std::string::npos;
  EXPECT_TRUE(warned);
}

// Wrong if the complete-combustion model ran where carbon cannot even reach CO (lambda < 1/4 for CH4).
TEST(Burn, TooLittleOxidantForCarbonMonoxideIsAnError) {
  EXPECT_THROW_WITH((void)burn(methane(), Oxidant{}, OperatingPoint::with_air_ratio(0.2, "--lambda"), db()),
                    units::InputError, "--lambda: the air ratio lambda = 0.2 is too low for the complete-combustion estimate");
  EXPECT_NO_THROW((void)burn(methane(), Oxidant{}, OperatingPoint::with_air_ratio(0.26), db()));
}

// Wrong if the air's water vapour did not reach the flue gas, or enrichment did not replace N2.
TEST(Burn, HumidityAddsWaterAndEnrichmentRemovesNitrogen) {
  const Fuel fuel = methane();
  const CombustionResult dry = burn(fuel, Oxidant{}, OperatingPoint::with_excess_air(0.1), db());
  OxidantOptions humid_options;
  humid_options.humidity = Humidity::ratio(0.012);
  const Oxidant humid(humid_options);
  const CombustionResult wet = burn(fuel, humid, OperatingPoint::with_excess_air(0.1), db());
  EXPECT_TRUE(is_close(wet.flue.amount(FlueSpecies::H2O) - dry.flue.amount(FlueSpecies::H2O),
                       wet.oxidant_mol_per_kg * humid.water_mole_fraction(), 1e-12));
  EXPECT_TRUE(is_close(wet.flue_o2_dry, dry.flue_o2_dry, 1e-12));  // water does not change the dry gas

  OxidantOptions oxygen_options;
  oxygen_options.enriched_o2_fraction = 1.0;
  const CombustionResult oxy = burn(fuel, Oxidant(oxygen_options), OperatingPoint::with_excess_air(0.0), db());
  EXPECT_TRUE(is_close(oxy.flue_co2_dry, 1.0, 1e-12));  // pure O2, stoichiometric: the dry flue gas is CO2
  EXPECT_TRUE(is_close(oxy.stoichiometric_oxidant_mol_per_kg, 2.0 / *fuel.molar_mass_kg_per_mol(), 1e-12));
}

// Wrong if F-factors depended on the oxidant or the operating point (Method 19 defines them for the fuel).
TEST(Burn, FFactorsAreFuelPropertiesOnly) {
  const Fuel fuel = preset_fuel("bituminous_coal", db());
  const CombustionResult a = burn(fuel, Oxidant{}, OperatingPoint::with_excess_air(0.0), db());
  const CombustionResult b = burn(fuel, humid_enriched_air(), OperatingPoint::with_excess_air(0.6), db());
  EXPECT_TRUE(is_close(a.f_factors.fd_m3_per_J, b.f_factors.fd_m3_per_J, 1e-15));
  EXPECT_TRUE(is_close(a.f_factors.fw_m3_per_J, b.f_factors.fw_m3_per_J, 1e-15));
  EXPECT_TRUE(is_close(a.f_factors.fc_m3_per_J, b.f_factors.fc_m3_per_J, 1e-15));
  // Fd equals the stoichiometric dry flue volume per HHV with dry air.
  const double vm = units::normal_20C().molar_volume_m3_per_mol();
  EXPECT_TRUE(is_close(a.f_factors.fd_m3_per_J, a.flue.total_mol_per_kg(GasBasis::dry) * vm / fuel.hhv_J_per_kg(), 1e-12));
}

// Wrong if the dew point were not taken from the flue's water partial pressure at the flue pressure.
TEST(Burn, DewPointFollowsTheWaterPartialPressure) {
  OperatingPoint op = OperatingPoint::with_excess_air(0.15);
  op.flue_pressure = units::pascals(2.0 * 101325.0);
  const CombustionResult r = burn(methane(), Oxidant{}, op, db());
  ASSERT_TRUE(r.water_dew_point_K.has_value());
  EXPECT_TRUE(is_close(water_saturation_pressure(units::kelvin(*r.water_dew_point_K)).value(),
                       r.moisture_fraction * 2.0 * 101325.0, 1e-10));
  GasFuelSpec co;
  co.composition_percent = {{"CO", 100.0}};
  EXPECT_FALSE(burn(Fuel::gas(co, db()), Oxidant{}, OperatingPoint{}, db()).water_dew_point_K.has_value());
}

// Wrong if a hot liquid fuel without a specific heat were passed silently.
TEST(Burn, HotFuelWithoutSpecificHeatIsFlagged) {
  CondensedFuelSpec spec;
  spec.state = FuelState::liquid;
  spec.analysis.carbon_percent = 86.0;
  spec.analysis.hydrogen_percent = 14.0;
  spec.heating_value = MeasuredHeatingValue{HeatingValueKind::higher, 45.5e6, AnalysisBasis::as_received};
  OperatingPoint op = OperatingPoint::with_excess_air(0.1);
  op.fuel_temperature = units::kelvin(380.0);
  const CombustionResult r = burn(Fuel::condensed(spec, db()), Oxidant{}, op, db());
  bool warned = false;
  for (const units::Warning& w : r.warnings) {
    warned = warned || units::warning_text(w).find("fuel.temperature = \"380.00 K\"") != std::string::npos;
  }
  EXPECT_TRUE(warned);
}

// Wrong if a feed rate were resolved with the wrong heating value, molar mass or unit.
TEST(FuelFeed, ResolvesMassMolarAndHeatInputRates) {
  const Fuel ng = preset_fuel("natural_gas", db());
  const FuelFeed mass = resolve_feed(ng, "1.2 t/h");
  EXPECT_TRUE(is_close(mass.mass_flow_kg_per_s, 1200.0 / 3600.0, 1e-14));
  EXPECT_TRUE(is_close(mass.heat_input_hhv_W, 1200.0 / 3600.0 * ng.hhv_J_per_kg(), 1e-14));
  const FuelFeed power = resolve_feed(ng, "25 MW");
  EXPECT_TRUE(is_close(power.heat_input_hhv_W, 25e6, 1e-14));
  const FuelFeed net = resolve_feed(ng, "25 MW", HeatInputBasis::lhv);
  EXPECT_TRUE(is_close(net.heat_input_lhv_W, 25e6, 1e-14));
  EXPECT_GT(net.mass_flow_kg_per_s, power.mass_flow_kg_per_s);
  const FuelFeed btu = resolve_feed(ng, "2.5 MMBtu/h");
  EXPECT_TRUE(is_close(btu.heat_input_hhv_W, 2.5e6 * units::kBtuIT_J / 3600.0, 1e-14));
  const FuelFeed normal = resolve_feed(ng, "850 Nm3/h");
  const double mol_per_s = 850.0 / 3600.0 / units::normal_0C().molar_volume_m3_per_mol();
  ASSERT_TRUE(normal.molar_flow_mol_per_s.has_value());
  EXPECT_TRUE(is_close(*normal.molar_flow_mol_per_s, mol_per_s, 1e-14));
  EXPECT_TRUE(is_close(normal.mass_flow_kg_per_s, mol_per_s * *ng.molar_mass_kg_per_mol(), 1e-14));
}

// Wrong if a normal-volume flow of coal, a zero rate or a quantity of another dimension were accepted.
TEST(FuelFeed, BadRatesAreErrorsNamingTheField) {
  const Fuel coal = preset_fuel("bituminous_coal", db());
  EXPECT_THROW_WITH((void)resolve_feed(coal, "850 Nm3/h", HeatInputBasis::hhv, "--rate"), units::InputError,
                    "--rate = \"850 Nm3/h\": a molar or normal-volume flow needs a gas fuel");
  EXPECT_THROW_WITH((void)resolve_feed(coal, "0 t/h"), units::InputError, "fuel.feed_rate = \"0 t/h\": a fuel rate must be above 0");
  EXPECT_THROW_WITH((void)resolve_feed(coal, "3 bar"), units::InputError, "fuel.feed_rate = \"3 bar\"");
}

// Wrong if rates did not scale the per-kg result by the fuel mass flow.
TEST(FuelFeed, RatesScaleThePerKilogramResult) {
  const Fuel coal = preset_fuel("bituminous_coal", db());
  const CombustionResult r = burn(coal, Oxidant{}, OperatingPoint::with_excess_air(0.25), db());
  const CombustionRates q = rates(r, resolve_feed(coal, "10 t/h"));
  const double m = 10000.0 / 3600.0;
  EXPECT_TRUE(is_close(q.flue_wet_mol_per_s, m * r.flue.total_mol_per_kg(GasBasis::wet), 1e-14));
  EXPECT_TRUE(is_close(q.flue_kg_per_s, m * r.flue.mass_kg_per_kg(GasBasis::wet), 1e-14));
  EXPECT_TRUE(is_close(q.reactant_enthalpy_W, m * r.reactant_enthalpy_J_per_kg, 1e-14));
  EXPECT_TRUE(is_close(q.reactant_element_mol_per_s[0], m * r.reactant_element_mol_per_kg[0], 1e-14));
  EXPECT_TRUE(is_close(q.ash_kg_per_s, m * coal.ash_mass_fraction(), 1e-14));
}

// Wrong if the standard air were not normalised or the enrichment target not met.
TEST(Oxidant, CompositionIsNormalisedAndEnrichmentMeetsItsTarget) {
  double sum = 0.0;
  for (const double x : standard_dry_air()) sum += x;
  EXPECT_TRUE(is_close(sum, 1.0, 1e-15));
  // Source: U.S. Standard Atmosphere 1976, O2 20.9476 % of dry air (from memory); normalised over 4 gases.
  EXPECT_TRUE(is_close(Oxidant{}.o2_dry(), 0.209476, 1e-4));
  OxidantOptions options;
  options.enriched_o2_fraction = 0.3;
  options.humidity = Humidity::ratio(0.01);
  const Oxidant enriched(options);
  EXPECT_TRUE(is_close(enriched.o2_dry(), 0.3, 1e-14));
  EXPECT_GT(enriched.water_mole_fraction(), 0.0);
}

// Wrong if relative humidity were not RH x p_sat / p, or the humidity ratio not converted with molar masses.
TEST(Oxidant, HumidityFromRelativeHumidityAndRatio) {
  OxidantOptions options;
  options.humidity = Humidity::relative(0.5, units::kelvin(293.15), units::pascals(101325.0));
  const Oxidant air(options);
  EXPECT_TRUE(is_close(air.water_mole_fraction(),
                       0.5 * water_saturation_pressure(units::kelvin(293.15)).value() / 101325.0, 1e-12));
  const Humidity ratio = Humidity::ratio(0.0085);
  EXPECT_TRUE(is_close(ratio.humidity_ratio(), 0.0085, 1e-14));
  EXPECT_TRUE(is_close(ratio.water_mol_per_mol_dry_air(), 0.0085 * Oxidant{}.dry_molar_mass_kg_per_mol() /
                                                              (2 * 1.008e-3 + 15.999e-3), 1e-12));
}

// Wrong if impossible humidity or enrichment were accepted.
TEST(Oxidant, BadHumidityAndEnrichmentAreErrorsNamingTheField) {
  EXPECT_THROW_WITH((void)Humidity::relative(1.2, units::kelvin(293.15), units::pascals(101325.0)), units::InputError,
                    "air.relative_humidity = 120 %: must be between 0 % and 100 %");
  EXPECT_THROW_WITH((void)Humidity::relative(1.0, units::kelvin(380.0), units::pascals(101325.0)), units::InputError,
                    "would reach the ambient pressure");
  EXPECT_THROW_WITH((void)Humidity::ratio(-0.01), units::InputError, "air.humidity_ratio = -0.01 kg/kg");
  OxidantOptions options;
  options.enriched_o2_fraction = 0.15;
  EXPECT_THROW_WITH(Oxidant{options}, units::InputError, "air.o2_enrichment = 15 %: the dry O2 content after enrichment");
  options.enriched_o2_fraction.reset();
  options.temperature = units::kelvin(5000.0);
  EXPECT_THROW_WITH(Oxidant{options}, units::InputError, "air.temperature = 5000 K");
}

}  // namespace
}  // namespace stackbound::core
