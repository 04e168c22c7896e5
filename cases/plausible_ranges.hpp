#pragma once
// The ranges of physical inputs the tool is built for. A value outside is refused (never run and
// screened as if it were meaningful): 1e308 Pa as a firing pressure is a typing error, not a plant.
// The ranges are stated in docs/case-file.md; they are wide on purpose (common practice, no source):
// the point is to stop nonsense, not to judge a design.

#include <optional>
#include <string>
#include <string_view>

#include <fmt/format.h>

#include "stackbound/units/quantity_parser.hpp"

namespace stackbound::cases {

struct PlausibleRange {
  double low_si;
  double high_si;
  std::string_view unit;   // the unit the range is stated in
  double unit_in_si;       // SI value of one `unit`
  std::string_view reason; // what the bound protects
};

// Ideal-gas equilibrium: below 1 kPa nothing burns steadily, above 10 MPa real-gas effects matter.
inline constexpr PlausibleRange kFiringPressure{1e3, 1e7, "kPa", 1e3, "a firing pressure (ideal-gas equilibrium)"};
// Flue gas in a stack or duct is near the ambient pressure.
inline constexpr PlausibleRange kStackPressure{5e4, 2e5, "kPa", 1e3, "a stack pressure (flue gas near ambient)"};
// Ambient air from the highest plant sites to the deepest mines.
inline constexpr PlausibleRange kAmbientPressure{5e4, 1.1e5, "kPa", 1e3, "an ambient pressure"};
// Fuel feeds from a small burner (0.36 g/h) to the largest units (36 000 t/h).
inline constexpr PlausibleRange kFuelMassFeed{1e-7, 1e4, "kg/s", 1.0, "a fuel feed"};
// Gas feeds, mol/s: about 8 mL/h to 80 000 Nm3/s of gas.
inline constexpr PlausibleRange kFuelMolarFeed{1e-7, 3.6e6, "mol/s", 1.0, "a fuel feed"};
// Heat input from 1 W to 20 GW (the largest boilers are about 5 GW of fuel).
inline constexpr PlausibleRange kHeatInput{1.0, 2e10, "MW", 1e6, "a heat input"};
// Post-flame times: a residence time at the firing temperature from 0 to 10 s, a cooling from 0 to
// 1 h (furnaces hold the gas for seconds; a longer time is a mistake in the unit).
inline constexpr PlausibleRange kResidenceTime{0.0, 10.0, "s", 1.0, "a residence time at the firing temperature"};
inline constexpr PlausibleRange kCoolingTime{0.0, 3600.0, "s", 1.0, "a post-flame cooling time"};

// The range of a fuel feed stated as a mass flow, a molar flow or a heat input.
inline const PlausibleRange& feed_range(units::Dimension dimension) {
  if (dimension == units::Dimension::mass_flow) return kFuelMassFeed;
  if (dimension == units::Dimension::molar_flow) return kFuelMolarFeed;
  return kHeatInput;
}

// The problem text for a value outside `range` ("outside 1 kPa to 10000 kPa, the range this tool
// accepts for a firing pressure (ideal-gas equilibrium)"), or
// nothing when it is inside.
inline std::optional<std::string> outside(double value_si, const PlausibleRange& range) {
  if (value_si >= range.low_si && value_si <= range.high_si) return std::nullopt;
  return fmt::format("outside {:g} {} to {:g} {}, the range this tool accepts for {}", range.low_si / range.unit_in_si,
                     range.unit, range.high_si / range.unit_in_si, range.unit, range.reason);
}

}  // namespace stackbound::cases
