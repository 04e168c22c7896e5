// Checks against EU practice: Directive 2010/75/EU (IED) reference conditions and O2 levels, molar
// volumes, and the ppm -> mg/Nm3 factors derived from IUPAC atomic weights. Each figure names its
// source and status beside it.

#include <cmath>
#include <string>
#include <vector>

#include <fmt/format.h>
#include <gtest/gtest.h>

#include "stackbound/emissions/emissions.hpp"
#include "tests/support/published_check.hpp"
#include "tests/support/tolerance.hpp"
#include "stackbound/units/normal_conditions.hpp"

namespace stackbound::emissions {
namespace {

using stackbound::testing::is_close;
using stackbound::testing::record_published_check;

// The 5-digit factors' tolerance as stated for docs/validation.md.
constexpr const char* kFiveDigits = "0.005 % relative (figures given to 5 digits)";

// Wrong if the molar volumes behind every mg/Nm3 figure were off.
TEST(EuReferenceConditions, MolarVolumes) {
  // Source: CODATA 2018 molar volume of ideal gas, 273.15 K, 101.325 kPa: 22.413 969 54 L/mol (reproduction).
  record_published_check({"molar volume of an ideal gas", "273.15 K, 101.325 kPa", "22.413 969 54 L/mol",
                          "CODATA 2018 (reproduction)", "1e-9 relative (test states no reason)",
                          units::normal_0C().molar_volume_m3_per_mol() * 1e3});
  EXPECT_TRUE(is_close(units::normal_0C().molar_volume_m3_per_mol() * 1e3, 22.41396954, 1e-9));
  // Derived R T/p at the IED reference state 273.15 K, 101.3 kPa (Directive 2010/75/EU Annex V Part 1): 22.4195 L/mol.
  record_published_check({"molar volume of an ideal gas", "273.15 K, 101.3 kPa (IED reference state)", "22.4195 L/mol",
                          "derived: R T/p at the reference state of Directive 2010/75/EU Annex V Part 1",
                          "5e-6 relative (test states no reason)",
                          units::normal_eu_ied().molar_volume_m3_per_mol() * 1e3});
  EXPECT_TRUE(is_close(units::normal_eu_ied().molar_volume_m3_per_mol() * 1e3, 22.4195, 5e-6));
  // Derived R T/p at 293.15 K, 101.325 kPa: 24.0551 L/mol.
  record_published_check({"molar volume of an ideal gas", "293.15 K, 101.325 kPa", "24.0551 L/mol", "derived: R T/p",
                          "5e-6 relative (test states no reason)",
                          units::normal_20C().molar_volume_m3_per_mol() * 1e3});
  EXPECT_TRUE(is_close(units::normal_20C().molar_volume_m3_per_mol() * 1e3, 24.0551, 5e-6));
}

double mg_per_Nm3_per_ppm(const char* pollutant, const units::NormalConditions& normal) {
  const Concentration one(1.0, pollutant_by_name(pollutant, "p"), parse_basis("ppmv, dry", "b"));
  return one.to(make_basis(mass_unit("mg/Nm3", normal), Moisture::dry, DiluentReference::as_measured()), {}).value();
}

// Wrong if a molar mass or the 0 degC molar volume were off.
TEST(EuReferenceConditions, PpmToMilligramFactorsAtZeroCelsius) {
  // Derived: M / 22.41397 L/mol with IUPAC atomic weights (M = 46.005, 30.006, 64.058, 28.010, 44.009 g/mol),
  // 273.15 K, 101.325 kPa: NO2 2.0525, NO 1.3387, SO2 2.8579, CO 1.2497, CO2 1.9635 (mg/m3)/ppm; given to 5 digits.
  const auto record = [](const char* pollutant, const char* molar_mass, const char* factor) {
    record_published_check(
        {fmt::format("ppm to mg/m3 factor, {}", pollutant), "dry, 273.15 K, 101.325 kPa",
         fmt::format("{} (mg/m3)/ppm", factor),
         fmt::format("derived: M / 22.41397 L/mol, M = {} g/mol from IUPAC atomic weights", molar_mass), kFiveDigits,
         mg_per_Nm3_per_ppm(pollutant, units::normal_0C())});
  };
  record("NOx", "46.005 (as NO2)", "2.0525");
  EXPECT_TRUE(is_close(mg_per_Nm3_per_ppm("NOx", units::normal_0C()), 2.0525, 5e-5));
  record("NO2", "46.005", "2.0525");
  EXPECT_TRUE(is_close(mg_per_Nm3_per_ppm("NO2", units::normal_0C()), 2.0525, 5e-5));
  record("NO", "30.006", "1.3387");
  EXPECT_TRUE(is_close(mg_per_Nm3_per_ppm("NO", units::normal_0C()), 1.3387, 5e-5));
  record("SO2", "64.058", "2.8579");
  EXPECT_TRUE(is_close(mg_per_Nm3_per_ppm("SO2", units::normal_0C()), 2.8579, 5e-5));
  record("CO", "28.010", "1.2497");
  EXPECT_TRUE(is_close(mg_per_Nm3_per_ppm("CO", units::normal_0C()), 1.2497, 5e-5));
  record("CO2", "44.009", "1.9635");
  EXPECT_TRUE(is_close(mg_per_Nm3_per_ppm("CO2", units::normal_0C()), 1.9635, 5e-5));
}

// Wrong if the IED pressure 101.3 kPa (not 101.325 kPa) were ignored.
TEST(EuReferenceConditions, IedReferenceStateUses101Point3Kilopascal) {
  // Source: Directive 2010/75/EU Annex V Part 1: 273.15 K, 101.3 kPa, dry (reproduction). The factor scales by p.
  const char* ied = "Directive 2010/75/EU Annex V Part 1: 273.15 K, 101.3 kPa, dry (reproduction)";
  record_published_check({"ppm to mg/m3 factor, NOx as NO2", "dry, 273.15 K, 101.3 kPa (IED reference state)",
                          fmt::format("{:#.5g} (mg/m3)/ppm", 2.0525 * 101.3 / 101.325),
                          fmt::format("derived: 2.0525 (at 101.325 kPa, above) x 101.3/101.325; {}", ied), kFiveDigits,
                          mg_per_Nm3_per_ppm("NOx", units::normal_eu_ied())});
  EXPECT_TRUE(is_close(mg_per_Nm3_per_ppm("NOx", units::normal_eu_ied()), 2.0525 * 101.3 / 101.325, 5e-5));
  record_published_check(
      {"ppm to mg/m3 factor at the IED state over the factor at 101.325 kPa, NOx", "dry, 273.15 K",
       fmt::format("{:.6g} (101.3/101.325)", 101300.0 / 101325.0), fmt::format("derived: {}", ied),
       "1e-14 relative (the factor scales by p: arithmetic only)",
       mg_per_Nm3_per_ppm("NOx", units::normal_eu_ied()) / mg_per_Nm3_per_ppm("NOx", units::normal_0C())});
  EXPECT_TRUE(is_close(mg_per_Nm3_per_ppm("NOx", units::normal_eu_ied()) / mg_per_Nm3_per_ppm("NOx", units::normal_0C()),
                       101300.0 / 101325.0, 1e-14));
}

// Wrong if the Annex V reference O2 presets were not 6 / 3 / 15 % or the Annex VI one not 11 %.
TEST(EuReferenceConditions, AnnexReferenceO2) {
  // Source: Directive 2010/75/EU Annex V Part 1 point 1 (reproduction): solid 6 %, liquid & gaseous 3 %, GT & engines 15 %.
  const auto record = [](const char* preset, const char* published, const char* source) {
    record_published_check(
        {"reference O2 of a preset", fmt::format("O2={}", preset), published, source,
         "1e-15 relative (a stated figure, reproduced exactly)",
         parse_basis(fmt::format("ppmv, dry, O2={}", preset), "b").reference.dry_fraction() * 100.0});
  };
  const char* annex_v = "Directive 2010/75/EU Annex V Part 1 point 1 (reproduction)";
  record("ied-solid", "6 % dry (solid fuels)", annex_v);
  EXPECT_TRUE(is_close(parse_basis("ppmv, dry, O2=ied-solid", "b").reference.dry_fraction(), 0.06, 1e-15));
  record("ied-liquid-gaseous", "3 % dry (liquid and gaseous fuels)", annex_v);
  EXPECT_TRUE(is_close(parse_basis("ppmv, dry, O2=ied-liquid-gaseous", "b").reference.dry_fraction(), 0.03, 1e-15));
  record("ied-gas-turbine", "15 % dry (gas turbines and engines)", annex_v);
  EXPECT_TRUE(is_close(parse_basis("ppmv, dry, O2=ied-gas-turbine", "b").reference.dry_fraction(), 0.15, 1e-15));
  record("ied-gas-engine", "15 % dry (gas turbines and engines)", annex_v);
  EXPECT_TRUE(is_close(parse_basis("ppmv, dry, O2=ied-gas-engine", "b").reference.dry_fraction(), 0.15, 1e-15));
  // Source: Directive 2010/75/EU Annex VI: waste incineration 11 % O2 (from memory).
  record("ied-waste-incineration", "11 % dry (waste incineration)", "Directive 2010/75/EU Annex VI (from memory)");
  EXPECT_TRUE(is_close(parse_basis("ppmv, dry, O2=ied-waste-incineration", "b").reference.dry_fraction(), 0.11, 1e-15));
}

// Wrong if the Annex VI Part 7 standardisation E_S = (21 - O_S)/(21 - O_M) E_M were not applied with 21.
TEST(EuReferenceConditions, AnnexViStandardisationFormula) {
  // Source: Directive 2010/75/EU Annex VI Part 7 (from memory). Invented measurement: 100 mg/Nm3 at 8 % O2 -> 11 %.
  ConcentrationContext context;
  context.o2_basis = O2Basis::eu_21;
  context.o2_dry_fraction = 0.08;
  const Concentration measured(100.0, pollutant_by_name("CO", "p"), parse_basis("mg/Nm3, dry, normal=IED", "b"));
  record_published_check({"standardised concentration E_S = (21 - O_S)/(21 - O_M) E_M, CO",
                          "100 mg/Nm3 measured at 8 % O2 dry, to 11 % O2 (invented measurement)",
                          fmt::format("{:.6g} mg/Nm3 (formula)", 100.0 * (21.0 - 11.0) / (21.0 - 8.0)),
                          "Directive 2010/75/EU Annex VI Part 7 (from memory)", "1e-14 relative (arithmetic only)",
                          measured.to(parse_basis("mg/Nm3, dry, O2=11%, normal=IED", "b"), context).value()});
  EXPECT_TRUE(is_close(measured.to(parse_basis("mg/Nm3, dry, O2=11%, normal=IED", "b"), context).value(),
                       100.0 * (21.0 - 11.0) / (21.0 - 8.0), 1e-14));
}

// Wrong if screening against an Annex V limit converted with the wrong conditions or O2.
TEST(EuReferenceConditions, ScreeningAgainstTheGasTurbineNoxLimit) {
  // Source: Directive 2010/75/EU Annex V Part 2 point 6: gas turbines, NOx 50 mg/Nm3 (reproduction), at 15 % O2,
  // 273.15 K, 101.3 kPa, dry (Annex V Part 1). Invented value: 20 ppmvd NOx at 15 % O2.
  const Concentration value(20.0, pollutant_by_name("NOx", "p"), parse_basis("ppmv, dry, O2=15%", "b"));
  const Concentration limit(50.0, pollutant_by_name("NOx", "p"), parse_basis("mg/Nm3, dry, O2=15%, normal=IED", "b"));
  ConcentrationContext context;
  context.o2_basis = O2Basis::eu_21;
  const ScreeningResult result = screen_concentration(value, limit, context);
  const double hand_mg = 20.0 * 46.005 / 22.4195;  // M(NO2) / V_m(IED) from the checks above
  record_published_check({"screened value, NOx as NO2", "20 ppmvd at 15 % O2 (invented value), IED reference state",
                          fmt::format("{:#.5g} mg/Nm3 (hand calculation)", hand_mg),
                          "derived: 20 ppm x M(NO2) 46.005 g/mol (IUPAC) / V_m 22.4195 L/mol at 273.15 K, 101.3 kPa "
                          "(Directive 2010/75/EU Annex V Part 1, reproduction)",
                          kFiveDigits, result.value});
  record_published_check({"fraction of the gas-turbine NOx limit", "20 ppmvd at 15 % O2 (invented value)",
                          fmt::format("{:#.5g} of 50 mg/Nm3", hand_mg / 50.0),
                          "Directive 2010/75/EU Annex V Part 2 point 6: gas turbines, NOx 50 mg/Nm3 at 15 % O2, "
                          "273.15 K, 101.3 kPa, dry (reproduction)",
                          kFiveDigits, result.fraction_of_limit});
  EXPECT_TRUE(is_close(result.value, hand_mg, 5e-5));
  EXPECT_TRUE(is_close(result.fraction_of_limit, hand_mg / 50.0, 5e-5));
  EXPECT_EQ(result.outcome, ScreeningOutcome::below_limit);
}

// Every basis the language can state, for one pollutant that admits all of them (NO, also "as NO2").
std::vector<Basis> every_basis() {
  const std::vector<std::string> units_text = {
      "ppmv",          "ppbv",           "%",           "mg/Nm3, normal=0C", "ug/Nm3, normal=IED", "g/Nm3, normal=15C",
      "mg/m3, normal=20C", "kg/ft3, normal=60F", "mg/Sm3", "mg/dscm",       "ng/dscm",           "gr/dscf",
      "lb/dscf",       "lb/scf"};
  const std::vector<std::string> levels = {"as measured", "O2=0%", "O2=3%", "O2=6%", "O2=11%", "O2=15%", "CO2=12%", "CO2=100%"};
  std::vector<Basis> bases;
  for (const std::string& unit : units_text) {
    for (const char* moisture : {"wet", "dry"}) {
      for (const std::string& level : levels) {
        for (const bool as_no2 : {false, true}) {
          if (std::string(moisture) == "wet" && level != "as measured") continue;  // corrected levels are dry
          if (std::string(moisture) == "wet" && (unit == "mg/dscm" || unit == "ng/dscm" || unit == "gr/dscf" ||
                                                 unit == "lb/dscf")) {
            continue;  // dry units
          }
          const std::string text = unit + ", " + moisture + ", " + level + (as_no2 ? ", as NO2" : "");
          bases.push_back(parse_basis(text, "basis"));
        }
      }
    }
  }
  return bases;
}

// Wrong if any conversion and its inverse did not return the starting value to 1e-12 relative.
TEST(EuReferenceConditions, RoundTripThroughEveryBasis) {
  const std::vector<Basis> bases = every_basis();
  ASSERT_GT(bases.size(), 200U);
  const Pollutant no = pollutant_by_name("NO", "p");
  // For docs/validation.md: the returned value farthest from the start, over every round trip below.
  double farthest_mg = 137.25;
  const auto track = [&farthest_mg](double returned_mg) {
    if (std::abs(returned_mg - 137.25) > std::abs(farthest_mg - 137.25) || !std::isfinite(returned_mg)) {
      farthest_mg = returned_mg;
    }
  };
  for (const O2Basis o2_basis : {O2Basis::eu_21, O2Basis::us_epa_20_9}) {
    ConcentrationContext context;
    context.moisture_fraction = 0.147;
    context.o2_dry_fraction = 0.0612;
    context.co2_dry_fraction = 0.0873;
    context.o2_basis = o2_basis;
    const Concentration start(137.25, no, parse_basis("mg/Nm3, dry, O2=3%, normal=IED", "b"));
    Concentration chained = start;
    for (const Basis& basis : bases) {
      SCOPED_TRACE(basis.text());
      const Concentration there = start.to(basis, context);
      track(there.to(start.basis(), context).value());
      EXPECT_TRUE(is_close(there.to(start.basis(), context).value(), start.value(), stackbound::testing::kRoundTrip));
      chained = chained.to(basis, context);
    }
    // The whole chain through every basis, then back.
    track(chained.to(start.basis(), context).value());
    EXPECT_TRUE(is_close(chained.to(start.basis(), context).value(), start.value(), stackbound::testing::kRoundTrip));
  }
  // One summary row rather than one per basis: no published value, a conversion and its inverse.
  record_published_check(
      {"round trip through every basis: returned value farthest from the start, NO",
       fmt::format("137.25 mg/Nm3 dry, 3 % O2, IED state; to each of {} bases and back, and through all of them in a "
                   "chain; O2 conventions 21 and 20.9; moisture 14.7 %, O2 6.12 % dry, CO2 8.73 % dry",
                   bases.size()),
       "137.25 mg/Nm3 (the start)", "none: internal consistency, no published value",
       "1e-12 relative (kRoundTrip: a conversion and its inverse differ by rounding only)", farthest_mg});
}

}  // namespace
}  // namespace stackbound::emissions
