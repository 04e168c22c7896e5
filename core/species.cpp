#include "stackbound/core/species.hpp"

#include <cmath>

#include <fmt/format.h>

#include "stackbound/core/elements.hpp"
#include "stackbound/units/constants.hpp"
#include "stackbound/units/input_error.hpp"

namespace stackbound::core {

namespace {
constexpr double kR = units::kGasConstant_J_per_mol_K;
// Records fitted from 300 K may be evaluated at the standard temperature (ambient feeds); the
// polynomial is smooth and the 1.85 K step is far inside the fit's accuracy.
constexpr double kStandardTemperatureAllowance_K = 300.0;

void require(bool condition, const std::string& formula, std::string_view rule) {
  if (!condition) {
    throw units::InputError(fmt::format("species {}: {}", formula.empty() ? "(unnamed)" : formula, rule));
  }
}
}  // namespace

Species::Species(SpeciesRecord record) : record_(std::move(record)) {
  const std::string& name = record_.formula;
  require(!name.empty(), name, "the formula is empty");
  require(!record_.composition.empty(), name, "the composition lists no elements");
  for (const ElementCount& count : record_.composition) {
    const Element& element = element_by_symbol(count.element, fmt::format("species {}: composition", name));
    require(std::isfinite(count.count) && count.count > 0.0, name,
            fmt::format("the count of {} must be a positive number", count.element));
    molar_mass_kg_per_mol_ += count.count * element.atomic_weight_g_per_mol * 1e-3;
  }
  const double low_K = record_.range.low.value();
  const double mid_K = record_.range.mid.value();
  const double high_K = record_.range.high.value();
  require(std::isfinite(low_K) && std::isfinite(high_K) && low_K > 0.0 && low_K <= mid_K && mid_K <= high_K &&
              low_K < high_K,
          name,
          fmt::format("the temperature range {}-{}-{} K must satisfy 0 < low <= mid <= high", low_K, mid_K, high_K));
  for (const Nasa7* set : {&record_.below_mid, &record_.above_mid}) {
    for (double a : *set) {
      require(std::isfinite(a), name, "a NASA coefficient is not a finite number");
    }
  }
}

units::MolarMass Species::molar_mass() const { return units::kilograms_per_mole(molar_mass_kg_per_mol_); }

double Species::atoms_of(std::string_view element) const {
  for (const ElementCount& count : record_.composition) {
    if (count.element == element) return count.count;
  }
  return 0.0;
}

bool Species::covers(units::Temperature temperature) const {
  const double temperature_K = temperature.value();
  const double low_K = record_.range.low.value();
  if (!std::isfinite(temperature_K)) return false;
  if (temperature_K >= low_K && temperature_K <= record_.range.high.value()) return true;
  return low_K == kStandardTemperatureAllowance_K && temperature_K == units::kReferenceTemperature_K;
}

void Species::check_temperature(units::Temperature temperature) const {
  if (!covers(temperature)) {
    throw units::InputError(fmt::format("species {}: temperature {:g} K is outside its data range {:g}-{:g} K",
                                        record_.formula, temperature.value(), record_.range.low.value(),
                                        record_.range.high.value()));
  }
}

double Species::cp_over_R_unchecked(double T) const {
  const Nasa7& a = coefficients_for(T);
  return a[0] + T * (a[1] + T * (a[2] + T * (a[3] + T * a[4])));
}

double Species::h_over_RT_unchecked(double T) const {
  const Nasa7& a = coefficients_for(T);
  return a[0] + T * (a[1] / 2 + T * (a[2] / 3 + T * (a[3] / 4 + T * a[4] / 5))) + a[5] / T;
}

double Species::s_over_R_unchecked(double T) const {
  const Nasa7& a = coefficients_for(T);
  return a[0] * std::log(T) + T * (a[1] + T * (a[2] / 2 + T * (a[3] / 3 + T * a[4] / 4))) + a[6];
}

double Species::g_over_RT_unchecked(double T) const { return h_over_RT_unchecked(T) - s_over_R_unchecked(T); }

double Species::cp_over_R(units::Temperature temperature) const {
  check_temperature(temperature);
  return cp_over_R_unchecked(temperature.value());
}
double Species::h_over_RT(units::Temperature temperature) const {
  check_temperature(temperature);
  return h_over_RT_unchecked(temperature.value());
}
double Species::s_over_R(units::Temperature temperature) const {
  check_temperature(temperature);
  return s_over_R_unchecked(temperature.value());
}
double Species::g_over_RT(units::Temperature temperature) const {
  check_temperature(temperature);
  return g_over_RT_unchecked(temperature.value());
}

units::MolarEntropy Species::heat_capacity(units::Temperature temperature) const {
  return units::joules_per_mole_kelvin(kR * cp_over_R(temperature));
}
units::MolarEnergy Species::enthalpy(units::Temperature temperature) const {
  const double T = temperature.value();
  return units::joules_per_mole(kR * T * h_over_RT(temperature));
}
units::MolarEntropy Species::entropy(units::Temperature temperature) const {
  return units::joules_per_mole_kelvin(kR * s_over_R(temperature));
}
units::MolarEnergy Species::gibbs_energy(units::Temperature temperature) const {
  const double T = temperature.value();
  return units::joules_per_mole(kR * T * g_over_RT(temperature));
}

}  // namespace stackbound::core
