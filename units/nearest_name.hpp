#pragma once
// "Did you mean ...?" for unknown names (species, case-file keys, units): the candidate with the
// smallest edit distance (Levenshtein, 1966), if it is close enough to be a plausible typo.

#include <optional>
#include <span>
#include <string>
#include <string_view>

namespace stackbound::units {

// Number of single-character insertions, deletions and substitutions turning `a` into `b`.
std::size_t edit_distance(std::string_view a, std::string_view b);

// The closest candidate within max(2, length/3) edits (case-insensitive comparison), or none.
std::optional<std::string> nearest_name(std::string_view name, std::span<const std::string> candidates);

}  // namespace stackbound::units
