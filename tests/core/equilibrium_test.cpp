// The TP and HP equilibrium solver (core/equilibrium.hpp, core/adiabatic_flame.hpp) and the feed
// helpers (core/element_amounts.hpp): properties every solution must have, and bad input.
// All feeds here are invented test mixtures.

#include "stackbound/core/equilibrium.hpp"

#include <gtest/gtest.h>

#include <Eigen/Dense>
#include <algorithm>
#include <cmath>
#include <limits>
#include <optional>
#include <string>
#include <vector>

#include "stackbound/cases/species_file.hpp"
#include "stackbound/core/adiabatic_flame.hpp"
#include "stackbound/core/element_amounts.hpp"
#include "stackbound/core/elements.hpp"
#include "tests/support/tolerance.hpp"
#include "stackbound/units/constants.hpp"
#include "stackbound/units/input_error.hpp"

namespace stackbound::core {
namespace {

using stackbound::testing::is_close;

constexpr double kAtm_Pa = units::kStandardAtmosphere_Pa;
// The tool promises element balances to 1e-10 relative (issue 3).
constexpr double kElementBalance = 1e-10;

const SpeciesDatabase& db() { return cases::builtin_species(); }

// Methane with dry air (O2 + 3.76 N2) at equivalence ratio phi: an invented test feed.
std::vector<SpeciesAmount> methane_air(double phi) {
  const double o2 = 2.0 / phi;
  return {{"CH4", 1.0}, {"O2", o2}, {"N2", 3.76 * o2}};
}

struct Solved {
  ElementAmounts b;
  EquilibriumResult result;
};

Solved solve(const std::vector<SpeciesAmount>& feed, double T, double P = kAtm_Pa,
             std::vector<std::string> candidates = {}) {
  const ElementAmounts b = element_amounts(db(), feed);
  const EquilibriumSolver solver(db(), b, std::move(candidates));
  return {b, solver.solve_tp(b, units::kelvin(T), units::pascals(P))};
}

// Element totals of the result, recomputed from the species' compositions (independent of the solver).
ElementAmounts product_elements(const EquilibriumResult& result) {
  ElementAmounts totals;
  for (std::size_t i = 0; i < result.species.size(); ++i)
    totals.add_species(db().at(result.species[i]), result.moles[i]);
  return totals;
}

double worst_element_miss(const ElementAmounts& feed, const EquilibriumResult& result) {
  const ElementAmounts products = product_elements(result);
  double worst = 0.0;
  for (std::size_t k = 0; k < kElementCount; ++k) {
    if (feed.moles[k] > 0.0) worst = std::max(worst, std::abs(products.moles[k] - feed.moles[k]) / feed.moles[k]);
  }
  return worst;
}

// Change of the dimensionless Gibbs energy G/RT when the amounts `moles` change by `delta`, at T and
// P, from the species data (1 bar standard state):
//   G/RT = sum_gas n_j (g_j/RT + ln(n_j/n) + ln(P/1 bar)) + sum_condensed n_c g_c/RT.
// Evaluated term by term with log1p, so that changes far below G itself are resolved.
double gibbs_change_over_RT(const std::vector<std::string>& species, const std::vector<double>& moles,
                            const std::vector<double>& delta, double T, double P) {
  double gas = 0.0;
  double gas_change = 0.0;
  for (std::size_t i = 0; i < species.size(); ++i) {
    if (db().at(species[i]).is_gas()) {
      gas += moles[i];
      gas_change += delta[i];
    }
  }
  const double ln_total_ratio = std::log1p(gas_change / gas);
  double change = 0.0;
  for (std::size_t i = 0; i < species.size(); ++i) {
    const Species& s = db().at(species[i]);
    if (!s.is_gas()) {
      change += delta[i] * s.g_over_RT(units::kelvin(T));
      continue;
    }
    if (moles[i] <= 0.0) continue;
    const double chemical_potential =
        s.g_over_RT(units::kelvin(T)) + std::log(moles[i] / gas) + std::log(P / units::kStandardStatePressure_Pa);
    const double ln_fraction_ratio = std::log1p(delta[i] / moles[i]) - ln_total_ratio;
    // (n + d)(mu + ln ratio) - n mu
    change += delta[i] * (chemical_potential + ln_fraction_ratio) + moles[i] * ln_fraction_ratio;
  }
  return change;
}

// The largest decrease of G/RT (relative to the size of the change, sum |delta_j|) over the
// elementary balance-preserving changes at `moles`: for each species j not in a basis of the
// most abundant species, the reaction forming j from the basis, run both ways by 1e-4 of the
// smallest amount involved (for a condensed species absent from `moles`: forming it only).
// <= 0 (to rounding) means no such change lowers G: the composition is the constrained minimum.
double largest_relative_gibbs_decrease(const EquilibriumResult& result, const std::vector<double>& moles) {
  const std::size_t count = result.species.size();
  Eigen::MatrixXd formula(static_cast<Eigen::Index>(kElementCount), static_cast<Eigen::Index>(count));
  for (std::size_t i = 0; i < count; ++i) {
    const Species& s = db().at(result.species[i]);
    for (std::size_t k = 0; k < kElementCount; ++k) {
      formula(static_cast<Eigen::Index>(k), static_cast<Eigen::Index>(i)) = s.atoms_of(known_elements()[k].symbol);
    }
  }
  // Basis: the most abundant species whose formula columns are independent.
  std::vector<std::size_t> order(count);
  for (std::size_t i = 0; i < count; ++i) order[i] = i;
  std::sort(order.begin(), order.end(), [&](std::size_t a, std::size_t b) { return moles[a] > moles[b]; });
  std::vector<std::size_t> basis;
  const Eigen::Index rank = Eigen::FullPivLU<Eigen::MatrixXd>(formula).rank();
  for (const std::size_t i : order) {
    if (static_cast<Eigen::Index>(basis.size()) == rank) break;
    Eigen::MatrixXd trial(formula.rows(), static_cast<Eigen::Index>(basis.size() + 1));
    for (std::size_t c = 0; c < basis.size(); ++c)
      trial.col(static_cast<Eigen::Index>(c)) = formula.col(static_cast<Eigen::Index>(basis[c]));
    trial.col(static_cast<Eigen::Index>(basis.size())) = formula.col(static_cast<Eigen::Index>(i));
    if (Eigen::FullPivLU<Eigen::MatrixXd>(trial).rank() == static_cast<Eigen::Index>(basis.size() + 1))
      basis.push_back(i);
  }
  Eigen::MatrixXd B(formula.rows(), static_cast<Eigen::Index>(basis.size()));
  for (std::size_t c = 0; c < basis.size(); ++c)
    B.col(static_cast<Eigen::Index>(c)) = formula.col(static_cast<Eigen::Index>(basis[c]));
  const auto decomposition = B.colPivHouseholderQr();
  double worst = -std::numeric_limits<double>::infinity();
  for (std::size_t j = 0; j < count; ++j) {
    if (std::find(basis.begin(), basis.end(), j) != basis.end()) continue;
    const bool condensed = !db().at(result.species[j]).is_gas();
    if (moles[j] <= 0.0 && !condensed) continue;  // an underflowed trace cannot be perturbed both ways
    const Eigen::VectorXd consumed = decomposition.solve(formula.col(static_cast<Eigen::Index>(j)));
    double smallest = moles[j] > 0.0 ? moles[j] : std::numeric_limits<double>::infinity();
    for (std::size_t c = 0; c < basis.size(); ++c) {
      if (consumed[static_cast<Eigen::Index>(c)] != 0.0) {
        smallest = std::min(smallest, moles[basis[c]] / std::abs(consumed[static_cast<Eigen::Index>(c)]));
      }
    }
    const double step = 1e-4 * smallest;
    for (const double sign : {1.0, -1.0}) {
      if (sign < 0.0 && moles[j] <= 0.0) continue;  // an absent condensed species can only form
      std::vector<double> delta(count, 0.0);
      delta[j] = sign * step;
      double size = step;
      for (std::size_t c = 0; c < basis.size(); ++c) {
        delta[basis[c]] = -sign * step * consumed[static_cast<Eigen::Index>(c)];
        size += std::abs(delta[basis[c]]);
      }
      worst = std::max(
          worst, -gibbs_change_over_RT(result.species, moles, delta, result.temperature_K, result.pressure_Pa) / size);
    }
  }
  return worst;
}

// ---------------------------------------------------------------------------------------------------
// Feed helpers

// Wrong if atoms per molecule were miscounted or amounts not scaled by the moles fed.
TEST(ElementAmounts, CountsTheAtomsOfEveryFeedSpecies) {
  const std::vector<SpeciesAmount> feed{{"CH4", 1.0}, {"O2", 2.5}, {"N2", 9.4}, {"Ar", 0.1}, {"H2S", 0.02}};
  const ElementAmounts b = element_amounts(db(), feed);
  EXPECT_TRUE(is_close(b.of("C"), 1.0, 1e-15));
  EXPECT_TRUE(is_close(b.of("H"), 4.04, 1e-15));
  EXPECT_TRUE(is_close(b.of("O"), 5.0, 1e-15));
  EXPECT_TRUE(is_close(b.of("N"), 18.8, 1e-15));
  EXPECT_TRUE(is_close(b.of("S"), 0.02, 1e-15));
  EXPECT_TRUE(is_close(b.of("Ar"), 0.1, 1e-15));
  EXPECT_TRUE(is_close(b.of("He"), 0.0, 0.0, 0.0));
  EXPECT_TRUE(is_close(b.total(), 1.0 + 4.04 + 5.0 + 18.8 + 0.02 + 0.1, 1e-15));
  EXPECT_EQ(b.present(), (std::vector<std::string>{"C", "H", "O", "N", "S", "Ar"}));
}

// Wrong if a bad feed were accepted silently (unknown name, negative or missing amounts).
TEST(ElementAmounts, RejectsUnknownNegativeAndEmptyFeeds) {
  const std::vector<SpeciesAmount> unknown{{"CH5", 1.0}};
  EXPECT_THROW_WITH((void)element_amounts(db(), unknown, "--feed"), units::InputError,
                    "--feed = \"CH5\": unknown species");
  const std::vector<SpeciesAmount> negative{{"CH4", -1.0}};
  EXPECT_THROW_WITH((void)element_amounts(db(), negative), units::InputError,
                    "feed.CH4 = -1 mol: the amount must be a finite number >= 0 mol");
  const std::vector<SpeciesAmount> not_a_number{{"CH4", std::nan("")}};
  EXPECT_THROW_WITH((void)element_amounts(db(), not_a_number), units::InputError, "must be a finite number");
  const std::vector<SpeciesAmount> empty;
  EXPECT_THROW_WITH((void)element_amounts(db(), empty), units::InputError, "feed: the feed is empty");
  const std::vector<SpeciesAmount> zero{{"CH4", 0.0}, {"O2", 0.0}};
  EXPECT_THROW_WITH((void)element_amounts(db(), zero), units::InputError, "feed: every amount is zero");
}

// Wrong if the feed enthalpy missed the formation enthalpies or used the wrong temperature.
TEST(FeedEnthalpy, IsTheSumOfTheSpeciesEnthalpiesAtTheFeedTemperature) {
  const std::vector<SpeciesAmount> feed{{"CH4", 1.0}, {"O2", 2.0}, {"N2", 7.52}};
  for (const double T : {298.15, 700.0}) {
    const double expected = 1.0 * db().at("CH4").enthalpy(units::kelvin(T)).value() +
                            2.0 * db().at("O2").enthalpy(units::kelvin(T)).value() +
                            7.52 * db().at("N2").enthalpy(units::kelvin(T)).value();
    EXPECT_TRUE(is_close(feed_enthalpy(db(), feed, units::kelvin(T)).value(), expected, 1e-13)) << T;
  }
  EXPECT_THROW_WITH((void)feed_enthalpy(db(), feed, units::kelvin(4000.0)).value(), units::InputError,
                    "feed temperature = 4000 K: outside the data range 200-3500 K of CH4");
}

// ---------------------------------------------------------------------------------------------------
// Construction

// Wrong if products with foreign elements were offered, or graphite were missing from carbon feeds.
TEST(EquilibriumSolver, DefaultProductsAreEverySpeciesOfTheFeedsElementsGasesFirst) {
  const ElementAmounts b = element_amounts(db(), methane_air(1.0));
  const EquilibriumSolver solver(db(), b);
  const std::vector<std::string>& names = solver.species();
  for (const std::string& name : names) {
    EXPECT_EQ(db().at(name).atoms_of("S"), 0.0) << name;
    EXPECT_EQ(db().at(name).atoms_of("Ar"), 0.0) << name;
  }
  EXPECT_NE(std::find(names.begin(), names.end(), "NO"), names.end());
  ASSERT_FALSE(names.empty());
  EXPECT_EQ(names.back(), "C(gr)");
  EXPECT_EQ(static_cast<std::size_t>(
                std::count_if(names.begin(), names.end(), [](const std::string& n) { return !db().at(n).is_gas(); })),
            1u);
  EXPECT_TRUE(is_close(solver.max_temperature().value(), 3500.0, 1e-15));
}

// Wrong if a product list that cannot hold the feed were accepted and failed later, or silently.
// Wrong if the typed boundary changed a number on the way in or out: the quantities must carry exactly
// the doubles of the raw fields, and the solve at typed T and P must land on them.
TEST(EquilibriumSolver, TypedStateCarriesTheRawNumbersExactly) {
  const Solved s = solve(methane_air(1.0), 1900.0, 2.0 * kAtm_Pa);
  EXPECT_EQ(s.result.temperature().value(), 1900.0);
  EXPECT_EQ(s.result.pressure().value(), 2.0 * kAtm_Pa);
  EXPECT_EQ(s.result.temperature().value(), s.result.temperature_K);
  EXPECT_EQ(s.result.pressure().value(), s.result.pressure_Pa);
  EXPECT_EQ(s.result.enthalpy().value(), s.result.enthalpy_J);
  EXPECT_EQ(s.result.total_gas_amount().value(), s.result.total_gas_moles);
  const EquilibriumSolver solver(db(), s.b);
  EXPECT_EQ(solver.max_temperature().value(), 3500.0);
  EXPECT_LT(solver.min_temperature().value(), solver.max_temperature().value());
}

TEST(EquilibriumSolver, RejectsProductListsThatCannotHoldTheFeed) {
  const ElementAmounts b = element_amounts(db(), methane_air(1.0));
  EXPECT_THROW_WITH(EquilibriumSolver(db(), b, {"CO2", "H2O", "N2", "Xx"}), units::InputError,
                    "species = \"Xx\": unknown species");
  EXPECT_THROW_WITH(EquilibriumSolver(db(), b, {"CO2", "H2O", "O2"}), units::InputError,
                    "no product contains N, which is in the feed");
  EXPECT_THROW_WITH(EquilibriumSolver(db(), b, {"CO2", "H2O", "N2", "SO2"}), units::InputError,
                    "species = \"SO2\": contains S, which is not in the feed");
  EXPECT_THROW_WITH(EquilibriumSolver(db(), b, {"CO2", "H2O", "N2", "CO2"}), units::InputError,
                    "species = \"CO2\": listed twice");
  EXPECT_THROW_WITH(
      EquilibriumSolver(db(), element_amounts(db(), std::vector<SpeciesAmount>{{"C(gr)", 1.0}}), {"C(gr)"}),
      units::InputError, "needs at least one gas species");
}

// Wrong if the solver referred to the database it was built from after construction (a sweep keeps
// solvers longer than a database copy may live). The freed copy's memory is overwritten by a new
// database of the same size before the solve.
TEST(EquilibriumSolver, OutlivesTheDatabaseItWasBuiltFrom) {
  const ElementAmounts b = element_amounts(db(), methane_air(1.0));
  std::optional<EquilibriumSolver> solver;
  {
    const SpeciesDatabase copy = db();
    solver.emplace(copy, b);
  }
  const SpeciesDatabase scribble = db();  // likely to reuse the freed storage
  const EquilibriumResult result = solver->solve_tp(b, units::kelvin(2000.0), units::pascals(kAtm_Pa));
  const EquilibriumResult reference =
      EquilibriumSolver(db(), b).solve_tp(b, units::kelvin(2000.0), units::pascals(kAtm_Pa));
  EXPECT_TRUE(is_close(result.mole_fraction("NO"), reference.mole_fraction("NO"), 1e-12));
  EXPECT_EQ(scribble.size(), db().size());
}

// Wrong if proportions the products cannot reach were answered with a wrong composition.
TEST(EquilibriumSolver, RejectsElementProportionsTheProductsCannotReach) {
  // CO fed, only CO2 and O2 allowed: C/O = 1/1 needs a negative amount of O2.
  const ElementAmounts co = element_amounts(db(), std::vector<SpeciesAmount>{{"CO", 1.0}});
  const EquilibriumSolver independent(db(), co, {"CO2", "O2"});
  EXPECT_THROW_WITH((void)independent.solve_tp(co, units::kelvin(2000.0), units::pascals(kAtm_Pa)), units::InputError,
                    "cannot hold the feed's elements in its proportions");
  // Only CO allowed: its C and O rows are dependent; CO2 fed cannot be held.
  const ElementAmounts co2 = element_amounts(db(), std::vector<SpeciesAmount>{{"CO2", 1.0}});
  const EquilibriumSolver dependent(db(), co2, {"CO"});
  EXPECT_THROW_WITH((void)dependent.solve_tp(co2, units::kelvin(2000.0), units::pascals(kAtm_Pa)), units::InputError,
                    "cannot hold the feed's elements in its proportions");
}

// Wrong if dependent balance rows (one product for two elements) made the Newton matrix singular.
TEST(EquilibriumSolver, SolvesAProductListWithDependentElementRows) {
  const Solved s = solve({{"CO2", 2.0}}, 1500.0, kAtm_Pa, {"CO2"});
  EXPECT_TRUE(is_close(s.result.moles_of("CO2"), 2.0, 1e-12));
  EXPECT_TRUE(is_close(s.result.mole_fraction("CO2"), 1.0, 1e-15));
  EXPECT_LE(s.result.element_residual, kElementBalance);
}

// ---------------------------------------------------------------------------------------------------
// Properties at every solution

struct Condition {
  double phi;
  double temperature_K;
  double pressure_atm;
};
const Condition kConditions[] = {{0.1, 300.0, 1.0},   {0.5, 1200.0, 0.01}, {1.0, 2200.0, 1.0},  {1.0, 3400.0, 100.0},
                                 {1.5, 1800.0, 10.0}, {3.0, 900.0, 1.0},   {4.0, 2500.0, 0.01}, {0.8, 1500.0, 30.0}};

// Wrong if atoms were created or lost: the balances must hold to 1e-10 relative per element.
TEST(Equilibrium, ElementBalancesHoldToOnePartIn1e10) {
  for (const Condition& c : kConditions) {
    const Solved s = solve(methane_air(c.phi), c.temperature_K, c.pressure_atm * kAtm_Pa);
    EXPECT_LE(worst_element_miss(s.b, s.result), kElementBalance) << c.phi << " " << c.temperature_K;
    EXPECT_LE(s.result.element_residual, kElementBalance);
    // The reported residual is the one recomputed here (to rounding).
    EXPECT_NEAR(s.result.element_residual, worst_element_miss(s.b, s.result), 1e-14);
  }
}

// Wrong if the gas mole fractions did not sum to 1, or any amount were negative or not a number.
TEST(Equilibrium, MoleFractionsAreNonNegativeAndSumToOne) {
  for (const Condition& c : kConditions) {
    const Solved s = solve(methane_air(c.phi), c.temperature_K, c.pressure_atm * kAtm_Pa);
    double sum = 0.0;
    double gas_moles = 0.0;
    for (std::size_t i = 0; i < s.result.species.size(); ++i) {
      EXPECT_TRUE(std::isfinite(s.result.moles[i]) && s.result.moles[i] >= 0.0) << s.result.species[i];
      EXPECT_TRUE(std::isfinite(s.result.mole_fractions[i]) && s.result.mole_fractions[i] >= 0.0);
      sum += s.result.mole_fractions[i];
      if (db().at(s.result.species[i]).is_gas()) {
        gas_moles += s.result.moles[i];
      } else {
        EXPECT_EQ(s.result.mole_fractions[i], 0.0) << "condensed species have no gas mole fraction";
      }
    }
    EXPECT_TRUE(is_close(sum, 1.0, 1e-14));
    EXPECT_TRUE(is_close(s.result.total_gas_moles, gas_moles, 1e-14));
  }
}

// Wrong if the solution were not the Gibbs minimum: some small feasible change would lower G.
TEST(Equilibrium, NoSmallFeasiblePerturbationLowersTheGibbsEnergy) {
  for (const Condition& c : kConditions) {
    const Solved s = solve(methane_air(c.phi), c.temperature_K, c.pressure_atm * kAtm_Pa);
    // At the minimum every elementary change raises G by O(step^2); 1e-9 per mole changed is far
    // below any real affinity (a 0.1 % departure from equilibrium gives about 1e-3).
    EXPECT_LE(largest_relative_gibbs_decrease(s.result, s.result.moles), 1e-9) << c.phi << " " << c.temperature_K;
  }
}

// Wrong if the perturbation test above could not detect a non-minimum: a composition moved 1 % away
// along the water-gas shift must be lowered by some perturbation.
TEST(Equilibrium, ThePerturbationTestDetectsANonEquilibriumComposition) {
  const Solved s = solve(methane_air(1.2), 1600.0);
  std::vector<double> shifted = s.result.moles;
  const double extent = 0.01 * s.result.moles_of("CO");
  shifted[s.result.index_of("CO")] -= extent;  // CO + H2O -> CO2 + H2
  shifted[s.result.index_of("H2O")] -= extent;
  shifted[s.result.index_of("CO2")] += extent;
  shifted[s.result.index_of("H2")] += extent;
  EXPECT_GT(largest_relative_gibbs_decrease(s.result, shifted), 1e-4);
}

// Wrong if the answer depended on how the same element totals were fed.
TEST(Equilibrium, SameElementTotalsGiveTheSameResultHoweverFed) {
  const Solved burned = solve({{"CH4", 1.0}, {"O2", 2.0}, {"N2", 7.52}}, 2100.0);
  const Solved products = solve({{"CO2", 1.0}, {"H2O", 2.0}, {"N2", 7.52}}, 2100.0);
  ASSERT_EQ(burned.result.species, products.result.species);
  for (std::size_t i = 0; i < burned.result.species.size(); ++i) {
    EXPECT_TRUE(is_close(burned.result.moles[i], products.result.moles[i], 1e-9, 1e-300)) << burned.result.species[i];
  }
}

// Wrong if graphite were missed in rich cold mixtures or kept where it is not stable. Its
// chemical-potential test (Gordon & McBride, NASA RP-1311, sec. 3.4): present => mu_C(gr)/RT = pi_C;
// absent => g_C(gr)/RT - pi_C >= 0.
TEST(Equilibrium, GraphiteAppearsExactlyWhenItsChemicalPotentialTestSaysSo) {
  const Species& graphite = db().at("C(gr)");
  const std::size_t carbon = element_index("C");
  int present = 0;
  int absent = 0;
  for (const double phi : {0.8, 1.0, 1.5, 2.0, 2.5, 3.0, 4.0}) {
    for (const double T : {700.0, 1000.0, 1400.0, 2000.0}) {
      const Solved s = solve(methane_air(phi), T);
      const double affinity = graphite.g_over_RT(units::kelvin(T)) - s.result.element_potentials[carbon];
      if (s.result.graphite_present) {
        ++present;
        EXPECT_GT(s.result.moles_of("C(gr)"), 0.0);
        EXPECT_NEAR(affinity, 0.0, 1e-9) << phi << " " << T;
      } else {
        ++absent;
        EXPECT_EQ(s.result.moles_of("C(gr)"), 0.0);
        EXPECT_GE(affinity, -1e-9) << phi << " " << T;
      }
    }
  }
  // Both regimes were exercised.
  EXPECT_GT(present, 3);
  EXPECT_GT(absent, 3);
  EXPECT_TRUE(solve(methane_air(3.0), 700.0).result.graphite_present);
  EXPECT_FALSE(solve(methane_air(1.0), 1000.0).result.graphite_present);
}

// Wrong if trace species underflowed or were not at their own equilibrium: every gas species,
// however scarce, must satisfy ln x_j = -g_j/RT - ln(P/P0) + sum_k a_kj pi_k.
TEST(Equilibrium, TraceSpeciesFarBelowOnePartIn1e30AreExactAndPositive) {
  const Solved s = solve(methane_air(0.5), 800.0);
  int deep_traces = 0;
  for (std::size_t i = 0; i < s.result.species.size(); ++i) {
    const Species& species = db().at(s.result.species[i]);
    if (!species.is_gas()) continue;
    double ln_x = -species.g_over_RT(units::kelvin(800.0)) - std::log(kAtm_Pa / units::kStandardStatePressure_Pa);
    for (std::size_t k = 0; k < kElementCount; ++k) {
      ln_x += species.atoms_of(known_elements()[k].symbol) * s.result.element_potentials[k];
    }
    const double x = s.result.mole_fractions[i];
    if (ln_x > -700.0) {
      ASSERT_GT(x, 0.0) << species.formula();
      EXPECT_TRUE(is_close(std::log(x), ln_x, 1e-9, 1e-9)) << species.formula();
    }
    if (x > 0.0 && x < 1e-30) ++deep_traces;
  }
  EXPECT_GE(deep_traces, 3);  // e.g. N, H, C2H2 at 800 K
}

// Wrong if inert-only feeds (one species per element) broke the Newton system.
TEST(Equilibrium, InertOnlyFeedsKeepTheirComposition) {
  const Solved helium = solve({{"He", 2.0}}, 1000.0);
  EXPECT_TRUE(is_close(helium.result.mole_fraction("He"), 1.0, 1e-15));
  EXPECT_TRUE(is_close(helium.result.moles_of("He"), 2.0, 1e-12));
  const Solved mixture = solve({{"He", 1.0}, {"Ar", 3.0}}, 500.0, 3.0 * kAtm_Pa);
  EXPECT_TRUE(is_close(mixture.result.mole_fraction("Ar"), 0.75, 1e-12));
  EXPECT_TRUE(is_close(mixture.result.mole_fraction("He"), 0.25, 1e-12));
}

// Wrong if an element with zero amount in one solve left its species in the answer or broke rows.
TEST(Equilibrium, AnElementWithZeroAmountDropsItsSpeciesForThatSolve) {
  std::vector<SpeciesAmount> sour = methane_air(1.0);
  sour.push_back({"H2S", 0.01});
  const EquilibriumSolver solver(db(), element_amounts(db(), sour));
  const ElementAmounts sweet = element_amounts(db(), methane_air(1.0));
  const EquilibriumResult with_solver = solver.solve_tp(sweet, units::kelvin(2000.0), units::pascals(kAtm_Pa));
  const EquilibriumResult reference = solve(methane_air(1.0), 2000.0).result;
  EXPECT_EQ(with_solver.moles_of("SO2"), 0.0);
  EXPECT_EQ(with_solver.moles_of("H2S"), 0.0);
  for (const char* name : {"CO2", "CO", "NO", "OH", "H2"}) {
    EXPECT_TRUE(is_close(with_solver.mole_fraction(name), reference.mole_fraction(name), 1e-9)) << name;
  }
  EXPECT_LE(with_solver.element_residual, kElementBalance);
}

// Wrong if a warm start changed the answer (it may only change the work), or a warm start the
// solver cannot use (another pressure, another solver's products) were not ignored.
TEST(Equilibrium, AWarmStartGivesTheColdStartAnswer) {
  const ElementAmounts b = element_amounts(db(), methane_air(1.3));
  const EquilibriumSolver solver(db(), b);
  const EquilibriumResult cold = solver.solve_tp(b, units::kelvin(2000.0), units::pascals(2.0 * kAtm_Pa));
  const EquilibriumResult nearby = solver.solve_tp(b, units::kelvin(1950.0), units::pascals(2.0 * kAtm_Pa));
  const EquilibriumResult other_pressure = solver.solve_tp(b, units::kelvin(1990.0), units::pascals(5.0 * kAtm_Pa));
  const EquilibriumResult other_feed =
      solver.solve_tp(element_amounts(db(), methane_air(0.7)), units::kelvin(2010.0), units::pascals(2.0 * kAtm_Pa));
  const ElementAmounts sour_b =
      element_amounts(db(), std::vector<SpeciesAmount>{{"CH4", 1.0}, {"H2S", 0.1}, {"O2", 2.0}});
  const EquilibriumResult other_solver =
      EquilibriumSolver(db(), sour_b).solve_tp(sour_b, units::kelvin(2000.0), units::pascals(2.0 * kAtm_Pa));
  for (const EquilibriumResult* seed : {&nearby, &other_pressure, &other_feed, &other_solver}) {
    const EquilibriumResult warm = solver.solve_tp(b, units::kelvin(2000.0), units::pascals(2.0 * kAtm_Pa), seed);
    for (std::size_t i = 0; i < cold.species.size(); ++i) {
      EXPECT_TRUE(is_close(warm.moles[i], cold.moles[i], 1e-9, 1e-300)) << cold.species[i];
    }
  }
  // The predictor start from 50 K away saves work.
  EXPECT_LT(solver.solve_tp(b, units::kelvin(2000.0), units::pascals(2.0 * kAtm_Pa), &nearby).iterations,
            cold.iterations);
}

// Wrong if pressure entered other than as ln(P / 1 bar): at 1 bar the solution of the mole-number
// equations must equal the standard-state one; N2 + O2 = 2 NO does not change moles, so its
// equilibrium is pressure-independent, while CO2 dissociation must fall with pressure.
TEST(Equilibrium, PressureEntersThroughLnPOverOneBar) {
  const std::vector<SpeciesAmount> air{{"N2", 3.0}, {"O2", 1.0}};
  const std::vector<std::string> nitric{"N2", "O2", "NO"};
  const double low = solve(air, 2500.0, 0.05 * kAtm_Pa, nitric).result.mole_fraction("NO");
  const double high = solve(air, 2500.0, 50.0 * kAtm_Pa, nitric).result.mole_fraction("NO");
  EXPECT_TRUE(is_close(low, high, 1e-10));
  const std::vector<SpeciesAmount> co2{{"CO2", 1.0}};
  const std::vector<std::string> carbon{"CO2", "CO", "O2"};
  EXPECT_GT(solve(co2, 2500.0, 0.1 * kAtm_Pa, carbon).result.mole_fraction("CO"),
            solve(co2, 2500.0, 10.0 * kAtm_Pa, carbon).result.mole_fraction("CO"));
}

// Wrong if conditions outside the data or physics were solved instead of refused.
TEST(Equilibrium, RejectsTemperaturePressureAndElementsItCannotUse) {
  const ElementAmounts b = element_amounts(db(), methane_air(1.0));
  const EquilibriumSolver solver(db(), b);
  EXPECT_THROW_WITH((void)solver.solve_tp(b, units::kelvin(3600.0), units::pascals(kAtm_Pa)), units::InputError,
                    "temperature = 3600 K: outside the data range of product CO2 (200-3500 K)");
  EXPECT_THROW_WITH((void)solver.solve_tp(b, units::kelvin(150.0), units::pascals(kAtm_Pa)), units::InputError,
                    "temperature = 150 K");
  EXPECT_THROW_WITH((void)solver.solve_tp(b, units::kelvin(std::nan("")), units::pascals(kAtm_Pa)), units::InputError,
                    "must be a finite absolute temperature");
  EXPECT_THROW_WITH((void)solver.solve_tp(b, units::kelvin(2000.0), units::pascals(0.0)), units::InputError,
                    "pressure = 0 Pa");
  ElementAmounts with_sulfur = b;
  with_sulfur.moles[element_index("S")] = 0.1;
  EXPECT_THROW_WITH((void)solver.solve_tp(with_sulfur, units::kelvin(2000.0), units::pascals(kAtm_Pa)),
                    units::InputError, "S = 0.1 mol, but this solver was built for the elements C, H, O, N only");
  ElementAmounts negative = b;
  negative.moles[element_index("H")] = -1.0;
  EXPECT_THROW_WITH((void)solver.solve_tp(negative, units::kelvin(2000.0), units::pascals(kAtm_Pa)), units::InputError,
                    "H = -1");
  EXPECT_THROW_WITH((void)solver.solve_tp(ElementAmounts{}, units::kelvin(2000.0), units::pascals(kAtm_Pa)),
                    units::InputError, "every element amount is zero");
}

// Wrong if a failure to converge returned a result instead of an error with the diagnostics.
TEST(Equilibrium, NonConvergenceIsAnErrorCarryingTheDiagnostics) {
  const ElementAmounts b = element_amounts(db(), methane_air(1.0));
  EquilibriumOptions options;
  options.max_iterations = 2;
  const EquilibriumSolver solver(db(), b, {}, options);
  try {
    (void)solver.solve_tp(b, units::kelvin(2000.0), units::pascals(kAtm_Pa));
    ADD_FAILURE() << "expected ConvergenceError";
  } catch (const ConvergenceError& error) {
    EXPECT_EQ(error.iterations(), 2);
    EXPECT_TRUE(is_close(error.temperature_K(), 2000.0, 1e-15));
    EXPECT_TRUE(is_close(error.pressure_Pa(), kAtm_Pa, 1e-15));
    EXPECT_GT(error.element_residual(), 1e-12);
    EXPECT_NE(std::string(error.what()).find("iteration limit reached (after 2 iterations"), std::string::npos)
        << error.what();
  }
}

// ---------------------------------------------------------------------------------------------------
// HP (adiabatic flame)

// Wrong if the HP solution's enthalpy missed the target, i.e. T were not the adiabatic temperature.
TEST(AdiabaticFlame, ProductsEnthalpyEqualsTheFeedEnthalpy) {
  for (const double phi : {0.6, 1.0, 1.4}) {
    const std::vector<SpeciesAmount> feed = methane_air(phi);
    const ElementAmounts b = element_amounts(db(), feed);
    const double target_J = feed_enthalpy(db(), feed, units::kelvin(298.15)).value();
    const EquilibriumSolver solver(db(), b);
    const EquilibriumResult hot = solver.solve_hp(b, units::joules(target_J), units::pascals(kAtm_Pa));
    EXPECT_NEAR(hot.enthalpy_J, target_J, 1e-5 * hot.equilibrium_heat_capacity_J_per_K) << phi;
    // The products' enthalpy recomputed from the species data.
    double enthalpy_J = 0.0;
    for (std::size_t i = 0; i < hot.species.size(); ++i) {
      enthalpy_J += hot.moles[i] * db().at(hot.species[i]).enthalpy(units::kelvin(hot.temperature_K)).value();
    }
    EXPECT_TRUE(is_close(enthalpy_J, hot.enthalpy_J, 1e-12, 1e-6));
    EXPECT_LE(hot.element_residual, kElementBalance);
    EXPECT_GT(hot.temperature_iterations, 1);
  }
}

// Wrong if the equilibrium heat capacity (used by the Newton step on T) were not dH/dT at fixed P.
TEST(AdiabaticFlame, EquilibriumHeatCapacityIsTheEnthalpySlope) {
  const ElementAmounts b = element_amounts(db(), methane_air(1.0));
  const EquilibriumSolver solver(db(), b);
  const double dT = 0.01;
  for (const double T : {1200.0, 2200.0, 3000.0}) {
    const EquilibriumResult at = solver.solve_tp(b, units::kelvin(T), units::pascals(kAtm_Pa));
    const double slope = (solver.solve_tp(b, units::kelvin(T + dT), units::pascals(kAtm_Pa)).enthalpy_J -
                          solver.solve_tp(b, units::kelvin(T - dT), units::pascals(kAtm_Pa)).enthalpy_J) /
                         (2 * dT);
    EXPECT_TRUE(is_close(at.equilibrium_heat_capacity_J_per_K, slope, 1e-5)) << T;
    EXPECT_GE(at.equilibrium_heat_capacity_J_per_K, at.frozen_heat_capacity_J_per_K);
  }
}

// Wrong if the heat loss were not taken from the heating value, or lowered T by the wrong amount.
TEST(AdiabaticFlame, HeatLossLowersTheTemperatureToTheReducedEnthalpy) {
  const std::vector<SpeciesAmount> feed = methane_air(1.0);
  const FeedStream stream{feed, units::kelvin(298.15)};
  AdiabaticFlameOptions options;
  const EquilibriumResult adiabatic = adiabatic_flame(db(), std::span<const FeedStream>(&stream, 1), options);
  options.heat_loss_fraction = 0.1;
  const EquilibriumResult lossy = adiabatic_flame(db(), std::span<const FeedStream>(&stream, 1), options);
  const double hhv_J = feed_heating_value(db(), feed, HeatingValueKind::higher).value();
  EXPECT_LT(lossy.temperature_K, adiabatic.temperature_K - 50.0);
  EXPECT_NEAR(lossy.enthalpy_J, feed_enthalpy(db(), feed, units::kelvin(298.15)).value() - 0.1 * hhv_J,
              1e-5 * lossy.equilibrium_heat_capacity_J_per_K);
  EXPECT_THROW_WITH((void)hp_target_enthalpy(units::joules(0.0), 1.0, units::joules(hhv_J)), units::InputError,
                    "heat loss = 1: must be");
  EXPECT_THROW_WITH((void)hp_target_enthalpy(units::joules(0.0), -0.1, units::joules(hhv_J)), units::InputError,
                    "heat loss = -0.1");
}

// Wrong if the heating value burned the wrong products or missed the water's condensation.
// Methane's LHV from NIST-JANAF 4th ed. formation enthalpies at 298.15 K (CH4 -74.873, CO2 -393.522,
// H2O(g) -241.826 kJ/mol; tables C-067, C-095, H-064): 802.301 kJ/mol (derived by subtraction).
// Our data's formation enthalpies differ from JANAF's (CH4 by about 0.27 kJ/mol, GRI-Mech 3.0); that
// data-set difference is computed here and carried into the expectation.
TEST(AdiabaticFlame, HeatingValueOfMethaneMatchesTheJanafFormationEnthalpies) {
  const auto h298 = [](const char* formula) {
    return db().at(formula).enthalpy(units::kelvin(units::kReferenceTemperature_K)).value();
  };
  const double data_difference_J =
      (h298("CH4") - (-74873.0)) + 2.0 * h298("O2") - (h298("CO2") - (-393522.0)) - 2.0 * (h298("H2O") - (-241826.0));
  EXPECT_LT(std::abs(data_difference_J), 500.0);  // the data sets agree to 0.5 kJ/mol
  // Non-fuel species (O2, N2, CO2, H2O) must add nothing.
  const std::vector<SpeciesAmount> feed{{"CH4", 2.0}, {"O2", 1.0}, {"N2", 5.0}, {"CO2", 0.5}, {"H2O", 0.3}};
  const double lhv = feed_heating_value(db(), feed, HeatingValueKind::lower).value() / 2.0;
  const double hhv = feed_heating_value(db(), feed, HeatingValueKind::higher).value() / 2.0;
  // JANAF prints kJ/mol to 3 decimals: four rounded values, 2 J/mol.
  EXPECT_NEAR(lhv, 802301.0 + data_difference_J, 2.0);
  // HHV - LHV: the vaporisation enthalpy of the 2 mol of water formed, 2 x 44.004 kJ/mol
  // (NIST-JANAF H-063/H-064, derived).
  EXPECT_NEAR(hhv - lhv, 2.0 * 44004.0, 1e-6);
}

// Wrong if an HP target beyond the species data were answered by extrapolation.
TEST(AdiabaticFlame, RefusesFlamesHotterOrColderThanTheData) {
  const std::vector<SpeciesAmount> feed{{"H2", 2.0}, {"O2", 1.0}};
  const ElementAmounts b = element_amounts(db(), feed);
  const EquilibriumSolver solver(db(), b);
  const double at_limit_J = solver.solve_tp(b, units::kelvin(3500.0), units::pascals(kAtm_Pa)).enthalpy_J;
  EXPECT_THROW_WITH((void)solver.solve_hp(b, units::joules(at_limit_J + 1e5), units::pascals(kAtm_Pa)),
                    units::InputError, "the products would be hotter than 3500 K, the upper end of the species data");
  const double at_bottom_J = solver.solve_tp(b, units::kelvin(200.0), units::pascals(kAtm_Pa)).enthalpy_J;
  EXPECT_THROW_WITH((void)solver.solve_hp(b, units::joules(at_bottom_J - 1e3), units::pascals(kAtm_Pa)),
                    units::InputError, "the products would be colder than 200 K");
  EXPECT_THROW_WITH((void)solver.solve_hp(b, units::joules(std::nan("")), units::pascals(kAtm_Pa)), units::InputError,
                    "must be a finite number");
}

// Wrong if a warm-started HP solve reached a different temperature, or did not save work.
TEST(AdiabaticFlame, WarmStartReachesTheSameTemperatureWithLessWork) {
  const std::vector<SpeciesAmount> feed = methane_air(0.9);
  const ElementAmounts b = element_amounts(db(), feed);
  const EquilibriumSolver solver(db(), b);
  const double target_J = feed_enthalpy(db(), feed, units::kelvin(298.15)).value();
  const EquilibriumResult seed = solver.solve_hp(b, units::joules(target_J - 5000.0), units::pascals(kAtm_Pa));
  const EquilibriumResult cold = solver.solve_hp(b, units::joules(target_J), units::pascals(kAtm_Pa));
  const EquilibriumResult warm = solver.solve_hp(b, units::joules(target_J), units::pascals(kAtm_Pa), &seed);
  EXPECT_NEAR(warm.temperature_K, cold.temperature_K, 1e-5);
  EXPECT_LT(warm.iterations, cold.iterations);
}

// Wrong if a feed that releases no heat did not stay at its own temperature.
TEST(AdiabaticFlame, AnInertFeedStaysAtItsTemperature) {
  const FeedStream stream{{{"N2", 3.0}, {"Ar", 1.0}}, units::kelvin(650.0)};
  const EquilibriumResult result = adiabatic_flame(db(), std::span<const FeedStream>(&stream, 1));
  EXPECT_NEAR(result.temperature_K, 650.0, 1e-5);
}

// Wrong if streams at different temperatures were not each counted at their own temperature.
TEST(AdiabaticFlame, StreamsEnterAtTheirOwnTemperatures) {
  const std::vector<FeedStream> split{{{{"CH4", 1.0}}, units::kelvin(298.15)},
                                      {{{"O2", 2.0}, {"N2", 7.52}}, units::kelvin(700.0)}};
  const EquilibriumResult preheated = adiabatic_flame(db(), split);
  const std::vector<SpeciesAmount> all = methane_air(1.0);
  const ElementAmounts b = element_amounts(db(), all);
  const double target_J = feed_enthalpy(db(), split[0].species, units::kelvin(298.15)).value() +
                          feed_enthalpy(db(), split[1].species, units::kelvin(700.0)).value();
  const EquilibriumResult direct =
      EquilibriumSolver(db(), b).solve_hp(b, units::joules(target_J), units::pascals(kAtm_Pa));
  EXPECT_NEAR(preheated.temperature_K, direct.temperature_K, 1e-5);
  const FeedStream cold{all, units::kelvin(298.15)};
  EXPECT_GT(preheated.temperature_K,
            adiabatic_flame(db(), std::span<const FeedStream>(&cold, 1)).temperature_K + 100.0);
}

}  // namespace
}  // namespace stackbound::core
