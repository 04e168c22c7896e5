// Robustness of the TP equilibrium solver over a grid of fuels x equivalence ratio x temperature x
// pressure (issue 3: every point converges, balances hold, no negative or NaN amount). The fuels
// and the air are invented test mixtures spanning C/H/O/N/S/Ar/He systems; the grid covers
// phi 0.1-4, 300 K to the data's upper limit (3500 K) and 0.01-100 atm.

#include <gtest/gtest.h>

#include <cmath>
#include <string>
#include <vector>

#include "stackbound/core/element_amounts.hpp"
#include "stackbound/core/elements.hpp"
#include "stackbound/core/equilibrium.hpp"
#include "tests/core/equilibrium_grid.hpp"

namespace stackbound::core {
namespace {

using grid::db;

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

// Wrong if any point of the 10 x 12 x 17 x 5 = 10 200 point grid failed to converge, broke an
// element balance beyond 1e-10, or produced a negative / NaN amount; every solve starts cold.
TEST(EquilibriumRobustness, EveryPointOfTheColdStartGridConverges) {
  GridSummary summary;
  grid::for_each_cold_point([&](const grid::Point& point, const EquilibriumSolver& solver, const ElementAmounts& b) {
    ++summary.points;
    try {
      const EquilibriumResult r =
          solver.solve_tp(b, units::kelvin(point.temperature_K), units::pascals(point.pressure_Pa()));
      if (r.iterations > 35)
        std::cout << "SLOW " << point.fuel << " " << point.phi << " " << point.temperature_K << " "
                  << point.pressure_atm << " " << r.iterations << "\n";
      check_point(r, b, summary);
    } catch (const std::exception& error) {
      ++summary.failures;
      ADD_FAILURE() << point.fuel << " phi " << point.phi << " T " << point.temperature_K << " P "
                    << point.pressure_atm << " atm: " << error.what();
    }
  });
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
  GridSummary summary;
  EquilibriumResult previous;
  bool have_previous = false;
  grid::for_each_sweep_point([&](const grid::Point& point, const EquilibriumSolver& solver, const ElementAmounts& b) {
    ++summary.points;
    try {
      EquilibriumResult r = solver.solve_tp(b, units::kelvin(point.temperature_K), units::pascals(point.pressure_Pa()),
                                            have_previous ? &previous : nullptr);
      check_point(r, b, summary);
      previous = std::move(r);
      have_previous = true;
    } catch (const std::exception& error) {
      ++summary.failures;
      ADD_FAILURE() << point.fuel << " phi " << point.phi << " T " << point.temperature_K << " P "
                    << point.pressure_atm << " atm: " << error.what();
    }
  });
  EXPECT_GT(summary.points, 3000);
  EXPECT_EQ(summary.failures, 0);
  EXPECT_EQ(summary.bad_amounts, 0);
  EXPECT_LE(summary.worst_residual, 1e-10);
}

}  // namespace
}  // namespace stackbound::core
