#pragma once
// A primary zone: part of the oxidant burns the whole fuel first, hotter than the mixed-out gas, and
// the rest of the oxidant is mixed in afterwards (a gas-turbine combustor's dilution, a staged burner).
//
// The zone's gas is the HP equilibrium of the fuel with `air_share` of the oxidant (the zone's
// equivalence ratio is the overall one divided by the share), each stream at its own temperature, less
// a stated fraction of the fuel's higher heating value lost in the zone:
//   H_zone(T_zone, P) = H_fuel + share * H_oxidant - loss * HHV        (per kg of fuel)
// Thermal NO forms there for the zone's residence time (core/thermal_no.hpp, equilibrium radicals at
// T_zone). The rest of the oxidant then mixes in at constant enthalpy; what the zone made is carried
// into the mixed gas as moles, so its mole fractions there are the zone's scaled by the ratio of gas
// moles, n_zone / n_mixed. The mixed state itself is the caller's (the adiabatic state of the whole
// mixture: cases/stage_post_flame.hpp).

#include <string>

#include "stackbound/core/combustion.hpp"
#include "stackbound/core/equilibrium.hpp"
#include "stackbound/core/thermal_no.hpp"
#include "stackbound/units/quantities.hpp"

namespace stackbound::core {

struct PrimaryZoneSpec {
  // Fraction of the oxidant that enters the zone, 0 < share <= 1.
  double air_share = 1.0;
  units::Time residence_time = units::seconds(0.0);  // >= 0, finite
  // Fraction of the fuel's higher heating value lost from the zone, 0 <= loss < 1.
  double heat_loss_fraction = 0.0;
  // Names the zone in error messages: "<field>.air_share = 1.5: ...".
  std::string field = "primary_zone";
};

struct PrimaryZone {
  double air_share = 1.0;
  double equivalence_ratio = 0.0;   // of the zone: the overall ratio / air_share
  double heat_loss_fraction = 0.0;
  EquilibriumResult equilibrium;    // the zone's gas, per kg of fuel, at its adiabatic temperature
  ThermalNoResult thermal_no;       // NO formed in the zone over its residence time

  [[nodiscard]] units::Temperature temperature() const { return units::kelvin(equilibrium.temperature_K); }
  // A mole fraction of the zone's gas carried into a mixed gas of `mixed_gas_moles` (per kg of fuel).
  [[nodiscard]] double carried_into(double zone_mole_fraction, double mixed_gas_moles) const;
};

// The zone of `combustion` (the whole fuel and oxidant per kg of fuel) at `pressure`, solved by
// `solver` (built for the elements of the whole mixture). Throws units::InputError naming
// "<field>.air_share", "<field>.residence_time" or "<field>.heat_loss" for values outside their ranges,
// or "<field>" when the zone's gas lacks nitrogen chemistry (O, O2, N2, NO); ConvergenceError when the
// zone's equilibrium fails.
[[nodiscard]] PrimaryZone primary_zone(const EquilibriumSolver& solver, const CombustionResult& combustion,
                                       const PrimaryZoneSpec& spec, units::Pressure pressure,
                                       const ZeldovichRates& rates = hanson_salimian_1984_rates());

}  // namespace stackbound::core
