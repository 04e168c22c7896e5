#pragma once
// The `equilibrium --format json` document (keys in docs/report-json.md), shared by the command line
// and the Python module.

#include <nlohmann/json.hpp>

#include "stackbound/cases/equilibrium_query.hpp"

namespace stackbound::render {

nlohmann::json equilibrium_json(const cases::EquilibriumAnswer& answer);

}  // namespace stackbound::render
