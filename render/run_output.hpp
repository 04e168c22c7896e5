#pragma once
// A run's result in one output format.

#include <string>

#include "stackbound/cases/pipeline.hpp"
#include "stackbound/cases/provenance.hpp"

namespace stackbound::render {

// Renders in one of "text", "json", "csv", "html".
// Every format carries `provenance` (cases/provenance.hpp).
std::string render_run(const cases::RunResult& result, const std::string& format, const cases::Provenance& provenance);

}  // namespace stackbound::render
