#pragma once
// A run's result in one output format.

#include <string>

#include "stackbound/cases/pipeline.hpp"

namespace stackbound::render {

// Renders in one of "text", "json", "csv", "html".
std::string render_run(const cases::RunResult& result, const std::string& format);

}  // namespace stackbound::render
