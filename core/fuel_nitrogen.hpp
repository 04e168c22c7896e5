#pragma once
// NO from the nitrogen bound in the fuel ("fuel NO"), by mass balance:
//   n_NO = f n_N,fuel,   0 <= f <= 1,
// with n_N,fuel the fuel-bound nitrogen per kg of as-fired fuel: all N of a liquid or solid fuel's
// ultimate analysis and of gas species other than N2 (molecular N2 in a fuel gas is inert, like the
// air's, and forms only thermal NO). f = 1 is the ceiling: every N atom of the fuel leaves as NO. A
// conversion fraction gives an estimate; typical bands by fuel class are listed below with their
// status. Real conversion depends on the N content, the firing (staging, excess air) and the
// fuel; a band is a screening range, not a prediction. Thermal NO (core/thermal_no.hpp) comes on top.

#include <optional>
#include <string>
#include <string_view>

#include "stackbound/core/combustion.hpp"
#include "stackbound/core/fuel.hpp"

namespace stackbound::core {

// Fuel classes with a typical conversion band in our sources.
enum class FuelNitrogenClass {
  oil,              // distillate and residual fuel oils
  pulverized_coal,  // pulverized-coal firing
};
[[nodiscard]] std::string_view to_string(FuelNitrogenClass fuel_class);

// A typical range of the conversion fraction f.
struct ConversionBand {
  double low_fraction = 0.0;
  double high_fraction = 0.0;
  std::string_view status;  // "typical"
  std::string_view source;  // where the band comes from, with its status
};

[[nodiscard]] ConversionBand typical_conversion_band(FuelNitrogenClass fuel_class);

// The class of a built-in fuel preset (core/fuel_presets.hpp): distillate_oil_no2 and
// residual_oil_no6 are oils, bituminous_coal is taken as pulverized-coal firing. Nothing for the gas
// presets (no fuel-bound nitrogen), for wood_chips (no band in our sources) and for unknown keys.
[[nodiscard]] std::optional<FuelNitrogenClass> fuel_nitrogen_class_of_preset(std::string_view preset_key);

// Fuel-bound nitrogen, mol N per kg of as-fired fuel (see the header comment).
[[nodiscard]] double fuel_bound_nitrogen_mol_per_kg(const Fuel& fuel);

// Molar masses of NO and of NO2 (NOx is commonly reported as NO2), kg/mol, from the IUPAC atomic weights
// of core/elements.hpp.
[[nodiscard]] double nitric_oxide_molar_mass_kg_per_mol();
[[nodiscard]] double nitrogen_dioxide_molar_mass_kg_per_mol();

struct FuelNitrogenNo {
  double fuel_nitrogen_mol_per_kg = 0.0;  // fuel-bound N
  double conversion_fraction = 0.0;       // f of the estimate
  std::string conversion_source;          // where f comes from (a band, a measurement, an assumption)
  double no_ceiling_mol_per_kg = 0.0;     // f = 1
  double no_estimate_mol_per_kg = 0.0;    // f as given

  [[nodiscard]] double no_ceiling_kg_per_kg() const {
    return no_ceiling_mol_per_kg * nitric_oxide_molar_mass_kg_per_mol();
  }
  [[nodiscard]] double no_estimate_kg_per_kg() const {
    return no_estimate_mol_per_kg * nitric_oxide_molar_mass_kg_per_mol();
  }
  // The same NO as NO2 mass (the usual NOx reporting basis), kg per kg of fuel.
  [[nodiscard]] double no_ceiling_as_no2_kg_per_kg() const {
    return no_ceiling_mol_per_kg * nitrogen_dioxide_molar_mass_kg_per_mol();
  }
  [[nodiscard]] double no_estimate_as_no2_kg_per_kg() const {
    return no_estimate_mol_per_kg * nitrogen_dioxide_molar_mass_kg_per_mol();
  }
};

// Ceiling and estimate for a conversion fraction 0 <= f <= 1. Throws units::InputError naming `field`
// for f outside [0, 1] or not finite (a conversion above 100 % would create nitrogen).
[[nodiscard]] FuelNitrogenNo fuel_nitrogen_no(const Fuel& fuel, double conversion_fraction,
                                              std::string conversion_source,
                                              std::string_view field = "fuel_nitrogen.conversion");

// The estimates at both ends of a typical band.
struct FuelNitrogenNoBand {
  ConversionBand band;
  FuelNitrogenNo low;
  FuelNitrogenNo high;
};
[[nodiscard]] FuelNitrogenNoBand fuel_nitrogen_no_band(const Fuel& fuel, FuelNitrogenClass fuel_class);

// Mole fraction in the flue gas of `no_mol_per_kg` (per kg of fuel), on the flue gas's wet or dry basis;
// the NO is taken as a trace (it does not change the flue moles).
[[nodiscard]] double fuel_no_mole_fraction(double no_mol_per_kg, const FlueGas& flue, GasBasis basis);

}  // namespace stackbound::core
