#pragma once
// Adiabatic flame temperature (HP equilibrium): the product temperature T at which the equilibrium
// products' enthalpy equals the feed's enthalpy at the feed's own temperature(s), less an optional
// heat loss given as a fraction of the feed's heating value:
//   H_products(T, P) = sum_streams H_feed(T_stream) - loss_fraction * HV_feed
// solved by EquilibriumSolver::solve_hp (safeguarded Newton on T with the equilibrium heat capacity,
// Gordon & McBride, NASA RP-1311, 1994, sec. 2.5 for the derivatives). Heating values are those of
// complete combustion to CO2, H2O, SO2 and N2 at 298.15 K from the species data; the higher heating
// value adds the enthalpy of vaporisation of the water formed from the feed's combustible species,
// kWaterVaporisationEnthalpy298_J_per_mol of core/fuel.hpp (44.004 kJ/mol, NIST-JANAF H-063/H-064);
// water vapour fed as H2O (e.g. air humidity) is not counted.

#include <span>
#include <string>
#include <vector>

#include "stackbound/core/element_amounts.hpp"
#include "stackbound/core/equilibrium.hpp"
#include "stackbound/core/fuel.hpp"
#include "stackbound/core/species_database.hpp"
#include "stackbound/units/constants.hpp"

namespace stackbound::core {

// Heat released by complete combustion of the feed's combustible species at 298.15 K (products CO2,
// H2O, SO2, N2; O2 taken as needed whether or not the feed holds it). Species that release no
// heat (O2, N2, CO2, H2O, Ar, ...) contribute nothing. Throws units::InputError like
// element_amounts(), or if the database lacks CO2, H2O, SO2, N2 or O2 where needed.
[[nodiscard]] units::Energy feed_heating_value(const SpeciesDatabase& db, std::span<const SpeciesAmount> feed,
                                               HeatingValueKind basis, std::string_view field = "feed");

// H_target = feed_enthalpy - heat_loss_fraction * heating_value. Throws units::InputError if the
// fraction is outside [0, 1) or the heating value is negative or not finite.
[[nodiscard]] units::Energy hp_target_enthalpy(units::Energy feed_enthalpy, double heat_loss_fraction,
                                               units::Energy heating_value);

// One reactant stream at its own temperature.
struct FeedStream {
  std::vector<SpeciesAmount> species;
  units::Temperature temperature = units::kelvin(units::kReferenceTemperature_K);
};

struct AdiabaticFlameOptions {
  units::Pressure pressure = units::pascals(units::kStandardAtmosphere_Pa);
  // Fraction of the feed's heating value lost from the flame (0 = adiabatic), dimensionless.
  double heat_loss_fraction = 0.0;
  HeatingValueKind heating_value_kind = HeatingValueKind::higher;
  // Product candidates; empty = every database species made only of the feed's elements.
  std::vector<std::string> candidates;
};

// Equilibrium products at the adiabatic flame temperature of the streams. Builds a solver for this
// one problem; for sweeps, build an EquilibriumSolver once and call solve_hp() with warm starts.
[[nodiscard]] EquilibriumResult adiabatic_flame(const SpeciesDatabase& db, std::span<const FeedStream> streams,
                                                const AdiabaticFlameOptions& options = {});

}  // namespace stackbound::core
