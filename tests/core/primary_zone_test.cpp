// The primary zone (core/primary_zone.hpp): its gas, its NO, what it carries into the mixed gas, and
// bad input. The mixture is an invented test case: the natural-gas preset with dry air at lambda 3
// (a lean overall mixture such as a gas turbine's), air at 600 K.

#include "stackbound/core/primary_zone.hpp"

#include <gtest/gtest.h>

#include <string>

#include "stackbound/cases/species_file.hpp"
#include "stackbound/core/fuel_presets.hpp"
#include "stackbound/core/oxidant.hpp"
#include "stackbound/units/constants.hpp"
#include "stackbound/units/input_error.hpp"
#include "tests/support/tolerance.hpp"

namespace stackbound::core {
namespace {

using stackbound::testing::is_close;

struct Fixture {
  Fixture()
      : fuel(preset_fuel("natural_gas", cases::builtin_species())),
        oxidant([] {
          OxidantOptions options;
          options.temperature = units::kelvin(600.0);
          return Oxidant(options);
        }()),
        combustion(burn(fuel, oxidant, OperatingPoint::with_air_ratio(3.0), cases::builtin_species())),
        b([this] {
          ElementAmounts amounts;
          amounts.moles = combustion.reactant_element_mol_per_kg;
          return amounts;
        }()),
        solver(cases::builtin_species(), b) {}
  Fuel fuel;
  Oxidant oxidant;
  CombustionResult combustion;
  ElementAmounts b;
  EquilibriumSolver solver;
  const units::Pressure pressure = units::pascals(10.0 * units::kStandardAtmosphere_Pa);

  PrimaryZone zone(double share, double time_s, double loss = 0.0) const {
    PrimaryZoneSpec spec;
    spec.air_share = share;
    spec.residence_time = units::seconds(time_s);
    spec.heat_loss_fraction = loss;
    return primary_zone(solver, combustion, spec, pressure);
  }
};

const Fixture& fixture() {
  static const Fixture f;
  return f;
}

// Wrong if a zone that takes all of the oxidant were not the adiabatic state of the whole mixture (the
// zone's feed or enthalpy would be assembled wrongly), or its equivalence ratio not the overall one.
TEST(PrimaryZone, AllOfTheOxidantGivesTheWholeMixturesAdiabaticState) {
  const Fixture& f = fixture();
  const PrimaryZone zone = f.zone(1.0, 0.005);
  const EquilibriumResult whole =
      f.solver.solve_hp(f.b, units::joules(f.combustion.reactant_enthalpy_J_per_kg), f.pressure);
  EXPECT_TRUE(is_close(zone.temperature().value(), whole.temperature_K, 1e-10));
  EXPECT_TRUE(is_close(zone.equivalence_ratio, 1.0 / 3.0, 1e-14));
  EXPECT_TRUE(is_close(zone.carried_into(1e-5, whole.total_gas_moles), 1e-5, 1e-10));
}

// Wrong if a richer zone (less of the air) were not hotter, its ratio not overall / share, its NO not
// zero at zero time and rising with time, or a heat loss did not cool it.
TEST(PrimaryZone, LessAirIsHotterAndFormsNoOverTime) {
  const Fixture& f = fixture();
  const PrimaryZone lean = f.zone(1.0, 0.005);
  const PrimaryZone half = f.zone(0.5, 0.005);
  EXPECT_GT(half.temperature().value(), lean.temperature().value() + 300.0);
  EXPECT_TRUE(is_close(half.equivalence_ratio, 2.0 / 3.0, 1e-14));
  EXPECT_EQ(f.zone(0.5, 0.0).thermal_no.no_mole_fraction, 0.0);
  EXPECT_GT(half.thermal_no.no_mole_fraction, 0.0);
  EXPECT_GT(f.zone(0.5, 0.010).thermal_no.no_mole_fraction, half.thermal_no.no_mole_fraction);
  EXPECT_LT(half.thermal_no.no_mole_fraction, half.thermal_no.no_equilibrium_mole_fraction);
  EXPECT_LT(f.zone(0.5, 0.005, 0.05).temperature().value(), half.temperature().value() - 20.0);
  // Fewer gas moles in the zone than in the mixed gas: what it carries is diluted.
  EXPECT_LT(half.carried_into(1.0, lean.equilibrium.total_gas_moles), 0.6);
}

// Wrong if a share, time or loss outside its range ran, or the message did not name the field.
TEST(PrimaryZone, BadSpecificationsNameTheirField) {
  const Fixture& f = fixture();
  const struct {
    double share, time_s, loss;
    const char* message;
  } bad[] = {
      {0.0, 0.005, 0.0, "primary_zone.air_share = 0 %: the share of the oxidant entering the zone must be above 0 %"},
      {1.5, 0.005, 0.0, "primary_zone.air_share = 150 %"},
      {0.5, -1.0, 0.0, "primary_zone.residence_time = -1 s: must be a finite time >= 0 s"},
      {0.5, 0.005, 1.0, "primary_zone.heat_loss = 100 %"},
  };
  for (const auto& b : bad) {
    try {
      (void)f.zone(b.share, b.time_s, b.loss);
      ADD_FAILURE() << "accepted share " << b.share;
    } catch (const units::InputError& error) {
      EXPECT_NE(std::string(error.what()).find(b.message), std::string::npos) << error.what();
    }
  }
}

}  // namespace
}  // namespace stackbound::core
