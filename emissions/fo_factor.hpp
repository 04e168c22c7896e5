#pragma once
// Analyser QA with the F-factor ratio Fo (US EPA Method 3B, 40 CFR 60 Appendix A-2; from memory for
// the equation numbers):
//   Fo = (20.9 - %O2) / %CO2, both dry; with CO present (%O2 - 0.5 %CO) and (%CO2 + %CO).
// The fuel's expected value is Fo = 0.209 Fd / Fc (Method 3B / Method 19; it follows from the
// definitions of Fd and Fc), and Method 3B gives acceptance ranges by fuel type (from memory).
// Fo checks that the O2 and CO2 analysers agree with each other and with the fuel burnt: a value
// outside the range points at an analyser, a leak or a different fuel.

#include <optional>
#include <span>
#include <string_view>

namespace stackbound::emissions {

// Fo from dry mole fractions (0.03 for 3 %); `co_dry_fraction` 0 when CO is not measured. nullopt
// when the CO2 (+ CO) is not above 0.
std::optional<double> fo_ratio(double o2_dry_fraction, double co2_dry_fraction, double co_dry_fraction = 0.0);

// 0.209 Fd / Fc (Fd and Fc in the same volume per energy).
double expected_fo(double fd_m3_per_J, double fc_m3_per_J);

struct FoRange {
  std::string_view key;      // "natural-gas", "bituminous-coal", ...
  std::string_view fuel;     // "natural gas"
  double low = 0.0;
  double high = 0.0;
};

// The Method 3B ranges (from memory): anthracite and lignite 1.016-1.130, bituminous coal
// 1.083-1.230, distillate oil 1.260-1.413, residual oil 1.210-1.370, natural gas 1.600-1.836,
// propane 1.434-1.586, butane 1.405-1.553, wood 1.000-1.120, wood bark 1.003-1.130.
std::span<const FoRange> fo_ranges();
// nullopt when `key` is none of the keys above.
std::optional<FoRange> find_fo_range(std::string_view key);
// The range for a built-in fuel preset (natural_gas, propane, bituminous_coal, wood_chips, ...), if any.
std::optional<FoRange> fo_range_for_preset(std::string_view preset);

}  // namespace stackbound::emissions
