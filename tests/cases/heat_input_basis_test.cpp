// A heat-input feed on the LHV (fuel.heating_value_basis: LHV) resolves through the LHV for every
// kind of fuel: the fuel rate is the heat input over the LHV, larger than on the HHV by HHV/LHV.
// Before issue 12 it was taken as HHV for presets, gases and blends without a word.

#include <string>

#include <gtest/gtest.h>

#include "stackbound/cases/case_file.hpp"
#include "stackbound/cases/pipeline.hpp"
#include "stackbound/cases/species_file.hpp"
#include "tests/support/tolerance.hpp"

namespace stackbound::cases {
namespace {

using stackbound::testing::is_close;

std::string case_with(const std::string& fuel, const std::string& basis) {
  return "case:\n  title: LHV feed (invented)\nfuel:\n" + fuel + "  feed_rate: 12 MW\n" + basis +
         "operating_point:\n  excess_air: 20 %\nfiring:\n  temperature: 1700 K\nreport:\n  reference_o2: 3 %\n";
}

RunResult run(const std::string& text) { return run_case(parse_case(text, "lhv.yaml"), builtin_species()); }

// Wrong if the LHV basis were ignored for any fuel kind (the two mass rates equal), or applied with
// another heating value than the fuel's own LHV.
TEST(HeatInputBasis, TwelveMegawattsOnTheLhvResolveThroughTheLhvForEveryFuelKind) {
  const std::string fuels[] = {
      "  preset: natural_gas\n",
      "  gas: {CH4: 90 %, C2H6: 6 %, N2: 4 %}\n",
      "  ultimate: {C: 85 %, H: 13 %, S: 0.5 %, N: 0.2 %, O: 1.3 %}\n  state: liquid\n  heating_value_correlation: channiwala_parikh\n",
      "  blend:\n    - {preset: natural_gas, fraction: 60 %}\n    - {preset: propane, fraction: 40 %}\n",
  };
  for (const std::string& fuel : fuels) {
    const RunResult hhv = run(case_with(fuel, ""));
    const RunResult lhv = run(case_with(fuel, "  heating_value_basis: LHV\n"));
    const double m_hhv = hhv.resolved.rates.feed.mass_flow_kg_per_s;
    const double m_lhv = lhv.resolved.rates.feed.mass_flow_kg_per_s;
    EXPECT_TRUE(is_close(m_hhv, 12e6 / hhv.resolved.fuel.hhv_J_per_kg(), 1e-12)) << fuel;
    EXPECT_TRUE(is_close(m_lhv, 12e6 / lhv.resolved.fuel.lhv_J_per_kg(), 1e-12)) << fuel;
    // HHV/LHV is about 1.06-1.11 for these fuels (common practice, no source).
    EXPECT_GT(m_lhv / m_hhv, 1.04) << fuel;
    EXPECT_NE(lhv.resolved.rates.feed.given.find("(heat input, LHV basis)"), std::string::npos) << fuel;
  }
}

}  // namespace
}  // namespace stackbound::cases
