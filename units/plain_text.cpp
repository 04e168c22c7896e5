#include "stackbound/units/plain_text.hpp"

#include <cstdint>

#include <fmt/format.h>

#include "stackbound/units/input_error.hpp"

namespace stackbound::units {
namespace {

// Length of the UTF-8 sequence starting at `i`, or 0 if it is not a valid one (overlong forms,
// surrogates and values above U+10FFFF included).
std::size_t utf8_sequence_length(std::string_view text, std::size_t i) {
  const auto byte = [&](std::size_t k) { return static_cast<unsigned char>(text[k]); };
  const unsigned char lead = byte(i);
  if (lead < 0x80) return 1;
  std::size_t length = 0;
  unsigned char low = 0x80;
  unsigned char high = 0xBF;
  if (lead >= 0xC2 && lead <= 0xDF) length = 2;
  else if (lead >= 0xE0 && lead <= 0xEF) {
    length = 3;
    if (lead == 0xE0) low = 0xA0;
    if (lead == 0xED) high = 0x9F;
  } else if (lead >= 0xF0 && lead <= 0xF4) {
    length = 4;
    if (lead == 0xF0) low = 0x90;
    if (lead == 0xF4) high = 0x8F;
  } else {
    return 0;
  }
  if (i + length > text.size()) return 0;
  if (byte(i + 1) < low || byte(i + 1) > high) return 0;
  for (std::size_t k = 2; k < length; ++k) {
    if (byte(i + k) < 0x80 || byte(i + k) > 0xBF) return 0;
  }
  return length;
}

// The code point of a valid sequence of `length` bytes at `i`.
char32_t code_point(std::string_view text, std::size_t i, std::size_t length) {
  const auto byte = [&](std::size_t k) { return static_cast<unsigned char>(text[i + k]); };
  if (length == 1) return byte(0);
  static constexpr unsigned char kLeadMask[] = {0, 0, 0x1F, 0x0F, 0x07};
  char32_t value = byte(0) & kLeadMask[length];
  for (std::size_t k = 1; k < length; ++k) value = (value << 6) | (byte(k) & 0x3F);
  return value;
}

// C0 controls other than tab, line feed and carriage return; DEL; the C1 controls.
bool is_refused_control(char32_t c) {
  if (c == U'\t' || c == U'\n' || c == U'\r') return false;
  return c < 0x20 || (c >= 0x7F && c <= 0x9F);
}

// "\\xNN" for one byte.
std::string hex_escape(unsigned char byte) {
  return fmt::format("\\x{:02x}", byte);
}

}  // namespace

std::optional<TextFault> find_text_fault(std::string_view text) {
  for (std::size_t i = 0; i < text.size();) {
    const std::size_t length = utf8_sequence_length(text, i);
    if (length == 0) {
      return TextFault{i, fmt::format("byte 0x{:02X} is not valid UTF-8", static_cast<unsigned char>(text[i])),
                       "save the file as UTF-8"};
    }
    const char32_t c = code_point(text, i, length);
    if (is_refused_control(c)) {
      return TextFault{i, fmt::format("control character U+{:04X} is not allowed in a text file",
                                      static_cast<std::uint32_t>(c)),
                       "remove it"};
    }
    i += length;
  }
  return std::nullopt;
}

std::string text_position(std::string_view origin, std::string_view text, std::size_t offset) {
  std::size_t line = 1;
  std::size_t line_start = 0;
  for (std::size_t i = 0; i < offset; ++i) {
    if (text[i] == '\n') {
      ++line;
      line_start = i + 1;
    }
  }
  return fmt::format("{}:{}:{}", origin, line, offset - line_start + 1);
}

std::string printable(std::string_view text) {
  std::string shown;
  shown.reserve(text.size());
  for (std::size_t i = 0; i < text.size();) {
    const std::size_t length = utf8_sequence_length(text, i);
    if (length == 0) {
      shown += hex_escape(static_cast<unsigned char>(text[i]));
      ++i;
      continue;
    }
    const char32_t c = code_point(text, i, length);
    if (c == U'\n') shown += "\\n";
    else if (c == U'\t') shown += "\\t";
    else if (c == U'\r') shown += "\\r";
    else if (c < 0x80 && is_refused_control(c)) shown += hex_escape(static_cast<unsigned char>(c));
    else if (is_refused_control(c)) shown += fmt::format("\\u{:04x}", static_cast<std::uint32_t>(c));
    else shown.append(text.substr(i, length));
    i += length;
  }
  return shown;
}

void require_plain_text(std::string_view text, std::string_view origin) {
  if (const std::optional<TextFault> fault = find_text_fault(text)) {
    throw InputError(
        fmt::format("{}: {}; {}", text_position(origin, text, fault->offset), fault->what, fault->remedy));
  }
}

}  // namespace stackbound::units
