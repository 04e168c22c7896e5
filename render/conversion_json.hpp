#pragma once
// The `convert --format json` document (keys in docs/report-json.md), shared by the command line and
// the Python module.

#include <nlohmann/json.hpp>

#include "stackbound/cases/conversion_query.hpp"

namespace stackbound::render {

nlohmann::json conversion_json(const cases::ConversionAnswer& answer);

}  // namespace stackbound::render
