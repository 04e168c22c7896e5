// `stackbound fuel (FILE.yaml | --gas TEXT | --preset NAME | --ultimate TEXT ...)`: a fuel's heating
// values, stoichiometric air, complete-combustion flue gas (wet and dry), flows, water dew point,
// F-factors and, with --rate, the flows for a feed. Method notes: docs/fuels.md.

#include <memory>
#include <optional>
#include <stdexcept>
#include <string>
#include <vector>

#include <fmt/format.h>
#include <fmt/ranges.h>

#include <nlohmann/json.hpp>

#include "stackbound/cases/fuel_file.hpp"
#include "stackbound/cases/fuel_query.hpp"
#include "stackbound/cases/species_file.hpp"
#include "stackbound/cli/commands.hpp"
#include "stackbound/render/finite_figures.hpp"
#include "stackbound/render/fuel_json.hpp"
#include "stackbound/core/combustion.hpp"
#include "stackbound/core/composition_notation.hpp"
#include "stackbound/core/elements.hpp"
#include "stackbound/core/fuel_presets.hpp"
#include "stackbound/units/constants.hpp"
#include "stackbound/units/input_error.hpp"
#include "stackbound/units/normal_conditions.hpp"
#include "stackbound/units/quantity_parser.hpp"

namespace stackbound::cli {

using namespace stackbound::cases;

namespace {

using units::Dimension;

struct FuelOptions {
  std::string file;
  std::string gas;
  std::string gas_basis = "mole";
  std::string preset;
  std::string ultimate;
  std::string analysis_basis = "as_received";
  std::string state = "solid";
  std::string hhv;
  std::string lhv;
  std::string estimate;
  FuelConditions conditions;  // oxidant, operating point, feed
  bool list_presets = false;
  std::string format;
  std::string output;
};

// ---------------------------------------------------------------------------------------------------
// Building the inputs

core::UltimateAnalysis ultimate_from_text(const FuelOptions& o) {
  core::UltimateAnalysis a;
  for (const auto& [key, value] :
       core::parse_analysis(o.ultimate, "--ultimate", core::ultimate_analysis_vocabulary())) {
    if (key == "C") {
      a.carbon_percent = value;
    } else if (key == "H") {
      a.hydrogen_percent = value;
    } else if (key == "O") {
      a.oxygen_percent = value;
    } else if (key == "N") {
      a.nitrogen_percent = value;
    } else if (key == "S") {
      a.sulfur_percent = value;
    } else if (key == "ash") {
      a.ash_percent = value;
    } else if (key == "moisture") {
      a.moisture_percent = value;
    } else {
      // parse_analysis accepts only the names of ultimate_analysis_vocabulary(), all handled above.
      throw std::logic_error(fmt::format("ultimate_from_text: component \"{}\" is not handled", key));
    }
  }
  a.basis = o.analysis_basis == "dry"            ? core::AnalysisBasis::dry
            : o.analysis_basis == "dry_ash_free" ? core::AnalysisBasis::dry_ash_free
                                                 : core::AnalysisBasis::as_received;
  return a;
}

FuelFile build_fuel(const FuelOptions& o, const core::SpeciesDatabase& db) {
  const int sources = !o.file.empty() + !o.gas.empty() + !o.preset.empty() + !o.ultimate.empty();
  if (sources != 1) {
    throw units::InputError(fmt::format("stackbound fuel: give exactly one fuel: FILE.yaml, --gas, --preset or --ultimate "
                                        "(got {}); see stackbound fuel --help",
                                        sources));
  }
  if (o.ultimate.empty() && (!o.hhv.empty() || !o.lhv.empty() || !o.estimate.empty())) {
    throw units::InputError("--hhv, --lhv and --estimate go with --ultimate (a gas's heating value is computed from the "
                            "species data; a file or preset states its own)");
  }
  if (!o.file.empty()) return read_fuel_file(o.file, db);
  const auto supply = [](core::Fuel fuel) { return FuelFile{std::move(fuel), std::nullopt, "", std::nullopt}; };
  if (!o.preset.empty()) {
    return supply(core::preset_fuel(o.preset, db, "--preset"));
  } else if (!o.gas.empty()) {
    core::GasFuelSpec spec;
    spec.name = "gas fuel";
    spec.composition_percent = core::parse_analysis(o.gas, "--gas", core::gas_analysis_vocabulary(db));
    spec.basis = o.gas_basis == "mass" ? core::CompositionBasis::mass : core::CompositionBasis::mole;
    spec.field = "--gas";
    return supply(core::Fuel::gas(spec, db));
  } else {
    core::CondensedFuelSpec spec;
    spec.name = o.state == "liquid" ? "liquid fuel" : "solid fuel";
    spec.state = o.state == "liquid" ? core::FuelState::liquid : core::FuelState::solid;
    spec.analysis = ultimate_from_text(o);
    spec.field = "--ultimate";
    if (int{!o.hhv.empty()} + int{!o.lhv.empty()} + int{!o.estimate.empty()} > 1) {
      throw units::InputError("--hhv, --lhv, --estimate: give one of them, not several");
    }
    const std::string& measured = o.hhv.empty() ? o.lhv : o.hhv;
    if (!measured.empty()) {
      const char* option = o.hhv.empty() ? "--lhv" : "--hhv";
      spec.heating_value = core::MeasuredHeatingValue{
          o.hhv.empty() ? core::HeatingValueKind::lower : core::HeatingValueKind::higher,
          units::parse_quantity(measured, option, {Dimension::specific_energy}).value_si, spec.analysis.basis};
    } else if (!o.estimate.empty()) {
      spec.estimate = o.estimate == "boie" ? core::HeatingValueCorrelation::boie
                                           : core::HeatingValueCorrelation::channiwala_parikh;
    } else {
      throw units::InputError("--ultimate: a liquid or solid fuel needs a heating value: --hhv or --lhv (e.g. \"31.4 "
                              "MJ/kg\", on the --analysis-basis), or --estimate channiwala_parikh|boie");
    }
    return supply(core::Fuel::condensed(spec, db));
  }
}

// ---------------------------------------------------------------------------------------------------
// Output

double nm3_per_mol() { return units::normal_0C().molar_volume_m3_per_mol(); }

std::string as_fired_text(const core::AsFiredAnalysis& a) {
  std::string text = fmt::format("C {:.3f} %, H {:.3f} %, O {:.3f} %, N {:.3f} %, S {:.3f} %, ash {:.3f} %, moisture {:.3f} %",
                                 a.carbon_percent, a.hydrogen_percent, a.oxygen_percent, a.nitrogen_percent,
                                 a.sulfur_percent, a.ash_percent, a.moisture_percent);
  if (a.other_percent > 0.0) text += fmt::format(", Ar/He {:.3f} %", a.other_percent);
  return text + " (mass)";
}

std::string composition_text(const std::vector<std::pair<std::string, double>>& fractions) {
  std::string text;
  for (const auto& [name, x] : fractions) text += fmt::format("{}{} {:.4g} %", text.empty() ? "" : ", ", name, x * 100.0);
  return text;
}

std::string line(std::string_view label, const std::string& value) { return fmt::format("  {:<30}{}\n", label, value); }

std::string text_report(const FuelAnswer& answer) {
  const core::Fuel& fuel = answer.fuel;
  const core::Oxidant& oxidant = answer.oxidant;
  const core::CombustionResult& r = answer.result;
  const std::optional<core::CombustionRates>& rates = answer.rates;
  const double vn = nm3_per_mol();
  const double hhv = r.hhv_J_per_kg;
  std::string t = "stackbound fuel: complete-combustion estimate\n\n";

  t += fmt::format("Fuel: {} ({})\n", fuel.name(), core::to_string(fuel.state()));
  if (!fuel.source().empty()) t += line("values", fuel.source());
  if (!fuel.mole_fractions().empty()) t += line("composition (mole)", composition_text(fuel.mole_fractions()));
  if (const auto m = fuel.molar_mass_kg_per_mol()) t += line("molar mass", fmt::format("{:.4f} g/mol", *m * 1e3));
  t += line("as fired", as_fired_text(fuel.as_fired_analysis()));
  std::string hhv_text = fmt::format("{:.4f} MJ/kg  ({:.1f} Btu/lb)", hhv * 1e-6,
                                     units::convert_from_si(hhv, Dimension::specific_energy, "Btu/lb"));
  std::string lhv_text = fmt::format("{:.4f} MJ/kg  ({:.1f} Btu/lb)", r.lhv_J_per_kg * 1e-6,
                                     units::convert_from_si(r.lhv_J_per_kg, Dimension::specific_energy, "Btu/lb"));
  if (const auto m = fuel.molar_mass_kg_per_mol()) {
    hhv_text += fmt::format("  {:.4f} MJ/Nm3 (0 degC)  {:.1f} Btu/scf (60 degF)", hhv * *m / vn * 1e-6,
                            units::convert_from_si(hhv * *m, Dimension::molar_energy, "Btu/scf"));
    lhv_text += fmt::format("  {:.4f} MJ/Nm3 (0 degC)  {:.1f} Btu/scf (60 degF)", r.lhv_J_per_kg * *m / vn * 1e-6,
                            units::convert_from_si(r.lhv_J_per_kg * *m, Dimension::molar_energy, "Btu/scf"));
  }
  t += line("HHV (gross)", hhv_text);
  t += line("LHV (net)", lhv_text);
  t += line("heating values", fuel.heating_value_method());
  t += line("temperature", fmt::format("{:.2f} K", r.fuel_temperature_K));

  t += fmt::format("\nOxidant: {}\n", oxidant.description());
  std::vector<std::pair<std::string, double>> ox;
  for (std::size_t i = 0; i < core::kOxidantSpeciesCount; ++i) {
    if (oxidant.mole_fractions()[i] > 0.0) ox.emplace_back(core::kOxidantSpeciesNames[i], oxidant.mole_fractions()[i]);
  }
  t += line("composition (mole, wet)", composition_text(ox));
  t += line("dry air", std::string(core::standard_dry_air_source()));

  t += fmt::format("\nOperating point: {}\n", answer.operating_point);

  t += "\nStoichiometry, per kg of fuel\n";
  t += line("theoretical air (dry)", fmt::format("{:.4f} kg/kg   {:.4f} Nm3/kg", r.stoichiometric_air_kg_per_kg,
                                                 r.stoichiometric_oxidant_mol_per_kg *
                                                     (1.0 - oxidant.water_mole_fraction()) * vn));
  t += line("oxidant supplied (wet)", fmt::format("{:.4f} kg/kg   {:.4f} Nm3/kg   {:.3f} mol/kg", r.oxidant_kg_per_kg,
                                                  r.oxidant_mol_per_kg * vn, r.oxidant_mol_per_kg));
  if (r.ash_kg_per_kg > 0.0) t += line("ash", fmt::format("{:.4f} kg/kg", r.ash_kg_per_kg));

  t += "\nFlue gas, complete combustion          wet          dry\n";
  for (std::size_t i = 0; i < core::kFlueSpeciesCount; ++i) {
    if (r.flue.mol_per_kg[i] <= 0.0) continue;
    const auto s = static_cast<core::FlueSpecies>(i);
    const double dry = r.flue.mole_fraction(s, core::GasBasis::dry);
    t += fmt::format("  {:<30}{:>9.4f} %  {}\n", core::kFlueSpeciesNames[i],
                     r.flue.mole_fraction(s, core::GasBasis::wet) * 100.0,
                     s == core::FlueSpecies::H2O ? std::string("        -") : fmt::format("{:>9.4f} %", dry * 100.0));
  }
  const double wet_mol = r.flue.total_mol_per_kg(core::GasBasis::wet);
  const double dry_mol = r.flue.total_mol_per_kg(core::GasBasis::dry);
  t += "\nFlue gas flows                         wet          dry\n";
  t += fmt::format("  {:<30}{:>9.4f}    {:>9.4f}    mol/kg fuel\n", "amount", wet_mol, dry_mol);
  t += fmt::format("  {:<30}{:>9.4f}    {:>9.4f}    Nm3/kg fuel (0 degC, 101.325 kPa)\n", "normal volume", wet_mol * vn,
                   dry_mol * vn);
  t += fmt::format("  {:<30}{:>9.4f}    {:>9.4f}    kg/kg fuel\n", "mass", r.flue.mass_kg_per_kg(core::GasBasis::wet),
                   r.flue.mass_kg_per_kg(core::GasBasis::dry));
  t += fmt::format("  {:<30}{:>9.2f}    {:>9.2f}    Nm3/GJ (HHV)\n", "per heat input", wet_mol * vn / hhv * 1e9,
                   dry_mol * vn / hhv * 1e9);
  t += fmt::format("  {:<30}{:>9.2f}    {:>9.2f}    kg/GJ (HHV)\n", "", r.flue.mass_kg_per_kg(core::GasBasis::wet) / hhv * 1e9,
                   r.flue.mass_kg_per_kg(core::GasBasis::dry) / hhv * 1e9);

  t += "\n";
  t += line("water dew point", r.water_dew_point_K
                                   ? fmt::format("{:.2f} degC ({:.2f} K) at {:.3f} kPa; saturation pressure IAPWS-IF97",
                                                 *r.water_dew_point_K - units::kCelsiusOffset_K, *r.water_dew_point_K,
                                                 r.flue_pressure_Pa * 1e-3)
                                   : std::string("none (the flue gas holds no water)"));
  t += "  (the acid dew point of SO3-bearing flue gas is higher and is not computed)\n";

  const core::FFactors& f = r.f_factors;
  t += "\nF-factors (US EPA Method 19 definitions: stoichiometric, dry air, HHV; gas at 20 degC, 101.325 kPa)\n";
  t += line("Fd (dry)", fmt::format("{:>8.0f} dscf/MMBtu   {:>7.2f} m3/GJ", f.fd_dscf_per_MMBtu(), f.fd_m3_per_GJ()));
  t += line("Fw (wet)", fmt::format("{:>8.0f} wscf/MMBtu   {:>7.2f} m3/GJ", f.fw_wscf_per_MMBtu(), f.fw_m3_per_GJ()));
  t += line("Fc (CO2)", fmt::format("{:>8.0f} scf/MMBtu    {:>7.2f} m3/GJ", f.fc_scf_per_MMBtu(), f.fc_m3_per_GJ()));

  if (rates) {
    const core::CombustionRates& q = *rates;
    t += fmt::format("\nFeed: {}\n", q.feed.given);
    t += line("fuel", fmt::format("{:.6g} kg/h   {:.6g} t/h   {:.6g} lb/h", q.feed.mass_flow_kg_per_s * 3600.0,
                                  q.feed.mass_flow_kg_per_s * 3.6,
                                  units::convert_from_si(q.feed.mass_flow_kg_per_s, Dimension::mass_flow, "lb/h")));
    if (q.feed.molar_flow_mol_per_s) {
      t += line("fuel gas", fmt::format("{:.6g} Nm3/h (0 degC)   {:.6g} scfh (60 degF)",
                                        *q.feed.molar_flow_mol_per_s * vn * 3600.0,
                                        units::convert_from_si(*q.feed.molar_flow_mol_per_s, Dimension::molar_flow, "scfh")));
    }
    t += line("heat input (HHV)", fmt::format("{:.6g} MW   {:.6g} MMBtu/h", q.feed.heat_input_hhv_W * 1e-6,
                                              units::convert_from_si(q.feed.heat_input_hhv_W, Dimension::power, "MMBtu/h")));
    t += line("heat input (LHV)", fmt::format("{:.6g} MW   {:.6g} MMBtu/h", q.feed.heat_input_lhv_W * 1e-6,
                                              units::convert_from_si(q.feed.heat_input_lhv_W, Dimension::power, "MMBtu/h")));
    t += line("oxidant", fmt::format("{:.6g} kg/h   {:.6g} Nm3/h (wet)", q.oxidant_kg_per_s * 3600.0,
                                     q.oxidant_mol_per_s * vn * 3600.0));
    t += line("flue gas, wet", fmt::format("{:.6g} Nm3/h   {:.6g} kg/h   {:.6g} scfm (60 degF)",
                                           q.flue_wet_mol_per_s * vn * 3600.0, q.flue_kg_per_s * 3600.0,
                                           units::convert_from_si(q.flue_wet_mol_per_s, Dimension::molar_flow, "scfm")));
    t += line("flue gas, dry", fmt::format("{:.6g} Nm3/h   {:.6g} dscfm (68 degF, EPA)", q.flue_dry_mol_per_s * vn * 3600.0,
                                           units::convert_from_si(q.flue_dry_mol_per_s, Dimension::molar_flow, "dscfm")));
    const double co2_molar_mass_kg_per_mol =
        (core::element_by_symbol("C").atomic_weight_g_per_mol + 2.0 * core::element_by_symbol("O").atomic_weight_g_per_mol) *
        1e-3;
    const double co2_kg_per_s = q.flue_mol_per_s[static_cast<std::size_t>(core::FlueSpecies::CO2)] * co2_molar_mass_kg_per_mol;
    t += line("CO2", fmt::format("{:.6g} kg/h", co2_kg_per_s * 3600.0));
    if (q.ash_kg_per_s > 0.0) t += line("ash", fmt::format("{:.6g} kg/h", q.ash_kg_per_s * 3600.0));
  }

  if (!r.warnings.empty()) {
    t += "\nWarnings\n";
    for (const units::Warning& w : r.warnings) t += fmt::format("  - {}\n", units::warning_text(w));
  }
  t += fmt::format("\n{}\n", kFuelCaution);
  return t;
}

std::string presets_listing(std::string_view format) {
  if (format == "json") {
    nlohmann::json list = nlohmann::json::array();
    for (const core::FuelPreset& p : core::fuel_presets()) {
      list.push_back({{"key", p.key}, {"description", p.description}, {"source", p.source}});
    }
    return render::json_text(list);
  }
  std::string text = "Fuel presets (typical values for their class, not the analysis of any fuel lot):\n";
  for (const core::FuelPreset& p : core::fuel_presets()) {
    text += fmt::format("  {:<20}{}\n  {:<20}source: {}\n", p.key, p.description, "", p.source);
  }
  return text;
}

void run(const FuelOptions& o, const GlobalOptions& global) {
  if (o.list_presets) {
    write_output(o.output, presets_listing(o.format));
    return;
  }
  const core::SpeciesDatabase db = species_database(global.species_file);
  const FuelAnswer answer = burn_fuel_query(build_fuel(o, db), o.conditions, db);
  write_output(o.output, o.format == "json" ? render::json_text(render::fuel_json(answer)) : text_report(answer));
}

}  // namespace

void add_fuel_command(CLI::App& app, const GlobalOptions& global) {
  auto o = std::make_shared<FuelOptions>();
  CLI::App* command = app.add_subcommand(
      "fuel", "A fuel's heating values, stoichiometric air, complete-combustion flue gas, dew point and F-factors");
  command->footer(
      "Examples:\n"
      "  stackbound fuel --gas \"CH4 93 %, C2H6 4 %, CO2 1 %, N2 2 %\" --excess-air 15%\n"
      "  stackbound fuel --preset natural_gas --flue-o2 \"3 %\" --rate \"25 MMBtu/h\"\n"
      "  stackbound fuel --preset wood_chips --excess-air 50% --relative-humidity 70% --ambient-temperature 10degC\n"
      "  stackbound fuel --ultimate \"C 75 %, H 5 %, O 6.7 %, N 1.5 %, S 2.3 %, ash 9.5 %, moisture 8 %\" \\\n"
      "                  --analysis-basis dry --hhv \"31.4 MJ/kg\" --excess-air 25% --rate \"12 t/h\" --format json\n"
      "  stackbound fuel my_fuel.yaml --lambda 1.2      (file: a `fuel:` mapping as in a case file)\n"
      "  stackbound fuel --list-presets\n"
      "--gas and --ultimate are written as on an analysis certificate: NAME PERCENT % items separated by commas\n"
      "(the % is required; each name once; notation: docs/composition-notation.md). The percentages are mole %\n"
      "(gas) or mass % and must sum to 100 (within 1 point, normalised with a warning).\n"
      "With no operating point the fuel is burned stoichiometrically.\n"
      "Results are complete-combustion estimates for screening; permits, regulators, local codes and licensed\n"
      "practice govern. Method notes: docs/fuels.md.");
  command->add_option("FILE", o->file, "Fuel file (YAML with a `fuel:` mapping, keys as in a case file)");
  command->add_option("--gas", o->gas, "Gas fuel composition, e.g. \"CH4 93 %, C2H6 4 %, CO2 1 %, N2 2 %\"");
  command->add_option("--gas-basis", o->gas_basis, "Basis of --gas percentages")
      ->check(CLI::IsMember({"mole", "mass"}))
      ->capture_default_str();
  std::vector<std::string> preset_keys;
  for (const core::FuelPreset& p : core::fuel_presets()) preset_keys.emplace_back(p.key);
  command->add_option("--preset", o->preset,
                      fmt::format("Built-in typical fuel: {} (see --list-presets)", fmt::join(preset_keys, ", ")));
  command->add_option("--ultimate", o->ultimate,
                      "Ultimate analysis, mass %: \"C .. %, H .. %, O .. %, N .. %, S .. %, ash .. %, moisture .. %\" "
                      "(O may be left out: by difference)");
  command->add_option("--analysis-basis", o->analysis_basis,
                      "Basis of --ultimate and its heating value (dry: moisture as received; dry_ash_free: ash dry, "
                      "moisture as received)")
      ->check(CLI::IsMember({"as_received", "dry", "dry_ash_free"}))
      ->capture_default_str();
  command->add_option("--state", o->state, "State of an --ultimate fuel")
      ->check(CLI::IsMember({"solid", "liquid"}))
      ->capture_default_str();
  command->add_option("--hhv", o->hhv, "Measured HHV of an --ultimate fuel, e.g. \"31.4 MJ/kg\", \"13500 Btu/lb\"");
  command->add_option("--lhv", o->lhv, "Measured LHV of an --ultimate fuel, on the analysis basis");
  command->add_option("--estimate", o->estimate, "Estimate the HHV by a published correlation instead")
      ->check(CLI::IsMember({"channiwala_parikh", "boie"}));
  command->add_option("--excess-air", o->conditions.excess_air, "Excess air, e.g. 15% (negative: sub-stoichiometric)");
  command->add_option("--lambda", o->conditions.lambda, "Air ratio lambda (actual / stoichiometric air), e.g. 1.15");
  command->add_option("--phi", o->conditions.phi, "Equivalence ratio phi = 1/lambda");
  command->add_option("--flue-o2", o->conditions.flue_o2, "Measured flue O2, e.g. \"3 %\"; the excess air is solved from it");
  command->add_option("--flue-o2-basis", o->conditions.flue_o2_basis, "Basis of --flue-o2")
      ->check(CLI::IsMember({"dry", "wet"}))
      ->capture_default_str();
  command->add_option("--air-temperature", o->conditions.air_temperature, "Air temperature at the burner (preheat); default 25 degC");
  command->add_option("--relative-humidity", o->conditions.relative_humidity, "Relative humidity of the ambient air, e.g. 60%");
  command->add_option("--ambient-temperature", o->conditions.ambient_temperature,
                      "Where the relative humidity was measured; default 15 degC");
  command->add_option("--ambient-pressure", o->conditions.ambient_pressure, "Ambient pressure for the humidity; default 1 atm");
  command->add_option("--humidity-ratio", o->conditions.humidity_ratio, "Instead: kg water per kg dry air, e.g. 0.0085");
  command->add_option("--o2-enrichment", o->conditions.o2_enrichment, "Dry O2 content of the oxidant after adding O2, e.g. 25%");
  command->add_option("--fuel-temperature", o->conditions.fuel_temperature, "Fuel temperature at the burner; default 25 degC");
  command->add_option("--pressure", o->conditions.pressure, "Flue gas pressure for the dew point; default 1 atm");
  command->add_option("--rate", o->conditions.rate,
                      "Fuel feed: \"1.2 t/h\", \"850 Nm3/h\", \"680 scfm\" (gas), \"25 MW\", \"2.5 MMBtu/h\"");
  command->add_option("--heat-basis", o->conditions.heat_basis, "Heating value a heat-input --rate refers to")
      ->check(CLI::IsMember({"hhv", "lhv"}))
      ->capture_default_str();
  command->add_flag("--list-presets", o->list_presets, "List the fuel presets with their sources");
  add_format_option(*command, o->format, {"text", "json"});
  command->add_option("--output", o->output, "Write to this file (whole or not at all) instead of stdout");
  command->callback([o, &global] { run(*o, global); });
}

}  // namespace stackbound::cli
