#pragma once
// A comparison of cases as JSON with stable keys (documented in docs/report-json.md).

#include <nlohmann/json.hpp>

#include "stackbound/cases/comparison.hpp"

namespace stackbound::render {

nlohmann::json comparison_json(const cases::Comparison& comparison);

}  // namespace stackbound::render
