#include "stackbound/emissions/fo_factor.hpp"

#include <algorithm>
#include <array>
#include <cmath>
#include <utility>

namespace stackbound::emissions {

namespace {

// Source: US EPA Method 3B, 40 CFR 60 Appendix A-2, table of Fo ranges (from memory).
constexpr std::array<FoRange, 9> kRanges{{
    {"anthracite-lignite", "anthracite and lignite", 1.016, 1.130},
    {"bituminous-coal", "bituminous coal", 1.083, 1.230},
    {"distillate-oil", "distillate oil", 1.260, 1.413},
    {"residual-oil", "residual oil", 1.210, 1.370},
    {"natural-gas", "natural gas", 1.600, 1.836},
    {"propane", "propane", 1.434, 1.586},
    {"butane", "butane", 1.405, 1.553},
    {"wood", "wood", 1.000, 1.120},
    {"wood-bark", "wood bark", 1.003, 1.130},
}};

// Built-in presets (core/fuel_presets.cpp) and the range of their fuel type.
constexpr std::array<std::pair<std::string_view, std::string_view>, 6> kPresetRanges{{
    {"natural_gas", "natural-gas"},
    {"propane", "propane"},
    {"bituminous_coal", "bituminous-coal"},
    {"distillate_oil_no2", "distillate-oil"},
    {"residual_oil_no6", "residual-oil"},
    {"wood_chips", "wood"},
}};

}  // namespace

std::optional<double> fo_ratio(double o2_dry_fraction, double co2_dry_fraction, double co_dry_fraction) {
  const double o2 = (o2_dry_fraction - 0.5 * co_dry_fraction) * 100.0;
  const double co2 = (co2_dry_fraction + co_dry_fraction) * 100.0;
  if (!(co2 > 0.0) || !std::isfinite(o2)) return std::nullopt;
  return (20.9 - o2) / co2;
}

double expected_fo(double fd_m3_per_J, double fc_m3_per_J) { return 0.209 * fd_m3_per_J / fc_m3_per_J; }

std::span<const FoRange> fo_ranges() { return kRanges; }

std::optional<FoRange> find_fo_range(std::string_view key) {
  const auto found = std::find_if(kRanges.begin(), kRanges.end(), [&](const FoRange& r) { return r.key == key; });
  if (found == kRanges.end()) return std::nullopt;
  return *found;
}

std::optional<FoRange> fo_range_for_preset(std::string_view preset) {
  for (const auto& [name, key] : kPresetRanges) {
    if (name == preset) return find_fo_range(key);
  }
  return std::nullopt;
}

}  // namespace stackbound::emissions
