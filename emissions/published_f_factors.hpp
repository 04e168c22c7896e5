#pragma once
// The published default F-factors of US EPA Method 19 Table 19-2 by fuel type (40 CFR 60 Appendix
// A-7), for permits that prescribe them instead of the fuel's own (Eqs. 19-13 to 19-15). Volumes at
// 20 degC and 101.325 kPa (29.92 in Hg) per 10^6 Btu of heat input on the HHV.
// Source: Fd and Fc as reproduced in 40 CFR 75 Appendix F, Table 1 ("same values as Method 19
// Table 19-2"); Fw from Method 19 Table 19-2 (from memory; none is listed for wood and bark).

#include <optional>
#include <span>
#include <string_view>

namespace stackbound::emissions {

struct PublishedFFactors {
  std::string_view key;        // used in case files: "natural_gas", "oil", "coal_bituminous" ...
  std::string_view fuel_type;  // as the table names it: "natural gas", "bituminous and subbituminous coal"
  double fd_dscf_per_MMBtu;
  std::optional<double> fw_wscf_per_MMBtu;  // none listed for wood and wood bark
  double fc_scf_per_MMBtu;
};

inline constexpr std::string_view kPublishedFFactorsSource =
    "US EPA Method 19 (40 CFR 60 Appendix A-7), Table 19-2; Fd and Fc as reproduced in 40 CFR 75 Appendix F "
    "Table 1, Fw from memory";

// The table, in its order: coal_anthracite, coal_bituminous, coal_lignite, oil, natural_gas, propane,
// butane, wood, wood_bark.
std::span<const PublishedFFactors> published_f_factors();

// nullptr if the key is unknown.
const PublishedFFactors* find_published_f_factors(std::string_view key);

// The table entry of a built-in fuel preset (core/fuel_presets.hpp), or nullptr when the table has
// none for it.
const PublishedFFactors* published_f_factors_of_preset(std::string_view preset_key);

}  // namespace stackbound::emissions
