#pragma once
// The basis of a concentration, and the small text language that describes it (docs/bases.md).
//
// A basis says what one number of a concentration means:
//   - the unit: a mole fraction (ppmv, ppbv, %) or a mass per normal volume (mg/Nm3, ug/Nm3, g/Nm3,
//     mg/m3 at named normal conditions, mg/Sm3, mg/dscm, gr/dscf, lb/dscf, lb/scf ...);
//   - wet or dry: per amount of stack gas including or excluding its water vapour;
//   - the diluent level: "as measured", or stated at (corrected to) a dry O2 or CO2 level;
//   - for nitrogen oxides, whether the mass is expressed as NO2 (40 CFR 60.2; 2010/75/EU Annex V).
// A normal volume is an amount of gas, so a mass per normal volume is stored as kg per mol of gas
// (ideal gas, V_m = R T / p at the named conditions; units/normal_conditions.hpp).
//
// Basis text is comma-separated items, e.g.
//   "mg/Nm3, dry, O2=3%"      "ppmvd"      "ppmv, wet"      "dry, CO2=12%"      "mg/m3, dry, normal=20C"
//   "gr/dscf, O2=7%"          "dry, O2=ied-gas-turbine"     "mg/Nm3, dry, O2=3%, as NO2"
// A partial basis (some items missing) is completed from another basis or from defaults; see
// complete_basis() and complete_basis_from().

#include <optional>
#include <string>
#include <string_view>

#include "stackbound/emissions/reference_o2_presets.hpp"
#include "stackbound/units/normal_conditions.hpp"

namespace stackbound::emissions {

enum class Moisture { wet, dry };
std::string_view moisture_name(Moisture moisture);  // "wet" / "dry"

enum class UnitKind {
  mole_fraction,           // ppmv, ppbv, %: mol of pollutant per mol of gas
  mass_per_normal_volume,  // mg/Nm3 ...: mass of pollutant per amount of gas
};

// How a mass-per-volume unit finds its normal conditions.
enum class NormalRule {
  not_applicable,  // mole-fraction units
  fixed,           // the unit names them: Sm3 (15 degC), dscm/dscf/scf (20 degC, 40 CFR 60.2)
  default_0C,      // Nm3: the named conditions, else the caller's default, else 0 degC / 101.325 kPa
  must_be_named,   // m3, ft3: the basis or the caller must name them
};

struct ConcentrationUnit {
  std::string symbol;                           // canonical: "ppmv", "ppbv", "%", "mg/Nm3", "ug/m3", "gr/dscf"
  UnitKind kind = UnitKind::mole_fraction;
  double factor = 1.0;                          // mole: mol/mol per unit (ppmv: 1e-6); mass: kg per unit of the numerator
  double volume_m3 = 1.0;                       // mass: the denominator volume in m3 (m3: 1; ft3: 0.028316846592)
  NormalRule normal_rule = NormalRule::not_applicable;
  const units::NormalConditions* normal = nullptr;  // mass: the conditions of the volume, once resolved
  std::optional<Moisture> implied_moisture;     // "ppmvd", "dscm", "dscf" say dry; "ppmvw" says wet

  [[nodiscard]] bool is_mass() const { return kind == UnitKind::mass_per_normal_volume; }
  // Mass kind with resolved conditions: kg of pollutant per mol of gas for one unit,
  // factor * V_m / volume_m3.
  [[nodiscard]] double kg_per_mol_per_unit() const;
  // Same symbol and, for mass units, same normal conditions.
  [[nodiscard]] bool same_as(const ConcentrationUnit& other) const;
};

// The diluent level a concentration is stated at: "as measured" (the O2 and CO2 of the gas
// sampled), or at a dry O2 (or CO2) level. A measured value at 7.2 % O2 and a value corrected to
// 3 % O2 are both "at an O2 level"; converting between levels is the O2 correction.
class DiluentReference {
 public:
  enum class Kind { as_measured, o2, co2 };
  static DiluentReference as_measured() { return DiluentReference(Kind::as_measured, 0.0, nullptr); }
  // Dry mole fractions; validated when used (O2 against the O2 basis, CO2 in (0, 1]).
  static DiluentReference o2(double dry_fraction) { return DiluentReference(Kind::o2, dry_fraction, nullptr); }
  static DiluentReference co2(double dry_fraction) { return DiluentReference(Kind::co2, dry_fraction, nullptr); }
  static DiluentReference o2_preset(const ReferenceO2Preset& preset) {
    return DiluentReference(Kind::o2, preset.o2_dry_fraction, &preset);
  }

  [[nodiscard]] Kind kind() const { return kind_; }
  [[nodiscard]] double dry_fraction() const { return dry_fraction_; }  // 0 for as_measured
  [[nodiscard]] const ReferenceO2Preset* preset() const { return preset_; }  // set when taken from a preset
  // "as measured", "O2=3%", "CO2=12%".
  [[nodiscard]] std::string text() const;
  // Same kind and level (the preset origin does not matter).
  [[nodiscard]] bool same_as(const DiluentReference& other) const {
    return kind_ == other.kind_ && dry_fraction_ == other.dry_fraction_;
  }

 private:
  DiluentReference(Kind kind, double dry_fraction, const ReferenceO2Preset* preset)
      : kind_(kind), dry_fraction_(dry_fraction), preset_(preset) {}
  Kind kind_;
  double dry_fraction_;
  const ReferenceO2Preset* preset_;
};

struct Basis {
  ConcentrationUnit unit;
  Moisture moisture = Moisture::dry;
  DiluentReference reference = DiluentReference::as_measured();
  bool as_no2 = false;  // mass expressed with the molar mass of NO2 (nitrogen oxides only)

  // Canonical text, e.g. "mg/Nm3, dry, O2=3%, normal=0C"; parse_basis(text()) gives the same basis.
  [[nodiscard]] std::string text() const;
  // Same unit, moisture, reference and as_no2.
  [[nodiscard]] bool same_as(const Basis& other) const;
};

// A basis with the rules checked: a mass unit has resolved normal conditions; a unit that implies
// wet or dry agrees with `moisture`; a reference O2/CO2 level is on the dry basis only (a corrected
// concentration is defined dry); levels are finite and within [0, 21 %) for O2, (0, 100 %] for CO2.
// Throws units::InputError naming `field`.
Basis make_basis(ConcentrationUnit unit, Moisture moisture, DiluentReference reference, bool as_no2 = false,
                 std::string_view field = "basis");

// The units by symbol (after normalising "³" -> "3" and "µ" -> "u"). Mole units: ppm, ppmv, ppmvd,
// ppmvw, ppb, ppbv, ppbvd, ppbvw, %, %v, vol%. Mass units: {ng, ug, mg, g, kg, gr, lb} over
// {Nm3, m3, Sm3, dscm, dscf, scf, ft3}. nullopt if the symbol is not a concentration unit. The
// returned unit's normal conditions are unresolved unless fixed by the unit itself.
std::optional<ConcentrationUnit> find_concentration_unit(std::string_view symbol);

// A mole unit: "ppmv", "ppbv", "%" (or any mole symbol above). Throws units::InputError otherwise.
ConcentrationUnit mole_unit(std::string_view symbol);
// A mass unit with its normal conditions resolved: mass_unit("mg/Nm3", units::normal_eu_ied()).
// A unit with fixed conditions (dscf ...) refuses other conditions. Throws units::InputError.
ConcentrationUnit mass_unit(std::string_view symbol, const units::NormalConditions& normal);

// A basis as written, with every item optional.
struct PartialBasis {
  std::optional<ConcentrationUnit> unit;  // normal conditions not yet resolved
  std::optional<Moisture> moisture;
  std::optional<DiluentReference> reference;
  const units::NormalConditions* normal = nullptr;  // from "normal=KEY"
  std::optional<bool> as_no2;
  [[nodiscard]] bool empty() const { return !unit && !moisture && !reference && normal == nullptr && !as_no2; }
};

// Parses basis text (may be empty: an empty partial basis). Throws units::InputError:
//   '<field> = "<text>": <problem>; accepted items: ...'.
PartialBasis parse_partial_basis(std::string_view text, std::string_view field);

// Combines two partial descriptions of the same basis (e.g. the unit after the number "35 ppmvd" and
// the --from text). An item given in both with different values is an InputError naming both fields.
PartialBasis merge_partial_bases(const PartialBasis& first, std::string_view first_field, const PartialBasis& second,
                                 std::string_view second_field);

// A complete basis from a partial one: the unit is required, and so is wet/dry unless the unit
// implies it; the reference defaults to "as measured"; as_no2 to false. Mass units take their
// normal conditions from "normal=KEY", else `default_normal`, else (Nm3 only) 0 degC / 101.325 kPa.
Basis complete_basis(const PartialBasis& partial, std::string_view field,
                     const units::NormalConditions* default_normal = nullptr);

// A complete target basis: items missing from `partial` are taken from `inherit` (the normal
// conditions only together with the unit). "--to mg/Nm3" from "ppmv, dry, O2=7.2%" means
// "mg/Nm3, dry, O2=7.2%".
Basis complete_basis_from(const PartialBasis& partial, const Basis& inherit, std::string_view field,
                          const units::NormalConditions* default_normal = nullptr);

// "35 ppm, dry, O2=3%" -> 35 and "ppm, dry, O2=3%": the leading number of a stated concentration and
// the rest (unit and basis items, for parse_partial_basis). Throws units::InputError naming `field`
// for empty text, no number, a number out of range or not finite.
struct StatedValue {
  double number = 0.0;
  std::string rest;
};
StatedValue split_stated_value(std::string_view text, std::string_view field);

// parse_partial_basis + complete_basis.
Basis parse_basis(std::string_view text, std::string_view field, const units::NormalConditions* default_normal = nullptr);

}  // namespace stackbound::emissions
