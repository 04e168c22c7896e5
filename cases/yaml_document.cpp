#include "stackbound/cases/yaml_document.hpp"

#include <map>

#include <fmt/format.h>

#include "stackbound/units/input_error.hpp"

namespace stackbound::cases {
namespace {

// Line and column (from 1) of byte `offset` of `text`; columns count bytes.
std::string position(std::string_view origin, std::string_view text, std::size_t offset) {
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

void require_utf8(std::string_view text, std::string_view origin) {
  for (std::size_t i = 0; i < text.size();) {
    const std::size_t length = utf8_sequence_length(text, i);
    if (length == 0) {
      throw units::InputError(fmt::format("{}: byte 0x{:02X} is not valid UTF-8; save the file as UTF-8",
                                          position(origin, text, i), static_cast<unsigned char>(text[i])));
    }
    i += length;
  }
}

// Bracket nesting outside quotes and comments: a deep "[[[[..." would otherwise exhaust the parser.
void require_shallow_nesting(std::string_view text, std::string_view origin) {
  std::size_t depth = 0;
  char quote = 0;
  bool comment = false;
  for (std::size_t i = 0; i < text.size(); ++i) {
    const char c = text[i];
    if (c == '\n') comment = false;
    if (comment) continue;
    if (quote != 0) {
      if (c == quote) quote = 0;
      continue;
    }
    if (c == '"' || c == '\'') quote = c;
    else if (c == '#' && (i == 0 || text[i - 1] == ' ' || text[i - 1] == '\t' || text[i - 1] == '\n')) comment = true;
    else if (c == '[' || c == '{') {
      if (++depth > kMaxYamlNesting) {
        throw units::InputError(fmt::format("{}: lists and mappings nest deeper than {} levels here; a stackbound file "
                                            "needs at most a few",
                                            position(origin, text, i), kMaxYamlNesting));
      }
    } else if ((c == ']' || c == '}') && depth > 0) {
      --depth;
    }
  }
}

std::string mark_text(std::string_view origin, const YAML::Mark& mark) {
  return fmt::format("{}:{}:{}", origin, mark.line + 1, mark.column + 1);
}

// Every key a plain scalar, each once per mapping; nesting (also by indentation) capped.
void check_keys(const YAML::Node& node, std::string_view origin, std::size_t depth) {
  if (depth > kMaxYamlNesting) {
    throw units::InputError(fmt::format("{}: lists and mappings nest deeper than {} levels here",
                                        mark_text(origin, node.Mark()), kMaxYamlNesting));
  }
  if (node.IsSequence()) {
    for (const YAML::Node& item : node) check_keys(item, origin, depth + 1);
    return;
  }
  if (!node.IsMap()) return;
  std::map<std::string, int> first_line;
  for (const auto& entry : node) {
    if (!entry.first.IsScalar()) {
      throw units::InputError(fmt::format("{}: a key must be a plain name, not a list or mapping",
                                          mark_text(origin, entry.first.Mark())));
    }
    const std::string key = entry.first.Scalar();
    const auto [found, inserted] = first_line.emplace(key, entry.first.Mark().line + 1);
    if (!inserted) {
      throw units::InputError(fmt::format("{}: key \"{}\" is given twice (lines {} and {}); keep one",
                                          mark_text(origin, entry.first.Mark()), key, found->second,
                                          entry.first.Mark().line + 1));
    }
    check_keys(entry.second, origin, depth + 1);
  }
}

}  // namespace

YAML::Node load_yaml_document(std::string_view text, std::string_view origin) {
  require_utf8(text, origin);
  require_shallow_nesting(text, origin);
  YAML::Node root;
  try {
    root = YAML::Load(std::string(text));
  } catch (const YAML::ParserException& error) {
    throw units::InputError(fmt::format("{}: not valid YAML: {}", mark_text(origin, error.mark), error.msg));
  } catch (const YAML::Exception& error) {
    throw units::InputError(fmt::format("{}: not valid YAML: {}", origin, error.msg));
  }
  check_keys(root, origin, 0);
  return root;
}

}  // namespace stackbound::cases
