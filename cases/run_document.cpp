#include "stackbound/cases/run_document.hpp"

#include <fmt/format.h>

#include "stackbound/emissions/reference_correction.hpp"
#include "stackbound/units/constants.hpp"

namespace stackbound::cases {

namespace {

namespace em = stackbound::emissions;

constexpr double kSecondsPerHour = 3600.0;

std::string num(double value, int significant = 4) {
  if (value == 0.0) return "0";
  return fmt::format("{:.{}g}", value, significant);
}

std::string percent_of(double fraction) { return fmt::format("{:.2f} %", fraction * 100.0); }

double normal_m3_per_h(double mol_per_s, const units::NormalConditions& normal) {
  return mol_per_s * normal.molar_volume_m3_per_mol() * kSecondsPerHour;
}

std::string operating_point_text(const RunResult& r) {
  const OperatingSpec& op = r.definition.operating;
  std::string stated;
  switch (op.mode) {
    case OperatingMode::excess_air: stated = fmt::format("excess air {} stated", percent_of(op.value)); break;
    case OperatingMode::lambda: stated = fmt::format("lambda {:.4g} stated", op.value); break;
    case OperatingMode::equivalence_ratio: stated = fmt::format("equivalence ratio {:.4g} stated", op.value); break;
    case OperatingMode::flue_o2:
      stated = fmt::format("flue O2 {} ({}) stated", percent_of(op.value), op.flue_o2_dry ? "dry" : "wet");
      break;
  }
  const core::CombustionResult& combustion = r.resolved.combustion;
  return fmt::format("{}; excess air {}, lambda {:.4f}", stated, percent_of(combustion.excess_air()), combustion.air_ratio);
}

std::string firing_text(const RunResult& r) {
  const FiringSpec& f = r.definition.firing;
  if (f.adiabatic) {
    return fmt::format("{:.1f} K adiabatic flame temperature ({} heat loss), {:.4g} kPa", r.fired.temperature_K,
                       percent_of(f.heat_loss_fraction), r.fired.pressure_Pa / 1e3);
  }
  return fmt::format("{:.1f} K (stated), {:.4g} kPa", r.fired.temperature_K, r.fired.pressure_Pa / 1e3);
}

std::string ref_label(const RunResult& r) {
  return fmt::format("@ {} O2", em::percent_text(r.emissions.reference_o2_dry) + " %");
}

std::vector<std::pair<std::string, std::string>> summary(const RunResult& r) {
  const core::FuelFeed& feed = r.resolved.rates.feed;
  const core::CombustionResult& combustion = r.resolved.combustion;
  const StackGas& stack = r.stack;
  const units::NormalConditions& normal = *r.emissions.normal;
  return {
      {"Case file", r.definition.origin},
      {"Fuel", fmt::format("{} (HHV {:.4g} MJ/kg, LHV {:.4g} MJ/kg; {})", r.resolved.fuel.name(),
                           combustion.hhv_J_per_kg / 1e6, combustion.lhv_J_per_kg / 1e6,
                           r.resolved.fuel.heating_value_method())},
      {"Fuel feed", fmt::format("{} = {:.5g} kg/h; heat input {:.5g} MW (HHV), {:.5g} MMBtu/h", feed.given,
                                feed.mass_flow_kg_per_s * kSecondsPerHour, feed.heat_input_hhv_W / 1e6,
                                feed.heat_input_hhv_W * kSecondsPerHour / (units::kBtuIT_J * 1e6))},
      {"F-factors (Method 19)", fmt::format("Fd {:.0f} dscf/MMBtu, Fw {:.0f} wscf/MMBtu, Fc {:.0f} scf/MMBtu; {}",
                                            r.resolved.f_factors.fd.scf_per_MMBtu(),
                                            r.resolved.f_factors.fw.scf_per_MMBtu(),
                                            r.resolved.f_factors.fc.scf_per_MMBtu(), r.resolved.f_factors.source)},
      {"Oxidant", r.resolved.oxidant.description()},
      {"Operating point", operating_point_text(r)},
      {"Firing conditions", firing_text(r)},
      {"Stack gas (frozen)", fmt::format("O2 {} dry, H2O {}, {:.5g} Nm3/h wet ({}), {:.5g} m3/h actual at {:.1f} K",
                                         percent_of(stack.o2_dry), percent_of(stack.h2o_wet),
                                         normal_m3_per_h(stack.wet_mol_per_s, normal), normal.key,
                                         stack.actual_m3_per_s * kSecondsPerHour, r.definition.stack.temperature_K)},
      {"Reference O2", r.emissions.reference_o2_text},
      {"Normal conditions", std::string(normal.description)},
      {"Solver", fmt::format("{} iterations, element-balance residual {:.1e}", r.fired.equilibrium.iterations,
                             r.fired.equilibrium.element_residual)},
  };
}

ReportTable bounds_table(const RunResult& r) {
  ReportTable bounds;
  bounds.title = fmt::format("Emissions: {}", kBoundStatement);
  const std::string ref = ref_label(r);
  bounds.columns = {"pollutant",
                    "[ppmvd]",
                    fmt::format("[ppmvd {}]", ref),
                    fmt::format("[mg/Nm3 {}]", ref),
                    "[kg/h]",
                    "[t/yr]",
                    "[lb/MMBtu]",
                    "[g/GJ]"};
  for (const PollutantBound& p : r.emissions.pollutants) {
    const em::StackEmission& e = p.emission;
    bounds.rows.push_back({p.name + (e.ppmvd.pollutant().expressed_as_no2 ? " (as NO2)" : ""), num(e.ppmvd.value()),
                           num(e.ppmvd_at_reference.value()), num(e.mg_per_Nm3_at_reference.result.value()),
                           num(e.mass_rate.value() * kSecondsPerHour), e.annual ? num(e.annual->value() / 1e3) : "-",
                           num(e.method19.lb_per_MMBtu()), num(e.method19.g_per_GJ())});
  }
  bounds.notes = {
      fmt::format("mg/Nm3 at {}, dry. t/yr for {:.0f} operating hours. lb/MMBtu and g/GJ on HHV by US EPA Method 19 "
                  "(Fd = {:.0f} dscf/MMBtu, O2-based).",
                  r.emissions.normal->description, r.definition.report.operating_hours_h,
                  r.resolved.f_factors.fd.scf_per_MMBtu()),
      "NOx is the sum of NO and NO2 expressed as NO2. Equilibrium NO is a bound: NO forms slowly, and plants "
      "usually emit far less than the equilibrium value at the flame temperature."};
  return bounds;
}

std::string figure_cell(const std::optional<PollutantFigure>& figure, bool mass) {
  if (!figure) return "-";
  const em::StackEmission& e = figure->emission;
  return num(mass ? e.mg_per_Nm3_at_reference.result.value() : e.ppmvd_at_reference.value());
}

std::string primary_zone_note(const PrimaryZonePart& z) {
  return fmt::format(
      "Primary zone: equivalence ratio {:.4g} ({:.4g} % of the oxidant; {}), adiabatic temperature {:.1f} K{}, "
      "{:g} ms: thermal NO {} ppmv there, {} ppmv wet in the mixed gas once the rest of the oxidant is mixed in at "
      "constant enthalpy; the zone's CO ({} ppmv wet in the mixed gas) is where CO burnout starts.",
      z.zone.equivalence_ratio, z.zone.air_share * 100.0, z.share_origin, z.zone.temperature().value(),
      z.zone.heat_loss_fraction > 0.0 ? fmt::format(" with {:g} % of the heat input lost", z.zone.heat_loss_fraction * 100.0)
                                      : std::string(),
      z.residence_time_s * 1e3, num(z.zone.thermal_no.no_mole_fraction * 1e6), num(z.no_carried * 1e6),
      num(z.co_carried * 1e6));
}

std::vector<std::string> post_flame_notes(const PostFlame& p) {
  std::vector<std::string> notes;
  if (p.primary_zone) notes.push_back(primary_zone_note(*p.primary_zone));
  notes.push_back(fmt::format(
      "Path{}: {:g} ms at {:.1f} K, then linear cooling to {:.1f} K ({}) over {:g} s, at {:.4g} kPa. Estimate: "
      "kinetics along that path; ceiling: the larger of the highest equilibrium value along the path and the "
      "kinetic NO with all fuel nitrogen as NO; bound: the frozen equilibrium at the firing temperature (as above).",
      p.primary_zone ? " after the primary zone, in the mixed gas" : "", p.path.hold_time.value() * 1e3,
      p.path.firing_temperature.value(), p.path.final_temperature.value(),
      p.cooling_to_origin, p.path.cooling_time.value(), p.path.pressure.value() / 1e3));
  if (p.thermal_no) {
    notes.push_back(fmt::format("NO split (wet): thermal {} ppmv, fuel nitrogen {} ppmv ({}, conversion {:g} %). "
                                "Thermal NO: extended Zeldovich with equilibrium O and OH; rate constants {}{}.",
                                num(p.thermal_no->no_mole_fraction * 1e6),
                                num(p.fuel_nitrogen.estimate_wet_mole_fraction * 1e6), to_string(p.fuel_nitrogen.origin),
                                p.fuel_nitrogen.no.conversion_fraction * 100.0, p.thermal_no->rate_constants,
                                p.thermal_no->rate_constants_within_stated_range
                                    ? ""
                                    : " (extrapolated outside their stated temperature range)"));
  } else {
    notes.push_back("Thermal NO not computed: the products lack O, O2, N2 or NO (firing.species).");
  }
  if (p.co) {
    notes.push_back(fmt::format("CO burnout from {}: {}{}.",
                                p.primary_zone ? "the primary zone's CO carried into the mixed gas"
                                               : "the equilibrium CO at the firing temperature",
                                p.co->rate_expression,
                                p.co->within_measured_range ? "" : " (used outside the temperatures it was measured at)"));
  }
  if (!p.assumptions.empty()) {
    notes.push_back("Assumptions (defaults the user should replace with the plant's): " +
                    fmt::format("{}.", fmt::join(p.assumptions, "; ")));
  }
  notes.push_back("Prompt NO is not computed.");
  notes.push_back(std::string(kPostFlameCaution));
  return notes;
}

// Estimate, ceiling and bound side by side for the pollutants the post-flame stage covers.
ReportTable post_flame_table(const RunResult& r) {
  ReportTable table;
  table.title = "Post-flame kinetics: estimate and ceiling beside the equilibrium bound";
  const std::string ref = ref_label(r);
  table.columns = {"pollutant",
                   fmt::format("estimate [ppmvd {}]", ref),
                   fmt::format("ceiling [ppmvd {}]", ref),
                   fmt::format("bound [ppmvd {}]", ref),
                   fmt::format("estimate [mg/Nm3 {}]", ref),
                   fmt::format("ceiling [mg/Nm3 {}]", ref),
                   fmt::format("bound [mg/Nm3 {}]", ref)};
  for (const PollutantBound& p : r.emissions.pollutants) {
    if (!p.estimate && !p.ceiling) continue;
    const em::StackEmission& e = p.emission;
    table.rows.push_back({p.name + (e.ppmvd.pollutant().expressed_as_no2 ? " (as NO2)" : ""),
                          figure_cell(p.estimate, false), figure_cell(p.ceiling, false),
                          num(e.ppmvd_at_reference.value()), figure_cell(p.estimate, true),
                          figure_cell(p.ceiling, true), num(e.mg_per_Nm3_at_reference.result.value())});
  }
  table.notes = post_flame_notes(r.post_flame);
  for (const PollutantBound& p : r.emissions.pollutants) {
    if (p.estimate && p.estimate->wet_mole_fraction > p.wet_mole_fraction) {
      table.notes.push_back(fmt::format(
          "{}: the estimate exceeds the equilibrium bound. NO from fuel nitrogen forms by kinetics in the flame and "
          "is not held to the equilibrium at the firing temperature; state fuel.nitrogen_conversion from the "
          "plant's data where it is known.",
          p.name));
    }
  }
  return table;
}

ReportTable limits_table(const Screening& s) {
  ReportTable limits;
  limits.title = "Screening against the stated limits";
  limits.columns = {"pollutant", "stated limit", "source", "value on the limit's basis", "share of limit", "reading"};
  for (const LimitScreening& l : s.limits) {
    limits.rows.push_back({l.pollutant, l.limit_text, std::string(em::screening_source_name(l.source)),
                           fmt::format("{} {}", num(l.result.value), l.result.unit),
                           fmt::format("{:.1f} %", l.result.fraction_of_limit * 100.0), l.reading});
  }
  for (std::size_t i = 0; i < s.limits.size(); ++i) {
    if (i == 0 || s.limits[i].limit_index != s.limits[i - 1].limit_index) {
      limits.notes.push_back(
          fmt::format("{} ({}): {}.", s.limits[i].pollutant, s.limits[i].limit_text, s.limits[i].conclusion));
    }
  }
  limits.notes.push_back(
      "Each value is converted to the limit's basis: measured values with the measured O2 (rates by Method 19 with "
      "the fuel's Fd), the estimate, ceiling and bound with the model's stack gas. A screening comparison, not a "
      "compliance determination.");
  return limits;
}

ReportTable measured_table(const Screening& s) {
  ReportTable measured;
  measured.title = "Measured values beside the model";
  measured.columns = {"quantity", "as stated", "basis", "measured", "model / bound"};
  for (const MeasuredComparison& m : s.measured) {
    measured.rows.push_back({m.quantity, m.measured_text, m.basis, fmt::format("{} {}", num(m.measured), m.unit),
                             fmt::format("{} {}", num(m.model), m.unit)});
  }
  measured.notes.push_back(
      fmt::format("Findings are raised when measured O2 differs by more than {} points, moisture by more than {} "
                  "points, CO exceeds {} times the bound, or NO/NOx exceeds the bound (our thresholds, common "
                  "practice, no source).",
                  kO2MismatchPoints, kMoistureMismatchPoints, kCoAboveBoundFactor));
  return measured;
}

ReportTable flue_table(const RunResult& r) {
  const core::CombustionResult& combustion = r.resolved.combustion;
  ReportTable flue;
  flue.title = "Flue gas";
  flue.columns = {"species", "complete combustion, wet [%]", "complete combustion, dry [%]",
                  "equilibrium at firing, frozen, wet [%]"};
  for (std::size_t i = 0; i < core::kFlueSpeciesCount; ++i) {
    const auto species = static_cast<core::FlueSpecies>(i);
    const std::string name(core::kFlueSpeciesNames[i]);
    const double wet = combustion.flue.mole_fraction(species, core::GasBasis::wet);
    const double eq = r.fired.equilibrium.mole_fraction(name);
    if (wet == 0.0 && eq < 1e-12) continue;
    flue.rows.push_back({name, fmt::format("{:.4f}", wet * 100.0),
                         fmt::format("{:.4f}", combustion.flue.mole_fraction(species, core::GasBasis::dry) * 100.0),
                         fmt::format("{:.4g}", eq * 100.0)});
  }
  flue.notes = {fmt::format(
      "Stoichiometric air {:.4g} kg/kg fuel; actual oxidant {:.4g} kg/kg; water dew point {}; the fuel's F-factors Fd {:.0f} "
      "dscf/MMBtu, Fw {:.0f} wscf/MMBtu, Fc {:.0f} scf/MMBtu (20 degC, 101.325 kPa).",
      combustion.stoichiometric_air_kg_per_kg, combustion.oxidant_kg_per_kg,
      combustion.water_dew_point_K ? fmt::format("{:.1f} K", *combustion.water_dew_point_K) : std::string("none"),
      combustion.f_factors.fd_dscf_per_MMBtu(), combustion.f_factors.fw_wscf_per_MMBtu(),
      combustion.f_factors.fc_scf_per_MMBtu())};
  return flue;
}

ReportTable species_table(const FiringState& fired) {
  const core::EquilibriumResult& eq = fired.equilibrium;
  ReportTable species;
  species.title = fmt::format("Equilibrium composition at {:.1f} K and {:.4g} kPa", fired.temperature_K,
                              fired.pressure_Pa / 1e3);
  species.columns = {"species", "mole fraction", "[mol/kg fuel]"};
  for (std::size_t i = 0; i < eq.species.size(); ++i) {
    const double x = eq.mole_fractions[i];
    const double n = eq.moles[i];
    if (x < 1e-9 && eq.species[i] != "C(gr)") continue;
    if (n <= 0.0) continue;
    species.rows.push_back({eq.species[i], fmt::format("{:.4e}", x), fmt::format("{:.5g}", n)});
  }
  species.notes = {"Species below 1e-9 mole fraction are not listed (the JSON output lists all)."};
  return species;
}

std::string optional_cell(const std::optional<double>& value) { return value ? num(*value) : "-"; }

// The figures an engineer reads first, per pollutant on the permit's basis.
ReportTable headline_table(const Screening& s) {
  ReportTable table;
  table.title = "Headline: each pollutant on the permit's basis";
  table.columns = {"pollutant", "unit and basis", "estimate", "ceiling", "bound", "measured", "stated limit"};
  for (const HeadlineRow& h : s.headline) {
    table.rows.push_back({h.pollutant, h.basis.empty() ? h.unit : fmt::format("{} ({})", h.unit, h.basis),
                          optional_cell(h.estimate), optional_cell(h.ceiling), num(h.bound), optional_cell(h.measured),
                          optional_cell(h.limit)});
    if (!h.reading.empty()) table.notes.push_back(fmt::format("{}: {}.", h.pollutant, h.reading));
  }
  table.notes.push_back(
      "Estimate: post-flame kinetics (not conservative); ceiling: the most the modelled path gives; bound: "
      "equilibrium at the stated firing conditions; measured: as stated in the case file, on the same "
      "basis. Without a stated limit the basis is mg/Nm3 dry at the reference O2. Details and cautions "
      "follow.");
  return table;
}

std::vector<ReportBarChart> headline_charts(const Screening& s) {
  std::vector<ReportBarChart> charts;
  for (const HeadlineRow& h : s.headline) {
    ReportBarChart chart{h.basis.empty() ? fmt::format("{} [{}]", h.pollutant, h.unit)
                                         : fmt::format("{} [{}, {}]", h.pollutant, h.unit, h.basis),
                         {},
                         h.limit};
    if (h.estimate) chart.bars.emplace_back("estimate", *h.estimate);
    if (h.ceiling) chart.bars.emplace_back("ceiling", *h.ceiling);
    chart.bars.emplace_back("bound", h.bound);
    if (h.measured) chart.bars.emplace_back("measured", *h.measured);
    charts.push_back(std::move(chart));
  }
  return charts;
}

}  // namespace

Report run_document(const RunResult& r, const Provenance& provenance) {
  Report report;
  report.title = r.definition.title;
  report.subtitle = fmt::format(
      "CO and NO figures are the {}: a screening estimate from chemical equilibrium, not a measurement and not a "
      "compliance determination.{}",
      kBoundStatement, r.definition.description.empty() ? "" : " " + r.definition.description);
  report.headline = headline_table(r.screening);
  report.headline_charts = headline_charts(r.screening);
  report.summary = summary(r);
  const std::vector<std::pair<std::string, std::string>> stamp = provenance_summary(provenance);
  report.summary.insert(report.summary.begin() + 1, stamp.begin(), stamp.end());
  report.tables.push_back(bounds_table(r));
  report.tables.push_back(post_flame_table(r));
  if (!r.screening.limits.empty()) report.tables.push_back(limits_table(r.screening));
  if (!r.screening.measured.empty()) report.tables.push_back(measured_table(r.screening));
  report.tables.push_back(flue_table(r));
  report.tables.push_back(species_table(r.fired));
  report.flags = r.screening.findings;
  for (const units::Warning& warning : r.screening.warnings) report.warnings.push_back(units::warning_text(warning));
  report.assumptions = r.screening.assumptions;
  report.cautions = r.screening.cautions;
  return report;
}

}  // namespace stackbound::cases
