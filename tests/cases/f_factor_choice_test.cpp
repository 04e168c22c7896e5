// report.f_factors: the computed F-factors stay the default; `published` takes Method 19 Table 19-2's
// for the fuel's type, `{Fd: ...}` the case's own; the rates per heat input follow, and the report
// names which were used.

#include "stackbound/cases/f_factor_choice.hpp"

#include <string>

#include <gtest/gtest.h>

#include "stackbound/cases/case_file.hpp"
#include "stackbound/cases/pipeline.hpp"
#include "stackbound/cases/run_document.hpp"
#include "stackbound/cases/species_file.hpp"
#include "stackbound/units/input_error.hpp"
#include "tests/support/tolerance.hpp"

namespace stackbound::cases {
namespace {

using stackbound::testing::is_close;

std::string case_with(const std::string& fuel, const std::string& f_factors) {
  return "case:\n  title: F-factors (invented)\nfuel:\n" + fuel + "  feed_rate: 10 MW\noperating_point:\n"
         "  excess_air: 15 %\nfiring:\n  temperature: 1800 K\nreport:\n  reference_o2: 3 %\n" + f_factors;
}

RunResult run(const std::string& text) {
  LoadedCase loaded = parse_case_file(text, "f.yaml");
  return with_positions(loaded.sources, [&] { return run_case(std::move(loaded.definition), builtin_species()); });
}

double nox_lb_per_MMBtu(const RunResult& r) {
  for (const PollutantBound& p : r.emissions.pollutants) {
    if (p.name == "NOx") return p.emission.method19.lb_per_MMBtu();
  }
  ADD_FAILURE() << "no NOx";
  return 0.0;
}

// Wrong if `published` did not take Table 19-2's Fd for natural gas, or the Method 19 rate did not
// follow it (E = C Fd 20.9/(20.9 - %O2): proportional to Fd at the same gas).
TEST(FFactorChoice, PublishedTakesTable19_2ForTheFuelsType) {
  const RunResult computed = run(case_with("  preset: natural_gas\n", ""));
  const RunResult published = run(case_with("  preset: natural_gas\n", "  f_factors: published\n"));
  // Source: 40 CFR 75 Appendix F, Table 1 (same values as Method 19 Table 19-2): natural gas Fd 8710,
  // Fc 1040 per 10^6 Btu (reproduction; recorded in tests/reference/f_factor_test.cpp).
  EXPECT_TRUE(is_close(published.resolved.f_factors.fd.scf_per_MMBtu(), 8710.0, 1e-4));
  EXPECT_TRUE(is_close(published.resolved.f_factors.fc.scf_per_MMBtu(), 1040.0, 1e-4));
  const double fd_computed = computed.resolved.f_factors.fd.scf_per_MMBtu();
  EXPECT_TRUE(is_close(fd_computed, computed.resolved.combustion.f_factors.fd_dscf_per_MMBtu(), 1e-12));
  EXPECT_TRUE(is_close(nox_lb_per_MMBtu(published) / nox_lb_per_MMBtu(computed), 8710.0 / fd_computed, 1e-9));
  EXPECT_EQ(published.resolved.f_factors.source,
            "published for natural gas: US EPA Method 19 (40 CFR 60 Appendix A-7), Table 19-2; Fd and Fc as "
            "reproduced in 40 CFR 75 Appendix F Table 1, Fw from memory");
  EXPECT_EQ(computed.resolved.f_factors.source,
            "computed from the fuel's composition and HHV (Method 19 definitions, Eqs. 19-13 to 19-15)");
  // The report names them.
  bool named = false;
  for (const auto& [label, value] : run_document(published, Provenance{}).summary) {
    if (label == "F-factors (Method 19)") {
      named = true;
      EXPECT_EQ(value.substr(0, 62), "Fd 8710 dscf/MMBtu, Fw 10610 wscf/MMBtu, Fc 1040 scf/MMBtu; pu");
    }
  }
  EXPECT_TRUE(named);
}

// Wrong if a named entry, or the case's own Fd, were not the one used.
TEST(FFactorChoice, ANamedEntryOrTheCasesOwnAreUsed) {
  const RunResult oil = run(case_with("  gas: {CH4: 100 %}\n", "  f_factors: {published: oil}\n"));
  EXPECT_TRUE(is_close(oil.resolved.f_factors.fd.scf_per_MMBtu(), 9190.0, 1e-4));
  const RunResult own = run(case_with("  preset: natural_gas\n", "  f_factors: {Fd: 8700 dscf/MMBtu}\n"));
  EXPECT_TRUE(is_close(own.resolved.f_factors.fd.scf_per_MMBtu(), 8700.0, 1e-4));
  EXPECT_EQ(own.resolved.f_factors.source,
            "stated in the case file (report.f_factors); those not stated computed from the fuel");
}

// Wrong if `published` were applied to a fuel the table has no type for, or a bad entry accepted.
TEST(FFactorChoice, PublishedWithoutAFuelTypeIsRefused) {
  EXPECT_THROW_WITH(run(case_with("  gas: {CH4: 100 %}\n", "  f_factors: published\n")), units::InputError,
                    "f.yaml:12:14: f_factors = \"published\": the fuel is not a preset with an entry in Method 19 "
                    "Table 19-2; name the entry, e.g. f_factors: {published: natural_gas} (entries: coal_anthracite, "
                    "coal_bituminous, coal_lignite, oil, natural_gas, propane, butane, wood, wood_bark), or give the "
                    "permit's: {Fd: 8710 dscf/MMBtu}");
  EXPECT_THROW_WITH(run(case_with("  preset: natural_gas\n", "  f_factors: {published: coal}\n")), units::InputError,
                    "report.f_factors.published = \"coal\": not an entry of Method 19 Table 19-2; accepted: "
                    "coal_anthracite, coal_bituminous");
  EXPECT_THROW_WITH(run(case_with("  preset: natural_gas\n", "  f_factors: {Fc: 1040 scf/MMBtu}\n")),
                    units::InputError, "needs Fd (the F-factor Method 19 uses with the flue O2)");
}

}  // namespace
}  // namespace stackbound::cases
