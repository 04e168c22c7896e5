#pragma once
// The last stage of a run (pipeline.hpp), document: its result as a report document (rendered by
// render/).

#include "stackbound/cases/pipeline.hpp"
#include "stackbound/cases/provenance.hpp"
#include "stackbound/cases/report_document.hpp"

namespace stackbound::cases {

// The wording every output of a run carries for the CO and NO figures.
inline constexpr const char* kBoundStatement = "equilibrium bound at the stated firing conditions";

// `provenance` goes into the summary (tool version, run time, case file SHA-256).
Report run_document(const RunResult& result, const Provenance& provenance);

}  // namespace stackbound::cases
