#include "stackbound/render/fuel_json.hpp"

#include "stackbound/render/warnings_json.hpp"
#include "stackbound/units/constants.hpp"
#include "stackbound/units/normal_conditions.hpp"
#include "stackbound/units/quantity_parser.hpp"

namespace stackbound::render {

namespace {

using units::Dimension;

// The caution as one paragraph.
double nm3_per_mol() { return units::normal_0C().molar_volume_m3_per_mol(); }

std::string caution_one_line() {
  std::string text(cases::kFuelCaution);
  for (char& c : text) {
    if (c == '\n') c = ' ';
  }
  return text;
}

nlohmann::json fractions_json(const std::vector<std::pair<std::string, double>>& fractions) {
  nlohmann::json object = nlohmann::json::object();
  for (const auto& [name, x] : fractions) object[name] = x;
  return object;
}

}  // namespace

nlohmann::json fuel_json(const cases::FuelAnswer& answer) {
  const core::Fuel& fuel = answer.fuel;
  const core::Oxidant& oxidant = answer.oxidant;
  const core::CombustionResult& r = answer.result;
  const double vn = nm3_per_mol();
  const double hhv = r.hhv_J_per_kg;
  const core::AsFiredAnalysis a = fuel.as_fired_analysis();
  nlohmann::json fuel_part = {{"name", fuel.name()},
                              {"state", core::to_string(fuel.state())},
                              {"source", fuel.source()},
                              {"heating_value_method", fuel.heating_value_method()},
                              {"temperature_K", r.fuel_temperature_K},
                              {"as_fired_mass_percent",
                               {{"C", a.carbon_percent},
                                {"H", a.hydrogen_percent},
                                {"O", a.oxygen_percent},
                                {"N", a.nitrogen_percent},
                                {"S", a.sulfur_percent},
                                {"ash", a.ash_percent},
                                {"moisture", a.moisture_percent},
                                {"other", a.other_percent}}}};
  if (!fuel.mole_fractions().empty()) fuel_part["mole_fractions"] = fractions_json(fuel.mole_fractions());
  if (const auto m = fuel.molar_mass_kg_per_mol()) {
    fuel_part["molar_mass_g_per_mol"] = *m * 1e3;
    fuel_part["hhv_MJ_per_Nm3"] = hhv * *m / vn * 1e-6;
    fuel_part["lhv_MJ_per_Nm3"] = r.lhv_J_per_kg * *m / vn * 1e-6;
    fuel_part["hhv_Btu_per_scf"] = units::convert_from_si(hhv * *m, Dimension::molar_energy, "Btu/scf");
  }
  nlohmann::json oxidant_json = {{"description", oxidant.description()},
                                 {"temperature_K", oxidant.temperature_K()},
                                 {"dry_air_source", core::standard_dry_air_source()},
                                 {"humidity", oxidant.humidity().description()}};
  for (std::size_t i = 0; i < core::kOxidantSpeciesCount; ++i) {
    oxidant_json["mole_fractions"][std::string(core::kOxidantSpeciesNames[i])] = oxidant.mole_fractions()[i];
  }
  const double wet_mol = r.flue.total_mol_per_kg(core::GasBasis::wet);
  const double dry_mol = r.flue.total_mol_per_kg(core::GasBasis::dry);
  nlohmann::json out = {
      {"fuel", fuel_part},
      {"oxidant", oxidant_json},
      {"hhv_MJ_per_kg", hhv * 1e-6},
      {"lhv_MJ_per_kg", r.lhv_J_per_kg * 1e-6},
      {"operating_point", answer.operating_point},
      {"excess_air_percent", r.excess_air() * 100.0},
      {"lambda", r.air_ratio},
      {"phi", r.equivalence_ratio()},
      {"stoichiometric_air_kg_per_kg", r.stoichiometric_air_kg_per_kg},
      {"stoichiometric_air_Nm3_per_kg",
       r.stoichiometric_oxidant_mol_per_kg * (1.0 - oxidant.water_mole_fraction()) * vn},
      {"oxidant_kg_per_kg", r.oxidant_kg_per_kg},
      {"oxidant_mol_per_kg", r.oxidant_mol_per_kg},
      {"flue_gas_wet", fractions_json(r.flue.mole_fractions(core::GasBasis::wet))},
      {"flue_gas_dry", fractions_json(r.flue.mole_fractions(core::GasBasis::dry))},
      {"flue_o2_dry", r.flue_o2_dry},
      {"flue_o2_wet", r.flue_o2_wet},
      {"flue_co2_dry", r.flue_co2_dry},
      {"moisture_fraction", r.moisture_fraction},
      {"flue_gas_mol_per_kg", {{"wet", wet_mol}, {"dry", dry_mol}}},
      {"flue_gas_Nm3_per_kg", {{"wet", wet_mol * vn}, {"dry", dry_mol * vn}}},
      {"flue_gas_kg_per_kg",
       {{"wet", r.flue.mass_kg_per_kg(core::GasBasis::wet)}, {"dry", r.flue.mass_kg_per_kg(core::GasBasis::dry)}}},
      {"flue_gas_Nm3_per_GJ_hhv", {{"wet", wet_mol * vn / hhv * 1e9}, {"dry", dry_mol * vn / hhv * 1e9}}},
      {"normal_conditions", units::normal_0C().description},
      {"water_dew_point_K", r.water_dew_point_K ? nlohmann::json(*r.water_dew_point_K) : nlohmann::json(nullptr)},
      {"flue_pressure_Pa", r.flue_pressure_Pa},
      {"Fd_dscf_per_MMBtu", r.f_factors.fd_dscf_per_MMBtu()},
      {"Fw_wscf_per_MMBtu", r.f_factors.fw_wscf_per_MMBtu()},
      {"Fc_scf_per_MMBtu", r.f_factors.fc_scf_per_MMBtu()},
      {"Fd_m3_per_GJ", r.f_factors.fd_m3_per_GJ()},
      {"Fw_m3_per_GJ", r.f_factors.fw_m3_per_GJ()},
      {"Fc_m3_per_GJ", r.f_factors.fc_m3_per_GJ()},
      {"f_factor_conditions", "US EPA Method 19 definitions; 20 degC (68 degF), 101.325 kPa; HHV"},
      {"warnings", warnings_json(r.warnings)},
      {"caution", caution_one_line()},
  };
  if (answer.rates) {
    const core::CombustionRates& q = *answer.rates;
    out["feed"] = {{"given", q.feed.given},
                   {"fuel_kg_per_h", q.feed.mass_flow_kg_per_s * 3600.0},
                   {"heat_input_hhv_MW", q.feed.heat_input_hhv_W * 1e-6},
                   {"heat_input_lhv_MW", q.feed.heat_input_lhv_W * 1e-6},
                   {"oxidant_kg_per_h", q.oxidant_kg_per_s * 3600.0},
                   {"flue_gas_wet_Nm3_per_h", q.flue_wet_mol_per_s * vn * 3600.0},
                   {"flue_gas_dry_Nm3_per_h", q.flue_dry_mol_per_s * vn * 3600.0},
                   {"flue_gas_kg_per_h", q.flue_kg_per_s * 3600.0},
                   {"ash_kg_per_h", q.ash_kg_per_s * 3600.0}};
    if (q.feed.molar_flow_mol_per_s) out["feed"]["fuel_Nm3_per_h"] = *q.feed.molar_flow_mol_per_s * vn * 3600.0;
  }
  return out;
}

}  // namespace stackbound::render
