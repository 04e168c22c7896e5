#include "stackbound/cases/runner.hpp"

#include <algorithm>
#include <cmath>

#include <fmt/format.h>

#include "stackbound/cases/fuel_spec.hpp"
#include "stackbound/cases/yaml_reader.hpp"
#include "stackbound/emissions/basis.hpp"
#include "stackbound/emissions/cautions.hpp"
#include "stackbound/emissions/concentration.hpp"
#include "stackbound/emissions/pollutant.hpp"
#include "stackbound/units/constants.hpp"
#include "stackbound/units/input_error.hpp"

namespace stackbound::cases {

namespace {

namespace em = stackbound::emissions;

core::Oxidant build_oxidant(const AirSpec& air) {
  core::OxidantOptions options;
  options.temperature = units::kelvin(air.temperature_K);
  if (air.relative_humidity) {
    options.humidity = core::Humidity::relative(*air.relative_humidity, units::kelvin(air.ambient_temperature_K),
                                                units::pascals(air.ambient_pressure_Pa));
  } else if (air.humidity_ratio_kg_per_kg) {
    options.humidity = core::Humidity::ratio(*air.humidity_ratio_kg_per_kg);
  }
  options.enriched_o2_fraction = air.o2_fraction;
  return core::Oxidant(options);
}

core::OperatingPoint build_operating_point(const CaseDefinition& definition) {
  const OperatingSpec& spec = definition.operating;
  core::OperatingPoint op;
  switch (spec.mode) {
    case OperatingMode::excess_air: op = core::OperatingPoint::with_excess_air(spec.value); break;
    case OperatingMode::lambda: op = core::OperatingPoint::with_air_ratio(spec.value, "operating_point.lambda"); break;
    case OperatingMode::equivalence_ratio:
      op = core::OperatingPoint::with_equivalence_ratio(spec.value, "operating_point.equivalence_ratio");
      break;
    case OperatingMode::flue_o2:
      op = core::OperatingPoint::with_flue_o2(spec.value, spec.flue_o2_dry ? core::GasBasis::dry : core::GasBasis::wet);
      break;
  }
  op.fuel_temperature = units::kelvin(definition.fuel.temperature_K);
  op.flue_pressure = units::pascals(definition.stack.pressure_Pa);
  return op;
}

// "35 ppm, dry, O2=3%" -> a concentration of `pollutant` on that basis.
em::Concentration stated_concentration(const SourceText& source, const em::Pollutant& pollutant,
                                       const units::NormalConditions& normal) {
  return with_location(source.location, [&] {
    const em::StatedValue stated = em::split_stated_value(source.text, source.path);
    const em::Basis basis = em::parse_basis(stated.rest, source.path, &normal);
    return em::Concentration(stated.number, pollutant, basis, source.path);
  });
}

double wet_fraction_of(const core::EquilibriumResult& eq, std::string_view pollutant) {
  if (pollutant == "NOx") return eq.mole_fraction("NO") + eq.mole_fraction("NO2");
  return eq.mole_fraction(pollutant);
}

std::string percent(double fraction) { return fmt::format("{:.2f} %", fraction * 100.0); }

}  // namespace

RunResult run_case(CaseDefinition definition, const core::SpeciesDatabase& database, const RunOptions& options) {
  const core::Fuel fuel = options.fuel != nullptr ? *options.fuel : build_fuel(definition.fuel.fuel, database);
  const core::Oxidant oxidant = with_location(definition.origin, [&] { return build_oxidant(definition.air); });
  const core::OperatingPoint op = build_operating_point(definition);
  const core::CombustionResult combustion =
      with_location(definition.operating.location, [&] { return core::burn(fuel, oxidant, op, database); });
  const core::FuelFeed feed = with_location(definition.fuel.feed_rate_text.location, [&] {
    return core::resolve_feed(fuel, definition.fuel.feed_rate, core::HeatInputBasis::hhv, "fuel.feed_rate");
  });
  const core::CombustionRates rates = core::rates(combustion, feed);

  // Equilibrium at the firing conditions, per kg of fuel.
  core::ElementAmounts elements;
  elements.moles = combustion.reactant_element_mol_per_kg;
  const FiringSpec& firing = definition.firing;
  std::array<bool, core::kElementCount> present{};
  for (std::size_t k = 0; k < core::kElementCount; ++k) present[k] = elements.moles[k] > 0.0;
  const bool reuse = options.solver != nullptr && options.solver_elements == present;
  const std::shared_ptr<const core::EquilibriumSolver> solver_ptr =
      reuse ? options.solver : with_location(firing.location, [&] {
        return std::make_shared<const core::EquilibriumSolver>(database, elements, firing.species);
      });
  const core::EquilibriumSolver& solver = *solver_ptr;
  const core::EquilibriumResult* warm =
      options.warm_start != nullptr && options.warm_start->species == solver.species() ? options.warm_start : nullptr;
  const core::EquilibriumResult equilibrium = with_location(firing.location, [&] {
    if (firing.adiabatic) {
      const double target = combustion.reactant_enthalpy_J_per_kg - firing.heat_loss_fraction * combustion.hhv_J_per_kg;
      return solver.solve_hp(elements, target, firing.pressure_Pa, warm);
    }
    return solver.solve_tp(elements, firing.temperature_K, firing.pressure_Pa, warm);
  });

  const units::NormalConditions& normal = units::normal_conditions_by_key(definition.report.normal_conditions,
                                                                          "report.normal_conditions");
  const em::O2Basis o2_basis =
      definition.report.o2_basis_percent == 21.0 ? em::O2Basis::eu_21 : em::O2Basis::us_epa_20_9;

  // Reference O2: the user's value, or the plant type's preset.
  const em::ReferenceO2Preset* preset = nullptr;
  if (!definition.plant_type.empty()) {
    preset = with_location(definition.plant_type_location,
                     [&] { return &em::reference_o2_preset(definition.plant_type, "case.plant_type"); });
  }
  if (preset == nullptr && !definition.report.reference_o2_fraction) {
    throw units::InputError(fmt::format(
        "{}: report.reference_o2 = \"preset\": needs case.plant_type (a reference-O2 preset key) or an explicit O2, "
        "e.g. reference_o2: 3 %",
        definition.report.reference_o2_location.empty() ? definition.origin : definition.report.reference_o2_location));
  }
  double reference_o2 = 0.0;
  std::string reference_text;
  bool from_preset = false;
  if (preset != nullptr) {
    const em::ReferenceO2Choice choice = em::choose_reference_o2(*preset, definition.report.reference_o2_fraction);
    reference_o2 = choice.o2_dry_fraction;
    if (options.full_report) reference_text = choice.text();  // report text only; sweeps skip the formatting
    from_preset = choice.from_preset;
  } else {
    reference_o2 = *definition.report.reference_o2_fraction;
    reference_text = fmt::format("{} (stated in the case file)", percent(reference_o2));
  }

  // The stack gas: the equilibrium gas phase, frozen.
  const double stack_h2o = equilibrium.mole_fraction("H2O");
  const double stack_o2 = equilibrium.mole_fraction("O2");
  const double stack_co2 = equilibrium.mole_fraction("CO2");
  const double wet_mol_per_s = equilibrium.total_gas_moles * feed.mass_flow_kg_per_s;
  em::ConcentrationContext context = em::ConcentrationContext::from_wet_flue_gas(stack_h2o, stack_o2, stack_co2, o2_basis);
  context.record_factors = options.record_factors;

  RunResult result{
      .definition = {},  // moved in before returning: the steps below still read `definition`
      .fuel = fuel,
      .oxidant = oxidant,
      .combustion = combustion,
      .rates = rates,
      .equilibrium = equilibrium,
      .solver = solver_ptr,
      .solver_elements = present,
      .firing_temperature_K = equilibrium.temperature_K,
      .firing_pressure_Pa = equilibrium.pressure_Pa,
      .stack_h2o_wet = stack_h2o,
      .stack_o2_wet = stack_o2,
      .stack_o2_dry = context.o2_dry_fraction.value_or(0.0),
      .stack_co2_dry = context.co2_dry_fraction.value_or(0.0),
      .stack_wet_mol_per_s = wet_mol_per_s,
      .stack_dry_mol_per_s = wet_mol_per_s * (1.0 - stack_h2o),
      .stack_actual_m3_per_s = wet_mol_per_s * units::kGasConstant_J_per_mol_K * definition.stack.temperature_K /
                               definition.stack.pressure_Pa,
      .normal = &normal,
      .o2_basis = o2_basis,
      .reference_o2_dry = reference_o2,
      .reference_o2_text = reference_text,
      .reference_o2_from_preset = from_preset,
      .pollutants = {},
      .limits = {},
      .measured = {},
      .findings = {},
      .warnings = combustion.warnings,
      .assumptions = {},
      .cautions = {},
      .caution_keys = {},
  };

  // Bounds on the report's bases.
  const em::FFactor fd = em::FFactor::from_scm_per_J(em::FFactorKind::dry, combustion.f_factors.fd_m3_per_J);
  result.pollutants.reserve(definition.report.pollutants.size());
  for (const std::string& name : definition.report.pollutants) {
    const em::Pollutant pollutant = em::pollutant_by_name(name, "report.pollutants");
    em::StackEmissionInput input{
        .pollutant = pollutant,
        .pollutant_wet_fraction = wet_fraction_of(equilibrium, name),
        .h2o_wet_fraction = stack_h2o,
        .o2_wet_fraction = stack_o2,
        .co2_wet_fraction = stack_co2,
        .wet_flue_gas_flow = units::moles_per_second(wet_mol_per_s),
        .heat_input = units::watts(feed.heat_input_hhv_W),
        .fd = fd,
        .reference_o2_dry_fraction = reference_o2,
        .normal = &normal,
        .o2_basis = o2_basis,
        .operating_hours_per_year = definition.report.operating_hours_h,
        .record_factors = options.record_factors,
    };
    em::StackEmission emission = em::evaluate_stack_emission(input);
    if (o2_basis != em::O2Basis::us_epa_20_9) {
      // Method 19 is written with 20.9 % O2 whatever the O2 basis of the concentration correction.
      em::ConcentrationContext method19_context = context;
      method19_context.o2_basis = em::O2Basis::us_epa_20_9;
      method19_context.record_factors = options.record_factors;
      emission.method19 = em::method19_o2_dry(emission.ppmvd, fd, method19_context);
    }
    result.pollutants.push_back({name, input.pollutant_wet_fraction, std::move(emission)});
  }

  if (!options.full_report) {
    result.definition = std::move(definition);
    return result;
  }

  // Limits: a concentration limit (unit of concentration) or a rate limit (kg/h, lb/MMBtu ...).
  for (const LimitSpec& limit : definition.report.limits) {
    const auto bound = std::find_if(result.pollutants.begin(), result.pollutants.end(),
                                    [&](const PollutantBound& p) { return p.name == limit.pollutant; });
    if (bound == result.pollutants.end()) {
      throw units::InputError(fmt::format("{}: report.limits: pollutant \"{}\" is not among report.pollutants ({})",
                                          limit.limit.location, limit.pollutant,
                                          fmt::join(definition.report.pollutants, ", ")));
    }
    em::ScreeningResult screening = with_location(limit.limit.location, [&] {
      const std::string& text = limit.limit.text;
      // A concentration unit ("mg/Nm3", "ppm") makes a concentration limit; anything else is a rate.
      const std::string rest = em::split_stated_value(text, limit.limit.path).rest;
      const std::string unit = rest.substr(0, rest.find(','));
      const auto first = unit.find_first_not_of(" \t");
      const auto last = unit.find_last_not_of(" \t");
      if (first != std::string::npos && em::find_concentration_unit(unit.substr(first, last - first + 1))) {
        const em::Concentration stated = stated_concentration(limit.limit, bound->emission.ppmvd.pollutant(), normal);
        return em::screen_concentration(bound->emission.ppmvd, stated, context);
      }
      const em::RateLimit rate = em::parse_rate_limit(text, limit.limit.path);
      switch (rate.kind) {
        case em::RateKind::mass_flow: return em::screen_mass_rate(bound->emission.mass_rate, rate);
        case em::RateKind::per_heat_input: return em::screen_heat_input_rate(bound->emission.method19, rate);
        case em::RateKind::per_useful_output: break;
      }
      throw units::InputError(fmt::format("{} = \"{}\": a limit per useful output needs an efficiency, which a case file "
                                          "does not state; give the limit as a concentration, a mass rate or per heat input",
                                          limit.limit.path, text));
    });
    result.limits.push_back({limit.pollutant, limit.limit.text, std::move(screening)});
  }

  // Measured values beside the model.
  const MeasuredSpec& measured = definition.stack.measured;
  std::optional<double> measured_o2_dry;
  if (measured.o2) {
    const em::Concentration o2 = stated_concentration(*measured.o2, em::pollutant_by_name("O2", "o2"), normal);
    const em::Basis dry_percent = em::make_basis(em::mole_unit("%"), em::Moisture::dry, em::DiluentReference::as_measured());
    const double value = with_location(measured.o2->location, [&] { return o2.to(dry_percent, context).value(); });
    measured_o2_dry = value / 100.0;
    MeasuredComparison row{"O2", measured.o2->text, "%, dry", value, result.stack_o2_dry * 100.0, "%", ""};
    if (std::abs(row.measured - row.model) > kO2MismatchPoints) {
      row.finding = fmt::format(
          "Measured O2 {:.2f} % (dry) differs from the {:.2f} % (dry) that the stated operating point gives by more "
          "than {} percentage points: the stated excess air, fuel or air leakage may not match the plant.",
          row.measured, row.model, kO2MismatchPoints);
    }
    result.measured.push_back(row);
  }
  if (measured.moisture) {
    const double value = units::parse_fraction(measured.moisture->text, measured.moisture->path) * 100.0;
    MeasuredComparison row{"moisture", measured.moisture->text, "% of wet gas", value, stack_h2o * 100.0, "%", ""};
    if (std::abs(row.measured - row.model) > kMoistureMismatchPoints) {
      row.finding = fmt::format("Measured moisture {:.1f} % differs from the model's {:.1f} % by more than {} points: check "
                                "the fuel moisture, humidity, or water injection and leaks.",
                                row.measured, row.model, kMoistureMismatchPoints);
    }
    result.measured.push_back(row);
  }
  // Measured pollutants are compared dry at the reference O2, using the measured O2 when given.
  em::ConcentrationContext measured_context = context;
  if (measured_o2_dry) measured_context.o2_dry_fraction = *measured_o2_dry;
  const em::Basis at_reference = em::make_basis(em::mole_unit("ppmv"), em::Moisture::dry, em::DiluentReference::o2(reference_o2));
  const auto compare_pollutant = [&](const std::optional<SourceText>& source, const std::string& name) {
    if (!source) return;
    const em::Pollutant pollutant = em::pollutant_by_name(name, source->path);
    const em::Concentration stated = stated_concentration(*source, pollutant, normal);
    const double value = with_location(source->location, [&] { return stated.to(at_reference, measured_context).value(); });
    const double bound = with_location(definition.origin, [&] {
      return em::Concentration::from_mole_fraction(wet_fraction_of(equilibrium, name), pollutant, em::Moisture::wet)
          .to(at_reference, context)
          .value();
    });
    MeasuredComparison row{name, source->text, at_reference.text(), value, bound, "ppmvd", ""};
    if (name == "CO" && value > kCoAboveBoundFactor * bound) {
      row.finding = fmt::format(
          "Measured CO {:.3g} ppmvd at {} O2 is more than {} times the equilibrium bound {:.3g} ppmvd: this points to "
          "incomplete combustion (poor mixing, flame quenching, too little residence time), not to equilibrium.",
          value, percent(reference_o2), kCoAboveBoundFactor, bound);
    } else if (name != "CO" && value > bound) {
      row.finding = fmt::format(
          "Measured {} {:.3g} ppmvd at {} O2 exceeds the equilibrium bound {:.3g} ppmvd at the stated firing "
          "conditions: the flame is likely hotter than stated somewhere, or the stated conditions do not match.",
          name, value, percent(reference_o2), bound);
    }
    result.measured.push_back(row);
  };
  compare_pollutant(measured.co, "CO");
  compare_pollutant(measured.no, "NO");
  compare_pollutant(measured.nox, "NOx");
  for (const MeasuredComparison& row : result.measured) {
    if (!row.finding.empty()) result.findings.push_back(row.finding);
  }

  // Findings from the model itself.
  if (equilibrium.graphite_present) {
    result.findings.push_back(fmt::format(
        "Solid carbon (graphite) is stable at the firing conditions ({:.4g} mol per kg of fuel): the mixture is too rich "
        "to burn clean; expect soot.",
        equilibrium.moles_of("C(gr)")));
  }
  if (combustion.air_ratio < 1.0) {
    result.findings.push_back(fmt::format("Sub-stoichiometric firing (lambda = {:.3f}): the flue gas holds CO and H2 "
                                          "in large amounts; the CO figures are those of a fuel-rich flame.",
                                          combustion.air_ratio));
  }
  if (combustion.water_dew_point_K && definition.stack.temperature_K < *combustion.water_dew_point_K + kDewPointMarginK) {
    result.findings.push_back(fmt::format(
        "The stack temperature {:.1f} K is within {} K of (or below) the water dew point {:.1f} K: water will condense "
        "in the stack, and the acid dew point lies higher still.",
        definition.stack.temperature_K, kDewPointMarginK, *combustion.water_dew_point_K));
  }
  for (const PollutantBound& bound : result.pollutants) {
    const double m19 = bound.emission.method19.kg_per_J;
    const double direct = bound.emission.direct.kg_per_J;
    if (direct > 0.0 && std::abs(m19 - direct) > 0.02 * direct) {
      result.findings.push_back(fmt::format(
          "For {}, the Method 19 rate ({:.4g} lb/MMBtu, Fd and flue O2) and the mass-balance rate ({:.4g} lb/MMBtu) "
          "differ by more than 2 %: the O2-based F-factor method assumes plain air, which this case does not use "
          "(humid, enriched or otherwise non-standard oxidant, or combustion products other than complete).",
          bound.name, bound.emission.method19.lb_per_MMBtu(), bound.emission.direct.lb_per_MMBtu()));
      break;
    }
  }
  for (const std::string& warning : fuel.warnings()) {
    if (std::find(result.warnings.begin(), result.warnings.end(), warning) == result.warnings.end()) {
      result.warnings.push_back(warning);
    }
  }

  // Assumptions and cautions.
  result.assumptions = {
      "Ideal-gas mixture; chemical equilibrium (minimum Gibbs energy) of the whole reactant mixture at the stated firing "
      "temperature and pressure, with pure graphite allowed as a condensed phase.",
      firing.adiabatic ? fmt::format("Firing temperature: adiabatic flame temperature with {} of the fuel's HHV heat input "
                                     "lost from the flame.",
                                     percent(firing.heat_loss_fraction))
                       : "Firing temperature: as stated in the case file (furnace or flame temperature).",
      "Complete mixing of fuel and oxidant in one zone at one temperature.",
      "The equilibrium composition is frozen from the firing zone to the stack (no further reaction).",
      fmt::format("Thermodynamic data: NASA 7-coefficient polynomials from the built-in data ({} species; sources in "
                  "docs/equilibrium.md); atomic weights IUPAC 2021.",
                  database.size()),
      fmt::format("Normal conditions of mg/Nm3 figures: {}; O2 correction with {} % O2 in air.", normal.description,
                  definition.report.o2_basis_percent),
      "Rates per heat input are on the higher heating value (HHV), by US EPA Method 19 (O2-based, Fd) and, as a check, "
      "by mass balance.",
  };
  std::vector<em::Caution> cautions(em::standard_cautions().begin(), em::standard_cautions().end());
  cautions.push_back(em::Caution::o2_correction_validity);
  if (from_preset) cautions.push_back(em::Caution::confirm_presets);
  for (const em::CautionText& entry : em::all_cautions()) {
    if (std::find(cautions.begin(), cautions.end(), entry.caution) != cautions.end()) {
      result.cautions.emplace_back(entry.text);
      result.caution_keys.emplace_back(entry.key);
    }
  }
  result.definition = std::move(definition);
  return result;
}

}  // namespace stackbound::cases
