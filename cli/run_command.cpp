// `stackbound run CASE.yaml [--format text|json|csv|html] [--output FILE]`: the main job.

#include "stackbound/cases/case_file.hpp"
#include "stackbound/cases/pipeline.hpp"
#include "stackbound/cases/species_file.hpp"
#include "stackbound/cli/commands.hpp"
#include "stackbound/render/run_output.hpp"

namespace stackbound::cli {

using namespace stackbound::cases;

namespace {

struct RunOptionsCli {
  std::string case_file;
  std::string format;
  std::string output;
};

}  // namespace

void add_run_command(CLI::App& app, const GlobalOptions& global) {
  auto options = std::make_shared<RunOptionsCli>();
  CLI::App* command = app.add_subcommand("run", "Run a case file: equilibrium bound, flue gas, emissions on permit bases");
  command->footer(
      "Examples:\n"
      "  stackbound run cases/examples/gas_boiler.yaml\n"
      "  stackbound run cases/examples/wood_chip_boiler.yaml --format html --output wb1.html\n"
      "  stackbound run cases/examples/gas_turbine.yaml --format json\n"
      "The case-file schema is in docs/case-file.md. The CO and NO figures are an equilibrium bound at the\n"
      "stated firing conditions, not a measurement; permits, regulators, local codes and licensed practice govern.");
  command->add_option("CASE", options->case_file, "Case file (YAML)")->required();
  add_format_option(*command, options->format, {"text", "json", "csv", "html"});
  command->add_option("--output", options->output, "Write to FILE (whole or not at all) instead of stdout");
  command->callback([options, &global] {
    LoadedCase loaded = load_case_file(options->case_file);
    const core::SpeciesDatabase database = species_database(global.species_file);
    const RunResult result =
        with_positions(loaded.sources, [&] { return run_case(std::move(loaded.definition), database); });
    const Provenance provenance = make_provenance(result.definition, std::chrono::system_clock::now());
    const std::string text = render::render_run(result, options->format, provenance);
    print_warnings(result.screening.warnings, loaded.sources);
    write_output(options->output, text);
  });
}

}  // namespace stackbound::cli
