#pragma once
// Emission rates from a concentration.
//   Mass rate:  m_dot = c * n_dot, with c the mass of pollutant per amount of gas (kg/mol) and n_dot
//     the flue-gas molar flow on the same wet/dry basis, at the measured diluent level (a normal-volume
//     flow such as "12000 Nm3/h" is a molar flow; units/quantity_parser.hpp).
//   Per heat input, US EPA 40 CFR 60 Appendix A-7, Method 19 (F-factors at 20 degC, 101.325 kPa):
//     O2-based, dry, Fd (Eq. 19-1):                E = C_d * Fd * b / (b - %O2_d)
//     O2-based, wet, Fw (form of Method 19 with B_wa): E = C_ws * Fw * b / (b (1 - B_wa) - %O2_ws)
//     CO2-based, Fc (Eqs. 19-6/19-7):              E = C * Fc * 100 / %CO2   (C and CO2 on one basis)
//   where b is 20.9 as Method 19 writes it (the context's O2 basis; 21 only if the user chose EU practice).
//   The O2 form holds when the O2 in the flue gas is excess air of 20.9 % O2; it fails for O2-enriched
//   or vitiated combustion air. Method 19 F-factors are on the gross (higher) heating value.
//   Per useful output: E_out = E_in / efficiency (efficiency on the same heating-value basis).
// The concentration is first converted (emissions/concentration.hpp), so any basis may be given.

#include <optional>
#include <string>
#include <string_view>
#include <vector>

#include "stackbound/emissions/concentration.hpp"
#include "stackbound/units/normal_conditions.hpp"
#include "stackbound/units/quantities.hpp"

namespace stackbound::emissions {

// A flue-gas flow: an amount of gas per time, wet or dry.
struct FlueGasFlow {
  units::MolarFlow flow;
  Moisture moisture = Moisture::wet;
};

// Mass emission rate; converts the concentration to mass per amount of gas on the flow's basis,
// "as measured" (which needs the measured O2 when the concentration is stated at a reference O2).
// Throws units::InputError for a negative or non-finite flow, MissingContextError for missing context.
units::MassFlow mass_rate(const Concentration& concentration, const FlueGasFlow& flow, const ConcentrationContext& context);

// Mass emitted in a year of `operating_hours_per_year` hours at a constant rate; hours in (0, 8784].
units::Mass annual_mass(units::MassFlow rate, double operating_hours_per_year);

enum class FFactorKind {
  dry,     // Fd: dry flue-gas volume at 0 % excess O2 per heat input (dscf/MMBtu, dscm/J)
  wet,     // Fw: wet flue-gas volume per heat input (wscf/MMBtu, wscm/J)
  carbon,  // Fc: CO2 volume per heat input (scf/MMBtu, scm/J)
};
std::string_view f_factor_symbol(FFactorKind kind);  // "Fd", "Fw", "Fc"

// An F-factor as an amount of gas per heat input, mol/J; the scf and scm of Method 19 are at
// 20 degC and 101.325 kPa (US EPA standard conditions, 40 CFR 60.2; units::normal_20C()).
struct FFactor {
  FFactorKind kind = FFactorKind::dry;
  double gas_mol_per_J = 0.0;

  static FFactor from_scf_per_MMBtu(FFactorKind kind, double scf_per_MMBtu);
  static FFactor from_scm_per_J(FFactorKind kind, double scm_per_J);
  [[nodiscard]] double scf_per_MMBtu() const;
  [[nodiscard]] double scm_per_J() const;
};

// "8710 dscf/MMBtu", "2.34e-7 dscm/J", "1040 scf/MMBtu", "10610 wscf/MMBtu", "260 Nm3/GJ" (Nm3 at 0 degC).
// The volume prefix must match the kind (Fd: dscf, dscm, Nm3; Fw: wscf, wscm, Nm3; Fc: scf, scm, Nm3);
// energy: MMBtu, J, MJ, GJ. Value must be > 0. Throws units::InputError naming the field.
FFactor parse_f_factor(std::string_view text, FFactorKind kind, std::string_view field);

// A rate per heat input.
struct HeatInputRate {
  double kg_per_J = 0.0;
  std::string method;                  // "US EPA Method 19 Eq. 19-1 (O2-based, dry, Fd)"
  std::vector<AppliedFactor> factors;  // conversion factors, then the F-factor and the equation's diluent term

  [[nodiscard]] double lb_per_MMBtu() const;
  [[nodiscard]] double g_per_GJ() const;  // equal to ng/J
  [[nodiscard]] double ng_per_J() const { return g_per_GJ(); }
};

// The three Method 19 forms list their factors only when context.record_factors is true.
// Eq. 19-1 form: the concentration is taken dry, as mass, at 0 % O2 (b/(b - %O2_d) applied from the
// measured O2 or from the basis' O2 level), times Fd.
HeatInputRate method19_o2_dry(const Concentration& concentration, const FFactor& fd, const ConcentrationContext& context);

// Wet form with Fw and the ambient-air moisture B_wa (fraction, [0, 1)): needs the stack moisture and
// measured O2 in the context to state the concentration and O2 wet.
HeatInputRate method19_o2_wet(const Concentration& concentration, const FFactor& fw, double ambient_moisture_fraction,
                              const ConcentrationContext& context);

// CO2 form: the concentration is taken dry, as mass, at 100 % CO2 (100/%CO2), times Fc.
HeatInputRate method19_co2(const Concentration& concentration, const FFactor& fc, const ConcentrationContext& context);

// Directly: mass rate / heat input.
HeatInputRate rate_per_heat_input(units::MassFlow rate, units::Power heat_input);

// A rate per useful output (electricity or useful heat).
struct OutputRate {
  double kg_per_J = 0.0;  // kg per J of useful output
  std::string method;

  [[nodiscard]] double mg_per_kWh() const { return kg_per_J * 3.6e12; }
  [[nodiscard]] double g_per_MWh() const { return kg_per_J * 3.6e12; }
};
// E_out = E_in / efficiency; efficiency in (0, 1] on the heating-value basis of the heat input.
OutputRate per_useful_output(const HeatInputRate& rate, double efficiency);
// mass rate / useful output power.
OutputRate per_useful_output(units::MassFlow rate, units::Power useful_output);

// Everything the case runner reports for one pollutant, from the stack state of one case.
struct StackEmissionInput {
  Pollutant pollutant;
  double pollutant_wet_fraction = 0.0;  // mole fraction of the pollutant in the wet stack gas
  double h2o_wet_fraction = 0.0;        // stack moisture B_ws
  double o2_wet_fraction = 0.0;
  std::optional<double> co2_wet_fraction;
  units::MolarFlow wet_flue_gas_flow = units::moles_per_second(0.0);  // wet stack gas, mol/s
  units::Power heat_input = units::watts(0.0);  // on the heating-value basis of fd (HHV for Method 19 values)
  FFactor fd;                                   // Method 19 dry F-factor of the fuel
  double reference_o2_dry_fraction = 0.03;
  const units::NormalConditions* normal = &units::normal_0C();  // of the mg/Nm3 figure
  O2Basis o2_basis = O2Basis::us_epa_20_9;
  std::optional<double> operating_hours_per_year;
  // false skips building the AppliedFactor lists (mg_per_Nm3_at_reference.factors, method19.factors
  // stay empty), for sweeps; values are identical. Becomes context.record_factors of the result.
  bool record_factors = true;
};

struct StackEmission {
  ConcentrationContext context;
  Concentration ppmvd;                 // dry, as measured
  Concentration ppmvd_at_reference;    // dry, at the reference O2
  Conversion mg_per_Nm3_at_reference;  // dry, at the reference O2, at `normal`, with its factors
  units::MassFlow mass_rate;           // kg/s
  std::optional<units::Mass> annual;   // when operating hours are given
  HeatInputRate method19;              // O2-based, Fd
  HeatInputRate direct;                // mass rate / heat input (a cross-check of method19)
};
StackEmission evaluate_stack_emission(const StackEmissionInput& input);

}  // namespace stackbound::emissions
