#pragma once
// One chemical species: formula, element composition, phase and NASA 7-coefficient polynomials
// (McBride, Gordon & Reno, NASA TM-4513, 1993):
//   cp/R = a1 + a2 T + a3 T^2 + a4 T^3 + a5 T^4
//   h/RT = a1 + a2 T/2 + a3 T^2/3 + a4 T^3/4 + a5 T^4/5 + a6/T
//   s/R  = a1 ln T + a2 T + a3 T^2/2 + a4 T^3/3 + a5 T^4/4 + a7
// at the standard-state pressure of 1 bar. h includes the enthalpy of formation at 298.15 K.
// Evaluation outside the record's temperature range is an error, never an extrapolation; the one
// allowance is 298.15 K for records whose range starts at 300 K (needed for ambient feeds).

#include <array>
#include <string>
#include <vector>

#include "stackbound/units/quantities.hpp"

namespace stackbound::core {

enum class Phase { gas, condensed };

struct ElementCount {
  std::string element;  // symbol, as in known_elements()
  double count = 0.0;   // atoms per molecule
};

struct TemperatureRange {
  units::Temperature low = units::kelvin(0.0);
  units::Temperature mid = units::kelvin(0.0);  // where the two polynomials meet
  units::Temperature high = units::kelvin(0.0);
};

using Nasa7 = std::array<double, 7>;

struct SpeciesRecord {
  std::string formula;                   // "CO2", "NO", "Ar", "C(gr)"
  std::vector<ElementCount> composition;
  Phase phase = Phase::gas;
  TemperatureRange range;
  Nasa7 below_mid{};
  Nasa7 above_mid{};
  std::string source;                    // key of the published source, e.g. "GRI30"
  std::string origin;                    // the record's own origin note in that source
};

class Species {
 public:
  // Validates the record (known elements, positive counts, ordered range, finite coefficients);
  // throws units::InputError naming the species and the broken rule.
  explicit Species(SpeciesRecord record);

  [[nodiscard]] const std::string& formula() const { return record_.formula; }
  [[nodiscard]] const std::vector<ElementCount>& composition() const { return record_.composition; }
  [[nodiscard]] Phase phase() const { return record_.phase; }
  [[nodiscard]] bool is_gas() const { return record_.phase == Phase::gas; }
  [[nodiscard]] const TemperatureRange& range() const { return record_.range; }
  [[nodiscard]] const std::string& source() const { return record_.source; }
  [[nodiscard]] const SpeciesRecord& record() const { return record_; }

  [[nodiscard]] double molar_mass_kg_per_mol() const { return molar_mass_kg_per_mol_; }
  [[nodiscard]] units::MolarMass molar_mass() const;
  // Atoms of `element` per molecule (0 if absent).
  [[nodiscard]] double atoms_of(std::string_view element) const;

  // True where the polynomials may be evaluated (the range, plus 298.15 K for 300 K records).
  [[nodiscard]] bool covers(units::Temperature temperature) const;
  // Throws units::InputError: 'species NO: temperature 6500 K is outside its data range 200-6000 K'.
  void check_temperature(units::Temperature temperature) const;

  // Dimensionless standard-state properties; these check the range.
  [[nodiscard]] double cp_over_R(units::Temperature temperature) const;
  [[nodiscard]] double h_over_RT(units::Temperature temperature) const;
  [[nodiscard]] double s_over_R(units::Temperature temperature) const;
  [[nodiscard]] double g_over_RT(units::Temperature temperature) const;  // h/RT - s/R

  // The same without the range check, for solver inner loops that checked the range once; they take
  // raw kelvins because they are the inner loop.
  [[nodiscard]] double cp_over_R_unchecked(double temperature_K) const;
  [[nodiscard]] double h_over_RT_unchecked(double temperature_K) const;
  [[nodiscard]] double s_over_R_unchecked(double temperature_K) const;
  [[nodiscard]] double g_over_RT_unchecked(double temperature_K) const;

  // SI quantities at T (standard state, 1 bar).
  [[nodiscard]] units::MolarEntropy heat_capacity(units::Temperature temperature) const;
  [[nodiscard]] units::MolarEnergy enthalpy(units::Temperature temperature) const;
  [[nodiscard]] units::MolarEntropy entropy(units::Temperature temperature) const;
  [[nodiscard]] units::MolarEnergy gibbs_energy(units::Temperature temperature) const;

 private:
  [[nodiscard]] const Nasa7& coefficients_for(double temperature_K) const {
    return temperature_K < record_.range.mid.value() ? record_.below_mid : record_.above_mid;
  }

  SpeciesRecord record_;
  double molar_mass_kg_per_mol_ = 0.0;
};

}  // namespace stackbound::core
