#include "stackbound/cases/comparison.hpp"

#include <fmt/format.h>

#include <algorithm>
#include <cmath>

#include "stackbound/cases/case_file.hpp"
#include "stackbound/cases/run_document.hpp"
#include "stackbound/emissions/cautions.hpp"
#include "stackbound/emissions/reference_correction.hpp"
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

bool depends_on_reference_basis(const MetricColumn& column) { return column.key.ends_with("_at_ref_o2"); }

namespace {

std::string basis_label(const RunResult& run) {
  const EmissionFigures& f = run.emissions;
  return fmt::format("@ {} % O2 ({} % air), normal {}", emissions::percent_text(f.reference_o2_dry),
                     emissions::o2_basis_percent(f.o2_basis), f.normal->key);
}

std::string pollutant_list(const RunResult& run) {
  std::vector<std::string> names;
  for (const PollutantBound& p : run.emissions.pollutants) names.push_back(p.name);
  return fmt::format("{}", fmt::join(names, ", "));
}

// The union of the runs' columns (the first run's order, then what later runs add), each run's
// values in that order, kMissingFigure where a run lacks a column.
void align(Comparison& c) {
  std::vector<std::vector<MetricColumn>> columns;
  for (const RunResult& run : c.runs) columns.push_back(run_metric_columns(run, c.bases_differ));
  for (const std::vector<MetricColumn>& run_columns : columns) {
    for (const MetricColumn& column : run_columns) {
      const bool known =
          std::any_of(c.columns.begin(), c.columns.end(), [&](const MetricColumn& k) { return k.key == column.key; });
      if (!known) c.columns.push_back(column);
    }
  }
  for (std::size_t i = 0; i < c.runs.size(); ++i) {
    const std::vector<double> run_values = run_metric_values(c.runs[i]);
    std::vector<double> values;
    for (MetricColumn& column : c.columns) {
      const auto found = std::find_if(columns[i].begin(), columns[i].end(),
                                      [&](const MetricColumn& k) { return k.key == column.key; });
      if (found == columns[i].end()) {
        column.may_be_missing = true;
        values.push_back(kMissingFigure);
      } else {
        values.push_back(run_values[static_cast<std::size_t>(found - columns[i].begin())]);
      }
    }
    c.values.push_back(std::move(values));
  }
}

}  // namespace

Comparison compare(const std::vector<std::string>& files, const core::SpeciesDatabase& database) {
  Comparison comparison;
  for (const std::string& file : files) {
    LoadedCase loaded = load_case_file(file);
    comparison.runs.push_back(with_positions(loaded.sources, [&] { return run_case(std::move(loaded.definition), database); }));
  }
  comparison.cautions = cautions_of(comparison.runs);
  for (const RunResult& run : comparison.runs) comparison.bases.push_back(basis_label(run));
  comparison.bases_differ = std::any_of(comparison.bases.begin(), comparison.bases.end(),
                                        [&](const std::string& b) { return b != comparison.bases.front(); });
  align(comparison);
  const RunResult& first = comparison.runs.front();
  for (std::size_t i = 1; i < comparison.runs.size(); ++i) {
    const RunResult& run = comparison.runs[i];
    if (pollutant_list(run) != pollutant_list(first)) {
      comparison.flags.push_back(fmt::format(
          "Case {} ({}) reports {}; case A ({}) reports {}: the cases are compared on the union of their pollutants, "
          "with \"-\" where a case does not report one.",
          static_cast<char>('A' + i), run.definition.origin, pollutant_list(run), first.definition.origin,
          pollutant_list(first)));
    }
  }
  if (comparison.bases_differ) {
    std::vector<std::string> bases;
    for (std::size_t i = 0; i < comparison.runs.size(); ++i) {
      bases.push_back(fmt::format("{} {}", static_cast<char>('A' + i), comparison.bases[i]));
    }
    comparison.flags.push_back(fmt::format(
        "The cases are on different reference bases ({}): each case's figures at the reference O2 are on its own "
        "basis, named in its column, and are not differenced; compare ppmvd, kg/h or lb/MMBtu across them.",
        fmt::join(bases, "; ")));
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
  for (std::size_t i = 0; i < c.runs.size(); ++i) {
    table.columns.push_back(fmt::format("{} [{}]", static_cast<char>('A' + i), c.bases[i]));
  }
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
      if (is_missing(c.columns[k], c.values[i][k]) || is_missing(c.columns[k], first[k]) ||
          (c.bases_differ && depends_on_reference_basis(c.columns[k]))) {
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
