#include "stackbound/core/oxidant.hpp"

#include <cmath>
#include <numeric>

#include <fmt/format.h>

#include "stackbound/core/elements.hpp"
#include "stackbound/core/humidity.hpp"
#include "stackbound/units/constants.hpp"
#include "stackbound/units/input_error.hpp"

namespace stackbound::core {

namespace {

// Indices of the species this file reads by name (the order of OxidantSpecies).
constexpr std::size_t kO2 = static_cast<std::size_t>(OxidantSpecies::O2);
constexpr std::size_t kH2O = static_cast<std::size_t>(OxidantSpecies::H2O);
constexpr double kLowestOxidantTemperature_K = 200.0;
constexpr double kHighestOxidantTemperature_K = 3000.0;

double weight(std::string_view symbol) { return element_by_symbol(symbol).atomic_weight_g_per_mol * 1e-3; }

// Molar masses of N2, O2, Ar, CO2, H2O from the IUPAC atomic weights (core/elements.hpp), kg/mol.
std::array<double, kOxidantSpeciesCount> species_molar_masses() {
  return {2.0 * weight("N"), 2.0 * weight("O"), weight("Ar"), weight("C") + 2.0 * weight("O"),
          2.0 * weight("H") + weight("O")};
}

double dry_air_molar_mass_kg_per_mol() {
  const auto masses = species_molar_masses();
  const auto& air = standard_dry_air();
  double m = 0.0;
  for (std::size_t i = 0; i < kOxidantSpeciesCount; ++i) m += air[i] * masses[i];
  return m;
}

}  // namespace

const std::array<double, kOxidantSpeciesCount>& standard_dry_air() {
  // U.S. Standard Atmosphere, 1976, Table 3, sea-level mole fractions (from memory), normalised.
  static const std::array<double, kOxidantSpeciesCount> air = [] {
    std::array<double, kOxidantSpeciesCount> published{0.78084, 0.209476, 0.00934, 0.000314, 0.0};
    const double sum = std::accumulate(published.begin(), published.end(), 0.0);
    for (double& x : published) x /= sum;
    return published;
  }();
  return air;
}

std::string_view standard_dry_air_source() {
  return "U.S. Standard Atmosphere, 1976, Table 3 (N2 78.084, O2 20.9476, Ar 0.934, CO2 0.0314 mole %; from "
         "memory), trace gases left out, normalised";
}

// ---------------------------------------------------------------------------------------------------

Humidity Humidity::dry() { return Humidity(0.0, "dry"); }

Humidity Humidity::relative(double relative_humidity, units::Temperature ambient_temperature,
                            units::Pressure ambient_pressure, std::string field) {
  if (!std::isfinite(relative_humidity) || relative_humidity < 0.0 || relative_humidity > 1.0) {
    throw units::InputError(fmt::format("{} = {:.6g} %: must be between 0 % and 100 %", field, relative_humidity * 100.0));
  }
  const double T = ambient_temperature.value();
  const double p = ambient_pressure.value();
  if (!std::isfinite(p) || p <= 0.0) {
    throw units::InputError(fmt::format("{}: ambient pressure {:.6g} Pa must be above 0", field, p));
  }
  const double saturation = water_vapour_pressure(ambient_temperature, field + " (ambient temperature)").value();
  const double partial = relative_humidity * saturation;
  if (partial >= p) {
    throw units::InputError(fmt::format("{} = {:.4g} % at {:.2f} K: the water vapour pressure ({:.6g} Pa) would reach "
                                        "the ambient pressure ({:.6g} Pa); give the humidity where the air is drawn in",
                                        field, relative_humidity * 100.0, T, partial, p));
  }
  const double x = partial / p;
  return Humidity(x / (1.0 - x), fmt::format("relative humidity {:.4g} % at {:.2f} K and {:.6g} kPa (saturation "
                                             "pressure: {})",
                                             relative_humidity * 100.0, T, p * 1e-3,
                                             T < kWaterTriplePoint_K ? "over ice, IAPWS R14-08(2011)"
                                                                     : "IAPWS-IF97 Eq. 30"));
}

Humidity Humidity::ratio(double kg_water_per_kg_dry_air, std::string field) {
  if (!std::isfinite(kg_water_per_kg_dry_air) || kg_water_per_kg_dry_air < 0.0 || kg_water_per_kg_dry_air > 0.5) {
    throw units::InputError(fmt::format("{} = {:.6g} kg/kg: must be between 0 and 0.5 kg water per kg dry air (ambient "
                                        "air holds about 0.001-0.03)",
                                        field, kg_water_per_kg_dry_air));
  }
  const double water_molar_mass = species_molar_masses()[kH2O];
  return Humidity(kg_water_per_kg_dry_air * dry_air_molar_mass_kg_per_mol() / water_molar_mass,
                  fmt::format("humidity ratio {:.6g} kg water per kg dry air", kg_water_per_kg_dry_air));
}

double Humidity::humidity_ratio() const {
  return water_per_dry_air_ * species_molar_masses()[kH2O] / dry_air_molar_mass_kg_per_mol();
}

// ---------------------------------------------------------------------------------------------------

Oxidant::Oxidant(const OxidantOptions& options)
    : temperature_(options.temperature), humidity_(options.humidity), enriched_o2_fraction_(options.enriched_o2_fraction) {
  const double T = temperature_.value();
  if (!std::isfinite(T) || T < kLowestOxidantTemperature_K || T > kHighestOxidantTemperature_K) {
    throw units::InputError(fmt::format("{} = {:.6g} K: must be between {} K and {} K", options.temperature_field, T,
                                        kLowestOxidantTemperature_K, kHighestOxidantTemperature_K));
  }
  const auto& air = standard_dry_air();
  // Fraction of the dry oxidant that is air; the rest is the added O2.
  double air_share = 1.0;
  if (enriched_o2_fraction_) {
    const double target = *enriched_o2_fraction_;
    if (!std::isfinite(target) || target < air[kO2] - 1e-12 || target > 1.0) {
      throw units::InputError(fmt::format("{} = {:.6g} %: the dry O2 content after enrichment must be "
                                          "between {:.4g} % (air) and 100 % (pure oxygen)",
                                          options.enrichment_field, target * 100.0, air[kO2] * 100.0));
    }
    air_share = std::max(0.0, (1.0 - target) / (1.0 - air[kO2]));
  }
  const double water = air_share * humidity_.water_mol_per_mol_dry_air();
  for (std::size_t i = 0; i < kOxidantSpeciesCount; ++i) wet_[i] = air_share * air[i];
  wet_[kO2] += 1.0 - air_share;
  wet_[kH2O] = water;
  for (double& x : wet_) x /= 1.0 + water;
}

double Oxidant::dry_mole_fraction(OxidantSpecies species) const {
  if (species == OxidantSpecies::H2O) return 0.0;
  return wet_[static_cast<std::size_t>(species)] / (1.0 - wet_[kH2O]);
}

double Oxidant::molar_mass_kg_per_mol() const {
  const auto masses = species_molar_masses();
  double m = 0.0;
  for (std::size_t i = 0; i < kOxidantSpeciesCount; ++i) m += wet_[i] * masses[i];
  return m;
}

double Oxidant::dry_molar_mass_kg_per_mol() const {
  const auto masses = species_molar_masses();
  return (molar_mass_kg_per_mol() - wet_[kH2O] * masses[kH2O]) / (1.0 - wet_[kH2O]);
}

double Oxidant::enthalpy_J_per_mol(const SpeciesDatabase& database) const {
  const double T = temperature_.value();
  double h = 0.0;
  for (std::size_t i = 0; i < kOxidantSpeciesCount; ++i) {
    if (wet_[i] == 0.0) continue;
    h += wet_[i] * units::kGasConstant_J_per_mol_K * T *
         database.at(kOxidantSpeciesNames[i], "oxidant species").h_over_RT(temperature_);
  }
  return h;
}

std::string Oxidant::description() const {
  std::string text = enriched_o2_fraction_
                         ? (*enriched_o2_fraction_ >= 1.0 ? std::string("pure oxygen")
                                                          : fmt::format("air enriched to {:.4g} % O2 (dry)",
                                                                        *enriched_o2_fraction_ * 100.0))
                         : std::string("air");
  text += fmt::format(", {}; supplied at {:.2f} K", humidity_.description(), temperature_.value());
  return text;
}

}  // namespace stackbound::core
