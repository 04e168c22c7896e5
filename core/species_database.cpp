#include "stackbound/core/species_database.hpp"

#include <algorithm>

#include <fmt/format.h>

#include "stackbound/units/input_error.hpp"
#include "stackbound/units/nearest_name.hpp"

namespace stackbound::core {

SpeciesDatabase::SpeciesDatabase(std::vector<Species> species) : species_(std::move(species)) {
  for (std::size_t i = 0; i < species_.size(); ++i) {
    for (std::size_t j = 0; j < i; ++j) {
      if (species_[i].formula() == species_[j].formula()) {
        throw units::InputError(fmt::format("species {}: defined twice", species_[i].formula()));
      }
    }
  }
}

SpeciesDatabase SpeciesDatabase::with(std::vector<Species> extra) const {
  std::vector<Species> merged = species_;
  for (Species& added : extra) {
    const auto same = std::find_if(merged.begin(), merged.end(),
                                   [&](const Species& s) { return s.formula() == added.formula(); });
    if (same != merged.end()) {
      *same = std::move(added);
    } else {
      merged.push_back(std::move(added));
    }
  }
  return SpeciesDatabase(std::move(merged));
}

const Species* SpeciesDatabase::find(std::string_view formula) const {
  const auto found = std::find_if(species_.begin(), species_.end(),
                                  [&](const Species& s) { return s.formula() == formula; });
  return found == species_.end() ? nullptr : &*found;
}

std::size_t SpeciesDatabase::index_of(std::string_view formula, std::string_view field) const {
  if (const Species* species = find(formula)) {
    return static_cast<std::size_t>(species - species_.data());
  }
  std::vector<std::string> names;
  names.reserve(species_.size());
  for (const Species& s : species_) names.push_back(s.formula());
  std::string message = fmt::format("{} = \"{}\": unknown species", field, formula);
  if (const auto suggestion = units::nearest_name(formula, names)) {
    message += fmt::format("; did you mean \"{}\"?", *suggestion);
  }
  message += fmt::format("; known species (formulas are case-sensitive): {}", fmt::join(names, ", "));
  throw units::InputError(message);
}

const Species& SpeciesDatabase::at(std::string_view formula, std::string_view field) const {
  return species_[index_of(formula, field)];
}

std::vector<const Species*> SpeciesDatabase::made_only_of(std::span<const std::string> elements) const {
  std::vector<const Species*> result;
  for (const Species& species : species_) {
    const bool all_present = std::all_of(
        species.composition().begin(), species.composition().end(), [&](const ElementCount& count) {
          return std::find(elements.begin(), elements.end(), count.element) != elements.end();
        });
    if (all_present) result.push_back(&species);
  }
  return result;
}

}  // namespace stackbound::core
