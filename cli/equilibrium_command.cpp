// `stackbound equilibrium --feed "CH4 + 2.4 O2 + 9.03 N2" (--temperature 1800K | --adiabatic) ...`:
// chemical equilibrium of a feed of database species at fixed T and P, or at the adiabatic flame
// temperature (core/equilibrium.hpp, core/adiabatic_flame.hpp).

#include <algorithm>
#include <memory>
#include <numeric>

#include <fmt/format.h>
#include <fmt/ranges.h>

#include "stackbound/cases/equilibrium_query.hpp"
#include "stackbound/cases/species_file.hpp"
#include "stackbound/cli/commands.hpp"
#include "stackbound/render/equilibrium_json.hpp"
#include "stackbound/render/finite_figures.hpp"
#include "stackbound/units/constants.hpp"

namespace stackbound::cli {

using namespace stackbound::cases;

namespace {

// Text output lists species down to this gas mole fraction unless --all is given.
constexpr double kDefaultListedFraction = 1e-12;

struct EquilibriumOptions {
  EquilibriumQuery query;
  std::string format;
  std::string output;
  bool all = false;
};

std::string thermal_no_text(const core::ThermalNoResult& no) {
  std::string text = fmt::format("\nThermal NO after a residence time of {:g} s at {:.2f} K:\n", no.residence_time_s,
                                 no.temperature_K);
  text += fmt::format("  NO mole fraction             {:.6e} ({:.4g} ppmv)\n", no.no_mole_fraction,
                      no.no_mole_fraction * 1e6);
  text += fmt::format("  equilibrium NO mole fraction {:.6e} ({:.4g} ppmv)\n", no.no_equilibrium_mole_fraction,
                      no.no_equilibrium_mole_fraction * 1e6);
  text += fmt::format("  initial rate                 {:.6e} 1/s (mole fraction per second)\n",
                      no.initial_rate_mole_fraction_per_s);
  text += fmt::format("  rate constants               {}{}\n", no.rate_constants,
                      no.rate_constants_within_stated_range ? "" : " (extrapolated outside their stated range)");
  text += fmt::format("{}\n", kThermalNoCaution);
  return text;
}

std::string feed_text(const std::vector<core::SpeciesAmount>& feed) {
  std::vector<std::string> parts;
  for (const core::SpeciesAmount& entry : feed) parts.push_back(fmt::format("{} {:g} mol", entry.formula, entry.moles));
  return fmt::format("{}", fmt::join(parts, ", "));
}

std::string text_report(const core::SpeciesDatabase& database, const EquilibriumAnswer& answer,
                        const EquilibriumOptions& options) {
  const core::EquilibriumResult& result = answer.result;
  const std::string& heat_loss = options.query.heat_loss;
  std::string text;
  text += fmt::format("Chemical equilibrium of {}\n", feed_text(answer.feed));
  if (answer.adiabatic) {
    text += fmt::format("Adiabatic flame temperature {:.2f} K (feed at {:.2f} K{})\n", result.temperature_K,
                        answer.feed_temperature_K, heat_loss.empty() ? "" : fmt::format(", heat loss {}", heat_loss));
  } else {
    text += fmt::format("Temperature {:.2f} K\n", result.temperature_K);
  }
  text += fmt::format("Pressure {:.6g} Pa ({:.6g} atm)\n", result.pressure_Pa,
                      result.pressure_Pa / units::kStandardAtmosphere_Pa);
  text += fmt::format("Newton iterations {}, element-balance residual {:.1e}, graphite {}\n", result.iterations,
                      result.element_residual, result.graphite_present ? "present" : "absent");
  text +=
      fmt::format("Gas moles {:.6g} mol, products' enthalpy {:.6g} J\n\n", result.total_gas_moles, result.enthalpy_J);

  std::vector<std::size_t> order(result.species.size());
  std::iota(order.begin(), order.end(), std::size_t{0});
  std::stable_sort(order.begin(), order.end(),
                   [&](std::size_t a, std::size_t b) { return result.moles[a] > result.moles[b]; });
  std::size_t width = 7;
  for (const std::string& name : result.species) width = std::max(width, name.size());
  text += fmt::format("{:<{}}  {:>14}  {:>14}\n", "species", width, "mole fraction", "moles [mol]");
  std::size_t omitted = 0;
  for (const std::size_t i : order) {
    const core::Species* species = database.find(result.species[i]);
    const bool condensed = species != nullptr && !species->is_gas();
    if (condensed && result.moles[i] <= 0.0 && !options.all) {
      ++omitted;
      continue;
    }
    if (!options.all && !condensed && !(result.mole_fractions[i] >= kDefaultListedFraction)) {
      ++omitted;
      continue;
    }
    if (condensed) {
      text += fmt::format("{:<{}}  {:>14}  {:>14.6e}\n", result.species[i], width, "(condensed)", result.moles[i]);
    } else {
      text += fmt::format("{:<{}}  {:>14.6e}  {:>14.6e}\n", result.species[i], width, result.mole_fractions[i],
                          result.moles[i]);
    }
  }
  if (omitted > 0) {
    text += fmt::format(
        "({} products below mole fraction {:.0e} (or absent condensed) not listed; --all lists "
        "them)\n",
        omitted, kDefaultListedFraction);
  }
  text += fmt::format("\nMole fractions are of the gas phase. {}\n", kEquilibriumBoundNote);
  return text;
}

void run(const EquilibriumOptions& options, const GlobalOptions& global) {
  const core::SpeciesDatabase database = species_database(global.species_file);
  const EquilibriumAnswer answer = solve_equilibrium_query(options.query, database);
  std::string content;
  if (options.format == "json") {
    content = render::json_text(render::equilibrium_json(answer));
  } else {
    content = text_report(database, answer, options);
    if (answer.thermal_no) content += thermal_no_text(*answer.thermal_no);
  }
  write_output(options.output, content);
}

}  // namespace

void add_equilibrium_command(CLI::App& app, const GlobalOptions& global) {
  auto options = std::make_shared<EquilibriumOptions>();
  CLI::App* command = app.add_subcommand(
      "equilibrium", "Chemical equilibrium of a species feed at fixed T and P, or at the adiabatic flame temperature");
  command->footer(
      "Examples:\n"
      "  stackbound equilibrium --feed \"CH4 + 2.4 O2 + 9.03 N2\" --temperature 1800K\n"
      "  stackbound equilibrium --feed \"CH4 + 2 O2 + 7.52 N2\" --adiabatic --format json\n"
      "  stackbound equilibrium --feed \"H2 + 0.5 O2 + 1.88 N2\" --adiabatic --feed-temperature 600K --pressure 10bar\n"
      "  stackbound equilibrium --feed \"CO2\" --temperature 3000K --species CO2,CO,O2\n"
      "  stackbound equilibrium --feed \"CH4 + 2.4 O2 + 9.03 N2\" --temperature 1900K --residence-time 20ms --format json\n"
      "The feed is written as reactants: terms joined by \"+\", each an optional coefficient in mol (a plain\n"
      "decimal number such as 2.4, .5 or 1e-3; 1 when left out) and a blank before the formula (\"2 O2\", not\n"
      "\"2O2\"); each species once. Formulas are database species (see `stackbound species`), case-sensitive\n"
      "(CO2, NO, Ar, C(gr)); notation: docs/composition-notation.md.\n"
      "Products: every species made of the feed's elements unless --species restricts them.\n"
      "Results are equilibrium bounds at the stated conditions, not measurements.\n"
      "--residence-time adds thermal NO (extended Zeldovich, equilibrium O and OH, no NO at the start) after\n"
      "that time at the solved state: the fixed --temperature, or with --adiabatic the adiabatic flame\n"
      "temperature. It is a kinetic estimate; prompt NO is not computed.");
  command
      ->add_option("--feed", options->query.feed, "Reactants in mol, terms joined by \"+\", e.g. \"CH4 + 2 O2 + 7.52 N2\"")
      ->required();
  command->add_option("--temperature", options->query.temperature,
                      "Fixed equilibrium temperature with unit, e.g. 1800K, \"1500 degC\"");
  command->add_flag("--adiabatic", options->query.adiabatic,
                    "Solve for the adiabatic flame temperature (products' enthalpy = feed's enthalpy)");
  command->add_option("--feed-temperature", options->query.feed_temperature,
                      "Temperature of the feed for --adiabatic (default 298.15 K)");
  command->add_option("--heat-loss", options->query.heat_loss,
                      "With --adiabatic: heat lost, as a fraction of the feed's higher heating value, e.g. 5%");
  command->add_option("--pressure", options->query.pressure, "Absolute pressure with unit (default 1 atm), e.g. 1atm, 5bar");
  command->add_option("--species", options->query.species,
                      "Restrict the products to this comma-separated list, e.g. CO2,CO,O2 (default: all)");
  command->add_option("--residence-time", options->query.residence_time,
                      "Also estimate thermal NO after this time at the solved T and P, e.g. 20ms (0 s ... 1 h)");
  command->add_flag("--all", options->all, "Text output: list every product, also below mole fraction 1e-12");
  add_format_option(*command, options->format, {"text", "json"});
  command->add_option("--output", options->output, "Write to this file (whole or not at all) instead of stdout");
  command->callback([options, &global] { run(*options, global); });
}

}  // namespace stackbound::cli
