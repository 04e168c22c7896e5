#pragma once
// The standard caution texts that reports carry beside equilibrium-based emission figures, in the
// project's own words. Each caution has a stable key (for JSON and tests) and one paragraph of text.

#include <span>
#include <string_view>

namespace stackbound::emissions {

enum class Caution {
  equilibrium_bound,        // an equilibrium value at stated firing conditions is a bound, not a measurement
  not_a_measurement,        // no figure replaces a stack test or a certified monitor
  not_compliance,           // screening against a limit is not a compliance determination
  authorities_govern,       // permits, regulators, local codes and licensed practice govern
  confirm_presets,          // reference-O2 and other presets must be confirmed against the permit
  frozen_composition,       // composition frozen from firing to stack
  ideal_gas,                // ideal gas, normal volumes as amounts of gas
  complete_mixing,          // one well-mixed zone at one temperature
  o2_correction_validity,   // the O2 correction assumes dilution by air
  data_sources,             // thermodynamic data and factors have their own uncertainty
  co_well_mixed_only,       // CO is bounded by equilibrium only in a well-mixed flame (when CO is reported)
  fuel_nitrogen_unbounded,  // NO from fuel-bound nitrogen is not bounded by equilibrium (fuel with nitrogen)
  primary_zone_needed,      // a gas turbine needs its primary-zone temperature (none stated)
  not_potential_to_emit,    // bound kg/h and t/yr are not a potential-to-emit figure
  sweep_fixed_temperature,  // a sweep at a stated firing temperature ignores the temperature change
};

struct CautionText {
  Caution caution;
  std::string_view key;   // "equilibrium_bound"
  std::string_view text;  // one paragraph
};

// All cautions, in the order reports print them.
std::span<const CautionText> all_cautions();

const CautionText& caution(Caution which);

// The cautions every emissions report carries. The others are added where they apply:
// confirm_presets when a preset was used, o2_correction_validity when an O2 correction was applied,
// co_well_mixed_only when CO is reported, fuel_nitrogen_unbounded for a fuel with bound nitrogen,
// primary_zone_needed for a gas turbine without firing.primary_zone, sweep_fixed_temperature for a
// sweep of an operating change at a stated firing temperature.
std::span<const Caution> standard_cautions();

}  // namespace stackbound::emissions
