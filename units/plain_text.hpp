#pragma once
// Plain text: what an input (a case, fuel, species or readings file, a command-line argument) may
// hold, and how a doubtful text is shown in a message. Plain text is valid UTF-8 without control
// characters other than tab, line feed and carriage return. A stray NUL, C1 or invalid byte would
// otherwise pass the YAML library and reach a report as bytes no JSON reader accepts.

#include <cstddef>
#include <optional>
#include <string>
#include <string_view>

namespace stackbound::units {

// The first offending byte of a text: what is wrong with it and how to mend the file, in words for a
// message ("byte 0xFC is not valid UTF-8", "save the file as UTF-8").
struct TextFault {
  std::size_t offset = 0;
  std::string what;
  std::string remedy;
};

[[nodiscard]] std::optional<TextFault> find_text_fault(std::string_view text);

// "<origin>:<line>:<column>" of byte `offset` of `text`; lines and columns count from 1, columns in bytes.
[[nodiscard]] std::string text_position(std::string_view origin, std::string_view text, std::size_t offset);

// `text` with every byte that is not plain text, and tab, line feed and carriage return, shown as an
// escape (\x00, \u0085, \n), so that a message stays on one line, is plain text itself and
// shows what was really there.
[[nodiscard]] std::string printable(std::string_view text);

// Throws units::InputError "<origin>:<line>:<column>: <what>; <remedy>" at the first fault of `text`.
void require_plain_text(std::string_view text, std::string_view origin);

}  // namespace stackbound::units
