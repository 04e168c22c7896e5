// `stackbound convert VALUE POLLUTANT --from BASIS --to BASIS`: one concentration on another basis,
// with every factor applied named (docs/bases.md describes the basis text).

#include <memory>
#include <optional>
#include <string>
#include <vector>

#include <fmt/format.h>

#include "stackbound/cases/conversion_query.hpp"
#include "stackbound/cli/commands.hpp"
#include "stackbound/emissions/basis.hpp"
#include "stackbound/render/conversion_json.hpp"
#include "stackbound/render/finite_figures.hpp"
#include "stackbound/units/normal_conditions.hpp"

namespace stackbound::cli {

namespace {

namespace em = stackbound::emissions;
using cases::ConversionAnswer;
using cases::convert_query;

struct ConvertOptions {
  cases::ConversionQuery query;
  std::string format;
  std::string output;
};

std::string factor_value_text(const em::AppliedFactor& factor) {
  if (factor.unit == "1") return fmt::format("{:.6g} (ratio)", factor.value);
  return fmt::format("{:.6g} {}", factor.value, factor.unit);
}

std::string context_text(const em::ConcentrationContext& context) {
  const auto fraction = [](const std::optional<double>& value) {
    return value ? fmt::format("{} %", em::percent_text(*value)) : std::string("not given");
  };
  return fmt::format("O2 basis {}; moisture {}; measured O2 (dry) {}; measured CO2 (dry) {}",
                     em::o2_basis_description(context.o2_basis), fraction(context.moisture_fraction),
                     fraction(context.o2_dry_fraction), fraction(context.co2_dry_fraction));
}

void run(const ConvertOptions& options) {
  const ConversionAnswer answer = convert_query(options.query);
  if (options.format == "json") {
    write_output(options.output, render::json_text(render::conversion_json(answer)));
    return;
  }
  const em::Concentration& input = answer.input;
  const em::Concentration& result = answer.conversion.result;
  std::string text = fmt::format("{}\n  = {}\n", input.text(10), result.text(6));
  if (result.basis().unit.is_mass()) {
    text += fmt::format("  normal conditions: {} (molar volume {:.6g} L/mol)\n", result.basis().unit.normal->description,
                        result.basis().unit.normal->molar_volume_m3_per_mol() * 1e3);
  }
  text += "\nFactors applied:\n";
  if (answer.conversion.factors.empty()) text += "  none (the two bases differ only in the unit's scale)\n";
  for (const em::AppliedFactor& f : answer.conversion.factors) {
    text += fmt::format("  {:<26} {:<20} {}\n", f.name, factor_value_text(f), f.detail);
  }
  text += fmt::format("\nContext: {}\n", context_text(answer.context));
  for (const em::ReferenceO2Preset* p : answer.presets) {
    text += fmt::format("Preset: O2={} % is preset {} ({}, {}); confirm it against your permit.\n",
                        em::percent_text(p->o2_dry_fraction), p->key, p->description, p->source);
  }
  text += "\nCautions:\n";
  for (const em::Caution c : answer.cautions) text += fmt::format("  * {}\n", em::caution(c).text);
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
  command->add_option("VALUE", options->query.value, "The number with its unit, e.g. \"35 ppm\" (the unit may instead be in --from)")
      ->required();
  command->add_option("POLLUTANT", options->query.pollutant, "Pollutant: CO, NO, NO2, NOx (as NO2), SO2, ... or any name with --molar-mass")
      ->required();
  command->add_option("--from", options->query.from, "Basis of VALUE, e.g. \"dry, O2=7.2%\"");
  command->add_option("--to", options->query.to, "Basis of the result, e.g. \"mg/Nm3, dry, O2=3%\"")->required();
  command->add_option("--moisture", options->query.moisture, "Stack moisture, H2O fraction of the wet gas, e.g. 12% (for wet <-> dry)");
  command->add_option("--o2", options->query.o2, "Measured O2 on the dry basis, e.g. 7.2% (for 'as measured' <-> O2 level)");
  command->add_option("--co2", options->query.co2, "Measured CO2 on the dry basis, e.g. 9.5% (for 'as measured' <-> CO2 level)");
  command->add_option("--normal", options->query.normal,
                      "Normal conditions of Nm3 and m3 units: 0C (default for Nm3), 15C, 20C, 60F, IED (273.15 K, 101.3 kPa)");
  command->add_option("--o2-basis", options->query.o2_basis, "O2 content of air in the O2 correction: 20.9 (US EPA practice, default) or 21 (EU practice)")
      ->default_str("20.9");
  command->add_option("--molar-mass", options->query.molar_mass, "Molar mass of a pollutant not built in, e.g. \"200.59 g/mol\"");
  command->add_option("--output", options->output, "Write to FILE (whole or not at all) instead of stdout");
  add_format_option(*command, options->format, {"text", "json"});
  command->callback([options] { run(*options); });
}

}  // namespace stackbound::cli
