#pragma once
// The runner: case -> fuel, oxidant and operating point -> complete-combustion stoichiometry and
// feed rates -> chemical equilibrium at the firing conditions (fixed T and P, or adiabatic with an
// optional heat loss) -> composition frozen to the stack -> CO, NO, NO2, NOx (as NO2), SO2 on the
// report's bases (ppmvd, ppmvd and mg/Nm3 at the reference O2, kg/h, t/yr, lb/MMBtu and g/GJ by
// US EPA Method 19) -> screening against the stated limits -> measured values (if any) set beside
// the bound, with findings where they disagree.
//
// Each step is a library call of core/ or emissions/; the runner only wires them and keeps the
// numbers a report shows. A run_case() call and the same calls made by hand give identical numbers.

#include <array>
#include <memory>
#include <optional>
#include <string>
#include <vector>

#include "stackbound/cases/case_definition.hpp"
#include "stackbound/core/combustion.hpp"
#include "stackbound/core/equilibrium.hpp"
#include "stackbound/core/fuel.hpp"
#include "stackbound/core/oxidant.hpp"
#include "stackbound/core/species_database.hpp"
#include "stackbound/emissions/emission_rate.hpp"
#include "stackbound/emissions/limit_screening.hpp"
#include "stackbound/emissions/reference_o2_presets.hpp"

namespace stackbound::cases {

struct PollutantBound {
  std::string name;               // "CO", "NO", "NO2", "NOx", "SO2"
  double wet_mole_fraction = 0.0; // in the frozen stack gas
  emissions::StackEmission emission;
};

struct LimitScreening {
  std::string pollutant;
  std::string limit_text;
  emissions::ScreeningResult result;
};

// A measured value set beside the equilibrium bound on the same basis.
struct MeasuredComparison {
  std::string quantity;           // "O2", "CO", "NO", "NOx", "moisture"
  std::string measured_text;      // as stated in the case file
  std::string basis;              // the common basis of the two numbers
  double measured = 0.0;
  double model = 0.0;             // the bound (CO, NO, NOx) or the model's value (O2, moisture)
  std::string unit;
  std::string finding;            // empty when consistent
};

struct RunResult {
  CaseDefinition definition;
  core::Fuel fuel;
  core::Oxidant oxidant;
  core::CombustionResult combustion;    // per kg of fuel, complete combustion
  core::CombustionRates rates;          // scaled to the feed
  core::EquilibriumResult equilibrium;  // per kg of fuel, at the firing conditions
  // The solver used, and the elements it was built for; a sweep hands it to the next point.
  std::shared_ptr<const core::EquilibriumSolver> solver;
  std::array<bool, core::kElementCount> solver_elements{};
  double firing_temperature_K = 0.0;
  double firing_pressure_Pa = 0.0;

  // The frozen stack gas (equilibrium gas phase), wet mole fractions, and its flows.
  double stack_h2o_wet = 0.0;
  double stack_o2_wet = 0.0;
  double stack_o2_dry = 0.0;
  double stack_co2_dry = 0.0;
  double stack_wet_mol_per_s = 0.0;
  double stack_dry_mol_per_s = 0.0;
  double stack_actual_m3_per_s = 0.0;   // at stack temperature and pressure
  const units::NormalConditions* normal = nullptr;
  emissions::O2Basis o2_basis = emissions::O2Basis::us_epa_20_9;
  double reference_o2_dry = 0.0;
  std::string reference_o2_text;        // with its origin (user or preset)
  bool reference_o2_from_preset = false;

  std::vector<PollutantBound> pollutants;
  std::vector<LimitScreening> limits;
  std::vector<MeasuredComparison> measured;
  std::vector<std::string> findings;    // what the reader must look at
  std::vector<std::string> warnings;    // notes from the fuel and combustion steps
  std::vector<std::string> assumptions;
  std::vector<std::string> cautions;    // texts, in print order
  std::vector<std::string> caution_keys;
};

struct RunOptions {
  // Seeds the equilibrium iteration (sweeps pass their neighbour's result). Must come from a run
  // with the same product candidates; otherwise it is ignored.
  const core::EquilibriumResult* warm_start = nullptr;
  // Keep the list of conversion factors behind each figure (for reports that explain them). Sweeps
  // switch it off: the values are identical, the work much less.
  bool record_factors = true;
  // The fuel, already built from definition.fuel.fuel (sweeps that do not vary the fuel build it once).
  const core::Fuel* fuel = nullptr;
  // A solver to reuse (from an earlier RunResult of the same case with other parameters): used when it
  // was built for the same elements; the caller guarantees the same firing.species.
  std::shared_ptr<const core::EquilibriumSolver> solver;
  std::array<bool, core::kElementCount> solver_elements{};
  // Everything after the emission figures: limit screening, measured values beside the bound,
  // findings, assumptions and cautions. Sweeps, which print none of these per point (their outputs
  // carry the standard cautions once), switch it off; RunResult then holds the figures only.
  bool full_report = true;
};

// Runs one case. Throws units::InputError with the case file's location for bad input, and
// core::ConvergenceError if the equilibrium does not converge.
// Takes the definition by value: it ends up in RunResult::definition (pass an rvalue to avoid a copy).
RunResult run_case(CaseDefinition definition, const core::SpeciesDatabase& database, const RunOptions& options = {});

// Thresholds of the findings (our choices, common practice, no source; printed in the report).
inline constexpr double kO2MismatchPoints = 0.5;          // measured vs model flue O2, percentage points (dry)
inline constexpr double kMoistureMismatchPoints = 2.0;    // measured vs model moisture, percentage points
inline constexpr double kCoAboveBoundFactor = 2.0;        // measured CO above this multiple of the bound
inline constexpr double kDewPointMarginK = 10.0;          // stack within this of the water dew point

}  // namespace stackbound::cases
