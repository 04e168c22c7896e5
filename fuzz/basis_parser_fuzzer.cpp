// The basis parser on any text: a basis, or a units::InputError. A stated value ("35 ppm, dry, O2=3%")
// too. Any other exception, a crash or a sanitizer report is a defect.

#include <cmath>

#include "fuzz/fuzz_input.hpp"
#include "stackbound/units/input_error.hpp"
#include "stackbound/emissions/basis.hpp"

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
  namespace emissions = stackbound::emissions;
  const std::string_view text = stackbound::fuzz::as_text(data, size);
  try {
    (void)emissions::parse_basis(text, "basis");
  } catch (const stackbound::units::InputError&) {
  }
  try {
    const emissions::StatedValue stated = emissions::split_stated_value(text, "value");
    if (!std::isfinite(stated.number)) stackbound::fuzz::property_failed("stated number is not finite");
    (void)emissions::parse_partial_basis(stated.rest, "value");
  } catch (const stackbound::units::InputError&) {
  }
  return 0;
}
