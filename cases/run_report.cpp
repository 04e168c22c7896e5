#include "stackbound/cases/run_report.hpp"

#include <fmt/format.h>

#include "stackbound/emissions/reference_correction.hpp"
#include "stackbound/units/constants.hpp"

namespace stackbound::cases {

namespace {

namespace em = stackbound::emissions;

constexpr double kSecondsPerHour = 3600.0;
constexpr double kKgPerLb = units::kPound_kg;

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
  return fmt::format("{}; excess air {}, lambda {:.4f}", stated, percent_of(r.combustion.excess_air()),
                     r.combustion.air_ratio);
}

std::string firing_text(const RunResult& r) {
  const FiringSpec& f = r.definition.firing;
  if (f.adiabatic) {
    return fmt::format("{:.1f} K adiabatic flame temperature ({} heat loss), {:.4g} kPa", r.firing_temperature_K,
                       percent_of(f.heat_loss_fraction), r.firing_pressure_Pa / 1e3);
  }
  return fmt::format("{:.1f} K (stated), {:.4g} kPa", r.firing_temperature_K, r.firing_pressure_Pa / 1e3);
}

std::string ref_label(const RunResult& r) { return fmt::format("@ {} O2", em::percent_text(r.reference_o2_dry) + " %"); }

}  // namespace

em::Report run_report(const RunResult& r) {
  em::Report report;
  report.title = r.definition.title;
  report.subtitle = fmt::format(
      "CO and NO figures are the {}: a screening estimate from chemical equilibrium, not a measurement and not a "
      "compliance determination.{}",
      kBoundStatement, r.definition.description.empty() ? "" : " " + r.definition.description);
  const core::FuelFeed& feed = r.rates.feed;
  report.summary = {
      {"Case file", r.definition.origin},
      {"Fuel", fmt::format("{} (HHV {:.4g} MJ/kg, LHV {:.4g} MJ/kg; {})", r.fuel.name(), r.combustion.hhv_J_per_kg / 1e6,
                           r.combustion.lhv_J_per_kg / 1e6, r.fuel.heating_value_method())},
      {"Fuel feed", fmt::format("{} = {:.5g} kg/h; heat input {:.5g} MW (HHV), {:.5g} MMBtu/h", feed.given,
                                feed.mass_flow_kg_per_s * kSecondsPerHour, feed.heat_input_hhv_W / 1e6,
                                feed.heat_input_hhv_W * kSecondsPerHour / (units::kBtuIT_J * 1e6))},
      {"Oxidant", r.oxidant.description()},
      {"Operating point", operating_point_text(r)},
      {"Firing conditions", firing_text(r)},
      {"Stack gas (frozen)", fmt::format("O2 {} dry, H2O {}, {:.5g} Nm3/h wet ({}), {:.5g} m3/h actual at {:.1f} K",
                                         percent_of(r.stack_o2_dry), percent_of(r.stack_h2o_wet),
                                         normal_m3_per_h(r.stack_wet_mol_per_s, *r.normal), r.normal->key,
                                         r.stack_actual_m3_per_s * kSecondsPerHour, r.definition.stack.temperature_K)},
      {"Reference O2", r.reference_o2_text},
      {"Normal conditions", std::string(r.normal->description)},
      {"Solver", fmt::format("{} iterations, element-balance residual {:.1e}", r.equilibrium.iterations,
                             r.equilibrium.element_residual)},
  };

  em::ReportTable bounds;
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
  for (const PollutantBound& p : r.pollutants) {
    const em::StackEmission& e = p.emission;
    bounds.rows.push_back({p.name + (e.ppmvd.pollutant().expressed_as_no2 ? " (as NO2)" : ""), num(e.ppmvd.value()),
                           num(e.ppmvd_at_reference.value()), num(e.mg_per_Nm3_at_reference.result.value()),
                           num(e.mass_rate.value() * kSecondsPerHour), e.annual ? num(e.annual->value() / 1e3) : "-",
                           num(e.method19.lb_per_MMBtu()), num(e.method19.g_per_GJ())});
  }
  bounds.notes = {
      fmt::format("mg/Nm3 at {}, dry. t/yr for {:.0f} operating hours. lb/MMBtu and g/GJ on HHV by US EPA Method 19 "
                  "(Fd = {:.0f} dscf/MMBtu, O2-based).",
                  r.normal->description, r.definition.report.operating_hours_h, r.combustion.f_factors.fd_dscf_per_MMBtu()),
      "NOx is the sum of NO and NO2 expressed as NO2. Equilibrium NO is a bound: NO forms slowly, and plants "
      "usually emit far less than the equilibrium value at the flame temperature."};
  report.tables.push_back(std::move(bounds));

  if (!r.limits.empty()) {
    em::ReportTable limits;
    limits.title = "Screening against the stated limits";
    limits.columns = {"pollutant", "stated limit", "bound on the limit's basis", "share of limit", "outcome"};
    for (const LimitScreening& l : r.limits) {
      limits.rows.push_back({l.pollutant, l.limit_text, fmt::format("{} {}", num(l.result.value), l.result.unit),
                             fmt::format("{:.1f} %", l.result.fraction_of_limit * 100.0),
                             std::string(em::screening_outcome_name(l.result.outcome))});
    }
    for (const LimitScreening& l : r.limits) limits.notes.push_back(l.result.wording);
    report.tables.push_back(std::move(limits));
  }

  if (!r.measured.empty()) {
    em::ReportTable measured;
    measured.title = "Measured values beside the model";
    measured.columns = {"quantity", "as stated", "basis", "measured", "model / bound"};
    for (const MeasuredComparison& m : r.measured) {
      measured.rows.push_back({m.quantity, m.measured_text, m.basis, fmt::format("{} {}", num(m.measured), m.unit),
                               fmt::format("{} {}", num(m.model), m.unit)});
    }
    measured.notes.push_back(
        fmt::format("Findings are raised when measured O2 differs by more than {} points, moisture by more than {} "
                    "points, CO exceeds {} times the bound, or NO/NOx exceeds the bound (our thresholds, common "
                    "practice, no source).",
                    kO2MismatchPoints, kMoistureMismatchPoints, kCoAboveBoundFactor));
    report.tables.push_back(std::move(measured));
  }

  em::ReportTable flue;
  flue.title = "Flue gas";
  flue.columns = {"species", "complete combustion, wet [%]", "complete combustion, dry [%]",
                  "equilibrium at firing, frozen, wet [%]"};
  for (std::size_t i = 0; i < core::kFlueSpeciesCount; ++i) {
    const auto species = static_cast<core::FlueSpecies>(i);
    const std::string name(core::kFlueSpeciesNames[i]);
    const double wet = r.combustion.flue.mole_fraction(species, core::GasBasis::wet);
    const double eq = r.equilibrium.mole_fraction(name);
    if (wet == 0.0 && eq < 1e-12) continue;
    flue.rows.push_back({name, fmt::format("{:.4f}", wet * 100.0),
                         fmt::format("{:.4f}", r.combustion.flue.mole_fraction(species, core::GasBasis::dry) * 100.0),
                         fmt::format("{:.4g}", eq * 100.0)});
  }
  flue.notes = {fmt::format(
      "Stoichiometric air {:.4g} kg/kg fuel; actual oxidant {:.4g} kg/kg; water dew point {}; F-factors Fd {:.0f} "
      "dscf/MMBtu, Fw {:.0f} wscf/MMBtu, Fc {:.0f} scf/MMBtu (20 degC, 101.325 kPa).",
      r.combustion.stoichiometric_air_kg_per_kg, r.combustion.oxidant_kg_per_kg,
      r.combustion.water_dew_point_K ? fmt::format("{:.1f} K", *r.combustion.water_dew_point_K) : std::string("none"),
      r.combustion.f_factors.fd_dscf_per_MMBtu(), r.combustion.f_factors.fw_wscf_per_MMBtu(),
      r.combustion.f_factors.fc_scf_per_MMBtu())};
  report.tables.push_back(std::move(flue));

  em::ReportTable species;
  species.title = fmt::format("Equilibrium composition at {:.1f} K and {:.4g} kPa", r.firing_temperature_K,
                              r.firing_pressure_Pa / 1e3);
  species.columns = {"species", "mole fraction", "[mol/kg fuel]"};
  for (std::size_t i = 0; i < r.equilibrium.species.size(); ++i) {
    const double x = r.equilibrium.mole_fractions[i];
    const double n = r.equilibrium.moles[i];
    if (x < 1e-9 && r.equilibrium.species[i] != "C(gr)") continue;
    if (n <= 0.0) continue;
    species.rows.push_back({r.equilibrium.species[i], fmt::format("{:.4e}", x), fmt::format("{:.5g}", n)});
  }
  species.notes = {"Species below 1e-9 mole fraction are not listed (the JSON output lists all)."};
  report.tables.push_back(std::move(species));

  report.flags = r.findings;
  for (const std::string& warning : r.warnings) report.flags.push_back("Note: " + warning);
  report.assumptions = r.assumptions;
  report.cautions = r.cautions;
  return report;
}

nlohmann::json run_json(const RunResult& r) {
  using nlohmann::json;
  json mole_fractions = json::object();
  json moles = json::object();
  for (std::size_t i = 0; i < r.equilibrium.species.size(); ++i) {
    mole_fractions[r.equilibrium.species[i]] = r.equilibrium.mole_fractions[i];
    moles[r.equilibrium.species[i]] = r.equilibrium.moles[i];
  }
  json emissions = json::object();
  for (const PollutantBound& p : r.pollutants) {
    const em::StackEmission& e = p.emission;
    emissions[p.name] = {
        {"wet_mole_fraction", p.wet_mole_fraction},
        {"ppmvd", e.ppmvd.value()},
        {"ppmvd_at_ref_o2", e.ppmvd_at_reference.value()},
        {"mg_per_Nm3_at_ref_o2", e.mg_per_Nm3_at_reference.result.value()},
        {"kg_per_h", e.mass_rate.value() * kSecondsPerHour},
        {"lb_per_h", e.mass_rate.value() * kSecondsPerHour / kKgPerLb},
        {"t_per_yr", e.annual ? json(e.annual->value() / 1e3) : json(nullptr)},
        {"lb_per_MMBtu", e.method19.lb_per_MMBtu()},
        {"g_per_GJ", e.method19.g_per_GJ()},
        {"lb_per_MMBtu_mass_balance", e.direct.lb_per_MMBtu()},
        {"as_no2", e.ppmvd.pollutant().expressed_as_no2},
    };
  }
  json limits = json::array();
  for (const LimitScreening& l : r.limits) {
    limits.push_back({{"pollutant", l.pollutant},
                      {"limit", l.limit_text},
                      {"value", l.result.value},
                      {"limit_value", l.result.limit},
                      {"unit", l.result.unit},
                      {"basis", l.result.basis},
                      {"margin", l.result.margin},
                      {"fraction_of_limit", l.result.fraction_of_limit},
                      {"outcome", em::screening_outcome_name(l.result.outcome)},
                      {"wording", l.result.wording}});
  }
  json measured = json::array();
  for (const MeasuredComparison& m : r.measured) {
    measured.push_back({{"quantity", m.quantity},
                        {"stated", m.measured_text},
                        {"basis", m.basis},
                        {"measured", m.measured},
                        {"model", m.model},
                        {"unit", m.unit},
                        {"finding", m.finding.empty() ? json(nullptr) : json(m.finding)}});
  }
  json flue_wet = json::object();
  json flue_dry = json::object();
  for (const auto& [name, x] : r.combustion.flue.mole_fractions(core::GasBasis::wet)) flue_wet[name] = x;
  for (const auto& [name, x] : r.combustion.flue.mole_fractions(core::GasBasis::dry)) flue_dry[name] = x;
  const core::FuelFeed& feed = r.rates.feed;
  return {
      {"case", {{"title", r.definition.title}, {"description", r.definition.description}, {"file", r.definition.origin},
                {"plant_type", r.definition.plant_type}}},
      {"bound_statement", kBoundStatement},
      {"fuel",
       {{"name", r.fuel.name()},
        {"source", r.fuel.source()},
        {"heating_value_method", r.fuel.heating_value_method()},
        {"hhv_MJ_per_kg", r.combustion.hhv_J_per_kg / 1e6},
        {"lhv_MJ_per_kg", r.combustion.lhv_J_per_kg / 1e6},
        {"feed_rate", feed.given},
        {"mass_flow_kg_per_h", feed.mass_flow_kg_per_s * kSecondsPerHour},
        {"heat_input_hhv_MW", feed.heat_input_hhv_W / 1e6},
        {"Fd_dscf_per_MMBtu", r.combustion.f_factors.fd_dscf_per_MMBtu()},
        {"Fw_wscf_per_MMBtu", r.combustion.f_factors.fw_wscf_per_MMBtu()},
        {"Fc_scf_per_MMBtu", r.combustion.f_factors.fc_scf_per_MMBtu()}}},
      {"combustion",
       {{"air_ratio", r.combustion.air_ratio},
        {"excess_air_percent", r.combustion.excess_air() * 100.0},
        {"stoichiometric_air_kg_per_kg", r.combustion.stoichiometric_air_kg_per_kg},
        {"flue_gas_wet", flue_wet},
        {"flue_gas_dry", flue_dry},
        {"water_dew_point_K", r.combustion.water_dew_point_K ? json(*r.combustion.water_dew_point_K) : json(nullptr)}}},
      {"firing",
       {{"temperature_K", r.firing_temperature_K},
        {"pressure_Pa", r.firing_pressure_Pa},
        {"adiabatic", r.definition.firing.adiabatic},
        {"heat_loss_fraction", r.definition.firing.heat_loss_fraction}}},
      {"equilibrium",
       {{"mole_fractions", mole_fractions},
        {"moles_per_kg_fuel", moles},
        {"total_gas_moles_per_kg_fuel", r.equilibrium.total_gas_moles},
        {"iterations", r.equilibrium.iterations},
        {"element_residual", r.equilibrium.element_residual},
        {"graphite_present", r.equilibrium.graphite_present}}},
      {"stack",
       {{"temperature_K", r.definition.stack.temperature_K},
        {"pressure_Pa", r.definition.stack.pressure_Pa},
        {"o2_dry_percent", r.stack_o2_dry * 100.0},
        {"moisture_percent", r.stack_h2o_wet * 100.0},
        {"wet_flow_mol_per_s", r.stack_wet_mol_per_s},
        {"wet_flow_Nm3_per_h", normal_m3_per_h(r.stack_wet_mol_per_s, *r.normal)},
        {"dry_flow_Nm3_per_h", normal_m3_per_h(r.stack_dry_mol_per_s, *r.normal)},
        {"actual_flow_m3_per_h", r.stack_actual_m3_per_s * kSecondsPerHour}}},
      {"reference_o2_percent", r.reference_o2_dry * 100.0},
      {"reference_o2", {{"text", r.reference_o2_text}, {"from_preset", r.reference_o2_from_preset}}},
      {"o2_basis_percent", r.definition.report.o2_basis_percent},
      {"normal_conditions", {{"key", r.normal->key}, {"description", r.normal->description}}},
      {"emissions", emissions},
      {"limits", limits},
      {"measured", measured},
      {"findings", r.findings},
      {"warnings", r.warnings},
      {"assumptions", r.assumptions},
      {"cautions", r.cautions},
      {"caution_keys", r.caution_keys},
  };
}

std::string render_run(const RunResult& result, const std::string& format) {
  if (format == "json") return run_json(result).dump(2) + "\n";
  const em::Report report = run_report(result);
  if (format == "csv") return em::render_csv(report);
  if (format == "html") return em::render_html(report);
  return em::render_text(report);
}

}  // namespace stackbound::cases
