#pragma once
// The set of species the tool may use: the built-in data (cases/builtin_species.hpp) plus any user
// file. A value type: adding species returns a new database.

#include <span>
#include <string>
#include <string_view>
#include <vector>

#include "stackbound/core/species.hpp"

namespace stackbound::core {

class SpeciesDatabase {
 public:
  SpeciesDatabase() = default;
  // Throws units::InputError if two species share a formula.
  explicit SpeciesDatabase(std::vector<Species> species);

  // A copy with `extra` added; a species of the same formula replaces the existing one.
  [[nodiscard]] SpeciesDatabase with(std::vector<Species> extra) const;

  [[nodiscard]] std::span<const Species> all() const { return species_; }
  [[nodiscard]] std::size_t size() const { return species_.size(); }

  // nullptr when absent.
  [[nodiscard]] const Species* find(std::string_view formula) const;
  // Throws units::InputError: '<field> = "co2": unknown species; did you mean "CO2"? Known species: ...'
  [[nodiscard]] const Species& at(std::string_view formula, std::string_view field = "species") const;
  // Index in all(); throws like at().
  [[nodiscard]] std::size_t index_of(std::string_view formula, std::string_view field = "species") const;

  // Every species all of whose elements are among `elements` (symbols), in database order.
  [[nodiscard]] std::vector<const Species*> made_only_of(std::span<const std::string> elements) const;

 private:
  std::vector<Species> species_;
};

}  // namespace stackbound::core
