// The composition notation of the command line (docs/composition-notation.md): reactants
// "CH4 + 2.4 O2 + 9.03 N2" and analyses "CH4 95 %, C2H6 3 %". Compositions are invented test mixtures.

#include "stackbound/core/composition_notation.hpp"

#include <gtest/gtest.h>

#include <string>
#include <vector>

#include "stackbound/cases/species_file.hpp"
#include "stackbound/units/input_error.hpp"
#include "tests/support/tolerance.hpp"

namespace stackbound::core {
namespace {

const SpeciesDatabase& db() { return cases::builtin_species(); }

// The message of the InputError `text` raises for --feed, or "" when it parses.
std::string feed_error(const std::string& text) {
  try {
    (void)parse_reactants(text, "--feed", db());
  } catch (const units::InputError& error) {
    return error.what();
  }
  return "";
}

std::string analysis_error(const std::string& text, const std::string& field = "--gas",
                           const AnalysisVocabulary& vocabulary = gas_analysis_vocabulary(db())) {
  try {
    (void)parse_analysis(text, field, vocabulary);
  } catch (const units::InputError& error) {
    return error.what();
  }
  return "";
}

#define EXPECT_CONTAINS(haystack, needle)                          \
  EXPECT_NE(std::string(haystack).find(needle), std::string::npos) \
      << "message: " << (haystack) << "\nexpected: " << (needle)

// ---------------------------------------------------------------------------------------------------
// Reactants

// Wrong if the coefficients were misread or misassigned, or the order of the terms were lost.
TEST(ReactantNotation, ReadsCoefficientsAndFormulasInOrder) {
  const std::vector<SpeciesAmount> feed = parse_reactants("CH4 + 2.4 O2 + 9.03 N2", "--feed", db());
  ASSERT_EQ(feed.size(), 3u);
  EXPECT_EQ(feed[0].formula, "CH4");
  EXPECT_EQ(feed[0].moles, 1.0);
  EXPECT_EQ(feed[1].formula, "O2");
  EXPECT_EQ(feed[1].moles, 2.4);
  EXPECT_EQ(feed[2].formula, "N2");
  EXPECT_EQ(feed[2].moles, 9.03);
}

// Wrong if a term without a coefficient were not 1 mol, or blanks around "+" (or none) mattered.
TEST(ReactantNotation, AnOmittedCoefficientIsOneAndBlanksAroundPlusAreOptional) {
  const std::vector<SpeciesAmount> feed = parse_reactants("  H2+O2 +  \t3 N2 ", "--feed");
  ASSERT_EQ(feed.size(), 3u);
  EXPECT_EQ(feed[0].formula, "H2");
  EXPECT_EQ(feed[0].moles, 1.0);
  EXPECT_EQ(feed[1].formula, "O2");
  EXPECT_EQ(feed[1].moles, 1.0);
  EXPECT_EQ(feed[2].formula, "N2");
  EXPECT_EQ(feed[2].moles, 3.0);
  const std::vector<SpeciesAmount> single = parse_reactants("CO2", "--feed");
  ASSERT_EQ(single.size(), 1u);
  EXPECT_EQ(single[0].moles, 1.0);
}

// Wrong if any accepted decimal form (leading point, trailing point, exponent, also with a "+" sign
// that is not a separator) were misread; the values must be the exact doubles of the text
// (std::from_chars, no locale).
TEST(ReactantNotation, DecimalAndExponentCoefficients) {
  const std::vector<SpeciesAmount> feed = parse_reactants(".5 CH4 + 5. O2 + 1e-3 NO + 2.5E+1 N2", "--feed", db());
  ASSERT_EQ(feed.size(), 4u);
  EXPECT_EQ(feed[0].moles, 0.5);
  EXPECT_EQ(feed[1].moles, 5.0);
  EXPECT_EQ(feed[2].moles, 1e-3);
  EXPECT_EQ(feed[3].moles, 25.0);
  const std::vector<SpeciesAmount> glued = parse_reactants("CH4+1e+1 N2+He", "--feed", db());
  ASSERT_EQ(glued.size(), 3u);
  EXPECT_EQ(glued[1].formula, "N2");
  EXPECT_EQ(glued[1].moles, 10.0);
  EXPECT_EQ(glued[2].formula, "He");
}

// Wrong if formulas with parentheses or hyphens (as in the species data) were split or refused.
TEST(ReactantNotation, FormulasWithParenthesesAndHyphens) {
  const std::vector<SpeciesAmount> feed = parse_reactants("C(gr) + 0.5 O2 + 2 n-C4H10", "--feed", db());
  ASSERT_EQ(feed.size(), 3u);
  EXPECT_EQ(feed[0].formula, "C(gr)");
  EXPECT_EQ(feed[0].moles, 1.0);
  EXPECT_EQ(feed[2].formula, "n-C4H10");
  EXPECT_EQ(feed[2].moles, 2.0);
}

// Wrong if the former NAME=AMOUNT list were read, or the refusal did not show how to write it now.
TEST(ReactantNotation, TheFormerNameEqualsAmountFormIsRefusedWithItsRewriting) {
  EXPECT_CONTAINS(feed_error("CH4=1, O2=2.4"),
                  "--feed = \"CH4=1, O2=2.4\": the NAME=AMOUNT form is not accepted; write \"CH4 + 2.4 O2\"");
  EXPECT_CONTAINS(feed_error("CH4=1, O2=2.4"), "found \"=\" at column 4");
  EXPECT_CONTAINS(feed_error("CH4=1, O2=2, N2=7.52"), "write \"CH4 + 2 O2 + 7.52 N2\"");
  EXPECT_CONTAINS(feed_error("CH4 = 2"), "write \"2 CH4\"");
  // The former form took amounts with a unit; the rewriting gives them in mol.
  EXPECT_CONTAINS(feed_error("CH4=1 kmol, O2=2.4 kmol"), "write \"1000 CH4 + 2400 O2\"");
  EXPECT_CONTAINS(feed_error("CH4=1000 mol, O2=1"), "write \"1000 CH4 + O2\"");
}

// Wrong if an amount too small to balance beside the rest reached the solver (1e-300 O2 beside 1 mol
// CH4 ran 200 iterations and failed to converge), or if the smallest accepted share (1e-30) were refused.
TEST(ReactantNotation, AnAmountBelowTheSmallestShareOfTheFeedIsRefused) {
  EXPECT_EQ(feed_error("CH4 + 1e-300 O2"),
            "--feed = \"CH4 + 1e-300 O2\": term 2 \"1e-300 O2\" (column 7): O2 is 1e-300 of the feed's 1 mol; "
            "amounts below 1e-30 of the total cannot be balanced beside the rest: leave the species out or raise "
            "its amount; reactants are [moles] FORMULA terms joined by \"+\", e.g. \"CH4 + 2.4 O2 + 9.03 N2\"");
  EXPECT_CONTAINS(feed_error("CH4 + 1e300 O2"), "CH4 is 1e-300 of the feed's 1e+300 mol");
  EXPECT_EQ(feed_error("CH4 + 2 O2 + 1e-29 NO"), "");
  EXPECT_EQ(feed_error("1e-300 CH4 + 2e-300 O2"), "");  // tiny amounts in ordinary proportions are fine
}

// Wrong if a coefficient glued to its formula were read (ambiguous: "2O2" vs a formula), or the hint
// did not show the spaced form and where the term is.
TEST(ReactantNotation, ACoefficientMustBeFollowedByABlank) {
  const std::string message = feed_error("CH4 + 2O2");
  EXPECT_CONTAINS(message, "--feed = \"CH4 + 2O2\": term 2 \"2O2\" (column 7)");
  EXPECT_CONTAINS(message, "the coefficient \"2\" must be followed by a blank: write \"2 O2\"");
  EXPECT_CONTAINS(message, "reactants are [moles] FORMULA terms joined by \"+\", e.g. \"CH4 + 2.4 O2 + 9.03 N2\"");
  EXPECT_CONTAINS(feed_error("2.4O2"), "write \"2.4 O2\"");
  EXPECT_CONTAINS(feed_error("3C(gr)"), "write \"3 C(gr)\"");
}

// Wrong if an empty term, a leading or trailing "+", or an empty text passed or were not located.
TEST(ReactantNotation, EmptyTermsAreRefusedWithTheirPlace) {
  EXPECT_CONTAINS(feed_error("CH4 + 2 O2 +"), "term 3 is empty: nothing after the last \"+\" (column 12)");
  EXPECT_CONTAINS(feed_error("CH4 + 2 O2 +"), "remove the trailing \"+\"");
  EXPECT_CONTAINS(feed_error("CH4 + + O2"),
                  "term 2 is empty: nothing between the \"+\" at column 5 and the one at "
                  "column 7");
  EXPECT_CONTAINS(feed_error("+ CH4"), "term 1 is empty: nothing before the first \"+\" (column 1)");
  EXPECT_CONTAINS(feed_error("   "), "--feed = \"   \": empty; reactants are");
}

// Wrong if zero, negative or out-of-range coefficients were accepted, or the message did not say why.
TEST(ReactantNotation, CoefficientsMustBeFinitePositiveNumbers) {
  EXPECT_CONTAINS(feed_error("0 CH4 + O2"),
                  "term 1 \"0 CH4\" (column 1): the coefficient \"0\" must be > 0 mol (leave "
                  "the species out instead)");
  EXPECT_CONTAINS(feed_error("CH4 + -1 O2"), "term 2 \"-1 O2\" (column 7): the coefficient \"-1\" must be > 0 mol");
  EXPECT_CONTAINS(feed_error("1e999 CH4"), "the coefficient \"1e999\" is out of range");
  EXPECT_CONTAINS(feed_error("1,5 CH4"), "\",\" at column 2 in \"1,5\": write the decimal point as \".\" (\"1.5\")");
  EXPECT_CONTAINS(feed_error("CH4, 2 O2"),
                  "\",\" at column 4: terms are joined by \"+\", not \",\"; write \"CH4 + 2 O2\"");
  EXPECT_CONTAINS(feed_error("2x CH4"), "the coefficient \"2x\" is not a plain decimal number");
  EXPECT_CONTAINS(feed_error("2 3 CH4"), "3 words; a term is one formula with an optional coefficient");
}

// Wrong if "inf" or "nan" were taken as numbers (std::from_chars reads them) instead of names.
TEST(ReactantNotation, InfAndNanAreNotNumbers) {
  EXPECT_CONTAINS(feed_error("inf CH4"), "two formulas in one term: write \"inf + CH4\"");
  EXPECT_CONTAINS(feed_error("nan"), "unknown species \"nan\"");
}

// Wrong if a species given twice were silently summed or overwritten instead of refused with the
// whole amount to write.
TEST(ReactantNotation, ARepeatedSpeciesIsRefused) {
  const std::string message = feed_error("CH4 + O2 + 2 CH4");
  EXPECT_CONTAINS(message, "term 3 \"2 CH4\" (column 12): CH4 is already term 1");
  EXPECT_CONTAINS(message, "give each species once, with its whole amount (\"3 CH4\")");
}

// Wrong if an unknown formula were accepted, or its refusal lost its place and the did-you-mean.
TEST(ReactantNotation, UnknownSpeciesAreLocatedWithASuggestion) {
  const std::string message = feed_error("CH4 + 2 o2");
  EXPECT_CONTAINS(message,
                  "--feed = \"CH4 + 2 o2\": term 2 \"2 o2\" (column 7): unknown species \"o2\"; did you mean "
                  "\"O2\"?");
  EXPECT_CONTAINS(message, "known species (case-sensitive): CO2, CO, O2");
  // Without a database only the notation is checked.
  EXPECT_EQ(parse_reactants("2 Xe", "--feed").at(0).formula, "Xe");
}

// Wrong if a group in parentheses (air as "2 (O2 + 3.76 N2)") were read, or its refusal did not show
// the terms multiplied out; or if the parentheses of a formula were taken for a group.
TEST(ReactantNotation, GroupsInParenthesesAreRefusedWithTheTermsMultipliedOut) {
  const std::string message = feed_error("CH4 + 2 (O2 + 3.76 N2)");
  EXPECT_CONTAINS(message,
                  "--feed = \"CH4 + 2 (O2 + 3.76 N2)\": \"(\" at column 9: groups in parentheses are not accepted; "
                  "give each species its own coefficient: write \"CH4 + 2 O2 + 7.52 N2\"");
  EXPECT_CONTAINS(feed_error("(CH4 + O2) + 3 N2"), "write \"CH4 + O2 + 3 N2\"");
  EXPECT_CONTAINS(feed_error("CH4 + 2.4 (O2 + 3.76 N2)"), "write \"CH4 + 2.4 O2 + 9.024 N2\"");
  EXPECT_CONTAINS(feed_error("CH4 + 0.5 (C(gr) + O2)"), "write \"CH4 + 0.5 C(gr) + 0.5 O2\"");
  const std::string unclosed = feed_error("CH4 + 2 (O2 + 3.76 N2");
  EXPECT_CONTAINS(unclosed, "\"(\" at column 9: groups in parentheses are not accepted");
  EXPECT_EQ(unclosed.find("write \"CH4"), std::string::npos) << unclosed;
  EXPECT_EQ(feed_error("C(gr) + 2 O2"), "");
}

// Wrong if a mistyped order or a missing "+" passed, or the hint did not show the intended form.
TEST(ReactantNotation, SwappedOrderAndMissingPlusGetHints) {
  EXPECT_CONTAINS(feed_error("CH4 2"), "the coefficient comes before the formula: write \"2 CH4\"");
  EXPECT_CONTAINS(feed_error("CH4 O2"), "two formulas in one term: write \"CH4 + O2\"");
  EXPECT_CONTAINS(feed_error("C (gr)"), "\"(gr)\" after the formula \"C\": a formula has no blanks in it");
  EXPECT_CONTAINS(feed_error("2"), "the coefficient \"2\" has no formula after it");
  EXPECT_CONTAINS(feed_error("CH4 95 %"), "3 words");
}

// ---------------------------------------------------------------------------------------------------
// Analyses

// Wrong if names or percentages were misread, "%" with or without a blank before it mattered, or
// the order were lost.
TEST(AnalysisNotation, ReadsNamePercentItemsInOrder) {
  const auto items = parse_analysis(" CH4 93 %,C2H6 4%, CO2 .5 % , N2 2.5e0 %", "--gas", gas_analysis_vocabulary(db()));
  ASSERT_EQ(items.size(), 4u);
  EXPECT_EQ(items[0].first, "CH4");
  EXPECT_EQ(items[0].second, 93.0);
  EXPECT_EQ(items[1].first, "C2H6");
  EXPECT_EQ(items[1].second, 4.0);
  EXPECT_EQ(items[2].first, "CO2");
  EXPECT_EQ(items[2].second, 0.5);
  EXPECT_EQ(items[3].first, "N2");
  EXPECT_EQ(items[3].second, 2.5);
}

// Wrong if the ultimate-analysis names (lower-case ash, moisture) were refused or misread.
TEST(AnalysisNotation, ReadsAnUltimateAnalysis) {
  const auto items = parse_analysis("C 75 %, H 5 %, O 6.7 %, N 1.5 %, S 2.3 %, ash 9.5 %, moisture 8 %", "--ultimate",
                                    ultimate_analysis_vocabulary());
  ASSERT_EQ(items.size(), 7u);
  EXPECT_EQ(items[2].first, "O");
  EXPECT_EQ(items[2].second, 6.7);
  EXPECT_EQ(items[5].first, "ash");
  EXPECT_EQ(items[5].second, 9.5);
  EXPECT_EQ(items[6].first, "moisture");
  EXPECT_EQ(items[6].second, 8.0);
}

// Wrong if the former NAME=VALUE list were read, or its refusal did not show the certificate form.
TEST(AnalysisNotation, TheFormerNameEqualsValueFormIsRefusedWithItsRewriting) {
  EXPECT_CONTAINS(analysis_error("CH4=95, C2H6=3"),
                  "--gas = \"CH4=95, C2H6=3\": the NAME=PERCENT form is not accepted; write \"CH4 95 %, C2H6 3 %\"");
  EXPECT_CONTAINS(analysis_error("C=75, H=5 %", "--ultimate", ultimate_analysis_vocabulary()),
                  "--ultimate = \"C=75, H=5 %\": the NAME=PERCENT form is not accepted; write \"C 75 %, H 5 %\"");
}

// Wrong if a percentage without "%" were accepted (the "%" is required), or the hint lacked it.
TEST(AnalysisNotation, ThePercentSignIsRequired) {
  const std::string message = analysis_error("CH4 95 %, C2H6 5");
  EXPECT_CONTAINS(message,
                  "--gas = \"CH4 95 %, C2H6 5\": item 2 \"C2H6 5\" (column 11): the \"%\" is missing: write "
                  "\"C2H6 5 %\"");
  EXPECT_CONTAINS(message,
                  "an analysis is NAME PERCENT % items separated by \",\", e.g. \"CH4 95 %, C2H6 3 %, N2 2 %\"");
  EXPECT_CONTAINS(analysis_error("CH4 95 %%"), "one \"%\" per item, at its end");
}

// Wrong if empty items (trailing comma, double comma) passed or were not located.
TEST(AnalysisNotation, EmptyItemsAreRefusedWithTheirPlace) {
  EXPECT_CONTAINS(analysis_error("CH4 95 %, C2H6 5 %,"), "item 3 is empty: nothing after the last \",\" (column 19)");
  EXPECT_CONTAINS(analysis_error("CH4 95 %,, C2H6 5 %"),
                  "item 2 is empty: nothing between the \",\" at column 9 and "
                  "the one at column 10");
  EXPECT_CONTAINS(analysis_error(""), "--gas = \"\": empty; an analysis is");
}

// Wrong if malformed items passed, or their messages did not say what is missing.
TEST(AnalysisNotation, MalformedItemsAreRefused) {
  EXPECT_CONTAINS(analysis_error("CH4 %"), "item 1 \"CH4 %\" (column 1): no percentage after \"CH4\"");
  EXPECT_CONTAINS(analysis_error("95 %"), "no name before \"95\"");
  EXPECT_CONTAINS(analysis_error("95 CH4 %"), "the name comes first: write \"CH4 95 %\"");
  EXPECT_CONTAINS(analysis_error("CH4 ninety %"), "the percentage \"ninety\" is not a plain decimal number");
  EXPECT_CONTAINS(analysis_error("CH4 9,5 %"),
                  "\",\" at column 6 in \"9,5\": write the decimal point as \".\" (\"9.5\")");
  EXPECT_CONTAINS(analysis_error("CH4 1,000.5 %"), "write numbers without thousands separators (\"1000.5\")");
  EXPECT_CONTAINS(analysis_error("CH4 -5 %"), "the percentage \"-5\" is negative; it must be >= 0");
  EXPECT_CONTAINS(analysis_error("CH4 95 % + N2 5 %"), "items are separated by \",\", not \"+\"");
  EXPECT_CONTAINS(analysis_error("CH4 95 % N2 5 %"), "a \"%\" inside the item: items are separated by \",\"");
}

// Wrong if an unknown name were accepted, or its refusal lost its place and the did-you-mean.
TEST(AnalysisNotation, UnknownNamesAreLocatedWithASuggestion) {
  EXPECT_CONTAINS(analysis_error("CH4 96 %, Ethane 4 %"),
                  "--gas = \"CH4 96 %, Ethane 4 %\": item 2 \"Ethane 4 %\" (column 11): unknown species \"Ethane\"");
  EXPECT_CONTAINS(analysis_error("CH4 96 %, c2h6 4 %"), "did you mean \"C2H6\"?");
  const std::string message = analysis_error("C 80 %, Ash 20 %", "--ultimate", ultimate_analysis_vocabulary());
  EXPECT_CONTAINS(message, "item 2 \"Ash 20 %\" (column 9): unknown component \"Ash\"; did you mean \"ash\"?");
  EXPECT_CONTAINS(message, "known component (case-sensitive): C, H, O, N, S, ash, moisture");
}

// Wrong if a name given twice were summed or overwritten instead of refused.
TEST(AnalysisNotation, ARepeatedNameIsRefused) {
  EXPECT_CONTAINS(analysis_error("CH4 90 %, N2 5 %, CH4 5 %"),
                  "item 3 \"CH4 5 %\" (column 19): CH4 is already item 1; give each species once");
}

// Wrong if the default vocabulary (any name) refused names: the notation alone is checked then.
TEST(AnalysisNotation, WithoutVocabularyAnyNameIsRead) {
  const auto items = parse_analysis("Xe 100 %", "--gas");
  ASSERT_EQ(items.size(), 1u);
  EXPECT_EQ(items[0].first, "Xe");
  EXPECT_EQ(items[0].second, 100.0);
}

}  // namespace
}  // namespace stackbound::core
