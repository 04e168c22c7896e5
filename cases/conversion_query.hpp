#pragma once
// The `convert` request of the front ends (the command line's arguments, the Python module's):
// one concentration on another basis, with every factor applied named (docs/bases.md). The texts
// are parsed and checked here, once; errors name the command-line argument or option ("--to = ...").

#include <string>
#include <vector>

#include "stackbound/emissions/cautions.hpp"
#include "stackbound/emissions/concentration.hpp"
#include "stackbound/emissions/pollutant.hpp"
#include "stackbound/emissions/reference_correction.hpp"

namespace stackbound::cases {

// Texts as given; empty means not given.
struct ConversionQuery {
  std::string value;       // VALUE: "35 ppm", "35", "120 mg/Nm3"
  std::string pollutant;   // POLLUTANT: "CO", "NOx", or another name with molar_mass
  std::string from;        // --from: basis text of the value (may be empty when the value carries it)
  std::string to;          // --to: basis text of the result; missing items are taken from --from
  std::string moisture;    // --moisture: stack moisture, H2O fraction of the wet gas: "12%"
  std::string o2;          // --o2: measured O2, dry: "7.2%"
  std::string co2;         // --co2: measured CO2, dry: "9.5%"
  std::string normal;      // --normal: default normal conditions of Nm3 / m3 units: 0C, 15C, 20C, 60F, IED
  std::string o2_basis;    // --o2-basis: 20.9 (default) or 21
  std::string molar_mass;  // --molar-mass: for a pollutant outside the built-in list: "200.59 g/mol"
};

struct ConversionAnswer {
  emissions::Pollutant pollutant;
  emissions::Concentration input;
  emissions::Conversion conversion;  // its result and the factors applied
  emissions::ConcentrationContext context;
  std::vector<emissions::Caution> cautions;
  std::vector<const emissions::ReferenceO2Preset*> presets;  // named by either basis
};

// Converts. Throws units::InputError naming the argument or option, also for context the conversion
// needs and the query lacks (with the option that gives it).
ConversionAnswer convert_query(const ConversionQuery& query);

}  // namespace stackbound::cases
