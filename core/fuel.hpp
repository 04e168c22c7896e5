#pragma once
// A fuel as fired, described per kilogram: its element content, heating values (HHV and LHV at
// 298.15 K) and its enthalpy on the species data's scale (elements in their reference states have
// h = 0 at 298.15 K), so that the reactants of a flame can enter an energy balance.
//
// Three kinds, which may be blended:
//  - Gas fuels: mole % or mass % of gas species in the SpeciesDatabase. Heating values follow from
//    the species' enthalpies at 298.15 K (products CO2, H2O, SO2, N2; for the HHV all water, including
//    water vapour in the fuel gas, condensed, the convention of ISO 6976 - from memory). Ideal gas.
//  - Liquid and solid fuels: ultimate analysis (C, H, O, N, S, ash, moisture by mass) on an
//    as-received, dry or dry-ash-free basis, and a heating value, measured (HHV or LHV, on any basis)
//    or estimated by a named published correlation. H and O exclude the moisture's H and O (ASTM
//    D3176 convention when moisture is reported separately - from memory).
//    Enthalpy of formation from the heating value, per kg of as-received fuel at 298.15 K:
//      h_f = HHV_ar + n_C h(CO2,g) + (n_H/2) h(H2O,l) + n_S h(SO2,g) + (n_N/2) h(N2) - n_O2,req h(O2)
//    with n_H including the moisture's hydrogen (the moisture enters and leaves as liquid water), the
//    product enthalpies from the species database at 298.15 K, and liquid water
//      h(H2O,l) = h(H2O,g, database) - 44.004 kJ/mol
//    where 44.004 kJ/mol = -241.826 - (-285.830) kJ/mol (NIST-JANAF 4th ed., tables H-064 and H-063);
//    with the built-in data h(H2O,l) = -285.83 kJ/mol. Ash is inert (h = 0). Above 298.15 K a liquid
//    or solid fuel adds c_p (T - 298.15 K) with its specific heat, when one is given.
//  - Blends by mass, mole (gases only) or heat-input (HHV) fraction: every per-kg property is the
//    mass-weighted sum of the parts'.
// Heating values are at constant pressure and 298.15 K; LHV = HHV - 44.004 kJ/mol x water formed
// (including fuel moisture).
// Errors in the description are units::InputError naming the field, the value and the rule.

#include <array>
#include <optional>
#include <string>
#include <string_view>
#include <utility>
#include <vector>

#include "stackbound/core/species_database.hpp"
#include "stackbound/units/warning.hpp"

namespace stackbound::core {

// Moles of each element, indexed like known_elements(): C, H, O, N, S, Ar, He.
using ElementMoles = std::array<double, 7>;

// Enthalpy of vaporisation of water at 298.15 K, J/mol: Delta_f H H2O(g) - Delta_f H H2O(l) =
// -241.826 - (-285.830) kJ/mol. Source: NIST-JANAF 4th ed. (Chase 1998), tables H-064 and H-063.
inline constexpr double kWaterVaporisationEnthalpy298_J_per_mol = 44004.0;

enum class FuelState { gas, liquid, solid, blend };
enum class CompositionBasis { mole, mass };
enum class AnalysisBasis { as_received, dry, dry_ash_free };
enum class HeatingValueKind { higher, lower };  // HHV (gross), LHV (net)
enum class BlendBasis { mass, mole, heat_input };

// Published correlations estimating the HHV of a solid or liquid fuel from its ultimate analysis.
enum class HeatingValueCorrelation {
  // HHV [MJ/kg, dry] = 0.3491 C + 1.1783 H + 0.1005 S - 0.1034 O - 0.0151 N - 0.0211 ash (mass %, dry).
  // S. A. Channiwala, P. P. Parikh, "A unified correlation for estimating HHV of solid, liquid and
  // gaseous fuels", Fuel 81 (2002) 1051-1063 (coefficients from memory). Stated average absolute
  // error 1.45 % (from memory).
  channiwala_parikh,
  // HHV [MJ/kg, dry] = 0.3516 C + 1.16225 H - 0.1109 O + 0.0628 N + 0.10465 S (mass %, dry).
  // W. Boie, Energietechnik 3 (1953) 309-316 (coefficients from memory).
  boie,
};

std::string_view to_string(FuelState state);
std::string_view to_string(AnalysisBasis basis);
std::string_view to_string(HeatingValueKind kind);
std::string_view to_string(BlendBasis basis);
// Name and citation of a correlation, for reports.
std::string_view correlation_name(HeatingValueCorrelation correlation);
std::string_view correlation_citation(HeatingValueCorrelation correlation);

// Percentages of a composition must add up to 100 %. A sum within this many percentage points of
// 100 is normalised (with a warning when it is off by more than 0.01 point); a larger difference is
// an error. Our choice (common practice, no source): analyses round to 0.01-0.1 % per component.
inline constexpr double kSumTolerance_percent = 1.0;

// A gas fuel: species formula -> percent (mole or mass).
struct GasFuelSpec {
  std::string name = "gas fuel";
  std::vector<std::pair<std::string, double>> composition_percent;
  CompositionBasis basis = CompositionBasis::mole;
  std::string field = "fuel.gas";  // names the input in error messages
};

// Ultimate analysis, mass percent on `basis`:
//   as_received : C + H + O + N + S + ash + moisture = 100
//   dry         : C + H + O + N + S + ash = 100; moisture is the as-received moisture
//   dry_ash_free: C + H + O + N + S = 100; ash is on the dry basis, moisture as received
// (the usual way of reporting them beside a daf analysis).
// Oxygen may be left out; it is then taken by difference (100 minus the rest of the basis sum).
struct UltimateAnalysis {
  double carbon_percent = 0.0;
  double hydrogen_percent = 0.0;
  std::optional<double> oxygen_percent;
  double nitrogen_percent = 0.0;
  double sulfur_percent = 0.0;
  double ash_percent = 0.0;
  double moisture_percent = 0.0;
  AnalysisBasis basis = AnalysisBasis::as_received;
};

// A measured heating value with the basis it refers to.
struct MeasuredHeatingValue {
  HeatingValueKind kind = HeatingValueKind::higher;
  double value_J_per_kg = 0.0;
  AnalysisBasis basis = AnalysisBasis::as_received;
};

// A liquid or solid fuel. Exactly one of `heating_value` (measured) or `estimate` (correlation) must
// be given; a fuel with neither is an error naming `<field>.heating_value`.
struct CondensedFuelSpec {
  std::string name = "fuel";
  FuelState state = FuelState::solid;  // liquid or solid
  UltimateAnalysis analysis;
  std::optional<MeasuredHeatingValue> heating_value;
  std::optional<HeatingValueCorrelation> estimate;
  // Specific heat of the as-fired fuel (with its moisture and ash), J/(kg K), for fuel temperatures
  // other than 298.15 K. Without it the fuel's sensible heat is left out (with a warning).
  std::optional<double> specific_heat_J_per_kg_K;
  std::string field = "fuel";
};

struct BlendPart;

// The as-received (as-fired) analysis of any fuel, mass percent: for gases and blends computed from
// the element content (gas H2O counts as H and O; only liquid/solid moisture is "moisture").
struct AsFiredAnalysis {
  double carbon_percent = 0.0;
  double hydrogen_percent = 0.0;
  double oxygen_percent = 0.0;
  double nitrogen_percent = 0.0;
  double sulfur_percent = 0.0;
  double ash_percent = 0.0;
  double moisture_percent = 0.0;
  double other_percent = 0.0;  // Ar, He in gas fuels
};

class Fuel {
 public:
  // Throws units::InputError for unknown or condensed species, negative or non-finite percentages,
  // a sum off 100 % by more than kSumTolerance_percent, duplicate species, or a gas that does not burn.
  static Fuel gas(const GasFuelSpec& spec, const SpeciesDatabase& database);
  // Throws units::InputError for negative or non-finite percentages, sums off 100 %, a missing
  // heating value, a heating value <= 0, or an analysis with no C, H or S.
  static Fuel condensed(const CondensedFuelSpec& spec, const SpeciesDatabase& database);
  // Percent of each part by mass, mole (all parts gases) or heat input (HHV); sums as above.
  static Fuel blend(std::string name, const std::vector<BlendPart>& parts, BlendBasis basis,
                    std::string field = "fuel.blend");

  // A copy carrying a provenance note (e.g. a preset's "typical values; source: ...").
  [[nodiscard]] Fuel with_source(std::string source) const;
  // A copy under another name (e.g. a preset the user names after the plant's fuel).
  [[nodiscard]] Fuel with_name(std::string name) const;

  [[nodiscard]] const std::string& name() const { return name_; }
  [[nodiscard]] FuelState state() const { return state_; }
  [[nodiscard]] const std::string& source() const { return source_; }
  [[nodiscard]] bool is_gas() const { return state_ == FuelState::gas; }

  // Per kg of as-fired fuel.
  [[nodiscard]] const ElementMoles& element_mol_per_kg() const { return element_mol_per_kg_; }
  [[nodiscard]] double hhv_J_per_kg() const { return hhv_J_per_kg_; }
  [[nodiscard]] double lhv_J_per_kg() const { return lhv_J_per_kg_; }
  [[nodiscard]] units::SpecificEnergy hhv() const { return units::joules_per_kilogram(hhv_J_per_kg_); }
  [[nodiscard]] units::SpecificEnergy lhv() const { return units::joules_per_kilogram(lhv_J_per_kg_); }
  // How the heating values were obtained: "computed from species data ...", "measured HHV, dry basis",
  // "estimated by the Channiwala & Parikh (2002) correlation", "mass-weighted from the blend's parts".
  [[nodiscard]] const std::string& heating_value_method() const { return heating_value_method_; }
  [[nodiscard]] double moisture_mass_fraction() const { return moisture_kg_per_kg_; }
  [[nodiscard]] double ash_mass_fraction() const { return ash_kg_per_kg_; }
  [[nodiscard]] AsFiredAnalysis as_fired_analysis() const;
  // Mol of water formed per kg on complete combustion (fuel H/2, including moisture and gas H2O).
  [[nodiscard]] double water_formed_mol_per_kg() const;
  // Mol of O2 needed per kg for complete combustion to CO2, H2O, SO2, N2 (net of the fuel's O).
  [[nodiscard]] double oxygen_required_mol_per_kg() const;

  // Gas species of the fuel (gas fuels, and the gaseous part of blends), mol per kg of fuel.
  [[nodiscard]] const std::vector<std::pair<std::string, double>>& gas_mol_per_kg() const { return gas_mol_per_kg_; }
  // Mass fraction of the fuel that is liquid or solid (0 for gas fuels).
  [[nodiscard]] double condensed_mass_fraction() const { return condensed_mass_fraction_; }
  // Mole fractions of a gas fuel (empty for fuels with a liquid or solid part).
  [[nodiscard]] std::vector<std::pair<std::string, double>> mole_fractions() const;
  // Molar mass of a gas fuel, kg/mol; nothing for fuels with a liquid or solid part.
  [[nodiscard]] std::optional<double> molar_mass_kg_per_mol() const;
  [[nodiscard]] std::optional<units::MolarMass> molar_mass() const {
    const std::optional<double> value = molar_mass_kg_per_mol();
    if (!value) return std::nullopt;
    return units::kilograms_per_mole(*value);
  }

  // Specific enthalpy (per kg of fuel) at `temperature` on the species data's scale. Gas species are
  // evaluated from `database` (an InputError if T is outside a species' range); the liquid/solid part
  // is h_f + c_p (T - 298.15 K) when a specific heat was given, h_f otherwise.
  [[nodiscard]] units::SpecificEnergy enthalpy(units::Temperature temperature, const SpeciesDatabase& database) const;
  // Enthalpy of formation of the liquid/solid part, J per kg of fuel (0 for gas fuels).
  [[nodiscard]] double condensed_formation_enthalpy_J_per_kg() const { return condensed_formation_J_per_kg_; }
  // True when the fuel's sensible heat above 298.15 K is fully known (gas, or c_p given).
  [[nodiscard]] bool sensible_heat_known() const { return condensed_mass_fraction_ == 0.0 || specific_heat_known_; }

  // Notes raised while building the fuel (normalised sums, estimated heating values ...).
  [[nodiscard]] const std::vector<units::Warning>& warnings() const { return warnings_; }

 private:
  Fuel() = default;

  std::string name_;
  FuelState state_ = FuelState::gas;
  std::string source_;
  std::vector<std::pair<std::string, double>> gas_mol_per_kg_;
  ElementMoles element_mol_per_kg_{};
  double condensed_mass_fraction_ = 0.0;
  double condensed_formation_J_per_kg_ = 0.0;
  double condensed_heat_capacity_J_per_kg_K_ = 0.0;  // per kg of fuel
  bool specific_heat_known_ = false;
  double moisture_kg_per_kg_ = 0.0;
  double ash_kg_per_kg_ = 0.0;
  double hhv_J_per_kg_ = 0.0;
  double lhv_J_per_kg_ = 0.0;
  std::string heating_value_method_;
  std::vector<units::Warning> warnings_;
};

struct BlendPart {
  Fuel fuel;
  double percent = 0.0;
};

// Estimated HHV, J/kg on the dry basis, from an ultimate analysis (any basis; converted to dry).
double estimate_hhv_dry_J_per_kg(const UltimateAnalysis& analysis, HeatingValueCorrelation correlation);

}  // namespace stackbound::core
