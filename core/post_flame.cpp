#include "stackbound/core/post_flame.hpp"

#include <fmt/format.h>

#include <array>
#include <cmath>
#include <cstddef>
#include <string_view>

#include "stackbound/units/input_error.hpp"

namespace stackbound::core {

namespace {

constexpr double kR = units::kGasConstant_J_per_mol_K;

// The species the post-flame rate laws read, in the order of PostFlameGas's members.
constexpr std::array<std::string_view, 7> kPostFlameSpecies{"O", "OH", "O2", "N2", "NO", "CO", "H2O"};
using SpeciesIndices = std::array<std::size_t, kPostFlameSpecies.size()>;

// Positions of kPostFlameSpecies in a product list (list.size() where absent).
SpeciesIndices indices_in(const std::vector<std::string>& species) {
  SpeciesIndices indices{};
  for (std::size_t k = 0; k < kPostFlameSpecies.size(); ++k) {
    indices[k] = species.size();
    for (std::size_t i = 0; i < species.size(); ++i) {
      if (species[i] == kPostFlameSpecies[k]) {
        indices[k] = i;
        break;
      }
    }
  }
  return indices;
}

PostFlameGas gas_from(const EquilibriumResult& equilibrium, const SpeciesIndices& indices) {
  const std::size_t absent = equilibrium.species.size();
  const auto x = [&](std::size_t k) { return indices[k] < absent ? equilibrium.mole_fractions[indices[k]] : 0.0; };
  PostFlameGas gas;
  gas.temperature_K = equilibrium.temperature_K;
  gas.pressure_Pa = equilibrium.pressure_Pa;
  gas.concentration_mol_per_m3 = equilibrium.pressure_Pa / (kR * equilibrium.temperature_K);
  gas.o = x(0);
  gas.oh = x(1);
  gas.o2 = x(2);
  gas.n2 = x(3);
  gas.no = x(4);
  gas.co = x(5);
  gas.h2o = x(6);
  gas.has_nitrogen_chemistry = indices[0] < absent && indices[2] < absent && indices[3] < absent && indices[4] < absent;
  gas.has_carbon_monoxide = indices[5] < absent;
  return gas;
}

void check_temperature(const EquilibriumSolver& solver, const std::string& field, double temperature_K) {
  if (!(std::isfinite(temperature_K) && temperature_K >= solver.min_temperature().value() &&
        temperature_K <= solver.max_temperature().value())) {
    throw units::InputError(fmt::format("{} = {:g} K: must lie within the species data range {:g}-{:g} K", field,
                                        temperature_K, solver.min_temperature().value(), solver.max_temperature().value()));
  }
}

void check_time(const std::string& field, double time_s) {
  if (!(std::isfinite(time_s) && time_s >= 0.0)) {
    throw units::InputError(fmt::format("{} = {:g} s: must be a finite time >= 0 s", field, time_s));
  }
}

void check_path(const EquilibriumSolver& solver, const PostFlamePath& path) {
  const std::string& f = path.field;
  check_temperature(solver, f + ".firing_temperature", path.firing_temperature.value());
  check_time(f + ".hold_time", path.hold_time.value());
  check_time(f + ".cooling_time", path.cooling_time.value());
  const double pressure_Pa = path.pressure.value();
  if (!(std::isfinite(pressure_Pa) && pressure_Pa > 0.0)) {
    throw units::InputError(fmt::format("{}.pressure = {:g} Pa: must be a finite pressure > 0 Pa", f, pressure_Pa));
  }
  if (path.cooling_time.value() > 0.0) {
    check_temperature(solver, f + ".final_temperature", path.final_temperature.value());
    if (path.cooling_steps < 1 || path.cooling_steps > kMaximumCoolingSteps) {
      throw units::InputError(
          fmt::format("{}.cooling_steps = {}: must be between 1 and {}", f, path.cooling_steps, kMaximumCoolingSteps));
    }
  }
}

}  // namespace

PostFlameGas post_flame_gas(const EquilibriumResult& equilibrium) {
  return gas_from(equilibrium, indices_in(equilibrium.species));
}

double logarithmic_mean(double p, double q) {
  if (!(p > 0.0 && q > 0.0)) return 0.0;
  if (p == q) return p;
  // p (e^u - 1)/u with u = ln(q/p), accurate when q is close to p.
  const double u = std::log(q / p);
  return p * std::expm1(u) / u;
}

double geometric_mean(double p, double q) { return std::sqrt(p) * std::sqrt(q); }

PostFlameHistory post_flame_history(const EquilibriumSolver& solver, const ElementAmounts& b,
                                    const PostFlamePath& path) {
  check_path(solver, path);
  const SpeciesIndices indices = indices_in(solver.species());
  const double pressure_Pa = path.pressure.value();
  const double firing_K = path.firing_temperature.value();
  const double hold_s = path.hold_time.value();
  const double cooling_s = path.cooling_time.value();

  PostFlameHistory history;
  EquilibriumResult previous = solver.solve_tp(b, units::kelvin(firing_K), units::pascals(pressure_Pa));
  const PostFlameGas firing = gas_from(previous, indices);
  history.nodes.push_back({0.0, firing});
  if (hold_s > 0.0) history.nodes.push_back({hold_s, firing});
  if (cooling_s > 0.0) {
    const double final_K = path.final_temperature.value();
    const int n = path.cooling_steps;
    history.nodes.reserve(history.nodes.size() + static_cast<std::size_t>(n));
    for (int i = 1; i <= n; ++i) {
      const double fraction = static_cast<double>(i) / n;
      const double temperature_K = i == n ? final_K : firing_K + (final_K - firing_K) * fraction;
      EquilibriumResult current = solver.solve_tp(b, units::kelvin(temperature_K), units::pascals(pressure_Pa), &previous);
      history.nodes.push_back({hold_s + cooling_s * fraction, gas_from(current, indices)});
      previous = std::move(current);
    }
  }
  return history;
}

}  // namespace stackbound::core
