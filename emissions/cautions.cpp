#include "stackbound/emissions/cautions.hpp"

#include <array>
#include <cassert>

namespace stackbound::emissions {

namespace {

constexpr std::array<CautionText, 10> kCautions{{
    {Caution::equilibrium_bound, "equilibrium_bound",
     "Figures derived from chemical equilibrium are an equilibrium bound at the stated firing conditions "
     "(temperature, pressure, fuel, air). Real flames may stay below it (NO forms slowly) or exceed it locally "
     "(CO from quenching or poor mixing); the bound is not a prediction of what a plant emits."},
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
     "The gas composition is taken as frozen from the firing zone to the stack: no reaction, condensation or "
     "absorption on the way is accounted for (e.g. CO burn-out, NO2 formation, SO3 and water condensation)."},
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
}};

constexpr std::array<Caution, 8> kStandard{{
    Caution::equilibrium_bound,
    Caution::not_a_measurement,
    Caution::not_compliance,
    Caution::authorities_govern,
    Caution::frozen_composition,
    Caution::ideal_gas,
    Caution::complete_mixing,
    Caution::data_sources,
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
