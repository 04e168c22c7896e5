#pragma once
// Chemical elements the tool handles, with their standard atomic weights.

#include <span>
#include <string_view>

namespace stackbound::core {

struct Element {
  std::string_view symbol;
  double atomic_weight_g_per_mol;
};

// The elements known to the tool (C, H, O, N, S, Ar, He), in a fixed order that the equilibrium
// solver also uses for its element-balance rows.
std::span<const Element> known_elements();

// The element with this symbol (case-sensitive: "Ar", not "AR"); throws units::InputError naming the
// field, the symbol and the accepted symbols.
const Element& element_by_symbol(std::string_view symbol, std::string_view field = "element");

// Index of the element in known_elements(); throws like element_by_symbol.
std::size_t element_index(std::string_view symbol, std::string_view field = "element");

}  // namespace stackbound::core
