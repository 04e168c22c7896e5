#pragma once
// A comparison of cases as JSON with stable keys (documented in docs/report-json.md).

#include <nlohmann/json.hpp>

#include "stackbound/cases/comparison.hpp"
#include "stackbound/cases/provenance.hpp"

namespace stackbound::render {

// `provenance` as in run JSON, with `case_sha256` the list of the cases' digests in case order; each
// case also names its own.
nlohmann::json comparison_json(const cases::Comparison& comparison, const cases::Provenance& provenance);

}  // namespace stackbound::render
