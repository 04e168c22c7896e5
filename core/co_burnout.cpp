#include "stackbound/core/co_burnout.hpp"

#include <fmt/format.h>

#include <cmath>

#include "stackbound/units/constants.hpp"
#include "stackbound/units/input_error.hpp"

namespace stackbound::core {

namespace {

// Thermochemical calorie, J (the unit of the kcal/mol activation energies). Source: NIST SP 811, B.8.
constexpr double kCalorie_J = 4.184;
constexpr double kR = units::kGasConstant_J_per_mol_K;

void require_carbon_monoxide(const PostFlameGas& gas) {
  if (!gas.has_carbon_monoxide) {
    throw units::InputError(
        "species: CO burnout needs CO among the equilibrium products; the feed must contain carbon and the "
        "product list CO");
  }
}

void check_initial_co(const CoBurnoutOptions& options) {
  if (!options.initial_co_mole_fraction) return;
  const double x = *options.initial_co_mole_fraction;
  if (!(std::isfinite(x) && x >= 0.0 && x <= 1.0)) {
    throw units::InputError(
        fmt::format("{}.initial_co_mole_fraction = {:g}: must be a mole fraction between 0 and 1", options.field, x));
  }
}

double initial_co(const PostFlameHistory& history, const CoBurnoutOptions& options) {
  check_initial_co(options);
  return options.initial_co_mole_fraction ? *options.initial_co_mole_fraction : history.firing().co;
}

// CO after one step (header comment) from x0, with the equilibrium CO going from e0 to e1 and k' constant;
// `raised` is set when CO below the equilibrium had to be raised to it.
double step_co(double x0, double e0, double e1, double k_per_s, double dt_s, bool& raised) {
  if (dt_s == 0.0) return x0;
  if (x0 < e0) {
    x0 = e0;
    raised = true;
  }
  const double d0 = x0 - e0;
  const double w = std::exp(-k_per_s * dt_s);
  // Growth rate of ln x_eq over the step, 1/s (0 without a change or without CO at either node).
  const double g = (e0 > 0.0 && e1 > 0.0 && e0 != e1) ? std::log(e1 / e0) / dt_s : 0.0;
  const double v = (k_per_s + g) * dt_s;
  // The forced part, -g int_0^dt exp(-k'(dt - s)) x_eq(s) ds, in the form that cannot overflow.
  const double forced =
      v > 1.0 ? -g * (e1 - w * e0) / (k_per_s + g) : -g * e0 * dt_s * w * (v == 0.0 ? 1.0 : std::expm1(v) / v);
  const double d1 = w * d0 + forced;
  if (d1 < 0.0) {
    raised = true;
    return e1;
  }
  return e1 + d1;
}

}  // namespace

CoRateExpression co_rate_expression(CoOxidationRate rate) {
  switch (rate) {
    case CoOxidationRate::howard_williams_fine_1973:
      // Source: J. B. Howard, G. C. Williams, D. H. Fine, "Kinetics of carbon monoxide oxidation in
      // postflame gases", 14th Symposium (International) on Combustion (1973) 975-986 - from memory.
      // A = 1.3e14 cm^3/(mol s) = 1.3e14 x 1e-6 m^3/(mol s); E = 30 000 cal/mol; about 840-2360 K.
      return {"howard_williams_fine_1973",
              "Howard, Williams & Fine (1973), 14th Symposium (Int.) on Combustion, 975-986 (from memory)",
              1.3e14 * 1e-6,
              30000.0 * kCalorie_J / kR,
              0.5,
              0.5,
              840.0,
              2360.0};
    case CoOxidationRate::dryer_glassman_1973:
      break;
  }
  // Source: F. L. Dryer, I. Glassman, "High-temperature oxidation of CO and CH4", 14th Symposium
  // (International) on Combustion (1973) 987-1003 - from memory. A = 10^14.6 (cm^3/mol)^0.75 / s =
  // 10^14.6 x 10^-4.5 (m^3/mol)^0.75 / s; E = 40 000 cal/mol; about 1030-1230 K, 1 atm, moist CO.
  return {"dryer_glassman_1973",
          "Dryer & Glassman (1973), 14th Symposium (Int.) on Combustion, 987-1003 (from memory)",
          std::pow(10.0, 14.6 - 4.5),
          40000.0 * kCalorie_J / kR,
          0.5,
          0.25,
          1030.0,
          1230.0};
}

std::string_view to_string(CoOxidationRate rate) { return co_rate_expression(rate).name; }

double co_oxidation_rate_constant_per_s(const PostFlameGas& gas, CoOxidationRate rate) {
  const CoRateExpression e = co_rate_expression(rate);
  const double c = gas.concentration_mol_per_m3;
  return e.pre_exponential_SI * std::exp(-e.activation_temperature_K / gas.temperature_K) *
         std::pow(gas.h2o * c, e.water_order) * std::pow(gas.o2 * c, e.oxygen_order);
}

CoBurnoutResult co_burnout_along(const PostFlameHistory& history, const CoBurnoutOptions& options) {
  require_carbon_monoxide(history.firing());
  const CoRateExpression expression = co_rate_expression(options.rate);
  const auto measured = [&](double temperature_K) {
    return temperature_K >= expression.measured_low_K && temperature_K <= expression.measured_high_K;
  };
  CoBurnoutResult result;
  double x = initial_co(history, options);
  result.initial_co_mole_fraction = x;
  result.rate_expression = std::string(expression.source);
  result.history.reserve(history.nodes.size());
  double previous_k_per_s = co_oxidation_rate_constant_per_s(history.firing(), options.rate);
  for (std::size_t i = 0; i < history.nodes.size(); ++i) {
    const PostFlameGas& gas = history.nodes[i].gas;
    const double k_per_s = co_oxidation_rate_constant_per_s(gas, options.rate);
    if (i > 0) {
      const PostFlameNode& start = history.nodes[i - 1];
      x = step_co(x, start.gas.co, gas.co, logarithmic_mean(previous_k_per_s, k_per_s),
                  history.nodes[i].time_s - start.time_s, result.raised_to_equilibrium);
    }
    result.within_measured_range = result.within_measured_range && measured(gas.temperature_K);
    result.history.push_back({history.nodes[i].time_s, gas.temperature_K, x, gas.co});
    previous_k_per_s = k_per_s;
  }
  result.total_time_s = history.total_time_s();
  result.co_mole_fraction = x;
  result.co_equilibrium_mole_fraction = history.nodes.back().gas.co;
  return result;
}

CoBurnoutResult co_burnout_along(const EquilibriumSolver& solver, const ElementAmounts& b, const PostFlamePath& path,
                                 const CoBurnoutOptions& options) {
  check_initial_co(options);  // before the solves, so that a bad option fails fast
  return co_burnout_along(post_flame_history(solver, b, path), options);
}

}  // namespace stackbound::core
