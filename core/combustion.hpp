#pragma once
// Complete-combustion stoichiometry of a fuel with an oxidant at an operating point, per kilogram of
// as-fired fuel, and the same scaled to a fuel feed rate.
//
// Method: element balance. The reactants (fuel + lambda x stoichiometric oxidant) burn to CO2, H2O,
// SO2, N2, Ar, He and the leftover O2 (lambda >= 1). Stoichiometric oxidant: the amount whose O2 equals
// the fuel's net O2 demand C + H/4 + S - O/2 (mol per kg; the oxidant's own CO2 and H2O need none).
// Sub-stoichiometric firing (lambda < 1): sulfur burns to SO2 and carbon at least to CO; the oxygen
// left over is shared between CO -> CO2 and H2 -> H2O by the water-gas-shift equilibrium
// CO + H2O = CO2 + H2 at a stated temperature (default 1700 K; common practice, no source), with K
// from the species data. That is a convention for a screening estimate, not the equilibrium of the
// flame; below the air ratio at which all carbon reaches CO (soot or unburned fuel) it is an error.
// Excess air from a measured flue O2 is solved in closed form: each mole of excess oxidant passes
// through unchanged, so x_O2 = e n_st x_O2,ox / (N_1 + e n_st (1 - x_H2O,ox if dry)), with N_1 the flue
// moles at lambda = 1.
// F-factors (US EPA 40 CFR 60 Appendix A-7, Method 19 definitions): flue volume of the stoichiometric
// products of the fuel with dry air per unit of HHV, at 20 degC and 101.325 kPa (68 degF, 29.92 inHg):
// Fd dry, Fw wet (water from the fuel's H and moisture; air dry), Fc the CO2 from the fuel's carbon.
// They are fuel properties: the oxidant and operating point do not change them.
// Water dew point: the temperature at which the flue's water partial pressure equals the saturation
// pressure (IAPWS-IF97, core/humidity.hpp). The acid (SO3/H2SO4) dew point is higher and not computed.

#include <array>
#include <optional>
#include <string>
#include <string_view>
#include <utility>
#include <vector>

#include "stackbound/core/fuel.hpp"
#include "stackbound/core/oxidant.hpp"
#include "stackbound/core/species_database.hpp"
#include "stackbound/units/quantities.hpp"
#include "stackbound/units/quantity_parser.hpp"

namespace stackbound::core {

enum class GasBasis { wet, dry };
std::string_view to_string(GasBasis basis);

// What fixes the amount of oxidant.
enum class AirSpecification {
  excess_air,         // value = excess air as a fraction, 0.15 = 15 %; lambda = 1 + value
  air_ratio,          // value = lambda (air-fuel ratio over the stoichiometric one)
  equivalence_ratio,  // value = phi = 1 / lambda
  flue_o2,            // value = measured flue O2 mole fraction (0.03 = 3 %) on flue_o2_basis
};

// Default water-gas-shift temperature for sub-stoichiometric flue gas, K (common practice, no source).
inline constexpr double kDefaultShiftTemperature_K = 1700.0;
// Largest accepted air ratio (lambda); beyond it an input is taken to be a unit mistake.
inline constexpr double kMaximumAirRatio = 100.0;

struct OperatingPoint {
  AirSpecification specification = AirSpecification::excess_air;
  double value = 0.0;
  GasBasis flue_o2_basis = GasBasis::dry;
  // Name of `value` in error messages, e.g. "operating_point.excess_air" or "--flue-o2".
  std::string field = "operating_point.excess_air";
  // Temperature of the fuel as fired (gas fuels from the species data; liquid/solid via c_p).
  units::Temperature fuel_temperature = units::kelvin(298.15);
  std::string fuel_temperature_field = "fuel.temperature";
  // Pressure of the flue gas where its dew point matters (stack, near atmospheric).
  units::Pressure flue_pressure = units::pascals(101325.0);
  // Temperature of the water-gas-shift split for lambda < 1.
  units::Temperature shift_temperature = units::kelvin(kDefaultShiftTemperature_K);

  static OperatingPoint with_excess_air(double fraction, std::string field = "operating_point.excess_air");
  static OperatingPoint with_air_ratio(double lambda, std::string field = "operating_point.lambda");
  static OperatingPoint with_equivalence_ratio(double phi, std::string field = "operating_point.phi");
  static OperatingPoint with_flue_o2(double fraction, GasBasis basis, std::string field = "operating_point.flue_o2");
};

// Species of the complete-combustion flue gas, in this order.
enum class FlueSpecies { CO2, CO, H2O, H2, O2, N2, SO2, Ar, He };
inline constexpr std::size_t kFlueSpeciesCount = 9;
inline constexpr std::array<std::string_view, kFlueSpeciesCount> kFlueSpeciesNames{"CO2", "CO", "H2O", "H2", "O2",
                                                                                   "N2",  "SO2", "Ar", "He"};

struct FlueGas {
  std::array<double, kFlueSpeciesCount> mol_per_kg{};  // per kg of as-fired fuel

  [[nodiscard]] double amount(FlueSpecies species) const { return mol_per_kg[static_cast<std::size_t>(species)]; }
  [[nodiscard]] double total_mol_per_kg(GasBasis basis) const;
  // Mole fraction on the basis; on the dry basis H2O is 0.
  [[nodiscard]] double mole_fraction(FlueSpecies species, GasBasis basis) const;
  // Species with a non-zero amount on the basis, with their mole fractions, in kFlueSpeciesNames order.
  [[nodiscard]] std::vector<std::pair<std::string, double>> mole_fractions(GasBasis basis) const;
  [[nodiscard]] double mass_kg_per_kg(GasBasis basis) const;
  // Element content, indexed like known_elements().
  [[nodiscard]] ElementMoles element_mol_per_kg() const;
};

// F-factors: m3 of gas at 20 degC and 101.325 kPa per J of HHV, with US-unit views.
struct FFactors {
  double fd_m3_per_J = 0.0;  // dry flue gas at stoichiometric
  double fw_m3_per_J = 0.0;  // wet flue gas at stoichiometric (fuel water; dry air)
  double fc_m3_per_J = 0.0;  // CO2 from the fuel's carbon

  [[nodiscard]] double fd_m3_per_GJ() const { return fd_m3_per_J * 1e9; }
  [[nodiscard]] double fw_m3_per_GJ() const { return fw_m3_per_J * 1e9; }
  [[nodiscard]] double fc_m3_per_GJ() const { return fc_m3_per_J * 1e9; }
  [[nodiscard]] double fd_dscf_per_MMBtu() const;
  [[nodiscard]] double fw_wscf_per_MMBtu() const;
  [[nodiscard]] double fc_scf_per_MMBtu() const;
};

// The F-factors of a fuel (see the header comment).
FFactors f_factors(const Fuel& fuel);

// Everything per kg of as-fired fuel.
struct CombustionResult {
  // Operating point.
  double air_ratio = 1.0;  // lambda
  [[nodiscard]] double excess_air() const { return air_ratio - 1.0; }
  [[nodiscard]] double equivalence_ratio() const { return 1.0 / air_ratio; }

  // Fuel.
  double hhv_J_per_kg = 0.0;
  double lhv_J_per_kg = 0.0;
  double fuel_temperature_K = 298.15;
  double ash_kg_per_kg = 0.0;

  // Oxidant (as supplied, with its water vapour, unless "dry").
  double oxidant_temperature_K = 298.15;
  double stoichiometric_oxidant_mol_per_kg = 0.0;
  double oxidant_mol_per_kg = 0.0;
  double stoichiometric_air_kg_per_kg = 0.0;        // dry oxidant (air), the usual air-fuel ratio
  double stoichiometric_oxidant_wet_kg_per_kg = 0.0;  // with its water vapour
  double oxidant_kg_per_kg = 0.0;                   // actual, with its water vapour
  double dry_oxidant_kg_per_kg = 0.0;               // actual, dry

  // Reactants, for the energy and element balances of an equilibrium calculation.
  ElementMoles fuel_element_mol_per_kg{};
  ElementMoles oxidant_element_mol_per_kg{};   // at the actual air ratio
  ElementMoles reactant_element_mol_per_kg{};  // fuel + oxidant
  double fuel_enthalpy_J_per_kg = 0.0;         // at fuel_temperature_K
  double oxidant_enthalpy_J_per_kg = 0.0;      // at oxidant_temperature_K, per kg of fuel
  double reactant_enthalpy_J_per_kg = 0.0;     // the sum

  // Complete-combustion products.
  FlueGas flue;
  double flue_o2_dry = 0.0;
  double flue_o2_wet = 0.0;
  double flue_co2_dry = 0.0;
  double moisture_fraction = 0.0;  // H2O mole fraction of the wet flue gas
  double flue_pressure_Pa = 101325.0;
  std::optional<double> water_dew_point_K;  // none when the flue gas holds no water
  double shift_temperature_K = kDefaultShiftTemperature_K;  // used only when air_ratio < 1

  FFactors f_factors;
  std::vector<units::Warning> warnings;  // the fuel's, plus those of this calculation

  // The temperatures and the pressure as quantities (the raw fields feed the renderers unchanged).
  [[nodiscard]] units::Temperature fuel_temperature() const { return units::kelvin(fuel_temperature_K); }
  [[nodiscard]] units::Temperature oxidant_temperature() const { return units::kelvin(oxidant_temperature_K); }
  [[nodiscard]] units::Pressure flue_pressure() const { return units::pascals(flue_pressure_Pa); }
  [[nodiscard]] units::Temperature shift_temperature() const { return units::kelvin(shift_temperature_K); }
  [[nodiscard]] std::optional<units::Temperature> water_dew_point() const {
    if (!water_dew_point_K) return std::nullopt;
    return units::kelvin(*water_dew_point_K);
  }
};

// The air ratio lambda for this fuel, oxidant and operating point. Throws units::InputError naming
// op.field for: excess air <= -100 %, lambda or phi <= 0 or lambda > kMaximumAirRatio, a flue O2 < 0 or
// at or above the oxidant's O2 on the same basis.
double resolve_air_ratio(const Fuel& fuel, const Oxidant& oxidant, const OperatingPoint& op);

// Moles of oxidant (as supplied) per kg of fuel at lambda = 1.
double stoichiometric_oxidant_mol_per_kg(const Fuel& fuel, const Oxidant& oxidant);

// The whole calculation. Throws units::InputError as resolve_air_ratio, for an air ratio too low for
// the complete-combustion model, or for temperatures outside the species data.
CombustionResult burn(const Fuel& fuel, const Oxidant& oxidant, const OperatingPoint& op,
                      const SpeciesDatabase& database);

// ---------------------------------------------------------------------------------------------------
// Feed rates

enum class HeatInputBasis { hhv, lhv };
std::string_view to_string(HeatInputBasis basis);

struct FuelFeed {
  double mass_flow_kg_per_s = 0.0;
  double heat_input_hhv_W = 0.0;
  double heat_input_lhv_W = 0.0;
  std::optional<double> molar_flow_mol_per_s;  // gas fuels only
  std::string given;                           // as the user gave it: "1.2 t/h (mass flow)"

  [[nodiscard]] units::MassFlow mass_flow() const { return units::kilograms_per_second(mass_flow_kg_per_s); }
  [[nodiscard]] std::optional<units::MolarFlow> molar_flow() const {
    if (!molar_flow_mol_per_s) return std::nullopt;
    return units::moles_per_second(*molar_flow_mol_per_s);
  }
  [[nodiscard]] units::Power heat_input(HeatInputBasis basis) const {
    return units::watts(basis == HeatInputBasis::hhv ? heat_input_hhv_W : heat_input_lhv_W);
  }
};

// A fuel rate given as a mass flow (kg/s ...), a molar or normal-volume flow (gas fuels only) or a
// heat input (W ...) on the named heating-value basis. Throws units::InputError naming `field` for
// other dimensions, a rate <= 0, or a molar flow of a fuel with a liquid or solid part.
FuelFeed resolve_feed(const Fuel& fuel, const units::ParsedQuantity& rate, HeatInputBasis basis = HeatInputBasis::hhv,
                      std::string_view field = "fuel.feed_rate");
// The same from text such as "1.2 t/h", "850 Nm3/h", "25 MW", "2.5 MMBtu/h".
FuelFeed resolve_feed(const Fuel& fuel, std::string_view rate_text, HeatInputBasis basis = HeatInputBasis::hhv,
                      std::string_view field = "fuel.feed_rate");

// A CombustionResult scaled to a feed.
struct CombustionRates {
  FuelFeed feed;
  double oxidant_mol_per_s = 0.0;
  double oxidant_kg_per_s = 0.0;
  std::array<double, kFlueSpeciesCount> flue_mol_per_s{};
  double flue_wet_mol_per_s = 0.0;
  double flue_dry_mol_per_s = 0.0;
  double flue_kg_per_s = 0.0;
  double ash_kg_per_s = 0.0;
  ElementMoles reactant_element_mol_per_s{};
  double reactant_enthalpy_W = 0.0;  // reactant enthalpy flow on the species data's scale

  // The flows as quantities (the raw fields stay for the renderers and the stages).
  [[nodiscard]] units::MolarFlow oxidant_flow() const { return units::moles_per_second(oxidant_mol_per_s); }
  [[nodiscard]] units::MassFlow oxidant_mass_flow() const { return units::kilograms_per_second(oxidant_kg_per_s); }
  [[nodiscard]] units::MolarFlow flue_flow(FlueSpecies species) const {
    return units::moles_per_second(flue_mol_per_s[static_cast<std::size_t>(species)]);
  }
  [[nodiscard]] units::MolarFlow flue_wet_flow() const { return units::moles_per_second(flue_wet_mol_per_s); }
  [[nodiscard]] units::MolarFlow flue_dry_flow() const { return units::moles_per_second(flue_dry_mol_per_s); }
  [[nodiscard]] units::MassFlow flue_mass_flow() const { return units::kilograms_per_second(flue_kg_per_s); }
  [[nodiscard]] units::MassFlow ash_mass_flow() const { return units::kilograms_per_second(ash_kg_per_s); }
  [[nodiscard]] units::Power reactant_enthalpy_flow() const { return units::watts(reactant_enthalpy_W); }
};

CombustionRates rates(const CombustionResult& result, const FuelFeed& feed);

}  // namespace stackbound::core
