// The screening rows of the stated limits: every source (measured, estimate, ceiling, bound) on the
// limit's basis, with the words each outcome gives, on the example cases and variants of them.

#include <gtest/gtest.h>

#include <nlohmann/json.hpp>
#include <string>
#include <vector>

#include "stackbound/cases/case_file.hpp"
#include "stackbound/cases/input_file.hpp"
#include "stackbound/cases/pipeline.hpp"
#include "stackbound/cases/run_document.hpp"
#include "stackbound/cases/species_file.hpp"
#include "tests/support/run_binary.hpp"
#include "tests/support/tolerance.hpp"

namespace stackbound::cases {
namespace {

using stackbound::testing::is_close;
namespace em = stackbound::emissions;

std::string example(const char* name) { return std::string(STACKBOUND_SOURCE_DIR) + "/cases/examples/" + name; }

std::string example_text(const char* name) { return read_input_file(example(name), "case", "case file"); }

std::string replaced(std::string text, const std::string& from, const std::string& to) {
  const std::size_t at = text.find(from);
  EXPECT_NE(at, std::string::npos) << from;
  if (at != std::string::npos) text.replace(at, from.size(), to);
  return text;
}

// The rows of one limit, by report.limits index.
std::vector<LimitScreening> rows_of(const RunResult& run, std::size_t limit_index) {
  std::vector<LimitScreening> rows;
  for (const LimitScreening& row : run.screening.limits) {
    if (row.limit_index == limit_index) rows.push_back(row);
  }
  return rows;
}

std::vector<std::string> sources_of(const std::vector<LimitScreening>& rows) {
  std::vector<std::string> sources;
  for (const LimitScreening& row : rows) sources.emplace_back(em::screening_source_name(row.source));
  return sources;
}

// Molar volume at 0 degC and 101.325 kPa, R T / p with R = 8.314462618 J/(mol K) (CODATA 2018), m3/mol.
constexpr double kMolarVolume0C = 8.314462618 * 273.15 / 101325.0;

// Wrong if the gas boiler's measured NOx were not screened, or not on the limit's basis: 62 ppmvd
// measured at 3 % O2 against 100 mg/Nm3 at 3 % O2 (as NO2) is 127 % of the limit.
TEST(ScreeningRows, GasBoilerMeasuredNoxIsAboveItsLimit) {
  const RunResult run = run_case(load_case(example("gas_boiler.yaml")), builtin_species());
  const std::vector<LimitScreening> nox = rows_of(run, 0);
  ASSERT_EQ(sources_of(nox), (std::vector<std::string>{"measured", "estimate", "ceiling", "bound"}));
  // Hand calculation: mg/Nm3 = ppmv * M / Vm, M(NO2) = 46.005 g/mol (IUPAC 2021 atomic weights); the
  // measured O2 equals the reference O2, so no O2 correction.
  const double measured_mg = 62.0 * 46.005e-3 / kMolarVolume0C;
  EXPECT_TRUE(is_close(nox[0].result.value, measured_mg, 1e-4));
  EXPECT_TRUE(is_close(nox[0].result.fraction_of_limit, measured_mg / 100.0, 1e-4));
  EXPECT_EQ(nox[0].reading, "measured above the stated limit");
  EXPECT_EQ(nox[1].reading, "estimate below the stated limit");
  EXPECT_EQ(nox[2].reading, "ceiling above the stated limit");
  EXPECT_EQ(nox[3].reading, "bound above the stated limit");
  EXPECT_EQ(nox[0].conclusion,
            "measured above the stated limit; estimate below, ceiling above: cannot be ruled out by screening");
  // The estimate, ceiling and bound rows carry the figures of the emissions stage on the same basis.
  const PollutantBound& bound = run.emissions.pollutants[2];
  ASSERT_EQ(bound.name, "NOx");
  EXPECT_TRUE(is_close(nox[1].result.value, bound.estimate->emission.mg_per_Nm3_at_reference.result.value(), 1e-12));
  EXPECT_TRUE(is_close(nox[2].result.value, bound.ceiling->emission.mg_per_Nm3_at_reference.result.value(), 1e-12));
  EXPECT_TRUE(is_close(nox[3].result.value, bound.emission.mg_per_Nm3_at_reference.result.value(), 1e-12));
}

// Wrong if the wood boiler's CO screening reassured while its measured CO is above the limit: 240
// ppmvd at 7.8 % O2 is 136 % of 250 mg/Nm3 at 6 % O2, and the conclusion must let the measurement govern.
TEST(ScreeningRows, WoodBoilerMeasuredCoGovernsOverTheModel) {
  const RunResult run = run_case(load_case(example("wood_chip_boiler.yaml")), builtin_species());
  const std::vector<LimitScreening> co = rows_of(run, 0);
  ASSERT_EQ(sources_of(co), (std::vector<std::string>{"measured", "estimate", "ceiling", "bound"}));
  // Hand calculation: C_ref = C (21 - O2_ref) / (21 - O2_measured) (Directive 2010/75/EU Annex VI
  // Part 6, with 21 % as the case's o2_basis), then mg/Nm3 = ppmv * M / Vm, M(CO) = 28.010 g/mol.
  const double measured_mg = 240.0 * (21.0 - 6.0) / (21.0 - 7.8) * 28.010e-3 / kMolarVolume0C;
  EXPECT_TRUE(is_close(co[0].result.value, measured_mg, 1e-4));
  EXPECT_TRUE(is_close(co[0].result.fraction_of_limit, measured_mg / 250.0, 1e-4));
  EXPECT_EQ(co[0].reading, "measured above the stated limit");
  EXPECT_EQ(co[2].reading,
            "ceiling below the stated limit: not reachable at these conditions in a well-mixed flame (screening)");
  EXPECT_EQ(co[0].conclusion,
            "measured above the stated limit; ceiling below the stated limit: not reachable at these conditions in a "
            "well-mixed flame (screening); the measurement governs: the model leaves out poor mixing and quenching, "
            "which raise CO above every equilibrium figure");
  const std::vector<LimitScreening> nox = rows_of(run, 1);
  ASSERT_EQ(sources_of(nox), (std::vector<std::string>{"estimate", "ceiling", "bound"}));
  EXPECT_EQ(nox[0].conclusion, "estimate above the stated limit: expected above it at these conditions (screening)");
}

// Wrong if a NOx ceiling below the limit were not read as "not reachable", or the gas turbine's
// estimate-below, ceiling-above case were read as anything but "cannot be ruled out".
TEST(ScreeningRows, CeilingBelowAndCeilingAboveTheLimit) {
  const std::string text =
      replaced(example_text("gas_boiler.yaml"), "limit: 100 mg/Nm3, dry, O2=3%\n    - pollutant: CO",
               "limit: 5000 mg/Nm3, dry, O2=3%\n    - pollutant: CO");
  const RunResult high = run_case(parse_case(text, "gas_boiler.yaml"), builtin_species());
  const std::vector<LimitScreening> nox = rows_of(high, 0);
  ASSERT_EQ(nox.size(), 4U);
  EXPECT_EQ(nox[0].reading, "measured below the stated limit");
  EXPECT_EQ(nox[2].reading, "ceiling below the stated limit: not reachable at these conditions (screening)");
  EXPECT_EQ(nox[0].conclusion,
            "measured below the stated limit; ceiling below the stated limit: not reachable at these conditions "
            "(screening)");
  const RunResult turbine = run_case(load_case(example("gas_turbine.yaml")), builtin_species());
  const std::vector<LimitScreening> gt = rows_of(turbine, 0);
  ASSERT_EQ(sources_of(gt), (std::vector<std::string>{"estimate", "ceiling", "bound"}));
  EXPECT_EQ(gt[0].conclusion, "estimate below, ceiling above: cannot be ruled out by screening");
}

// Wrong if a measured value were not screened against a limit per heat input, or not by Method 19:
// E = C_d Fd 20.9 / (20.9 - %O2_d) (40 CFR 60 Appendix A-7, Method 19 Eq. 19-1), C_d in kg per dry
// standard m3 at 20 degC, 101.325 kPa.
TEST(ScreeningRows, MeasuredValueAgainstARateLimitGoesThroughMethod19) {
  const std::string text = replaced(example_text("oil_heater.yaml"), "report:\n",
                                    "  measured:\n    o2: 3.5 %, dry\n    nox: 60 ppm, dry\n\nreport:\n");
  const RunResult run = run_case(parse_case(text, "oil_heater.yaml"), builtin_species());
  const std::vector<LimitScreening> nox = rows_of(run, 0);
  ASSERT_EQ(sources_of(nox), (std::vector<std::string>{"measured", "estimate", "ceiling", "bound"}));
  const double molar_volume_20C = 8.314462618 * 293.15 / 101325.0;
  const double c_kg_per_m3 = 60e-6 * 46.005e-3 / molar_volume_20C;
  const double kg_per_J = c_kg_per_m3 * run.resolved.combustion.f_factors.fd_m3_per_J * 20.9 / (20.9 - 3.5);
  const double lb_per_MMBtu = kg_per_J / 0.45359237 * 1.05505585262e9;  // lb (exact) and MMBtu (IT Btu, exact)
  EXPECT_EQ(nox[0].result.unit, "lb/MMBtu");
  EXPECT_TRUE(is_close(nox[0].result.value, lb_per_MMBtu, 1e-4));
  EXPECT_EQ(nox[0].reading, "measured below the stated limit");
}

// Wrong if the JSON lost the one-entry-per-source-and-limit layout or the keys kept from before.
TEST(ScreeningRows, JsonHasOneEntryPerSourceAndLimit) {
  const auto printed = testing::run_stackbound({"run", example("gas_boiler.yaml"), "--format", "json"});
  ASSERT_EQ(printed.exit_code, 0) << printed.err;
  const nlohmann::json limits = nlohmann::json::parse(printed.out)["limits"];
  ASSERT_EQ(limits.size(), 8U);
  const std::vector<std::string> expected = {"measured", "estimate", "ceiling", "bound"};
  for (std::size_t i = 0; i < limits.size(); ++i) {
    EXPECT_EQ(limits[i]["source"], expected[i % 4]) << i;
    EXPECT_EQ(limits[i]["pollutant"], i < 4 ? "NOx" : "CO") << i;
    for (const char* key : {"limit", "value", "limit_value", "unit", "basis", "margin", "fraction_of_limit", "outcome",
                            "wording", "reading", "conclusion", "limit_index"}) {
      EXPECT_TRUE(limits[i].contains(key)) << i << " " << key;
    }
  }
  EXPECT_EQ(limits[0]["outcome"], "above the stated limit");
  EXPECT_EQ(limits[4]["conclusion"],
            "measured below the stated limit; ceiling below the stated limit: not reachable at these conditions in a "
            "well-mixed flame (screening)");
}

// Wrong if the text report lost a row's source or words, or the limit's conclusion.
TEST(ScreeningRows, TextReportShowsTheRowsAndTheConclusion) {
  const auto printed = testing::run_stackbound({"run", example("wood_chip_boiler.yaml")});
  ASSERT_EQ(printed.exit_code, 0) << printed.err;
  for (const char* fragment : {"source", "measured above the stated limit", "136.3 %",
                               "note: CO (250 mg/Nm3, dry, O2=6%): measured above the stated limit;"}) {
    EXPECT_NE(printed.out.find(fragment), std::string::npos) << fragment;
  }
  EXPECT_EQ(printed.out.find("compliant"), std::string::npos);
}

// Wrong if the headline lost a pollutant, put a figure on another basis than the limit's, or left out
// the measured value or the limit's conclusion.
TEST(ScreeningRows, HeadlineHoldsEachPollutantOnThePermitsBasis) {
  const RunResult run = run_case(load_case(example("gas_boiler.yaml")), builtin_species());
  const std::vector<HeadlineRow>& headline = run.screening.headline;
  ASSERT_EQ(headline.size(), 3U);  // NOx and CO with their limits, then NO without one
  EXPECT_EQ(headline[0].pollutant, "NOx");
  EXPECT_EQ(headline[0].unit, "mg/Nm3");
  EXPECT_EQ(headline[0].basis, "dry, O2=3%, as NO2, normal=0C");
  const std::vector<LimitScreening> nox = rows_of(run, 0);
  ASSERT_TRUE(headline[0].measured && headline[0].estimate && headline[0].ceiling && headline[0].limit);
  EXPECT_TRUE(is_close(*headline[0].measured, nox[0].result.value, 0.0));
  EXPECT_TRUE(is_close(*headline[0].estimate, nox[1].result.value, 0.0));
  EXPECT_TRUE(is_close(*headline[0].ceiling, nox[2].result.value, 0.0));
  EXPECT_TRUE(is_close(headline[0].bound, nox[3].result.value, 0.0));
  EXPECT_TRUE(is_close(*headline[0].limit, 100.0, 0.0));
  EXPECT_EQ(headline[0].reading, nox[0].conclusion);
  EXPECT_EQ(headline[1].pollutant, "CO");
  EXPECT_EQ(headline[2].pollutant, "NO");
  EXPECT_EQ(headline[2].basis, "dry, O2=3%, normal=0C");
  EXPECT_FALSE(headline[2].limit);
  EXPECT_FALSE(headline[2].measured);  // the gas boiler states no measured NO
  EXPECT_EQ(headline[2].reading, "");
  EXPECT_TRUE(
      is_close(headline[2].bound, run.emissions.pollutants[1].emission.mg_per_Nm3_at_reference.result.value(), 0.0));
}

// Wrong if the text or HTML report did not open with the headline, before the summary and details.
TEST(ScreeningRows, ReportsOpenWithTheHeadline) {
  const auto text = testing::run_stackbound({"run", example("gas_boiler.yaml")});
  ASSERT_EQ(text.exit_code, 0) << text.err;
  const std::size_t headline = text.out.find("Headline: each pollutant on the permit's basis");
  ASSERT_NE(headline, std::string::npos);
  EXPECT_LT(headline, text.out.find("Case file"));
  EXPECT_LT(headline, text.out.find("Screening against the stated limits"));
  const auto html = testing::run_stackbound({"run", example("gas_boiler.yaml"), "--format", "html"});
  ASSERT_EQ(html.exit_code, 0) << html.err;
  const std::size_t section = html.out.find("<section class=\"headline\">");
  ASSERT_NE(section, std::string::npos);
  EXPECT_LT(section, html.out.find("<h2>Summary</h2>"));
  const std::size_t chart = html.out.find("<svg", section);
  ASSERT_NE(chart, std::string::npos);
  EXPECT_LT(chart, html.out.find("<h2>Summary</h2>"));
  EXPECT_NE(html.out.find("stated limit 100</text>", section), std::string::npos);
}

}  // namespace
}  // namespace stackbound::cases
