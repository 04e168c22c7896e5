#include "stackbound/cases/comparison.hpp"

#include <algorithm>
#include <cmath>

#include <fmt/format.h>

#include "stackbound/cases/case_file.hpp"
#include "stackbound/cases/run_document.hpp"
#include "stackbound/emissions/cautions.hpp"
#include "stackbound/units/input_error.hpp"

namespace stackbound::cases {

namespace {

// The cautions any of the runs carries, once each, in the order of all_cautions().
std::vector<std::string> cautions_of(const std::vector<RunResult>& runs) {
  std::vector<std::string> cautions;
  for (const emissions::CautionText& entry : emissions::all_cautions()) {
    const bool carried = std::any_of(runs.begin(), runs.end(), [&](const RunResult& run) {
      const std::vector<std::string>& keys = run.screening.caution_keys;
      return std::find(keys.begin(), keys.end(), entry.key) != keys.end();
    });
    if (carried) cautions.emplace_back(entry.text);
  }
  return cautions;
}

}  // namespace

// Relative difference against the first case; none when the first is zero.
std::optional<double> relative_difference(double value, double first) {
  if (first == 0.0) return std::nullopt;
  return (value - first) / std::abs(first);
}

Comparison compare(const std::vector<std::string>& files, const core::SpeciesDatabase& database) {
  Comparison comparison;
  for (const std::string& file : files) {
    LoadedCase loaded = load_case_file(file);
    comparison.runs.push_back(with_positions(loaded.sources, [&] { return run_case(std::move(loaded.definition), database); }));
  }
  comparison.cautions = cautions_of(comparison.runs);
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
    const EmissionFigures& figures = comparison.runs[i].emissions;
    const EmissionFigures& first = comparison.runs[0].emissions;
    if (figures.reference_o2_dry != first.reference_o2_dry || figures.normal != first.normal) {
      comparison.flags.push_back(fmt::format(
          "{} uses a different reference O2 or normal conditions from {}: values 'at the reference O2' and in mg/Nm3 are "
          "on different bases; compare ppmvd, kg/h or lb/MMBtu instead.",
          comparison.runs[i].definition.origin, comparison.runs[0].definition.origin));
    }
  }
  return comparison;
}

Report comparison_document(const Comparison& c, const Provenance& provenance) {
  Report report;
  report.title = "Comparison of cases";
  report.subtitle = fmt::format("CO and NO figures are the {} of each case: screening estimates, not measurements "
                                "and not compliance determinations. Differences are against case A.",
                                kBoundStatement);
  for (std::size_t i = 0; i < c.runs.size(); ++i) {
    report.summary.emplace_back(fmt::format("Case {}", static_cast<char>('A' + i)),
                                fmt::format("{} ({}; SHA-256 {})", c.runs[i].definition.title,
                                            c.runs[i].definition.origin, c.runs[i].definition.source_sha256));
  }
  report.summary.emplace_back("Tool version", fmt::format("stackbound {}", provenance.version));
  report.summary.emplace_back("Run at", provenance.run_at);
  ReportTable table;
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
    const auto cell = [&](double value) { return is_missing(c.columns[k], value) ? std::string("-") : fmt::format("{:.5g}", value); };
    for (const auto& values : c.values) row.push_back(cell(values[k]));
    for (std::size_t i = 1; i < c.values.size(); ++i) {
      if (is_missing(c.columns[k], c.values[i][k]) || is_missing(c.columns[k], first[k])) {
        row.insert(row.end(), {"-", "-"});
        continue;
      }
      row.push_back(fmt::format("{:+.4g}", c.values[i][k] - first[k]));
      const auto rel = relative_difference(c.values[i][k], first[k]);
      row.push_back(rel ? fmt::format("{:+.2f}", *rel * 100.0) : "-");
    }
    table.rows.push_back(std::move(row));
  }
  report.tables.push_back(std::move(table));
  report.flags = c.flags;
  for (std::size_t i = 0; i < c.runs.size(); ++i) {
    for (const std::string& finding : c.runs[i].screening.findings) {
      report.flags.push_back(fmt::format("Case {}: {}", static_cast<char>('A' + i), finding));
    }
  }
  report.cautions = c.cautions;
  return report;
}

}  // namespace stackbound::cases
