#pragma once
// The command-line notation for compositions (a contract other tools rely on; docs/composition-notation.md).
//
// Reactants, as combustion engineers write them: terms joined by "+", each an optional coefficient
// (moles) and a formula:
//   "CH4 + 2.4 O2 + 9.03 N2"      "C(gr) + O2"      "H2 + .5 O2 + 1.88 N2"      "CH4 + 1e-3 NO"
//  - The coefficient is a plain decimal number ("9.03", ".5", "5.", exponent allowed: "1e-3",
//    "2.5E+1": a "+" right after the "e" of a number, before a digit, is its sign, not a separator); it
//    must be finite and > 0; without one the coefficient is 1. It must be followed by at least one
//    blank: "2O2" is refused with the hint "2 O2" (a formula may end in digits, so "CH42O2" could not
//    be read back; the blank removes every doubt).
//  - A formula begins with a letter and runs to the next blank or "+"; it is the formula as in the
//    species data (case-sensitive: CO2, NO, Ar, C(gr), n-C4H10). Formulas holding "+" or "," cannot
//    be written in this notation.
//  - Blanks around "+" are optional ("CH4+2.4 O2" reads like "CH4 + 2.4 O2").
//  - Each species at most once: a repeated formula is refused (write "2 CH4", not "CH4 + CH4").
//  - No groups in parentheses: "CH4 + 2 (O2 + 3.76 N2)" is refused with the terms multiplied out
//    ("CH4 + 2 O2 + 7.52 N2").
// Analyses, as printed on a gas certificate or a fuel laboratory's report: items separated by ",",
// each a name, a percentage and "%":
//   "CH4 95 %, C2H6 3 %, N2 2 %"      "C 75 %, H 5 %, O 6.7 %, N 1.5 %, S 2.3 %, ash 9.5 %, moisture 8 %"
//  - The "%" is required (blanks before it optional: "95%"); the number is a plain decimal number
//    >= 0 (exponent allowed). Each name at most once.
// Numbers are read with std::from_chars: no locale, decimal point ".", no thousands separators.
// The former NAME=VALUE lists ("CH4=1, O2=2.4", "CH4=95, C2H6=3") are refused with their rewriting in
// this notation.
//
// Every error is a units::InputError naming the field, the whole text, the term or item (its number and
// the column where it starts, counted from 1), what is wrong and what is accepted, e.g.
//   --feed = "CH4 + 2O2": term 2 "2O2" (column 7): the coefficient "2" must be followed by a blank:
//   write "2 O2"; reactants are [moles] FORMULA terms joined by "+", e.g. "CH4 + 2.4 O2 + 9.03 N2"

#include <span>
#include <string>
#include <string_view>
#include <utility>
#include <vector>

#include "stackbound/core/element_amounts.hpp"
#include "stackbound/core/species_database.hpp"

namespace stackbound::core {

// The example shown in reactant messages.
inline constexpr std::string_view kReactantsExample = "CH4 + 2.4 O2 + 9.03 N2";

// "CH4 + 2.4 O2 + 9.03 N2" -> {CH4, 1}, {O2, 2.4}, {N2, 9.03}, in the order written. Checks the notation
// only; the formulas are not looked up.
[[nodiscard]] std::vector<SpeciesAmount> parse_reactants(std::string_view text, std::string_view field);
// The same, and every formula must be a species of `database` (unknown ones are refused with their
// term, a did-you-mean suggestion and the known species).
[[nodiscard]] std::vector<SpeciesAmount> parse_reactants(std::string_view text, std::string_view field,
                                                         const SpeciesDatabase& database);

// What an analysis may hold: the accepted names and the example shown in messages.
struct AnalysisVocabulary {
  std::vector<std::string> names;  // accepted names, case-sensitive; empty: any name
  std::string kind = "species";    // what a name is, for messages: "species", "component"
  std::string example = "CH4 95 %, C2H6 3 %, N2 2 %";
};

// Gas analyses: the names are the species of `database` (a condensed one is refused later, by
// Fuel::gas, with its own message).
[[nodiscard]] AnalysisVocabulary gas_analysis_vocabulary(const SpeciesDatabase& database);
// Ultimate analyses: C, H, O, N, S, ash, moisture.
[[nodiscard]] AnalysisVocabulary ultimate_analysis_vocabulary();

// "CH4 95 %, C2H6 3 %, N2 2 %" -> {CH4, 95}, {C2H6, 3}, {N2, 2} (percent, in the order written).
// Checks the notation and the names; whether the percentages add up to 100 is the caller's rule.
[[nodiscard]] std::vector<std::pair<std::string, double>> parse_analysis(std::string_view text, std::string_view field,
                                                                         const AnalysisVocabulary& vocabulary = {});

}  // namespace stackbound::core
