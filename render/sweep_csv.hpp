#pragma once
// A sweep as CSV, written as the points arrive: comment lines (the bound statement and cautions), one
// header line with units, one row a point. The header's result columns come from the first point that
// ran; earlier failed points wait for it (at most 1000 of them).

#include <cstddef>
#include <functional>
#include <string_view>
#include <vector>

#include "stackbound/cases/pipeline.hpp"
#include "stackbound/cases/provenance.hpp"
#include "stackbound/cases/run_metrics.hpp"
#include "stackbound/cases/sweep.hpp"

namespace stackbound::render {

class SweepCsvWriter {
 public:
  using Sink = std::function<void(std::string_view)>;
  // Writes the comment lines at once (the bound statement, `cautions`: cases::sweep_cautions()); `vary`
  // must outlive the writer.
  SweepCsvWriter(Sink sink, const std::vector<cases::VarySpec>& vary, const std::vector<emissions::Caution>& cautions,
                 const cases::Provenance& provenance);

  void add(const cases::SweepPoint& point);
  // Writes the header if no point ran, and the rows still waiting for it.
  void finish();

 private:
  void write_header(const cases::RunResult* first);
  void write_row(const cases::SweepPoint& point);

  Sink sink_;
  const std::vector<cases::VarySpec>& vary_;
  bool header_written_ = false;
  std::vector<cases::MetricColumn> columns_;  // of the first point that ran
  std::vector<cases::SweepPoint> pending_;
};

}  // namespace stackbound::render
