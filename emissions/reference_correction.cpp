#include "stackbound/emissions/reference_correction.hpp"

#include <cmath>

#include <fmt/format.h>

#include "stackbound/units/input_error.hpp"

namespace stackbound::emissions {

double o2_basis_percent(O2Basis basis) { return basis == O2Basis::eu_21 ? 21.0 : 20.9; }

std::string o2_basis_description(O2Basis basis) {
  return basis == O2Basis::eu_21 ? "21 % (EU practice)" : "20.9 % (US EPA practice)";
}

O2Basis parse_o2_basis(std::string_view text, std::string_view field) {
  std::string compact;
  for (const char c : text) {
    if (c != ' ' && c != '\t') compact += c;
  }
  if (compact == "20.9" || compact == "20.9%") return O2Basis::us_epa_20_9;
  if (compact == "21" || compact == "21%" || compact == "21.0" || compact == "21.0%") return O2Basis::eu_21;
  throw units::InputError(fmt::format("{} = \"{}\": unknown O2 basis; accepted: 20.9 (US EPA practice), 21 (EU practice)",
                                      field, text));
}

std::string percent_text(double fraction) { return fmt::format("{:.10g}", fraction * 100.0); }

void check_o2_level(double dry_fraction, O2Basis basis, std::string_view what) {
  const double b = o2_basis_percent(basis);
  if (!std::isfinite(dry_fraction) || dry_fraction < 0.0) {
    throw units::InputError(fmt::format("{} = {} %: must be >= 0 % and below the O2 basis {}", what,
                                        percent_text(dry_fraction), o2_basis_description(basis)));
  }
  if (dry_fraction * 100.0 >= b) {
    throw units::InputError(fmt::format(
        "{} = {} %: at or above the O2 basis {}; the correction (b - O2_ref)/(b - O2_meas) is undefined there "
        "(gas at or above the O2 content of air is not flue gas diluted with air)",
        what, percent_text(dry_fraction), o2_basis_description(basis)));
  }
}

void check_co2_level(double dry_fraction, std::string_view what) {
  if (!std::isfinite(dry_fraction) || dry_fraction <= 0.0 || dry_fraction > 1.0) {
    throw units::InputError(fmt::format("{} = {} %: must be above 0 % and at most 100 %", what, percent_text(dry_fraction)));
  }
}

double o2_correction_factor(double from_o2_dry_fraction, double to_o2_dry_fraction, O2Basis basis,
                            std::string_view from_label, std::string_view to_label) {
  check_o2_level(from_o2_dry_fraction, basis, from_label);
  check_o2_level(to_o2_dry_fraction, basis, to_label);
  const double b = o2_basis_percent(basis);
  return (b - to_o2_dry_fraction * 100.0) / (b - from_o2_dry_fraction * 100.0);
}

double co2_correction_factor(double from_co2_dry_fraction, double to_co2_dry_fraction, std::string_view from_label,
                             std::string_view to_label) {
  check_co2_level(from_co2_dry_fraction, from_label);
  check_co2_level(to_co2_dry_fraction, to_label);
  return to_co2_dry_fraction / from_co2_dry_fraction;
}

std::string o2_correction_text(double from_o2_dry_fraction, double to_o2_dry_fraction, O2Basis basis) {
  const std::string b = fmt::format("{:g}", o2_basis_percent(basis));
  return fmt::format("({} - {})/({} - {}), O2 in % dry, O2 basis {}", b, percent_text(to_o2_dry_fraction), b,
                     percent_text(from_o2_dry_fraction), o2_basis_description(basis));
}

std::string co2_correction_text(double from_co2_dry_fraction, double to_co2_dry_fraction) {
  return fmt::format("{}/{}, CO2 in % dry", percent_text(to_co2_dry_fraction), percent_text(from_co2_dry_fraction));
}

}  // namespace stackbound::emissions
