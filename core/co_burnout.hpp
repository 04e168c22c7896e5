#pragma once
// CO burnout along a post-flame temperature history (core/post_flame.hpp) by a global oxidation rate
// relaxing CO toward its local equilibrium:
//   d x_CO/dt = -k'(T) (x_CO - x_CO,eq(T)),   k'(T) = A exp(-theta/T) [H2O]^a [O2]^b
// with [H2O], [O2] and x_CO,eq the equilibrium values of our solver at the local T and P (mol/m^3 in
// k'). Each step of a history (core/post_flame.hpp) is integrated exactly with k' constant at its
// logarithmic mean over the step and x_CO,eq varying log-linearly between its node values
// (x_eq(s) = x_eq,0 exp(g s), g = ln(x_eq,1/x_eq,0)/dt): for the deviation d = x - x_eq,
//   d(dt) = w d(0) - g x_eq,0 dt w phi((k' + g) dt),   w = exp(-k' dt),  phi(v) = (e^v - 1)/v,
// stable for any step; at a fixed temperature it is x_eq + (x - x_eq) exp(-k' dt). The global rates
// describe oxidation only: CO never falls below the local equilibrium CO (while cooling the exact
// update stays above it), and a CO below it (a given start, or a gas being heated) is raised to it
// (CO2 dissociation is fast at these temperatures), which the result flags.
//
// Applies to well-mixed lean post-flame gas with OH near partial equilibrium, the conditions of the
// measurements behind the rates; it cannot describe CO left by poor mixing or quenched flames near
// walls. See docs/equilibrium.md.

#include <optional>
#include <string>
#include <string_view>
#include <vector>

#include "stackbound/core/equilibrium.hpp"
#include "stackbound/core/post_flame.hpp"

namespace stackbound::core {

// The published global rate expressions.
enum class CoOxidationRate {
  // Dryer & Glassman (1973), 14th Symposium (International) on Combustion, 987-1003 (from memory):
  // -d[CO]/dt = 10^14.6 exp(-40 kcal/mol / RT) [CO][H2O]^0.5[O2]^0.25, mol/cm^3, s. Measured at about
  // 1030-1230 K, 1 atm, moist CO.
  dryer_glassman_1973,
  // Howard, Williams & Fine (1973), 14th Symposium (International) on Combustion, 975-986 (from
  // memory): -d[CO]/dt = 1.3e14 [CO][O2]^0.5[H2O]^0.5 exp(-30 kcal/mol / RT), mol/cm^3, s. Post-flame
  // gases at about 840-2360 K.
  howard_williams_fine_1973,
};

// A rate expression in SI: k' = A exp(-theta/T) [H2O]^water_order [O2]^oxygen_order, 1/s.
struct CoRateExpression {
  std::string_view name;            // "dryer_glassman_1973"
  std::string_view source;          // citation and status, shown with every result
  double pre_exponential_SI = 0.0;  // A, (m^3/mol)^(water_order + oxygen_order) / s
  double activation_temperature_K = 0.0;
  double water_order = 0.0;
  double oxygen_order = 0.0;
  double measured_low_K = 0.0;  // temperatures of the measurements behind the expression
  double measured_high_K = 0.0;
};

[[nodiscard]] CoRateExpression co_rate_expression(CoOxidationRate rate);
[[nodiscard]] std::string_view to_string(CoOxidationRate rate);

// k' of the expression at the gas's T and equilibrium H2O and O2, 1/s (0 without H2O or O2).
[[nodiscard]] double co_oxidation_rate_constant_per_s(const PostFlameGas& gas, CoOxidationRate rate);

struct CoBurnoutOptions {
  // CO mole fraction at time 0 (0 ... 1). Default: the equilibrium CO at the firing temperature,
  // the frozen-flame value of the equilibrium bound (docs/equilibrium.md).
  std::optional<double> initial_co_mole_fraction;
  CoOxidationRate rate = CoOxidationRate::dryer_glassman_1973;
  // Names the options in error messages: "<field>.initial_co_mole_fraction = ...".
  std::string field = "co_burnout";
};

// One node of a history: its time and temperature, the CO there and the equilibrium CO there.
struct CoBurnoutSample {
  double time_s = 0.0;
  double temperature_K = 0.0;
  double co_mole_fraction = 0.0;
  double co_equilibrium_mole_fraction = 0.0;
};

struct CoBurnoutResult {
  double total_time_s = 0.0;
  double initial_co_mole_fraction = 0.0;
  double co_mole_fraction = 0.0;              // at the end of the path
  double co_equilibrium_mole_fraction = 0.0;  // at the final node's temperature
  std::string rate_expression;                // CoRateExpression::source
  // False when a node's temperature lies outside the measurements behind the expression.
  bool within_measured_range = true;
  // True when CO below the local equilibrium was raised to it (see the header comment).
  bool raised_to_equilibrium = false;
  // One sample per node of the history (the first: time 0, firing temperature, the initial CO).
  std::vector<CoBurnoutSample> history;
};

// CO along a solved history. Throws units::InputError if CO is not among the products, or for an
// initial CO that is not a mole fraction.
[[nodiscard]] CoBurnoutResult co_burnout_along(const PostFlameHistory& history, const CoBurnoutOptions& options = {});
// The same, solving the path's equilibria first (post_flame_history()).
[[nodiscard]] CoBurnoutResult co_burnout_along(const EquilibriumSolver& solver, const ElementAmounts& b,
                                               const PostFlamePath& path, const CoBurnoutOptions& options = {});

}  // namespace stackbound::core
