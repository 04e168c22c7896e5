#pragma once
// Loading a YAML document (case, fuel or species file) so that nothing the YAML library would accept
// in silence or throw in its own words reaches a reader: before parsing, the text must be plain text
// (require_plain_text: UTF-8 without stray control characters) and nest at most kMaxYamlNesting
// brackets deep; after parsing, every mapping key must be a plain scalar and appear once. Every
// refusal is a units::InputError "<origin>:<line>:<column>: ...".

#include <cstddef>
#include <string>
#include <string_view>

#include <yaml-cpp/yaml.h>

namespace stackbound::cases {

// Deepest nesting of lists and mappings a document may have; our deepest schema has 4 levels.
inline constexpr std::size_t kMaxYamlNesting = 64;

[[nodiscard]] YAML::Node load_yaml_document(std::string_view text, std::string_view origin);

}  // namespace stackbound::cases
