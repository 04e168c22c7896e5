#pragma once
// Thermal NO by the extended Zeldovich mechanism,
//   (1) N2 + O = NO + N,   (2) N + O2 = NO + O,   (3) N + OH = NO + H,
// with N in quasi-steady state and O, OH, O2, N2 at their equilibrium values at the local T and P
// (from our equilibrium solver, core/post_flame.hpp):
//   d[NO]/dt = 2 k1f [O][N2] (1 - [NO]^2/[NO]e^2) / (1 + k1r [NO] / (k2f [O2] + k3f [OH]))
// The published form writes [NO]e^2 as K [O2][N2] with K = (k1f/k1r)(k2f/k2r) (Hanson & Salimian 1984
// as tabulated in Turns, An Introduction to Combustion, ch. 5 - from memory). We use the equilibrium NO
// of our own species data instead, so that the rate vanishes exactly at the NO the equilibrium solver
// reports. Over 1800-2500 K the K of the rate constants is 14-18 % above the K of our species data
// (tests/reference/post_flame_rates_test.cpp), mostly through the NO formation enthalpy of our data.
//
// Integration at fixed T and P: with y = [NO]/[NO]e, a = 2 k1f [O][N2]/[NO]e and
// beta = k1r [NO]e/(k2f [O2] + k3f [OH]) the law is dy/dt = a (1 - y^2)/(1 + beta y), whose integral is
//   (1 + beta)/2 ln(|1 - y0| / |1 - y|) + (1 - beta)/2 ln((1 + y)/(1 + y0)) = a t.
// It is solved for z = ln(|1 - y0|/|1 - y|) by a bracketed Newton iteration (the left side is
// strictly increasing in z): exact for any step size, so stiffness does not arise. y moves
// monotonically from y0 toward 1 and never crosses it: NO formed from below never exceeds the local
// equilibrium NO, and NO above it (a cooled gas) decomposes toward it without undershooting.
//
// Applies to lean and near-stoichiometric post-flame gas where O, OH are near equilibrium. It
// underestimates NO where superequilibrium radicals matter (in and just behind the flame front) and
// leaves out prompt NO and NO from fuel nitrogen (core/fuel_nitrogen.hpp). See docs/equilibrium.md.

#include <string>
#include <vector>

#include "stackbound/core/equilibrium.hpp"
#include "stackbound/core/post_flame.hpp"
#include "stackbound/units/quantities.hpp"

namespace stackbound::core {

// k = A T^n exp(-theta/T) in m^3/(mol s), with the temperature range its source states.
struct ArrheniusRate {
  double pre_exponential_m3_per_mol_s = 0.0;  // A, m^3/(mol s) K^-n
  double temperature_exponent = 0.0;          // n
  double activation_temperature_K = 0.0;      // theta = E/R
  double stated_low_K = 0.0;                  // the source's stated range
  double stated_high_K = 0.0;

  [[nodiscard]] double at_K(double temperature_K) const;
  [[nodiscard]] double at(units::Temperature temperature) const { return at_K(temperature.value()); }
  [[nodiscard]] bool within_stated_range_K(double temperature_K) const {
    return temperature_K >= stated_low_K && temperature_K <= stated_high_K;
  }
};

// Rate constants of the three reactions, forward (f) and reverse (r), and where they come from.
struct ZeldovichRates {
  std::string source;  // shown with every result
  ArrheniusRate k1f;
  ArrheniusRate k1r;
  ArrheniusRate k2f;
  ArrheniusRate k2r;
  ArrheniusRate k3f;
  ArrheniusRate k3r;

  // K of N2 + O2 = 2 NO implied by the rate constants, (k1f/k1r)(k2f/k2r), dimensionless.
  [[nodiscard]] double equilibrium_constant(units::Temperature temperature) const;
  // True when T lies in the stated range of every constant the rate law uses (k1f, k1r, k2f, k3f).
  [[nodiscard]] bool rate_law_within_stated_ranges(units::Temperature temperature) const;
};

// The default set: Hanson & Salimian (1984), as tabulated in Turns, ch. 5 (from memory).
[[nodiscard]] ZeldovichRates hanson_salimian_1984_rates();

struct ThermalNoOptions {
  // NO mole fraction at time 0 (0 ... 1). Default 0: no NO entering the post-flame zone.
  double initial_no_mole_fraction = 0.0;
  ZeldovichRates rates = hanson_salimian_1984_rates();
  // Names the options in error messages: "<field>.initial_no_mole_fraction = ...".
  std::string field = "thermal_no";
};

// NO after a residence time at fixed T and P. The CLI prints the first five members under these names.
struct ThermalNoResult {
  double residence_time_s = 0.0;
  double no_mole_fraction = 0.0;
  double no_equilibrium_mole_fraction = 0.0;      // of our species data at T, P
  double initial_rate_mole_fraction_per_s = 0.0;  // d x_NO/dt at the initial NO
  std::string rate_constants;                     // ZeldovichRates::source
  double temperature_K = 0.0;
  double pressure_Pa = 0.0;
  double initial_no_mole_fraction = 0.0;
  // False when T is outside the stated range of a rate constant the law uses (the value is then an
  // extrapolation of the published expressions, e.g. k1f below 2000 K).
  bool rate_constants_within_stated_range = true;

  [[nodiscard]] units::Time residence_time() const { return units::seconds(residence_time_s); }
  [[nodiscard]] units::Temperature temperature() const { return units::kelvin(temperature_K); }
};

// d[NO]/dt of the rate law above, mol/(m^3 s), at the NO concentration `no_mol_per_m3` (>= 0) and the
// gas's T, P and equilibrium radicals. Throws units::InputError if the gas lacks O, O2, N2 or NO among
// its products, or for a negative or non-finite NO.
[[nodiscard]] double thermal_no_rate_mol_per_m3_s(const PostFlameGas& gas, double no_mol_per_m3,
                                                  const ZeldovichRates& rates = hanson_salimian_1984_rates());

// NO after `residence_time` (>= 0, finite) in `gas`. Throws units::InputError for a bad time, a bad
// initial NO (field named) or a gas without nitrogen chemistry.
[[nodiscard]] ThermalNoResult thermal_no(const PostFlameGas& gas, units::Time residence_time,
                                         const ThermalNoOptions& options = {});

// The same at T and P, with the gas from one solve of `solver` for the feed `b`. Throws
// units::InputError naming "thermal_no.temperature" / "thermal_no.pressure" for values outside the
// species data or not > 0.
[[nodiscard]] ThermalNoResult thermal_no(const EquilibriumSolver& solver, const ElementAmounts& b,
                                         units::Temperature temperature, units::Pressure pressure,
                                         units::Time residence_time, const ThermalNoOptions& options = {});

// One node of a history: its time and temperature, the NO there and the equilibrium NO there.
struct ThermalNoSample {
  double time_s = 0.0;
  double temperature_K = 0.0;
  double no_mole_fraction = 0.0;
  double no_equilibrium_mole_fraction = 0.0;
};

struct ThermalNoPathResult {
  double total_time_s = 0.0;
  double no_mole_fraction = 0.0;              // at the end of the path
  double no_equilibrium_mole_fraction = 0.0;  // at the final node's temperature
  double initial_no_mole_fraction = 0.0;
  std::string rate_constants;
  bool rate_constants_within_stated_range = true;  // at every node
  // One sample per node of the history (the first: time 0, firing temperature, the initial NO).
  std::vector<ThermalNoSample> history;
};

// NO along a solved history (core/post_flame.hpp). Each step between two nodes is integrated by the
// closed form above with constant coefficients: 2 k1f [O][N2] at its logarithmic mean over the step,
// beta and the equilibrium NO at their geometric means (exact at a fixed temperature).
[[nodiscard]] ThermalNoPathResult thermal_no_along(const PostFlameHistory& history,
                                                   const ThermalNoOptions& options = {});
// The same, solving the path's equilibria first (post_flame_history()).
[[nodiscard]] ThermalNoPathResult thermal_no_along(const EquilibriumSolver& solver, const ElementAmounts& b,
                                                   const PostFlamePath& path, const ThermalNoOptions& options = {});

}  // namespace stackbound::core
