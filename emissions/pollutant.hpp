#pragma once
// Pollutants that concentrations are stated for, with the molar mass used to turn a mole fraction
// into a mass concentration. NOx is reported "as NO2": its mass uses the molar mass of NO2 whatever
// the NO/NO2 split (US EPA 40 CFR 60.2 and Directive 2010/75/EU Annex V both state NOx as NO2).
// A pollutant outside the built-in list may be named with or without a molar mass; without one,
// only mole-basis conversions (ppmv, wet/dry, O2) are possible and mass conversions are refused.

#include <optional>
#include <span>
#include <string>
#include <string_view>

namespace stackbound::emissions {

struct Pollutant {
  std::string name;             // "CO", "NOx", "SO2", "NO", "NO2", "CO2", "O2"
  double molar_mass_kg_per_mol; // for NOx: that of NO2; 0 when unknown (a user-named pollutant without one)
  bool expressed_as_no2;        // true for NOx

  [[nodiscard]] bool has_molar_mass() const { return molar_mass_kg_per_mol > 0.0; }
  // NO, NO2 or NOx: the pollutants that may be expressed as NO2.
  [[nodiscard]] bool is_nitrogen_oxide() const { return name == "NO" || name == "NO2" || name == "NOx"; }
};

// Built-in pollutants: CO, NO, NO2, NOx (as NO2), SO2, SO3, CO2, O2, N2O, NH3, H2S, HCN, CH4.
std::span<const Pollutant> known_pollutants();

// nullopt if unknown.
std::optional<Pollutant> find_pollutant(std::string_view name);

// Throws units::InputError naming the field, the name and the known pollutants.
Pollutant pollutant_by_name(std::string_view name, std::string_view field);

// Molar mass of NO2 (IUPAC conventional atomic weights), kg/mol: the mass basis of "as NO2".
double no2_molar_mass_kg_per_mol();

// A built-in pollutant, or a user-named one. For a built-in name, a given molar mass must agree with
// the built-in one within 0.1 % (otherwise InputError: the name is taken); for another name the
// molar mass is optional (then has_molar_mass() is false). Names are 1-32 characters of letters,
// digits and ( ) - _ . + ; anything else is an InputError naming the field.
Pollutant resolve_pollutant(std::string_view name, std::optional<double> molar_mass_kg_per_mol, std::string_view field);

// "; did you mean "NOx"?" for "NOX", "" when no built-in name is close: a hint for messages about unknown names.
std::string pollutant_name_hint(std::string_view name);

}  // namespace stackbound::emissions
