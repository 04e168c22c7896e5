#include "stackbound/core/element_amounts.hpp"

#include <fmt/format.h>

#include <cmath>

#include "stackbound/core/elements.hpp"
#include "stackbound/units/constants.hpp"
#include "stackbound/units/input_error.hpp"

namespace stackbound::core {

void ElementAmounts::add(const ElementAmounts& other, double factor) {
  for (std::size_t k = 0; k < kElementCount; ++k) moles[k] += factor * other.moles[k];
}

void ElementAmounts::add_species(const Species& species, double amount) {
  for (const ElementCount& count : species.composition()) {
    moles[element_index(count.element)] += amount * count.count;
  }
}

double ElementAmounts::total() const {
  double sum = 0.0;
  for (double m : moles) sum += m;
  return sum;
}

double ElementAmounts::of(std::string_view symbol) const { return moles[element_index(symbol)]; }

std::vector<std::string> ElementAmounts::present() const {
  std::vector<std::string> symbols;
  for (std::size_t k = 0; k < kElementCount; ++k) {
    if (moles[k] != 0.0) symbols.emplace_back(known_elements()[k].symbol);
  }
  return symbols;
}

namespace {
// Validates the feed entries; returns the species of each.
std::vector<const Species*> checked_feed(const SpeciesDatabase& db, std::span<const SpeciesAmount> feed,
                                         std::string_view field) {
  if (known_elements().size() != kElementCount) {
    throw std::logic_error("element_amounts: kElementCount does not match known_elements()");
  }
  if (feed.empty()) {
    throw units::InputError(
        fmt::format("{}: the feed is empty; give at least one species with a positive amount "
                    "(e.g. \"CH4 + 2 O2 + 7.52 N2\")",
                    field));
  }
  std::vector<const Species*> species;
  species.reserve(feed.size());
  bool any_positive = false;
  for (const SpeciesAmount& entry : feed) {
    const Species& s = db.at(entry.formula, field);
    if (!std::isfinite(entry.moles) || entry.moles < 0.0) {
      throw units::InputError(fmt::format("{}.{} = {} mol: the amount must be a finite number >= 0 mol", field,
                                          entry.formula, entry.moles));
    }
    any_positive = any_positive || entry.moles > 0.0;
    species.push_back(&s);
  }
  if (!any_positive) {
    throw units::InputError(
        fmt::format("{}: every amount is zero; at least one species needs a positive amount", field));
  }
  return species;
}
}  // namespace

ElementAmounts element_amounts(const SpeciesDatabase& db, std::span<const SpeciesAmount> feed, std::string_view field) {
  const std::vector<const Species*> species = checked_feed(db, feed, field);
  ElementAmounts amounts;
  for (std::size_t i = 0; i < feed.size(); ++i) amounts.add_species(*species[i], feed[i].moles);
  return amounts;
}

units::Energy feed_enthalpy(const SpeciesDatabase& db, std::span<const SpeciesAmount> feed,
                            units::Temperature temperature, std::string_view field) {
  const double temperature_K = temperature.value();
  const std::vector<const Species*> species = checked_feed(db, feed, field);
  if (!std::isfinite(temperature_K) || temperature_K <= 0.0) {
    throw units::InputError(
        fmt::format("{} temperature = {:g} K: must be a finite absolute temperature > 0 K", field, temperature_K));
  }
  double enthalpy_J = 0.0;
  for (std::size_t i = 0; i < feed.size(); ++i) {
    if (feed[i].moles == 0.0) continue;
    if (!species[i]->covers(temperature)) {
      throw units::InputError(fmt::format("{} temperature = {:g} K: outside the data range {:g}-{:g} K of {}", field,
                                          temperature_K, species[i]->range().low.value(),
                                          species[i]->range().high.value(), species[i]->formula()));
    }
    enthalpy_J += feed[i].moles * units::kGasConstant_J_per_mol_K * temperature_K *
                  species[i]->h_over_RT_unchecked(temperature_K);
  }
  return units::joules(enthalpy_J);
}

}  // namespace stackbound::core
