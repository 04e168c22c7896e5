// `stackbound reduce CASE.yaml READINGS.csv [--format csv|json|html] [--output FILE] [--average hour|day|PERIOD]
// [--rules us-part60|eu-ied|none]`: analyser readings to corrected, validated averages (cases/reduction.hpp).

#include <memory>

#include "stackbound/cases/case_file.hpp"
#include "stackbound/cases/reduce_query.hpp"
#include "stackbound/cases/species_file.hpp"
#include "stackbound/cli/commands.hpp"
#include "stackbound/cli/progress_bar.hpp"
#include "stackbound/render/reduction_output.hpp"

namespace stackbound::cli {

using namespace stackbound::cases;

namespace {

struct ReduceOptionsCli {
  std::string case_file;
  std::string readings;
  std::string format = "csv";
  std::string output;
  std::vector<std::string> average{"hour"};  // "30d rolling" may come as two words
  ReduceQuery query;
};

ReduceOptions library_options(const ReduceOptionsCli& cli) {
  ReduceQuery query = cli.query;
  query.average = cli.average.front();
  for (std::size_t i = 1; i < cli.average.size(); ++i) query.average += " " + cli.average[i];
  return reduce_options(query);
}

}  // namespace

void add_reduce_command(CLI::App& app, const GlobalOptions& global) {
  auto options = std::make_shared<ReduceOptionsCli>();
  CLI::App* command = app.add_subcommand(
      "reduce", "Analyser readings (CSV) to corrected, validated averages on the case's bases");
  command->footer(
      "Examples:\n"
      "  stackbound reduce cases/examples/gas_turbine.yaml cases/examples/gas_turbine_readings.csv\n"
      "  stackbound reduce cases/examples/gas_turbine.yaml cases/examples/gas_turbine_readings.csv --rules us-part60 --format json\n"
      "  stackbound reduce cases/examples/gas_turbine.yaml cases/examples/gas_turbine_readings.csv --rules eu-ied --average day\n"
      "  stackbound reduce cases/examples/gas_turbine.yaml cases/examples/gas_turbine_readings.csv --average 3h --format html --output gt3-day.html\n"
      "The case file's readings section maps the CSV's columns (docs/case-file.md); the rules and the output keys are in\n"
      "docs/reduce.md and docs/report-json.md. Averages, validity and counts above a limit are screening figures, not a\n"
      "compliance determination: the permit, the regulation and the competent authority govern.");
  command->add_option("CASE", options->case_file, "Case file (YAML) with a readings section")->required();
  command->add_option("READINGS", options->readings, "Analyser readings (CSV with a header row)")->required();
  add_format_option(*command, options->format, {"csv", "json", "html"});
  command->add_option("--output", options->output, "Write to FILE (whole or not at all) instead of stdout");
  command->add_option("--average", options->average,
                      "Averaging period: hour, day, month, Nh, Nd, optionally followed by rolling (\"30d rolling\")")
      ->expected(1, 2)
      ->default_str("hour");
  command->add_option("--rules", options->query.rules, "Rule set: us-part60, eu-ied or none (plain averages)")->default_str("none");
  command->add_flag("--strict", options->query.strict, "Stop at the first malformed row");
  command->add_option("--list-bad-rows", options->query.listed_problems, "Malformed rows listed with their line numbers (all are counted)")
      ->default_str("5");
  command->add_option("--min-quadrants", options->query.min_quadrants, "Override: 15-minute quadrants needing a valid reading (0-4)");
  command->add_option("--min-hour-coverage", options->query.min_hour_coverage, "Override: share of an hour's readings that must be valid (\"75 %\")");
  command->add_option("--max-invalid-hours", options->query.max_invalid_hours, "Override: invalid hours allowed in a valid day");
  command->add_option("--min-valid-hours", options->query.min_valid_hours, "Override: share of operating hours valid in a longer period (\"75 %\")");
  command->callback([options, &global] {
    const ReduceOptions chosen = library_options(*options);
    LoadedCase loaded = load_case_file(options->case_file);
    const core::SpeciesDatabase database = species_database(global.species_file);
    ReadingsFile readings = open_readings_file(options->readings);
    const std::size_t total = readings.size;
    std::istream& input = readings.stream;
    const ProgressBar bar("bytes");
    ReduceOptions with_progress = chosen;
    if (total > (std::size_t{8} << 20)) with_progress.progress = [&](std::size_t done) { bar.update(std::min(done, total), total); };
    // CSV to a file is written row by row (the file still appears whole or not at all): memory then
    // does not grow with the number of periods.
    if (options->format == "csv" && !options->output.empty() && options->output != "-") {
      OutputStream stream(options->output);
      bool header = false;
      with_progress.keep_periods = false;
      with_progress.on_period = [&](const ReductionDocument& document, const ReductionPeriod& period) {
        if (!header) stream.write(render::reduction_csv_header(document));
        header = true;
        stream.write(render::reduction_csv_row(document, period));
      };
      const ReductionDocument document = with_positions(loaded.sources, [&] {
        return reduce_readings(loaded.definition, database, input, options->readings, with_progress);
      });
      if (!header) stream.write(render::reduction_csv_header(document));
      stream.commit();
      return;
    }
    const ReductionDocument document = with_positions(loaded.sources, [&] {
      return reduce_readings(loaded.definition, database, input, options->readings, with_progress);
    });
    write_output(options->output, render::render_reduction(document, options->format));
  });
}

}  // namespace stackbound::cli
