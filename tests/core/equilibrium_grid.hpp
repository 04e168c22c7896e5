#pragma once
// The robustness grid of the TP equilibrium solver, shared by the robustness test and the fingerprint
// test: invented fuels spanning C/H/O/N/S/Ar/He systems burnt with an invented dry air, over
// equivalence ratio x temperature x pressure. Cold grid: 10 fuels x 12 phi x 17 T x 5 P, one solver
// per feed; warm sweep: one solver for every element, each point warm-started from the previous one.

#include <vector>

#include "stackbound/cases/species_file.hpp"
#include "stackbound/core/element_amounts.hpp"
#include "stackbound/core/elements.hpp"
#include "stackbound/core/equilibrium.hpp"
#include "stackbound/units/constants.hpp"

namespace stackbound::core::grid {

inline const SpeciesDatabase& db() { return cases::builtin_species(); }

struct Fuel {
  const char* name;
  std::vector<SpeciesAmount> species;  // one "unit" of fuel
  double oxygen_demand;                // mol O2 for complete combustion of one unit
};

// Invented fuels: pure gases, a coal-like solid (graphite + H2 + water + NH3 + H2S), a sour gas,
// an ammonia fuel and a helium-diluted methane.
inline std::vector<Fuel> fuels() {
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

// Element amounts of `fuel` burnt at equivalence ratio `phi` with invented dry air (O2 + 3.727 N2 + 0.0446 Ar).
inline ElementAmounts feed_elements(const Fuel& fuel, double phi) {
  std::vector<SpeciesAmount> feed = fuel.species;
  const double o2 = fuel.oxygen_demand / phi;
  feed.push_back({"O2", o2});
  feed.push_back({"N2", 3.727 * o2});
  feed.push_back({"Ar", 0.0446 * o2});
  return element_amounts(db(), feed);
}

// One grid point, as named in failure messages.
struct Point {
  const char* fuel;
  double phi;
  double temperature_K;
  double pressure_atm;
  [[nodiscard]] double pressure_Pa() const { return pressure_atm * units::kStandardAtmosphere_Pa; }
};

inline constexpr double kPhis[] = {0.1, 0.3, 0.5, 0.8, 0.95, 1.0, 1.05, 1.2, 1.5, 2.0, 3.0, 4.0};
inline constexpr double kPressures_atm[] = {0.01, 0.1, 1.0, 10.0, 100.0};

// 300 K to the data's upper limit (3500 K) in 200 K steps, and the limit itself.
inline std::vector<double> cold_temperatures_K() {
  std::vector<double> temperatures_K;
  for (double T = 300.0; T < 3500.0; T += 200.0) temperatures_K.push_back(T);
  temperatures_K.push_back(3500.0);
  return temperatures_K;
}

// Calls visit(point, solver, b) for every point of the cold-start grid, in a fixed order; the solver
// is built for the point's feed.
template <class Visit>
void for_each_cold_point(Visit&& visit) {
  const std::vector<double> temperatures_K = cold_temperatures_K();
  for (const Fuel& fuel : fuels()) {
    for (const double phi : kPhis) {
      const ElementAmounts b = feed_elements(fuel, phi);
      const EquilibriumSolver solver(db(), b);
      for (const double T : temperatures_K) {
        for (const double P_atm : kPressures_atm) visit(Point{fuel.name, phi, T, P_atm}, solver, b);
      }
    }
  }
}

// Calls visit(point, solver, b) for every point of the warm-started sweep, in sweep order: phi steps by
// a factor 1.25 from 0.1 to 4, T by 150 K from 300 to 3500 K, P over 0.01, 1 and 100 atm; one solver
// holds every element, so the caller may warm-start each point from the previous one.
template <class Visit>
void for_each_sweep_point(Visit&& visit) {
  ElementAmounts all_elements;
  for (const char* symbol : {"C", "H", "O", "N", "S", "Ar", "He"}) all_elements.moles[element_index(symbol)] = 1.0;
  const EquilibriumSolver solver(db(), all_elements);
  for (const Fuel& fuel : fuels()) {
    for (double phi = 0.1; phi <= 4.0; phi *= 1.25) {
      const ElementAmounts b = feed_elements(fuel, phi);
      for (double T = 300.0; T <= 3500.0; T += 150.0) {
        for (const double P_atm : {0.01, 1.0, 100.0}) visit(Point{fuel.name, phi, T, P_atm}, solver, b);
      }
    }
  }
}

}  // namespace stackbound::core::grid
