#pragma once
// Stage 2 of a run, fire: the firing state. The whole reactant mixture (fuel and oxidant at the
// operating point's air ratio) at chemical equilibrium at the firing conditions: a stated temperature
// and pressure, or adiabatic with a stated fraction of the heat input lost. This is the one stage
// that solves an equilibrium.

#include <array>
#include <memory>

#include "stackbound/cases/case_definition.hpp"
#include "stackbound/cases/stage_resolve.hpp"
#include "stackbound/core/equilibrium.hpp"
#include "stackbound/core/species_database.hpp"

namespace stackbound::cases {

struct FiringState {
  double temperature_K = 0.0;  // stated, or the adiabatic flame temperature
  double pressure_Pa = 0.0;
  core::EquilibriumResult equilibrium;  // per kg of fuel
  // The solver used, and the elements it was built for; a sweep hands it to its next point.
  std::shared_ptr<const core::EquilibriumSolver> solver;
  std::array<bool, core::kElementCount> solver_elements{};
};

// Runs the stage. `previous`: the firing state of an earlier run of the same case with other
// parameters (a sweep's previous point), or nullptr. Its solver is reused when built for the same
// elements (the caller guarantees the same firing.species), and its equilibrium seeds the iteration
// when it has the same product candidates. Errors name "firing.temperature", "firing.species" or
// "firing" (source_map.hpp); core::ConvergenceError when the equilibrium does not converge.
FiringState fire_stage(const FiringSpec& firing, const ResolvedCase& resolved, const core::SpeciesDatabase& database,
                       const FiringState* previous = nullptr);

}  // namespace stackbound::cases
