#include "stackbound/emissions/emission_rate.hpp"

#include <array>
#include <charconv>
#include <cmath>

#include <fmt/format.h>

#include "stackbound/units/constants.hpp"
#include "stackbound/units/input_error.hpp"

namespace stackbound::emissions {

namespace {

constexpr double kCubicFoot_m3 = units::kFoot_m * units::kFoot_m * units::kFoot_m;
constexpr double kMMBtu_J = 1e6 * units::kBtuIT_J;
// A leap year of 366 days; the upper bound of operating hours in a calendar year.
constexpr double kLeapYear_h = 8784.0;

std::string number_text(double value) { return fmt::format("{:.10g}", value); }

// A mass-per-amount basis in kg per mol of gas: "kg/m3" at any resolved conditions, scaled back.
Basis kg_per_mol_basis(Moisture moisture, DiluentReference reference, bool as_no2) {
  static const ConcentrationUnit kg_per_Nm3 = mass_unit("kg/Nm3", units::normal_0C());
  return make_basis(kg_per_Nm3, moisture, reference, as_no2, "internal basis");
}

const ConcentrationUnit& ppmv_unit() {
  static const ConcentrationUnit unit = mole_unit("ppmv");
  return unit;
}

double kg_per_mol(const Concentration& concentration) {
  return concentration.value() * concentration.basis().unit.kg_per_mol_per_unit();
}

void check_positive(double value, std::string_view what, std::string_view unit) {
  if (!std::isfinite(value) || value <= 0.0) {
    throw units::InputError(fmt::format("{} = {} {}: must be a finite number above 0", what, value, unit));
  }
}

std::string_view strip(std::string_view text) {
  const auto first = text.find_first_not_of(" \t");
  if (first == std::string_view::npos) return {};
  const auto last = text.find_last_not_of(" \t");
  return text.substr(first, last - first + 1);
}

}  // namespace

units::MassFlow mass_rate(const Concentration& concentration, const FlueGasFlow& flow, const ConcentrationContext& context) {
  const double flow_mol_per_s = flow.flow.value();
  if (!std::isfinite(flow_mol_per_s) || flow_mol_per_s < 0.0) {
    throw units::InputError(fmt::format("flue-gas flow = {} mol/s: must be a finite number >= 0", flow_mol_per_s));
  }
  const Concentration c =
      concentration.to(kg_per_mol_basis(flow.moisture, DiluentReference::as_measured(), concentration.basis().as_no2),
                       context);
  return units::kilograms_per_second(kg_per_mol(c) * flow_mol_per_s);
}

units::Mass annual_mass(units::MassFlow rate, double operating_hours_per_year) {
  if (!std::isfinite(operating_hours_per_year) || operating_hours_per_year <= 0.0 ||
      operating_hours_per_year > kLeapYear_h) {
    throw units::InputError(fmt::format("operating hours = {} h/yr: must be above 0 and at most 8784 h/yr (366 d)",
                                        operating_hours_per_year));
  }
  return units::kilograms(rate.value() * operating_hours_per_year * 3600.0);
}

std::string_view f_factor_symbol(FFactorKind kind) {
  switch (kind) {
    case FFactorKind::dry: return "Fd";
    case FFactorKind::wet: return "Fw";
    case FFactorKind::carbon: return "Fc";
  }
  return "F";
}

FFactor FFactor::from_scf_per_MMBtu(FFactorKind kind, double scf_per_MMBtu) {
  check_positive(scf_per_MMBtu, f_factor_symbol(kind), "scf/MMBtu");
  return {kind, scf_per_MMBtu * kCubicFoot_m3 / units::normal_20C().molar_volume_m3_per_mol() / kMMBtu_J};
}

FFactor FFactor::from_scm_per_J(FFactorKind kind, double scm_per_J) {
  check_positive(scm_per_J, f_factor_symbol(kind), "scm/J");
  return {kind, scm_per_J / units::normal_20C().molar_volume_m3_per_mol()};
}

double FFactor::scf_per_MMBtu() const {
  return gas_mol_per_J * units::normal_20C().molar_volume_m3_per_mol() / kCubicFoot_m3 * kMMBtu_J;
}

double FFactor::scm_per_J() const { return gas_mol_per_J * units::normal_20C().molar_volume_m3_per_mol(); }

FFactor parse_f_factor(std::string_view text, FFactorKind kind, std::string_view field) {
  const std::string_view symbol = f_factor_symbol(kind);
  const std::string prefix = kind == FFactorKind::dry ? "d" : kind == FFactorKind::wet ? "w" : "";
  const std::string accepted = fmt::format("{0}scf/MMBtu, {0}scm/J, {0}scm/GJ, Nm3/GJ (Nm3 at 0 degC)", prefix);
  const auto refuse = [&](const std::string& problem) {
    throw units::InputError(fmt::format("{} = \"{}\": {}; {} accepts {}", field, text, problem, symbol, accepted));
  };
  const std::string_view body = strip(text);
  double number = 0.0;
  const auto [end, error] = std::from_chars(body.data(), body.data() + body.size(), number);
  if (error != std::errc() || end == body.data()) refuse("no number found");
  if (!std::isfinite(number) || number <= 0.0) refuse("an F-factor must be above 0");
  const std::string_view unit = strip(body.substr(static_cast<std::size_t>(end - body.data())));
  if (unit.empty()) refuse("a unit is required");
  const auto slash = unit.find('/');
  if (slash == std::string_view::npos) refuse(fmt::format("unknown unit \"{}\"", unit));
  const std::string_view amount = strip(unit.substr(0, slash));
  const std::string_view energy = strip(unit.substr(slash + 1));
  double energy_J = 0.0;
  if (energy == "MMBtu" || energy == "10^6 Btu" || energy == "10^6Btu") {
    energy_J = kMMBtu_J;
  } else if (energy == "J") {
    energy_J = 1.0;
  } else if (energy == "MJ") {
    energy_J = 1e6;
  } else if (energy == "GJ") {
    energy_J = 1e9;
  } else {
    refuse(fmt::format("unknown energy unit \"{}\"", energy));
  }
  double mol = 0.0;
  const double mol_per_scf = kCubicFoot_m3 / units::normal_20C().molar_volume_m3_per_mol();
  const double mol_per_scm = 1.0 / units::normal_20C().molar_volume_m3_per_mol();
  if (amount == prefix + "scf") {
    mol = mol_per_scf;
  } else if (amount == prefix + "scm") {
    mol = mol_per_scm;
  } else if (amount == "Nm3") {
    mol = 1.0 / units::normal_0C().molar_volume_m3_per_mol();
  } else if (amount == "dscf" || amount == "wscf" || amount == "scf" || amount == "dscm" || amount == "wscm" ||
             amount == "scm") {
    refuse(fmt::format("\"{}\" is not the volume of {} ({} is {})", amount, symbol, symbol,
                       kind == FFactorKind::dry   ? "dry gas: dscf or dscm"
                       : kind == FFactorKind::wet ? "wet gas: wscf or wscm"
                                                  : "CO2 volume: scf or scm"));
  } else {
    refuse(fmt::format("unknown volume unit \"{}\"", amount));
  }
  return {kind, number * mol / energy_J};
}

double HeatInputRate::lb_per_MMBtu() const { return kg_per_J / units::kPound_kg * kMMBtu_J; }
double HeatInputRate::g_per_GJ() const { return kg_per_J * 1e12; }

namespace {

void require_kind(const FFactor& factor, FFactorKind kind, std::string_view method) {
  if (factor.kind != kind) {
    throw units::InputError(fmt::format("{} needs {}, not {}", method, f_factor_symbol(kind), f_factor_symbol(factor.kind)));
  }
  check_positive(factor.gas_mol_per_J, f_factor_symbol(kind), "mol/J");
}

AppliedFactor f_factor_entry(const FFactor& factor) {
  const std::string_view prefix = factor.kind == FFactorKind::dry ? "d" : factor.kind == FFactorKind::wet ? "w" : "";
  return {std::string(f_factor_symbol(factor.kind)), factor.scf_per_MMBtu(), fmt::format("{}scf/MMBtu", prefix),
          fmt::format("= {} {}scm/J at 20 degC, 101.325 kPa (US EPA standard conditions)", number_text(factor.scm_per_J()),
                      prefix)};
}

}  // namespace

HeatInputRate method19_o2_dry(const Concentration& concentration, const FFactor& fd, const ConcentrationContext& context) {
  constexpr std::string_view kMethod = "US EPA Method 19 Eq. 19-1 (O2-based, dry, Fd)";
  require_kind(fd, FFactorKind::dry, kMethod);
  // C_d * b/(b - %O2_d) is the dry concentration at 0 % O2.
  Conversion at_zero_o2 = concentration.convert(
      kg_per_mol_basis(Moisture::dry, DiluentReference::o2(0.0), concentration.basis().as_no2), context);
  HeatInputRate rate{kg_per_mol(at_zero_o2.result) * fd.gas_mol_per_J, std::string(kMethod),
                     std::move(at_zero_o2.factors)};
  if (context.record_factors) rate.factors.push_back(f_factor_entry(fd));
  return rate;
}

HeatInputRate method19_o2_wet(const Concentration& concentration, const FFactor& fw, double ambient_moisture_fraction,
                              const ConcentrationContext& context) {
  constexpr std::string_view kMethod = "US EPA Method 19 (O2-based, wet, Fw, ambient moisture B_wa)";
  require_kind(fw, FFactorKind::wet, kMethod);
  if (!std::isfinite(ambient_moisture_fraction) || ambient_moisture_fraction < 0.0 || ambient_moisture_fraction >= 1.0) {
    throw units::InputError(fmt::format("ambient-air moisture B_wa = {}: must be >= 0 and below 1", ambient_moisture_fraction));
  }
  if (!context.moisture_fraction || !context.o2_dry_fraction) {
    throw MissingContextError(
        !context.moisture_fraction ? ContextPiece::moisture : ContextPiece::measured_o2,
        fmt::format("missing context: {} needs the stack moisture and the measured O2 to state C and O2 wet", kMethod));
  }
  Conversion wet = concentration.convert(
      kg_per_mol_basis(Moisture::wet, DiluentReference::as_measured(), concentration.basis().as_no2), context);
  const double b = o2_basis_percent(context.o2_basis);
  check_o2_level(*context.o2_dry_fraction, context.o2_basis, "measured O2");
  const double o2_wet_percent = *context.o2_dry_fraction * (1.0 - *context.moisture_fraction) * 100.0;
  const double denominator = b * (1.0 - ambient_moisture_fraction) - o2_wet_percent;
  if (denominator <= 0.0) {
    throw units::InputError(fmt::format(
        "Method 19 wet O2 form: {} (1 - B_wa = {}) - %O2_w = {} is not above 0; the ambient moisture or the O2 is too high",
        b, 1.0 - ambient_moisture_fraction, o2_wet_percent));
  }
  const double diluent = b / denominator;
  HeatInputRate rate{kg_per_mol(wet.result) * fw.gas_mol_per_J * diluent, std::string(kMethod), std::move(wet.factors)};
  if (context.record_factors) {
    rate.factors.push_back(f_factor_entry(fw));
    rate.factors.push_back({"O2 term", diluent, "1",
                            fmt::format("{:g}/({:g} (1 - {}) - {}), O2 in % wet", b, b,
                                        number_text(ambient_moisture_fraction), number_text(o2_wet_percent))});
  }
  return rate;
}

HeatInputRate method19_co2(const Concentration& concentration, const FFactor& fc, const ConcentrationContext& context) {
  constexpr std::string_view kMethod = "US EPA Method 19 Eqs. 19-6/19-7 (CO2-based, Fc)";
  require_kind(fc, FFactorKind::carbon, kMethod);
  // C * 100/%CO2 is the dry concentration at 100 % CO2.
  Conversion at_pure_co2 = concentration.convert(
      kg_per_mol_basis(Moisture::dry, DiluentReference::co2(1.0), concentration.basis().as_no2), context);
  HeatInputRate rate{kg_per_mol(at_pure_co2.result) * fc.gas_mol_per_J, std::string(kMethod),
                     std::move(at_pure_co2.factors)};
  if (context.record_factors) rate.factors.push_back(f_factor_entry(fc));
  return rate;
}

HeatInputRate rate_per_heat_input(units::MassFlow rate, units::Power heat_input) {
  check_positive(heat_input.value(), "heat input", "W");
  if (!std::isfinite(rate.value()) || rate.value() < 0.0) {
    throw units::InputError(fmt::format("mass rate = {} kg/s: must be a finite number >= 0", rate.value()));
  }
  return {rate.value() / heat_input.value(), "mass rate / heat input", {}};
}

OutputRate per_useful_output(const HeatInputRate& rate, double efficiency) {
  if (!std::isfinite(efficiency) || efficiency <= 0.0 || efficiency > 1.0) {
    throw units::InputError(fmt::format("efficiency = {} %: must be above 0 % and at most 100 % (on the heating-value "
                                        "basis of the heat input)",
                                        efficiency * 100.0));
  }
  return {rate.kg_per_J / efficiency, fmt::format("{} / efficiency {:g} %", rate.method, efficiency * 100.0)};
}

OutputRate per_useful_output(units::MassFlow rate, units::Power useful_output) {
  check_positive(useful_output.value(), "useful output", "W");
  if (!std::isfinite(rate.value()) || rate.value() < 0.0) {
    throw units::InputError(fmt::format("mass rate = {} kg/s: must be a finite number >= 0", rate.value()));
  }
  return {rate.value() / useful_output.value(), "mass rate / useful output"};
}

StackEmission evaluate_stack_emission(const StackEmissionInput& input) {
  ConcentrationContext context = ConcentrationContext::from_wet_flue_gas(
      input.h2o_wet_fraction, input.o2_wet_fraction, input.co2_wet_fraction, input.o2_basis);
  context.record_factors = input.record_factors;
  const Concentration measured =
      Concentration::from_mole_fraction(input.pollutant_wet_fraction, input.pollutant, Moisture::wet);
  const bool as_no2 = measured.basis().as_no2;
  const DiluentReference reference = DiluentReference::o2(input.reference_o2_dry_fraction);
  const Concentration ppmvd =
      measured.to(make_basis(ppmv_unit(), Moisture::dry, DiluentReference::as_measured(), as_no2), context);
  const Concentration at_reference = measured.to(make_basis(ppmv_unit(), Moisture::dry, reference, as_no2), context);
  const units::NormalConditions& normal = input.normal != nullptr ? *input.normal : units::normal_0C();
  Conversion mass_at_reference =
      measured.convert(make_basis(mass_unit("mg/Nm3", normal), Moisture::dry, reference, as_no2), context);
  const units::MassFlow rate = mass_rate(measured, {input.wet_flue_gas_flow, Moisture::wet}, context);
  std::optional<units::Mass> annual;
  if (input.operating_hours_per_year) annual = annual_mass(rate, *input.operating_hours_per_year);
  return StackEmission{context,
                       ppmvd,
                       at_reference,
                       std::move(mass_at_reference),
                       rate,
                       annual,
                       method19_o2_dry(measured, input.fd, context),
                       rate_per_heat_input(rate, input.heat_input)};
}

}  // namespace stackbound::emissions
