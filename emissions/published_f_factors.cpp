#include "stackbound/emissions/published_f_factors.hpp"

#include <array>
#include <utility>

namespace stackbound::emissions {

namespace {

// Source: 40 CFR 75 Appendix F, Table 1 (Fd, Fc; the same values as Method 19 Table 19-2) and Method
// 19 Table 19-2 (Fw, from memory), dscf, wscf and scf CO2 per 10^6 Btu at 20 degC, 29.92 in Hg.
constexpr std::array<PublishedFFactors, 9> kTable{{
    {"coal_anthracite", "anthracite coal", 10100.0, 10540.0, 1970.0},
    {"coal_bituminous", "bituminous and subbituminous coal", 9780.0, 10640.0, 1800.0},
    {"coal_lignite", "lignite coal", 9860.0, 11950.0, 1910.0},
    {"oil", "oil", 9190.0, 10320.0, 1420.0},
    {"natural_gas", "natural gas", 8710.0, 10610.0, 1040.0},
    {"propane", "propane", 8710.0, 10200.0, 1190.0},
    {"butane", "butane", 8710.0, 10390.0, 1250.0},
    {"wood", "wood", 9240.0, std::nullopt, 1830.0},
    {"wood_bark", "wood bark", 9600.0, std::nullopt, 1920.0},
}};

// Built-in presets and the table entry of their fuel type.
constexpr std::array<std::pair<std::string_view, std::string_view>, 6> kPresetEntries{{
    {"natural_gas", "natural_gas"},
    {"propane", "propane"},
    {"distillate_oil_no2", "oil"},
    {"residual_oil_no6", "oil"},
    {"bituminous_coal", "coal_bituminous"},
    {"wood_chips", "wood"},
}};

}  // namespace

std::span<const PublishedFFactors> published_f_factors() { return kTable; }

const PublishedFFactors* find_published_f_factors(std::string_view key) {
  for (const PublishedFFactors& entry : kTable) {
    if (entry.key == key) return &entry;
  }
  return nullptr;
}

const PublishedFFactors* published_f_factors_of_preset(std::string_view preset_key) {
  for (const auto& [preset, entry] : kPresetEntries) {
    if (preset == preset_key) return find_published_f_factors(entry);
  }
  return nullptr;
}

}  // namespace stackbound::emissions
