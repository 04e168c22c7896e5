// `stackbound compare A.yaml B.yaml [...] [--format text|csv|json|html] [--output FILE]`: cases side
// by side, each against the first (absolute and relative differences).

#include "stackbound/cases/comparison.hpp"
#include "stackbound/cases/species_file.hpp"
#include "stackbound/render/finite_figures.hpp"
#include "stackbound/cli/commands.hpp"
#include "stackbound/render/comparison_json.hpp"
#include "stackbound/render/report_renderers.hpp"

namespace stackbound::cli {

using namespace stackbound::cases;

namespace {

struct CompareCli {
  std::vector<std::string> case_files;
  std::string format;
  std::string output;
};

}  // namespace

void add_compare_command(CLI::App& app, const GlobalOptions& global) {
  auto cli = std::make_shared<CompareCli>();
  CLI::App* command = app.add_subcommand("compare", "Compare two or more cases side by side");
  command->footer(
      "Examples:\n"
      "  stackbound compare cases/examples/gas_boiler.yaml cases/examples/wood_chip_boiler.yaml\n"
      "  stackbound compare base.yaml low_excess_air.yaml --format html --output compare.html\n"
      "  stackbound compare cases/examples/gas_boiler.yaml cases/examples/oil_heater.yaml --format json\n"
      "Differences are against the first case: absolute, and relative in %. Each case's column names its\n"
      "reference basis; figures at the reference O2 of cases on different bases are not differenced.\n"
      "Cases reporting different pollutants are compared on the union, with \"-\" where one is not reported.");
  command->add_option("CASES", cli->case_files, "Two or more case files (YAML)")->required()->expected(2, 26);
  add_format_option(*command, cli->format, {"text", "csv", "json", "html"});
  command->add_option("--output", cli->output, "Write to FILE (whole or not at all) instead of stdout");
  command->callback([cli, &global] {
    const core::SpeciesDatabase database = species_database(global.species_file);
    const Comparison comparison = compare(cli->case_files, database);
    const Provenance provenance = make_provenance(comparison.runs.front().definition, std::chrono::system_clock::now());
    const std::string text =
        cli->format == "json" ? render::json_text(render::comparison_json(comparison, provenance))
                              : render::render_report(cases::comparison_document(comparison, provenance), cli->format);
    for (const RunResult& run : comparison.runs) print_warnings(run.screening.warnings, SourceMap(run.definition.origin));
    write_output(cli->output, text);
  });
}

}  // namespace stackbound::cli
