// Stoichiometric air, flue-gas CO2 and water dew point against published or derived figures. Each
// figure names its source and status beside it.

#include <cmath>

#include <fmt/format.h>
#include <gtest/gtest.h>

#include "stackbound/cases/species_file.hpp"
#include "stackbound/core/combustion.hpp"
#include "stackbound/core/fuel_presets.hpp"
#include "stackbound/core/humidity.hpp"
#include "tests/support/published_check.hpp"
#include "tests/support/tolerance.hpp"

namespace stackbound::core {
namespace {

using stackbound::testing::is_close;
using stackbound::testing::record_published_check;

const SpeciesDatabase& db() { return cases::builtin_species(); }

CombustionResult stoichiometric(const char* formula) {
  GasFuelSpec spec;
  spec.composition_percent = {{formula, 100.0}};
  return burn(Fuel::gas(spec, db()), Oxidant{}, OperatingPoint::with_excess_air(0.0), db());
}

// Dry air of the U.S. Standard Atmosphere 1976: O2 20.9476 mole %, mean molar mass 28.9644 g/mol
// (both from memory). Derived stoichiometric air: (O2 demand / x_O2) x M_air / M_fuel.
constexpr double kAirO2 = 0.209476;
constexpr double kAirMolarMass = 28.9644;
constexpr const char* kStandardAir =
    "U.S. Standard Atmosphere 1976 dry air: O2 20.9476 mole %, 28.9644 g/mol (from memory)";
constexpr const char* kStoichiometric = "stoichiometric, dry air";

// Wrong if the stoichiometric air of methane were off (air composition, O2 demand or molar masses).
TEST(Stoichiometry, MethaneStoichiometricAir) {
  const double air = stoichiometric("CH4").stoichiometric_air_kg_per_kg;
  // Derived: 2 / 0.209476 x 28.9644 / 16.043 = 17.238 kg air per kg CH4.
  record_published_check({"stoichiometric air, CH4 (derived)", kStoichiometric,
                          fmt::format("{:.5g} kg/kg", 2.0 / kAirO2 * kAirMolarMass / 16.043),
                          fmt::format("derived: 2 / x_O2 x M_air / 16.043 g/mol, {}", kStandardAir),
                          "0.1 % relative (test states no reason)", air});
  EXPECT_TRUE(is_close(air, 2.0 / kAirO2 * kAirMolarMass / 16.043, 1e-3));
  // Source: the stoichiometric air-fuel ratio of methane, 17.2 kg/kg, a common handbook figure (from memory).
  record_published_check({"stoichiometric air, CH4 (handbook)", kStoichiometric, "17.2 kg/kg",
                          "common handbook figure (from memory)", "0.5 % relative (test states no reason)", air});
  EXPECT_TRUE(is_close(air, 17.2, 5e-3));
}

// Wrong if the stoichiometric air of propane were off.
TEST(Stoichiometry, PropaneStoichiometricAir) {
  const double air = stoichiometric("C3H8").stoichiometric_air_kg_per_kg;
  // Derived: 5 / 0.209476 x 28.9644 / 44.097 = 15.678 kg air per kg C3H8.
  record_published_check({"stoichiometric air, C3H8 (derived)", kStoichiometric,
                          fmt::format("{:.5g} kg/kg", 5.0 / kAirO2 * kAirMolarMass / 44.097),
                          fmt::format("derived: 5 / x_O2 x M_air / 44.097 g/mol, {}", kStandardAir),
                          "0.1 % relative (test states no reason)", air});
  EXPECT_TRUE(is_close(air, 5.0 / kAirO2 * kAirMolarMass / 44.097, 1e-3));
  // Source: stoichiometric air-fuel ratio of propane 15.7 kg/kg, common handbook figure (from memory).
  record_published_check({"stoichiometric air, C3H8 (handbook)", kStoichiometric, "15.7 kg/kg",
                          "common handbook figure (from memory)", "0.5 % relative (test states no reason)", air});
  EXPECT_TRUE(is_close(air, 15.7, 5e-3));
}

// Wrong if the dry flue gas at stoichiometric held the wrong nitrogen/argon or lost the CO2.
TEST(Stoichiometry, MethaneMaximumDryCo2) {
  const double co2 = stoichiometric("CH4").flue_co2_dry;
  // Derived: 1 / (1 + 2 (1 - 0.209476) / 0.209476) = 11.70 % (air CO2 adds 0.03 point).
  record_published_check({"maximum dry CO2, CH4 (derived)", kStoichiometric,
                          fmt::format("{:#.4g} % dry", 100.0 / (1.0 + 2.0 * (1.0 - kAirO2) / kAirO2)),
                          fmt::format("derived: 1 / (1 + 2 (1 - x_O2) / x_O2), {}", kStandardAir),
                          "0.05 percentage point absolute (air's own CO2 adds 0.03 point)", co2 * 100.0});
  EXPECT_TRUE(is_close(co2, 1.0 / (1.0 + 2.0 * (1.0 - kAirO2) / kAirO2), 0.0, 0.0005));
  // Source: "CO2 max" of methane, 11.7 % dry, common combustion-analysis figure (from memory).
  record_published_check({"maximum dry CO2, CH4 (handbook)", kStoichiometric, "11.7 % dry",
                          "\"CO2 max\" of methane, common combustion-analysis figure (from memory)",
                          "0.1 percentage point absolute (test states no reason)", co2 * 100.0});
  EXPECT_TRUE(is_close(co2 * 100.0, 11.7, 0.0, 0.1));
}

// Wrong if the water dew point of natural-gas flue gas were off (water fraction, pressure or
// saturation curve).
TEST(Stoichiometry, NaturalGasFlueGasWaterDewPoint) {
  const CombustionResult ch4 = stoichiometric("CH4");
  ASSERT_TRUE(ch4.water_dew_point_K.has_value());
  // Derived: water partial pressure from the stoichiometry (x_H2O = 2 / (3 + 2 (1 - x_O2)/x_O2) at
  // 101.325 kPa) and the Antoine equation for water, log10(p/bar) = 5.20389 - 1733.926/(T/K - 39.485),
  // 304-333 K (NIST Chemistry WebBook, after Bridgeman & Aldrich 1964; coefficients from memory):
  // 332.36 K. The Antoine fit is good to about 0.1 K here; criterion 0.3 K.
  const double x_water = 2.0 / (3.0 + 2.0 * (1.0 - kAirO2) / kAirO2);
  const double p_bar = x_water * 1.01325;
  const double antoine_K = 1733.926 / (5.20389 - std::log10(p_bar)) + 39.485;
  record_published_check({"water dew point of the flue gas, CH4 (derived)", "stoichiometric, dry air, 101.325 kPa",
                          fmt::format("{:.2f} K", antoine_K),
                          "derived: x_H2O from the stoichiometry and the Antoine equation for water, 304-333 K (NIST "
                          "Chemistry WebBook, after Bridgeman & Aldrich 1964; coefficients from memory)",
                          "0.3 K absolute (the Antoine fit is good to about 0.1 K here)", *ch4.water_dew_point_K});
  EXPECT_TRUE(is_close(*ch4.water_dew_point_K, antoine_K, 0.0, 0.3));
  // Source: water dew point of stoichiometric natural-gas flue gas, about 59 degC, a common figure in
  // condensing-boiler literature (from memory). Our typical pipeline gas; criterion 1 K.
  const CombustionResult ng = burn(preset_fuel("natural_gas", db()), Oxidant{}, OperatingPoint{}, db());
  record_published_check(
      {"water dew point of the flue gas, natural gas (preset)", "stoichiometric, dry air, 101.325 kPa", "59 degC",
       "common figure in condensing-boiler literature (from memory)",
       "1 K absolute (our typical pipeline gas; \"about 59 degC\")", *ng.water_dew_point_K - 273.15});
  EXPECT_TRUE(is_close(*ng.water_dew_point_K - 273.15, 59.0, 0.0, 1.0));
}

// Wrong if the dew point's saturation curve disagreed with steam tables at a round pressure.
TEST(Stoichiometry, SaturationTemperatureAtTwentyKilopascal) {
  // Source: saturation temperature of water at 20 kPa, 60.06 degC, steam tables based on IAPWS-IF97
  // (from memory).
  record_published_check({"saturation temperature of water", "20 kPa", "60.06 degC",
                          "steam tables based on IAPWS-IF97 (from memory)", "0.02 K absolute (test states no reason)",
                          water_dew_point(units::pascals(20e3))->value() - 273.15});
  EXPECT_TRUE(is_close(water_dew_point(units::pascals(20e3))->value() - 273.15, 60.06, 0.0, 0.02));
}

// Wrong if solving the excess air from a measured flue O2 did not reproduce the excess air behind it.
TEST(Stoichiometry, FlueO2RoundTripForNaturalGasAndCoal) {
  for (const char* key : {"natural_gas", "bituminous_coal"}) {
    const Fuel fuel = preset_fuel(key, db());
    const CombustionResult at_20 = burn(fuel, Oxidant{}, OperatingPoint::with_excess_air(0.2), db());
    const CombustionResult solved =
        burn(fuel, Oxidant{}, OperatingPoint::with_flue_o2(at_20.flue_o2_dry, GasBasis::dry), db());
    EXPECT_TRUE(is_close(solved.excess_air(), 0.2, 1e-10)) << key;
  }
}

}  // namespace
}  // namespace stackbound::core
