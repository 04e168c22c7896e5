#include "stackbound/core/combustion.hpp"

#include <algorithm>
#include <cmath>
#include <cstdint>

#include <boost/math/tools/roots.hpp>
#include <fmt/format.h>

#include "stackbound/core/elements.hpp"
#include "stackbound/core/humidity.hpp"
#include "stackbound/units/constants.hpp"
#include "stackbound/units/input_error.hpp"
#include "stackbound/units/normal_conditions.hpp"

namespace stackbound::core {

namespace {

constexpr std::size_t kC = 0, kH = 1, kO = 2, kN = 3, kS = 4, kAr = 5, kHe = 6;

std::size_t at(FlueSpecies species) { return static_cast<std::size_t>(species); }

double weight(std::size_t element) { return known_elements()[element].atomic_weight_g_per_mol * 1e-3; }

// Molar masses of the flue species from the IUPAC atomic weights, kg/mol.
const std::array<double, kFlueSpeciesCount>& flue_molar_masses() {
  static const std::array<double, kFlueSpeciesCount> masses{
      weight(kC) + 2 * weight(kO), weight(kC) + weight(kO), 2 * weight(kH) + weight(kO), 2 * weight(kH),
      2 * weight(kO),              2 * weight(kN),          weight(kS) + 2 * weight(kO), weight(kAr),
      weight(kHe)};
  return masses;
}

// Element content of one mole of the oxidant.
ElementMoles oxidant_elements_per_mol(const Oxidant& oxidant) {
  using S = OxidantSpecies;
  ElementMoles e{};
  e[kN] = 2.0 * oxidant.mole_fraction(S::N2);
  e[kO] = 2.0 * oxidant.mole_fraction(S::O2) + 2.0 * oxidant.mole_fraction(S::CO2) + oxidant.mole_fraction(S::H2O);
  e[kAr] = oxidant.mole_fraction(S::Ar);
  e[kC] = oxidant.mole_fraction(S::CO2);
  e[kH] = 2.0 * oxidant.mole_fraction(S::H2O);
  return e;
}

ElementMoles add(const ElementMoles& a, const ElementMoles& b, double b_scale) {
  ElementMoles sum{};
  for (std::size_t k = 0; k < sum.size(); ++k) sum[k] = a[k] + b_scale * b[k];
  return sum;
}

// Oxygen left for CO -> CO2 and H2 -> H2O once S is SO2 and C is CO.
double oxygen_beyond_co(const ElementMoles& e) { return e[kO] - 2.0 * e[kS] - e[kC]; }

// Equilibrium constant of CO + H2O = CO2 + H2 (dimensionless, no mole change) from the species data.
double shift_constant(double temperature_K, const SpeciesDatabase& database) {
  const auto g = [&](std::string_view formula) {
    return database.at(formula, "species data for the water-gas shift").g_over_RT(units::kelvin(temperature_K));
  };
  return std::exp(-(g("CO2") + g("H2") - g("CO") - g("H2O")));
}

// Products when the oxygen suffices (lambda >= 1): CO2, H2O, SO2, N2, Ar, He and the leftover O2.
// At exactly lambda = 1 rounding may leave -1e-16 mol of O2; it is clamped to 0.
FlueGas lean_products(const ElementMoles& e) {
  FlueGas flue;
  auto& n = flue.mol_per_kg;
  n[at(FlueSpecies::SO2)] = e[kS];
  n[at(FlueSpecies::N2)] = 0.5 * e[kN];
  n[at(FlueSpecies::Ar)] = e[kAr];
  n[at(FlueSpecies::He)] = e[kHe];
  n[at(FlueSpecies::CO2)] = e[kC];
  n[at(FlueSpecies::H2O)] = 0.5 * e[kH];
  n[at(FlueSpecies::O2)] = std::max(0.0, 0.5 * (oxygen_beyond_co(e) - e[kC] - 0.5 * e[kH]));
  return flue;
}

// Complete-combustion products of the element amounts `e` (see the header comment).
FlueGas products(const ElementMoles& e, double shift_K, const SpeciesDatabase& database) {
  const double carbon = e[kC];
  const double hydrogen = 0.5 * e[kH];  // as H2
  const double spare = oxygen_beyond_co(e);
  const double rounding = 1e-12 * (carbon + hydrogen + e[kO]);
  if (spare >= carbon + hydrogen - rounding) return lean_products(e);
  FlueGas flue = lean_products(e);
  auto& n = flue.mol_per_kg;
  n[at(FlueSpecies::O2)] = 0.0;
  // Rich: x = CO2, y = spare - x = H2O, with K = x (hydrogen - y) / ((carbon - x) y).
  const double K = shift_constant(shift_K, database);
  const double low = std::max(0.0, spare - hydrogen);
  const double high = std::min(carbon, spare);
  // f rises monotonically from f(low) <= 0 to f(high) >= 0 (up to rounding at the ends).
  const auto f = [&](double co2) { return co2 * (hydrogen - spare + co2) - K * (carbon - co2) * (spare - co2); };
  double x = low;
  if (!(high > low) || f(low) >= 0.0) {
    x = low;
  } else if (f(high) <= 0.0) {
    x = high;
  } else {
    std::uintmax_t iterations = 200;
    const auto [a, b] = boost::math::tools::toms748_solve(f, low, high, boost::math::tools::eps_tolerance<double>(50),
                                                          iterations);
    x = 0.5 * (a + b);
  }
  const double y = std::clamp(spare - x, 0.0, hydrogen);
  n[at(FlueSpecies::CO2)] = x;
  n[at(FlueSpecies::CO)] = std::max(0.0, carbon - x);
  n[at(FlueSpecies::H2O)] = y;
  n[at(FlueSpecies::H2)] = std::max(0.0, hydrogen - y);
  return flue;
}

double cubic_feet_per_cubic_metre() { return 1.0 / (units::kFoot_m * units::kFoot_m * units::kFoot_m); }
double joules_per_MMBtu() { return 1e6 * units::kBtuIT_J; }

}  // namespace

std::string_view to_string(GasBasis basis) { return basis == GasBasis::wet ? "wet" : "dry"; }
std::string_view to_string(HeatInputBasis basis) { return basis == HeatInputBasis::hhv ? "HHV" : "LHV"; }

OperatingPoint OperatingPoint::with_excess_air(double fraction, std::string field) {
  OperatingPoint op;
  op.specification = AirSpecification::excess_air;
  op.value = fraction;
  op.field = std::move(field);
  return op;
}

OperatingPoint OperatingPoint::with_air_ratio(double lambda, std::string field) {
  OperatingPoint op;
  op.specification = AirSpecification::air_ratio;
  op.value = lambda;
  op.field = std::move(field);
  return op;
}

OperatingPoint OperatingPoint::with_equivalence_ratio(double phi, std::string field) {
  OperatingPoint op;
  op.specification = AirSpecification::equivalence_ratio;
  op.value = phi;
  op.field = std::move(field);
  return op;
}

OperatingPoint OperatingPoint::with_flue_o2(double fraction, GasBasis basis, std::string field) {
  OperatingPoint op;
  op.specification = AirSpecification::flue_o2;
  op.value = fraction;
  op.flue_o2_basis = basis;
  op.field = std::move(field);
  return op;
}

// ---------------------------------------------------------------------------------------------------

double FlueGas::total_mol_per_kg(GasBasis basis) const {
  double total = 0.0;
  for (double n : mol_per_kg) total += n;
  return basis == GasBasis::wet ? total : total - amount(FlueSpecies::H2O);
}

double FlueGas::mole_fraction(FlueSpecies species, GasBasis basis) const {
  if (basis == GasBasis::dry && species == FlueSpecies::H2O) return 0.0;
  const double total = total_mol_per_kg(basis);
  return total > 0.0 ? amount(species) / total : 0.0;
}

std::vector<std::pair<std::string, double>> FlueGas::mole_fractions(GasBasis basis) const {
  std::vector<std::pair<std::string, double>> fractions;
  for (std::size_t i = 0; i < kFlueSpeciesCount; ++i) {
    const auto species = static_cast<FlueSpecies>(i);
    if (mol_per_kg[i] > 0.0 && !(basis == GasBasis::dry && species == FlueSpecies::H2O)) {
      fractions.emplace_back(kFlueSpeciesNames[i], mole_fraction(species, basis));
    }
  }
  return fractions;
}

double FlueGas::mass_kg_per_kg(GasBasis basis) const {
  double mass = 0.0;
  for (std::size_t i = 0; i < kFlueSpeciesCount; ++i) {
    if (basis == GasBasis::dry && static_cast<FlueSpecies>(i) == FlueSpecies::H2O) continue;
    mass += mol_per_kg[i] * flue_molar_masses()[i];
  }
  return mass;
}

ElementMoles FlueGas::element_mol_per_kg() const {
  using F = FlueSpecies;
  ElementMoles e{};
  e[kC] = amount(F::CO2) + amount(F::CO);
  e[kH] = 2.0 * (amount(F::H2O) + amount(F::H2));
  e[kO] = 2.0 * amount(F::CO2) + amount(F::CO) + amount(F::H2O) + 2.0 * amount(F::O2) + 2.0 * amount(F::SO2);
  e[kN] = 2.0 * amount(F::N2);
  e[kS] = amount(F::SO2);
  e[kAr] = amount(F::Ar);
  e[kHe] = amount(F::He);
  return e;
}

double FFactors::fd_dscf_per_MMBtu() const { return fd_m3_per_J * cubic_feet_per_cubic_metre() * joules_per_MMBtu(); }
double FFactors::fw_wscf_per_MMBtu() const { return fw_m3_per_J * cubic_feet_per_cubic_metre() * joules_per_MMBtu(); }
double FFactors::fc_scf_per_MMBtu() const { return fc_m3_per_J * cubic_feet_per_cubic_metre() * joules_per_MMBtu(); }

FFactors f_factors(const Fuel& fuel) {
  const Oxidant dry_air;  // standard dry air, Method 19's combustion air
  const double n_st = stoichiometric_oxidant_mol_per_kg(fuel, dry_air);
  const FlueGas flue = lean_products(add(fuel.element_mol_per_kg(), oxidant_elements_per_mol(dry_air), n_st));
  const double molar_volume = units::normal_20C().molar_volume_m3_per_mol();
  const double hhv = fuel.hhv_J_per_kg();
  FFactors f;
  f.fd_m3_per_J = flue.total_mol_per_kg(GasBasis::dry) * molar_volume / hhv;
  f.fw_m3_per_J = flue.total_mol_per_kg(GasBasis::wet) * molar_volume / hhv;
  f.fc_m3_per_J = fuel.element_mol_per_kg()[kC] * molar_volume / hhv;
  return f;
}

double stoichiometric_oxidant_mol_per_kg(const Fuel& fuel, const Oxidant& oxidant) {
  return fuel.oxygen_required_mol_per_kg() / oxidant.o2_wet();
}

double resolve_air_ratio(const Fuel& fuel, const Oxidant& oxidant, const OperatingPoint& op) {
  const double v = op.value;
  if (!std::isfinite(v)) throw units::InputError(fmt::format("{} = {}: not a finite number", op.field, v));
  const auto check_lambda = [&](double lambda, const std::string& shown) {
    if (!(lambda > 0.0) || lambda > kMaximumAirRatio) {
      throw units::InputError(fmt::format("{} = {}: the air ratio lambda would be {:.6g}; it must be above 0 and at "
                                          "most {} (excess air above -100 %, phi at least {:.3g})",
                                          op.field, shown, lambda, kMaximumAirRatio, 1.0 / kMaximumAirRatio));
    }
    return lambda;
  };
  switch (op.specification) {
    case AirSpecification::excess_air:
      return check_lambda(1.0 + v, fmt::format("{:.6g} %", v * 100.0));
    case AirSpecification::air_ratio:
      return check_lambda(v, fmt::format("{:.6g}", v));
    case AirSpecification::equivalence_ratio:
      if (!(v > 0.0)) {
        throw units::InputError(fmt::format("{} = {:.6g}: the equivalence ratio phi must be above 0", op.field, v));
      }
      return check_lambda(1.0 / v, fmt::format("{:.6g}", v));
    case AirSpecification::flue_o2: break;
  }
  // Solve from the flue O2 (see the header comment).
  const GasBasis basis = op.flue_o2_basis;
  const double oxidant_o2 = basis == GasBasis::wet ? oxidant.o2_wet() : oxidant.o2_dry();
  if (v < 0.0 || v >= oxidant_o2) {
    throw units::InputError(fmt::format("{} = {:.6g} % ({}): the flue O2 must be at least 0 % and below the "
                                        "oxidant's O2, {:.4g} % ({}); at or above it there would be no fuel burning",
                                        op.field, v * 100.0, to_string(basis), oxidant_o2 * 100.0, to_string(basis)));
  }
  const double n_st = stoichiometric_oxidant_mol_per_kg(fuel, oxidant);
  // Flue moles at lambda = 1 (no CO/H2 there); the water-gas shift is not needed.
  const FlueGas at_one = lean_products(add(fuel.element_mol_per_kg(), oxidant_elements_per_mol(oxidant), n_st));
  const double x_o2 = oxidant.o2_wet();
  const double x_w = oxidant.water_mole_fraction();
  const double excess_oxidant =
      basis == GasBasis::wet ? v * at_one.total_mol_per_kg(GasBasis::wet) / (x_o2 - v)
                             : v * at_one.total_mol_per_kg(GasBasis::dry) / (x_o2 - v * (1.0 - x_w));
  return check_lambda(1.0 + excess_oxidant / n_st, fmt::format("{:.6g} % ({})", v * 100.0, to_string(basis)));
}

CombustionResult burn(const Fuel& fuel, const Oxidant& oxidant, const OperatingPoint& op,
                      const SpeciesDatabase& database) {
  CombustionResult r;
  r.warnings = fuel.warnings();
  r.air_ratio = resolve_air_ratio(fuel, oxidant, op);
  r.hhv_J_per_kg = fuel.hhv_J_per_kg();
  r.lhv_J_per_kg = fuel.lhv_J_per_kg();
  r.ash_kg_per_kg = fuel.ash_mass_fraction();

  const double T_fuel = op.fuel_temperature.value();
  if (!std::isfinite(T_fuel) || T_fuel < 200.0 || T_fuel > 3000.0) {
    throw units::InputError(fmt::format("{} = {:.6g} K: must be between 200 K and 3000 K", op.fuel_temperature_field,
                                        T_fuel));
  }
  const double p_flue = op.flue_pressure.value();
  if (!std::isfinite(p_flue) || p_flue <= 0.0) {
    throw units::InputError(fmt::format("flue pressure = {:.6g} Pa: must be above 0", p_flue));
  }
  r.fuel_temperature_K = T_fuel;
  r.oxidant_temperature_K = oxidant.temperature_K();
  r.flue_pressure_Pa = p_flue;
  r.shift_temperature_K = op.shift_temperature.value();

  // Oxidant.
  r.stoichiometric_oxidant_mol_per_kg = stoichiometric_oxidant_mol_per_kg(fuel, oxidant);
  r.oxidant_mol_per_kg = r.air_ratio * r.stoichiometric_oxidant_mol_per_kg;
  const double dry_share = 1.0 - oxidant.water_mole_fraction();
  r.stoichiometric_oxidant_wet_kg_per_kg = r.stoichiometric_oxidant_mol_per_kg * oxidant.molar_mass_kg_per_mol();
  r.stoichiometric_air_kg_per_kg =
      r.stoichiometric_oxidant_mol_per_kg * dry_share * oxidant.dry_molar_mass_kg_per_mol();
  r.oxidant_kg_per_kg = r.oxidant_mol_per_kg * oxidant.molar_mass_kg_per_mol();
  r.dry_oxidant_kg_per_kg = r.oxidant_mol_per_kg * dry_share * oxidant.dry_molar_mass_kg_per_mol();

  // Reactants.
  r.fuel_element_mol_per_kg = fuel.element_mol_per_kg();
  const ElementMoles per_mol_oxidant = oxidant_elements_per_mol(oxidant);
  r.oxidant_element_mol_per_kg = add(ElementMoles{}, per_mol_oxidant, r.oxidant_mol_per_kg);
  r.reactant_element_mol_per_kg = add(r.fuel_element_mol_per_kg, per_mol_oxidant, r.oxidant_mol_per_kg);
  r.fuel_enthalpy_J_per_kg = fuel.enthalpy(units::kelvin(T_fuel), database).value();
  r.oxidant_enthalpy_J_per_kg = r.oxidant_mol_per_kg * oxidant.enthalpy_J_per_mol(database);
  r.reactant_enthalpy_J_per_kg = r.fuel_enthalpy_J_per_kg + r.oxidant_enthalpy_J_per_kg;
  if (!fuel.sensible_heat_known() && std::abs(T_fuel - units::kReferenceTemperature_K) > 0.5) {
    r.warnings.push_back({op.fuel_temperature_field, fmt::format("{:.2f} K", T_fuel),
                          "no specific heat was given for the liquid/solid fuel, so its sensible heat above 298.15 K "
                          "is left out of the reactant enthalpy"});
  }

  // Products.
  const ElementMoles& e = r.reactant_element_mol_per_kg;
  if (r.air_ratio < 1.0) {
    if (oxygen_beyond_co(e) < 0.0) {
      // lambda at which all carbon just reaches CO: the spare oxygen is linear in lambda.
      const double at_zero = oxygen_beyond_co(fuel.element_mol_per_kg());
      const double slope = oxygen_beyond_co(add(ElementMoles{}, per_mol_oxidant, r.stoichiometric_oxidant_mol_per_kg));
      throw units::InputError(fmt::format(
          "{}: the air ratio lambda = {:.4g} is too low for the complete-combustion estimate: below lambda = {:.4g} not "
          "all carbon reaches CO (soot or unburned fuel would remain); use the equilibrium calculation",
          op.field, r.air_ratio, -at_zero / slope));
    }
    const double T_shift = r.shift_temperature_K;
    if (!std::isfinite(T_shift) || T_shift < 300.0 || T_shift > 3000.0) {
      throw units::InputError(fmt::format("water-gas shift temperature = {:.6g} K: must be between 300 K and 3000 K",
                                          T_shift));
    }
    r.warnings.push_back({op.field, fmt::format("lambda = {:.4g}", r.air_ratio), fmt::format(
        "sub-stoichiometric: CO and H2 are split by the water-gas-shift equilibrium at {:.0f} K, a "
        "convention of this complete-combustion estimate; the equilibrium calculation gives the actual composition",
        T_shift)});
  }
  r.flue = products(e, r.shift_temperature_K, database);
  r.flue_o2_dry = r.flue.mole_fraction(FlueSpecies::O2, GasBasis::dry);
  r.flue_o2_wet = r.flue.mole_fraction(FlueSpecies::O2, GasBasis::wet);
  r.flue_co2_dry = r.flue.mole_fraction(FlueSpecies::CO2, GasBasis::dry);
  r.moisture_fraction = r.flue.mole_fraction(FlueSpecies::H2O, GasBasis::wet);
  const std::optional<units::Temperature> dew_point =
      water_dew_point(units::pascals(r.moisture_fraction * p_flue), "flue water partial pressure");
  if (dew_point) r.water_dew_point_K = dew_point->value();
  r.f_factors = f_factors(fuel);
  return r;
}

// ---------------------------------------------------------------------------------------------------

FuelFeed resolve_feed(const Fuel& fuel, const units::ParsedQuantity& rate, HeatInputBasis basis,
                      std::string_view field) {
  using D = units::Dimension;
  const std::string shown =
      rate.unit != nullptr
          ? fmt::format("{:.6g} {}", units::convert_from_si(rate.value_si, rate.dimension, rate.unit->symbol),
                        rate.unit->symbol)
          : fmt::format("{:.6g}", rate.value_si);
  if (!std::isfinite(rate.value_si) || rate.value_si <= 0.0) {
    throw units::InputError(fmt::format("{} = \"{}\": a fuel rate must be above 0", field, shown));
  }
  FuelFeed feed;
  const double heating_value = basis == HeatInputBasis::hhv ? fuel.hhv_J_per_kg() : fuel.lhv_J_per_kg();
  switch (rate.dimension) {
    case D::mass_flow:
      feed.mass_flow_kg_per_s = rate.value_si;
      feed.given = shown + " (mass flow)";
      break;
    case D::power:
      if (!(heating_value > 0.0)) {
        throw units::InputError(fmt::format("{} = \"{}\": the fuel's {} is not above 0, so a heat input cannot give a "
                                            "fuel rate",
                                            field, shown, to_string(basis)));
      }
      feed.mass_flow_kg_per_s = rate.value_si / heating_value;
      feed.given = fmt::format("{} (heat input, {} basis)", shown, to_string(basis));
      break;
    case D::molar_flow: {
      const auto molar_mass = fuel.molar_mass_kg_per_mol();
      if (!molar_mass) {
        throw units::InputError(fmt::format("{} = \"{}\": a molar or normal-volume flow needs a gas fuel; give {} as a "
                                            "mass flow (t/h, kg/h, lb/h) or a heat input (MW, MMBtu/h)",
                                            field, shown, fuel.name()));
      }
      feed.mass_flow_kg_per_s = rate.value_si * *molar_mass;
      feed.molar_flow_mol_per_s = rate.value_si;
      feed.given = shown + (rate.unit != nullptr && rate.unit->normal != nullptr
                                ? fmt::format(" (normal-volume flow; {} at {:.2f} K and {:.3f} kPa)", rate.unit->symbol,
                                              rate.unit->normal->temperature_K, rate.unit->normal->pressure_Pa * 1e-3)
                                : std::string(" (molar flow)"));
      break;
    }
    default:
      throw units::InputError(fmt::format("{} = \"{}\": expected a mass flow (kg/h, t/h, lb/h), a molar or "
                                          "normal-volume flow (kmol/h, Nm3/h, scfm) or a heat input (MW, MMBtu/h)",
                                          field, shown));
  }
  if (const auto molar_mass = fuel.molar_mass_kg_per_mol(); molar_mass && !feed.molar_flow_mol_per_s) {
    feed.molar_flow_mol_per_s = feed.mass_flow_kg_per_s / *molar_mass;
  }
  feed.heat_input_hhv_W = feed.mass_flow_kg_per_s * fuel.hhv_J_per_kg();
  feed.heat_input_lhv_W = feed.mass_flow_kg_per_s * fuel.lhv_J_per_kg();
  return feed;
}

FuelFeed resolve_feed(const Fuel& fuel, std::string_view rate_text, HeatInputBasis basis, std::string_view field) {
  using D = units::Dimension;
  return resolve_feed(fuel, units::parse_quantity(rate_text, field, {D::mass_flow, D::molar_flow, D::power}), basis,
                      field);
}

CombustionRates rates(const CombustionResult& result, const FuelFeed& feed) {
  const double m = feed.mass_flow_kg_per_s;
  CombustionRates out;
  out.feed = feed;
  out.oxidant_mol_per_s = result.oxidant_mol_per_kg * m;
  out.oxidant_kg_per_s = result.oxidant_kg_per_kg * m;
  for (std::size_t i = 0; i < kFlueSpeciesCount; ++i) out.flue_mol_per_s[i] = result.flue.mol_per_kg[i] * m;
  out.flue_wet_mol_per_s = result.flue.total_mol_per_kg(GasBasis::wet) * m;
  out.flue_dry_mol_per_s = result.flue.total_mol_per_kg(GasBasis::dry) * m;
  out.flue_kg_per_s = result.flue.mass_kg_per_kg(GasBasis::wet) * m;
  out.ash_kg_per_s = result.ash_kg_per_kg * m;
  for (std::size_t k = 0; k < out.reactant_element_mol_per_s.size(); ++k) {
    out.reactant_element_mol_per_s[k] = result.reactant_element_mol_per_kg[k] * m;
  }
  out.reactant_enthalpy_W = result.reactant_enthalpy_J_per_kg * m;
  return out;
}

}  // namespace stackbound::core
