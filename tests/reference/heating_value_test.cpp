// Heating values computed from the species data against published values. Each figure names its
// source and status beside it. Pass criterion 0.3 % (the issue's), which covers the difference
// between our species data (GRI-Mech 3.0 / Burcat) and NIST-JANAF (CH4: -74.60 vs -74.873 kJ/mol).

#include <string>

#include <gtest/gtest.h>

#include "stackbound/cases/species_file.hpp"
#include "stackbound/core/fuel.hpp"
#include "stackbound/core/fuel_presets.hpp"
#include "tests/support/published_check.hpp"
#include "tests/support/tolerance.hpp"
#include "stackbound/units/quantity_parser.hpp"

namespace stackbound::core {
namespace {

using stackbound::testing::is_close;
using stackbound::testing::record_published_check;

constexpr double kHandbook = 0.003;
// kHandbook as stated for docs/validation.md.
constexpr const char* kHandbookCriterion =
    "0.3 % relative (issue criterion; covers our species data, GRI-Mech 3.0 / Burcat, vs NIST-JANAF: CH4 -74.60 vs "
    "-74.873 kJ/mol)";
constexpr const char* kGas = "gas, 298.15 K, products at 298.15 K";

const SpeciesDatabase& db() { return cases::builtin_species(); }

Fuel pure(const char* formula) {
  GasFuelSpec spec;
  spec.name = formula;
  spec.composition_percent = {{formula, 100.0}};
  return Fuel::gas(spec, db());
}

double hhv_kJ_per_mol(const Fuel& f) { return f.hhv_J_per_kg() * *f.molar_mass_kg_per_mol() * 1e-3; }
double lhv_kJ_per_mol(const Fuel& f) { return f.lhv_J_per_kg() * *f.molar_mass_kg_per_mol() * 1e-3; }

// Wrong if the methane heating values (the base of every natural-gas figure) were off.
TEST(HeatingValues, Methane) {
  // Derived from NIST-JANAF 4th ed. Delta_f H at 298.15 K: CO2 -393.522 (C-095), H2O(l) -285.830
  // (H-063), H2O(g) -241.826 (H-064), CH4 -74.873 (C-067): HHV 890.309, LHV 802.301 kJ/mol.
  const Fuel ch4 = pure("CH4");
  const char* source =
      "derived from NIST-JANAF 4th ed. delta-f H at 298.15 K: CO2 (C-095), H2O(l) (H-063), H2O(g) (H-064), CH4 (C-067)";
  record_published_check({"HHV, CH4", kGas, "890.309 kJ/mol", source, kHandbookCriterion, hhv_kJ_per_mol(ch4)});
  EXPECT_TRUE(is_close(hhv_kJ_per_mol(ch4), 890.309, kHandbook));
  record_published_check({"LHV, CH4", kGas, "802.301 kJ/mol", source, kHandbookCriterion, lhv_kJ_per_mol(ch4)});
  EXPECT_TRUE(is_close(lhv_kJ_per_mol(ch4), 802.301, kHandbook));
}

// Wrong if the hydrogen heating values were off (the vaporisation enthalpy is the whole HHV-LHV gap).
TEST(HeatingValues, Hydrogen) {
  // Derived from NIST-JANAF 4th ed.: HHV = -Delta_f H H2O(l) = 285.830, LHV = -Delta_f H H2O(g) = 241.826 kJ/mol.
  const Fuel h2 = pure("H2");
  record_published_check({"HHV, H2", kGas, "285.830 kJ/mol",
                          "derived from NIST-JANAF 4th ed.: -delta-f H of H2O(l) (H-063)", kHandbookCriterion,
                          hhv_kJ_per_mol(h2)});
  EXPECT_TRUE(is_close(hhv_kJ_per_mol(h2), 285.830, kHandbook));
  record_published_check({"LHV, H2", kGas, "241.826 kJ/mol",
                          "derived from NIST-JANAF 4th ed.: -delta-f H of H2O(g) (H-064)", kHandbookCriterion,
                          lhv_kJ_per_mol(h2)});
  EXPECT_TRUE(is_close(lhv_kJ_per_mol(h2), 241.826, kHandbook));
}

// Wrong if a fuel that forms no water got an HHV different from its LHV.
TEST(HeatingValues, CarbonMonoxide) {
  // Derived from NIST-JANAF 4th ed. (C-093, C-095): heat of combustion of CO 282.995 kJ/mol.
  const Fuel co = pure("CO");
  record_published_check({"HHV, CO", kGas, "282.995 kJ/mol", "derived from NIST-JANAF 4th ed. (C-093, C-095)",
                          kHandbookCriterion, hhv_kJ_per_mol(co)});
  EXPECT_TRUE(is_close(hhv_kJ_per_mol(co), 282.995, kHandbook));
  EXPECT_TRUE(is_close(lhv_kJ_per_mol(co), hhv_kJ_per_mol(co), 1e-14));
}

// Wrong if the ethane or propane heating values were off.
TEST(HeatingValues, EthaneAndPropane) {
  // Source: NIST Chemistry WebBook, standard enthalpy of combustion of the gas at 298.15 K: ethane
  // -1560.7 kJ/mol, propane -2219.2 kJ/mol (from memory). LHV derived: HHV minus n_H2O x 44.004 kJ/mol
  // (NIST-JANAF H-063/H-064): ethane 1560.7 - 3 x 44.004 = 1428.688, propane 2219.2 - 4 x 44.004 = 2043.184.
  const Fuel c2h6 = pure("C2H6");
  const Fuel c3h8 = pure("C3H8");
  const char* webbook = "NIST Chemistry WebBook, standard enthalpy of combustion of the gas at 298.15 K (from memory)";
  const char* lhv_source = "derived: WebBook HHV (from memory) minus n_H2O x 44.004 kJ/mol (NIST-JANAF H-063/H-064)";
  record_published_check({"HHV, C2H6", kGas, "1560.7 kJ/mol", webbook, kHandbookCriterion, hhv_kJ_per_mol(c2h6)});
  EXPECT_TRUE(is_close(hhv_kJ_per_mol(c2h6), 1560.7, kHandbook));
  record_published_check({"HHV, C3H8", kGas, "2219.2 kJ/mol", webbook, kHandbookCriterion, hhv_kJ_per_mol(c3h8)});
  EXPECT_TRUE(is_close(hhv_kJ_per_mol(c3h8), 2219.2, kHandbook));
  record_published_check({"LHV, C2H6", kGas, "1428.688 kJ/mol", lhv_source, kHandbookCriterion, lhv_kJ_per_mol(c2h6)});
  EXPECT_TRUE(is_close(lhv_kJ_per_mol(c2h6), 1428.688, kHandbook));
  record_published_check({"LHV, C3H8", kGas, "2043.184 kJ/mol", lhv_source, kHandbookCriterion, lhv_kJ_per_mol(c3h8)});
  EXPECT_TRUE(is_close(lhv_kJ_per_mol(c3h8), 2043.184, kHandbook));
}

// Wrong if per-mass heating values used a wrong molar mass.
TEST(HeatingValues, MethanePerMass) {
  // Derived: 890.309 kJ/mol (JANAF, above) / 16.043 g/mol (IUPAC conventional atomic weights) = 55.495 MJ/kg.
  record_published_check({"HHV per mass, CH4", kGas, "55.495 MJ/kg",
                          "derived: 890.309 kJ/mol (NIST-JANAF, above) / 16.043 g/mol (IUPAC conventional atomic "
                          "weights)",
                          kHandbookCriterion, pure("CH4").hhv_J_per_kg() * 1e-6});
  EXPECT_TRUE(is_close(pure("CH4").hhv_J_per_kg() * 1e-6, 55.495, kHandbook));
}

// Wrong if a gas mixture's heating value per standard cubic foot were far from the regulatory default
// for pipeline gas (our preset is a typical composition; the class spans a few percent: criterion 3 %).
TEST(HeatingValues, NaturalGasPerStandardCubicFoot) {
  const Fuel ng = preset_fuel("natural_gas", db());
  const double btu_per_scf =
      units::convert_from_si(ng.hhv_J_per_kg() * *ng.molar_mass_kg_per_mol(), units::Dimension::molar_energy, "Btu/scf");
  // Source: 40 CFR Part 98 Subpart NN, Table NN-1, default HHV of natural gas 1.026 MMBtu/Mscf (reproduction).
  // Our scf is at 60 degF, 14.696 psia; Part 98's standard conditions are 60 or 68 degF (from memory),
  // a further 1.5 % spread.
  record_published_check({"HHV per standard cubic foot, natural gas (preset)", "ours 60 degF, 14.696 psia",
                          "1026 Btu/scf (printed 1.026 MMBtu/Mscf)",
                          "40 CFR Part 98 Subpart NN, Table NN-1, default HHV of natural gas (reproduction)",
                          "3 % relative (typical composition, the class spans a few percent; Part 98 standard "
                          "conditions 60 or 68 degF, from memory, a further 1.5 %)",
                          btu_per_scf});
  EXPECT_TRUE(is_close(btu_per_scf, 1026.0, 0.03));
}

// Wrong if the Channiwala-Parikh correlation were miscoded: applied to methane's own analysis it
// must come near methane's HHV. Source of the correlation's stated average absolute error, 1.45 %:
// Channiwala & Parikh, Fuel 81 (2002) 1051 (from memory); criterion twice that.
TEST(HeatingValues, ChanniwalaParikhCorrelationOnMethane) {
  const AsFiredAnalysis a = pure("CH4").as_fired_analysis();
  UltimateAnalysis analysis;
  analysis.carbon_percent = a.carbon_percent;
  analysis.hydrogen_percent = a.hydrogen_percent;
  analysis.oxygen_percent = 0.0;
  record_published_check(
      {"HHV by the Channiwala-Parikh correlation, CH4 analysis", "C and H mass % of CH4, no O", "55.495 MJ/kg",
       "derived from NIST-JANAF (CH4 HHV per mass, above); correlation's stated average absolute error 1.45 %: "
       "Channiwala & Parikh, Fuel 81 (2002) 1051 (from memory)",
       "2.9 % relative (twice the correlation's stated average absolute error)",
       estimate_hhv_dry_J_per_kg(analysis, HeatingValueCorrelation::channiwala_parikh) * 1e-6});
  EXPECT_TRUE(is_close(estimate_hhv_dry_J_per_kg(analysis, HeatingValueCorrelation::channiwala_parikh), 55.495e6, 0.029));
}

// Wrong if the pentane and hexane records (Burcat & Ruscic 2005, added for pipeline-gas analyses)
// were mistyped: their heating values follow from their enthalpies of formation.
TEST(HeatingValues, PentanesAndHexane) {
  // Source: NIST Chemistry WebBook, standard enthalpy of combustion of the gas at 298.15 K: n-pentane
  // -3535 kJ/mol, isopentane -3528 kJ/mol, n-hexane -4195 kJ/mol (from memory: liquid values plus the
  // enthalpy of vaporisation). Criterion 0.5 % (from memory: looser than the handbook criterion).
  const char* webbook =
      "NIST Chemistry WebBook, standard enthalpy of combustion of the gas at 298.15 K (from memory; liquid value plus "
      "enthalpy of vaporisation)";
  const char* criterion = "0.5 % relative (a value from memory: looser than the 0.3 % handbook criterion)";
  const struct {
    const char* formula;
    double hhv_kJ_per_mol;
    const char* published;
  } checks[] = {{"n-C5H12", 3535.0, "3535 kJ/mol"}, {"i-C5H12", 3528.0, "3528 kJ/mol"}, {"n-C6H14", 4195.0, "4195 kJ/mol"}};
  for (const auto& check : checks) {
    const double hhv = hhv_kJ_per_mol(pure(check.formula));
    record_published_check({std::string("HHV, ") + check.formula, kGas, check.published, webbook, criterion, hhv});
    EXPECT_TRUE(is_close(hhv, check.hhv_kJ_per_mol, 0.005)) << check.formula << ": " << hhv;
  }
}

}  // namespace
}  // namespace stackbound::core
