#pragma once
// Reference ("normal") conditions of a normal volume. A normal cubic metre is an amount of gas,
// not a volume: it always names the temperature and pressure it refers to. Molar volumes follow
// from the ideal-gas law V_m = R T / p with R from CODATA 2018.

#include <memory>
#include <span>
#include <string>
#include <string_view>

#include "stackbound/units/quantities.hpp"

namespace stackbound::units {

struct NormalConditions {
  std::string_view key;          // short name used on the command line and in case files: "0C", "20C" ...
  std::string_view description;  // for reports: "0 degC, 101.325 kPa (EU practice)"
  double temperature_K = 0.0;
  double pressure_Pa = 0.0;

  // Ideal-gas molar volume at these conditions, m3/mol.
  [[nodiscard]] double molar_volume_m3_per_mol() const;
  [[nodiscard]] MolarVolume molar_volume() const { return cubic_metres_per_mole(molar_volume_m3_per_mol()); }
  [[nodiscard]] Temperature temperature() const { return kelvin(temperature_K); }
  [[nodiscard]] Pressure pressure() const { return pascals(pressure_Pa); }
};

// Presets (DESIGN section 3).
//   0 degC, 101.325 kPa             - EU practice (normal cubic metre, Nm3)
//   15 degC, 101.325 kPa            - ISO 13443 standard reference conditions (Sm3)
//   20 degC, 101.325 kPa            - US EPA standard conditions (68 degF, 29.92 inHg; 40 CFR 60.2)
//   60 degF, 14.696 psia            - US gas industry (scf of fuel gas)
//   0 degC, 101.3 kPa               - the reference state written in Directive 2010/75/EU Annex V/VI
const NormalConditions& normal_0C();
const NormalConditions& normal_15C();
const NormalConditions& normal_20C();
const NormalConditions& normal_60F();
const NormalConditions& normal_eu_ied();
std::span<const NormalConditions> all_normal_conditions();

// Looks a preset up by key ("0C", "15C", "20C", "60F", "IED"); throws InputError naming the
// field, the text and the accepted keys.
const NormalConditions& normal_conditions_by_key(std::string_view key, std::string_view field);

// Normal conditions stated as a temperature and pressure ("25 degC, 101.325 kPa"), owning the texts
// its NormalConditions view: made once by stated_normal_conditions() and shared, never copied or
// moved (the views would dangle).
class StatedNormalConditions {
 public:
  StatedNormalConditions(double temperature_K, double pressure_Pa);
  StatedNormalConditions(const StatedNormalConditions&) = delete;
  StatedNormalConditions& operator=(const StatedNormalConditions&) = delete;
  [[nodiscard]] const NormalConditions& conditions() const { return conditions_; }

 private:
  std::string key_;          // "25degC/101.325kPa"
  std::string description_;  // "25 degC, 101.325 kPa (stated)"
  NormalConditions conditions_;
};

// Parses "25 degC, 101.325 kPa" (a temperature and a pressure, in either order) into shared stated
// conditions. Throws InputError naming `field` for another form, or a temperature outside 250-350 K or
// a pressure outside 80-120 kPa (typing errors, not reference states; common practice, no source).
std::shared_ptr<const StatedNormalConditions> stated_normal_conditions(std::string_view text, std::string_view field);

// An amount of gas expressed as a normal volume at named conditions.
class NormalVolume {
 public:
  static NormalVolume from_cubic_metres(double normal_m3, const NormalConditions& conditions);
  explicit NormalVolume(Amount amount) : amount_(amount) {}
  [[nodiscard]] Amount amount() const { return amount_; }
  [[nodiscard]] double cubic_metres(const NormalConditions& conditions) const;

 private:
  Amount amount_;
};

}  // namespace stackbound::units
