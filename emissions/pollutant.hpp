#pragma once
// Pollutants that concentrations are stated for, with the molar mass used to turn a mole fraction
// into a mass concentration. NOx is reported "as NO2": its mass uses the molar mass of NO2 whatever
// the NO/NO2 split (US EPA 40 CFR 60.2 and Directive 2010/75/EU Annex V both state NOx as NO2).

#include <optional>
#include <span>
#include <string>
#include <string_view>

namespace stackbound::emissions {

struct Pollutant {
  std::string name;             // "CO", "NOx", "SO2", "NO", "NO2", "CO2", "O2"
  double molar_mass_kg_per_mol; // for NOx: that of NO2
  bool expressed_as_no2;        // true for NOx
};

// Built-in pollutants: CO, NO, NO2, NOx (as NO2), SO2, SO3, CO2, O2, N2O, NH3, H2S, HCN, CH4.
std::span<const Pollutant> known_pollutants();

// nullopt if unknown.
std::optional<Pollutant> find_pollutant(std::string_view name);

// Throws units::InputError naming the field, the name and the known pollutants.
Pollutant pollutant_by_name(std::string_view name, std::string_view field);

}  // namespace stackbound::emissions
