#include "stackbound/render/conversion_json.hpp"

#include <optional>

#include "stackbound/emissions/basis.hpp"
#include "stackbound/units/normal_conditions.hpp"

namespace stackbound::render {

namespace {

namespace em = stackbound::emissions;

nlohmann::json normal_json(const units::NormalConditions* normal) {
  if (normal == nullptr) return nullptr;
  return {{"key", normal->key},
          {"description", normal->description},
          {"temperature_K", normal->temperature_K},
          {"pressure_Pa", normal->pressure_Pa},
          {"molar_volume_L_per_mol", normal->molar_volume_m3_per_mol() * 1e3}};
}

}  // namespace

nlohmann::json conversion_json(const cases::ConversionAnswer& answer) {
  const em::Concentration& input = answer.input;
  const em::Concentration& result = answer.conversion.result;
  const em::ConcentrationContext& context = answer.context;
  const em::Pollutant& pollutant = answer.pollutant;
  nlohmann::json factors = nlohmann::json::array();
  for (const em::AppliedFactor& f : answer.conversion.factors) {
    factors.push_back({{"name", f.name}, {"value", f.value}, {"unit", f.unit}, {"detail", f.detail}});
  }
  nlohmann::json preset_list = nlohmann::json::array();
  for (const em::ReferenceO2Preset* p : answer.presets) {
    preset_list.push_back({{"key", p->key},
                           {"reference_o2_percent", p->o2_dry_fraction * 100.0},
                           {"description", p->description},
                           {"source", p->source},
                           {"note", "preset: confirm against your permit"}});
  }
  nlohmann::json caution_list = nlohmann::json::array();
  for (const em::Caution c : answer.cautions)
    caution_list.push_back({{"key", em::caution(c).key}, {"text", em::caution(c).text}});
  const auto optional_json = [](const std::optional<double>& v) {
    return v ? nlohmann::json(*v) : nlohmann::json(nullptr);
  };
  return {{"value", result.value()},
          {"unit", result.basis().unit.symbol},
          {"basis", result.basis().text()},
          {"pollutant", pollutant.name},
          {"text", result.text(6)},
          {"normal_conditions", normal_json(result.basis().unit.normal)},
          {"input",
           {{"value", input.value()},
            {"unit", input.basis().unit.symbol},
            {"basis", input.basis().text()},
            {"normal_conditions", normal_json(input.basis().unit.normal)}}},
          {"context",
           {{"o2_basis_percent", em::o2_basis_percent(context.o2_basis)},
            {"moisture_fraction", optional_json(context.moisture_fraction)},
            {"o2_dry_fraction", optional_json(context.o2_dry_fraction)},
            {"co2_dry_fraction", optional_json(context.co2_dry_fraction)}}},
          {"factors", factors},
          {"presets", preset_list},
          {"cautions", caution_list}};
}

}  // namespace stackbound::render
