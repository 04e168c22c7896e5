#include "stackbound/core/primary_zone.hpp"

#include <fmt/format.h>

#include <cassert>
#include <cmath>

#include "stackbound/core/post_flame.hpp"
#include "stackbound/units/input_error.hpp"

namespace stackbound::core {

namespace {

void check(const PrimaryZoneSpec& spec) {
  if (!(spec.air_share > 0.0 && spec.air_share <= 1.0)) {
    throw units::InputError(fmt::format("{}.air_share = {:g} %: the share of the oxidant entering the zone must be "
                                        "above 0 % and at most 100 %",
                                        spec.field, spec.air_share * 100.0));
  }
  const double t = spec.residence_time.value();
  if (!(std::isfinite(t) && t >= 0.0)) {
    throw units::InputError(fmt::format("{}.residence_time = {:g} s: must be a finite time >= 0 s", spec.field, t));
  }
  if (!(spec.heat_loss_fraction >= 0.0 && spec.heat_loss_fraction < 1.0)) {
    throw units::InputError(fmt::format("{}.heat_loss = {:g} %: must be at least 0 % and below 100 % of the heat input",
                                        spec.field, spec.heat_loss_fraction * 100.0));
  }
}

}  // namespace

double PrimaryZone::carried_into(double zone_mole_fraction, double mixed_gas_moles) const {
  assert(mixed_gas_moles > 0.0);
  return zone_mole_fraction * equilibrium.total_gas_moles / mixed_gas_moles;
}

PrimaryZone primary_zone(const EquilibriumSolver& solver, const CombustionResult& combustion,
                         const PrimaryZoneSpec& spec, units::Pressure pressure, const ZeldovichRates& rates) {
  check(spec);
  ElementAmounts b;
  b.moles = combustion.fuel_element_mol_per_kg;
  ElementAmounts oxidant;
  oxidant.moles = combustion.oxidant_element_mol_per_kg;
  b.add(oxidant, spec.air_share);
  const double target = combustion.fuel_enthalpy_J_per_kg + spec.air_share * combustion.oxidant_enthalpy_J_per_kg -
                        spec.heat_loss_fraction * combustion.hhv_J_per_kg;
  PrimaryZone zone;
  zone.air_share = spec.air_share;
  zone.equivalence_ratio = combustion.equivalence_ratio() / spec.air_share;
  zone.heat_loss_fraction = spec.heat_loss_fraction;
  zone.equilibrium = solver.solve_hp(b, units::joules(target), pressure);
  const PostFlameGas gas = post_flame_gas(zone.equilibrium);
  if (!gas.has_nitrogen_chemistry) {
    throw units::InputError(fmt::format("{}: the zone's thermal NO needs O, O2, N2 and NO among the products "
                                        "(firing.species) and nitrogen in the feed",
                                        spec.field));
  }
  ThermalNoOptions options;
  options.rates = rates;
  options.field = spec.field;
  zone.thermal_no = thermal_no(gas, spec.residence_time, options);
  return zone;
}

}  // namespace stackbound::core
