#pragma once
// The last stage of a run (pipeline.hpp), document: its result as a report document (rendered by
// render/).

#include "stackbound/cases/pipeline.hpp"
#include "stackbound/cases/report_document.hpp"

namespace stackbound::cases {

// The wording every output of a run carries for the CO and NO figures.
inline constexpr const char* kBoundStatement = "equilibrium bound at the stated firing conditions";

Report run_document(const RunResult& result);

}  // namespace stackbound::cases
