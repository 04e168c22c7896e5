#pragma once
// Loading a case file (YAML, schema documented in docs/case-file.md) into a CaseDefinition: every
// quantity, basis, stated limit and measured value is parsed and checked here, so a bad value is
// reported at load. Every error names the file, line and column, the field path, the bad value and
// what is accepted; unknown keys are refused with the nearest valid key suggested.

#include <string>
#include <string_view>

#include <yaml-cpp/yaml.h>

#include "stackbound/cases/case_definition.hpp"
#include "stackbound/cases/source_map.hpp"

namespace stackbound::cases {

// A loaded case and where each of its fields was written. Errors of a run name field paths; run it
// inside with_positions(sources, ...) to report them at their file positions.
struct LoadedCase {
  CaseDefinition definition;
  SourceMap sources;
};

// Parses case text; `origin` is the file name used in messages. Throws units::InputError.
LoadedCase parse_case_file(std::string_view text, const std::string& origin);

// The same for a document built in memory (the Python module's dict); its nodes have no positions, so
// errors read "<origin>: <field path> ...".
LoadedCase read_case_document(const YAML::Node& document, const std::string& origin);

// Reads and parses a case file. Throws units::InputError (also when the file cannot be read).
LoadedCase load_case_file(const std::string& path);

// The same, keeping the definition only (for callers that report no run errors by position).
CaseDefinition parse_case(std::string_view text, const std::string& origin);
CaseDefinition load_case(const std::string& path);

}  // namespace stackbound::cases
