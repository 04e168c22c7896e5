#include "stackbound/core/fuel.hpp"

#include <algorithm>
#include <cassert>
#include <cmath>
#include <numeric>

#include <fmt/format.h>

#include "stackbound/core/elements.hpp"
#include "stackbound/units/constants.hpp"
#include "stackbound/units/input_error.hpp"

namespace stackbound::core {

namespace {

constexpr double kT0_K = units::kReferenceTemperature_K;
constexpr double kR = units::kGasConstant_J_per_mol_K;

// Indices into ElementMoles, checked against known_elements() in element_indices_are_consistent().
constexpr std::size_t kC = 0, kH = 1, kO = 2, kN = 3, kS = 4, kAr = 5, kHe = 6;

[[maybe_unused]] bool element_indices_are_consistent() {
  return element_index("C") == kC && element_index("H") == kH && element_index("O") == kO &&
         element_index("N") == kN && element_index("S") == kS && element_index("Ar") == kAr &&
         element_index("He") == kHe && known_elements().size() == std::tuple_size_v<ElementMoles>;
}

double atomic_weight_kg_per_mol(std::size_t index) { return known_elements()[index].atomic_weight_g_per_mol * 1e-3; }
double water_molar_mass_kg_per_mol() { return 2.0 * atomic_weight_kg_per_mol(kH) + atomic_weight_kg_per_mol(kO); }

// h(298.15 K) of a species in the database, J/mol; InputError if the data lack it.
double h298_J_per_mol(const SpeciesDatabase& database, std::string_view formula) {
  return kR * kT0_K * database.at(formula, "species data needed for heating values").h_over_RT(units::kelvin(kT0_K));
}

double liquid_water_h298_J_per_mol(const SpeciesDatabase& database) {
  return h298_J_per_mol(database, "H2O") - kWaterVaporisationEnthalpy298_J_per_mol;
}

double oxygen_required(const ElementMoles& e) { return e[kC] + 0.25 * e[kH] + e[kS] - 0.5 * e[kO]; }

// Enthalpy at 298.15 K of the complete-combustion products of `e` (CO2, H2O, SO2, N2, Ar, He) minus
// that of the O2 they consumed, J. Water liquid or gaseous as asked.
double products_minus_oxygen_h298(const ElementMoles& e, const SpeciesDatabase& database, bool liquid_water) {
  double h = 0.0;
  if (e[kC] > 0.0) h += e[kC] * h298_J_per_mol(database, "CO2");
  if (e[kH] > 0.0) {
    h += 0.5 * e[kH] * (liquid_water ? liquid_water_h298_J_per_mol(database) : h298_J_per_mol(database, "H2O"));
  }
  if (e[kS] > 0.0) h += e[kS] * h298_J_per_mol(database, "SO2");
  if (e[kN] > 0.0) h += 0.5 * e[kN] * h298_J_per_mol(database, "N2");
  if (e[kAr] > 0.0) h += e[kAr] * h298_J_per_mol(database, "Ar");
  if (e[kHe] > 0.0) h += e[kHe] * h298_J_per_mol(database, "He");
  h -= oxygen_required(e) * h298_J_per_mol(database, "O2");
  return h;
}

std::string percent_text(double value) { return fmt::format("{:.6g} %", value); }

void require_percent(double value, const std::string& field) {
  if (!std::isfinite(value)) throw units::InputError(fmt::format("{} = {}: not a finite number", field, value));
  if (value < 0.0) {
    throw units::InputError(fmt::format("{} = {}: must be >= 0 % (mass or mole percent)", field, percent_text(value)));
  }
  if (value > 100.0 + kSumTolerance_percent) {
    throw units::InputError(fmt::format("{} = {}: must be <= 100 %", field, percent_text(value)));
  }
}

// Checks that `sum` (percent) is 100 within kSumTolerance_percent; returns the factor that
// normalises it, adding a warning when the correction exceeds rounding.
double normalising_factor(double sum, const std::string& field, std::string_view what,
                          std::vector<units::Warning>& warnings) {
  if (!(sum > 0.0)) throw units::InputError(fmt::format("{}: the {} sum to 0 %; give percentages adding up to 100 %", field, what));
  const double difference = sum - 100.0;
  if (std::abs(difference) > kSumTolerance_percent) {
    std::string hint = std::abs(sum - 1.0) < 0.05 ? "; they look like fractions: give percent (e.g. 93 %, not 0.93)"
                                                  : "; check for a missing or mistyped component";
    throw units::InputError(fmt::format("{}: the {} sum to {:.6g} %, which is more than {} percentage point from 100 %{}",
                                        field, what, sum, kSumTolerance_percent, hint));
  }
  if (std::abs(difference) > 0.01) {
    warnings.push_back({field, fmt::format("{:.4g} %", sum), fmt::format("the {} sum to {:.4g} %; normalised to 100 %", what, sum)});
  }
  return 100.0 / sum;
}

}  // namespace

std::string_view to_string(FuelState state) {
  switch (state) {
    case FuelState::gas: return "gas";
    case FuelState::liquid: return "liquid";
    case FuelState::solid: return "solid";
    case FuelState::blend: return "blend";
  }
  return "fuel";
}

std::string_view to_string(AnalysisBasis basis) {
  switch (basis) {
    case AnalysisBasis::as_received: return "as-received";
    case AnalysisBasis::dry: return "dry";
    case AnalysisBasis::dry_ash_free: return "dry ash-free";
  }
  return "basis";
}

std::string_view to_string(HeatingValueKind kind) { return kind == HeatingValueKind::higher ? "HHV" : "LHV"; }

std::string_view to_string(BlendBasis basis) {
  switch (basis) {
    case BlendBasis::mass: return "mass";
    case BlendBasis::mole: return "mole";
    case BlendBasis::heat_input: return "heat input (HHV)";
  }
  return "basis";
}

std::string_view correlation_name(HeatingValueCorrelation correlation) {
  return correlation == HeatingValueCorrelation::channiwala_parikh ? "Channiwala & Parikh (2002)" : "Boie (1953)";
}

std::string_view correlation_citation(HeatingValueCorrelation correlation) {
  return correlation == HeatingValueCorrelation::channiwala_parikh
             ? "S. A. Channiwala, P. P. Parikh, Fuel 81 (2002) 1051-1063, unified HHV correlation (coefficients from memory)"
             : "W. Boie, Energietechnik 3 (1953) 309-316 (coefficients from memory)";
}

// ---------------------------------------------------------------------------------------------------
// Gas fuels

Fuel Fuel::gas(const GasFuelSpec& spec, const SpeciesDatabase& database) {
  assert(element_indices_are_consistent() && "ElementMoles indices must follow known_elements()");
  if (spec.composition_percent.empty()) {
    throw units::InputError(fmt::format("{}: empty composition; give at least one species with its percentage",
                                        spec.field));
  }
  Fuel fuel;
  fuel.name_ = spec.name;
  fuel.state_ = FuelState::gas;
  const std::string_view basis_word = spec.basis == CompositionBasis::mole ? "mole" : "mass";
  std::vector<const Species*> species;
  double sum = 0.0;
  for (const auto& [formula, percent] : spec.composition_percent) {
    const Species& s = database.at(formula, spec.field);
    if (!s.is_gas()) {
      throw units::InputError(fmt::format("{} = \"{}\": {} is a condensed species; a gas fuel holds gas species only "
                                          "(give liquid or solid fuels by ultimate analysis)",
                                          spec.field, formula, formula));
    }
    if (std::find(species.begin(), species.end(), &s) != species.end()) {
      throw units::InputError(fmt::format("{} = \"{}\": listed twice; give each species once", spec.field, formula));
    }
    require_percent(percent, fmt::format("{}.{}", spec.field, formula));
    species.push_back(&s);
    sum += percent;
  }
  const double factor =
      normalising_factor(sum, spec.field, fmt::format("{} percentages", basis_word), fuel.warnings_);

  // mol of each species per kg of fuel
  double denominator = 0.0;  // kg per (sum of mole fractions) or 1 for mass basis
  if (spec.basis == CompositionBasis::mole) {
    for (std::size_t i = 0; i < species.size(); ++i) {
      denominator += spec.composition_percent[i].second * factor / 100.0 * species[i]->molar_mass_kg_per_mol();
    }
  }
  for (std::size_t i = 0; i < species.size(); ++i) {
    const double fraction = spec.composition_percent[i].second * factor / 100.0;
    if (fraction == 0.0) continue;
    const double mol_per_kg = spec.basis == CompositionBasis::mole ? fraction / denominator
                                                                   : fraction / species[i]->molar_mass_kg_per_mol();
    fuel.gas_mol_per_kg_.emplace_back(species[i]->formula(), mol_per_kg);
    for (const ElementCount& count : species[i]->composition()) {
      fuel.element_mol_per_kg_[element_index(count.element)] += mol_per_kg * count.count;
    }
  }

  double reactants_h = 0.0;
  for (const auto& [formula, mol_per_kg] : fuel.gas_mol_per_kg_) reactants_h += mol_per_kg * h298_J_per_mol(database, formula);
  fuel.lhv_J_per_kg_ = reactants_h - products_minus_oxygen_h298(fuel.element_mol_per_kg_, database, false);
  fuel.hhv_J_per_kg_ = fuel.lhv_J_per_kg_ + fuel.water_formed_mol_per_kg() * kWaterVaporisationEnthalpy298_J_per_mol;
  fuel.heating_value_method_ =
      "computed from the species data at 298.15 K (ideal gas; HHV with all water condensed)";
  if (!(fuel.lhv_J_per_kg_ > 0.0) || !(fuel.oxygen_required_mol_per_kg() > 0.0)) {
    throw units::InputError(fmt::format("{}: this gas does not burn (LHV {:.4g} MJ/kg, O2 demand {:.4g} mol/kg); a fuel "
                                        "needs combustible species such as CH4, H2 or CO",
                                        spec.field, fuel.lhv_J_per_kg_ * 1e-6, fuel.oxygen_required_mol_per_kg()));
  }
  return fuel;
}

// ---------------------------------------------------------------------------------------------------
// Liquid and solid fuels

namespace {

// As-received mass fractions of a validated ultimate analysis.
struct AsReceived {
  double carbon = 0.0, hydrogen = 0.0, oxygen = 0.0, nitrogen = 0.0, sulfur = 0.0, ash = 0.0, moisture = 0.0;
  // Multiplier turning a quantity per kg on `basis` into per kg as received.
  [[nodiscard]] double factor(AnalysisBasis basis) const {
    switch (basis) {
      case AnalysisBasis::as_received: return 1.0;
      case AnalysisBasis::dry: return 1.0 - moisture;
      case AnalysisBasis::dry_ash_free: return 1.0 - moisture - ash;
    }
    return 1.0;
  }
};

AsReceived as_received(const UltimateAnalysis& a, const std::string& field, std::vector<units::Warning>& warnings) {
  const std::string f = field + ".ultimate";
  require_percent(a.carbon_percent, f + ".C");
  require_percent(a.hydrogen_percent, f + ".H");
  require_percent(a.nitrogen_percent, f + ".N");
  require_percent(a.sulfur_percent, f + ".S");
  require_percent(a.ash_percent, f + ".ash");
  require_percent(a.moisture_percent, f + ".moisture");
  if (a.oxygen_percent) require_percent(*a.oxygen_percent, f + ".O");

  // The components that make up the basis sum, and the as-received moisture and ash outside it.
  const bool ash_inside = a.basis != AnalysisBasis::dry_ash_free;
  const bool moisture_inside = a.basis == AnalysisBasis::as_received;
  const double rest = a.carbon_percent + a.hydrogen_percent + a.nitrogen_percent + a.sulfur_percent +
                      (ash_inside ? a.ash_percent : 0.0) + (moisture_inside ? a.moisture_percent : 0.0);
  double oxygen = 0.0;
  if (a.oxygen_percent) {
    oxygen = *a.oxygen_percent;
  } else {
    oxygen = 100.0 - rest;
    if (oxygen < -1e-9) {
      throw units::InputError(fmt::format("{}.O: oxygen by difference would be {:.4g} % ({} basis: the other components sum "
                                          "to {:.6g} %, above 100 %)",
                                          f, oxygen, to_string(a.basis), rest));
    }
    oxygen = std::max(0.0, oxygen);
  }
  const std::string what = fmt::format("{} ultimate-analysis percentages{}", to_string(a.basis),
                                       a.basis == AnalysisBasis::as_received ? " (C, H, O, N, S, ash, moisture)"
                                       : a.basis == AnalysisBasis::dry      ? " (C, H, O, N, S, ash)"
                                                                            : " (C, H, O, N, S)");
  const double factor = normalising_factor(rest + oxygen, f, what, warnings);

  // As-received moisture and ash outside the basis sum (daf: ash given on the dry basis).
  const double moisture_outside = moisture_inside ? 0.0 : a.moisture_percent / 100.0;
  const double ash_outside = ash_inside ? 0.0 : a.ash_percent / 100.0 * (1.0 - moisture_outside);
  if (!(moisture_outside < 1.0) || (!ash_inside && !(a.ash_percent < 100.0))) {
    throw units::InputError(fmt::format("{}: moisture {} (as received){} leave no fuel; each must be below 100 %", f,
                                        percent_text(a.moisture_percent),
                                        ash_inside ? "" : fmt::format(" and ash {} (dry)", percent_text(a.ash_percent))));
  }
  const double scale = factor / 100.0 * (1.0 - moisture_outside - ash_outside);
  AsReceived r;
  r.carbon = a.carbon_percent * scale;
  r.hydrogen = a.hydrogen_percent * scale;
  r.oxygen = oxygen * scale;
  r.nitrogen = a.nitrogen_percent * scale;
  r.sulfur = a.sulfur_percent * scale;
  r.ash = ash_inside ? a.ash_percent * scale : ash_outside;
  r.moisture = moisture_inside ? a.moisture_percent * scale : moisture_outside;
  if (!(r.carbon + r.hydrogen + r.sulfur > 0.0)) {
    throw units::InputError(fmt::format("{}: no carbon, hydrogen or sulfur; nothing in this fuel burns", f));
  }
  return r;
}

// Water formed per kg as received (from hydrogen and moisture), kg/kg.
double water_formed_kg_per_kg(const AsReceived& r) {
  return r.hydrogen * water_molar_mass_kg_per_mol() / (2.0 * atomic_weight_kg_per_mol(kH)) + r.moisture;
}

double vaporisation_J_per_kg_water() { return kWaterVaporisationEnthalpy298_J_per_mol / water_molar_mass_kg_per_mol(); }

UltimateAnalysis dry_analysis(const AsReceived& r) {
  const double d = 1.0 - r.moisture;
  UltimateAnalysis dry;
  dry.basis = AnalysisBasis::dry;
  dry.carbon_percent = 100.0 * r.carbon / d;
  dry.hydrogen_percent = 100.0 * r.hydrogen / d;
  dry.oxygen_percent = 100.0 * r.oxygen / d;
  dry.nitrogen_percent = 100.0 * r.nitrogen / d;
  dry.sulfur_percent = 100.0 * r.sulfur / d;
  dry.ash_percent = 100.0 * r.ash / d;
  return dry;
}

double correlation_MJ_per_kg(const UltimateAnalysis& dry, HeatingValueCorrelation correlation) {
  const double C = dry.carbon_percent, H = dry.hydrogen_percent, O = dry.oxygen_percent.value_or(0.0),
               N = dry.nitrogen_percent, S = dry.sulfur_percent, A = dry.ash_percent;
  if (correlation == HeatingValueCorrelation::channiwala_parikh) {
    return 0.3491 * C + 1.1783 * H + 0.1005 * S - 0.1034 * O - 0.0151 * N - 0.0211 * A;
  }
  return 0.3516 * C + 1.16225 * H - 0.1109 * O + 0.0628 * N + 0.10465 * S;
}

}  // namespace

double estimate_hhv_dry_J_per_kg(const UltimateAnalysis& analysis, HeatingValueCorrelation correlation) {
  std::vector<units::Warning> ignored;
  return 1e6 * correlation_MJ_per_kg(dry_analysis(as_received(analysis, "analysis", ignored)), correlation);
}

namespace {

// An as-received HHV and how it was obtained.
struct HeatingValue {
  double hhv_J_per_kg = 0.0;
  std::string method;
};

// From a measured HHV or LHV on its basis (`hv_field` names it in messages). A large gap to a
// published correlation's estimate for the analysis is warned about: it usually means a basis or
// unit mix-up.
HeatingValue measured_heating_value(const MeasuredHeatingValue& hv, const AsReceived& r, const UltimateAnalysis& dry,
                                    const std::string& hv_field, std::vector<units::Warning>& warnings) {
  if (!std::isfinite(hv.value_J_per_kg) || hv.value_J_per_kg <= 0.0) {
    throw units::InputError(fmt::format("{} = {:.6g} MJ/kg: a heating value must be a finite number above 0", hv_field,
                                        hv.value_J_per_kg * 1e-6));
  }
  if (hv.value_J_per_kg > 150e6) {
    throw units::InputError(fmt::format("{} = {:.6g} MJ/kg: above the HHV of hydrogen (141.8 MJ/kg); check the unit",
                                        hv_field, hv.value_J_per_kg * 1e-6));
  }
  const double to_ar = r.factor(hv.basis);
  if (!(to_ar > 0.0)) {
    throw units::InputError(
        fmt::format("{}: a {} heating value needs moisture and ash below 100 %", hv_field, to_string(hv.basis)));
  }
  double hhv_on_basis = hv.value_J_per_kg;
  if (hv.kind == HeatingValueKind::lower) {
    // water formed per kg on the heating value's basis: hydrogen water, plus moisture when as received
    const double water_on_basis =
        (water_formed_kg_per_kg(r) - (hv.basis == AnalysisBasis::as_received ? 0.0 : r.moisture)) / to_ar;
    hhv_on_basis += vaporisation_J_per_kg_water() * water_on_basis;
  }
  HeatingValue value;
  value.hhv_J_per_kg = hhv_on_basis * to_ar;
  value.method = fmt::format("measured {}, {} basis, {:.6g} MJ/kg", to_string(hv.kind), to_string(hv.basis),
                             hv.value_J_per_kg * 1e-6);
  const double estimate =
      1e6 * correlation_MJ_per_kg(dry, HeatingValueCorrelation::channiwala_parikh) * (1.0 - r.moisture);
  const double gap = value.hhv_J_per_kg / estimate - 1.0;
  if (std::abs(gap) > 0.10) {
    warnings.push_back({hv_field, fmt::format("{:.6g} MJ/kg", hv.value_J_per_kg * 1e-6), fmt::format(
        "the HHV ({:.4g} MJ/kg as received) differs by {:+.0f} % from the {} estimate ({:.4g} MJ/kg) for this "
        "analysis; check the heating value's basis and unit",
        value.hhv_J_per_kg * 1e-6, gap * 100.0, correlation_name(HeatingValueCorrelation::channiwala_parikh),
        estimate * 1e-6)});
  }
  return value;
}

// From a correlation on the dry analysis; always warned about, as an estimate is not a measurement.
HeatingValue estimated_heating_value(HeatingValueCorrelation correlation, const AsReceived& r,
                                     const UltimateAnalysis& dry, const std::string& hv_field,
                                     std::vector<units::Warning>& warnings) {
  const double hhv_dry = 1e6 * correlation_MJ_per_kg(dry, correlation);
  if (!(hhv_dry > 0.0)) {
    throw units::InputError(fmt::format("{}: the {} estimate is {:.4g} MJ/kg (dry), not a usable heating value",
                                        hv_field, correlation_name(correlation), hhv_dry * 1e-6));
  }
  HeatingValue value;
  value.hhv_J_per_kg = hhv_dry * (1.0 - r.moisture);
  value.method = fmt::format("estimated HHV ({:.4g} MJ/kg dry) by the {} correlation: {}", hhv_dry * 1e-6,
                             correlation_name(correlation), correlation_citation(correlation));
  warnings.push_back({hv_field, "", fmt::format("the HHV is an estimate by the {} correlation, not a measurement",
                                               correlation_name(correlation))});
  return value;
}

// Element amounts per kg as received, the moisture's water included.
ElementMoles condensed_element_moles(const AsReceived& r) {
  const double water_mol = r.moisture / water_molar_mass_kg_per_mol();
  ElementMoles e{};
  e[kC] = r.carbon / atomic_weight_kg_per_mol(kC);
  e[kH] = r.hydrogen / atomic_weight_kg_per_mol(kH) + 2.0 * water_mol;
  e[kO] = r.oxygen / atomic_weight_kg_per_mol(kO) + water_mol;
  e[kN] = r.nitrogen / atomic_weight_kg_per_mol(kN);
  e[kS] = r.sulfur / atomic_weight_kg_per_mol(kS);
  return e;
}

}  // namespace

Fuel Fuel::condensed(const CondensedFuelSpec& spec, const SpeciesDatabase& database) {
  assert(element_indices_are_consistent() && "ElementMoles indices must follow known_elements()");
  if (spec.state != FuelState::liquid && spec.state != FuelState::solid) {
    throw units::InputError(fmt::format("{}.state = \"{}\": a fuel given by ultimate analysis is liquid or solid",
                                        spec.field, to_string(spec.state)));
  }
  Fuel fuel;
  fuel.name_ = spec.name;
  fuel.state_ = spec.state;
  const AsReceived r = as_received(spec.analysis, spec.field, fuel.warnings_);
  const std::string hv_field = spec.field + ".heating_value";

  if (spec.heating_value && spec.estimate) {
    throw units::InputError(fmt::format("{}: give either a measured heating value or an estimate by a correlation, "
                                        "not both",
                                        hv_field));
  }
  const UltimateAnalysis dry = dry_analysis(r);
  HeatingValue heating_value;
  if (spec.heating_value) {
    heating_value = measured_heating_value(*spec.heating_value, r, dry, hv_field, fuel.warnings_);
  } else if (spec.estimate) {
    heating_value = estimated_heating_value(*spec.estimate, r, dry, hv_field, fuel.warnings_);
  } else {
    throw units::InputError(fmt::format("{}: missing; a liquid or solid fuel needs a measured heating value (HHV or "
                                        "LHV, with its basis) or an estimate by a named correlation "
                                        "(channiwala-parikh, boie)",
                                        hv_field));
  }
  fuel.hhv_J_per_kg_ = heating_value.hhv_J_per_kg;
  fuel.heating_value_method_ = std::move(heating_value.method);
  fuel.lhv_J_per_kg_ = fuel.hhv_J_per_kg_ - vaporisation_J_per_kg_water() * water_formed_kg_per_kg(r);
  if (!(fuel.lhv_J_per_kg_ > 0.0)) {
    fuel.warnings_.push_back({hv_field, "", fmt::format("the LHV as received is {:.4g} MJ/kg: too wet to release net heat",
                                                        fuel.lhv_J_per_kg_ * 1e-6)});
  }

  fuel.element_mol_per_kg_ = condensed_element_moles(r);
  fuel.moisture_kg_per_kg_ = r.moisture;
  fuel.ash_kg_per_kg_ = r.ash;
  fuel.condensed_mass_fraction_ = 1.0;
  fuel.condensed_formation_J_per_kg_ =
      fuel.hhv_J_per_kg_ + products_minus_oxygen_h298(fuel.element_mol_per_kg_, database, true);
  if (spec.specific_heat_J_per_kg_K) {
    const double cp = *spec.specific_heat_J_per_kg_K;
    if (!std::isfinite(cp) || cp <= 0.0 || cp > 10000.0) {
      throw units::InputError(fmt::format("{}.specific_heat = {:.6g} J/(kg K): must be between 0 and 10000 J/(kg K)",
                                          spec.field, cp));
    }
    fuel.condensed_heat_capacity_J_per_kg_K_ = cp;
    fuel.specific_heat_known_ = true;
  }
  return fuel;
}

// ---------------------------------------------------------------------------------------------------
// Blends

Fuel Fuel::blend(std::string name, const std::vector<BlendPart>& parts, BlendBasis basis, std::string field) {
  if (parts.empty()) throw units::InputError(fmt::format("{}: a blend needs at least one part", field));
  Fuel fuel;
  fuel.name_ = std::move(name);
  double sum = 0.0;
  bool all_gas = true;
  for (std::size_t i = 0; i < parts.size(); ++i) {
    require_percent(parts[i].percent, fmt::format("{}[{}] ({}) fraction", field, i, parts[i].fuel.name()));
    sum += parts[i].percent;
    all_gas = all_gas && parts[i].fuel.condensed_mass_fraction() == 0.0;
  }
  if (basis == BlendBasis::mole && !all_gas) {
    throw units::InputError(fmt::format("{}.basis = mole: mole fractions apply to gas fuels only; blend liquid or solid "
                                        "fuels by mass or heat input",
                                        field));
  }
  const double factor = normalising_factor(sum, field, fmt::format("{} fractions", to_string(basis)), fuel.warnings_);

  // Mass fraction of each part.
  std::vector<double> mass(parts.size());
  for (std::size_t i = 0; i < parts.size(); ++i) {
    const double share = parts[i].percent * factor / 100.0;
    switch (basis) {
      case BlendBasis::mass: mass[i] = share; break;
      case BlendBasis::mole: mass[i] = share * parts[i].fuel.molar_mass_kg_per_mol().value_or(0.0); break;
      case BlendBasis::heat_input: mass[i] = share / parts[i].fuel.hhv_J_per_kg(); break;
    }
  }
  const double total = std::accumulate(mass.begin(), mass.end(), 0.0);
  fuel.state_ = all_gas ? FuelState::gas : FuelState::blend;
  fuel.specific_heat_known_ = true;
  for (std::size_t i = 0; i < parts.size(); ++i) {
    const double w = mass[i] / total;
    const Fuel& part = parts[i].fuel;
    if (w == 0.0) continue;
    for (const auto& [formula, n] : part.gas_mol_per_kg_) {
      // Captures a named copy, not the structured binding: capturing a binding is new in C++20 and
      // not every supported compiler has it yet.
      auto found = std::find_if(fuel.gas_mol_per_kg_.begin(), fuel.gas_mol_per_kg_.end(),
                                [name = formula](const auto& item) { return item.first == name; });
      if (found == fuel.gas_mol_per_kg_.end()) {
        fuel.gas_mol_per_kg_.emplace_back(formula, w * n);
      } else {
        found->second += w * n;
      }
    }
    for (std::size_t k = 0; k < fuel.element_mol_per_kg_.size(); ++k) {
      fuel.element_mol_per_kg_[k] += w * part.element_mol_per_kg_[k];
    }
    fuel.condensed_mass_fraction_ += w * part.condensed_mass_fraction_;
    fuel.condensed_formation_J_per_kg_ += w * part.condensed_formation_J_per_kg_;
    fuel.condensed_heat_capacity_J_per_kg_K_ += w * part.condensed_heat_capacity_J_per_kg_K_;
    if (part.condensed_mass_fraction_ > 0.0 && !part.specific_heat_known_) fuel.specific_heat_known_ = false;
    fuel.moisture_kg_per_kg_ += w * part.moisture_kg_per_kg_;
    fuel.ash_kg_per_kg_ += w * part.ash_kg_per_kg_;
    fuel.hhv_J_per_kg_ += w * part.hhv_J_per_kg_;
    fuel.lhv_J_per_kg_ += w * part.lhv_J_per_kg_;
    for (const units::Warning& warning : part.warnings_) {
      fuel.warnings_.push_back({warning.field, warning.value, fmt::format("{}: {}", part.name_, warning.message)});
    }
  }
  std::string parts_text;
  for (std::size_t i = 0; i < parts.size(); ++i) {
    parts_text += fmt::format("{}{} {:.4g} %", i == 0 ? "" : ", ", parts[i].fuel.name(), parts[i].percent * factor);
  }
  fuel.heating_value_method_ =
      fmt::format("mass-weighted from the parts ({} basis: {})", to_string(basis), parts_text);
  return fuel;
}

// ---------------------------------------------------------------------------------------------------
// Properties

Fuel Fuel::with_source(std::string source) const {
  Fuel copy = *this;
  copy.source_ = std::move(source);
  return copy;
}

Fuel Fuel::with_name(std::string name) const {
  Fuel copy = *this;
  copy.name_ = std::move(name);
  return copy;
}

double Fuel::water_formed_mol_per_kg() const { return 0.5 * element_mol_per_kg_[kH]; }

double Fuel::oxygen_required_mol_per_kg() const { return oxygen_required(element_mol_per_kg_); }

AsFiredAnalysis Fuel::as_fired_analysis() const {
  const double water_mol = moisture_kg_per_kg_ / water_molar_mass_kg_per_mol();
  const ElementMoles& e = element_mol_per_kg_;
  AsFiredAnalysis a;
  a.carbon_percent = 100.0 * e[kC] * atomic_weight_kg_per_mol(kC);
  a.hydrogen_percent = 100.0 * (e[kH] - 2.0 * water_mol) * atomic_weight_kg_per_mol(kH);
  a.oxygen_percent = 100.0 * (e[kO] - water_mol) * atomic_weight_kg_per_mol(kO);
  a.nitrogen_percent = 100.0 * e[kN] * atomic_weight_kg_per_mol(kN);
  a.sulfur_percent = 100.0 * e[kS] * atomic_weight_kg_per_mol(kS);
  a.other_percent = 100.0 * (e[kAr] * atomic_weight_kg_per_mol(kAr) + e[kHe] * atomic_weight_kg_per_mol(kHe));
  a.ash_percent = 100.0 * ash_kg_per_kg_;
  a.moisture_percent = 100.0 * moisture_kg_per_kg_;
  return a;
}

std::vector<std::pair<std::string, double>> Fuel::mole_fractions() const {
  std::vector<std::pair<std::string, double>> fractions;
  if (condensed_mass_fraction_ > 0.0) return fractions;
  double total = 0.0;
  for (const auto& item : gas_mol_per_kg_) total += item.second;
  for (const auto& [formula, n] : gas_mol_per_kg_) fractions.emplace_back(formula, n / total);
  return fractions;
}

std::optional<double> Fuel::molar_mass_kg_per_mol() const {
  if (condensed_mass_fraction_ > 0.0 || gas_mol_per_kg_.empty()) return std::nullopt;
  double total = 0.0;
  for (const auto& item : gas_mol_per_kg_) total += item.second;
  return 1.0 / total;
}

units::SpecificEnergy Fuel::enthalpy(units::Temperature temperature, const SpeciesDatabase& database) const {
  const double temperature_K = temperature.value();
  double h = 0.0;
  for (const auto& [formula, n] : gas_mol_per_kg_) {
    h += n * kR * temperature_K * database.at(formula, "fuel species").h_over_RT(temperature);
  }
  h += condensed_formation_J_per_kg_;
  if (specific_heat_known_) h += condensed_heat_capacity_J_per_kg_K_ * (temperature_K - kT0_K);
  return units::joules_per_kilogram(h);
}

}  // namespace stackbound::core
