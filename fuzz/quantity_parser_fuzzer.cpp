// The quantity parser on any text: a value with a known dimension and a finite SI value, or a
// units::InputError. Any other exception, a crash or a sanitizer report is a defect.

#include <cmath>

#include "fuzz/fuzz_input.hpp"
#include "stackbound/units/input_error.hpp"
#include "stackbound/units/quantity_parser.hpp"

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
  namespace units = stackbound::units;
  const std::string_view text = stackbound::fuzz::as_text(data, size);
  try {
    const units::ParsedQuantity q =
        units::parse_quantity(text, "value",
                              {units::Dimension::dimensionless, units::Dimension::temperature,
                               units::Dimension::pressure, units::Dimension::mass_flow, units::Dimension::power,
                               units::Dimension::time});
    if (!std::isfinite(q.value_si)) stackbound::fuzz::property_failed("parsed value is not finite");
  } catch (const units::InputError&) {
  }
  try {
    const double kelvin = units::parse_temperature(text, "temperature").value();
    if (!(kelvin > 0.0) || !std::isfinite(kelvin)) stackbound::fuzz::property_failed("temperature not above 0 K");
  } catch (const units::InputError&) {
  }
  return 0;
}
