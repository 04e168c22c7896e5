#pragma once
// Stage 3 of a run, post-flame: what the gas does between the flame and the stack, by the kinetics of
// core/ (core/post_flame.hpp): an optional primary zone (firing.primary_zone, core/primary_zone.hpp)
// whose NO and CO enter the mixed gas at the firing state (the adiabatic state of the whole mixture), a hold at the firing temperature for firing.residence_time, then linear
// cooling to post_flame.cooling_to over post_flame.cooling_time. Along that path it follows thermal NO
// (extended Zeldovich with equilibrium radicals, core/thermal_no.hpp) and CO burnout
// (core/co_burnout.hpp), and adds NO from fuel-bound nitrogen (core/fuel_nitrogen.hpp).
//
// It gives an estimate and a ceiling next to the equilibrium bound, which the stack and emissions
// stages keep computing exactly as before (the frozen firing-state gas):
//   NO, NOx  estimate = thermal NO + fuel-N NO at the conversion (stated, else the fuel class's
//                       typical band, its upper end; else 100 %),
//            ceiling  = max(highest equilibrium NO (NOx: NO + NO2) along the path, thermal NO + fuel-N
//                       NO at 100 %);
//   CO       estimate = CO after burnout, starting from the equilibrium CO at the firing temperature
//                       (with a primary zone: the zone's equilibrium CO carried into the mixed gas),
//            ceiling  = highest equilibrium CO along the path (at the firing temperature when cooling),
//                       or the zone's carried CO when higher.
// With a primary zone, the path's NO starts from the zone's thermal NO carried into the mixed gas, and
// the zone's carried equilibrium NO joins the "highest equilibrium" of the ceiling.
// Prompt NO is not computed. Unstated times and temperatures are defaults the report states.

#include <optional>
#include <string>
#include <string_view>
#include <vector>

#include "stackbound/cases/case_definition.hpp"
#include "stackbound/cases/stage_fire.hpp"
#include "stackbound/cases/stage_resolve.hpp"
#include "stackbound/core/co_burnout.hpp"
#include "stackbound/core/fuel_nitrogen.hpp"
#include "stackbound/core/post_flame.hpp"
#include "stackbound/core/primary_zone.hpp"
#include "stackbound/core/thermal_no.hpp"

namespace stackbound::cases {

// Printed with every estimate: what it leaves out and why it may lie far below a measurement.
inline constexpr std::string_view kPostFlameCaution =
    "The estimate is not conservative: it follows the gas at the stated (or adiabatic overall-mixture) firing "
    "temperature with equilibrium radicals, while real flames form NO faster at their peak temperatures, with "
    "superequilibrium O and OH and by prompt NO (not computed). It can lie far below measured NOx; use it to see "
    "how far the bound is from kinetics, not in place of the bound or a measurement.";

// Where the fuel-N conversion of the estimate comes from.
enum class ConversionOrigin {
  stated,         // fuel.nitrogen_conversion
  typical_band,   // the upper end of the fuel class's typical band (core/fuel_nitrogen.hpp)
  ceiling,        // no band for this fuel: 100 %, the estimate equals the ceiling
  no_fuel_nitrogen,
};
[[nodiscard]] std::string_view to_string(ConversionOrigin origin);

struct FuelNitrogenPart {
  core::FuelNitrogenNo no;                        // per kg of fuel, at the conversion of the estimate
  ConversionOrigin origin = ConversionOrigin::no_fuel_nitrogen;
  std::optional<core::FuelNitrogenNoBand> band;   // when a typical band applied
  double estimate_wet_mole_fraction = 0.0;        // in the flue gas of complete combustion, as a trace
  double ceiling_wet_mole_fraction = 0.0;
};

// The primary zone (firing.primary_zone) and what it hands to the mixed gas where the path starts.
struct PrimaryZonePart {
  core::PrimaryZone zone;
  double residence_time_s = 0.0;
  std::string share_origin;            // "firing.primary_zone.equivalence_ratio" or "...air_share"
  double no_carried = 0.0;             // the zone's thermal NO, as a wet mole fraction of the mixed gas
  double no_equilibrium_carried = 0.0; // the zone's equilibrium NO, likewise (part of the ceiling)
  double co_carried = 0.0;             // the zone's equilibrium CO, likewise: where CO burnout starts
};

struct PostFlame {
  std::optional<PrimaryZonePart> primary_zone;  // when firing.primary_zone is stated
  core::PostFlamePath path;           // firing T and P, hold, cooling as run
  std::string cooling_to_origin;      // "post_flame.cooling_to", "stack.temperature" or the stack default
  // Thermal NO along the path; nullopt when the products lack O, O2, N2 or NO (firing.species).
  std::optional<core::ThermalNoPathResult> thermal_no;
  // CO along the path; nullopt when CO is not among the products.
  std::optional<core::CoBurnoutResult> co;
  FuelNitrogenPart fuel_nitrogen;
  double highest_equilibrium_no = 0.0;   // wet mole fractions along the path
  double highest_equilibrium_nox = 0.0;  // NO + NO2 of the firing-state equilibrium and the path's NO
  double highest_equilibrium_co = 0.0;
  // The defaults used, as sentences for the report ("defaults the user should replace").
  std::vector<std::string> assumptions;

  // Wet mole fractions of the estimate and the ceiling of a pollutant ("NO", "NOx", "CO"); nullopt
  // for the others (NO2, SO2) and when the kinetics could not run.
  [[nodiscard]] std::optional<double> estimate_wet_fraction(std::string_view pollutant) const;
  [[nodiscard]] std::optional<double> ceiling_wet_fraction(std::string_view pollutant) const;
};

// True for the pollutants the stage gives an estimate and a ceiling for: NO, NOx and CO.
[[nodiscard]] bool post_flame_covers(std::string_view pollutant);

// Runs the stage on the firing state. Errors name "firing.residence_time", "firing.primary_zone",
// "post_flame.cooling_to", "post_flame" or "fuel.nitrogen_conversion"; core::ConvergenceError if a path equilibrium fails.
PostFlame post_flame_stage(const CaseDefinition& definition, const ResolvedCase& resolved, const FiringState& fired);

}  // namespace stackbound::cases
