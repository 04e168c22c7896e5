// The built-in species data (NASA 7-coefficient records from GRI-Mech 3.0 and Burcat & Ruscic 2005)
// against the NIST-JANAF Thermochemical Tables, 4th ed. (M. W. Chase Jr., J. Phys. Chem. Ref. Data
// Monograph 9, 1998), standard-state pressure 1 bar, T_r = 298.15 K.
//
// Pass criteria (issue 2): cp within 0.5 %; S within 0.3 J/(mol K); H - H(298.15 K) within 0.5 %
// at T >= 500 K (below that H - H298 is a small difference of large numbers and a relative
// criterion is ill-conditioned, so it is not applied); standard enthalpy of formation at 298.15 K
// within 0.5 kJ/mol, except where our record's source states a different value (NO, OH), where
// the difference between the two published values is stated and carried into the expectation.
//
// Every figure below was copied from the JANAF table named beside it, row by row.

#include <cmath>
#include <map>
#include <string>
#include <vector>

#include <fmt/format.h>
#include <gtest/gtest.h>

#include "stackbound/cases/species_file.hpp"
#include "stackbound/core/species.hpp"
#include "tests/support/published_check.hpp"
#include "tests/support/tolerance.hpp"
#include "stackbound/units/constants.hpp"

namespace stackbound::reference {
namespace {

using stackbound::testing::is_close;
using stackbound::testing::record_published_check;

constexpr double kR = units::kGasConstant_J_per_mol_K;
constexpr double kT298_K = units::kReferenceTemperature_K;

// Issue 2 criteria.
constexpr double kCpRelative = 0.005;
constexpr double kEntropyAbsolute_J_per_mol_K = 0.3;
constexpr double kEnthalpyChangeRelative = 0.005;
constexpr double kFormationEnthalpy_kJ_per_mol = 0.5;
// log10 Kf: 0.01 (K within 2.3 %); project tolerance, common practice, no source. JANAF prints 3 decimals.
constexpr double kLogKf = 0.01;

const core::Species& species(const std::string& formula) { return cases::builtin_species().at(formula); }

struct ThermoRow {
  const char* formula;
  const char* table;  // NIST-JANAF table number, for failure messages
  double temperature_K;
  double cp_J_per_mol_K;
  double s_J_per_mol_K;
  double h_minus_h298_kJ_per_mol;  // JANAF column H-H(Tr)
};

// Rows used with all three criteria. Temperatures: 298.15, 500, 1000, 1500, 2000, 3000 K for every
// species, except H2O above 1500 K and OH cp above 2000 K (see WaterAndHydroxylAtFlameTemperatures).
const std::vector<ThermoRow>& thermo_rows() {
  static const std::vector<ThermoRow> rows = {
      {"CO2", "C-095", 298.15, 37.129, 213.795, 0.0},    // Source: NIST-JANAF 4th ed., table C-095 (CO2), row 298.15 K
      {"CO2", "C-095", 500, 44.627, 234.901, 8.305},     // Source: NIST-JANAF 4th ed., table C-095 (CO2), row 500 K
      {"CO2", "C-095", 1000, 54.308, 269.299, 33.397},   // Source: NIST-JANAF 4th ed., table C-095 (CO2), row 1000 K
      {"CO2", "C-095", 1500, 58.379, 292.199, 61.705},   // Source: NIST-JANAF 4th ed., table C-095 (CO2), row 1500 K
      {"CO2", "C-095", 2000, 60.350, 309.293, 91.439},   // Source: NIST-JANAF 4th ed., table C-095 (CO2), row 2000 K
      {"CO2", "C-095", 3000, 62.229, 334.169, 152.852},  // Source: NIST-JANAF 4th ed., table C-095 (CO2), row 3000 K
      {"CO", "C-093", 298.15, 29.142, 197.653, 0.0},     // Source: NIST-JANAF 4th ed., table C-093 (CO), row 298.15 K
      {"CO", "C-093", 500, 29.794, 212.831, 5.931},      // Source: NIST-JANAF 4th ed., table C-093 (CO), row 500 K
      {"CO", "C-093", 1000, 33.183, 234.538, 21.690},    // Source: NIST-JANAF 4th ed., table C-093 (CO), row 1000 K
      {"CO", "C-093", 1500, 35.217, 248.426, 38.850},    // Source: NIST-JANAF 4th ed., table C-093 (CO), row 1500 K
      {"CO", "C-093", 2000, 36.250, 258.714, 56.744},    // Source: NIST-JANAF 4th ed., table C-093 (CO), row 2000 K
      {"CO", "C-093", 3000, 37.217, 273.623, 93.546},    // Source: NIST-JANAF 4th ed., table C-093 (CO), row 3000 K
      {"H2O", "H-064", 298.15, 33.590, 188.834, 0.0},    // Source: NIST-JANAF 4th ed., table H-064 (H2O), row 298.15 K
      {"H2O", "H-064", 500, 35.226, 206.534, 6.925},     // Source: NIST-JANAF 4th ed., table H-064 (H2O), row 500 K
      {"H2O", "H-064", 1000, 41.268, 232.738, 26.000},   // Source: NIST-JANAF 4th ed., table H-064 (H2O), row 1000 K
      {"H2O", "H-064", 1500, 47.090, 250.620, 48.151},   // Source: NIST-JANAF 4th ed., table H-064 (H2O), row 1500 K
      {"O2", "O-029", 298.15, 29.376, 205.147, 0.0},     // Source: NIST-JANAF 4th ed., table O-029 (O2), row 298.15 K
      {"O2", "O-029", 500, 31.091, 220.693, 6.084},      // Source: NIST-JANAF 4th ed., table O-029 (O2), row 500 K
      {"O2", "O-029", 1000, 34.870, 243.578, 22.703},    // Source: NIST-JANAF 4th ed., table O-029 (O2), row 1000 K
      {"O2", "O-029", 1500, 36.544, 258.068, 40.599},    // Source: NIST-JANAF 4th ed., table O-029 (O2), row 1500 K
      {"O2", "O-029", 2000, 37.741, 268.748, 59.175},    // Source: NIST-JANAF 4th ed., table O-029 (O2), row 2000 K
      {"O2", "O-029", 3000, 39.864, 284.466, 98.013},    // Source: NIST-JANAF 4th ed., table O-029 (O2), row 3000 K
      {"N2", "N-023", 298.15, 29.124, 191.609, 0.0},     // Source: NIST-JANAF 4th ed., table N-023 (N2), row 298.15 K
      {"N2", "N-023", 500, 29.580, 206.739, 5.911},      // Source: NIST-JANAF 4th ed., table N-023 (N2), row 500 K
      {"N2", "N-023", 1000, 32.697, 228.170, 21.463},    // Source: NIST-JANAF 4th ed., table N-023 (N2), row 1000 K
      {"N2", "N-023", 1500, 34.843, 241.880, 38.405},    // Source: NIST-JANAF 4th ed., table N-023 (N2), row 1500 K
      {"N2", "N-023", 2000, 35.971, 252.074, 56.137},    // Source: NIST-JANAF 4th ed., table N-023 (N2), row 2000 K
      {"N2", "N-023", 3000, 37.030, 266.891, 92.715},    // Source: NIST-JANAF 4th ed., table N-023 (N2), row 3000 K
      {"NO", "N-005", 298.15, 29.845, 210.758, 0.0},     // Source: NIST-JANAF 4th ed., table N-005 (NO), row 298.15 K
      {"NO", "N-005", 500, 30.486, 226.263, 6.059},      // Source: NIST-JANAF 4th ed., table N-005 (NO), row 500 K
      {"NO", "N-005", 1000, 33.987, 248.536, 22.229},    // Source: NIST-JANAF 4th ed., table N-005 (NO), row 1000 K
      {"NO", "N-005", 1500, 35.780, 262.703, 39.729},    // Source: NIST-JANAF 4th ed., table N-005 (NO), row 1500 K
      {"NO", "N-005", 2000, 36.647, 273.128, 57.859},    // Source: NIST-JANAF 4th ed., table N-005 (NO), row 2000 K
      {"NO", "N-005", 3000, 37.466, 288.165, 94.973},    // Source: NIST-JANAF 4th ed., table N-005 (NO), row 3000 K
      {"OH", "H-038", 298.15, 29.986, 183.708, 0.0},     // Source: NIST-JANAF 4th ed., table H-038 (OH), row 298.15 K
      {"OH", "H-038", 500, 29.521, 199.066, 5.992},      // Source: NIST-JANAF 4th ed., table H-038 (OH), row 500 K
      {"OH", "H-038", 1000, 30.676, 219.736, 20.935},    // Source: NIST-JANAF 4th ed., table H-038 (OH), row 1000 K
      {"OH", "H-038", 1500, 32.917, 232.602, 36.839},    // Source: NIST-JANAF 4th ed., table H-038 (OH), row 1500 K
      {"OH", "H-038", 2000, 34.670, 242.327, 53.762},    // Source: NIST-JANAF 4th ed., table H-038 (OH), row 2000 K
      {"H", "H-001", 298.15, 20.786, 114.716, 0.0},      // Source: NIST-JANAF 4th ed., table H-001 (H), row 298.15 K
      {"H", "H-001", 500, 20.786, 125.463, 4.196},       // Source: NIST-JANAF 4th ed., table H-001 (H), row 500 K
      {"H", "H-001", 1000, 20.786, 139.871, 14.589},     // Source: NIST-JANAF 4th ed., table H-001 (H), row 1000 K
      {"H", "H-001", 1500, 20.786, 148.299, 24.982},     // Source: NIST-JANAF 4th ed., table H-001 (H), row 1500 K
      {"H", "H-001", 2000, 20.786, 154.278, 35.375},     // Source: NIST-JANAF 4th ed., table H-001 (H), row 2000 K
      {"H", "H-001", 3000, 20.786, 162.706, 56.161},     // Source: NIST-JANAF 4th ed., table H-001 (H), row 3000 K
  };
  return rows;
}

// The JANAF table of a species, as named beside its rows above, for docs/validation.md.
std::string janaf_source(const std::string& formula) {
  for (const ThermoRow& row : thermo_rows()) {
    if (formula == row.formula) return fmt::format("NIST-JANAF 4th ed., table {} ({})", row.table, row.formula);
  }
  ADD_FAILURE() << "no JANAF table for " << formula;
  return "NIST-JANAF 4th ed.";
}

// Tolerances as stated for docs/validation.md (same numbers as the constants above).
constexpr const char* kCpCriterion = "0.5 % relative (issue 2 criterion)";
constexpr const char* kEntropyCriterion = "0.3 J/(mol K) absolute (issue 2 criterion)";
constexpr const char* kEnthalpyChangeCriterion =
    "0.5 % relative (issue 2 criterion; applied from 500 K, below which H - H298 is ill-conditioned)";

double cp_J_per_mol_K(const core::Species& s, double T) { return kR * s.cp_over_R(units::kelvin(T)); }
double s_J_per_mol_K(const core::Species& s, double T) { return kR * s.s_over_R(units::kelvin(T)); }
double h_J_per_mol(const core::Species& s, double T) { return kR * T * s.h_over_RT(units::kelvin(T)); }
double g_J_per_mol(const core::Species& s, double T) { return kR * T * s.g_over_RT(units::kelvin(T)); }

// Formation from the elements in their reference states (C graphite, H2, O2, N2 gas).
const std::map<std::string, std::map<std::string, double>>& formation_reactions() {
  static const std::map<std::string, std::map<std::string, double>> reactions = {
      {"CO2", {{"C(gr)", 1.0}, {"O2", 1.0}}},
      {"CO", {{"C(gr)", 1.0}, {"O2", 0.5}}},
      {"H2O", {{"H2", 1.0}, {"O2", 0.5}}},
      {"O2", {{"O2", 1.0}}},
      {"N2", {{"N2", 1.0}}},
      {"NO", {{"N2", 0.5}, {"O2", 0.5}}},
      {"OH", {{"H2", 0.5}, {"O2", 0.5}}},
      {"H", {{"H2", 0.5}}},
  };
  return reactions;
}

// Delta_f of a molar property `property` (h or g) of `formula` at T: species minus its elements.
template <typename Property>
double formation_J_per_mol(const std::string& formula, double T, Property property) {
  double value = property(species(formula), T);
  for (const auto& [element, count] : formation_reactions().at(formula)) value -= count * property(species(element), T);
  return value;
}

double log10_kf(const std::string& formula, double T) {
  return -formation_J_per_mol(formula, T, g_J_per_mol) / (kR * T * std::log(10.0));
}

// Differences in the standard enthalpy of formation at 298.15 K between the record we ship and
// JANAF, as stated by the two sources (kJ/mol). A log10 K involving the species then differs by
// about -difference / (R T ln 10): for NO 0.025 at 2000 K.
// (The GRI-Mech figures are as quoted with that source in the project's collected check values.)
// Source: GRI-Mech 3.0 (Smith et al., 1999), thermo30.dat record NO (RUS 78): 91.26 kJ/mol;
//         NIST-JANAF 4th ed., table N-005 (NO), row 298.15 K, delta-f H: 90.291 kJ/mol.
constexpr double kNoFormationDifference_kJ_per_mol = 91.26 - 90.291;
// Source: GRI-Mech 3.0 (Smith et al., 1999), thermo30.dat record OH (RUS 78): 39.35 kJ/mol;
//         NIST-JANAF 4th ed., table H-038 (OH), row 298.15 K, delta-f H: 38.987 kJ/mol.
constexpr double kOhFormationDifference_kJ_per_mol = 39.35 - 38.987;

double stated_difference_kJ_per_mol(const std::string& formula) {
  if (formula == "NO") return kNoFormationDifference_kJ_per_mol;
  if (formula == "OH") return kOhFormationDifference_kJ_per_mol;
  return 0.0;
}

// Wrong if a heat capacity coefficient (a1..a5) of a record were miscopied or the cp polynomial
// were evaluated wrongly.
TEST(JanafSpecies, HeatCapacityWithinHalfAPercent) {
  for (const ThermoRow& row : thermo_rows()) {
    record_published_check({fmt::format("cp, {}", row.formula), fmt::format("{:g} K", row.temperature_K),
                            fmt::format("{:.3f} J/(mol K)", row.cp_J_per_mol_K),
                            fmt::format("{}, row {:g} K", janaf_source(row.formula), row.temperature_K), kCpCriterion,
                            cp_J_per_mol_K(species(row.formula), row.temperature_K)});
    EXPECT_TRUE(is_close(cp_J_per_mol_K(species(row.formula), row.temperature_K), row.cp_J_per_mol_K, kCpRelative))
        << row.formula << " at " << row.temperature_K << " K (JANAF " << row.table << ")";
  }
}

// Wrong if an entropy constant (a7) or the entropy polynomial were off, or if a record were on a
// 1 atm basis (R ln 1.01325 = 0.109 J/(mol K) would still pass, so 1 atm is caught only together
// with the other checks; see the data file's note on N2 and Ar).
TEST(JanafSpecies, EntropyWithinThreeTenthsJoulePerMoleKelvin) {
  for (const ThermoRow& row : thermo_rows()) {
    record_published_check({fmt::format("S, {}", row.formula), fmt::format("{:g} K, 1 bar", row.temperature_K),
                            fmt::format("{:.3f} J/(mol K)", row.s_J_per_mol_K),
                            fmt::format("{}, row {:g} K", janaf_source(row.formula), row.temperature_K),
                            kEntropyCriterion, s_J_per_mol_K(species(row.formula), row.temperature_K)});
    EXPECT_TRUE(is_close(s_J_per_mol_K(species(row.formula), row.temperature_K), row.s_J_per_mol_K, 0.0,
                         kEntropyAbsolute_J_per_mol_K))
        << row.formula << " at " << row.temperature_K << " K (JANAF " << row.table << ")";
  }
}

// Wrong if the enthalpy polynomial (a1..a5 over T) were off; the energy balance of the adiabatic
// flame rests on these differences.
TEST(JanafSpecies, SensibleEnthalpyWithinHalfAPercentFromFiveHundredKelvin) {
  int checked = 0;
  for (const ThermoRow& row : thermo_rows()) {
    if (row.temperature_K < 500.0) continue;  // ill-conditioned near 298.15 K, see the header
    const core::Species& s = species(row.formula);
    const double h_minus_h298_kJ = (h_J_per_mol(s, row.temperature_K) - h_J_per_mol(s, kT298_K)) * 1e-3;
    record_published_check({fmt::format("H - H(298.15 K), {}", row.formula), fmt::format("{:g} K", row.temperature_K),
                            fmt::format("{:.3f} kJ/mol", row.h_minus_h298_kJ_per_mol),
                            fmt::format("{}, row {:g} K", janaf_source(row.formula), row.temperature_K),
                            kEnthalpyChangeCriterion, h_minus_h298_kJ});
    EXPECT_TRUE(is_close(h_minus_h298_kJ, row.h_minus_h298_kJ_per_mol, kEnthalpyChangeRelative))
        << row.formula << " at " << row.temperature_K << " K (JANAF " << row.table << ")";
    ++checked;
  }
  EXPECT_GE(checked, 8 * 3);  // three or more temperatures for each of the eight species
}

// Wrong if an enthalpy constant (a6) were miscopied, or an element's reference enthalpy were not zero.
TEST(JanafSpecies, EnthalpyOfFormationAtStandardTemperature) {
  struct Row {
    const char* formula;
    double janaf_kJ_per_mol;
  };
  const Row rows[] = {
      {"CO2", -393.522},  // Source: NIST-JANAF 4th ed., table C-095 (CO2), row 298.15 K, delta-f H
      {"CO", -110.527},   // Source: NIST-JANAF 4th ed., table C-093 (CO), row 298.15 K, delta-f H
      {"H2O", -241.826},  // Source: NIST-JANAF 4th ed., table H-064 (H2O g), row 298.15 K, delta-f H
      {"O2", 0.0},        // Source: NIST-JANAF 4th ed., table O-029 (O2, reference state), row 298.15 K
      {"N2", 0.0},        // Source: NIST-JANAF 4th ed., table N-023 (N2, reference state), row 298.15 K
      {"NO", 90.291},     // Source: NIST-JANAF 4th ed., table N-005 (NO), row 298.15 K, delta-f H
      {"OH", 38.987},     // Source: NIST-JANAF 4th ed., table H-038 (OH), row 298.15 K, delta-f H
      {"H", 217.999},     // Source: NIST-JANAF 4th ed., table H-001 (H), row 298.15 K, delta-f H
  };
  for (const Row& row : rows) {
    const double ours_kJ = formation_J_per_mol(row.formula, kT298_K, h_J_per_mol) * 1e-3;
    // JANAF plus the difference the two sources themselves state (0 except NO and OH), within the
    // issue's 0.5 kJ/mol: the tolerance is not widened to cover the data-set difference.
    const double expected_kJ = row.janaf_kJ_per_mol + stated_difference_kJ_per_mol(row.formula);
    const double difference_kJ = stated_difference_kJ_per_mol(row.formula);
    record_published_check(
        {fmt::format("delta-f H, {}", row.formula), "298.15 K", fmt::format("{:.3f} kJ/mol", row.janaf_kJ_per_mol),
         fmt::format("{}, row 298.15 K, delta-f H{}", janaf_source(row.formula),
                     difference_kJ == 0.0
                         ? ""
                         : fmt::format("; shifted by the GRI-Mech 3.0 (Smith et al., 1999) thermo30.dat "
                                       "record's stated {:.2f} kJ/mol (as quoted in the project's "
                                       "collected check values)",
                                       row.janaf_kJ_per_mol + difference_kJ)),
         difference_kJ == 0.0
             ? std::string("0.5 kJ/mol absolute (issue 2 criterion)")
             : fmt::format("0.5 kJ/mol absolute (issue 2 criterion) about JANAF {:+.3f} = {:.3f} kJ/mol, the "
                           "difference the two sources state (tolerance not widened)",
                           difference_kJ, expected_kJ),
         ours_kJ});
    EXPECT_TRUE(is_close(ours_kJ, expected_kJ, 0.0, kFormationEnthalpy_kJ_per_mol))
        << row.formula << ": ours " << ours_kJ << " kJ/mol, JANAF " << row.janaf_kJ_per_mol;
  }
}

// Wrong if NO or OH silently matched JANAF: that would mean the record is not the published
// GRI-Mech 3.0 one we claim to ship (the stated differences are 0.969 and 0.363 kJ/mol).
TEST(JanafSpecies, NitricOxideAndHydroxylCarryTheirSourcesStatedDifference) {
  const double no_kJ = formation_J_per_mol("NO", kT298_K, h_J_per_mol) * 1e-3;
  const double oh_kJ = formation_J_per_mol("OH", kT298_K, h_J_per_mol) * 1e-3;
  // Source: GRI-Mech 3.0 (Smith et al., 1999), thermo30.dat: NO 91.26, OH 39.35 kJ/mol (2 decimals printed).
  const char* gri_source =
      "GRI-Mech 3.0 (Smith et al., 1999), thermo30.dat (as quoted in the project's collected check values)";
  const char* gri_criterion = "0.01 kJ/mol absolute (2 decimals printed)";
  record_published_check({"delta-f H, NO (GRI-Mech 3.0 record)", "298.15 K", "91.26 kJ/mol",
                          std::string(gri_source) + ", record NO (RUS 78)", gri_criterion, no_kJ});
  EXPECT_TRUE(is_close(no_kJ, 91.26, 0.0, 0.01));
  record_published_check({"delta-f H, OH (GRI-Mech 3.0 record)", "298.15 K", "39.35 kJ/mol",
                          std::string(gri_source) + ", record OH (RUS 78)", gri_criterion, oh_kJ});
  EXPECT_TRUE(is_close(oh_kJ, 39.35, 0.0, 0.01));
}

// Wrong if the Gibbs energies that drive the equilibrium solver were off: formation constants of
// the species from their elements, with the stated NO/OH differences carried in.
TEST(JanafSpecies, FormationEquilibriumConstants) {
  struct Row {
    const char* formula;
    double temperature_K;
    double janaf_log10_kf;
  };
  const Row rows[] = {
      {"CO2", 1000, 20.679},  // Source: NIST-JANAF 4th ed., table C-095 (CO2), row 1000 K, log Kf
      {"CO2", 2000, 10.351},  // Source: NIST-JANAF 4th ed., table C-095 (CO2), row 2000 K, log Kf
      {"CO2", 3000, 6.886},   // Source: NIST-JANAF 4th ed., table C-095 (CO2), row 3000 K, log Kf
      {"CO", 1000, 10.461},   // Source: NIST-JANAF 4th ed., table C-093 (CO), row 1000 K, log Kf
      {"CO", 2000, 7.470},    // Source: NIST-JANAF 4th ed., table C-093 (CO), row 2000 K, log Kf
      {"CO", 3000, 6.404},    // Source: NIST-JANAF 4th ed., table C-093 (CO), row 3000 K, log Kf
      {"H2O", 1000, 10.060},  // Source: NIST-JANAF 4th ed., table H-064 (H2O g), row 1000 K, log Kf
      {"H2O", 2000, 3.540},   // Source: NIST-JANAF 4th ed., table H-064 (H2O g), row 2000 K, log Kf
      {"H2O", 2500, 2.223},   // Source: NIST-JANAF 4th ed., table H-064 (H2O g), row 2500 K, log Kf
      {"H2O", 3000, 1.344},   // Source: NIST-JANAF 4th ed., table H-064 (H2O g), row 3000 K, log Kf
      {"NO", 1000, -4.063},   // Source: NIST-JANAF 4th ed., table N-005 (NO), row 1000 K, log Kf
      {"NO", 2000, -1.699},   // Source: NIST-JANAF 4th ed., table N-005 (NO), row 2000 K, log Kf
      {"NO", 3000, -0.913},   // Source: NIST-JANAF 4th ed., table N-005 (NO), row 3000 K, log Kf
      {"OH", 1000, -1.222},   // Source: NIST-JANAF 4th ed., table H-038 (OH), row 1000 K, log Kf
      {"OH", 2000, -0.240},   // Source: NIST-JANAF 4th ed., table H-038 (OH), row 2000 K, log Kf
      {"OH", 3000, 0.074},    // Source: NIST-JANAF 4th ed., table H-038 (OH), row 3000 K, log Kf
      {"H", 1000, -8.644},    // Source: NIST-JANAF 4th ed., table H-001 (H), row 1000 K, log Kf
      {"H", 2000, -2.788},    // Source: NIST-JANAF 4th ed., table H-001 (H), row 2000 K, log Kf
      {"H", 3000, -0.801},    // Source: NIST-JANAF 4th ed., table H-001 (H), row 3000 K, log Kf
  };
  for (const Row& row : rows) {
    const double T = row.temperature_K;
    // A higher enthalpy of formation lowers log Kf by difference / (R T ln 10).
    const double shift = -stated_difference_kJ_per_mol(row.formula) * 1e3 / (kR * T * std::log(10.0));
    record_published_check(
        {fmt::format("log10 Kf, {}", row.formula), fmt::format("{:g} K, 1 bar", T),
         fmt::format("{:.3f}", row.janaf_log10_kf), fmt::format("{}, row {:g} K, log Kf", janaf_source(row.formula), T),
         fmt::format("0.01 absolute (K within 2.3 %; project tolerance, common practice, no source; JANAF prints "
                     "3 decimals){}",
                     shift == 0.0 ? ""
                                  : fmt::format(" about JANAF {:+.4f} = {:.4f}, the stated GRI-Mech 3.0 - JANAF "
                                                "delta-f H difference carried in",
                                                shift, row.janaf_log10_kf + shift)),
         log10_kf(row.formula, T)});
    EXPECT_TRUE(is_close(log10_kf(row.formula, T), row.janaf_log10_kf + shift, 0.0, kLogKf))
        << row.formula << " at " << T << " K (data-set shift " << shift << ")";
  }
  // The stated NO difference is worth 0.025 in log10 K at 2000 K (as noted in the header).
  EXPECT_TRUE(is_close(kNoFormationDifference_kJ_per_mol * 1e3 / (kR * 2000.0 * std::log(10.0)), 0.025, 0.02));
}

// KNOWN DATA-SET DIFFERENCE, not meeting issue 2's cp criterion: the GRI-Mech 3.0 H2O record
// (L 8/89) departs from JANAF above 1500 K, and the OH record (RUS 78) in cp above 2000 K.
// Measured with this build (ours vs JANAF):
//   H2O cp  +1.12 % at 2000 K, +1.67 % at 2500 K, +1.87 % at 3000 K
//   H2O S   +0.15, +0.31, +0.49 J/(mol K);  H - H298  +0.34 %, +0.63 %, +0.88 %
//   OH  cp  +0.55 % at 2500 K, +0.79 % at 3000 K (S and H - H298 within the criteria)
// The departures largely cancel in g = h - T s, so the formation constants above still agree
// (H2O log10 Kf within 0.005 at 3000 K); the energy balance of a flame sees the enthalpy part.
// This test holds the parts that do meet the criteria at these temperatures, and guards the
// H2O departure against growing (a miscopied coefficient would move it by far more).
TEST(JanafSpecies, WaterAndHydroxylAtFlameTemperatures) {
  const core::Species& h2o = species("H2O");
  const core::Species& oh = species("OH");
  const auto h_minus_h298_kJ = [](const core::Species& s, double T) {
    return (h_J_per_mol(s, T) - h_J_per_mol(s, kT298_K)) * 1e-3;
  };
  // Source: NIST-JANAF 4th ed., table H-064 (H2O g), row 2000 K: S 264.769, H-H298 72.790.
  const char* h2o_2000 = "NIST-JANAF 4th ed., table H-064 (H2O g), row 2000 K";
  record_published_check(
      {"S, H2O", "2000 K, 1 bar", "264.769 J/(mol K)", h2o_2000, kEntropyCriterion, s_J_per_mol_K(h2o, 2000.0)});
  EXPECT_TRUE(is_close(s_J_per_mol_K(h2o, 2000.0), 264.769, 0.0, kEntropyAbsolute_J_per_mol_K));
  record_published_check({"H - H(298.15 K), H2O", "2000 K", "72.790 kJ/mol", h2o_2000, kEnthalpyChangeCriterion,
                          h_minus_h298_kJ(h2o, 2000.0)});
  EXPECT_TRUE(is_close(h_minus_h298_kJ(h2o, 2000.0), 72.790, kEnthalpyChangeRelative));
  // Source: NIST-JANAF 4th ed., table H-038 (OH), rows 2500 K (S 250.202, H-H298 71.419) and
  // 3000 K (S 256.824, H-H298 89.584).
  record_published_check({"S, OH", "2500 K, 1 bar", "250.202 J/(mol K)",
                          "NIST-JANAF 4th ed., table H-038 (OH), row 2500 K", kEntropyCriterion,
                          s_J_per_mol_K(oh, 2500.0)});
  EXPECT_TRUE(is_close(s_J_per_mol_K(oh, 2500.0), 250.202, 0.0, kEntropyAbsolute_J_per_mol_K));
  record_published_check({"H - H(298.15 K), OH", "2500 K", "71.419 kJ/mol",
                          "NIST-JANAF 4th ed., table H-038 (OH), row 2500 K", kEnthalpyChangeCriterion,
                          h_minus_h298_kJ(oh, 2500.0)});
  EXPECT_TRUE(is_close(h_minus_h298_kJ(oh, 2500.0), 71.419, kEnthalpyChangeRelative));
  record_published_check({"S, OH", "3000 K, 1 bar", "256.824 J/(mol K)",
                          "NIST-JANAF 4th ed., table H-038 (OH), row 3000 K", kEntropyCriterion,
                          s_J_per_mol_K(oh, 3000.0)});
  EXPECT_TRUE(is_close(s_J_per_mol_K(oh, 3000.0), 256.824, 0.0, kEntropyAbsolute_J_per_mol_K));
  record_published_check({"H - H(298.15 K), OH", "3000 K", "89.584 kJ/mol",
                          "NIST-JANAF 4th ed., table H-038 (OH), row 3000 K", kEnthalpyChangeCriterion,
                          h_minus_h298_kJ(oh, 3000.0)});
  EXPECT_TRUE(is_close(h_minus_h298_kJ(oh, 3000.0), 89.584, kEnthalpyChangeRelative));
  // Regression guard on the known H2O departure (bounds = measured departure rounded up, not a
  // JANAF agreement claim). Source: NIST-JANAF 4th ed., table H-064 (H2O g), row 3000 K: cp 55.748,
  // S 286.504, H-H298 126.549.
  const char* h2o_3000 = "NIST-JANAF 4th ed., table H-064 (H2O g), row 3000 K";
  const char* guard = "regression guard, not a JANAF agreement claim: known GRI-Mech 3.0 H2O departure (measured ";
  record_published_check({"cp, H2O", "3000 K", "55.748 J/(mol K)", h2o_3000,
                          std::string("2 % relative (") + guard + "+1.87 %, rounded up; issue 2 asks 0.5 %)",
                          cp_J_per_mol_K(h2o, 3000.0)});
  EXPECT_TRUE(is_close(cp_J_per_mol_K(h2o, 3000.0), 55.748, 0.02));
  record_published_check(
      {"S, H2O", "3000 K, 1 bar", "286.504 J/(mol K)", h2o_3000,
       std::string("0.6 J/(mol K) absolute (") + guard + "+0.49 J/(mol K), rounded up; issue 2 asks 0.3)",
       s_J_per_mol_K(h2o, 3000.0)});
  EXPECT_TRUE(is_close(s_J_per_mol_K(h2o, 3000.0), 286.504, 0.0, 0.6));
  record_published_check({"H - H(298.15 K), H2O", "3000 K", "126.549 kJ/mol", h2o_3000,
                          std::string("1 % relative (") + guard + "+0.88 %, rounded up; issue 2 asks 0.5 %)",
                          h_minus_h298_kJ(h2o, 3000.0)});
  EXPECT_TRUE(is_close(h_minus_h298_kJ(h2o, 3000.0), 126.549, 0.01));
}

}  // namespace
}  // namespace stackbound::reference
