#include "stackbound/emissions/pollutant.hpp"

#include <algorithm>
#include <cctype>
#include <cmath>
#include <vector>

#include <fmt/format.h>

#include "stackbound/core/elements.hpp"
#include "stackbound/units/input_error.hpp"
#include "stackbound/units/nearest_name.hpp"

namespace stackbound::emissions {

namespace {

// Molar mass from IUPAC conventional atomic weights (core/elements.cpp).
double molar_mass_of(std::initializer_list<std::pair<std::string_view, int>> atoms) {
  double grams = 0.0;
  for (const auto& [symbol, count] : atoms) grams += count * core::element_by_symbol(symbol).atomic_weight_g_per_mol;
  return grams * 1e-3;
}

const std::vector<Pollutant>& table() {
  static const std::vector<Pollutant> pollutants = {
      {"CO", molar_mass_of({{"C", 1}, {"O", 1}}), false},
      {"NO", molar_mass_of({{"N", 1}, {"O", 1}}), false},
      {"NO2", molar_mass_of({{"N", 1}, {"O", 2}}), false},
      {"NOx", molar_mass_of({{"N", 1}, {"O", 2}}), true},
      {"SO2", molar_mass_of({{"S", 1}, {"O", 2}}), false},
      {"SO3", molar_mass_of({{"S", 1}, {"O", 3}}), false},
      {"CO2", molar_mass_of({{"C", 1}, {"O", 2}}), false},
      {"O2", molar_mass_of({{"O", 2}}), false},
      {"N2O", molar_mass_of({{"N", 2}, {"O", 1}}), false},
      {"NH3", molar_mass_of({{"N", 1}, {"H", 3}}), false},
      {"H2S", molar_mass_of({{"H", 2}, {"S", 1}}), false},
      {"HCN", molar_mass_of({{"H", 1}, {"C", 1}, {"N", 1}}), false},
      {"CH4", molar_mass_of({{"C", 1}, {"H", 4}}), false},
  };
  return pollutants;
}

}  // namespace

std::span<const Pollutant> known_pollutants() { return table(); }

std::optional<Pollutant> find_pollutant(std::string_view name) {
  const auto& pollutants = table();
  const auto found = std::find_if(pollutants.begin(), pollutants.end(), [&](const Pollutant& p) { return p.name == name; });
  if (found == pollutants.end()) return std::nullopt;
  return *found;
}

Pollutant pollutant_by_name(std::string_view name, std::string_view field) {
  if (auto found = find_pollutant(name)) return *found;
  std::vector<std::string> names;
  for (const Pollutant& p : table()) names.push_back(p.name);
  throw units::InputError(fmt::format("{} = \"{}\": unknown pollutant; known: {}", field, name, fmt::join(names, ", ")));
}

double no2_molar_mass_kg_per_mol() {
  static const double molar_mass = molar_mass_of({{"N", 1}, {"O", 2}});
  return molar_mass;
}

std::string pollutant_name_hint(std::string_view name) {
  std::vector<std::string> names;
  for (const Pollutant& p : table()) names.push_back(p.name);
  // Only close names: a two-letter name is not a typo of every other two-letter name.
  if (const auto suggestion = units::nearest_name(name, names)) {
    std::string a(name);
    std::string b(*suggestion);
    for (auto* text : {&a, &b}) {
      for (char& c : *text) c = static_cast<char>(std::tolower(static_cast<unsigned char>(c)));
    }
    if (*suggestion != name && units::edit_distance(a, b) <= std::max<std::size_t>(1, name.size() / 3)) {
      return fmt::format("; did you mean \"{}\"?", *suggestion);
    }
  }
  return "";
}

Pollutant resolve_pollutant(std::string_view name, std::optional<double> molar_mass_kg_per_mol, std::string_view field) {
  const bool valid_characters = std::all_of(name.begin(), name.end(), [](char c) {
    return std::isalnum(static_cast<unsigned char>(c)) != 0 || c == '(' || c == ')' || c == '-' || c == '_' || c == '.' ||
           c == '+';
  });
  if (name.empty() || name.size() > 32 || !valid_characters) {
    throw units::InputError(fmt::format("{} = \"{}\": not a pollutant name; use 1-32 letters, digits and ( ) - _ . +",
                                        field, name));
  }
  if (molar_mass_kg_per_mol && (!std::isfinite(*molar_mass_kg_per_mol) || *molar_mass_kg_per_mol <= 0.0 ||
                                *molar_mass_kg_per_mol > 10.0)) {
    throw units::InputError(fmt::format("{} molar mass = {} g/mol: must be above 0 and at most 10000 g/mol", field,
                                        *molar_mass_kg_per_mol * 1e3));
  }
  if (auto known = find_pollutant(name)) {
    if (molar_mass_kg_per_mol &&
        std::abs(*molar_mass_kg_per_mol - known->molar_mass_kg_per_mol) > 1e-3 * known->molar_mass_kg_per_mol) {
      throw units::InputError(fmt::format(
          "{} = \"{}\": built in with molar mass {:.3f} g/mol{}; the given {:.6g} g/mol disagrees (name a pollutant "
          "outside the built-in list to use another molar mass)",
          field, name, known->molar_mass_kg_per_mol * 1e3, known->expressed_as_no2 ? " (as NO2)" : "",
          *molar_mass_kg_per_mol * 1e3));
    }
    return *known;
  }
  return {std::string(name), molar_mass_kg_per_mol.value_or(0.0), false};
}

}  // namespace stackbound::emissions
