#include "stackbound/cases/stage_screening.hpp"

#include <fmt/format.h>

#include <algorithm>
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

em::ScreeningResult screen_limit(const LimitSpec& limit, const PollutantBound& bound, const StackGas& stack) {
  if (const auto* concentration = std::get_if<em::Concentration>(&limit.limit)) {
    return em::screen_concentration(bound.emission.ppmvd, *concentration, stack.context);
  }
  const em::RateLimit& rate = std::get<em::RateLimit>(limit.limit);
  switch (rate.kind) {
    case em::RateKind::mass_flow:
      return em::screen_mass_rate(bound.emission.mass_rate, rate);
    case em::RateKind::per_heat_input:
      return em::screen_heat_input_rate(bound.emission.method19, rate);
    case em::RateKind::per_useful_output:
      break;
  }
  throw units::InputError(
      fmt::format("\"{}\": a limit per useful output needs an efficiency, which a case file does "
                  "not state; give the limit as a concentration, a mass rate or per heat input",
                  limit.text));
}

// A concentration limit (unit of concentration) or a rate limit (kg/h, lb/MMBtu ...).
std::vector<LimitScreening> screen_limits(const ScreeningInput& in) {
  std::vector<LimitScreening> screened;
  const std::vector<LimitSpec>& limits = in.definition.report.limits;
  for (std::size_t i = 0; i < limits.size(); ++i) {
    const std::string field = fmt::format("report.limits[{}].limit", i);
    const std::vector<PollutantBound>& bounds = in.figures.pollutants;
    const auto bound =
        std::find_if(bounds.begin(), bounds.end(), [&](const auto& p) { return p.name == limits[i].pollutant; });
    if (bound == bounds.end()) {
      std::vector<std::string> names;
      for (const PollutantBound& p : bounds) names.push_back(p.name);
      throw units::InputError(fmt::format("{}: report.limits: pollutant \"{}\" is not among report.pollutants ({})",
                                          field, limits[i].pollutant, fmt::join(names, ", ")));
    }
    em::ScreeningResult result = at_field(field, [&] { return screen_limit(limits[i], *bound, in.stack); });
    screened.push_back({limits[i].pollutant, limits[i].text, std::move(result)});
  }
  return screened;
}

MeasuredComparison measured_o2(const MeasuredValue& o2, const StackGas& stack, const em::ConcentrationContext& context) {
  const em::Basis dry_percent =
      em::make_basis(em::mole_unit("%"), em::Moisture::dry, em::DiluentReference::as_measured());
  const double value = at_field("stack.measured.o2", [&] { return o2.value.to(dry_percent, context).value(); });
  MeasuredComparison row{"O2", o2.text, "%, dry", value, stack.o2_dry * 100.0, "%", ""};
  if (std::abs(row.measured - row.model) > kO2MismatchPoints) {
    row.finding = fmt::format(
        "Measured O2 {:.2f} % (dry) differs from the {:.2f} % (dry) that the stated operating point gives by more "
        "than {} percentage points: the stated excess air, fuel or air leakage may not match the plant.",
        row.measured, row.model, kO2MismatchPoints);
  }
  return row;
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

std::vector<MeasuredComparison> compare_measured(const ScreeningInput& in) {
  const MeasuredSpec& measured = in.definition.stack.measured;
  std::vector<MeasuredComparison> rows;
  em::ConcentrationContext measured_context = in.stack.context;
  if (measured.moisture) measured_context.moisture_fraction = measured.moisture->fraction;
  if (measured.o2) {
    rows.push_back(measured_o2(*measured.o2, in.stack, measured_context));
    measured_context.o2_dry_fraction = rows.back().measured / 100.0;
  }
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

// The standard cautions, the O2-correction one, and "confirm against your permit" for a preset.
void add_cautions(bool reference_o2_from_preset, Screening& screening) {
  std::vector<em::Caution> cautions(em::standard_cautions().begin(), em::standard_cautions().end());
  cautions.push_back(em::Caution::o2_correction_validity);
  if (reference_o2_from_preset) cautions.push_back(em::Caution::confirm_presets);
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
  screening.limits = screen_limits(in);
  screening.measured = compare_measured(in);
  for (const MeasuredComparison& row : screening.measured) {
    if (!row.finding.empty()) screening.findings.push_back(row.finding);
  }
  for (std::string& finding : model_findings(in)) screening.findings.push_back(std::move(finding));
  screening.warnings = run_warnings(in.definition, in.resolved);
  add_screening_warnings(in, screening.warnings);
  screening.assumptions = assumptions_of(in, database);
  add_cautions(in.figures.reference_o2_from_preset, screening);
  return screening;
}

}  // namespace stackbound::cases
