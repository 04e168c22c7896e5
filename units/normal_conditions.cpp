#include "stackbound/units/normal_conditions.hpp"

#include <algorithm>
#include <array>
#include <string>

#include <fmt/format.h>

#include "stackbound/units/constants.hpp"
#include "stackbound/units/input_error.hpp"
#include "stackbound/units/quantity_parser.hpp"

namespace stackbound::units {

namespace {
// 60 degF = 288.705556 K; 14.696 psia (US gas-industry base, e.g. AGA Report 3 / GPA 2172, from memory).
constexpr double kSixtyFahrenheit_K = (60.0 - 32.0) * 5.0 / 9.0 + kCelsiusOffset_K;

constexpr std::array<NormalConditions, 5> kPresets{{
    {"0C", "0 degC, 101.325 kPa (EU practice, normal cubic metre)", 273.15, kStandardAtmosphere_Pa},
    {"15C", "15 degC, 101.325 kPa (ISO 13443 standard reference conditions)", 288.15, kStandardAtmosphere_Pa},
    {"20C", "20 degC, 101.325 kPa (US EPA standard conditions, 68 degF and 29.92 inHg, 40 CFR 60.2)", 293.15,
     kStandardAtmosphere_Pa},
    {"60F", "60 degF, 14.696 psia (US gas industry)", kSixtyFahrenheit_K, 14.696 * kPsi_Pa},
    {"IED", "273.15 K, 101.3 kPa (Directive 2010/75/EU Annex V reference state)", 273.15, 101300.0},
}};
}  // namespace

double NormalConditions::molar_volume_m3_per_mol() const {
  return kGasConstant_J_per_mol_K * temperature_K / pressure_Pa;
}

const NormalConditions& normal_0C() { return kPresets[0]; }
const NormalConditions& normal_15C() { return kPresets[1]; }
const NormalConditions& normal_20C() { return kPresets[2]; }
const NormalConditions& normal_60F() { return kPresets[3]; }
const NormalConditions& normal_eu_ied() { return kPresets[4]; }
std::span<const NormalConditions> all_normal_conditions() { return kPresets; }

const NormalConditions& normal_conditions_by_key(std::string_view key, std::string_view field) {
  for (const NormalConditions& preset : kPresets) {
    if (preset.key == key) return preset;
  }
  std::string accepted;
  for (const NormalConditions& preset : kPresets) {
    if (!accepted.empty()) accepted += ", ";
        accepted += preset.key;
  }
  throw InputError(std::string(field) + " = \"" + std::string(key) + "\": unknown normal conditions; accepted: " +
                   accepted);
}

StatedNormalConditions::StatedNormalConditions(double temperature_K, double pressure_Pa)
    : key_(fmt::format("{:g}degC/{:g}kPa", temperature_K - kCelsiusOffset_K, pressure_Pa / 1e3)),
      description_(fmt::format("{:g} degC, {:g} kPa (stated)", temperature_K - kCelsiusOffset_K, pressure_Pa / 1e3)),
      conditions_{key_, description_, temperature_K, pressure_Pa} {}

std::shared_ptr<const StatedNormalConditions> stated_normal_conditions(std::string_view text, std::string_view field) {
  const std::size_t comma = text.find(',');
  const auto refuse = [&](const std::string& problem) {
    throw InputError(std::string(field) + " = \"" + std::string(text) + "\": " + problem);
  };
  if (comma == std::string_view::npos || text.find(',', comma + 1) != std::string_view::npos) {
    refuse("expected a key (0C, 15C, 20C, 60F, IED) or a temperature and a pressure, e.g. \"25 degC, 101.325 kPa\"");
  }
  const auto part = [&](std::string_view piece) {
    const std::size_t start = std::min(piece.find_first_not_of(" \t"), piece.size());
    const std::size_t end = piece.find_last_not_of(" \t");
    return parse_quantity(piece.substr(start, end == std::string_view::npos ? 0 : end + 1 - start), field,
                          {Dimension::temperature, Dimension::pressure});
  };
  const ParsedQuantity first = part(text.substr(0, comma));
  const ParsedQuantity second = part(text.substr(comma + 1));
  if (first.dimension == second.dimension) refuse("give one temperature and one pressure, e.g. \"25 degC, 101.325 kPa\"");
  const double temperature_K = first.dimension == Dimension::temperature ? first.value_si : second.value_si;
  const double pressure_Pa = first.dimension == Dimension::pressure ? first.value_si : second.value_si;
  if (!(temperature_K >= 250.0 && temperature_K <= 350.0)) refuse("the temperature must be between 250 K and 350 K");
  if (!(pressure_Pa >= 80e3 && pressure_Pa <= 120e3)) refuse("the pressure must be between 80 kPa and 120 kPa");
  return std::make_shared<const StatedNormalConditions>(temperature_K, pressure_Pa);
}

NormalVolume NormalVolume::from_cubic_metres(double normal_m3, const NormalConditions& conditions) {
  return NormalVolume(moles(normal_m3 / conditions.molar_volume_m3_per_mol()));
}

double NormalVolume::cubic_metres(const NormalConditions& conditions) const {
  return amount_.value() * conditions.molar_volume_m3_per_mol();
}

}  // namespace stackbound::units
