// Limits and measured values in the forms permits write load into the basis they mean (issue 12):
// "25 ppmvd @ 3% O2" is the limit "25 ppmvd, O2=3%", "0.1 lb/MMBtu" a rate per heat input.

#include <string>
#include <variant>

#include <gtest/gtest.h>

#include "stackbound/cases/case_file.hpp"

namespace stackbound::cases {
namespace {

std::string case_with_limit(const std::string& limit) {
  return "case:\n  title: Limit forms (invented)\nfuel:\n  preset: natural_gas\n  feed_rate: 10 MW\n"
         "operating_point:\n  excess_air: 15 %\nfiring:\n  temperature: 1800 K\nstack:\n  measured:\n"
         "    nox: 30 ppmvd at 15 % O2\nreport:\n  reference_o2: 3 %\n  limits:\n    - pollutant: NOx\n"
         "      limit: " + limit + "\n";
}

// Wrong if a permit's form were refused, taken as a rate, or read at another O2 level.
TEST(LimitForms, PermitFormsLoadAsTheirBasis) {
  const CaseDefinition at = parse_case(case_with_limit("25 ppmvd @ 3% O2"), "l.yaml");
  const auto* limit = std::get_if<emissions::Concentration>(&at.report.limits.at(0).limit);
  ASSERT_NE(limit, nullptr);
  EXPECT_DOUBLE_EQ(limit->value(), 25.0);
  EXPECT_EQ(limit->basis().text(), "ppmv, dry, O2=3%, as NO2");
  ASSERT_TRUE(at.stack.measured.nox.has_value());
  EXPECT_EQ(at.stack.measured.nox->value.basis().text(), "ppmv, dry, O2=15%, as NO2");

  const CaseDefinition mass = parse_case(case_with_limit("50 mg/Nm3 @ 15% O2 dry"), "l.yaml");
  const auto* mass_limit = std::get_if<emissions::Concentration>(&mass.report.limits.at(0).limit);
  ASSERT_NE(mass_limit, nullptr);
  EXPECT_EQ(mass_limit->basis().text(), "mg/Nm3, dry, O2=15%, as NO2, normal=0C");

  const CaseDefinition rate = parse_case(case_with_limit("0.1 lb/MMBtu"), "l.yaml");
  const auto* rate_limit = std::get_if<emissions::RateLimit>(&rate.report.limits.at(0).limit);
  ASSERT_NE(rate_limit, nullptr);
  EXPECT_EQ(rate_limit->kind, emissions::RateKind::per_heat_input);
}

}  // namespace
}  // namespace stackbound::cases
