#pragma once
// Warnings as JSON: a list of {"field", "value", "message"} objects (docs/report-json.md).

#include <vector>

#include <nlohmann/json.hpp>

#include "stackbound/units/warning.hpp"

namespace stackbound::render {

nlohmann::json warnings_json(const std::vector<units::Warning>& warnings);

}  // namespace stackbound::render
