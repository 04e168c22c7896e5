#include "stackbound/cases/stage_screening.hpp"

#include <fmt/format.h>

#include <algorithm>
#include <cctype>
#include <cmath>

#include "stackbound/cases/run_warnings.hpp"
#include "stackbound/cases/source_map.hpp"
#include "stackbound/emissions/basis.hpp"
#include "stackbound/emissions/cautions.hpp"
#include "stackbound/units/input_error.hpp"

namespace stackbound::cases {

namespace {

namespace em = stackbound::emissions;

std::string percent(double fraction) { return fmt::format("{:.2f} %", fraction * 100.0); }

[[noreturn]] void refuse_output_limit(const LimitSpec& limit) {
  throw units::InputError(
      fmt::format("\"{}\": a limit per useful output needs an efficiency, which a case file does "
                  "not state; give the limit as a concentration, a mass rate or per heat input",
                  limit.text));
}

// A modelled figure (the bound, the estimate or the ceiling) against a concentration limit or a rate
// limit (kg/h, lb/MMBtu ...).
em::ScreeningResult screen_figure(const LimitSpec& limit, const em::StackEmission& emission, const StackGas& stack) {
  if (const auto* concentration = std::get_if<em::Concentration>(&limit.limit)) {
    return em::screen_concentration(emission.ppmvd, *concentration, stack.context);
  }
  const em::RateLimit& rate = std::get<em::RateLimit>(limit.limit);
  switch (rate.kind) {
    case em::RateKind::mass_flow:
      return em::screen_mass_rate(emission.mass_rate, rate);
    case em::RateKind::per_heat_input:
      return em::screen_heat_input_rate(emission.method19, rate);
    case em::RateKind::per_useful_output:
      break;
  }
  refuse_output_limit(limit);
}

// The stack context of measured values: the model's, with the measured O2 (dry) when one is stated.
em::ConcentrationContext measured_context_of(const ScreeningInput& in) {
  em::ConcentrationContext context = in.stack.context;
  const MeasuredSpec& measured = in.definition.stack.measured;
  if (measured.moisture) context.moisture_fraction = measured.moisture->fraction;  // a stated moisture governs
  if (const std::optional<MeasuredValue>& o2 = measured.o2) {
    const em::Basis dry_fraction =
        em::make_basis(em::mole_unit("%"), em::Moisture::dry, em::DiluentReference::as_measured());
    context.o2_dry_fraction =
        at_field("stack.measured.o2", [&] { return o2->value.to(dry_fraction, context).value(); }) / 100.0;
  }
  return context;
}

// The measured value of a pollutant, or nullptr.
const MeasuredValue* measured_of(const MeasuredSpec& measured, std::string_view pollutant) {
  const std::optional<MeasuredValue>* value = pollutant == "CO"    ? &measured.co
                                              : pollutant == "NO"  ? &measured.no
                                              : pollutant == "NOx" ? &measured.nox
                                                                   : nullptr;
  return value != nullptr && *value ? &**value : nullptr;
}

// A measured concentration against a limit: converted with the measured O2 for a concentration limit;
// per heat input by Method 19 (Fd of the fuel, measured O2, 20.9 % as Method 19 writes it); as a mass
// rate, that rate times the heat input.
em::ScreeningResult screen_measured(const LimitSpec& limit, const MeasuredValue& measured, const ScreeningInput& in,
                                    const em::ConcentrationContext& context) {
  if (const auto* concentration = std::get_if<em::Concentration>(&limit.limit)) {
    return em::screen_concentration(measured.value, *concentration, context);
  }
  const em::RateLimit& rate = std::get<em::RateLimit>(limit.limit);
  if (rate.kind == em::RateKind::per_useful_output) refuse_output_limit(limit);
  em::ConcentrationContext method19_context = context;
  method19_context.o2_basis = em::O2Basis::us_epa_20_9;
  const em::FFactor fd =
      em::FFactor::from_scm_per_J(em::FFactorKind::dry, in.resolved.combustion.f_factors.fd_m3_per_J);
  const em::HeatInputRate per_heat = em::method19_o2_dry(measured.value, fd, method19_context);
  if (rate.kind == em::RateKind::per_heat_input) return em::screen_heat_input_rate(per_heat, rate);
  return em::screen_mass_rate(units::kilograms_per_second(per_heat.kg_per_J * in.resolved.rates.feed.heat_input_hhv_W),
                              rate);
}

const PollutantBound& bound_for(const LimitSpec& limit, const std::vector<PollutantBound>& bounds,
                                const std::string& field) {
  const auto bound =
      std::find_if(bounds.begin(), bounds.end(), [&](const auto& p) { return p.name == limit.pollutant; });
  if (bound == bounds.end()) {
    std::vector<std::string> names;
    for (const PollutantBound& p : bounds) names.push_back(p.name);
    throw units::InputError(fmt::format("{}: report.limits: pollutant \"{}\" is not among report.pollutants ({})",
                                        field, limit.pollutant, fmt::join(names, ", ")));
  }
  return *bound;
}

// The rows of one limit: measured (when stated), estimate and ceiling (when the post-flame stage gives
// them), bound; each with its reading, all with the limit's conclusion.
std::vector<LimitScreening> screen_one_limit(const ScreeningInput& in, std::size_t index,
                                             const em::ConcentrationContext& measured_context) {
  const LimitSpec& limit = in.definition.report.limits[index];
  const std::string field = fmt::format("report.limits[{}].limit", index);
  const PollutantBound& bound = bound_for(limit, in.figures.pollutants, field);
  std::vector<std::pair<em::ScreeningSource, em::ScreeningResult>> results;
  at_field(field, [&] {
    if (const MeasuredValue* measured = measured_of(in.definition.stack.measured, limit.pollutant)) {
      results.emplace_back(em::ScreeningSource::measured, screen_measured(limit, *measured, in, measured_context));
    }
    if (bound.estimate) {
      results.emplace_back(em::ScreeningSource::estimate, screen_figure(limit, bound.estimate->emission, in.stack));
    }
    if (bound.ceiling) {
      results.emplace_back(em::ScreeningSource::ceiling, screen_figure(limit, bound.ceiling->emission, in.stack));
    }
    results.emplace_back(em::ScreeningSource::bound, screen_figure(limit, bound.emission, in.stack));
  });
  em::LimitOutcomes outcomes;
  for (const auto& [source, result] : results) {
    switch (source) {
      case em::ScreeningSource::measured:
        outcomes.measured = result.outcome;
        break;
      case em::ScreeningSource::estimate:
        outcomes.estimate = result.outcome;
        break;
      case em::ScreeningSource::ceiling:
        outcomes.ceiling = result.outcome;
        break;
      case em::ScreeningSource::bound:
        outcomes.bound = result.outcome;
        break;
    }
  }
  const std::string conclusion = em::screening_conclusion(outcomes, limit.pollutant);
  std::vector<LimitScreening> rows;
  for (auto& [source, result] : results) {
    std::string reading = em::screening_reading(source, result.outcome, limit.pollutant);
    rows.push_back({limit.pollutant, limit.text, index, source, std::move(result), std::move(reading), conclusion});
  }
  return rows;
}

std::vector<LimitScreening> screen_limits(const ScreeningInput& in, const em::ConcentrationContext& measured_context) {
  std::vector<LimitScreening> screened;
  for (std::size_t i = 0; i < in.definition.report.limits.size(); ++i) {
    for (LimitScreening& row : screen_one_limit(in, i, measured_context)) screened.push_back(std::move(row));
  }
  return screened;
}

// `measured_o2_dry`: the measured O2 as a dry fraction (measured_context_of).
MeasuredComparison measured_o2(const MeasuredValue& o2, double measured_o2_dry, const StackGas& stack) {
  const double value = measured_o2_dry * 100.0;
  MeasuredComparison row{"O2", o2.text, "%, dry", value, stack.o2_dry * 100.0, "%", ""};
  if (std::abs(row.measured - row.model) > kO2MismatchPoints) {
    row.finding = fmt::format(
        "Measured O2 {:.2f} % (dry) differs from the {:.2f} % (dry) that the stated operating point gives by more "
        "than {} percentage points: the stated excess air, fuel or air leakage may not match the plant.",
        row.measured, row.model, kO2MismatchPoints);
  }
  return row;
}

// A pollutant without a stated limit on mg/Nm3 dry at the reference O2 (the basis of the bound's
// mg/Nm3 figure).
HeadlineRow unlimited_headline(const PollutantBound& p, const ScreeningInput& in,
                               const em::ConcentrationContext& measured_context) {
  const em::Concentration& reference = p.emission.mg_per_Nm3_at_reference.result;
  const std::string basis = reference.basis().text();
  const auto value = [](const std::optional<PollutantFigure>& f) -> std::optional<double> {
    if (!f) return std::nullopt;
    return f->emission.mg_per_Nm3_at_reference.result.value();
  };
  HeadlineRow row{p.name,
                  reference.basis().unit.symbol,
                  basis.substr(reference.basis().unit.symbol.size() + 2),
                  value(p.estimate),
                  value(p.ceiling),
                  reference.value(),
                  std::nullopt,
                  std::nullopt,
                  ""};
  if (const MeasuredValue* measured = measured_of(in.definition.stack.measured, p.name)) {
    std::string field = "stack.measured.";
    for (const char c : p.name) field += static_cast<char>(std::tolower(static_cast<unsigned char>(c)));
    row.measured = at_field(field, [&] { return measured->value.to(reference.basis(), measured_context).value(); });
  }
  return row;
}

// The headline: per stated limit its rows on its basis, then the pollutants without a limit.
std::vector<HeadlineRow> headline_of(const std::vector<LimitScreening>& limits, const ScreeningInput& in,
                                     const em::ConcentrationContext& measured_context) {
  std::vector<HeadlineRow> headline;
  for (std::size_t i = 0; i < limits.size(); ++i) {
    const LimitScreening& l = limits[i];
    if (i == 0 || l.limit_index != limits[i - 1].limit_index) {
      headline.push_back({l.pollutant, l.result.unit, l.result.basis, std::nullopt, std::nullopt, 0.0, std::nullopt,
                          l.result.limit, l.conclusion});
    }
    HeadlineRow& row = headline.back();
    switch (l.source) {
      case em::ScreeningSource::measured:
        row.measured = l.result.value;
        break;
      case em::ScreeningSource::estimate:
        row.estimate = l.result.value;
        break;
      case em::ScreeningSource::ceiling:
        row.ceiling = l.result.value;
        break;
      case em::ScreeningSource::bound:
        row.bound = l.result.value;
        break;
    }
  }
  for (const PollutantBound& p : in.figures.pollutants) {
    const bool limited =
        std::any_of(limits.begin(), limits.end(), [&](const LimitScreening& l) { return l.pollutant == p.name; });
    if (!limited) headline.push_back(unlimited_headline(p, in, measured_context));
  }
  return headline;
}

MeasuredComparison measured_moisture(const MeasuredFraction& moisture, const StackGas& stack) {
  MeasuredComparison row{
      "moisture", moisture.text, "% of wet gas", moisture.fraction * 100.0, stack.h2o_wet * 100.0, "%", ""};
  if (std::abs(row.measured - row.model) > kMoistureMismatchPoints) {
    row.finding = fmt::format(
        "Measured moisture {:.1f} % differs from the model's {:.1f} % by more than {} points: check "
        "the fuel moisture, humidity, or water injection and leaks.",
        row.measured, row.model, kMoistureMismatchPoints);
  }
  return row;
}

// A measured pollutant and its bound, both dry at the reference O2; the measured value corrected with
// the measured O2 when one is given.
MeasuredComparison measured_pollutant(const MeasuredValue& measured, std::string_view field, const ScreeningInput& in,
                                      const em::ConcentrationContext& measured_context) {
  const double reference_o2 = in.figures.reference_o2_dry;
  const em::Basis at_reference =
      em::make_basis(em::mole_unit("ppmv"), em::Moisture::dry, em::DiluentReference::o2(reference_o2));
  const em::Pollutant& pollutant = measured.value.pollutant();
  const double value = at_field(field, [&] { return measured.value.to(at_reference, measured_context).value(); });
  const double bound = at_field(field, [&] {
    return em::Concentration::from_mole_fraction(wet_fraction_of(in.fired.equilibrium, pollutant.name), pollutant,
                                                 em::Moisture::wet)
        .to(at_reference, in.stack.context)
        .value();
  });
  MeasuredComparison row{pollutant.name, measured.text, at_reference.text(), value, bound, "ppmvd", ""};
  if (pollutant.name == "CO" && value > kCoAboveBoundFactor * bound) {
    row.finding = fmt::format(
        "Measured CO {:.3g} ppmvd at {} O2 is more than {} times the equilibrium bound {:.3g} ppmvd: this points to "
        "incomplete combustion (poor mixing, flame quenching, too little residence time), not to equilibrium.",
        value, percent(reference_o2), kCoAboveBoundFactor, bound);
  } else if (pollutant.name != "CO" && value > bound) {
    row.finding = fmt::format(
        "Measured {} {:.3g} ppmvd at {} O2 exceeds the equilibrium bound {:.3g} ppmvd at the stated firing "
        "conditions: the flame is likely hotter than stated somewhere, or the stated conditions do not match.",
        pollutant.name, value, percent(reference_o2), bound);
  }
  return row;
}

std::vector<MeasuredComparison> compare_measured(const ScreeningInput& in,
                                                 const em::ConcentrationContext& measured_context) {
  const MeasuredSpec& measured = in.definition.stack.measured;
  std::vector<MeasuredComparison> rows;
  if (measured.o2) rows.push_back(measured_o2(*measured.o2, *measured_context.o2_dry_fraction, in.stack));
  if (measured.moisture) rows.push_back(measured_moisture(*measured.moisture, in.stack));
  if (measured.co) rows.push_back(measured_pollutant(*measured.co, "stack.measured.co", in, measured_context));
  if (measured.no) rows.push_back(measured_pollutant(*measured.no, "stack.measured.no", in, measured_context));
  if (measured.nox) rows.push_back(measured_pollutant(*measured.nox, "stack.measured.nox", in, measured_context));
  return rows;
}

// Findings from the model itself.
std::vector<std::string> model_findings(const ScreeningInput& in) {
  const core::EquilibriumResult& equilibrium = in.fired.equilibrium;
  const core::CombustionResult& combustion = in.resolved.combustion;
  const double stack_K = in.definition.stack.temperature_K;
  std::vector<std::string> findings;
  if (equilibrium.graphite_present) {
    findings.push_back(
        fmt::format("Solid carbon (graphite) is stable at the firing conditions ({:.4g} mol per kg of fuel): the "
                    "mixture is too rich "
                    "to burn clean; expect soot.",
                    equilibrium.moles_of("C(gr)")));
  }
  if (combustion.air_ratio < 1.0) {
    findings.push_back(
        fmt::format("Sub-stoichiometric firing (lambda = {:.3f}): the flue gas holds CO and H2 "
                    "in large amounts; the CO figures are those of a fuel-rich flame.",
                    combustion.air_ratio));
  }
  if (combustion.water_dew_point_K && stack_K < *combustion.water_dew_point_K + kDewPointMarginK) {
    findings.push_back(fmt::format(
        "The stack temperature {:.1f} K is within {} K of (or below) the water dew point {:.1f} K: water will condense "
        "in the stack, and the acid dew point lies higher still.",
        stack_K, kDewPointMarginK, *combustion.water_dew_point_K));
  }
  // With published or stated F-factors the two rates differ by the F-factor's own difference.
  if (in.resolved.f_factors.choice != FFactorChoice::computed) return findings;
  for (const PollutantBound& bound : in.figures.pollutants) {
    const double m19 = bound.emission.method19.kg_per_J;
    const double direct = bound.emission.direct.kg_per_J;
    if (direct > 0.0 && std::abs(m19 - direct) > 0.02 * direct) {
      findings.push_back(fmt::format(
          "For {}, the Method 19 rate ({:.4g} lb/MMBtu, Fd and flue O2) and the mass-balance rate ({:.4g} lb/MMBtu) "
          "differ by more than 2 %: the O2-based F-factor method assumes plain air, which this case does not use "
          "(humid, enriched or otherwise non-standard oxidant, or combustion products other than complete).",
          bound.name, bound.emission.method19.lb_per_MMBtu(), bound.emission.direct.lb_per_MMBtu()));
      break;
    }
  }
  return findings;
}

// A wet measured value with no measured moisture is made dry with the model's moisture; a limit with
// no reference O2 is screened at the run's flue O2, not at a permit's reference level.
void add_screening_warnings(const ScreeningInput& in, std::vector<units::Warning>& warnings) {
  const MeasuredSpec& measured = in.definition.stack.measured;
  if (!measured.moisture) {
    const std::pair<const char*, const std::optional<MeasuredValue>*> values[] = {
        {"stack.measured.o2", &measured.o2}, {"stack.measured.co", &measured.co},
        {"stack.measured.no", &measured.no}, {"stack.measured.nox", &measured.nox}};
    for (const auto& [field, value] : values) {
      if (!*value || (*value)->value.basis().moisture != em::Moisture::wet) continue;
      add_warning(warnings, {field, (*value)->text,
                             fmt::format("a wet value and no stack.measured.moisture: made dry with the model's "
                                         "moisture ({:.2f} % H2O); state the measured moisture to use it instead",
                                         in.stack.h2o_wet * 100.0)});
    }
  }
  const std::vector<LimitSpec>& limits = in.definition.report.limits;
  for (std::size_t i = 0; i < limits.size(); ++i) {
    const auto* concentration = std::get_if<em::Concentration>(&limits[i].limit);
    if (concentration == nullptr || concentration->basis().reference.kind() != em::DiluentReference::Kind::as_measured) {
      continue;
    }
    add_warning(warnings, {fmt::format("report.limits[{}].limit", i), limits[i].text,
                           fmt::format("no reference O2 stated: screened at the flue O2 of this run ({:.2f} %, dry), "
                                       "not at a permit's reference level; write the permit's, e.g. \"{}, O2=3%\"",
                                       in.stack.o2_dry * 100.0, limits[i].text)});
  }
}

std::vector<std::string> assumptions_of(const ScreeningInput& in, const core::SpeciesDatabase& database) {
  const FiringSpec& firing = in.definition.firing;
  return {
      "Ideal-gas mixture; chemical equilibrium (minimum Gibbs energy) of the whole reactant mixture at the stated "
      "firing "
      "temperature and pressure, with pure graphite allowed as a condensed phase.",
      firing.adiabatic
          ? fmt::format("Firing temperature: adiabatic flame temperature with {} of the fuel's HHV heat input "
                        "lost from the flame.",
                        percent(firing.heat_loss_fraction))
          : "Firing temperature: as stated in the case file (furnace or flame temperature).",
      "Complete mixing of fuel and oxidant in one zone at one temperature.",
      "The equilibrium composition is frozen from the firing zone to the stack (no further reaction).",
      fmt::format("Thermodynamic data: NASA 7-coefficient polynomials from the built-in data ({} species; sources in "
                  "docs/equilibrium.md); atomic weights IUPAC 2021.",
                  database.size()),
      fmt::format("Normal conditions of mg/Nm3 figures: {}; O2 correction with {} % O2 in air.",
                  in.figures.normal->description, em::o2_basis_percent(in.figures.o2_basis)),
      "Rates per heat input are on the higher heating value (HHV), by US EPA Method 19 (O2-based, Fd) and, as a check, "
      "by mass balance.",
  };
}

// The standard cautions, then those that apply to this case, in the order all_cautions() lists them.
void add_cautions(const ScreeningInput& in, Screening& screening) {
  std::vector<em::Caution> cautions(em::standard_cautions().begin(), em::standard_cautions().end());
  cautions.push_back(em::Caution::o2_correction_validity);
  if (in.figures.reference_o2_from_preset) cautions.push_back(em::Caution::confirm_presets);
  const std::vector<em::Pollutant>& pollutants = in.definition.report.pollutants;
  if (std::any_of(pollutants.begin(), pollutants.end(), [](const em::Pollutant& p) { return p.name == "CO"; })) {
    cautions.push_back(em::Caution::co_well_mixed_only);
  }
  if (in.post_flame.fuel_nitrogen.no.fuel_nitrogen_mol_per_kg > 0.0) {
    cautions.push_back(em::Caution::fuel_nitrogen_unbounded);
  }
  const em::ReferenceO2Preset* preset = in.definition.reference_o2_preset;
  if (preset != nullptr && preset->key == "ied-gas-turbine" && !in.definition.firing.primary_zone) {
    cautions.push_back(em::Caution::primary_zone_needed);
  }
  for (const em::CautionText& entry : em::all_cautions()) {
    if (std::find(cautions.begin(), cautions.end(), entry.caution) != cautions.end()) {
      screening.cautions.emplace_back(entry.text);
      screening.caution_keys.emplace_back(entry.key);
    }
  }
}

}  // namespace

Screening screening_stage(const ScreeningInput& in, const core::SpeciesDatabase& database) {
  Screening screening;
  const em::ConcentrationContext measured_context = measured_context_of(in);
  screening.limits = screen_limits(in, measured_context);
  screening.measured = compare_measured(in, measured_context);
  screening.headline = headline_of(screening.limits, in, measured_context);
  for (const MeasuredComparison& row : screening.measured) {
    if (!row.finding.empty()) screening.findings.push_back(row.finding);
  }
  for (std::string& finding : model_findings(in)) screening.findings.push_back(std::move(finding));
  screening.warnings = run_warnings(in.definition, in.resolved);
  add_screening_warnings(in, screening.warnings);
  screening.assumptions = assumptions_of(in, database);
  add_cautions(in, screening);
  return screening;
}

}  // namespace stackbound::cases
