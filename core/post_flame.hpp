#pragma once
// The post-flame gas and its temperature history, shared by the post-flame kinetics (thermal NO,
// core/thermal_no.hpp; CO burnout, core/co_burnout.hpp).
//
// The gas at each temperature is the equilibrium of our own solver at that T and P, reduced to the
// species the rate laws use (O, OH, O2, N2, NO, CO, H2O), with the molar concentration of the ideal gas
//   C = P / (R T),   [X] = x_X C.
// The path is a hold at the firing temperature followed by linear cooling (or heating) to a final
// temperature. It is followed through nodes: time 0 and the end of the hold at the firing temperature,
// then `cooling_steps` equal time steps of the linear history, with the equilibrium solved at every
// node's temperature (each solve warm-started from the previous one). Between two nodes the rate
// models take their coefficients as varying log-linearly in time (rates of the Arrhenius kind change
// by orders of magnitude over a step; a logarithmic mean integrates them exactly where ln k is linear
// in t) and integrate the step in closed form (core/thermal_no.hpp, core/co_burnout.hpp): exact at a
// fixed temperature, second order in the step otherwise, with a small error constant. A parcel of gas
// is followed at constant pressure, so mole fractions (not concentrations) carry from one node to the
// next; the change in total moles by the slow reactions (ppm levels) is neglected.

#include <string>
#include <vector>

#include "stackbound/core/element_amounts.hpp"
#include "stackbound/core/equilibrium.hpp"
#include "stackbound/units/constants.hpp"
#include "stackbound/units/quantities.hpp"

namespace stackbound::core {

// The equilibrium gas at one T, P as the post-flame rate laws see it. Mole fractions are 0 for a
// species that is not among the solver's products.
struct PostFlameGas {
  double temperature_K = 0.0;
  double pressure_Pa = 0.0;
  double concentration_mol_per_m3 = 0.0;  // C = P/(R T)
  double o = 0.0;                         // equilibrium mole fractions
  double oh = 0.0;
  double o2 = 0.0;
  double n2 = 0.0;
  double no = 0.0;
  double co = 0.0;
  double h2o = 0.0;
  bool has_nitrogen_chemistry = false;  // O, O2, N2 and NO are all among the products
  bool has_carbon_monoxide = false;     // CO is among the products

  [[nodiscard]] units::Temperature temperature() const { return units::kelvin(temperature_K); }
  [[nodiscard]] units::Pressure pressure() const { return units::pascals(pressure_Pa); }
};

// The gas of one equilibrium result of our solver (at that result's T and P).
[[nodiscard]] PostFlameGas post_flame_gas(const EquilibriumResult& equilibrium);

// Largest number of cooling steps accepted: bounds the work of one path (each step is one
// equilibrium solve); more than this is taken to be a mistake. Our choice, no source.
inline constexpr int kMaximumCoolingSteps = 10000;

// A post-flame temperature history.
struct PostFlamePath {
  // Temperature of the gas leaving the flame, where the hold takes place. Must lie inside the
  // species data of the solver; no default (0 K is refused).
  units::Temperature firing_temperature = units::kelvin(0.0);
  // Time at the firing temperature before cooling starts, s (>= 0). Default 20 ms: a typical
  // flame-zone residence time (common practice, no source).
  units::Time hold_time = units::seconds(0.020);
  // Temperature at the end of the linear cooling; may equal or exceed the firing temperature (the
  // models do not assume cooling). No default (0 K is refused) unless cooling_time is 0.
  units::Temperature final_temperature = units::kelvin(0.0);
  // Duration of the linear change from the firing to the final temperature, s (>= 0). 0 = quench
  // after the hold: the composition freezes.
  units::Time cooling_time = units::seconds(1.0);
  // Pressure of the gas (constant along the path), Pa.
  units::Pressure pressure = units::pascals(units::kStandardAtmosphere_Pa);
  // Number of equal time steps of the cooling, 1 ... kMaximumCoolingSteps. See tests/core for the
  // step error at the default.
  int cooling_steps = 20;
  // Names the path in error messages: "<field>.hold_time = -1 s: ...".
  std::string field = "post_flame";
};

// One node of a history: a time and the equilibrium gas at the temperature of the path then.
struct PostFlameNode {
  double time_s = 0.0;
  PostFlameGas gas;
};

// The path solved for its equilibria: nodes in time order, the first at time 0 and the firing
// temperature (the starting state), then the end of the hold (if its time is > 0) and the ends of the
// cooling steps (if cooling_time > 0). A step runs from one node to the next.
struct PostFlameHistory {
  std::vector<PostFlameNode> nodes;
  [[nodiscard]] const PostFlameGas& firing() const { return nodes.front().gas; }
  [[nodiscard]] double total_time_s() const { return nodes.back().time_s; }
};

// Means of a coefficient over a step from its values at the two nodes (both >= 0):
// logarithmic_mean(p, q) = (q - p)/ln(q/p), the exact mean of a quantity varying log-linearly in
// time (p if p == q, 0 if either is 0); geometric_mean(p, q) = sqrt(p q), its value at mid-step.
[[nodiscard]] double logarithmic_mean(double p, double q);
[[nodiscard]] double geometric_mean(double p, double q);

// Checks the path (throws units::InputError naming `<path.field>.<member>`, the value and the
// accepted range: temperatures inside the solver's species data, times >= 0 and finite, pressure > 0
// and finite, 1 <= cooling_steps <= kMaximumCoolingSteps) and solves the equilibrium at every node
// (1 + cooling_steps solves). Throws ConvergenceError if a solve fails.
[[nodiscard]] PostFlameHistory post_flame_history(const EquilibriumSolver& solver, const ElementAmounts& b,
                                                  const PostFlamePath& path);

}  // namespace stackbound::core
