// The rate constants of the post-flame kinetics against the published expressions, and the
// thermodynamic consistency of the thermal-NO rate constants:
//  1. Zeldovich rate constants (core/thermal_no.cpp) against the table of Hanson & Salimian (1984) as
//     tabulated in Turns, An Introduction to Combustion, ch. 5 (from memory), typed here in the table's
//     units (m^3/(kmol s)): transcription and unit conversion must be exact (1e-12).
//  2. K = (k1f/k1r)(k2f/k2r) of N2 + O2 = 2 NO against NIST-JANAF (log Kf of NO, table N-005) and
//     against K from our own species data (Gibbs energies) over 1800-2500 K. Figures found: the rate
//     constants give K 3.0 % (2000 K) and 3.7 % (2500 K) above JANAF, and 14.4 % (2500 K) to 17.7 %
//     (1800 K) above our data; our NO formation enthalpy (GRI-Mech 3.0, 91.26 kJ/mol against JANAF's
//     90.291) accounts for all but 3.3-4.2 % of the latter.
//  3. Global CO oxidation rates (core/co_burnout.cpp) against the published cgs expressions of Dryer &
//     Glassman (1973) and Howard, Williams & Fine (1973) (from memory): unit conversion exact (1e-12).

#include <fmt/format.h>
#include <gtest/gtest.h>

#include <cmath>
#include <string>
#include <vector>

#include "stackbound/cases/species_file.hpp"
#include "stackbound/core/co_burnout.hpp"
#include "stackbound/core/thermal_no.hpp"
#include "stackbound/units/constants.hpp"
#include "tests/support/published_check.hpp"
#include "tests/support/tolerance.hpp"

namespace stackbound::reference {
namespace {

using stackbound::testing::is_close;
using stackbound::testing::record_published_check;

constexpr double kR = units::kGasConstant_J_per_mol_K;
constexpr double kCalorie_J = 4.184;  // thermochemical calorie. Source: NIST SP 811, B.8.

const core::SpeciesDatabase& db() { return cases::builtin_species(); }

constexpr const char* kHansonSalimian =
    "Hanson & Salimian (1984), Survey of rate constants in the N/H/O system, in Combustion Chemistry (Gardiner, "
    "ed.), as tabulated in Turns, An Introduction to Combustion, ch. 5 (from memory)";

// One row of the published table: k = A T^n exp(-theta/T), A in m^3/(kmol s), with its stated range.
struct TableRow {
  const char* name;
  double a_m3_per_kmol_s;
  double n;
  double theta_K;
  double low_K;
  double high_K;
  const core::ArrheniusRate& (*ours)(const core::ZeldovichRates&);
};

// Source: Hanson & Salimian (1984) as tabulated in Turns, ch. 5 (from memory).
const std::vector<TableRow>& table() {
  static const std::vector<TableRow> rows{
      {"k1f", 1.8e11, 0.0, 38370.0, 2000.0, 5000.0,
       [](const core::ZeldovichRates& r) -> const core::ArrheniusRate& { return r.k1f; }},
      {"k1r", 3.8e10, 0.0, 425.0, 300.0, 5000.0,
       [](const core::ZeldovichRates& r) -> const core::ArrheniusRate& { return r.k1r; }},
      {"k2f", 1.8e7, 1.0, 4680.0, 300.0, 3000.0,
       [](const core::ZeldovichRates& r) -> const core::ArrheniusRate& { return r.k2f; }},
      {"k2r", 3.81e6, 1.0, 20820.0, 1000.0, 3000.0,
       [](const core::ZeldovichRates& r) -> const core::ArrheniusRate& { return r.k2r; }},
      {"k3f", 7.1e10, 0.0, 450.0, 300.0, 2500.0,
       [](const core::ZeldovichRates& r) -> const core::ArrheniusRate& { return r.k3f; }},
      {"k3r", 1.7e11, 0.0, 24560.0, 2200.0, 4500.0,
       [](const core::ZeldovichRates& r) -> const core::ArrheniusRate& { return r.k3r; }},
  };
  return rows;
}

// Wrong if a rate constant of the default set were mistyped, converted with the wrong unit factor or
// carried the wrong stated range. 2200 and 2500 K lie inside every stated range.
TEST(ZeldovichRates, MatchThePublishedTable) {
  const core::ZeldovichRates rates = core::hanson_salimian_1984_rates();
  for (const TableRow& row : table()) {
    for (const double T : {2200.0, 2500.0}) {
      const double published = row.a_m3_per_kmol_s * std::pow(T, row.n) * std::exp(-row.theta_K / T);
      const double ours = row.ours(rates).at(units::kelvin(T)) * 1000.0;  // m^3/(mol s) -> m^3/(kmol s)
      record_published_check({fmt::format("Zeldovich rate constant {}", row.name), fmt::format("{:g} K", T),
                              fmt::format("{:.6e} m3/(kmol s)", published), kHansonSalimian,
                              "1e-12 relative: transcription and unit conversion only", ours});
      EXPECT_TRUE(is_close(ours, published, 1e-12)) << row.name << " at " << T << " K";
    }
    EXPECT_TRUE(is_close(row.ours(rates).stated_low_K, row.low_K, 0.0, 0.0)) << row.name;
    EXPECT_TRUE(is_close(row.ours(rates).stated_high_K, row.high_K, 0.0, 0.0)) << row.name;
  }
}

// Wrong if the rate constants (from memory) were thermodynamically inconsistent with the published
// equilibrium constant of N2 + O2 = 2 NO: K = (k1f/k1r)(k2f/k2r) against K = 10^(2 log Kf(NO)) from
// NIST-JANAF. Found: +3.0 % at 2000 K, +3.7 % at 2500 K.
TEST(ZeldovichRates, EquilibriumConstantAgreesWithJanafWithinAFewPercent) {
  const core::ZeldovichRates rates = core::hanson_salimian_1984_rates();
  // Source: NIST-JANAF 4th ed. (Chase 1998), table N-005 [NO(g)], log Kf at 2000 and 2500 K.
  for (const auto& [T, log_kf] : std::vector<std::pair<double, double>>{{2000.0, -1.699}, {2500.0, -1.227}}) {
    const double janaf = std::pow(10.0, 2.0 * log_kf);
    const double ours = rates.equilibrium_constant(units::kelvin(T));
    record_published_check({"K of N2 + O2 = 2 NO from the Zeldovich rate constants (k1f/k1r)(k2f/k2r)",
                            fmt::format("{:g} K", T),
                            fmt::format("{:.4e} (derived: 10^(2 log Kf), log Kf = {:.3f})", janaf, log_kf),
                            "derived: NIST-JANAF 4th ed., table N-005, log Kf of NO(g)",
                            "5 % relative: rate constants from memory, stated to agree within a few per cent; "
                            "printed log Kf rounding 0.2 %",
                            ours});
    EXPECT_TRUE(is_close(ours, janaf, 0.05)) << T << " K";
  }
}

// Wrong if the equilibrium that the thermal-NO rate law relaxes to (our species data, core/thermal_no.hpp)
// and the one implied by the rate constants differed by more than our data's known difference from
// JANAF explains. Found over 1800-2500 K: the rate constants' K is 17.7 % (1800 K) to 14.4 % (2500 K)
// above ours. Our NO formation enthalpy is 0.97 kJ/mol above JANAF's (docs/equilibrium.md), which
// lowers our K by exp(-2 x 973 J/mol / RT) (-12 % at 1800 K, -9 % at 2500 K); with that removed the two
// agree within 3.3-4.2 % (asserted: 5 %), close to the rate constants' agreement with JANAF.
TEST(ZeldovichRates, EquilibriumConstantAgreesWithOurSpeciesDataWithinTheKnownDataSetDifference) {
  const core::ZeldovichRates rates = core::hanson_salimian_1984_rates();
  const auto h298 = [](const char* formula) {
    return db().at(formula).enthalpy(units::kelvin(units::kReferenceTemperature_K)).value();
  };
  // Source: NIST-JANAF 4th ed., table N-005 [NO(g)], Delta_f H at 298.15 K = 90.291 kJ/mol.
  const double formation_difference_J = h298("NO") - 0.5 * h298("N2") - 0.5 * h298("O2") - 90291.0;
  EXPECT_TRUE(is_close(formation_difference_J, 970.0, 0.0, 10.0));  // 0.97 kJ/mol, docs/equilibrium.md
  for (double T = 1800.0; T <= 2500.0; T += 100.0) {
    const double ln_k_ours =
        -(2.0 * db().at("NO").g_over_RT(units::kelvin(T)) - db().at("N2").g_over_RT(units::kelvin(T)) - db().at("O2").g_over_RT(units::kelvin(T)));
    const double ours = std::exp(ln_k_ours);
    const double from_rates = rates.equilibrium_constant(units::kelvin(T));
    record_published_check(
        {"K of N2 + O2 = 2 NO from our species data against the Zeldovich rate constants", fmt::format("{:g} K", T),
         fmt::format("{:.4e} (derived: (k1f/k1r)(k2f/k2r))", from_rates), fmt::format("derived: {}", kHansonSalimian),
         "20 % relative: our NO formation enthalpy 0.97 kJ/mol above JANAF (-9 to -12 % in K) and the rate "
         "constants +3 to +4 % against JANAF",
         ours});
    EXPECT_TRUE(is_close(ours, from_rates, 0.20)) << T << " K";
    EXPECT_LT(ours, from_rates) << T << " K";
    const double corrected = ours * std::exp(2.0 * formation_difference_J / (kR * T));
    EXPECT_TRUE(is_close(corrected, from_rates, 0.05)) << T << " K";
  }
}

// Wrong if a global CO oxidation rate were converted from its published cgs / cal form with the wrong
// factor: the SI pre-exponential and activation temperature are converted back here.
TEST(CoOxidationRates, MatchThePublishedExpressions) {
  struct Published {
    core::CoOxidationRate rate;
    double a_cgs;
    double total_order;  // of the concentrations in k': (mol/cm^3)^order
    double e_cal_per_mol;
    const char* printed;
    const char* source;
  };
  const std::vector<Published> expressions{
      // Source: Dryer & Glassman (1973), 14th Symposium (Int.) on Combustion, 987-1003 (from memory).
      {core::CoOxidationRate::dryer_glassman_1973, std::pow(10.0, 14.6), 0.75, 40000.0, "10^14.6",
       "Dryer & Glassman (1973), 14th Symposium (Int.) on Combustion, 987-1003 (from memory)"},
      // Source: Howard, Williams & Fine (1973), 14th Symposium (Int.) on Combustion, 975-986 (from memory).
      {core::CoOxidationRate::howard_williams_fine_1973, 1.3e14, 1.0, 30000.0, "1.3e14",
       "Howard, Williams & Fine (1973), 14th Symposium (Int.) on Combustion, 975-986 (from memory)"},
  };
  for (const Published& p : expressions) {
    const core::CoRateExpression e = core::co_rate_expression(p.rate);
    EXPECT_TRUE(is_close(e.water_order + e.oxygen_order, p.total_order, 1e-15));
    // (m^3/mol)^order -> (cm^3/mol)^order: x 10^(6 order).
    const double a_cgs = e.pre_exponential_SI * std::pow(1e6, p.total_order);
    const double e_cal = e.activation_temperature_K * kR / kCalorie_J;
    record_published_check({fmt::format("pre-exponential factor of the CO oxidation rate, {}", e.name), "cgs units",
                            fmt::format("{} (cm3/mol)^{:g}/s", p.printed, p.total_order), p.source,
                            "1e-12 relative: unit conversion only", a_cgs});
    record_published_check({fmt::format("activation energy of the CO oxidation rate, {}", e.name), "cal/mol",
                            fmt::format("{:g} cal/mol", p.e_cal_per_mol), p.source,
                            "1e-12 relative: unit conversion only", e_cal});
    EXPECT_TRUE(is_close(a_cgs, p.a_cgs, 1e-12)) << e.name;
    EXPECT_TRUE(is_close(e_cal, p.e_cal_per_mol, 1e-12)) << e.name;
  }
}

}  // namespace
}  // namespace stackbound::reference
