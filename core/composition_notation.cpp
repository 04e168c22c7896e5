#include "stackbound/core/composition_notation.hpp"

#include <fmt/format.h>
#include <fmt/ranges.h>

#include <algorithm>
#include <charconv>
#include <cmath>
#include <optional>
#include <system_error>

#include "stackbound/units/input_error.hpp"
#include "stackbound/units/nearest_name.hpp"
#include "stackbound/units/quantity_parser.hpp"

namespace stackbound::core {

namespace {

constexpr std::string_view kBlanks = " \t\r\n\f\v";

// What the parse is reading, for messages.
struct Notation {
  std::string_view field;
  std::string_view text;
  std::string_view piece;  // "term" or "item"
  char separator = '+';
  std::string accepted;  // the closing "; ..." of a syntax message
};

Notation reactant_notation(std::string_view text, std::string_view field) {
  return {field, text, "term", '+',
          fmt::format("reactants are [moles] FORMULA terms joined by \"+\", e.g. \"{}\"", kReactantsExample)};
}

Notation analysis_notation(std::string_view text, std::string_view field, const AnalysisVocabulary& vocabulary) {
  return {field, text, "item", ',',
          fmt::format("an analysis is NAME PERCENT % items separated by \",\", e.g. \"{}\"", vocabulary.example)};
}

// A term or an item: its text without surrounding blanks, its number (from 1), the column where it
// starts (from 1; for an empty piece the column of the separator before it, or after it for the first)
// and the columns of the separators around it (0: none).
struct Piece {
  std::string_view text;
  std::size_t number = 0;
  std::size_t column = 0;
  std::size_t separator_before = 0;
  std::size_t separator_after = 0;
};

bool is_letter(char c) { return (c >= 'A' && c <= 'Z') || (c >= 'a' && c <= 'z'); }
bool is_digit(char c) { return c >= '0' && c <= '9'; }

// True when the "+" at `i` is the sign of an exponent ("1e+3": "e" after a word of digits and points,
// a digit after the sign), not a separator between terms.
bool is_exponent_sign(std::string_view text, std::size_t i) {
  if (i < 2 || i + 1 >= text.size() || (text[i - 1] != 'e' && text[i - 1] != 'E') || !is_digit(text[i + 1])) {
    return false;
  }
  std::size_t begin = i - 1;
  bool digits = false;
  while (begin > 0 && (is_digit(text[begin - 1]) || text[begin - 1] == '.')) {
    digits = digits || is_digit(text[begin - 1]);
    --begin;
  }
  return digits && (begin == 0 || kBlanks.find(text[begin - 1]) != std::string_view::npos || text[begin - 1] == '+');
}

// The next separator at or after `from` (text.size() if none); a "+" of an exponent does not count.
std::size_t next_separator(std::string_view text, char separator, std::size_t from) {
  std::size_t at = text.find(separator, from);
  while (separator == '+' && at != std::string_view::npos && is_exponent_sign(text, at)) {
    at = text.find(separator, at + 1);
  }
  return std::min(at, text.size());
}

std::vector<Piece> split(std::string_view text, char separator) {
  std::vector<Piece> pieces;
  std::size_t start = 0;
  while (start <= text.size()) {
    const std::size_t end = next_separator(text, separator, start);
    Piece piece;
    piece.number = pieces.size() + 1;
    piece.separator_before = start == 0 ? 0 : start;  // column of text[start - 1] is start
    piece.separator_after = end < text.size() ? end + 1 : 0;
    const std::string_view raw = text.substr(start, end - start);
    const std::size_t first = raw.find_first_not_of(kBlanks);
    if (first == std::string_view::npos) {
      piece.column = piece.separator_before != 0 ? piece.separator_before : piece.separator_after;
    } else {
      piece.text = raw.substr(first, raw.find_last_not_of(kBlanks) - first + 1);
      piece.column = start + first + 1;
    }
    pieces.push_back(piece);
    start = end + 1;
  }
  return pieces;
}

std::vector<std::string_view> words(std::string_view text) {
  std::vector<std::string_view> result;
  std::size_t start = text.find_first_not_of(kBlanks);
  while (start != std::string_view::npos) {
    const std::size_t end = std::min(text.find_first_of(kBlanks, start), text.size());
    result.push_back(text.substr(start, end - start));
    start = text.find_first_not_of(kBlanks, end);
  }
  return result;
}

// A number starts with a digit, "." or "-" followed by a digit or "." (so "inf", "nan" and "-x" do not).
bool starts_number(std::string_view w) {
  if (w.empty()) return false;
  if (is_digit(w.front()) || w.front() == '.') return true;
  return w.front() == '-' && w.size() > 1 && (is_digit(w[1]) || w[1] == '.');
}

// The decimal number at the start of `w` ("9.03", ".5", "1e-3", "-2"), read without locale.
struct Number {
  double value = 0.0;
  std::size_t length = 0;
  bool out_of_range = false;
};

std::optional<Number> read_number(std::string_view w) {
  if (!starts_number(w)) return std::nullopt;
  double value = 0.0;
  const auto [end, error] = std::from_chars(w.data(), w.data() + w.size(), value, std::chars_format::general);
  if (error == std::errc::invalid_argument) return std::nullopt;
  return Number{value, static_cast<std::size_t>(end - w.data()), error == std::errc::result_out_of_range};
}

// The whole word as a number, or nothing.
std::optional<Number> whole_number(std::string_view w) {
  const auto number = read_number(w);
  if (!number || number->length != w.size()) return std::nullopt;
  return number;
}

std::string located(const Notation& n, const Piece& piece) {
  return fmt::format("{} = \"{}\": {} {} \"{}\" (column {})", n.field, n.text, n.piece, piece.number, piece.text,
                     piece.column);
}

[[noreturn]] void refuse(const Notation& n, const Piece& piece, const std::string& problem) {
  throw units::InputError(fmt::format("{}: {}; {}", located(n, piece), problem, n.accepted));
}

[[noreturn]] void refuse_empty_piece(const Notation& n, const Piece& piece, std::size_t count) {
  if (count == 1) throw units::InputError(fmt::format("{} = \"{}\": empty; {}", n.field, n.text, n.accepted));
  std::string where;
  if (piece.number == 1) {
    where = fmt::format("nothing before the first \"{}\" (column {})", n.separator, piece.separator_after);
  } else if (piece.number == count) {
    where = fmt::format("nothing after the last \"{}\" (column {}): remove the trailing \"{}\"", n.separator,
                        piece.separator_before, n.separator);
  } else {
    where = fmt::format("nothing between the \"{}\" at column {} and the one at column {}", n.separator,
                        piece.separator_before, piece.separator_after);
  }
  throw units::InputError(
      fmt::format("{} = \"{}\": {} {} is empty: {}; {}", n.field, n.text, n.piece, piece.number, where, n.accepted));
}

// Column (from 1) of the first `c` in the text, for messages.
std::size_t column_of(std::string_view text, char c) { return text.find(c) + 1; }

std::string_view trimmed(std::string_view s) {
  const std::size_t first = s.find_first_not_of(kBlanks);
  if (first == std::string_view::npos) return {};
  return s.substr(first, s.find_last_not_of(kBlanks) - first + 1);
}

// An amount of the former notation ("2.4", "1 kmol", "500 mol") as the coefficient in mol it is now;
// a text that is not an amount stays as written.
std::string old_amount_in_mol(std::string_view value) {
  if (whole_number(value)) return std::string(value);
  try {
    const double moles =
        units::parse_quantity(value, "", {units::Dimension::dimensionless, units::Dimension::amount}).value_si;
    return fmt::format("{:.15g}", moles);
  } catch (const units::InputError&) {
    return std::string(value);
  }
}

// The NAME=VALUE list of the former notation, rewritten: "CH4=1, O2=2.4" -> "CH4 + 2.4 O2" (reactants)
// or "CH4=95, C2H6=3" -> "CH4 95 %, C2H6 3 %" (analyses).
std::string rewritten_old_form(std::string_view text, bool reactants) {
  std::string result;
  for (const Piece& item : split(text, ',')) {
    if (item.text.empty()) continue;
    const std::size_t equals = item.text.find('=');
    std::string term(item.text);
    if (equals != std::string_view::npos) {
      const std::string_view name = trimmed(item.text.substr(0, equals));
      std::string_view value = trimmed(item.text.substr(equals + 1));
      if (!value.empty() && value.back() == '%') value = trimmed(value.substr(0, value.size() - 1));
      if (reactants) {
        term = fmt::format("{} {}", old_amount_in_mol(value), name);
        if (term.starts_with("1 ")) term.erase(0, 2);
      } else {
        term = fmt::format("{} {} %", name, value);
      }
    }
    if (!result.empty()) result += reactants ? " + " : ", ";
    result += term;
  }
  return result;
}

void refuse_old_form(const Notation& n, bool reactants) {
  const std::size_t equals = n.text.find('=');
  if (equals == std::string_view::npos) return;
  throw units::InputError(
      fmt::format("{} = \"{}\": the NAME={} form is not accepted; write \"{}\" (found \"=\" at "
                  "column {}; {})",
                  n.field, n.text, reactants ? "AMOUNT" : "PERCENT", rewritten_old_form(n.text, reactants), equals + 1,
                  n.accepted));
}

// "1,5 O2", "CH4 9,5 %": a comma between digits, the word before it a number, is a decimal comma.
void refuse_decimal_comma(const Notation& n) {
  const std::string_view t = n.text;
  for (std::size_t i = t.find(','); i != std::string_view::npos; i = t.find(',', i + 1)) {
    if (i + 1 >= t.size() || !is_digit(t[i + 1])) continue;
    std::size_t begin = i;
    while (begin > 0 && (is_digit(t[begin - 1]) || t[begin - 1] == '.')) --begin;
    if (begin == i || (begin > 0 && kBlanks.find(t[begin - 1]) == std::string_view::npos && t[begin - 1] != '+' &&
                       t[begin - 1] != ',')) {
      continue;
    }
    std::size_t end = i + 1;
    while (end < t.size() && (is_digit(t[end]) || t[end] == '.')) ++end;
    const std::string_view number = t.substr(begin, end - begin);
    std::string hint;
    if (number.find('.') != std::string_view::npos) {
      std::string plain;
      for (const char c : number) {
        if (c != ',') plain += c;
      }
      hint = fmt::format("write numbers without thousands separators (\"{}\")", plain);
    } else {
      hint = fmt::format("write the decimal point as \".\" (\"{}.{}\"), and no thousands separators",
                         t.substr(begin, i - begin), t.substr(i + 1, end - i - 1));
    }
    throw units::InputError(
        fmt::format("{} = \"{}\": \",\" at column {} in \"{}\": {}; {}", n.field, t, i + 1, number, hint, n.accepted));
  }
}

// ---------------------------------------------------------------------------------------------------
// Reactants

// Reactants separated by commas instead of "+": "CH4, 2 O2" -> "CH4 + 2 O2".
void refuse_commas(const Notation& n) {
  if (n.text.find(',') == std::string_view::npos) return;
  std::string rewritten;
  for (const Piece& piece : split(n.text, ',')) {
    if (piece.text.empty()) continue;
    if (!rewritten.empty()) rewritten += " + ";
    rewritten += piece.text;
  }
  throw units::InputError(
      fmt::format("{} = \"{}\": \",\" at column {}: terms are joined by \"+\", not \",\"; write "
                  "\"{}\" ({})",
                  n.field, n.text, column_of(n.text, ','), rewritten, n.accepted));
}

void require_formula(const Notation& n, const Piece& piece, std::string_view formula) {
  if (is_letter(formula.front())) return;
  if (starts_number(formula))
    refuse(n, piece, fmt::format("\"{}\" is a second number; one coefficient per term", formula));
  refuse(n, piece, fmt::format("\"{}\" is not a formula: a formula begins with a letter", formula));
}

SpeciesAmount coefficient_and_formula(const Notation& n, const Piece& piece, std::string_view first,
                                      std::string_view formula) {
  const auto number = whole_number(first);
  if (!number) refuse(n, piece, fmt::format("the coefficient \"{}\" is not a plain decimal number", first));
  if (number->out_of_range || !std::isfinite(number->value)) {
    refuse(n, piece, fmt::format("the coefficient \"{}\" is out of range", first));
  }
  if (number->value <= 0.0) {
    refuse(n, piece,
           fmt::format("the coefficient \"{}\" must be > 0 mol{}", first,
                       number->value == 0.0 ? " (leave the species out instead)" : ""));
  }
  require_formula(n, piece, formula);
  return {std::string(formula), number->value};
}

// One term: "2.4 O2", "CH4", "C(gr)".
SpeciesAmount parse_term(const Notation& n, const Piece& piece) {
  const std::vector<std::string_view> w = words(piece.text);
  if (w.size() == 1) {
    const std::string_view word = w.front();
    if (is_letter(word.front())) return {std::string(word), 1.0};
    const auto number = read_number(word);
    if (number && number->length == word.size()) {
      refuse(n, piece, fmt::format("the coefficient \"{}\" has no formula after it", word));
    }
    if (number && number->length > 0 && (is_letter(word[number->length]) || word[number->length] == '(')) {
      const std::string_view digits = word.substr(0, number->length);
      refuse(n, piece,
             fmt::format("the coefficient \"{}\" must be followed by a blank: write \"{} {}\"", digits, digits,
                         word.substr(number->length)));
    }
    if (starts_number(word)) refuse(n, piece, fmt::format("\"{}\" is not a plain decimal number", word));
    refuse(n, piece, fmt::format("\"{}\" is not a formula: a formula begins with a letter", word));
  }
  if (w.size() == 2) {
    if (is_letter(w[0].front()) && whole_number(w[1])) {
      refuse(n, piece, fmt::format("the coefficient comes before the formula: write \"{} {}\"", w[1], w[0]));
    }
    if (is_letter(w[0].front()) && is_letter(w[1].front())) {
      refuse(n, piece, fmt::format("two formulas in one term: write \"{} + {}\"", w[0], w[1]));
    }
    if (is_letter(w[0].front())) {
      refuse(n, piece, fmt::format("\"{}\" after the formula \"{}\": a formula has no blanks in it", w[1], w[0]));
    }
    return coefficient_and_formula(n, piece, w[0], w[1]);
  }
  refuse(n, piece, fmt::format("{} words; a term is one formula with an optional coefficient before it", w.size()));
}

struct ParsedReactants {
  std::vector<SpeciesAmount> amounts;
  std::vector<Piece> pieces;  // the term of each amount
};

// An amount below 1e-30 of the feed's total is refused: the element balance (held to 1e-10 of each
// element's amount) cannot place it beside the rest, and no plant stream is that pure (common
// practice, no source). Down to that share the solver converges (tests/core/equilibrium_trace_test.cpp).
constexpr double kSmallestShare = 1e-30;

void refuse_vanishing_shares(const Notation& n, const ParsedReactants& parsed) {
  double total = 0.0;
  for (const SpeciesAmount& amount : parsed.amounts) total += amount.moles;
  for (std::size_t i = 0; i < parsed.amounts.size(); ++i) {
    const double share = parsed.amounts[i].moles / total;
    if (share >= kSmallestShare) continue;
    refuse(n, parsed.pieces[i],
           fmt::format("{} is {:.3g} of the feed's {:g} mol; amounts below {:g} of the total cannot be balanced "
                       "beside the rest: leave the species out or raise its amount",
                       parsed.amounts[i].formula, share, total, kSmallestShare));
  }
}

ParsedReactants read_reactants(std::string_view text, std::string_view field);

bool is_blank(char c) { return kBlanks.find(c) != std::string_view::npos; }

// "CH4 + 2 (O2 + 3.76 N2)": a group in parentheses, as air is often written, is refused with the terms
// multiplied out ("CH4 + 2 O2 + 7.52 N2"). A "(" that starts a word opens a group; one inside a
// formula ("C(gr)") does not.
void refuse_groups(const Notation& n) {
  const std::string_view t = n.text;
  for (std::size_t open = 0; open < t.size(); ++open) {
    if (t[open] != '(' || (open > 0 && !is_blank(t[open - 1]) && t[open - 1] != '+')) continue;
    // A group starts a term, or follows its coefficient; "C (gr)" is a formula with a blank in it.
    std::size_t word_end = open;
    while (word_end > 0 && is_blank(t[word_end - 1])) --word_end;
    std::size_t word_begin = word_end;
    while (word_begin > 0 && !is_blank(t[word_begin - 1]) && t[word_begin - 1] != '+') --word_begin;
    const auto factor = whole_number(t.substr(word_begin, word_end - word_begin));
    if (word_end > 0 && t[word_end - 1] != '+' && !factor) continue;
    std::size_t close = std::string_view::npos;
    std::size_t depth = 0;
    for (std::size_t j = open; j < t.size() && close == std::string_view::npos; ++j) {
      if (t[j] == '(') ++depth;
      if (t[j] == ')' && --depth == 0) close = j;
    }
    std::string problem = fmt::format(
        "\"(\" at column {}: groups in parentheses are not accepted; give each species its own coefficient", open + 1);
    if (close != std::string_view::npos) {
      try {
        std::string expanded;
        for (const SpeciesAmount& amount : read_reactants(t.substr(open + 1, close - open - 1), n.field).amounts) {
          const double moles = amount.moles * (factor ? factor->value : 1.0);
          if (!expanded.empty()) expanded += " + ";
          expanded += moles == 1.0 ? amount.formula : fmt::format("{:.12g} {}", moles, amount.formula);
        }
        problem +=
            fmt::format(": write \"{}{}{}\"", t.substr(0, factor ? word_begin : open), expanded, t.substr(close + 1));
      } catch (const units::InputError&) {
        // The group itself is not in the notation: no rewriting to offer.
      }
    }
    throw units::InputError(fmt::format("{} = \"{}\": {} ({})", n.field, t, problem, n.accepted));
  }
}

ParsedReactants read_reactants(std::string_view text, std::string_view field) {
  const Notation n = reactant_notation(text, field);
  refuse_old_form(n, true);
  refuse_decimal_comma(n);
  refuse_commas(n);
  refuse_groups(n);
  ParsedReactants parsed;
  const std::vector<Piece> pieces = split(text, '+');
  for (const Piece& piece : pieces) {
    if (piece.text.empty()) refuse_empty_piece(n, piece, pieces.size());
    SpeciesAmount amount = parse_term(n, piece);
    for (std::size_t i = 0; i < parsed.amounts.size(); ++i) {
      if (parsed.amounts[i].formula != amount.formula) continue;
      refuse(
          n, piece,
          fmt::format("{} is already term {}; give each species once, with its whole amount (\"{:g} {}\")",
                      amount.formula, parsed.pieces[i].number, parsed.amounts[i].moles + amount.moles, amount.formula));
    }
    parsed.amounts.push_back(std::move(amount));
    parsed.pieces.push_back(piece);
  }
  refuse_vanishing_shares(n, parsed);
  return parsed;
}

std::vector<std::string> names_of(const SpeciesDatabase& database) {
  std::vector<std::string> names;
  names.reserve(database.size());
  for (const Species& species : database.all()) names.push_back(species.formula());
  return names;
}

// '<located>: unknown <kind> "X"; did you mean "Y"?; known <kind>: ...'
[[noreturn]] void refuse_unknown_name(const std::string& where, std::string_view name, std::string_view kind,
                                      std::span<const std::string> names) {
  std::string message = fmt::format("{}: unknown {} \"{}\"", where, kind, name);
  if (const auto suggestion = units::nearest_name(name, names))
    message += fmt::format("; did you mean \"{}\"?", *suggestion);
  message += fmt::format("; known {} (case-sensitive): {}", kind, fmt::join(names, ", "));
  throw units::InputError(message);
}

// ---------------------------------------------------------------------------------------------------
// Analyses

std::pair<std::string, double> name_and_percent(const Notation& n, const Piece& piece, std::string_view body) {
  const std::vector<std::string_view> w = words(body);
  if (w.size() == 1 && is_letter(w[0].front())) {
    refuse(n, piece, fmt::format("no percentage after \"{}\" (a blank separates the name from the number)", w[0]));
  }
  if (w.size() == 1) refuse(n, piece, fmt::format("no name before \"{}\"", w[0]));
  if (w.size() != 2) refuse(n, piece, "expected one name and one percentage");
  if (!is_letter(w[0].front()) && is_letter(w[1].front())) {
    refuse(n, piece, fmt::format("the name comes first: write \"{} {} %\"", w[1], w[0]));
  }
  if (!is_letter(w[0].front()))
    refuse(n, piece, fmt::format("\"{}\" is not a name: a name begins with a letter", w[0]));
  const auto number = whole_number(w[1]);
  if (!number) refuse(n, piece, fmt::format("the percentage \"{}\" is not a plain decimal number", w[1]));
  if (number->out_of_range || !std::isfinite(number->value)) {
    refuse(n, piece, fmt::format("the percentage \"{}\" is out of range", w[1]));
  }
  if (number->value < 0.0) refuse(n, piece, fmt::format("the percentage \"{}\" is negative; it must be >= 0", w[1]));
  return {std::string(w[0]), number->value};
}

// One item: "CH4 95 %", "ash 9.5%".
std::pair<std::string, double> parse_item(const Notation& n, const Piece& piece) {
  if (piece.text.find('+') != std::string_view::npos) {
    refuse(n, piece, "items are separated by \",\", not \"+\"");
  }
  if (piece.text.back() != '%') {
    const std::vector<std::string_view> w = words(piece.text);
    if (w.size() == 2 && whole_number(w[1])) {
      refuse(n, piece, fmt::format("the \"%\" is missing: write \"{} {} %\"", w[0], w[1]));
    }
    refuse(n, piece, "an item ends with \"%\"");
  }
  const std::string_view body = trimmed(piece.text.substr(0, piece.text.size() - 1));
  if (!body.empty() && body.back() == '%') refuse(n, piece, "one \"%\" per item, at its end");
  if (body.find('%') != std::string_view::npos) {
    refuse(n, piece, "a \"%\" inside the item: items are separated by \",\"");
  }
  return name_and_percent(n, piece, body);
}

}  // namespace

std::vector<SpeciesAmount> parse_reactants(std::string_view text, std::string_view field) {
  return read_reactants(text, field).amounts;
}

std::vector<SpeciesAmount> parse_reactants(std::string_view text, std::string_view field,
                                           const SpeciesDatabase& database) {
  const ParsedReactants parsed = read_reactants(text, field);
  const Notation n = reactant_notation(text, field);
  for (std::size_t i = 0; i < parsed.amounts.size(); ++i) {
    const std::string& formula = parsed.amounts[i].formula;
    if (database.find(formula) == nullptr) {
      refuse_unknown_name(located(n, parsed.pieces[i]), formula, "species", names_of(database));
    }
  }
  return parsed.amounts;
}

AnalysisVocabulary gas_analysis_vocabulary(const SpeciesDatabase& database) {
  return {names_of(database), "species", "CH4 95 %, C2H6 3 %, N2 2 %"};
}

AnalysisVocabulary ultimate_analysis_vocabulary() {
  return {{"C", "H", "O", "N", "S", "ash", "moisture"},
          "component",
          "C 75 %, H 5 %, O 6.7 %, N 1.5 %, S 2.3 %, ash 9.5 %, moisture 8 %"};
}

std::vector<std::pair<std::string, double>> parse_analysis(std::string_view text, std::string_view field,
                                                           const AnalysisVocabulary& vocabulary) {
  const Notation n = analysis_notation(text, field, vocabulary);
  refuse_old_form(n, false);
  refuse_decimal_comma(n);
  std::vector<std::pair<std::string, double>> items;
  const std::vector<Piece> pieces = split(text, ',');
  for (std::size_t i = 0; i < pieces.size(); ++i) {
    const Piece& piece = pieces[i];
    if (piece.text.empty()) refuse_empty_piece(n, piece, pieces.size());
    auto item = parse_item(n, piece);
    if (!vocabulary.names.empty() &&
        std::find(vocabulary.names.begin(), vocabulary.names.end(), item.first) == vocabulary.names.end()) {
      refuse_unknown_name(located(n, piece), item.first, vocabulary.kind, vocabulary.names);
    }
    for (std::size_t j = 0; j < items.size(); ++j) {
      if (items[j].first == item.first) {
        refuse(n, piece, fmt::format("{} is already item {}; give each {} once", item.first, j + 1, vocabulary.kind));
      }
    }
    items.push_back(std::move(item));
  }
  return items;
}

}  // namespace stackbound::core
