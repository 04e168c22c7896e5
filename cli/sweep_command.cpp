// `stackbound sweep CASE.yaml --vary PARAM=FROM:TO:STEPS [--vary ...] [--format csv|html] [--output FILE]`

#include <fmt/format.h>

#include "stackbound/cases/case_file.hpp"
#include "stackbound/cases/run_warnings.hpp"
#include "stackbound/cases/sweep.hpp"
#include "stackbound/cli/commands.hpp"
#include "stackbound/cli/progress_bar.hpp"
#include "stackbound/cases/species_file.hpp"
#include "stackbound/render/report_renderers.hpp"
#include "stackbound/render/sweep_csv.hpp"
#include "stackbound/render/sweep_html.hpp"
#include "stackbound/units/input_error.hpp"

namespace stackbound::cli {

using namespace stackbound::cases;

namespace {

struct SweepCli {
  std::string case_file;
  std::vector<std::string> vary;
  std::string format;
  std::string output;
  unsigned threads = 0;
  std::size_t max_points = kDefaultMaxSweepPoints;
};

void run(const SweepCli& cli, const GlobalOptions& global) {
  std::vector<VarySpec> vary;
  for (const std::string& text : cli.vary) vary.push_back(parse_vary(text));
  const std::size_t total = checked_sweep_size(vary, cli.max_points);
  const LoadedCase loaded = load_case_file(cli.case_file);
  const CaseDefinition& definition = loaded.definition;
  check_sweep(definition, vary);
  if (cli.format == "html" && total > render::kSweepHtmlMaxPoints) {
    throw units::InputError(fmt::format("--format html holds every point for its plots: at most {} points ({} asked); "
                                        "use --format csv",
                                        render::kSweepHtmlMaxPoints, total));
  }
  const core::SpeciesDatabase database = species_database(global.species_file);
  const ProgressBar progress;
  SweepOptions options;
  options.threads = cli.threads;
  options.sources = &loaded.sources;
  options.progress = [&](std::size_t done, std::size_t all) { progress.update(done, all); };
  const Provenance provenance = make_provenance(definition, std::chrono::system_clock::now());
  OutputStream out(cli.output);
  std::size_t failed = 0;
  // The first point that ran gives the warnings of the case (those of the load, fuel and combustion).
  std::optional<std::vector<units::Warning>> warnings;
  const auto note_warnings = [&](const SweepPoint& p) {
    if (!warnings && p.result) warnings = run_warnings(p.result->definition, p.result->resolved);
  };
  if (cli.format == "csv") {
    render::SweepCsvWriter writer([&out](std::string_view text) { out.write(text); }, vary,
                                  sweep_cautions(definition, vary), provenance);
    failed = run_sweep(
        definition, vary, database, [&](const SweepPoint& p) { note_warnings(p); writer.add(p); }, options);
    writer.finish();
  } else {
    render::SweepHtmlCollector collector(vary);
    failed = run_sweep(
        definition, vary, database, [&](const SweepPoint& p) { note_warnings(p); collector.add(p); }, options);
    out.write(render::render_report(collector.document(definition, provenance), "html"));
  }
  print_warnings(warnings.value_or(definition.warnings), loaded.sources);
  out.commit();
  if (failed > 0) {
    throw PartialFailure(fmt::format("{} of {} sweep points failed; each failed row names its parameters and the reason",
                                     failed, total));
  }
}

}  // namespace

void add_sweep_command(CLI::App& app, const GlobalOptions& global) {
  auto cli = std::make_shared<SweepCli>();
  CLI::App* command = app.add_subcommand("sweep", "Run a case over a grid of operating changes (CSV or HTML with plots)");
  command->footer(
      "Examples:\n"
      "  stackbound sweep cases/examples/gas_boiler.yaml --vary excess_air=5%:45%:9\n"
      "  stackbound sweep cases/examples/gas_boiler.yaml --vary excess_air=8%:15%:8 --format html --output ea.html\n"
      "  stackbound sweep cases/examples/wood_chip_boiler.yaml --vary air_preheat=20degC:320degC:7 --vary heat_loss=10%:30%:3\n"
      "Parameters: excess_air, flue_o2, firing_temperature, heat_loss, air_preheat, humidity, o2_enrichment,\n"
      "pressure, blend_fraction, reference_o2; values with units; STEPS >= 2 points; the last --vary changes fastest.\n"
      "Exit codes: 0 all points ran, 2 bad input, 4 some points failed (their rows say why).\n"
      "At most --max-points points (default 10000000): the grid is checked before any work.");
  command->add_option("CASE", cli->case_file, "Case file (YAML)")->required();
  command->add_option("--vary", cli->vary, "PARAM=FROM:TO:STEPS, e.g. excess_air=5%:45%:9 (repeatable)")->required();
  add_format_option(*command, cli->format, {"csv", "html"});
  command->add_option("--output", cli->output, "Write to FILE (whole or not at all) instead of stdout");
  command->add_option("--threads", cli->threads, "Worker threads (default: all cores)");
  command->add_option("--max-points", cli->max_points,
                      fmt::format("Refuse grids of more points than this (default {})", kDefaultMaxSweepPoints))
      ->check(CLI::PositiveNumber);
  command->callback([cli, &global] { run(*cli, global); });
}

}  // namespace stackbound::cli
