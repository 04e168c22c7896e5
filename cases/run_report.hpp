#pragma once
// A run's result as a report document (text, CSV, HTML renderers in emissions/) and as JSON with
// stable keys (documented in docs/report-json.md).

#include <nlohmann/json.hpp>

#include "stackbound/cases/runner.hpp"
#include "stackbound/emissions/report.hpp"

namespace stackbound::cases {

// The wording every output of a run carries for the CO and NO figures.
inline constexpr const char* kBoundStatement = "equilibrium bound at the stated firing conditions";

emissions::Report run_report(const RunResult& result);
nlohmann::json run_json(const RunResult& result);

// Renders in one of "text", "json", "csv", "html".
std::string render_run(const RunResult& result, const std::string& format);

}  // namespace stackbound::cases
