#include "stackbound/emissions/cautions.hpp"

#include <algorithm>
#include <set>
#include <string>

#include <gtest/gtest.h>

namespace stackbound::emissions {
namespace {

// Wrong if a caution were missing, empty, or two shared a key (reports and JSON use the keys).
TEST(Cautions, EveryCautionHasAUniqueKeyAndText) {
  std::set<std::string_view> keys;
  for (const CautionText& c : all_cautions()) {
    EXPECT_FALSE(c.text.empty()) << c.key;
    EXPECT_TRUE(keys.insert(c.key).second) << "duplicate key " << c.key;
    EXPECT_EQ(caution(c.caution).key, c.key);
  }
  EXPECT_EQ(keys.size(), 10U);
}

// Wrong if the standard set lacked the bound, non-compliance or authority statements DESIGN section 5 requires.
TEST(Cautions, StandardSetCarriesTheRequiredStatements) {
  const auto standard = standard_cautions();
  for (const Caution required : {Caution::equilibrium_bound, Caution::not_a_measurement, Caution::not_compliance,
                                 Caution::authorities_govern, Caution::frozen_composition, Caution::ideal_gas}) {
    EXPECT_NE(std::find(standard.begin(), standard.end(), required), standard.end()) << caution(required).key;
  }
  EXPECT_NE(caution(Caution::equilibrium_bound).text.find("equilibrium bound at the stated firing conditions"),
            std::string_view::npos);
  EXPECT_NE(caution(Caution::not_compliance).text.find("not a compliance determination"), std::string_view::npos);
  EXPECT_NE(caution(Caution::authorities_govern).text.find("Permits, regulators, local codes and licensed"),
            std::string_view::npos);
  EXPECT_NE(caution(Caution::confirm_presets).text.find("confirm each preset against it"), std::string_view::npos);
}

// Wrong if any caution called a result compliant.
TEST(Cautions, NoCautionCallsAnythingCompliant) {
  for (const CautionText& c : all_cautions()) {
    EXPECT_EQ(std::string(c.text).find("compliant"), std::string::npos) << c.key;
  }
}

}  // namespace
}  // namespace stackbound::emissions
