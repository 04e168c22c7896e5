#include "stackbound/render/run_json.hpp"

#include "stackbound/cases/run_document.hpp"
#include "stackbound/render/warnings_json.hpp"
#include "stackbound/units/constants.hpp"

#include <optional>

namespace stackbound::render {

namespace {

namespace em = stackbound::emissions;
using namespace stackbound::cases;

constexpr double kSecondsPerHour = 3600.0;
constexpr double kKgPerLb = units::kPound_kg;

double normal_m3_per_h(double mol_per_s, const units::NormalConditions& normal) {
  return mol_per_s * normal.molar_volume_m3_per_mol() * kSecondsPerHour;
}

// A pollutant's figures on every basis: the keys of the bound, and of its estimate and ceiling.
nlohmann::json figure_json(double wet_mole_fraction, const em::StackEmission& e) {
  using nlohmann::json;
  return {
      {"wet_mole_fraction", wet_mole_fraction},
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

nlohmann::json optional_figure_json(const std::optional<PollutantFigure>& figure) {
  return figure ? figure_json(figure->wet_mole_fraction, figure->emission) : nlohmann::json(nullptr);
}

nlohmann::json thermal_no_json(const std::optional<core::ThermalNoPathResult>& no) {
  if (!no) return nullptr;
  nlohmann::json history = nlohmann::json::array();
  for (const core::ThermalNoSample& s : no->history) {
    history.push_back({{"time_s", s.time_s},
                       {"temperature_K", s.temperature_K},
                       {"no_mole_fraction", s.no_mole_fraction},
                       {"no_equilibrium_mole_fraction", s.no_equilibrium_mole_fraction}});
  }
  return {{"no_mole_fraction", no->no_mole_fraction},
          {"no_equilibrium_mole_fraction_at_end", no->no_equilibrium_mole_fraction},
          {"initial_no_mole_fraction", no->initial_no_mole_fraction},
          {"rate_constants", no->rate_constants},
          {"rate_constants_within_stated_range", no->rate_constants_within_stated_range},
          {"history", history}};
}

nlohmann::json co_json(const std::optional<core::CoBurnoutResult>& co) {
  if (!co) return nullptr;
  return {{"initial_co_mole_fraction", co->initial_co_mole_fraction},
          {"co_mole_fraction", co->co_mole_fraction},
          {"co_equilibrium_mole_fraction_at_end", co->co_equilibrium_mole_fraction},
          {"rate_expression", co->rate_expression},
          {"within_measured_range", co->within_measured_range},
          {"raised_to_equilibrium", co->raised_to_equilibrium}};
}

nlohmann::json fuel_nitrogen_json(const FuelNitrogenPart& n) {
  using nlohmann::json;
  json band = nullptr;
  if (n.band) {
    band = {{"low_fraction", n.band->band.low_fraction},
            {"high_fraction", n.band->band.high_fraction},
            {"status", n.band->band.status},
            {"source", n.band->band.source}};
  }
  return {{"fuel_nitrogen_mol_per_kg", n.no.fuel_nitrogen_mol_per_kg},
          {"conversion_fraction", n.no.conversion_fraction},
          {"conversion_origin", to_string(n.origin)},
          {"conversion_source", n.no.conversion_source},
          {"typical_band", band},
          {"no_estimate_wet_mole_fraction", n.estimate_wet_mole_fraction},
          {"no_ceiling_wet_mole_fraction", n.ceiling_wet_mole_fraction}};
}

nlohmann::json primary_zone_json(const std::optional<PrimaryZonePart>& part) {
  if (!part) return nullptr;
  const core::PrimaryZone& z = part->zone;
  return {{"equivalence_ratio", z.equivalence_ratio},
          {"air_share", z.air_share},
          {"share_origin", part->share_origin},
          {"temperature_K", z.temperature().value()},
          {"residence_time_s", part->residence_time_s},
          {"heat_loss_fraction", z.heat_loss_fraction},
          {"no_mole_fraction", z.thermal_no.no_mole_fraction},
          {"no_equilibrium_mole_fraction", z.thermal_no.no_equilibrium_mole_fraction},
          {"rate_constants", z.thermal_no.rate_constants},
          {"mixed_gas_wet_mole_fraction",
           {{"NO", part->no_carried}, {"NO_equilibrium", part->no_equilibrium_carried}, {"CO", part->co_carried}}}};
}

// The zones the gas passes through in order, each with its temperature(s) and time.
nlohmann::json zones_json(const PostFlame& p) {
  nlohmann::json zones = nlohmann::json::array();
  if (p.primary_zone) {
    zones.push_back({{"zone", "primary"},
                     {"temperature_K", p.primary_zone->zone.temperature().value()},
                     {"time_s", p.primary_zone->residence_time_s}});
  }
  zones.push_back({{"zone", "hold"}, {"temperature_K", p.path.firing_temperature.value()}, {"time_s", p.path.hold_time.value()}});
  zones.push_back({{"zone", "cooling"},
                   {"from_K", p.path.firing_temperature.value()},
                   {"to_K", p.path.final_temperature.value()},
                   {"time_s", p.path.cooling_time.value()}});
  return zones;
}

nlohmann::json post_flame_json(const RunResult& r) {
  const PostFlame& p = r.post_flame;
  const double thermal = p.thermal_no ? p.thermal_no->no_mole_fraction : 0.0;
  const double fuel = p.fuel_nitrogen.estimate_wet_mole_fraction;
  return {
      {"zones", zones_json(p)},
      {"primary_zone", primary_zone_json(p.primary_zone)},
      {"residence_time_s", p.path.hold_time.value()},
      {"residence_time_stated", r.definition.firing.residence_time_stated},
      {"firing_temperature_K", p.path.firing_temperature.value()},
      {"pressure_Pa", p.path.pressure.value()},
      {"cooling",
       {{"to_K", p.path.final_temperature.value()},
        {"to_origin", p.cooling_to_origin},
        {"time_s", p.path.cooling_time.value()},
        {"time_stated", r.definition.post_flame.cooling_time_stated},
        {"steps", p.path.cooling_steps},
        {"profile", "linear"}}},
      {"rate_sources",
       {{"thermal_no", p.thermal_no ? nlohmann::json(p.thermal_no->rate_constants) : nlohmann::json(nullptr)},
        {"co_burnout", p.co ? nlohmann::json(p.co->rate_expression) : nlohmann::json(nullptr)}}},
      {"thermal_no", thermal_no_json(p.thermal_no)},
      {"co_burnout", co_json(p.co)},
      {"fuel_nitrogen", fuel_nitrogen_json(p.fuel_nitrogen)},
      {"no_split",
       {{"thermal_wet_mole_fraction", thermal},
        {"fuel_wet_mole_fraction", fuel},
        {"thermal_share", thermal + fuel > 0.0 ? nlohmann::json(thermal / (thermal + fuel)) : nlohmann::json(nullptr)}}},
      {"highest_equilibrium_wet_mole_fraction",
       {{"NO", p.highest_equilibrium_no}, {"NOx", p.highest_equilibrium_nox}, {"CO", p.highest_equilibrium_co}}},
      {"assumptions", p.assumptions},
      {"prompt_no", "not computed"},
      {"caution", kPostFlameCaution},
  };
}

}  // namespace

nlohmann::json provenance_json(const Provenance& p) {
  return {{"version", p.version}, {"run_at", p.run_at}, {"case_sha256", p.case_sha256}};
}

nlohmann::json run_json(const RunResult& r, const Provenance& provenance) {
  using nlohmann::json;
  json mole_fractions = json::object();
  json moles = json::object();
  for (std::size_t i = 0; i < r.fired.equilibrium.species.size(); ++i) {
    mole_fractions[r.fired.equilibrium.species[i]] = r.fired.equilibrium.mole_fractions[i];
    moles[r.fired.equilibrium.species[i]] = r.fired.equilibrium.moles[i];
  }
  json emissions = json::object();
  for (const PollutantBound& p : r.emissions.pollutants) {
    emissions[p.name] = figure_json(p.wet_mole_fraction, p.emission);
    emissions[p.name]["estimate"] = optional_figure_json(p.estimate);
    emissions[p.name]["ceiling"] = optional_figure_json(p.ceiling);
  }
  json limits = json::array();
  for (const LimitScreening& l : r.screening.limits) {
    limits.push_back({{"pollutant", l.pollutant},
                      {"limit", l.limit_text},
                      {"limit_index", l.limit_index},
                      {"source", em::screening_source_name(l.source)},
                      {"value", l.result.value},
                      {"limit_value", l.result.limit},
                      {"unit", l.result.unit},
                      {"basis", l.result.basis},
                      {"margin", l.result.margin},
                      {"fraction_of_limit", l.result.fraction_of_limit},
                      {"outcome", em::screening_outcome_name(l.result.outcome)},
                      {"wording", l.result.wording},
                      {"reading", l.reading},
                      {"conclusion", l.conclusion}});
  }
  json measured = json::array();
  for (const MeasuredComparison& m : r.screening.measured) {
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
  for (const auto& [name, x] : r.resolved.combustion.flue.mole_fractions(core::GasBasis::wet)) flue_wet[name] = x;
  for (const auto& [name, x] : r.resolved.combustion.flue.mole_fractions(core::GasBasis::dry)) flue_dry[name] = x;
  const core::FuelFeed& feed = r.resolved.rates.feed;
  return {
      {"case",
       {{"title", r.definition.title},
        {"description", r.definition.description},
        {"file", r.definition.origin},
        {"plant_type", r.definition.plant_type}}},
      {"provenance", provenance_json(provenance)},
      {"bound_statement", kBoundStatement},
      {"fuel",
       {{"name", r.resolved.fuel.name()},
        {"source", r.resolved.fuel.source()},
        {"heating_value_method", r.resolved.fuel.heating_value_method()},
        {"hhv_MJ_per_kg", r.resolved.combustion.hhv_J_per_kg / 1e6},
        {"lhv_MJ_per_kg", r.resolved.combustion.lhv_J_per_kg / 1e6},
        {"feed_rate", feed.given},
        {"mass_flow_kg_per_h", feed.mass_flow_kg_per_s * kSecondsPerHour},
        {"heat_input_hhv_MW", feed.heat_input_hhv_W / 1e6},
        {"Fd_dscf_per_MMBtu", r.resolved.combustion.f_factors.fd_dscf_per_MMBtu()},
        {"Fw_wscf_per_MMBtu", r.resolved.combustion.f_factors.fw_wscf_per_MMBtu()},
        {"Fc_scf_per_MMBtu", r.resolved.combustion.f_factors.fc_scf_per_MMBtu()},
        {"f_factors",
         {{"choice", f_factor_choice_name(r.resolved.f_factors.choice)},
          {"source", r.resolved.f_factors.source},
          {"Fd_dscf_per_MMBtu", r.resolved.f_factors.fd.scf_per_MMBtu()},
          {"Fw_wscf_per_MMBtu", r.resolved.f_factors.fw.scf_per_MMBtu()},
          {"Fc_scf_per_MMBtu", r.resolved.f_factors.fc.scf_per_MMBtu()}}}}},
      {"combustion",
       {{"air_ratio", r.resolved.combustion.air_ratio},
        {"excess_air_percent", r.resolved.combustion.excess_air() * 100.0},
        {"stoichiometric_air_kg_per_kg", r.resolved.combustion.stoichiometric_air_kg_per_kg},
        {"flue_gas_wet", flue_wet},
        {"flue_gas_dry", flue_dry},
        {"water_dew_point_K",
         r.resolved.combustion.water_dew_point_K ? json(*r.resolved.combustion.water_dew_point_K) : json(nullptr)}}},
      {"firing",
       {{"temperature_K", r.fired.temperature_K},
        {"pressure_Pa", r.fired.pressure_Pa},
        {"adiabatic", r.definition.firing.adiabatic},
        {"heat_loss_fraction", r.definition.firing.heat_loss_fraction}}},
      {"equilibrium",
       {{"mole_fractions", mole_fractions},
        {"moles_per_kg_fuel", moles},
        {"total_gas_moles_per_kg_fuel", r.fired.equilibrium.total_gas_moles},
        {"iterations", r.fired.equilibrium.iterations},
        {"element_residual", r.fired.equilibrium.element_residual},
        {"graphite_present", r.fired.equilibrium.graphite_present}}},
      {"stack",
       {{"temperature_K", r.definition.stack.temperature_K},
        {"pressure_Pa", r.definition.stack.pressure_Pa},
        {"o2_dry_percent", r.stack.o2_dry * 100.0},
        {"moisture_percent", r.stack.h2o_wet * 100.0},
        {"wet_flow_mol_per_s", r.stack.wet_mol_per_s},
        {"wet_flow_Nm3_per_h", normal_m3_per_h(r.stack.wet_mol_per_s, *r.emissions.normal)},
        {"dry_flow_Nm3_per_h", normal_m3_per_h(r.stack.dry_mol_per_s, *r.emissions.normal)},
        {"actual_flow_m3_per_h", r.stack.actual_m3_per_s * kSecondsPerHour}}},
      {"reference_o2_percent", r.emissions.reference_o2_dry * 100.0},
      {"reference_o2",
       {{"text", r.emissions.reference_o2_text}, {"from_preset", r.emissions.reference_o2_from_preset}}},
      {"o2_basis_percent", em::o2_basis_percent(r.definition.report.o2_basis)},
      {"normal_conditions", {{"key", r.emissions.normal->key}, {"description", r.emissions.normal->description}}},
      {"post_flame", post_flame_json(r)},
      {"emissions", emissions},
      {"limits", limits},
      {"measured", measured},
      {"findings", r.screening.findings},
      {"warnings", warnings_json(r.screening.warnings)},
      {"assumptions", r.screening.assumptions},
      {"cautions", r.screening.cautions},
      {"caution_keys", r.screening.caution_keys},
  };
}

}  // namespace stackbound::render
