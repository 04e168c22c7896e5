// Adiabatic flame temperatures (HP equilibrium, core/adiabatic_flame.hpp) of stoichiometric fuel-air
// mixtures from 298.15 K against handbook values, and complete-combustion ("frozen", no
// dissociation) temperatures against values derived from the NIST-JANAF tables.
//
// Air is O2 + 3.76 N2, the handbooks' convention. Pass criteria (issue 3): within 15 K of the
// handbook figure. The handbook figures below were recalled from memory, not read from a copy;
// Glassman & Yetter print theirs to the nearest 10 K ("approximate flame temperatures"), so their
// unrounded value may lie 5 K either side and the criterion becomes 15 K + 5 K for those figures.

#include <gtest/gtest.h>

#include <fmt/format.h>

#include <cmath>
#include <string>
#include <vector>

#include "stackbound/cases/species_file.hpp"
#include "stackbound/core/adiabatic_flame.hpp"
#include "stackbound/core/element_amounts.hpp"
#include "stackbound/core/equilibrium.hpp"
#include "tests/support/published_check.hpp"
#include "stackbound/units/constants.hpp"

namespace stackbound::reference {
namespace {

constexpr double kAtm_Pa = units::kStandardAtmosphere_Pa;
constexpr double kT0_K = units::kReferenceTemperature_K;
constexpr double kHandbookTolerance_K = 15.0;
constexpr double kTenKelvinRounding_K = 5.0;

const core::SpeciesDatabase& db() { return cases::builtin_species(); }

struct Fuel {
  const char* formula;
  double oxygen;  // mol O2 per mol fuel for complete combustion
};

std::vector<core::SpeciesAmount> stoichiometric_air_feed(const Fuel& fuel) {
  return {{fuel.formula, 1.0}, {"O2", fuel.oxygen}, {"N2", 3.76 * fuel.oxygen}};
}

// HP equilibrium with every product the data offers (or the given list), feed at 298.15 K.
core::EquilibriumResult flame(const Fuel& fuel, double pressure_Pa, std::vector<std::string> products = {}) {
  const std::vector<core::SpeciesAmount> feed = stoichiometric_air_feed(fuel);
  const core::ElementAmounts b = core::element_amounts(db(), feed);
  const core::EquilibriumSolver solver(db(), b, std::move(products));
  return solver.solve_hp(b, core::feed_enthalpy(db(), feed, units::kelvin(kT0_K)), units::pascals(pressure_Pa));
}

// Records the comparison for docs/validation.md and asserts it.
void expect_flame(const std::string& quantity, const std::string& conditions, double tool_K, double published_K,
                  double tolerance_K, const std::string& source, const std::string& why) {
  stackbound::testing::record_published_check(
      {quantity, conditions, fmt::format("{:.0f} K", published_K), source, fmt::format("{:g} K ({})", tolerance_K, why),
       tool_K});
  EXPECT_NEAR(tool_K, published_K, tolerance_K) << quantity << ", " << conditions;
}

constexpr const char* kTurns = "Turns, An Introduction to Combustion, 2nd ed. (2000), App. B, Table B.1 (from memory)";
constexpr const char* kGlassman =
    "Glassman and Yetter, Combustion, 4th ed. (2008), Ch. 1, approximate flame temperatures (from memory)";

const Fuel kHydrogen{"H2", 0.5};
const Fuel kMethane{"CH4", 2.0};
const Fuel kEthane{"C2H6", 3.5};
const Fuel kPropane{"C3H8", 5.0};
const Fuel kCarbonMonoxide{"CO", 0.5};

// Wrong if the HP solution (energy balance + dissociation) were off: methane, ethane and propane
// with air. Source: S. R. Turns, An Introduction to Combustion, 2nd ed. (McGraw-Hill, 2000),
// Appendix B, Table B.1, adiabatic flame temperature at 1 atm, stoichiometric with air, reactants at
// 298 K: CH4 2226 K, C2H6 2259 K, C3H8 2267 K (from memory; C2H6 with moderate confidence).
TEST(FlameTemperature, HydrocarbonsWithAirMatchTurnsTableB1) {
  const char* why = "issue criterion; handbook value recalled from memory";
  expect_flame("adiabatic flame temperature, CH4-air", "phi = 1, 298 K, 1 atm", flame(kMethane, kAtm_Pa).temperature_K,
               2226.0, kHandbookTolerance_K, kTurns, why);
  expect_flame("adiabatic flame temperature, C2H6-air", "phi = 1, 298 K, 1 atm", flame(kEthane, kAtm_Pa).temperature_K,
               2259.0, kHandbookTolerance_K, kTurns, why);
  expect_flame("adiabatic flame temperature, C3H8-air", "phi = 1, 298 K, 1 atm", flame(kPropane, kAtm_Pa).temperature_K,
               2267.0, kHandbookTolerance_K, kTurns, why);
}

// Wrong if hydrogen, CO or methane flames (also at 20 atm, where dissociation is weaker) were off.
// Source: I. Glassman, R. A. Yetter, Combustion, 4th ed. (Academic Press, 2008), Ch. 1, table of
// approximate flame temperatures of stoichiometric mixtures, initial temperature 298 K (table number
// not recalled): H2-air 2400 K, CO-air 2400 K, CH4-air 2210 K at 1 atm and 2270 K at 20 atm
// (from memory). Printed to the nearest 10 K: criterion 15 K + 5 K.
TEST(FlameTemperature, HydrogenCarbonMonoxideAndMethaneMatchGlassmanAndYetter) {
  const double tolerance_K = kHandbookTolerance_K + kTenKelvinRounding_K;
  const char* why = "issue criterion 15 K plus 5 K for values printed to the nearest 10 K";
  expect_flame("adiabatic flame temperature, H2-air", "stoichiometric, 298 K, 1 atm",
               flame(kHydrogen, kAtm_Pa).temperature_K, 2400.0, tolerance_K, kGlassman, why);
  expect_flame("adiabatic flame temperature, CO-air", "stoichiometric, 298 K, 1 atm",
               flame(kCarbonMonoxide, kAtm_Pa).temperature_K, 2400.0, tolerance_K, kGlassman, why);
  expect_flame("adiabatic flame temperature, CH4-air", "stoichiometric, 298 K, 1 atm",
               flame(kMethane, kAtm_Pa).temperature_K, 2210.0, tolerance_K, kGlassman, why);
  expect_flame("adiabatic flame temperature, CH4-air", "stoichiometric, 298 K, 20 atm",
               flame(kMethane, 20.0 * kAtm_Pa).temperature_K, 2270.0, tolerance_K, kGlassman, why);
}

// NIST-JANAF 4th ed. (Chase 1998) figures for the complete-combustion check:
// Delta_f H at 298.15 K [kJ/mol]. Source: tables H-064 (H2O(g)), C-095 (CO2), C-093 (CO), C-067 (CH4).
constexpr double kJanafFormationH2O = -241.826;
constexpr double kJanafFormationCO2 = -393.522;
constexpr double kJanafFormationCO = -110.527;
constexpr double kJanafFormationCH4 = -74.873;
// H - H(298.15 K) [kJ/mol] at 2300 / 2400 / 2500 / 2600 / 2700 K.
// Source: table H-064 [H2O(g)], column H-H(Tr): 88.421 / 93.741 / 99.108 / 104.520 / 109.973
// Source: table N-023 [N2], column H-H(Tr):     66.995 / 70.640 / 74.296 / 77.963 / 81.639
// Source: table C-095 [CO2(g)], column H-H(Tr): 109.660 / 115.779 / 121.917 / 128.073 / 134.246
const double kJanafRows_K[] = {2300.0, 2400.0, 2500.0, 2600.0, 2700.0};
const double kJanafH2O[] = {88.421, 93.741, 99.108, 104.520, 109.973};
const double kJanafN2[] = {66.995, 70.640, 74.296, 77.963, 81.639};
const double kJanafCO2[] = {109.660, 115.779, 121.917, 128.073, 134.246};

// Linear interpolation in the 100 K rows, as the derived values were computed, J/mol.
double janaf_increment_J(const double (&rows)[5], double T) {
  for (int i = 0; i < 4; ++i) {
    if (T >= kJanafRows_K[i] && T <= kJanafRows_K[i + 1]) {
      const double w = (T - kJanafRows_K[i]) / (kJanafRows_K[i + 1] - kJanafRows_K[i]);
      return 1000.0 * ((1.0 - w) * rows[i] + w * rows[i + 1]);
    }
  }
  ADD_FAILURE() << "no JANAF row pair around " << T << " K";
  return 0.0;
}

double our_increment_J(const char* formula, double T) {
  const core::Species& s = db().at(formula);
  return s.enthalpy(units::kelvin(T)).value() - s.enthalpy(units::kelvin(kT0_K)).value();
}

struct FrozenCase {
  Fuel fuel;
  std::vector<std::string> products;
  std::vector<double> product_moles;       // per mol fuel, in `products` order
  std::vector<const double (*)[5]> janaf;  // JANAF increments of each product
  std::vector<double> janaf_formation_kJ;  // JANAF Delta_f H of each product
  double janaf_fuel_formation_kJ;
  // Complete-combustion temperature derived from the NIST-JANAF tables named above: the T solving
  // sum_p n_p [Delta_f H_p + (H - H298)_p(T)] = Delta_f H_fuel, linear interpolation in the 100 K
  // rows (derived by that algebra, not itself a published number): H2 2525 K, CH4 2327 K, CO 2664 K.
  double janaf_derived_K;
};

// Wrong if the HP energy balance (without dissociation) disagreed with the JANAF-derived complete-
// combustion temperatures by more than 3 K once the stated data-set difference is applied. The
// difference between our data and JANAF (formation enthalpies and H - H298 of the products) is
// computed here and converted to kelvin with the products' heat capacity:
//   T_ours ~= T_JANAF + [dQ - dH(T_JANAF)] / Cp,
//   dQ = (Delta_f H_fuel,ours - JANAF) - sum_p n_p (Delta_f H_p,ours - JANAF),
//   dH = sum_p n_p ((H - H298)_p,ours - JANAF).
// For hydrogen dH is about +0.6 kJ per mol H2O at 2500 K (GRI-Mech 3.0 H2O), i.e. about -5 K.
// And the equilibrium (dissociating) flame must be colder than the frozen one.
TEST(FlameTemperature, CompleteCombustionReproducesTheJanafDerivedValuesAndBoundsTheEquilibrium) {
  const std::vector<FrozenCase> cases{
      {kHydrogen, {"H2O", "N2"}, {1.0, 1.88}, {&kJanafH2O, &kJanafN2}, {kJanafFormationH2O, 0.0}, 0.0, 2525.0},
      {kMethane,
       {"CO2", "H2O", "N2"},
       {1.0, 2.0, 7.52},
       {&kJanafCO2, &kJanafH2O, &kJanafN2},
       {kJanafFormationCO2, kJanafFormationH2O, 0.0},
       kJanafFormationCH4,
       2327.0},
      {kCarbonMonoxide,
       {"CO2", "N2"},
       {1.0, 1.88},
       {&kJanafCO2, &kJanafN2},
       {kJanafFormationCO2, 0.0},
       kJanafFormationCO,
       2664.0},
  };
  for (const FrozenCase& c : cases) {
    const core::EquilibriumResult frozen = flame(c.fuel, kAtm_Pa, c.products);
    // The restricted products are the complete-combustion products, in the stated amounts.
    for (std::size_t p = 0; p < c.products.size(); ++p) {
      EXPECT_NEAR(frozen.moles_of(c.products[p]), c.product_moles[p], 1e-9) << c.products[p];
    }
    const double T = c.janaf_derived_K;
    const auto formation_J = [](const char* formula) {
      return db().at(formula).enthalpy(units::kelvin(kT0_K)).value();
    };
    double dQ = formation_J(c.fuel.formula) - 1000.0 * c.janaf_fuel_formation_kJ;
    double dH = 0.0;
    double cp = 0.0;
    for (std::size_t p = 0; p < c.products.size(); ++p) {
      const char* name = c.products[p].c_str();
      const double n = c.product_moles[p];
      dQ -= n * (formation_J(name) - 1000.0 * c.janaf_formation_kJ[p]);
      dH += n * (our_increment_J(name, T) - janaf_increment_J(*c.janaf[p], T));
      cp += n * db().at(name).heat_capacity(units::kelvin(T)).value();
    }
    // Fuel and O2 formation enthalpies of our data at 298.15 K also enter dQ (O2 is ~0 by construction).
    dQ += c.fuel.oxygen * formation_J("O2") + 3.76 * c.fuel.oxygen * formation_J("N2");
    const double expected_K = T + (dQ - dH) / cp;
    stackbound::testing::record_published_check(
        {fmt::format("complete-combustion flame temperature, {}-air", c.fuel.formula),
         "stoichiometric, 298.15 K, 1 atm, no dissociation", fmt::format("{:.0f} K", T),
         "derived from NIST-JANAF 4th ed. formation enthalpies and H-H298 columns (tables named in the test)",
         fmt::format("3 K after the computed data-set shift of {:+.1f} K", (dQ - dH) / cp), frozen.temperature_K});
    EXPECT_NEAR(frozen.temperature_K, expected_K, 3.0)
        << c.fuel.formula << ": data-set shift " << (dQ - dH) / cp << " K from the JANAF-derived " << T << " K";
    const double equilibrium_K = flame(c.fuel, kAtm_Pa).temperature_K;
    EXPECT_LT(equilibrium_K, frozen.temperature_K - 50.0) << c.fuel.formula;
  }
}

}  // namespace
}  // namespace stackbound::reference
