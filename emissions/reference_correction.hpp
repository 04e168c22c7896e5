#pragma once
// Correction of a dry-basis concentration from one diluent level to another.
//   O2:  C_to = C_from * (b - O2_to) / (b - O2_from), O2 in % by volume on the dry basis, where the
//        "O2 basis" b is 20.9 % (US EPA practice, 40 CFR 60, e.g. 60.44b; Method 19 Eq. 19-1) or
//        21 % (EU practice, Directive 2010/75/EU Annex VI Part 7). Both are selectable.
//   CO2: C_to = C_from * CO2_to / CO2_from (e.g. "corrected to 12 % CO2"; 40 CFR 60 Subpart E form, from memory).
// The correction assumes that the O2 (or CO2) level changes only by dilution with air (or with a
// gas free of CO2): it applies to combustion flue gas, not to gas with O2 from another source.
// It is undefined when an O2 level reaches b; such levels are refused with an InputError.

#include <string>
#include <string_view>

namespace stackbound::emissions {

// The O2 content of air assumed by the correction formula.
enum class O2Basis {
  us_epa_20_9,  // 20.9 % (US EPA practice)
  eu_21,        // 21 %   (EU practice)
};

// 20.9 or 21.
double o2_basis_percent(O2Basis basis);
// "20.9 % (US EPA practice)" or "21 % (EU practice)".
std::string o2_basis_description(O2Basis basis);
// Parses "20.9", "20.9%", "21", "21%" (the --o2-basis option). InputError names the field otherwise.
O2Basis parse_o2_basis(std::string_view text, std::string_view field);

// Refuses an O2 level outside [0, b): the message names `what` ("measured O2", "reference O2"),
// the value and the O2 basis. `dry_fraction` is a mole fraction (0.03 for 3 %).
void check_o2_level(double dry_fraction, O2Basis basis, std::string_view what);
// Refuses a CO2 level outside (0, 100 %].
void check_co2_level(double dry_fraction, std::string_view what);

// (b - O2_to) / (b - O2_from); both levels are dry mole fractions. The labels name the two levels
// in error messages. Exactly 1 when the two levels are equal (x/x in IEEE arithmetic).
double o2_correction_factor(double from_o2_dry_fraction, double to_o2_dry_fraction, O2Basis basis,
                            std::string_view from_label = "measured O2",
                            std::string_view to_label = "reference O2");

// CO2_to / CO2_from; both dry mole fractions in (0, 1].
double co2_correction_factor(double from_co2_dry_fraction, double to_co2_dry_fraction,
                             std::string_view from_label = "measured CO2",
                             std::string_view to_label = "reference CO2");

// "(20.9 - 3)/(20.9 - 7.2)": the correction written out for reports.
std::string o2_correction_text(double from_o2_dry_fraction, double to_o2_dry_fraction, O2Basis basis);
std::string co2_correction_text(double from_co2_dry_fraction, double to_co2_dry_fraction);

// A mole fraction written as percent with up to 10 significant digits and no trailing zeros: 0.072 -> "7.2".
std::string percent_text(double fraction);

}  // namespace stackbound::emissions
