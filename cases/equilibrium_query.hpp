#pragma once
// The `equilibrium` request of the front ends (the command line's options, the Python module's
// keyword arguments): a feed of database species at a fixed T and P or at its adiabatic flame
// temperature, and optionally thermal NO after a residence time at the solved state. Every text is
// parsed and checked here, once; errors name the command-line option ("--temperature = ...").

#include <optional>
#include <string>
#include <string_view>
#include <vector>

#include "stackbound/core/equilibrium.hpp"
#include "stackbound/core/species_database.hpp"
#include "stackbound/core/thermal_no.hpp"

namespace stackbound::cases {

inline constexpr std::string_view kEquilibriumBoundNote =
    "Chemical-equilibrium values at the stated T and P: an equilibrium bound, not a measurement.";
inline constexpr std::string_view kThermalNoCaution =
    "Thermal NO is a kinetic estimate with equilibrium O and OH (extended Zeldovich); prompt NO is not computed.";

// Option texts as given; empty means not given.
struct EquilibriumQuery {
  std::string feed;              // --feed: reactants, "CH4 + 2.4 O2 + 9.03 N2"
  std::string temperature;       // --temperature: fixed T with unit (exclusive with adiabatic)
  bool adiabatic = false;        // --adiabatic: solve at the adiabatic flame temperature
  std::string feed_temperature;  // --feed-temperature (adiabatic only; default 298.15 K)
  std::string heat_loss;         // --heat-loss: fraction of the feed's HHV lost (adiabatic only)
  std::string pressure;          // --pressure (default 1 atm)
  std::string species;           // --species: comma-separated product list (default: all)
  std::string residence_time;    // --residence-time: thermal NO after this time (0 s ... 1 h)
};

struct EquilibriumAnswer {
  std::vector<core::SpeciesAmount> feed;
  bool adiabatic = false;
  double feed_temperature_K = 0.0;
  core::EquilibriumResult result;
  std::optional<core::ThermalNoResult> thermal_no;  // with a residence time
};

// Solves the query. Throws units::InputError naming the option, core::ConvergenceError when the
// solver does not converge.
EquilibriumAnswer solve_equilibrium_query(const EquilibriumQuery& query, const core::SpeciesDatabase& database);

}  // namespace stackbound::cases
