#pragma once
// Reading an input file (case, fuel or species file) whole, before any parsing: it must be a regular
// file (not a directory, device or FIFO: /dev/zero would be read forever) no larger than the cap.

#include <cstddef>
#include <string>
#include <string_view>

namespace stackbound::cases {

// 1 MiB: the largest example case is about 3 kB, the built-in species data about 60 kB.
inline constexpr std::size_t kMaxInputFileBytes = std::size_t{1} << 20;

// The file's bytes. Throws units::InputError '<field> = "<path>": <what is wrong>' when the path is
// missing, not a regular file, larger than kMaxInputFileBytes, or unreadable. `kind` names the file
// in messages ("case file", "fuel file", "species file").
[[nodiscard]] std::string read_input_file(const std::string& path, std::string_view field, std::string_view kind);

}  // namespace stackbound::cases
