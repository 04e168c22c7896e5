#include "stackbound/render/finite_figures.hpp"

#include <cctype>
#include <cmath>
#include <string_view>

namespace stackbound::render {
namespace {

void require_finite_at(const nlohmann::json& value, const std::string& path) {
  if (value.is_number_float() && !std::isfinite(value.get<double>())) {
    throw NonFiniteFigure("the figure at JSON path " + path + " is not finite");
  }
  if (value.is_object()) {
    for (const auto& [key, item] : value.items()) require_finite_at(item, path + "." + key);
  } else if (value.is_array()) {
    for (std::size_t i = 0; i < value.size(); ++i) require_finite_at(value[i], path + "[" + std::to_string(i) + "]");
  }
}

// True if `text` holds "nan" or "inf" (any case) as a word of its own: not inside "information".
bool holds_non_finite_word(std::string_view text) {
  for (const std::string_view word : {std::string_view("nan"), std::string_view("inf")}) {
    for (std::size_t at = 0; at + word.size() <= text.size(); ++at) {
      bool same = true;
      for (std::size_t k = 0; k < word.size() && same; ++k) {
        same = std::tolower(static_cast<unsigned char>(text[at + k])) == word[k];
      }
      const auto letter = [&](std::size_t i) { return std::isalpha(static_cast<unsigned char>(text[i])) != 0; };
      const bool starts_word = at == 0 || !letter(at - 1);
      const bool ends_word = at + word.size() == text.size() || !letter(at + word.size());
      if (same && starts_word && ends_word) return true;
    }
  }
  return false;
}

void require_finite_text(std::string_view text, const std::string& where) {
  if (holds_non_finite_word(text)) {
    throw NonFiniteFigure(where + " holds a figure that is not finite: \"" + std::string(text) + "\"");
  }
}

}  // namespace

void require_finite_json(const nlohmann::json& document) { require_finite_at(document, "$"); }

std::string json_text(const nlohmann::json& document) {
  require_finite_json(document);
  return document.dump(2) + "\n";
}

void require_finite_figures(const cases::Report& report) {
  for (const auto& [label, value] : report.summary) require_finite_text(value, "the summary line \"" + label + "\"");
  for (const cases::ReportTable& table : report.tables) {
    for (const auto& row : table.rows) {
      for (const std::string& cell : row) require_finite_text(cell, "a cell of the table \"" + table.title + "\"");
    }
  }
  for (const std::string& flag : report.flags) require_finite_text(flag, "a flag");
  for (const std::string& warning : report.warnings) require_finite_text(warning, "a warning");
}

}  // namespace stackbound::render
