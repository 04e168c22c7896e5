#pragma once
// A reduction of analyser readings (cases/reduction.hpp) in one output format: "csv" (one row per
// period), "json" (keys in docs/report-json.md, "reduce") or "html" (summary, time-series SVG plots,
// the periods table, rules with their sources, warnings, cautions).

#include <string>

#include <nlohmann/json.hpp>

#include "stackbound/cases/reduction_document.hpp"

namespace stackbound::render {

nlohmann::json reduction_json(const cases::ReductionDocument& document);
std::string render_reduction_csv(const cases::ReductionDocument& document);
// The CSV header line and one period's row (for writing rows as they come: ReduceOptions::on_period).
std::string reduction_csv_header(const cases::ReductionDocument& document);
std::string reduction_csv_row(const cases::ReductionDocument& document, const cases::ReductionPeriod& period);
std::string render_reduction_html(const cases::ReductionDocument& document);
// One of "csv", "json", "html".
std::string render_reduction(const cases::ReductionDocument& document, const std::string& format);

}  // namespace stackbound::render
