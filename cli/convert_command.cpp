// `stackbound convert VALUE POLLUTANT --from BASIS --to BASIS`: one concentration on another basis,
// with every factor applied named (docs/bases.md describes the basis text).

#include <charconv>
#include <cmath>
#include <memory>
#include <optional>
#include <string>
#include <vector>

#include <fmt/format.h>

#include <nlohmann/json.hpp>

#include "stackbound/render/finite_figures.hpp"
#include "stackbound/cli/commands.hpp"
#include "stackbound/emissions/basis.hpp"
#include "stackbound/emissions/cautions.hpp"
#include "stackbound/emissions/concentration.hpp"
#include "stackbound/emissions/pollutant.hpp"
#include "stackbound/emissions/reference_correction.hpp"
#include "stackbound/units/input_error.hpp"
#include "stackbound/units/normal_conditions.hpp"
#include "stackbound/units/quantity_parser.hpp"

namespace stackbound::cli {


namespace {

namespace em = stackbound::emissions;

struct ConvertOptions {
  std::string value;        // "35 ppm", "35", "120 mg/Nm3"
  std::string pollutant;    // "CO", "NOx", or another name with --molar-mass
  std::string from;         // basis text of the value (may be empty when the value carries it)
  std::string to;           // basis text of the result; missing items are taken from --from
  std::string moisture;     // stack moisture, H2O fraction of the wet gas: "12%"
  std::string o2;           // measured O2, dry: "7.2%"
  std::string co2;          // measured CO2, dry: "9.5%"
  std::string normal;       // default normal conditions of Nm3 / m3 units: 0C, 15C, 20C, 60F, IED
  std::string o2_basis;     // 20.9 or 21
  std::string molar_mass;   // for a pollutant outside the built-in list: "200.59 g/mol"
  std::string format;
  std::string output;
};

std::optional<double> optional_fraction(const std::string& text, std::string_view option) {
  if (text.empty()) return std::nullopt;
  return units::parse_fraction(text, option);
}

std::string context_hint(em::ContextPiece piece) {
  switch (piece) {
    case em::ContextPiece::moisture: return "give it with --moisture (H2O fraction of the wet gas, e.g. --moisture 12%)";
    case em::ContextPiece::measured_o2: return "give it with --o2 (dry, e.g. --o2 7.2%) or state the O2 level in --from";
    case em::ContextPiece::measured_co2: return "give it with --co2 (dry, e.g. --co2 9.5%) or state the CO2 level in --from";
    case em::ContextPiece::molar_mass: return "give it with --molar-mass (e.g. --molar-mass \"200.59 g/mol\")";
  }
  return "";
}

em::Pollutant pollutant_from(const ConvertOptions& options) {
  std::optional<double> molar_mass;
  if (!options.molar_mass.empty()) {
    const units::ParsedQuantity parsed =
        units::parse_quantity(options.molar_mass, "--molar-mass", {units::Dimension::mass_per_amount});
    const std::string_view symbol = parsed.unit->symbol;
    if (symbol != "g/mol" && symbol != "kg/kmol" && symbol != "kg/mol") {
      throw units::InputError(fmt::format("--molar-mass = \"{}\": a molar mass is needed; accepted units: g/mol, kg/kmol, "
                                          "kg/mol",
                                          options.molar_mass));
    }
    molar_mass = parsed.value_si;
  }
  return em::resolve_pollutant(options.pollutant, molar_mass, "POLLUTANT");
}

std::string factor_value_text(const em::AppliedFactor& factor) {
  if (factor.unit == "1") return fmt::format("{:.6g} (ratio)", factor.value);
  return fmt::format("{:.6g} {}", factor.value, factor.unit);
}

std::vector<em::Caution> cautions_for(const em::Basis& from, const em::Basis& to, const std::vector<em::AppliedFactor>& factors) {
  std::vector<em::Caution> cautions;
  if (from.reference.preset() != nullptr || to.reference.preset() != nullptr) cautions.push_back(em::Caution::confirm_presets);
  for (const em::AppliedFactor& factor : factors) {
    if (factor.name == "O2 correction factor") {
      cautions.push_back(em::Caution::o2_correction_validity);
      break;
    }
  }
  cautions.push_back(em::Caution::ideal_gas);
  cautions.push_back(em::Caution::authorities_govern);
  return cautions;
}

std::vector<const em::ReferenceO2Preset*> presets_of(const em::Basis& from, const em::Basis& to) {
  std::vector<const em::ReferenceO2Preset*> presets;
  if (from.reference.preset() != nullptr) presets.push_back(from.reference.preset());
  if (to.reference.preset() != nullptr && to.reference.preset() != from.reference.preset()) {
    presets.push_back(to.reference.preset());
  }
  return presets;
}

std::string context_text(const em::ConcentrationContext& context) {
  const auto fraction = [](const std::optional<double>& value) {
    return value ? fmt::format("{} %", em::percent_text(*value)) : std::string("not given");
  };
  return fmt::format("O2 basis {}; moisture {}; measured O2 (dry) {}; measured CO2 (dry) {}",
                     em::o2_basis_description(context.o2_basis), fraction(context.moisture_fraction),
                     fraction(context.o2_dry_fraction), fraction(context.co2_dry_fraction));
}

nlohmann::json normal_json(const units::NormalConditions* normal) {
  if (normal == nullptr) return nullptr;
  return {{"key", normal->key},
          {"description", normal->description},
          {"temperature_K", normal->temperature_K},
          {"pressure_Pa", normal->pressure_Pa},
          {"molar_volume_L_per_mol", normal->molar_volume_m3_per_mol() * 1e3}};
}

void run(const ConvertOptions& options) {
  const auto [number, value_basis_text] = em::split_stated_value(options.value, "VALUE");
  const em::Pollutant pollutant = pollutant_from(options);
  const units::NormalConditions* default_normal =
      options.normal.empty() ? nullptr : &units::normal_conditions_by_key(options.normal, "--normal");

  const em::PartialBasis from_partial =
      em::merge_partial_bases(em::parse_partial_basis(value_basis_text, "VALUE"), "VALUE",
                              em::parse_partial_basis(options.from, "--from"), "--from");
  const em::Basis from = em::complete_basis(from_partial, "--from", default_normal);
  const em::Basis to = em::complete_basis_from(em::parse_partial_basis(options.to, "--to"), from, "--to", default_normal);
  const em::Concentration input(number, pollutant, from, "VALUE");

  em::ConcentrationContext context;
  context.moisture_fraction = optional_fraction(options.moisture, "--moisture");
  context.o2_dry_fraction = optional_fraction(options.o2, "--o2");
  context.co2_dry_fraction = optional_fraction(options.co2, "--co2");
  context.o2_basis = options.o2_basis.empty() ? em::O2Basis::us_epa_20_9 : em::parse_o2_basis(options.o2_basis, "--o2-basis");
  if (context.o2_dry_fraction) em::check_o2_level(*context.o2_dry_fraction, context.o2_basis, "--o2 (measured O2, dry)");
  if (context.co2_dry_fraction) em::check_co2_level(*context.co2_dry_fraction, "--co2 (measured CO2, dry)");
  if (context.moisture_fraction && (*context.moisture_fraction < 0.0 || *context.moisture_fraction >= 1.0)) {
    throw units::InputError(fmt::format("--moisture = \"{}\": the H2O fraction of the wet gas must be >= 0 % and below 100 %",
                                        options.moisture));
  }

  em::Conversion conversion = [&] {
    try {
      return input.convert(to, context);
    } catch (const em::MissingContextError& missing) {
      throw units::InputError(fmt::format("{}; {}", missing.what(), context_hint(missing.piece())));
    }
  }();
  const em::Concentration& result = conversion.result;
  const std::vector<em::Caution> cautions = cautions_for(input.basis(), result.basis(), conversion.factors);
  const std::vector<const em::ReferenceO2Preset*> presets = presets_of(input.basis(), result.basis());

  if (options.format == "json") {
    nlohmann::json factors = nlohmann::json::array();
    for (const em::AppliedFactor& f : conversion.factors) {
      factors.push_back({{"name", f.name}, {"value", f.value}, {"unit", f.unit}, {"detail", f.detail}});
    }
    nlohmann::json preset_list = nlohmann::json::array();
    for (const em::ReferenceO2Preset* p : presets) {
      preset_list.push_back({{"key", p->key},
                             {"reference_o2_percent", p->o2_dry_fraction * 100.0},
                             {"description", p->description},
                             {"source", p->source},
                             {"note", "preset: confirm against your permit"}});
    }
    nlohmann::json caution_list = nlohmann::json::array();
    for (const em::Caution c : cautions) caution_list.push_back({{"key", em::caution(c).key}, {"text", em::caution(c).text}});
    const auto optional_json = [](const std::optional<double>& v) { return v ? nlohmann::json(*v) : nlohmann::json(nullptr); };
    const nlohmann::json out = {
        {"value", result.value()},
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
    write_output(options.output, render::json_text(out));
    return;
  }

  std::string text = fmt::format("{}\n  = {}\n", input.text(10), result.text(6));
  if (result.basis().unit.is_mass()) {
    text += fmt::format("  normal conditions: {} (molar volume {:.6g} L/mol)\n", result.basis().unit.normal->description,
                        result.basis().unit.normal->molar_volume_m3_per_mol() * 1e3);
  }
  text += "\nFactors applied:\n";
  if (conversion.factors.empty()) text += "  none (the two bases differ only in the unit's scale)\n";
  for (const em::AppliedFactor& f : conversion.factors) {
    text += fmt::format("  {:<26} {:<20} {}\n", f.name, factor_value_text(f), f.detail);
  }
  text += fmt::format("\nContext: {}\n", context_text(context));
  for (const em::ReferenceO2Preset* p : presets) {
    text += fmt::format("Preset: O2={} % is preset {} ({}, {}); confirm it against your permit.\n",
                        em::percent_text(p->o2_dry_fraction), p->key, p->description, p->source);
  }
  text += "\nCautions:\n";
  for (const em::Caution c : cautions) text += fmt::format("  * {}\n", em::caution(c).text);
  write_output(options.output, text);
}

}  // namespace

void add_convert_command(CLI::App& app, const GlobalOptions& /*global*/) {
  auto options = std::make_shared<ConvertOptions>();
  CLI::App* command = app.add_subcommand("convert", "Convert a concentration between bases (ppmv, mg/Nm3, wet/dry, O2/CO2 level)");
  command->footer(
      "Examples:\n"
      "  stackbound convert \"35 ppm\" CO --from \"dry, O2=7.2%\" --to \"mg/Nm3, dry, O2=3%\"\n"
      "  stackbound convert \"25 ppmvd\" NOx --from \"O2=15%\" --to \"mg/Nm3\" --normal IED --o2-basis 21\n"
      "  stackbound convert \"120 mg/Nm3\" SO2 --from \"wet\" --to \"ppmv, dry, O2=6%\" --moisture 11% --o2 8.1%\n"
      "  stackbound convert \"0.02 gr/dscf\" PM --to \"mg/Nm3\"\n"
      "  stackbound convert \"40 ppmvd\" NOx --from \"O2=ied-gas-turbine\" --to \"mg/Nm3\" --format json\n"
      "Basis text: comma-separated items - a unit (ppmv, ppmvd, ppbv, %, mg/Nm3, ug/Nm3, mg/m3, mg/Sm3, mg/dscm,\n"
      "gr/dscf, lb/dscf ...), wet or dry, as measured, O2=<x>% or O2=<preset>, CO2=<x>%, as NO2, normal=<key>.\n"
      "Items missing from --to are taken from --from. See docs/bases.md.\n"
      "A value at \"O2=7.2%\" is the concentration at that dry O2 level (for a measurement: the measured O2).\n");
  command->add_option("VALUE", options->value, "The number with its unit, e.g. \"35 ppm\" (the unit may instead be in --from)")
      ->required();
  command->add_option("POLLUTANT", options->pollutant, "Pollutant: CO, NO, NO2, NOx (as NO2), SO2, ... or any name with --molar-mass")
      ->required();
  command->add_option("--from", options->from, "Basis of VALUE, e.g. \"dry, O2=7.2%\"");
  command->add_option("--to", options->to, "Basis of the result, e.g. \"mg/Nm3, dry, O2=3%\"")->required();
  command->add_option("--moisture", options->moisture, "Stack moisture, H2O fraction of the wet gas, e.g. 12% (for wet <-> dry)");
  command->add_option("--o2", options->o2, "Measured O2 on the dry basis, e.g. 7.2% (for 'as measured' <-> O2 level)");
  command->add_option("--co2", options->co2, "Measured CO2 on the dry basis, e.g. 9.5% (for 'as measured' <-> CO2 level)");
  command->add_option("--normal", options->normal,
                      "Normal conditions of Nm3 and m3 units: 0C (default for Nm3), 15C, 20C, 60F, IED (273.15 K, 101.3 kPa)");
  command->add_option("--o2-basis", options->o2_basis, "O2 content of air in the O2 correction: 20.9 (US EPA practice, default) or 21 (EU practice)")
      ->default_str("20.9");
  command->add_option("--molar-mass", options->molar_mass, "Molar mass of a pollutant not built in, e.g. \"200.59 g/mol\"");
  command->add_option("--output", options->output, "Write to FILE (whole or not at all) instead of stdout");
  add_format_option(*command, options->format, {"text", "json"});
  command->callback([options] { run(*options); });
}

}  // namespace stackbound::cli
