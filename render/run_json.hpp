#pragma once
// A run's result as JSON with stable keys (documented in docs/report-json.md).

#include <nlohmann/json.hpp>

#include "stackbound/cases/pipeline.hpp"
#include "stackbound/cases/provenance.hpp"

namespace stackbound::render {

// {version, run_at, case_sha256}: the `provenance` object of every JSON output.
nlohmann::json provenance_json(const cases::Provenance& provenance);

nlohmann::json run_json(const cases::RunResult& result, const cases::Provenance& provenance);

}  // namespace stackbound::render
