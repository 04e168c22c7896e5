// Limits and measured values in the forms permits write load into the basis they mean (issue 12):
// "25 ppmvd @ 3% O2" is the limit "25 ppmvd, O2=3%", "0.1 lb/MMBtu" a rate per heat input; normal
// conditions may be stated as a temperature and a pressure.

#include <string>
#include <variant>

#include <gtest/gtest.h>

#include "stackbound/cases/case_file.hpp"
#include "stackbound/cases/pipeline.hpp"
#include "stackbound/cases/species_file.hpp"

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

// Wrong if normal conditions stated as "25 degC, 101.325 kPa" were not those of the mg/Nm3 figures:
// a mass per normal volume scales with 1/V_m = p / (R T), so 25 degC gives 273.15/298.15 of 0 degC's.
TEST(LimitForms, StatedNormalConditionsAreThoseOfTheMassConcentrations) {
  const std::string base = case_with_limit("25 ppmvd @ 3% O2");
  std::string stated = base;
  stated.replace(stated.find("  reference_o2: 3 %\n"), 19, "  reference_o2: 3 %\n  normal_conditions: 25 degC, 101.325 kPa\n");
  const RunResult at_0C = run_case(parse_case(base, "l.yaml"), builtin_species());
  const RunResult at_25C = run_case(parse_case(stated, "l.yaml"), builtin_species());
  EXPECT_EQ(at_25C.emissions.normal->description, "25 degC, 101.325 kPa (stated)");
  const double ratio = at_25C.emissions.pollutants.front().emission.mg_per_Nm3_at_reference.result.value() /
                       at_0C.emissions.pollutants.front().emission.mg_per_Nm3_at_reference.result.value();
  EXPECT_NEAR(ratio, 273.15 / 298.15, 1e-12);
}

}  // namespace
}  // namespace stackbound::cases
