#include "stackbound/cases/stage_fire.hpp"

#include "stackbound/cases/source_map.hpp"

namespace stackbound::cases {

namespace {

// The field an error of the equilibrium concerns: the stated temperature, else the firing section.
std::string_view firing_field(const FiringSpec& firing) { return firing.adiabatic ? "firing" : "firing.temperature"; }

std::shared_ptr<const core::EquilibriumSolver> solver_for(const FiringSpec& firing,
                                                          const core::ElementAmounts& elements,
                                                          const std::array<bool, core::kElementCount>& present,
                                                          const core::SpeciesDatabase& database,
                                                          const FiringState* previous) {
  if (previous != nullptr && previous->solver != nullptr && previous->solver_elements == present)
    return previous->solver;
  return at_field(firing.species.empty() ? firing_field(firing) : "firing.species",
                  [&] { return std::make_shared<const core::EquilibriumSolver>(database, elements, firing.species); });
}

}  // namespace

FiringState fire_stage(const FiringSpec& firing, const ResolvedCase& resolved, const core::SpeciesDatabase& database,
                       const FiringState* previous) {
  const core::CombustionResult& combustion = resolved.combustion;
  core::ElementAmounts elements;
  elements.moles = combustion.reactant_element_mol_per_kg;
  std::array<bool, core::kElementCount> present{};
  for (std::size_t k = 0; k < core::kElementCount; ++k) present[k] = elements.moles[k] > 0.0;
  std::shared_ptr<const core::EquilibriumSolver> solver = solver_for(firing, elements, present, database, previous);
  const core::EquilibriumResult* warm =
      previous != nullptr && previous->equilibrium.species == solver->species() ? &previous->equilibrium : nullptr;
  core::EquilibriumResult equilibrium = at_field(firing_field(firing), [&] {
    if (firing.adiabatic) {
      const double target = combustion.reactant_enthalpy_J_per_kg - firing.heat_loss_fraction * combustion.hhv_J_per_kg;
      return solver->solve_hp(elements, units::joules(target), units::pascals(firing.pressure_Pa), warm);
    }
    return solver->solve_tp(elements, units::kelvin(firing.temperature_K), units::pascals(firing.pressure_Pa), warm);
  });
  const double temperature_K = equilibrium.temperature_K;
  const double pressure_Pa = equilibrium.pressure_Pa;
  // Moved into the result: `equilibrium` and `solver` are not const for that reason only.
  return {temperature_K, pressure_Pa, std::move(equilibrium), std::move(solver), present};
}

}  // namespace stackbound::cases
