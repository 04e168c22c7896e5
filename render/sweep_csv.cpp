#include "stackbound/render/sweep_csv.hpp"

#include <algorithm>
#include <array>
#include <charconv>
#include <cmath>
#include <iterator>
#include <string>

#include <fmt/format.h>

#include "stackbound/cases/run_document.hpp"
#include "stackbound/cases/run_metrics.hpp"
#include "stackbound/render/finite_figures.hpp"
#include "stackbound/emissions/cautions.hpp"
#include "stackbound/render/csv_cell.hpp"

namespace stackbound::render {

using namespace stackbound::cases;

SweepCsvWriter::SweepCsvWriter(Sink sink, const std::vector<VarySpec>& vary,
                               const std::vector<emissions::Caution>& cautions, const Provenance& provenance)
    : sink_(std::move(sink)), vary_(vary) {
  sink_(fmt::format("# stackbound sweep: CO and NO figures are the {}; screening estimates, not measurements.\n",
                    kBoundStatement));
  sink_("# provenance: " + provenance_line(provenance) + "\n");
  for (const emissions::Caution c : cautions) {
    sink_("# caution: " + std::string(emissions::caution(c).text) + "\n");
  }
}

void SweepCsvWriter::add(const SweepPoint& point) {
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

void SweepCsvWriter::finish() {
  if (!header_written_) {
    write_header(nullptr);
    for (const SweepPoint& earlier : pending_) write_row(earlier);
  }
}

void SweepCsvWriter::write_header(const RunResult* first) {
  std::string line = "point";
  for (const VarySpec& v : vary_) line += "," + csv_cell(sweep_parameter_label(v.parameter));
  line += ",status";
  if (first != nullptr) {
    const bool reference_o2_varies = std::any_of(
        vary_.begin(), vary_.end(), [](const VarySpec& v) { return v.parameter == SweepParameter::reference_o2; });
    columns_ = run_metric_columns(*first, reference_o2_varies);
    for (const MetricColumn& column : columns_) line += "," + csv_cell(column.header);
  }
  line += ",error\n";
  sink_(line);
  header_written_ = true;
}

void SweepCsvWriter::write_row(const SweepPoint& point) {
  fmt::memory_buffer line;
  fmt::format_to(std::back_inserter(line), "{}", point.index + 1);
  for (std::size_t k = 0; k < vary_.size(); ++k) {
    fmt::format_to(std::back_inserter(line), ",{:.10g}", sweep_parameter_display(vary_[k].parameter, point.values[k]));
  }
  if (point.result) {
    fmt::format_to(std::back_inserter(line), ",ok");
    const std::vector<double> values = run_metric_values(*point.result);
    for (std::size_t m = 0; m < values.size(); ++m) {
      const double value = values[m];
      if (is_missing(columns_[m], value)) {
        line.push_back(',');  // an estimate or ceiling this point does not have: an empty cell
        continue;
      }
      if (!std::isfinite(value)) {
        throw NonFiniteFigure(fmt::format("sweep point {}: figure {} of the row is not finite", point.index + 1, m + 1));
      }
      // to_chars: the same 8 significant digits as "{:.8g}", at a fraction of the cost per row.
      std::array<char, 32> digits{};
      const auto end = std::to_chars(digits.data(), digits.data() + digits.size(), value, std::chars_format::general, 8).ptr;
      line.push_back(',');
      line.append(digits.data(), end);
    }
    fmt::format_to(std::back_inserter(line), ",\n");
  } else {
    fmt::format_to(std::back_inserter(line), ",failed{},{}\n", std::string(columns_.size(), ','), csv_cell(point.error));
  }
  sink_(std::string_view(line.data(), line.size()));
}

}  // namespace stackbound::render
