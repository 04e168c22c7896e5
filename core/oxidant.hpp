#pragma once
// The oxidant fed with the fuel: dry air of standard composition, optionally enriched with pure O2,
// carrying water vapour, at a temperature (ambient or preheated).
//
// Dry air: N2 78.084, O2 20.9476, Ar 0.934, CO2 0.0314 mole % - the sea-level composition of the
// U.S. Standard Atmosphere, 1976 (NOAA/NASA/USAF), Table 3 (from memory); the trace gases (Ne, He,
// Kr, Xe, CH4, H2; together 0.0027 %) are left out and the four are normalised to 100 %. Present-day
// CO2 (about 0.042 %) is higher than the 1976 figure; the difference moves flue CO2 by < 0.01 point.
// Enrichment: pure O2 is added to the dry air until its dry O2 mole fraction is the target.
// Humidity: water vapour per mole of dry air, from a relative humidity at an ambient temperature and
// pressure (x_H2O = RH p_sat(T) / p, p_sat from IAPWS-IF97 Eq. 30 - over ice below 273.16 K, see
// core/humidity.hpp) or from a humidity ratio (kg water per kg dry air). The added O2 is dry.
// Ideal gases; the enhancement factor of moist air is left out.

#include <array>
#include <optional>
#include <string>
#include <string_view>

#include "stackbound/core/species_database.hpp"
#include "stackbound/units/quantities.hpp"

namespace stackbound::core {

// The species an oxidant holds, in this order.
enum class OxidantSpecies { N2, O2, Ar, CO2, H2O };
inline constexpr std::size_t kOxidantSpeciesCount = 5;
inline constexpr std::array<std::string_view, kOxidantSpeciesCount> kOxidantSpeciesNames{"N2", "O2", "Ar", "CO2",
                                                                                         "H2O"};

// Mole fractions of standard dry air (normalised; see the header comment for the source).
const std::array<double, kOxidantSpeciesCount>& standard_dry_air();
std::string_view standard_dry_air_source();

// Water vapour carried by the air.
class Humidity {
 public:
  // No water vapour.
  static Humidity dry();
  // Relative humidity (0..1) measured at `ambient_temperature` and `ambient_pressure`. Throws
  // units::InputError naming `field` when RH is outside 0-100 %, the temperature is outside the
  // saturation equations' range (50-647.096 K), or the water partial pressure would reach the pressure.
  static Humidity relative(double relative_humidity, units::Temperature ambient_temperature,
                           units::Pressure ambient_pressure, std::string field = "air.relative_humidity");
  // Humidity ratio, kg water per kg dry air (0 <= w <= 0.5). Throws units::InputError naming `field`.
  static Humidity ratio(double kg_water_per_kg_dry_air, std::string field = "air.humidity_ratio");

  // Moles of water vapour per mole of dry air.
  [[nodiscard]] double water_mol_per_mol_dry_air() const { return water_per_dry_air_; }
  // Humidity ratio, kg water per kg of standard dry air.
  [[nodiscard]] double humidity_ratio() const;
  // For reports: "dry", "relative humidity 60 % at 293.15 K and 101.325 kPa (IAPWS-IF97 Eq. 30)" ...
  [[nodiscard]] const std::string& description() const { return description_; }
  [[nodiscard]] bool is_dry() const { return water_per_dry_air_ == 0.0; }

 private:
  Humidity(double water_per_dry_air, std::string description)
      : water_per_dry_air_(water_per_dry_air), description_(std::move(description)) {}
  double water_per_dry_air_ = 0.0;
  std::string description_;
};

struct OxidantOptions {
  // Temperature of the oxidant where it meets the fuel (ambient, or after a preheater). Default 298.15 K.
  units::Temperature temperature = units::kelvin(298.15);
  // Water vapour; default dry.
  Humidity humidity = Humidity::dry();
  // Dry-basis O2 mole fraction after adding pure O2 (e.g. 0.25); nothing = plain air. Must lie
  // between the air's 0.2095 and 1 (pure oxygen).
  std::optional<double> enriched_o2_fraction;
  // Names of the two fields in error messages (case-file paths or command-line options).
  std::string temperature_field = "air.temperature";
  std::string enrichment_field = "air.o2_enrichment";
};

class Oxidant {
 public:
  // Throws units::InputError naming the field for an enrichment outside 20.95-100 % or a temperature
  // outside 200-3000 K.
  explicit Oxidant(const OxidantOptions& options = {});

  // Mole fractions including water vapour, and on a dry basis (H2O excluded).
  [[nodiscard]] double mole_fraction(OxidantSpecies species) const { return wet_[static_cast<std::size_t>(species)]; }
  [[nodiscard]] double dry_mole_fraction(OxidantSpecies species) const;
  [[nodiscard]] const std::array<double, kOxidantSpeciesCount>& mole_fractions() const { return wet_; }
  [[nodiscard]] double o2_wet() const { return mole_fraction(OxidantSpecies::O2); }
  [[nodiscard]] double o2_dry() const { return dry_mole_fraction(OxidantSpecies::O2); }
  [[nodiscard]] double water_mole_fraction() const { return mole_fraction(OxidantSpecies::H2O); }
  // Molar mass of the oxidant as supplied (with its water), and of its dry part, kg/mol.
  [[nodiscard]] double molar_mass_kg_per_mol() const;
  [[nodiscard]] double dry_molar_mass_kg_per_mol() const;
  [[nodiscard]] units::MolarMass molar_mass() const { return units::kilograms_per_mole(molar_mass_kg_per_mol()); }
  [[nodiscard]] units::MolarMass dry_molar_mass() const {
    return units::kilograms_per_mole(dry_molar_mass_kg_per_mol());
  }

  [[nodiscard]] units::Temperature temperature() const { return temperature_; }
  [[nodiscard]] double temperature_K() const { return temperature_.value(); }
  [[nodiscard]] const Humidity& humidity() const { return humidity_; }
  [[nodiscard]] std::optional<double> enriched_o2_fraction() const { return enriched_o2_fraction_; }

  // Molar enthalpy at the oxidant's temperature on the species data's scale, J/mol.
  [[nodiscard]] double enthalpy_J_per_mol(const SpeciesDatabase& database) const;
  [[nodiscard]] units::MolarEnergy enthalpy(const SpeciesDatabase& database) const {
    return units::joules_per_mole(enthalpy_J_per_mol(database));
  }

  // One line for reports: "air, dry; supplied at 298.15 K".
  [[nodiscard]] std::string description() const;

 private:
  std::array<double, kOxidantSpeciesCount> wet_{};
  units::Temperature temperature_;
  Humidity humidity_;
  std::optional<double> enriched_o2_fraction_;
};

}  // namespace stackbound::core
