// `stackbound compare A.yaml B.yaml [...] [--format text|csv|json|html] [--output FILE]`: cases side
// by side, each against the first (absolute and relative differences).

#include <fmt/format.h>

#include <nlohmann/json.hpp>

#include "stackbound/cases/case_file.hpp"
#include "stackbound/cases/commands.hpp"
#include "stackbound/cases/run_metrics.hpp"
#include "stackbound/cases/run_report.hpp"
#include "stackbound/cases/species_file.hpp"
#include "stackbound/emissions/cautions.hpp"
#include "stackbound/emissions/report.hpp"
#include "stackbound/units/input_error.hpp"

namespace stackbound::cases {

namespace {

struct CompareCli {
  std::vector<std::string> case_files;
  std::string format;
  std::string output;
};

struct Comparison {
  std::vector<RunResult> runs;
  std::vector<MetricColumn> columns;         // of the first run
  std::vector<std::vector<double>> values;   // per run, in the columns' order
  std::vector<std::string> flags;
};

// Relative difference against the first case; none when the first is zero.
std::optional<double> relative(double value, double first) {
  if (first == 0.0) return std::nullopt;
  return (value - first) / std::abs(first);
}

Comparison compare(const std::vector<std::string>& files, const core::SpeciesDatabase& database) {
  Comparison comparison;
  for (const std::string& file : files) comparison.runs.push_back(run_case(load_case(file), database));
  comparison.columns = run_metric_columns(comparison.runs.front());
  for (const RunResult& run : comparison.runs) comparison.values.push_back(run_metric_values(run));
  for (std::size_t i = 1; i < comparison.runs.size(); ++i) {
    const std::vector<MetricColumn> other = run_metric_columns(comparison.runs[i]);
    bool same_columns = other.size() == comparison.columns.size();
    for (std::size_t k = 0; same_columns && k < other.size(); ++k) same_columns = other[k].key == comparison.columns[k].key;
    if (!same_columns) {
      throw units::InputError(fmt::format("{}: report.pollutants must list the same pollutants as {} to compare them",
                                          comparison.runs[i].definition.origin, comparison.runs[0].definition.origin));
    }
    if (comparison.runs[i].reference_o2_dry != comparison.runs[0].reference_o2_dry ||
        comparison.runs[i].normal != comparison.runs[0].normal) {
      comparison.flags.push_back(fmt::format(
          "{} uses a different reference O2 or normal conditions from {}: values 'at the reference O2' and in mg/Nm3 are "
          "on different bases; compare ppmvd, kg/h or lb/MMBtu instead.",
          comparison.runs[i].definition.origin, comparison.runs[0].definition.origin));
    }
  }
  return comparison;
}

emissions::Report comparison_report(const Comparison& c) {
  emissions::Report report;
  report.title = "Comparison of cases";
  report.subtitle = fmt::format("CO and NO figures are the {} of each case: screening estimates, not measurements "
                                "and not compliance determinations. Differences are against case A.",
                                kBoundStatement);
  for (std::size_t i = 0; i < c.runs.size(); ++i) {
    report.summary.emplace_back(fmt::format("Case {}", static_cast<char>('A' + i)),
                                fmt::format("{} ({})", c.runs[i].definition.title, c.runs[i].definition.origin));
  }
  emissions::ReportTable table;
  table.title = "Side by side";
  table.columns.push_back("quantity");
  for (std::size_t i = 0; i < c.runs.size(); ++i) table.columns.push_back(fmt::format("{}", static_cast<char>('A' + i)));
  for (std::size_t i = 1; i < c.runs.size(); ++i) {
    table.columns.push_back(fmt::format("{} - A", static_cast<char>('A' + i)));
    table.columns.push_back(fmt::format("({} - A)/A [%]", static_cast<char>('A' + i)));
  }
  const std::vector<double>& first = c.values.front();
  for (std::size_t k = 0; k < c.columns.size(); ++k) {
    std::vector<std::string> row{c.columns[k].header};
    for (const auto& values : c.values) row.push_back(fmt::format("{:.5g}", values[k]));
    for (std::size_t i = 1; i < c.values.size(); ++i) {
      row.push_back(fmt::format("{:+.4g}", c.values[i][k] - first[k]));
      const auto rel = relative(c.values[i][k], first[k]);
      row.push_back(rel ? fmt::format("{:+.2f}", *rel * 100.0) : "-");
    }
    table.rows.push_back(std::move(row));
  }
  report.tables.push_back(std::move(table));
  report.flags = c.flags;
  for (std::size_t i = 0; i < c.runs.size(); ++i) {
    for (const std::string& finding : c.runs[i].findings) {
      report.flags.push_back(fmt::format("Case {}: {}", static_cast<char>('A' + i), finding));
    }
  }
  report.cautions = c.runs.front().cautions;
  return report;
}

nlohmann::json comparison_json(const Comparison& c) {
  nlohmann::json cases = nlohmann::json::array();
  for (std::size_t i = 0; i < c.runs.size(); ++i) {
    nlohmann::json values = nlohmann::json::object();
    nlohmann::json differences = nlohmann::json::object();
    for (std::size_t k = 0; k < c.columns.size(); ++k) {
      const double value = c.values[i][k];
      const double first = c.values[0][k];
      values[c.columns[k].key] = value;
      const auto rel = relative(value, first);
      differences[c.columns[k].key] = {{"absolute", value - first}, {"relative", rel ? nlohmann::json(*rel) : nlohmann::json(nullptr)}};
    }
    cases.push_back({{"label", std::string(1, static_cast<char>('A' + i))},
                     {"file", c.runs[i].definition.origin},
                     {"title", c.runs[i].definition.title},
                     {"values", values},
                     {"difference_from_first", differences},
                     {"findings", c.runs[i].findings}});
  }
  nlohmann::json units = nlohmann::json::object();
  for (const MetricColumn& column : c.columns) units[column.key] = column.header;
  return {{"bound_statement", kBoundStatement}, {"cases", cases},      {"columns", units},
          {"flags", c.flags},                    {"cautions", c.runs.front().cautions}};
}

}  // namespace

void add_compare_command(CLI::App& app, const GlobalOptions& global) {
  auto cli = std::make_shared<CompareCli>();
  CLI::App* command = app.add_subcommand("compare", "Compare two or more cases side by side");
  command->footer(
      "Examples:\n"
      "  stackbound compare cases/examples/gas_boiler.yaml cases/examples/oil_heater.yaml\n"
      "  stackbound compare base.yaml low_excess_air.yaml --format html --output compare.html\n"
      "Differences are against the first case: absolute, and relative in %.");
  command->add_option("CASES", cli->case_files, "Two or more case files (YAML)")->required()->expected(2, 26);
  add_format_option(*command, cli->format, {"text", "csv", "json", "html"});
  command->add_option("--output", cli->output, "Write to FILE (whole or not at all) instead of stdout");
  command->callback([cli, &global] {
    const core::SpeciesDatabase database = species_database(global.species_file);
    const Comparison comparison = compare(cli->case_files, database);
    std::string text;
    if (cli->format == "json") {
      text = comparison_json(comparison).dump(2) + "\n";
    } else {
      const emissions::Report report = comparison_report(comparison);
      text = cli->format == "csv"    ? emissions::render_csv(report)
             : cli->format == "html" ? emissions::render_html(report)
                                     : emissions::render_text(report);
    }
    write_output(cli->output, text);
  });
}

}  // namespace stackbound::cases
