#pragma once
// A run's result as JSON with stable keys (documented in docs/report-json.md).

#include <nlohmann/json.hpp>

#include "stackbound/cases/pipeline.hpp"

namespace stackbound::render {

nlohmann::json run_json(const cases::RunResult& result);

}  // namespace stackbound::render
