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
  EXPECT_EQ(keys.size(), 15U);
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

// Wrong if a caution the reports need lost what it must say: fuel nitrogen is not bounded by
// equilibrium, CO only for a well-mixed flame, rates are no potential-to-emit figure, a sweep at a
// stated firing temperature ignores the temperature change.
TEST(Cautions, TheCautionsThatSayWhatMatters) {
  EXPECT_EQ(
      caution(Caution::fuel_nitrogen_unbounded).text,
      "NO from the nitrogen bound in the fuel is not bounded by equilibrium: it forms by kinetics in the flame and "
      "can exceed the equilibrium NO at the firing temperature. Only the ceiling (all fuel nitrogen as NO) bounds "
      "it; state fuel.nitrogen_conversion from the plant's data where it is known.");
  EXPECT_EQ(caution(Caution::co_well_mixed_only).text,
            "CO is bounded by these figures only in a well-mixed flame with enough time at temperature: poor mixing, "
            "quenching on cold surfaces, or too short a residence time leave CO far above every figure here, the "
            "ceiling included. A CO measurement governs.");
  EXPECT_EQ(caution(Caution::not_potential_to_emit).text,
            "The kg/h and t/yr figures are the stated feed and operating hours at the stated conditions; they are not "
            "a potential-to-emit figure, which the applicable rules define (maximum capacity, worst-case fuel and "
            "operation, enforceable limits).");
  EXPECT_EQ(caution(Caution::sweep_fixed_temperature).text,
            "This sweep holds the stated firing temperature while the operating change varies: in a real flame, "
            "excess air, air preheat, humidity, enrichment or fuel blend change the flame temperature, and with it NO "
            "and CO. The figures show the change at a fixed temperature only; use firing.adiabatic: true to let it "
            "follow.");
  const auto standard = standard_cautions();
  EXPECT_NE(std::find(standard.begin(), standard.end(), Caution::not_potential_to_emit), standard.end());
  for (const Caution conditional : {Caution::co_well_mixed_only, Caution::fuel_nitrogen_unbounded,
                                    Caution::primary_zone_needed, Caution::sweep_fixed_temperature}) {
    EXPECT_EQ(std::find(standard.begin(), standard.end(), conditional), standard.end()) << caution(conditional).key;
  }
}

// Wrong if two cautions said the same thing: the CO and fuel-nitrogen points live in their own
// cautions, not repeated in the general one.
TEST(Cautions, RepeatsAreMerged) {
  EXPECT_EQ(caution(Caution::equilibrium_bound).text.find("CO"), std::string_view::npos);
  EXPECT_EQ(caution(Caution::frozen_composition).text.find("CO burn-out"), std::string_view::npos);
}

// Wrong if any caution called a result compliant.
TEST(Cautions, NoCautionCallsAnythingCompliant) {
  for (const CautionText& c : all_cautions()) {
    EXPECT_EQ(std::string(c.text).find("compliant"), std::string::npos) << c.key;
  }
}

}  // namespace
}  // namespace stackbound::emissions
