// Robustness of the TP equilibrium solver over a grid of fuels x equivalence ratio x temperature x
// pressure (issue 3: every point converges, balances hold, no negative or NaN amount). The fuels
// and the air are invented test mixtures spanning C/H/O/N/S/Ar/He systems; the grid covers
// phi 0.1-4, 300 K to the data's upper limit (3500 K) and 0.01-100 atm.

#include <gtest/gtest.h>

#include <cmath>
#include <string>
#include <vector>

#include "stackbound/cases/species_file.hpp"
#include "stackbound/core/element_amounts.hpp"
#include "stackbound/core/elements.hpp"
#include "stackbound/core/equilibrium.hpp"
#include "stackbound/units/constants.hpp"

namespace stackbound::core {
namespace {

const SpeciesDatabase& db() { return cases::builtin_species(); }

struct Fuel {
  const char* name;
  std::vector<SpeciesAmount> species;  // one "unit" of fuel
  double oxygen_demand;                // mol O2 for complete combustion of one unit
};

// Invented fuels: pure gases, a coal-like solid (graphite + H2 + water + NH3 + H2S), a sour gas,
// an ammonia fuel and a helium-diluted methane.
std::vector<Fuel> fuels() {
  return {
      {"H2", {{"H2", 1.0}}, 0.5},
      {"CH4", {{"CH4", 1.0}}, 2.0},
      {"C3H8", {{"C3H8", 1.0}}, 5.0},
      {"CO", {{"CO", 1.0}}, 0.5},
      {"C2H2", {{"C2H2", 1.0}}, 2.5},
      {"CH3OH", {{"CH3OH", 1.0}}, 1.5},
      {"coal-like",
       {{"C(gr)", 0.8}, {"H2", 0.35}, {"H2O", 0.05}, {"NH3", 0.02}, {"H2S", 0.01}},
       0.8 + 0.175 + 0.015 + 0.015},
      {"sour gas", {{"CH4", 0.9}, {"H2S", 0.1}, {"CO2", 0.05}}, 1.8 + 0.15},
      {"NH3", {{"NH3", 1.0}}, 0.75},
      {"CH4 in He", {{"CH4", 1.0}, {"He", 3.0}}, 2.0},
  };
}

struct GridSummary {
  int points = 0;
  int failures = 0;
  int max_iterations = 0;
  double worst_residual = 0.0;
  double worst_fraction_sum_error = 0.0;
  int bad_amounts = 0;
  int graphite_points = 0;
};

void check_point(const EquilibriumResult& r, const ElementAmounts& b, GridSummary& summary) {
  double sum = 0.0;
  for (std::size_t i = 0; i < r.species.size(); ++i) {
    if (!(r.moles[i] >= 0.0) || !std::isfinite(r.moles[i]) || !(r.mole_fractions[i] >= 0.0)) ++summary.bad_amounts;
    sum += r.mole_fractions[i];
  }
  ElementAmounts products;
  for (std::size_t i = 0; i < r.species.size(); ++i) products.add_species(db().at(r.species[i]), r.moles[i]);
  for (std::size_t k = 0; k < kElementCount; ++k) {
    if (b.moles[k] > 0.0) {
      summary.worst_residual = std::max(summary.worst_residual, std::abs(products.moles[k] - b.moles[k]) / b.moles[k]);
    }
  }
  summary.worst_fraction_sum_error = std::max(summary.worst_fraction_sum_error, std::abs(sum - 1.0));
  summary.max_iterations = std::max(summary.max_iterations, r.iterations);
  if (r.graphite_present) ++summary.graphite_points;
}

const double kPhis[] = {0.1, 0.3, 0.5, 0.8, 0.95, 1.0, 1.05, 1.2, 1.5, 2.0, 3.0, 4.0};
const double kPressures_atm[] = {0.01, 0.1, 1.0, 10.0, 100.0};

// Wrong if any point of the 10 x 12 x 18 x 5 = 10 800 point grid failed to converge, broke an
// element balance beyond 1e-10, or produced a negative / NaN amount; every solve starts cold.
TEST(EquilibriumRobustness, EveryPointOfTheColdStartGridConverges) {
  std::vector<double> temperatures_K;
  for (double T = 300.0; T < 3500.0; T += 200.0) temperatures_K.push_back(T);
  temperatures_K.push_back(3500.0);  // the data's upper limit
  GridSummary summary;
  for (const Fuel& fuel : fuels()) {
    for (const double phi : kPhis) {
      std::vector<SpeciesAmount> feed = fuel.species;
      const double o2 = fuel.oxygen_demand / phi;
      // Invented dry air: O2 + 3.727 N2 + 0.0446 Ar.
      feed.push_back({"O2", o2});
      feed.push_back({"N2", 3.727 * o2});
      feed.push_back({"Ar", 0.0446 * o2});
      const ElementAmounts b = element_amounts(db(), feed);
      const EquilibriumSolver solver(db(), b);
      for (const double T : temperatures_K) {
        for (const double P_atm : kPressures_atm) {
          ++summary.points;
          try {
            const EquilibriumResult r = solver.solve_tp(b, T, P_atm * units::kStandardAtmosphere_Pa);
            if (r.iterations > 35)
              std::cout << "SLOW " << fuel.name << " " << phi << " " << T << " " << P_atm << " " << r.iterations
                        << "\n";
            check_point(r, b, summary);
          } catch (const std::exception& error) {
            ++summary.failures;
            ADD_FAILURE() << fuel.name << " phi " << phi << " T " << T << " P " << P_atm << " atm: " << error.what();
          }
        }
      }
    }
  }
  EXPECT_GE(summary.points, 10000);
  EXPECT_EQ(summary.failures, 0);
  EXPECT_EQ(summary.bad_amounts, 0);
  EXPECT_LE(summary.worst_residual, 1e-10);
  EXPECT_LE(summary.worst_fraction_sum_error, 1e-13);
  EXPECT_GT(summary.graphite_points, 100);  // rich, cool points must have produced graphite
  std::cout << "[ grid     ] " << summary.points << " points, max " << summary.max_iterations
            << " Newton iterations, worst element residual " << summary.worst_residual << ", "
            << summary.graphite_points << " with graphite\n";
}

// Wrong if warm starts from the previous grid point (a sweep) ever failed or broke a balance, also
// across jumps in T, P and feed.
TEST(EquilibriumRobustness, AWarmStartedSweepOverTheGridConverges) {
  ElementAmounts all_elements;
  for (const char* symbol : {"C", "H", "O", "N", "S", "Ar", "He"}) all_elements.moles[element_index(symbol)] = 1.0;
  const EquilibriumSolver solver(db(), all_elements);
  GridSummary summary;
  EquilibriumResult previous;
  bool have_previous = false;
  for (const Fuel& fuel : fuels()) {
    for (double phi = 0.1; phi <= 4.0; phi *= 1.25) {
      std::vector<SpeciesAmount> feed = fuel.species;
      const double o2 = fuel.oxygen_demand / phi;
      feed.push_back({"O2", o2});
      feed.push_back({"N2", 3.727 * o2});
      feed.push_back({"Ar", 0.0446 * o2});
      const ElementAmounts b = element_amounts(db(), feed);
      for (double T = 300.0; T <= 3500.0; T += 150.0) {
        for (const double P_atm : {0.01, 1.0, 100.0}) {
          ++summary.points;
          try {
            EquilibriumResult r =
                solver.solve_tp(b, T, P_atm * units::kStandardAtmosphere_Pa, have_previous ? &previous : nullptr);
            check_point(r, b, summary);
            previous = std::move(r);
            have_previous = true;
          } catch (const std::exception& error) {
            ++summary.failures;
            ADD_FAILURE() << fuel.name << " phi " << phi << " T " << T << " P " << P_atm << " atm: " << error.what();
          }
        }
      }
    }
  }
  EXPECT_GT(summary.points, 3000);
  EXPECT_EQ(summary.failures, 0);
  EXPECT_EQ(summary.bad_amounts, 0);
  EXPECT_LE(summary.worst_residual, 1e-10);
}

}  // namespace
}  // namespace stackbound::core
