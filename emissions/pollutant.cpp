#include "emissions/pollutant.hpp"

#include <algorithm>
#include <vector>

#include <fmt/format.h>

#include "core/elements.hpp"
#include "units/input_error.hpp"

namespace stackbound::emissions {

namespace {

// Molar mass from IUPAC conventional atomic weights (core/elements.cpp).
double molar_mass(std::initializer_list<std::pair<std::string_view, int>> atoms) {
  double grams = 0.0;
  for (const auto& [symbol, count] : atoms) grams += count * core::element_by_symbol(symbol).atomic_weight_g_per_mol;
  return grams * 1e-3;
}

const std::vector<Pollutant>& table() {
  static const std::vector<Pollutant> pollutants = {
      {"CO", molar_mass({{"C", 1}, {"O", 1}}), false},
      {"NO", molar_mass({{"N", 1}, {"O", 1}}), false},
      {"NO2", molar_mass({{"N", 1}, {"O", 2}}), false},
      {"NOx", molar_mass({{"N", 1}, {"O", 2}}), true},
      {"SO2", molar_mass({{"S", 1}, {"O", 2}}), false},
      {"SO3", molar_mass({{"S", 1}, {"O", 3}}), false},
      {"CO2", molar_mass({{"C", 1}, {"O", 2}}), false},
      {"O2", molar_mass({{"O", 2}}), false},
      {"N2O", molar_mass({{"N", 2}, {"O", 1}}), false},
      {"NH3", molar_mass({{"N", 1}, {"H", 3}}), false},
      {"H2S", molar_mass({{"H", 2}, {"S", 1}}), false},
      {"HCN", molar_mass({{"H", 1}, {"C", 1}, {"N", 1}}), false},
      {"CH4", molar_mass({{"C", 1}, {"H", 4}}), false},
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

}  // namespace stackbound::emissions
