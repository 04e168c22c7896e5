// `stackbound sweep CASE.yaml --vary PARAM=FROM:TO:STEPS [--vary ...] [--format csv|html] [--output FILE]`

#include <unistd.h>

#include <array>
#include <charconv>
#include <cstdio>
#include <iterator>
#include <map>

#include <fmt/format.h>

#include "stackbound/cases/case_file.hpp"
#include "stackbound/cases/commands.hpp"
#include "stackbound/cases/run_metrics.hpp"
#include "stackbound/cases/run_report.hpp"
#include "stackbound/cases/species_file.hpp"
#include "stackbound/cases/sweep.hpp"
#include "stackbound/emissions/cautions.hpp"
#include "stackbound/emissions/report.hpp"

namespace stackbound::cases {

namespace {

struct SweepCli {
  std::string case_file;
  std::vector<std::string> vary;
  std::string format;
  std::string output;
  unsigned threads = 0;
};

// HTML holds every point for its plots; beyond this a CSV is the right output.
constexpr std::size_t kHtmlMaxPoints = 100000;
// Points listed in the HTML table.
constexpr std::size_t kHtmlMaxTableRows = 400;

std::string csv_cell(const std::string& cell) {
  if (cell.find_first_of(",\"\n") == std::string::npos) return cell;
  std::string quoted = "\"";
  for (const char c : cell) quoted += c == '"' ? std::string("\"\"") : std::string(1, c);
  return quoted + "\"";
}

std::string parameter_header(const VarySpec& v) {
  return fmt::format("{} [{}]", sweep_parameter_name(v.parameter), sweep_parameter_unit(v.parameter));
}

class ProgressBar {
 public:
  ProgressBar() : shown_(::isatty(::fileno(stderr)) != 0) {}
  void update(std::size_t done, std::size_t total) const {
    if (!shown_) return;
    constexpr int kWidth = 40;
    const int filled = static_cast<int>(kWidth * done / std::max<std::size_t>(total, 1));
    std::fprintf(stderr, "\r[%s%s] %3d %% %zu/%zu points", std::string(static_cast<std::size_t>(filled), '#').c_str(),
                 std::string(static_cast<std::size_t>(kWidth - filled), ' ').c_str(),
                 static_cast<int>(100 * done / std::max<std::size_t>(total, 1)), done, total);
    if (done == total) std::fprintf(stderr, "\n");
    std::fflush(stderr);
  }

 private:
  bool shown_;
};

// CSV: comment lines (the bound statement and cautions), one header line with units, one row a point,
// written as the points arrive. The header's result columns come from the first point that ran.
class CsvSweepWriter {
 public:
  CsvSweepWriter(OutputStream& out, const std::vector<VarySpec>& vary) : out_(out), vary_(vary) {
    out_.write(fmt::format("# stackbound sweep: CO and NO figures are the {}; screening estimates, not measurements.\n",
                           kBoundStatement));
    for (const emissions::Caution c : emissions::standard_cautions()) {
      out_.write("# caution: " + std::string(emissions::caution(c).text) + "\n");
    }
  }

  void add(const SweepPoint& point) {
    if (!header_written_) {
      if (!point.result) {
        pending_.push_back(point);
        if (pending_.size() < 1000) return;
      }
      write_header(point.result ? &*point.result : nullptr);
      for (const SweepPoint& earlier : pending_) write_row(earlier);
      pending_.clear();
    }
    write_row(point);
  }

  void finish() {
    if (!header_written_) {
      write_header(nullptr);
      for (const SweepPoint& earlier : pending_) write_row(earlier);
    }
  }

 private:
  void write_header(const RunResult* first) {
    std::string line = "point";
    for (const VarySpec& v : vary_) line += "," + csv_cell(parameter_header(v));
    line += ",status";
    if (first != nullptr) {
      const std::vector<MetricColumn> columns = run_metric_columns(*first);
      for (const MetricColumn& column : columns) line += "," + csv_cell(column.header);
      metric_count_ = columns.size();
    }
    line += ",error\n";
    out_.write(line);
    header_written_ = true;
  }

  void write_row(const SweepPoint& point) {
    fmt::memory_buffer line;
    fmt::format_to(std::back_inserter(line), "{}", point.index + 1);
    for (std::size_t k = 0; k < vary_.size(); ++k) {
      fmt::format_to(std::back_inserter(line), ",{:.10g}", sweep_parameter_display(vary_[k].parameter, point.values[k]));
    }
    if (point.result) {
      fmt::format_to(std::back_inserter(line), ",ok");
      for (const double value : run_metric_values(*point.result)) {
        // to_chars: the same 8 significant digits as "{:.8g}", at a fraction of the cost per row.
        std::array<char, 32> digits{};
        const auto end = std::to_chars(digits.data(), digits.data() + digits.size(), value, std::chars_format::general, 8).ptr;
        line.push_back(',');
        line.append(digits.data(), end);
      }
      fmt::format_to(std::back_inserter(line), ",\n");
    } else {
      fmt::format_to(std::back_inserter(line), ",failed{},{}\n", std::string(metric_count_, ','), csv_cell(point.error));
    }
    out_.write(std::string_view(line.data(), line.size()));
  }

  OutputStream& out_;
  const std::vector<VarySpec>& vary_;
  bool header_written_ = false;
  std::size_t metric_count_ = 0;
  std::vector<SweepPoint> pending_;
};

// HTML: keeps the numbers it plots (not the full results) and draws CO, NO/NOx, firing temperature
// and flue O2 against the first varied parameter, one line for each combination of the others.
class HtmlSweepCollector {
 public:
  explicit HtmlSweepCollector(const std::vector<VarySpec>& vary) : vary_(vary) {}

  void add(const SweepPoint& point) {
    Row row{point.values, {}, point.error};
    if (point.result) {
      if (columns_.empty()) {
        columns_ = run_metric_columns(*point.result);
        reference_o2_ = emissions::percent_text(point.result->reference_o2_dry) + " % O2";
      }
      const std::vector<double> values = run_metric_values(*point.result);
      for (std::size_t k = 0; k < values.size() && k < columns_.size(); ++k) row.metrics[columns_[k].key] = values[k];
    } else {
      ++failed_;
    }
    rows_.push_back(std::move(row));
  }

  emissions::Report report(const CaseDefinition& definition) const {
    emissions::Report report;
    report.title = "Sweep: " + definition.title;
    report.subtitle = fmt::format("CO and NO figures are the {} of each point: screening estimates from chemical "
                                  "equilibrium, not measurements and not compliance determinations.",
                                  kBoundStatement);
    report.summary.emplace_back("Case file", definition.origin);
    for (const VarySpec& v : vary_) report.summary.emplace_back("Varied", v.text);
    report.summary.emplace_back("Points", fmt::format("{} ({} failed)", rows_.size(), failed_));
    const std::string x_label = parameter_header(vary_.front());
    const auto plot = [&](const std::string& title, const std::string& y_label, const std::vector<std::string>& keys) {
      emissions::ReportPlot p{title, x_label, y_label, {}};
      for (const std::string& key : keys) {
        for (auto& series : series_for(key)) p.series.push_back(std::move(series));
      }
      return p;
    };
    report.plots.push_back(plot(fmt::format("CO bound at {}", reference_o2_), fmt::format("CO [ppmvd @ {}]", reference_o2_),
                                {"CO_ppmvd_at_ref_o2"}));
    report.plots.push_back(plot(fmt::format("NO bound at {}", reference_o2_), fmt::format("NO [ppmvd @ {}]", reference_o2_),
                                {"NO_ppmvd_at_ref_o2"}));
    report.plots.push_back(plot("Firing (flame) temperature", "temperature [K]", {"firing_temperature_K"}));
    report.plots.push_back(plot("Flue-gas O2", "O2 [% dry]", {"flue_o2_dry_percent"}));

    emissions::ReportTable table;
    table.title = "Points";
    table.columns.push_back("point");
    for (const VarySpec& v : vary_) table.columns.push_back(parameter_header(v));
    for (const MetricColumn& column : columns_) table.columns.push_back(column.header);
    table.columns.push_back("error");
    for (std::size_t i = 0; i < rows_.size() && i < kHtmlMaxTableRows; ++i) {
      std::vector<std::string> cells{std::to_string(i + 1)};
      for (std::size_t k = 0; k < vary_.size(); ++k) {
        cells.push_back(fmt::format("{:.6g}", sweep_parameter_display(vary_[k].parameter, rows_[i].values[k])));
      }
      for (const MetricColumn& column : columns_) {
        const auto found = rows_[i].metrics.find(column.key);
        cells.push_back(found == rows_[i].metrics.end() ? "-" : fmt::format("{:.5g}", found->second));
      }
      cells.push_back(rows_[i].error);
      table.rows.push_back(std::move(cells));
    }
    if (rows_.size() > kHtmlMaxTableRows) {
      table.notes.push_back(fmt::format("First {} of {} points shown; use --format csv for all.", kHtmlMaxTableRows, rows_.size()));
    }
    report.tables.push_back(std::move(table));
    if (failed_ > 0) report.flags.push_back(fmt::format("{} points failed; their rows say why.", failed_));
    for (const emissions::Caution c : emissions::standard_cautions()) report.cautions.emplace_back(emissions::caution(c).text);
    return report;
  }

 private:
  struct Row {
    std::vector<double> values;
    std::map<std::string, double> metrics;
    std::string error;
  };

  // One series per combination of the parameters after the first (at most 6 lines a plot).
  std::vector<emissions::PlotSeries> series_for(const std::string& key) const {
    std::map<std::vector<double>, emissions::PlotSeries> by_rest;
    for (const Row& row : rows_) {
      const std::vector<double> rest(row.values.begin() + 1, row.values.end());
      auto [it, inserted] = by_rest.try_emplace(rest);
      if (inserted) {
        std::string name = key.substr(0, key.find('_'));
        for (std::size_t k = 1; k < vary_.size(); ++k) {
          name += fmt::format(", {} = {:.4g} {}", sweep_parameter_name(vary_[k].parameter),
                              sweep_parameter_display(vary_[k].parameter, row.values[k]), sweep_parameter_unit(vary_[k].parameter));
        }
        it->second.name = name;
      }
      const auto found = row.metrics.find(key);
      it->second.x.push_back(sweep_parameter_display(vary_.front().parameter, row.values.front()));
      it->second.y.push_back(found == row.metrics.end() ? std::nan("") : found->second);
    }
    std::vector<emissions::PlotSeries> series;
    for (auto& [rest, s] : by_rest) {
      if (series.size() == 6) break;
      series.push_back(std::move(s));
    }
    return series;
  }

  const std::vector<VarySpec>& vary_;
  std::vector<Row> rows_;
  std::vector<MetricColumn> columns_;
  std::string reference_o2_ = "reference O2";
  std::size_t failed_ = 0;
};

void run(const SweepCli& cli, const GlobalOptions& global) {
  const CaseDefinition definition = load_case(cli.case_file);
  std::vector<VarySpec> vary;
  for (const std::string& text : cli.vary) vary.push_back(parse_vary(text));
  check_sweep(definition, vary);
  const std::size_t total = sweep_size(vary);
  if (cli.format == "html" && total > kHtmlMaxPoints) {
    throw units::InputError(fmt::format("--format html holds every point for its plots: at most {} points ({} asked); "
                                        "use --format csv",
                                        kHtmlMaxPoints, total));
  }
  const core::SpeciesDatabase database = species_database(global.species_file);
  const ProgressBar progress;
  SweepOptions options;
  options.threads = cli.threads;
  options.progress = [&](std::size_t done, std::size_t all) { progress.update(done, all); };
  OutputStream out(cli.output);
  std::size_t failed = 0;
  if (cli.format == "csv") {
    CsvSweepWriter writer(out, vary);
    failed = run_sweep(definition, vary, database, [&](const SweepPoint& p) { writer.add(p); }, options);
    writer.finish();
  } else {
    HtmlSweepCollector collector(vary);
    failed = run_sweep(definition, vary, database, [&](const SweepPoint& p) { collector.add(p); }, options);
    out.write(emissions::render_html(collector.report(definition)));
  }
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
      "pressure, blend_fraction; values with units; STEPS >= 2 points; the last --vary changes fastest.\n"
      "Exit codes: 0 all points ran, 2 bad input, 4 some points failed (their rows say why).");
  command->add_option("CASE", cli->case_file, "Case file (YAML)")->required();
  command->add_option("--vary", cli->vary, "PARAM=FROM:TO:STEPS, e.g. excess_air=5%:45%:9 (repeatable)")->required();
  add_format_option(*command, cli->format, {"csv", "html"});
  command->add_option("--output", cli->output, "Write to FILE (whole or not at all) instead of stdout");
  command->add_option("--threads", cli->threads, "Worker threads (default: all cores)");
  command->callback([cli, &global] { run(*cli, global); });
}

}  // namespace stackbound::cases
