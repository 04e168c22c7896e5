#pragma once
// Reads species data in the project's YAML schema (stackbound-species/1, see core/data/species.yaml
// and DEVELOPERS.md). Errors name the origin (file), line and column, the field and the rule.

#include <string>
#include <string_view>
#include <vector>

#include "stackbound/core/species.hpp"
#include "stackbound/core/species_database.hpp"

namespace stackbound::cases {

// Parses YAML text; `origin` is the file name used in messages.
std::vector<core::Species> parse_species_yaml(std::string_view text, std::string_view origin);

// Reads a file; throws units::InputError if it cannot be read or parsed.
std::vector<core::Species> read_species_file(const std::string& path);

// The built-in data compiled into the binary (core/data/species.yaml), parsed once.
const core::SpeciesDatabase& builtin_species();

// The built-in data plus the user's file (if `user_file` is non-empty); user records replace
// built-in ones of the same formula.
core::SpeciesDatabase species_database(const std::string& user_file);

}  // namespace stackbound::cases
