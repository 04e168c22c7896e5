#pragma once
// Element totals of a feed of database species (b_k = sum_j a_kj n_j, the right-hand side of the
// element balances in Gordon & McBride, NASA RP-1311, 1994, eq. 2.2) and the feed's total enthalpy
// H = sum_j n_j h_j(T) from the species' NASA 7-coefficient data (standard state, 1 bar).

#include <array>
#include <cstddef>
#include <span>
#include <string>
#include <string_view>
#include <vector>

#include "stackbound/core/species_database.hpp"

namespace stackbound::core {

// Number of elements the tool knows (size of known_elements()).
inline constexpr std::size_t kElementCount = 7;

// Moles of each element, indexed like known_elements() (core/elements.hpp).
struct ElementAmounts {
  std::array<double, kElementCount> moles{};

  // Adds factor * other, element by element.
  void add(const ElementAmounts& other, double factor = 1.0);
  // Adds the atoms of `moles` mol of `species`.
  void add_species(const Species& species, double moles);
  // Sum over the elements (mol of atoms).
  [[nodiscard]] double total() const;
  // Moles of the element with this symbol; throws units::InputError for an unknown symbol.
  [[nodiscard]] double of(std::string_view symbol) const;
  // Symbols of the elements with a nonzero amount, in known_elements() order.
  [[nodiscard]] std::vector<std::string> present() const;
};

// One feed entry: a database species (formula as in the data file) and its amount in mol.
struct SpeciesAmount {
  std::string formula;
  double moles = 0.0;
};

// Element totals of the feed. Throws units::InputError naming `field` for an unknown species, a
// negative or non-finite amount, or an empty feed (no entries, or all amounts zero).
[[nodiscard]] ElementAmounts element_amounts(const SpeciesDatabase& db, std::span<const SpeciesAmount> feed,
                                             std::string_view field = "feed");

// Total enthalpy of the feed at `temperature` (includes enthalpies of formation). Throws
// units::InputError like element_amounts(), and when the temperature is outside a species' data range.
[[nodiscard]] units::Energy feed_enthalpy(const SpeciesDatabase& db, std::span<const SpeciesAmount> feed,
                                          units::Temperature temperature, std::string_view field = "feed");

}  // namespace stackbound::core
