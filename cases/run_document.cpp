#include "stackbound/cases/run_document.hpp"

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

Report run_document(const RunResult& r) {
  Report report;
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
    ReportTable limits;
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
    ReportTable measured;
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

  ReportTable flue;
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

  ReportTable species;
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

}  // namespace stackbound::cases
