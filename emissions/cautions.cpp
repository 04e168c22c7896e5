#include "stackbound/emissions/cautions.hpp"

#include <array>
#include <cassert>

namespace stackbound::emissions {

namespace {

constexpr std::array<CautionText, 15> kCautions{{
    {Caution::equilibrium_bound, "equilibrium_bound",
     "Figures derived from chemical equilibrium are an equilibrium bound at the stated firing conditions "
     "(temperature, pressure, fuel, air), not a prediction of what a plant emits: thermal NO forms slowly, so real "
     "flames usually stay below it."},
    {Caution::not_a_measurement, "not_a_measurement",
     "These are estimates, not measurements. Only a stack test or a certified monitoring system, run by the methods "
     "the permit names, measures what a plant emits."},
    {Caution::not_compliance, "not_compliance",
     "A comparison with a limit here is screening against the stated limit. It is not a compliance determination: "
     "that depends on the permit's test methods, averaging periods, data handling and the regulator's decision."},
    {Caution::authorities_govern, "authorities_govern",
     "Permits, regulators, local codes and licensed professional practice govern. Check every basis, factor and "
     "reference condition used here against the documents that apply to the plant."},
    {Caution::confirm_presets, "confirm_presets",
     "Reference O2 levels and other values marked as presets come from general rules (e.g. Directive 2010/75/EU "
     "annexes). The plant's permit decides; confirm each preset against it or replace it with the permit's value."},
    {Caution::frozen_composition, "frozen_composition",
     "The bound takes the gas composition as frozen from the firing zone to the stack: no reaction, condensation or "
     "absorption on the way (NO2 formation, SO3 and water condensation). Only the post-flame estimate and ceiling "
     "follow NO and CO along the way."},
    {Caution::ideal_gas, "ideal_gas",
     "Gases are treated as ideal: a normal cubic metre is an amount of gas at the named normal conditions, with the "
     "molar volume R T / p. Non-ideality at stack conditions is below what matters for these estimates."},
    {Caution::complete_mixing, "complete_mixing",
     "Fuel and air are taken as completely mixed at one temperature and pressure; staged, diffusion or "
     "poorly mixed flames have zones far from this state."},
    {Caution::o2_correction_validity, "o2_correction_validity",
     "The O2 correction assumes the O2 in the flue gas comes from excess air of 20.9 % (or 21 %) O2. It misleads "
     "for O2-enriched air, flue-gas recirculation counted as air, or gas diluted by something other than air."},
    {Caution::data_sources, "data_sources",
     "Thermodynamic data, F-factors and molar masses carry their published uncertainty; the sources are named in "
     "the documentation and beside each value."},
    {Caution::co_well_mixed_only, "co_well_mixed_only",
     "CO is bounded by these figures only in a well-mixed flame with enough time at temperature: poor mixing, "
     "quenching on cold surfaces, or too short a residence time leave CO far above every figure here, the ceiling "
     "included. A CO measurement governs."},
    {Caution::fuel_nitrogen_unbounded, "fuel_nitrogen_unbounded",
     "NO from the nitrogen bound in the fuel is not bounded by equilibrium: it forms by kinetics in the flame and "
     "can exceed the equilibrium NO at the firing temperature. Only the ceiling (all fuel nitrogen as NO) bounds it; "
     "state fuel.nitrogen_conversion from the plant's data where it is known."},
    {Caution::primary_zone_needed, "primary_zone_needed",
     "A gas turbine forms its NO in the primary zone, far hotter than the mixed gas of the stated firing "
     "conditions; without that zone (firing.primary_zone) the estimate follows the mixed gas only and can lie far "
     "below the turbine's NOx. State the primary zone from the combustor's data."},
    {Caution::not_potential_to_emit, "not_potential_to_emit",
     "The kg/h and t/yr figures are the stated feed and operating hours at the stated conditions; they are not a "
     "potential-to-emit figure, which the applicable rules define (maximum capacity, worst-case fuel and operation, "
     "enforceable limits)."},
    {Caution::sweep_fixed_temperature, "sweep_fixed_temperature",
     "This sweep holds the stated firing temperature while the operating change varies: in a real flame, excess "
     "air, air preheat, humidity, enrichment or fuel blend change the flame temperature, and with it NO and CO. The "
     "figures show the change at a fixed temperature only; use firing.adiabatic: true to let it follow."},
}};

constexpr std::array<Caution, 9> kStandard{{
    Caution::equilibrium_bound,
    Caution::not_a_measurement,
    Caution::not_compliance,
    Caution::authorities_govern,
    Caution::frozen_composition,
    Caution::ideal_gas,
    Caution::complete_mixing,
    Caution::data_sources,
    Caution::not_potential_to_emit,
}};

}  // namespace

std::span<const CautionText> all_cautions() { return kCautions; }

const CautionText& caution(Caution which) {
  for (const CautionText& entry : kCautions) {
    if (entry.caution == which) return entry;
  }
  assert(false && "every Caution has a text");
  return kCautions.front();
}

std::span<const Caution> standard_cautions() { return kStandard; }

}  // namespace stackbound::emissions
