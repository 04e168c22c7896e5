#include "stackbound/core/thermal_no.hpp"

#include <fmt/format.h>

#include <algorithm>
#include <cmath>
#include <limits>

#include "stackbound/units/input_error.hpp"

namespace stackbound::core {

namespace {

// Upper limit of beta = k1r [NO]e / (k2f [O2] + k3f [OH]): reached only when O2 and OH are all but
// absent (very rich gas), where the N atoms find no partner and the net rate is that of reaction 1
// alone; the cap keeps the arithmetic finite.
constexpr double kMaximumBeta = 1e200;

// The rate law at fixed T, P and radicals, in y = x_NO/x_NO,e: dy/dt = a (1 - y^2)/(1 + beta y).
struct RateLaw {
  double a_per_s = 0.0;
  double beta = 0.0;
};

// The law's coefficients at one gas state in mole fractions: forward = 2 k1f [O][N2] / C (the rate of
// NO formation far from equilibrium, mole fraction per s), beta, and the equilibrium NO.
struct NodeCoefficients {
  double forward_per_s = 0.0;
  double beta = 0.0;
  double no_equilibrium = 0.0;
};

void require_nitrogen_chemistry(const PostFlameGas& gas) {
  if (!gas.has_nitrogen_chemistry || !(gas.no > 0.0) || !(gas.n2 > 0.0)) {
    throw units::InputError(
        "species: thermal NO needs O, O2, N2 and NO among the equilibrium products, with N2 and NO present; "
        "include nitrogen in the feed and these species in the product list");
  }
}

NodeCoefficients coefficients(const PostFlameGas& gas, const ZeldovichRates& rates) {
  const double T = gas.temperature_K;
  const double c = gas.concentration_mol_per_m3;
  const double partners = rates.k2f.at_K(T) * gas.o2 * c + rates.k3f.at_K(T) * gas.oh * c;
  NodeCoefficients node;
  node.forward_per_s = 2.0 * rates.k1f.at_K(T) * gas.o * gas.n2 * c;
  node.beta = partners > 0.0 ? std::min(rates.k1r.at_K(T) * gas.no * c / partners, kMaximumBeta) : kMaximumBeta;
  node.no_equilibrium = gas.no;
  return node;
}

RateLaw rate_law(const NodeCoefficients& node) { return {node.forward_per_s / node.no_equilibrium, node.beta}; }

// The constant coefficients of a step between two nodes (core/post_flame.hpp): the forward rate
// at its logarithmic mean, beta and the equilibrium NO at their geometric means (mid-step values).
NodeCoefficients step_coefficients(const NodeCoefficients& start, const NodeCoefficients& end) {
  return {logarithmic_mean(start.forward_per_s, end.forward_per_s), geometric_mean(start.beta, end.beta),
          geometric_mean(start.no_equilibrium, end.no_equilibrium)};
}

// y after time t from y0 >= 0 by the exact integral (header): solves
//   psi(z) = z + gamma ln((1 + y(z))/(1 + y0)) - tau = 0,  y(z) = y0 + sigma s0 (1 - e^-z),
// gamma = (1 - beta)/(1 + beta), tau = 2 a t/(1 + beta), sigma = sign(1 - y0), s0 = |1 - y0|.
// psi' = 1 + gamma sigma s0 e^-z/(1 + y) > 0, and |gamma ln(...)| <= |ln(2/(1 + y0))|, which brackets the
// root; Newton steps that leave the bracket are replaced by bisection.
double advance(double y0, const RateLaw& law, double time_s) {
  if (time_s == 0.0 || y0 == 1.0 || law.a_per_s == 0.0) return y0;
  const double sigma = y0 < 1.0 ? 1.0 : -1.0;
  const double s0 = std::abs(1.0 - y0);
  const double gamma = (1.0 - law.beta) / (1.0 + law.beta);
  const double tau = 2.0 * law.a_per_s * time_s / (1.0 + law.beta);
  if (!std::isfinite(tau)) return 1.0;
  const double spread = std::abs(gamma) * std::abs(std::log(2.0 / (1.0 + y0)));
  double low = std::max(0.0, tau - spread);
  double high = tau + spread;
  // Change of y from y0, accurate for small z (expm1) where y - y0 is far below y0.
  const auto change = [&](double z) { return -sigma * s0 * std::expm1(-z); };
  double z = std::clamp(tau, low, high);
  for (int iteration = 0; iteration < 200; ++iteration) {
    const double dy = change(z);
    const double psi = z + gamma * std::log1p(dy / (1.0 + y0)) - tau;
    if (psi == 0.0) break;
    if (psi < 0.0)
      low = z;
    else
      high = z;
    const double slope = 1.0 + gamma * sigma * s0 * std::exp(-z) / (1.0 + y0 + dy);
    double next = z - psi / slope;
    if (!(next > low && next < high)) next = 0.5 * (low + high);
    const double step = std::abs(next - z);
    z = next;
    if (step <= 4.0 * std::numeric_limits<double>::epsilon() * z ||
        high - low <= 4.0 * std::numeric_limits<double>::epsilon() * high)
      break;
  }
  const double y = y0 + change(z);
  // Rounding must not carry y across the equilibrium it approaches.
  return sigma > 0.0 ? std::min(y, 1.0) : std::max(y, 1.0);
}

void check_initial_no(const ThermalNoOptions& options) {
  const double x = options.initial_no_mole_fraction;
  if (!(std::isfinite(x) && x >= 0.0 && x <= 1.0)) {
    throw units::InputError(
        fmt::format("{}.initial_no_mole_fraction = {:g}: must be a mole fraction between 0 and 1", options.field, x));
  }
}

void check_residence_time(const ThermalNoOptions& options, double time_s) {
  if (!(std::isfinite(time_s) && time_s >= 0.0)) {
    throw units::InputError(
        fmt::format("{}.residence_time = {:g} s: must be a finite time >= 0 s", options.field, time_s));
  }
}

}  // namespace

double ArrheniusRate::at_K(double temperature_K) const {
  const double power = temperature_exponent == 0.0 ? 1.0 : std::pow(temperature_K, temperature_exponent);
  return pre_exponential_m3_per_mol_s * power * std::exp(-activation_temperature_K / temperature_K);
}

double ZeldovichRates::equilibrium_constant(units::Temperature temperature) const {
  const double T = temperature.value();
  return (k1f.at_K(T) / k1r.at_K(T)) * (k2f.at_K(T) / k2r.at_K(T));
}

bool ZeldovichRates::rate_law_within_stated_ranges(units::Temperature temperature) const {
  const double T = temperature.value();
  return k1f.within_stated_range_K(T) && k1r.within_stated_range_K(T) && k2f.within_stated_range_K(T) &&
         k3f.within_stated_range_K(T);
}

ZeldovichRates hanson_salimian_1984_rates() {
  // Source: R. K. Hanson, S. Salimian, "Survey of rate constants in the N/H/O system", in Combustion
  // Chemistry (W. C. Gardiner, ed.), Springer, 1984; as tabulated in S. R. Turns, An Introduction to
  // Combustion, ch. 5 - from memory. The table gives A in m^3/(kmol s); 1 m^3/(kmol s) = 1e-3 m^3/(mol s).
  //   k1f = 1.8e11 exp(-38370/T)       2000-5000 K
  //   k1r = 3.8e10 exp(-425/T)         300-5000 K
  //   k2f = 1.8e7 T exp(-4680/T)       300-3000 K
  //   k2r = 3.81e6 T exp(-20820/T)     1000-3000 K
  //   k3f = 7.1e10 exp(-450/T)         300-2500 K
  //   k3r = 1.7e11 exp(-24560/T)       2200-4500 K
  constexpr double kPerKmol = 1e-3;
  ZeldovichRates rates;
  rates.source = "Hanson & Salimian (1984), as tabulated in Turns, An Introduction to Combustion, ch. 5 (from memory)";
  rates.k1f = {1.8e11 * kPerKmol, 0.0, 38370.0, 2000.0, 5000.0};
  rates.k1r = {3.8e10 * kPerKmol, 0.0, 425.0, 300.0, 5000.0};
  rates.k2f = {1.8e7 * kPerKmol, 1.0, 4680.0, 300.0, 3000.0};
  rates.k2r = {3.81e6 * kPerKmol, 1.0, 20820.0, 1000.0, 3000.0};
  rates.k3f = {7.1e10 * kPerKmol, 0.0, 450.0, 300.0, 2500.0};
  rates.k3r = {1.7e11 * kPerKmol, 0.0, 24560.0, 2200.0, 4500.0};
  return rates;
}

double thermal_no_rate_mol_per_m3_s(const PostFlameGas& gas, double no_mol_per_m3, const ZeldovichRates& rates) {
  require_nitrogen_chemistry(gas);
  if (!(std::isfinite(no_mol_per_m3) && no_mol_per_m3 >= 0.0)) {
    throw units::InputError(fmt::format("NO concentration = {:g} mol/m3: must be finite and >= 0", no_mol_per_m3));
  }
  const double T = gas.temperature_K;
  const double c = gas.concentration_mol_per_m3;
  const double no_equilibrium = gas.no * c;
  const double partners = rates.k2f.at_K(T) * gas.o2 * c + rates.k3f.at_K(T) * gas.oh * c;
  const double ratio = no_mol_per_m3 / no_equilibrium;
  const double forward = 2.0 * rates.k1f.at_K(T) * (gas.o * c) * (gas.n2 * c);
  // beta y, with beta capped as in coefficients().
  const double beta_y = partners > 0.0 ? std::min(rates.k1r.at_K(T) * no_mol_per_m3 / partners, kMaximumBeta * ratio)
                                       : kMaximumBeta * ratio;
  return forward * (1.0 - ratio * ratio) / (1.0 + beta_y);
}

ThermalNoResult thermal_no(const PostFlameGas& gas, units::Time residence_time, const ThermalNoOptions& options) {
  require_nitrogen_chemistry(gas);
  check_initial_no(options);
  const double time_s = residence_time.value();
  check_residence_time(options, time_s);
  const double x0 = options.initial_no_mole_fraction;
  const double c = gas.concentration_mol_per_m3;
  ThermalNoResult result;
  result.residence_time_s = time_s;
  result.no_equilibrium_mole_fraction = gas.no;
  result.no_mole_fraction = gas.no * advance(x0 / gas.no, rate_law(coefficients(gas, options.rates)), time_s);
  result.initial_rate_mole_fraction_per_s = thermal_no_rate_mol_per_m3_s(gas, x0 * c, options.rates) / c;
  result.rate_constants = options.rates.source;
  result.temperature_K = gas.temperature_K;
  result.pressure_Pa = gas.pressure_Pa;
  result.initial_no_mole_fraction = x0;
  result.rate_constants_within_stated_range = options.rates.rate_law_within_stated_ranges(gas.temperature());
  return result;
}

ThermalNoResult thermal_no(const EquilibriumSolver& solver, const ElementAmounts& b, units::Temperature temperature,
                           units::Pressure pressure, units::Time residence_time, const ThermalNoOptions& options) {
  const double T = temperature.value();
  const double P = pressure.value();
  if (!(std::isfinite(T) && T >= solver.min_temperature().value() && T <= solver.max_temperature().value())) {
    throw units::InputError(fmt::format("{}.temperature = {:g} K: must lie within the species data range {:g}-{:g} K",
                                        options.field, T, solver.min_temperature().value(), solver.max_temperature().value()));
  }
  if (!(std::isfinite(P) && P > 0.0)) {
    throw units::InputError(fmt::format("{}.pressure = {:g} Pa: must be a finite pressure > 0 Pa", options.field, P));
  }
  check_residence_time(options, residence_time.value());
  check_initial_no(options);
  return thermal_no(post_flame_gas(solver.solve_tp(b, temperature, pressure)), residence_time, options);
}

ThermalNoPathResult thermal_no_along(const PostFlameHistory& history, const ThermalNoOptions& options) {
  require_nitrogen_chemistry(history.firing());
  check_initial_no(options);
  ThermalNoPathResult result;
  result.initial_no_mole_fraction = options.initial_no_mole_fraction;
  result.rate_constants = options.rates.source;
  result.history.reserve(history.nodes.size());
  double x = options.initial_no_mole_fraction;
  NodeCoefficients previous = coefficients(history.firing(), options.rates);
  for (std::size_t i = 0; i < history.nodes.size(); ++i) {
    const PostFlameNode& node = history.nodes[i];
    require_nitrogen_chemistry(node.gas);
    const NodeCoefficients current = coefficients(node.gas, options.rates);
    if (i > 0) {
      const NodeCoefficients step = step_coefficients(previous, current);
      x = step.no_equilibrium *
          advance(x / step.no_equilibrium, rate_law(step), node.time_s - history.nodes[i - 1].time_s);
    }
    result.rate_constants_within_stated_range = result.rate_constants_within_stated_range &&
                                                options.rates.rate_law_within_stated_ranges(node.gas.temperature());
    result.history.push_back({node.time_s, node.gas.temperature_K, x, node.gas.no});
    previous = current;
  }
  result.total_time_s = history.total_time_s();
  result.no_mole_fraction = x;
  result.no_equilibrium_mole_fraction = history.nodes.back().gas.no;
  return result;
}

ThermalNoPathResult thermal_no_along(const EquilibriumSolver& solver, const ElementAmounts& b,
                                     const PostFlamePath& path, const ThermalNoOptions& options) {
  check_initial_no(options);
  return thermal_no_along(post_flame_history(solver, b, path), options);
}

}  // namespace stackbound::core
