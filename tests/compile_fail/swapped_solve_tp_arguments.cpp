// The TP solve takes (temperature, pressure); passing them the other way round must not compile.
// With STACKBOUND_COMPILE_FAIL_MISUSE core::EquilibriumSolver::solve_tp gets the pressure first;
// without it, the arguments in their order (the control, which must compile).
#include "stackbound/core/element_amounts.hpp"
#include "stackbound/core/equilibrium.hpp"
#include "stackbound/units/quantities.hpp"

namespace stackbound::compile_fail {

core::EquilibriumResult products_at(const core::EquilibriumSolver& solver, const core::ElementAmounts& b) {
  const units::Temperature temperature = units::kelvin(1800.0);
  const units::Pressure pressure = units::pascals(101325.0);
#ifdef STACKBOUND_COMPILE_FAIL_MISUSE
  return solver.solve_tp(b, pressure, temperature);
#else
  return solver.solve_tp(b, temperature, pressure);
#endif
}

}  // namespace stackbound::compile_fail
