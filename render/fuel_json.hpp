#pragma once
// The `fuel --format json` document (keys in docs/report-json.md), shared by the command line and the
// Python module.

#include <string>

#include <nlohmann/json.hpp>

#include "stackbound/cases/fuel_query.hpp"

namespace stackbound::render {

nlohmann::json fuel_json(const cases::FuelAnswer& answer);

}  // namespace stackbound::render
