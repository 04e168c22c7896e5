#include "stackbound/core/elements.hpp"

#include <algorithm>
#include <array>
#include <string>

#include "stackbound/units/input_error.hpp"

namespace stackbound::core {

namespace {
// Conventional atomic weights. Source: IUPAC CIAAW, Standard atomic weights of the elements 2021,
// Pure Appl. Chem. 94 (2022) 573, Table 2 (abridged/conventional values); He is the standard value.
constexpr std::array<Element, 7> kElements{{
    {"C", 12.011},
    {"H", 1.008},
    {"O", 15.999},
    {"N", 14.007},
    {"S", 32.06},
    {"Ar", 39.95},
    {"He", 4.002602},
}};
}  // namespace

std::span<const Element> known_elements() { return kElements; }

std::size_t element_index(std::string_view symbol, std::string_view field) {
  const auto found = std::find_if(kElements.begin(), kElements.end(),
                                  [&](const Element& e) { return e.symbol == symbol; });
  if (found == kElements.end()) {
    std::string accepted;
    for (const Element& e : kElements) {
      if (!accepted.empty()) accepted += ", ";
        accepted += e.symbol;
    }
    throw units::InputError(std::string(field) + " = \"" + std::string(symbol) +
                            "\": unknown element; accepted symbols (case-sensitive): " + accepted);
  }
  return static_cast<std::size_t>(found - kElements.begin());
}

const Element& element_by_symbol(std::string_view symbol, std::string_view field) {
  return kElements[element_index(symbol, field)];
}

}  // namespace stackbound::core
