#pragma once
// Loading a case file (YAML, schema documented in docs/case-file.md) into a CaseDefinition.
// Every error names the file, line and column, the field path, the bad value and what is accepted;
// unknown keys are refused with the nearest valid key suggested.

#include <string>
#include <string_view>

#include "stackbound/cases/case_definition.hpp"

namespace stackbound::cases {

// Parses case text; `origin` is the file name used in messages. Throws units::InputError.
CaseDefinition parse_case(std::string_view text, const std::string& origin);

// Reads and parses a case file. Throws units::InputError (also when the file cannot be read).
CaseDefinition load_case(const std::string& path);

}  // namespace stackbound::cases
