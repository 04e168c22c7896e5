// `stackbound equilibrium --feed "CH4 + 2.4 O2 + 9.03 N2" (--temperature 1800K | --adiabatic) ...`:
// chemical equilibrium of a feed of database species at fixed T and P, or at the adiabatic flame
// temperature (core/equilibrium.hpp, core/adiabatic_flame.hpp).

#include <fmt/format.h>

#include <algorithm>
#include <memory>
#include <nlohmann/json.hpp>
#include <cmath>
#include <numeric>
#include <optional>

#include "stackbound/render/finite_figures.hpp"
#include "stackbound/cli/commands.hpp"
#include "stackbound/cases/species_file.hpp"
#include "stackbound/core/adiabatic_flame.hpp"
#include "stackbound/core/composition_notation.hpp"
#include "stackbound/core/element_amounts.hpp"
#include "stackbound/core/equilibrium.hpp"
#include "stackbound/core/post_flame.hpp"
#include "stackbound/core/thermal_no.hpp"
#include "stackbound/units/constants.hpp"
#include "stackbound/units/input_error.hpp"
#include "stackbound/units/quantity_parser.hpp"

namespace stackbound::cli {

using namespace stackbound::cases;

namespace {

constexpr std::string_view kBoundNote =
    "Chemical-equilibrium values at the stated T and P: an equilibrium bound, not a measurement.";
constexpr std::string_view kThermalNoCaution =
    "Thermal NO is a kinetic estimate with equilibrium O and OH (extended Zeldovich); prompt NO is not computed.";
// Longest --residence-time accepted: far beyond any furnace, so a larger value is taken as a mistake
// in the unit. Our choice, no source.
constexpr double kMaximumResidenceTime_s = 3600.0;
// Text output lists species down to this gas mole fraction unless --all is given.
constexpr double kDefaultListedFraction = 1e-12;

struct EquilibriumOptions {
  std::string feed;
  std::string temperature;
  bool adiabatic = false;
  std::string feed_temperature;
  std::string heat_loss;
  std::string pressure;
  std::string species;
  std::string format;
  std::string output;
  std::string residence_time;
  bool all = false;
};

// --residence-time parsed and checked at the edge: a finite time, 0 s ... 1 h.
std::optional<units::Time> residence_time_option(const std::string& text) {
  if (text.empty()) return std::nullopt;
  const units::Time time = units::parse_time(text, "--residence-time");
  const double seconds = time.value();
  if (!(std::isfinite(seconds) && seconds >= 0.0 && seconds <= kMaximumResidenceTime_s)) {
    throw units::InputError(fmt::format("--residence-time = \"{}\" ({:g} s): must be a finite time from 0 s to {:g} s (1 h)",
                                        text, seconds, kMaximumResidenceTime_s));
  }
  return time;
}

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

nlohmann::json thermal_no_json(const core::ThermalNoResult& no) {
  return {{"residence_time_s", no.residence_time_s},
          {"no_mole_fraction", no.no_mole_fraction},
          {"no_equilibrium_mole_fraction", no.no_equilibrium_mole_fraction},
          {"initial_rate_mole_fraction_per_s", no.initial_rate_mole_fraction_per_s},
          {"rate_constants", no.rate_constants},
          {"temperature_K", no.temperature_K},
          {"pressure_Pa", no.pressure_Pa},
          {"rate_constants_within_stated_range", no.rate_constants_within_stated_range},
          {"note", kThermalNoCaution}};
}

// Solver messages name their fields plainly ("species = ..."); on the command line they are options.
[[noreturn]] void rethrow_as_option(const units::InputError& error) {
  const std::string message = error.what();
  for (const char* field : {"species", "temperature", "pressure"}) {
    if (message.rfind(field, 0) == 0) throw units::InputError("--" + message);
  }
  throw error;
}

std::string feed_text(const std::vector<core::SpeciesAmount>& feed) {
  std::vector<std::string> parts;
  for (const core::SpeciesAmount& entry : feed) parts.push_back(fmt::format("{} {:g} mol", entry.formula, entry.moles));
  return fmt::format("{}", fmt::join(parts, ", "));
}

std::string text_report(const core::SpeciesDatabase& database, const core::EquilibriumResult& result,
                        const std::vector<core::SpeciesAmount>& feed, const EquilibriumOptions& options,
                        double feed_temperature_K) {
  std::string text;
  text += fmt::format("Chemical equilibrium of {}\n", feed_text(feed));
  if (options.adiabatic) {
    text += fmt::format("Adiabatic flame temperature {:.2f} K (feed at {:.2f} K{})\n", result.temperature_K,
                        feed_temperature_K,
                        options.heat_loss.empty() ? "" : fmt::format(", heat loss {}", options.heat_loss));
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
  text += fmt::format("\nMole fractions are of the gas phase. {}\n", kBoundNote);
  return text;
}

nlohmann::json json_report(const core::EquilibriumResult& result, const std::vector<core::SpeciesAmount>& feed,
                           const EquilibriumOptions& options, double feed_temperature_K) {
  nlohmann::json fractions = nlohmann::json::object();
  nlohmann::json moles = nlohmann::json::object();
  for (std::size_t i = 0; i < result.species.size(); ++i) {
    fractions[result.species[i]] = result.mole_fractions[i];
    moles[result.species[i]] = result.moles[i];
  }
  nlohmann::json feed_json = nlohmann::json::object();
  for (const core::SpeciesAmount& entry : feed) {
    feed_json[entry.formula] = feed_json.value(entry.formula, 0.0) + entry.moles;
  }
  nlohmann::json out = {{"mode", options.adiabatic ? "adiabatic" : "fixed_temperature"},
                        {"temperature_K", result.temperature_K},
                        {"pressure_Pa", result.pressure_Pa},
                        {"feed_moles", feed_json},
                        {"total_moles", result.total_gas_moles},
                        {"total_moles_basis", "gas phase"},
                        {"mole_fractions", fractions},
                        {"mole_fraction_basis", "gas phase (condensed species 0)"},
                        {"moles", moles},
                        {"iterations", result.iterations},
                        {"element_residual", result.element_residual},
                        {"graphite_present", result.graphite_present},
                        {"enthalpy_J", result.enthalpy_J},
                        {"note", kBoundNote}};
  if (options.adiabatic) {
    out["feed_temperature_K"] = feed_temperature_K;
    out["temperature_iterations"] = result.temperature_iterations;
  }
  return out;
}

void run(const EquilibriumOptions& options, const GlobalOptions& global) {
  const core::SpeciesDatabase database = species_database(global.species_file);
  const std::vector<core::SpeciesAmount> feed = core::parse_reactants(options.feed, "--feed", database);
  const core::ElementAmounts b = core::element_amounts(database, feed, "--feed");
  const double pressure_Pa = options.pressure.empty() ? units::kStandardAtmosphere_Pa
                                                      : checked_pressure(options.pressure, "--pressure", cases::kFiringPressure).value();
  if (options.adiabatic && !options.temperature.empty()) {
    throw units::InputError(fmt::format(
        "--temperature = \"{}\": give either --temperature (fixed T) or --adiabatic, not both", options.temperature));
  }
  if (!options.adiabatic && options.temperature.empty()) {
    throw units::InputError("--temperature: missing; give --temperature (e.g. 1800K) or --adiabatic");
  }
  if (!options.adiabatic && !options.feed_temperature.empty()) {
    throw units::InputError(
        fmt::format("--feed-temperature = \"{}\": applies only with --adiabatic", options.feed_temperature));
  }
  if (!options.adiabatic && !options.heat_loss.empty()) {
    throw units::InputError(fmt::format("--heat-loss = \"{}\": applies only with --adiabatic", options.heat_loss));
  }
  const std::optional<units::Time> residence_time = residence_time_option(options.residence_time);
  std::vector<std::string> candidates;
  if (!options.species.empty()) {
    candidates = split_list(options.species, "--species");
    for (const std::string& name : candidates) (void)database.at(name, "--species");
  }

  double feed_temperature_K = units::kReferenceTemperature_K;
  core::EquilibriumResult result;
  try {
    const core::EquilibriumSolver solver(database, b, candidates);
    if (options.adiabatic) {
      if (!options.feed_temperature.empty()) {
        feed_temperature_K = units::parse_temperature(options.feed_temperature, "--feed-temperature").value();
      }
      const double loss = options.heat_loss.empty() ? 0.0 : units::parse_fraction(options.heat_loss, "--heat-loss");
      if (loss < 0.0 || loss >= 1.0) {
        throw units::InputError(
            fmt::format("--heat-loss = \"{}\": must be at least 0 % and below 100 %", options.heat_loss));
      }
      const units::Energy enthalpy =
          core::feed_enthalpy(database, feed, units::kelvin(feed_temperature_K), "--feed-temperature");
      const units::Energy heating_value =
          loss > 0.0 ? core::feed_heating_value(database, feed, core::HeatingValueKind::higher, "--feed")
                     : units::joules(0.0);
      result = solver.solve_hp(b, core::hp_target_enthalpy(enthalpy, loss, heating_value), units::pascals(pressure_Pa));
    } else {
      const double temperature_K = units::parse_temperature(options.temperature, "--temperature").value();
      result = solver.solve_tp(b, units::kelvin(temperature_K), units::pascals(pressure_Pa));
    }
  } catch (const units::InputError& error) {
    rethrow_as_option(error);
  }
  // Thermal NO at the solved state: the fixed T, or with --adiabatic the adiabatic flame temperature.
  std::optional<core::ThermalNoResult> no;
  if (residence_time) {
    try {
      no = core::thermal_no(core::post_flame_gas(result), *residence_time, {.field = "--residence-time"});
    } catch (const units::InputError& error) {
      throw units::InputError(fmt::format("--residence-time = \"{}\": {}", options.residence_time, error.what()));
    }
  }
  std::string content;
  if (options.format == "json") {
    nlohmann::json json = json_report(result, feed, options, feed_temperature_K);
    if (no) json["thermal_no"] = thermal_no_json(*no);
    content = render::json_text(json);
  } else {
    content = text_report(database, result, feed, options, feed_temperature_K);
    if (no) content += thermal_no_text(*no);
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
      ->add_option("--feed", options->feed, "Reactants in mol, terms joined by \"+\", e.g. \"CH4 + 2 O2 + 7.52 N2\"")
      ->required();
  command->add_option("--temperature", options->temperature,
                      "Fixed equilibrium temperature with unit, e.g. 1800K, \"1500 degC\"");
  command->add_flag("--adiabatic", options->adiabatic,
                    "Solve for the adiabatic flame temperature (products' enthalpy = feed's enthalpy)");
  command->add_option("--feed-temperature", options->feed_temperature,
                      "Temperature of the feed for --adiabatic (default 298.15 K)");
  command->add_option("--heat-loss", options->heat_loss,
                      "With --adiabatic: heat lost, as a fraction of the feed's higher heating value, e.g. 5%");
  command->add_option("--pressure", options->pressure, "Absolute pressure with unit (default 1 atm), e.g. 1atm, 5bar");
  command->add_option("--species", options->species,
                      "Restrict the products to this comma-separated list, e.g. CO2,CO,O2 (default: all)");
  command->add_option("--residence-time", options->residence_time,
                      "Also estimate thermal NO after this time at the solved T and P, e.g. 20ms (0 s ... 1 h)");
  command->add_flag("--all", options->all, "Text output: list every product, also below mole fraction 1e-12");
  add_format_option(*command, options->format, {"text", "json"});
  command->add_option("--output", options->output, "Write to this file (whole or not at all) instead of stdout");
  command->callback([options, &global] { run(*options, global); });
}

}  // namespace stackbound::cli
