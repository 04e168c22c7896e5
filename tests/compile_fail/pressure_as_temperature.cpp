// A pressure passed where the public API expects a temperature must not compile.
// With STACKBOUND_COMPILE_FAIL_MISUSE the species thermo is called with a units::Pressure; without it,
// the same call with a units::Temperature (the control, which must compile).
#include "stackbound/core/species.hpp"
#include "stackbound/units/quantities.hpp"

namespace stackbound::compile_fail {

double heat_capacity_ratio(const core::Species& species) {
#ifdef STACKBOUND_COMPILE_FAIL_MISUSE
  return species.cp_over_R(units::pascals(101325.0));
#else
  return species.cp_over_R(units::kelvin(1500.0));
#endif
}

}  // namespace stackbound::compile_fail
