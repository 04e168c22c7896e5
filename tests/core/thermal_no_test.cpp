// Thermal NO (core/thermal_no.hpp) and the post-flame path it runs on (core/post_flame.hpp):
// properties of the result, an independent integration of the rate law, and bad input.
// Feeds are invented test mixtures: methane with dry air (O2 + 3.76 N2) at 15 % excess air, a
// typical excess air for gas firing (common practice, no source).

#include "stackbound/core/thermal_no.hpp"

#include <gtest/gtest.h>

#include <cmath>
#include <limits>
#include <vector>

#include "stackbound/cases/species_file.hpp"
#include "stackbound/core/element_amounts.hpp"
#include "stackbound/core/post_flame.hpp"
#include "stackbound/units/constants.hpp"
#include "stackbound/units/input_error.hpp"
#include "tests/support/tolerance.hpp"

namespace stackbound::core {
namespace {

using stackbound::testing::is_close;
using stackbound::testing::kExact;

constexpr double kAtm_Pa = units::kStandardAtmosphere_Pa;

const SpeciesDatabase& db() { return cases::builtin_species(); }

// Methane-air at air ratio lambda.
ElementAmounts methane_air(double lambda = 1.15) {
  const double o2 = 2.0 * lambda;
  const std::vector<SpeciesAmount> feed{{"CH4", 1.0}, {"O2", o2}, {"N2", 3.76 * o2}};
  return element_amounts(db(), feed);
}

struct Fixture {
  explicit Fixture(double lambda = 1.15) : b(methane_air(lambda)), solver(db(), b) {}
  ElementAmounts b;
  EquilibriumSolver solver;

  ThermalNoResult at(double T_K, double t_s, const ThermalNoOptions& options = {}) const {
    return thermal_no(solver, b, units::kelvin(T_K), units::pascals(kAtm_Pa), units::seconds(t_s), options);
  }
  PostFlameGas gas(double T_K, double P_Pa = kAtm_Pa) const { return post_flame_gas(solver.solve_tp(b, units::kelvin(T_K), units::pascals(P_Pa))); }
};

PostFlamePath cooling_path(double firing_K, double final_K, double hold_s, double cooling_s, int steps = 20) {
  PostFlamePath path;
  path.firing_temperature = units::kelvin(firing_K);
  path.final_temperature = units::kelvin(final_K);
  path.hold_time = units::seconds(hold_s);
  path.cooling_time = units::seconds(cooling_s);
  path.cooling_steps = steps;
  return path;
}

// The rate law written out here from the published table (Hanson & Salimian 1984 as tabulated in
// Turns, ch. 5, m^3/(kmol s) - from memory), independently of core/thermal_no.cpp, with [NO]e^2 in
// place of K [O2][N2] as the header states. mol/(m^3 s).
double published_rate(const PostFlameGas& gas, double no_mol_per_m3) {
  const double T = gas.temperature_K;
  const double c = gas.concentration_mol_per_m3;
  const double k1f = 1.8e11 * std::exp(-38370.0 / T) / 1000.0;
  const double k1r = 3.8e10 * std::exp(-425.0 / T) / 1000.0;
  const double k2f = 1.8e7 * T * std::exp(-4680.0 / T) / 1000.0;
  const double k3f = 7.1e10 * std::exp(-450.0 / T) / 1000.0;
  const double ratio = no_mol_per_m3 / (gas.no * c);
  return 2.0 * k1f * (gas.o * c) * (gas.n2 * c) * (1.0 - ratio * ratio) /
         (1.0 + k1r * no_mol_per_m3 / (k2f * gas.o2 * c + k3f * gas.oh * c));
}

// Classical fourth-order Runge-Kutta on d[NO]/dt = published_rate, fixed step; returns x_NO.
double runge_kutta_no(const PostFlameGas& gas, double x0, double time_s, int steps) {
  const double c = gas.concentration_mol_per_m3;
  const double h = time_s / steps;
  double no = x0 * c;
  for (int i = 0; i < steps; ++i) {
    const double k1 = published_rate(gas, no);
    const double k2 = published_rate(gas, no + 0.5 * h * k1);
    const double k3 = published_rate(gas, no + 0.5 * h * k2);
    const double k4 = published_rate(gas, no + h * k3);
    no += h / 6.0 * (k1 + 2.0 * k2 + 2.0 * k3 + k4);
  }
  return no / c;
}

// Wrong if the integration let time pass at t = 0 or lost a given initial NO.
TEST(ThermalNo, IsZeroAtZeroResidenceTime) {
  const Fixture f;
  const ThermalNoResult result = f.at(2000.0, 0.0);
  EXPECT_TRUE(is_close(result.no_mole_fraction, 0.0, 0.0, 0.0));
  EXPECT_TRUE(is_close(result.residence_time_s, 0.0, 0.0, 0.0));
  EXPECT_GT(result.no_equilibrium_mole_fraction, 0.0);
  ThermalNoOptions options;
  options.initial_no_mole_fraction = 4e-5;
  EXPECT_TRUE(is_close(f.at(2000.0, 0.0, options).no_mole_fraction, 4e-5, 0.0, 0.0));
}

// Wrong if NO fell with time at some point, overshot the equilibrium, or the closed form lost
// precision at short times (where NO grows linearly: x = rate x t).
TEST(ThermalNo, RisesMonotonicallyWithResidenceTimeAndNeverExceedsEquilibrium) {
  const Fixture f;
  for (const double T : {1600.0, 1800.0, 2000.0, 2200.0, 2400.0}) {
    double previous = 0.0;
    for (const double t : {1e-7, 1e-5, 1e-4, 1e-3, 0.003, 0.01, 0.03, 0.1, 0.3, 1.0, 3.0, 10.0}) {
      const ThermalNoResult r = f.at(T, t);
      // Strictly rising until the equilibrium is reached to the last bit (the update then returns it).
      EXPECT_TRUE(r.no_mole_fraction > previous || r.no_mole_fraction == r.no_equilibrium_mole_fraction)
          << T << " K, " << t << " s: " << r.no_mole_fraction << " after " << previous;
      EXPECT_LE(r.no_mole_fraction, r.no_equilibrium_mole_fraction) << T << " K, " << t << " s";
      previous = r.no_mole_fraction;
    }
    const ThermalNoResult early = f.at(T, 1e-9);
    EXPECT_TRUE(is_close(early.no_mole_fraction, early.initial_rate_mole_fraction_per_s * 1e-9, 1e-6)) << T << " K";
  }
  // Far beyond the approach time the result is the equilibrium value, not above it.
  for (const double T : {2000.0, 2600.0, 3200.0}) {
    const ThermalNoResult r = f.at(T, 1e6);
    EXPECT_LE(r.no_mole_fraction, r.no_equilibrium_mole_fraction);
    EXPECT_TRUE(is_close(r.no_mole_fraction, r.no_equilibrium_mole_fraction, 1e-12)) << T << " K";
  }
}

// Wrong if the temperature dependence of the rate constants or of the radicals had the wrong sign.
TEST(ThermalNo, RisesWithTemperatureAtAFixedResidenceTime) {
  const Fixture f;
  double previous = 0.0;
  for (double T = 1500.0; T <= 2400.0; T += 100.0) {
    const double x = f.at(T, 0.1).no_mole_fraction;
    EXPECT_GT(x, previous) << T << " K";
    previous = x;
  }
}

// Wrong if NO did not approach its equilibrium at a high temperature and long residence time (the
// approach time at 2400 K is about 0.05 s, so 10 s is far beyond it).
TEST(ThermalNo, ApproachesTheEquilibriumNoAt2400KAfterTenSeconds) {
  const Fixture f;
  const ThermalNoResult r = f.at(2400.0, 10.0);
  EXPECT_TRUE(is_close(r.no_mole_fraction, r.no_equilibrium_mole_fraction, 1e-6));
  EXPECT_GT(r.no_equilibrium_mole_fraction, 1e-3);  // thousands of ppm at 2400 K: a real approach
}

// Wrong if the activation temperature of k1f (38 370 K) were lost: at 1400 K thermal NO is
// negligible (about 4e-10 = 0.0004 ppm after 1 s here).
TEST(ThermalNo, StaysBelowOnePpmAt1400KAfterOneSecond) {
  const Fixture f;
  const ThermalNoResult r = f.at(1400.0, 1.0);
  EXPECT_LT(r.no_mole_fraction, 1e-6);
  EXPECT_GT(r.no_mole_fraction, 0.0);
}

// Wrong if the closed-form integration disagreed with a direct integration of the published rate
// law (written out in this test) by fourth-order Runge-Kutta with tiny steps, from zero NO and from
// NO far above equilibrium, lean and rich (where little O2 makes beta large), or if the rate function
// disagreed with the published law.
TEST(ThermalNo, ClosedFormMatchesARungeKuttaIntegrationOfThePublishedRateLaw) {
  const Fixture lean;
  const Fixture rich(0.85);
  for (const auto& [f, T] : {std::pair<const Fixture&, double>{lean, 1900.0},
                             {lean, 2200.0},
                             {lean, 2500.0},
                             {rich, 2000.0},
                             {rich, 2300.0}}) {
    const PostFlameGas gas = f.gas(T);
    const double c = gas.concentration_mol_per_m3;
    for (const double fraction : {0.0, 0.3, 0.9, 1.0, 2.5}) {
      const double no = fraction * gas.no * c;
      EXPECT_TRUE(is_close(thermal_no_rate_mol_per_m3_s(gas, no), published_rate(gas, no), 1e-12, 1e-300))
          << T << " K, " << fraction;
    }
    // Times at which the approach is partial: about 0.3 and 1.5 approach times.
    const double scale_s = gas.no * c / published_rate(gas, 0.0);
    for (const double initial : {0.0, 3.0 * gas.no}) {
      for (const double t : {0.3 * scale_s, 1.5 * scale_s}) {
        ThermalNoOptions options;
        options.initial_no_mole_fraction = initial;
        const double closed = thermal_no(gas, units::seconds(t), options).no_mole_fraction;
        EXPECT_TRUE(is_close(closed, runge_kutta_no(gas, initial, t, 20000), 1e-9)) << T << " K, " << t << " s";
      }
    }
  }
}

// Wrong if NO above the local equilibrium (a cooled gas) were not decomposed toward it, or fell below it.
TEST(ThermalNo, NoAboveEquilibriumDecaysTowardItWithoutUndershoot) {
  const Fixture f;
  const PostFlameGas gas = f.gas(2300.0);
  ThermalNoOptions options;
  options.initial_no_mole_fraction = 4.0 * gas.no;
  double previous = options.initial_no_mole_fraction;
  for (const double t : {1e-4, 1e-3, 1e-2, 0.1, 1.0, 100.0}) {
    const ThermalNoResult r = thermal_no(gas, units::seconds(t), options);
    EXPECT_LT(r.no_mole_fraction, previous) << t << " s";
    EXPECT_GE(r.no_mole_fraction, gas.no) << t << " s";
    EXPECT_LT(r.initial_rate_mole_fraction_per_s, 0.0);
    previous = r.no_mole_fraction;
  }
}

// Wrong if the result did not carry the names the report prints, or hid that k1f is extrapolated
// below its stated 2000 K.
TEST(ThermalNo, ResultNamesItsRateConstantsAndFlagsExtrapolation) {
  const Fixture f;
  const ThermalNoResult hot = f.at(2200.0, 0.01);
  EXPECT_NE(hot.rate_constants.find("Hanson & Salimian (1984)"), std::string::npos);
  EXPECT_NE(hot.rate_constants.find("from memory"), std::string::npos);
  EXPECT_TRUE(hot.rate_constants_within_stated_range);
  EXPECT_FALSE(f.at(1800.0, 0.01).rate_constants_within_stated_range);
  EXPECT_TRUE(is_close(hot.residence_time().value(), 0.01, kExact));
}

// Wrong if bad input were accepted or reported without the field and the accepted range.
TEST(ThermalNo, RejectsBadInputNamingTheField) {
  const Fixture f;
  EXPECT_THROW_WITH((void)f.at(2000.0, -1.0), units::InputError,
                    "thermal_no.residence_time = -1 s: must be a finite time >= 0 s");
  EXPECT_THROW_WITH((void)f.at(2000.0, std::numeric_limits<double>::infinity()), units::InputError,
                    "thermal_no.residence_time = inf s");
  EXPECT_THROW_WITH((void)f.at(5000.0, 1.0), units::InputError,
                    "thermal_no.temperature = 5000 K: must lie within the species data range 200-3500 K");
  ThermalNoOptions options;
  options.initial_no_mole_fraction = 1.5;
  EXPECT_THROW_WITH((void)f.at(2000.0, 1.0, options), units::InputError,
                    "thermal_no.initial_no_mole_fraction = 1.5: must be a mole fraction between 0 and 1");
  EXPECT_THROW_WITH((void)thermal_no(f.solver, f.b, units::kelvin(2000.0), units::pascals(0.0), units::seconds(1.0)),
                    units::InputError, "thermal_no.pressure = 0 Pa: must be a finite pressure > 0 Pa");
  // A feed without nitrogen has no thermal NO to compute.
  const std::vector<SpeciesAmount> no_nitrogen{{"CH4", 1.0}, {"O2", 2.3}};
  const ElementAmounts b = element_amounts(db(), no_nitrogen);
  const EquilibriumSolver solver(db(), b);
  EXPECT_THROW_WITH((void)thermal_no(solver, b, units::kelvin(2000.0), units::pascals(kAtm_Pa), units::seconds(1.0)),
                    units::InputError, "species: thermal NO needs O, O2, N2 and NO among the equilibrium products");
}

// Wrong if the path integration at a constant temperature differed from the fixed-temperature
// closed form (the hold and the steps must add up exactly).
TEST(ThermalNoPath, AtConstantTemperatureMatchesTheFixedTemperatureResult) {
  const Fixture f;
  const ThermalNoPathResult path = thermal_no_along(f.solver, f.b, cooling_path(2100.0, 2100.0, 0.02, 0.3, 7));
  EXPECT_TRUE(is_close(path.total_time_s, 0.32, kExact));
  EXPECT_TRUE(is_close(path.no_mole_fraction, f.at(2100.0, 0.32).no_mole_fraction, 1e-12));
  ASSERT_EQ(path.history.size(), 9u);  // time 0, end of hold, 7 steps
}

// Wrong if the nodes were not on the linear history, the warm-started solves along it differed
// from cold solves at the same temperatures, or the samples were out of order.
TEST(ThermalNoPath, HistoryFollowsTheLinearCoolingWithEquilibriaOfColdSolves) {
  const Fixture f;
  const ThermalNoPathResult path = thermal_no_along(f.solver, f.b, cooling_path(1900.0, 1000.0, 0.02, 1.0, 20));
  ASSERT_EQ(path.history.size(), 22u);
  EXPECT_TRUE(is_close(path.history[0].time_s, 0.0, 0.0, 0.0));
  EXPECT_TRUE(is_close(path.history[0].no_mole_fraction, 0.0, 0.0, 0.0));
  for (std::size_t i = 2; i < path.history.size(); ++i) {
    const ThermalNoSample& s = path.history[i];
    const double expected_T = 1900.0 - 900.0 * (s.time_s - 0.02) / 1.0;
    EXPECT_TRUE(is_close(s.temperature_K, expected_T, 1e-12)) << i;
    EXPECT_GT(s.time_s, path.history[i - 1].time_s);
    EXPECT_TRUE(is_close(s.no_equilibrium_mole_fraction, f.gas(s.temperature_K).no, 1e-9)) << i;
  }
  EXPECT_TRUE(is_close(path.history.back().temperature_K, 1000.0, kExact));
  // NO keeps forming while the gas is hot: more than after the hold alone.
  EXPECT_GT(path.no_mole_fraction, 1.5 * f.at(1900.0, 0.02).no_mole_fraction);
}

// Wrong if the step error at the default 20 steps were larger than stated in docs/equilibrium.md
// (0.3 % of a 2000-step reference for NO in these paths), or the scheme were not second order
// (halving the step must quarter the error).
TEST(ThermalNoPath, DefaultStepsAreWithinThreeTenthsOfAPercentAndTheSchemeIsSecondOrder) {
  const Fixture f;
  struct Case {
    double firing_K, final_K, hold_s, cooling_s;
  };
  for (const Case c :
       {Case{1900.0, 1000.0, 0.02, 1.0}, Case{2300.0, 1200.0, 0.02, 0.5}, Case{2400.0, 1400.0, 0.0, 0.2}}) {
    const auto no = [&](int steps) {
      return thermal_no_along(f.solver, f.b, cooling_path(c.firing_K, c.final_K, c.hold_s, c.cooling_s, steps))
          .no_mole_fraction;
    };
    const double reference = no(2000);
    const double error20 = no(20) / reference - 1.0;
    const double error40 = no(40) / reference - 1.0;
    EXPECT_LT(std::abs(error20), 3e-3) << c.firing_K << " K";
    EXPECT_GT(error20 / error40, 3.5) << c.firing_K << " K";
    EXPECT_LT(error20 / error40, 4.5) << c.firing_K << " K";
  }
}

// Wrong if a bad path were accepted or reported without the field and the accepted range.
TEST(ThermalNoPath, RejectsBadPathsNamingTheField) {
  const Fixture f;
  EXPECT_THROW_WITH((void)thermal_no_along(f.solver, f.b, cooling_path(1900.0, 1000.0, -0.1, 1.0)), units::InputError,
                    "post_flame.hold_time = -0.1 s: must be a finite time >= 0 s");
  EXPECT_THROW_WITH((void)thermal_no_along(f.solver, f.b, cooling_path(1900.0, 1000.0, 0.0, 1.0, 0)), units::InputError,
                    "post_flame.cooling_steps = 0: must be between 1 and 10000");
  EXPECT_THROW_WITH((void)thermal_no_along(f.solver, f.b, cooling_path(1900.0, 100.0, 0.0, 1.0)), units::InputError,
                    "post_flame.final_temperature = 100 K: must lie within the species data range 200-3500 K");
  EXPECT_THROW_WITH((void)thermal_no_along(f.solver, f.b, PostFlamePath{}), units::InputError,
                    "post_flame.firing_temperature = 0 K");
  // A quench (no cooling time) needs no final temperature.
  EXPECT_NO_THROW((void)thermal_no_along(f.solver, f.b, cooling_path(1900.0, 0.0, 0.02, 0.0)));
}

}  // namespace
}  // namespace stackbound::core
