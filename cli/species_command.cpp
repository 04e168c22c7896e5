// `stackbound species [NAME --temperature T] [--format text|json]`: the species data.

#include <fmt/format.h>

#include <nlohmann/json.hpp>

#include "stackbound/render/finite_figures.hpp"
#include "stackbound/cli/commands.hpp"
#include "stackbound/cases/species_file.hpp"
#include "stackbound/units/constants.hpp"
#include "stackbound/units/input_error.hpp"
#include "stackbound/units/quantity_parser.hpp"

namespace stackbound::cli {

using namespace stackbound::cases;

namespace {

struct SpeciesOptions {
  std::string name;
  std::string temperature;
  std::string format;
  std::string output;
};

std::string species_table(const core::SpeciesDatabase& database) {
  std::string text = fmt::format("{:<10} {:>12} {:>9} {:>9}  {:<9} {}\n", "formula", "M [g/mol]", "T_low [K]",
                                 "T_high [K]", "phase", "source");
  for (const core::Species& s : database.all()) {
    text += fmt::format("{:<10} {:>12.5f} {:>9.2f} {:>9.2f}  {:<9} {}\n", s.formula(), s.molar_mass_kg_per_mol() * 1e3,
                        s.range().low.value(), s.range().high.value(), s.is_gas() ? "gas" : "condensed", s.source());
  }
  text += fmt::format("{} species. Standard-state pressure 1 bar; NASA 7-coefficient polynomials.\n", database.size());
  return text;
}

nlohmann::json species_list_json(const core::SpeciesDatabase& database) {
  nlohmann::json list = nlohmann::json::array();
  for (const core::Species& s : database.all()) {
    nlohmann::json composition = nlohmann::json::object();
    for (const core::ElementCount& c : s.composition()) composition[c.element] = c.count;
    list.push_back({{"name", s.formula()},
                    {"molar_mass_g_per_mol", s.molar_mass_kg_per_mol() * 1e3},
                    {"phase", s.is_gas() ? "gas" : "condensed"},
                    {"temperature_range_K", {s.range().low.value(), s.range().mid.value(), s.range().high.value()}},
                    {"composition", composition},
                    {"source", s.source()}});
  }
  return list;
}

void run(const SpeciesOptions& options, const GlobalOptions& global) {
  const core::SpeciesDatabase database = species_database(global.species_file);
  if (options.name.empty()) {
    if (!options.temperature.empty()) {
      throw units::InputError("--temperature needs a species NAME, e.g. stackbound species CO2 --temperature 1500K");
    }
    write_output(options.output,
                 options.format == "json" ? render::json_text(species_list_json(database)) : species_table(database));
    return;
  }
  const core::Species& species = database.at(options.name, "NAME");
  const units::Temperature temperature = options.temperature.empty()
                                             ? units::kelvin(units::kReferenceTemperature_K)
                                             : units::parse_temperature(options.temperature, "--temperature");
  species.check_temperature(temperature);
  const double T = temperature.value();
  const double R = units::kGasConstant_J_per_mol_K;
  const double cp = R * species.cp_over_R(temperature);
  const double h = R * T * species.h_over_RT(temperature);
  const double s = R * species.s_over_R(temperature);
  const double g = R * T * species.g_over_RT(temperature);
  if (options.format == "json") {
    const nlohmann::json out = {{"name", species.formula()},       {"temperature_K", T},
                                {"cp_J_per_mol_K", cp},            {"h_J_per_mol", h},
                                {"s_J_per_mol_K", s},              {"g_J_per_mol", g},
                                {"pressure_Pa", units::kStandardStatePressure_Pa},
                                {"molar_mass_g_per_mol", species.molar_mass_kg_per_mol() * 1e3},
                                {"source", species.source()}};
    write_output(options.output, render::json_text(out));
    return;
  }
  write_output(options.output, fmt::format("{} at {:.2f} K, standard state (1 bar), source {}\n"
                               "  cp = {:>14.4f} J/(mol K)\n"
                               "  h  = {:>14.2f} J/mol   (includes the enthalpy of formation at 298.15 K)\n"
                               "  s  = {:>14.4f} J/(mol K)\n"
                               "  g  = {:>14.2f} J/mol   (g = h - T s)\n",
                               species.formula(), T, species.source(), cp, h, s, g));
}

}  // namespace

void add_species_command(CLI::App& app, const GlobalOptions& global) {
  auto options = std::make_shared<SpeciesOptions>();
  CLI::App* command = app.add_subcommand("species", "List the species data, or one species' cp, h, s, g at T");
  command->footer(
      "Examples:\n"
      "  stackbound species\n"
      "  stackbound species NO --temperature 2000K\n"
      "  stackbound species H2O --temperature \"1500 degC\" --format json\n"
      "Names are chemical formulas, case-sensitive (CO2, NO, Ar, C(gr)).");
  command->add_option("NAME", options->name, "Species formula, e.g. CO2");
  command->add_option("--temperature", options->temperature, "Temperature with unit, e.g. 1500K, \"1200 degC\" (default 298.15 K)");
  add_format_option(*command, options->format, {"text", "json"});
  command->add_option("--output", options->output, "Write to FILE (whole or not at all) instead of stdout");
  command->callback([options, &global] { run(*options, global); });
}

}  // namespace stackbound::cli
