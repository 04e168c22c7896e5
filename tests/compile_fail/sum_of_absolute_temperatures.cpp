// Two absolute temperatures must not add (300 K + 300 K is not the temperature of anything); a
// temperature plus a difference of two temperatures is fine.
// With STACKBOUND_COMPILE_FAIL_MISUSE the midpoint of a species' data range is formed as (low + high) / 2;
// without it, as low + (high - low) / 2 (the control, which must compile).
#include "stackbound/core/species.hpp"
#include "stackbound/units/quantities.hpp"

namespace stackbound::compile_fail {

units::Temperature middle_of_range(const core::Species& species) {
  const core::TemperatureRange& range = species.range();
#ifdef STACKBOUND_COMPILE_FAIL_MISUSE
  return (range.low + range.high) / 2.0;
#else
  const units::TemperatureDifference width = range.high - range.low;
  return range.low + width / 2.0;
#endif
}

}  // namespace stackbound::compile_fail
