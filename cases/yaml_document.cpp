#include "stackbound/cases/yaml_document.hpp"

#include <map>
#include <optional>

#include <fmt/format.h>

#include "stackbound/units/input_error.hpp"
#include "stackbound/units/plain_text.hpp"

namespace stackbound::cases {
namespace {

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
                                            units::text_position(origin, text, i), kMaxYamlNesting));
      }
    } else if ((c == ']' || c == '}') && depth > 0) {
      --depth;
    }
  }
}

std::string mark_text(std::string_view origin, const YAML::Mark& mark) {
  return fmt::format("{}:{}:{}", origin, mark.line + 1, mark.column + 1);
}

// A scalar's text after its escapes ("\0", "\N" in double quotes) must be plain text as well.
void check_scalar_text(const YAML::Node& scalar, std::string_view origin) {
  if (const std::optional<units::TextFault> fault = units::find_text_fault(scalar.Scalar())) {
    throw units::InputError(fmt::format("{}: an escape in this value (such as \\0 or \\N) gives text that is not "
                                        "plain: {} (byte {} of the value); write the value without it",
                                        mark_text(origin, scalar.Mark()), fault->what, fault->offset + 1));
  }
}

// Every key a plain scalar, each once per mapping; every scalar plain text; nesting (also by
// indentation) capped.
void check_nodes(const YAML::Node& node, std::string_view origin, std::size_t depth) {
  if (depth > kMaxYamlNesting) {
    throw units::InputError(fmt::format("{}: lists and mappings nest deeper than {} levels here",
                                        mark_text(origin, node.Mark()), kMaxYamlNesting));
  }
  if (node.IsScalar()) {
    check_scalar_text(node, origin);
    return;
  }
  if (node.IsSequence()) {
    for (const YAML::Node& item : node) check_nodes(item, origin, depth + 1);
    return;
  }
  if (!node.IsMap()) return;
  std::map<std::string, int> first_line;
  for (const auto& entry : node) {
    if (!entry.first.IsScalar()) {
      throw units::InputError(fmt::format("{}: a key must be a plain name, not a list or mapping",
                                          mark_text(origin, entry.first.Mark())));
    }
    check_scalar_text(entry.first, origin);
    const std::string key = entry.first.Scalar();
    const auto [found, inserted] = first_line.emplace(key, entry.first.Mark().line + 1);
    if (!inserted) {
      throw units::InputError(fmt::format("{}: key \"{}\" is given twice (lines {} and {}); keep one",
                                          mark_text(origin, entry.first.Mark()), key, found->second,
                                          entry.first.Mark().line + 1));
    }
    check_nodes(entry.second, origin, depth + 1);
  }
}

}  // namespace

YAML::Node load_yaml_document(std::string_view text, std::string_view origin) {
  units::require_plain_text(text, origin);
  require_shallow_nesting(text, origin);
  YAML::Node root;
  try {
    root = YAML::Load(std::string(text));
  } catch (const YAML::ParserException& error) {
    throw units::InputError(fmt::format("{}: not valid YAML: {}", mark_text(origin, error.mark), error.msg));
  } catch (const YAML::Exception& error) {
    throw units::InputError(fmt::format("{}: not valid YAML: {}", origin, error.msg));
  }
  check_nodes(root, origin, 0);
  return root;
}

}  // namespace stackbound::cases
