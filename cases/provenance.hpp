#pragma once
// The provenance every output carries, so that two people can tell whether they looked at the same
// run: the tool's version (project(VERSION) of the build), the run's date and time (UTC, ISO 8601,
// to the second) and the SHA-256 of the case file's bytes (CaseDefinition::source_sha256).
// The run time is passed in: the command line passes the clock's now, a test a fixed time.

#include <chrono>
#include <string>
#include <vector>

#include "stackbound/cases/case_definition.hpp"

namespace stackbound::cases {

struct Provenance {
  std::string version;      // "0.1.0"
  std::string run_at;       // "2026-12-03T18:49:07Z"
  std::string case_sha256;  // 64 hex digits; of the first case for an output of several
};

// "2026-12-03T18:49:07Z" (UTC, seconds truncated).
[[nodiscard]] std::string format_run_time(std::chrono::system_clock::time_point run_at);

[[nodiscard]] Provenance make_provenance(const CaseDefinition& definition,
                                         std::chrono::system_clock::time_point run_at);

// "stackbound 0.1.0, run at 2026-12-03T18:49:07Z, case file SHA-256 9f86d0...": one line for text
// and CSV outputs.
[[nodiscard]] std::string provenance_line(const Provenance& provenance);

// The label -> value rows that report documents put in their summary.
[[nodiscard]] std::vector<std::pair<std::string, std::string>> provenance_summary(const Provenance& provenance);

}  // namespace stackbound::cases
