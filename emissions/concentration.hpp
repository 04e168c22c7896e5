#pragma once
// A concentration with its basis (emissions/basis.hpp), and the conversion between any two bases.
//
// The conversion runs one chain, each step only when the two bases differ in it:
//   1. unit -> SI: a mole fraction x (mol/mol), or a mass per amount of gas c = value * m / (V / V_m(N))
//      in kg/mol, V_m(N) = R T_N / p_N the ideal-gas molar volume at the unit's normal conditions;
//   2. wet -> dry: divide by (1 - B_ws), B_ws the H2O mole fraction of the wet gas;
//   3. diluent level (dry basis): O2 correction (b - O2_to)/(b - O2_from) with b = 20.9 or 21, or
//      CO2 correction CO2_to/CO2_from (emissions/reference_correction.hpp); "as measured" is the level
//      in the context;
//   4. dry -> wet: multiply by (1 - B_ws);
//   5. mole <-> mass: multiply or divide by the molar mass M (that of NO2 for "as NO2");
//   6. SI -> target unit.
// Sources: ideal-gas molar volume with R from CODATA 2018; O2 correction US EPA 40 CFR 60 / Directive
// 2010/75/EU Annex VI Part 7; wet/dry by definition of the mole fraction. The conversion is exact
// arithmetic on ideal-gas amounts: it applies to stack gas well above its dew point at about 1 atm.
//
// A step that needs a piece of context the caller did not give (moisture, measured O2 or CO2, the
// molar mass of a pollutant outside the built-in list) throws MissingContextError, which says which.
//
// Typical use by the case runner (stack composition from an equilibrium result, wet mole fractions):
//   const auto context = ConcentrationContext::from_wet_flue_gas(x_h2o, x_o2, x_co2, O2Basis::eu_21);
//   const Concentration co = Concentration::from_mole_fraction(x_co, pollutant_by_name("CO", "co"), Moisture::wet);
//   const double ppmvd = co.to(make_basis(mole_unit("ppmv"), Moisture::dry, DiluentReference::as_measured()), context).value();
//   const Basis permit = make_basis(mass_unit("mg/Nm3", units::normal_eu_ied()), Moisture::dry, DiluentReference::o2(0.03));
//   const Conversion at_ref = co.convert(permit, context);   // at_ref.result.value() in mg/Nm3; at_ref.factors

#include <optional>
#include <string>
#include <string_view>
#include <vector>

#include "stackbound/emissions/basis.hpp"
#include "stackbound/emissions/pollutant.hpp"
#include "stackbound/emissions/reference_correction.hpp"
#include "stackbound/units/input_error.hpp"

namespace stackbound::emissions {

// What is known about the sampled gas, and the O2-correction convention.
struct ConcentrationContext {
  // B_ws: H2O mole fraction of the wet stack gas, [0, 1). Needed for wet <-> dry.
  std::optional<double> moisture_fraction;
  // Measured O2, dry basis, [0, b). Needed to go from or to "as measured" across an O2 level.
  std::optional<double> o2_dry_fraction;
  // Measured CO2, dry basis, (0, 1]. Needed to go from or to "as measured" across a CO2 level.
  std::optional<double> co2_dry_fraction;
  // b in the O2 correction: 20.9 % (US EPA practice, default) or 21 % (EU practice).
  O2Basis o2_basis = O2Basis::us_epa_20_9;
  // false skips building the AppliedFactor list, for sweeps; values are identical. Honoured by
  // Concentration::convert, method19_o2_dry/_wet, method19_co2 and screen_concentration, whose factor
  // lists are then empty. Default true: reports show how each figure was formed.
  bool record_factors = true;

  // From wet mole fractions of the stack gas (as the equilibrium or combustion result gives them):
  // O2_dry = O2_wet / (1 - H2O), CO2_dry likewise. Throws units::InputError for fractions outside
  // [0, 1) or summing above 1.
  static ConcentrationContext from_wet_flue_gas(double h2o_wet_fraction, double o2_wet_fraction,
                                                std::optional<double> co2_wet_fraction, O2Basis o2_basis);
};

// The piece of context a conversion lacked.
enum class ContextPiece { moisture, measured_o2, measured_co2, molar_mass };
std::string_view context_piece_name(ContextPiece piece);  // "moisture", "measured O2", ...

class MissingContextError : public units::InputError {
 public:
  MissingContextError(ContextPiece piece, const std::string& message) : units::InputError(message), piece_(piece) {}
  [[nodiscard]] ContextPiece piece() const { return piece_; }

 private:
  ContextPiece piece_;
};

// One factor of a conversion, for reports: "molar mass" 28.010 g/mol, "molar volume" 22.414 L/mol,
// "dry/wet factor", "O2 correction factor", "CO2 correction factor", "NO2/own molar-mass ratio",
// "normal-conditions factor".
struct AppliedFactor {
  std::string name;
  double value = 0.0;
  std::string unit;    // "g/mol", "L/mol", "1" for a ratio
  std::string detail;  // how it was formed: "(20.9 - 3)/(20.9 - 7.2), O2 in % dry, ..."
};

struct Conversion;

class Concentration {
 public:
  // value in the basis' unit; must be finite and >= 0 (a mole fraction at most 1). NOx is always
  // expressed as NO2; "as NO2" on another pollutant than NO, NO2, NOx is refused. InputError names `field`.
  Concentration(double value, Pollutant pollutant, Basis basis, std::string_view field = "concentration");

  // A mole fraction of the gas as sampled ("as measured"), stated in ppmv.
  static Concentration from_mole_fraction(double mole_fraction, Pollutant pollutant, Moisture moisture);

  [[nodiscard]] double value() const { return value_; }
  [[nodiscard]] const Pollutant& pollutant() const { return pollutant_; }
  [[nodiscard]] const Basis& basis() const { return basis_; }

  // The same concentration on another basis, with the factors applied (in the order applied; none
  // when context.record_factors is false).
  [[nodiscard]] Conversion convert(const Basis& target, const ConcentrationContext& context) const;
  // convert(...).result; never builds the factors.
  [[nodiscard]] Concentration to(const Basis& target, const ConcentrationContext& context) const;

  // "35 ppmv CO (dry, O2=7.2%)", "42.6 mg/Nm3 NOx (dry, O2=3%, as NO2, normal=0C)".
  [[nodiscard]] std::string text(int significant = 6) const;

 private:
  struct Unchecked {};
  Concentration(Unchecked, double value, Pollutant pollutant, Basis basis)
      : value_(value), pollutant_(std::move(pollutant)), basis_(std::move(basis)) {}
  double value_;
  Pollutant pollutant_;
  Basis basis_;
};

struct Conversion {
  Concentration result;
  std::vector<AppliedFactor> factors;
};

// The molar mass a mass basis uses: that of NO2 when `as_no2`, else the pollutant's. Throws
// MissingContextError(molar_mass) when unknown; `purpose` completes the message ("to convert ppmv to mg/Nm3").
double basis_molar_mass_kg_per_mol(const Pollutant& pollutant, bool as_no2, std::string_view purpose);

}  // namespace stackbound::emissions
