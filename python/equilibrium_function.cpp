// stackbound.equilibrium(feed, temperature=None, pressure="1 atm", adiabatic=False,
// residence_time=None): the `equilibrium --format json` document.

#include <fmt/format.h>

#include "case_argument.hpp"
#include "functions.hpp"
#include "python_values.hpp"
#include "stackbound/cases/equilibrium_query.hpp"
#include "stackbound/render/equilibrium_json.hpp"
#include "stackbound/render/finite_figures.hpp"
#include "stackbound/units/input_error.hpp"

namespace stackbound::python {

namespace {

// --species as a comma-separated text or a list of names.
std::string species_text(py::handle species) {
  if (py::isinstance<py::list>(species) || py::isinstance<py::tuple>(species)) {
    std::string text;
    for (const py::handle name : species) text += (text.empty() ? "" : ",") + option_text_or_empty(name, "--species");
    return text;
  }
  return option_text_or_empty(species, "--species");
}

py::object equilibrium(py::handle feed, py::handle temperature, py::handle pressure, py::handle adiabatic,
                       py::handle residence_time, py::handle feed_temperature, py::handle heat_loss, py::handle species,
                       py::handle species_file) {
  if (!py::isinstance<py::bool_>(adiabatic)) {
    throw units::InputError(
        fmt::format("--adiabatic = {}: expected True or False", py::repr(adiabatic).cast<std::string>()));
  }
  cases::EquilibriumQuery query;
  query.feed = option_text_or_empty(feed, "--feed");
  query.temperature = option_text_or_empty(temperature, "--temperature");
  query.pressure = option_text_or_empty(pressure, "--pressure");
  query.adiabatic = adiabatic.cast<bool>();
  query.residence_time = option_text_or_empty(residence_time, "--residence-time");
  query.feed_temperature = option_text_or_empty(feed_temperature, "--feed-temperature");
  query.heat_loss = option_text_or_empty(heat_loss, "--heat-loss");
  query.species = species_text(species);
  const core::SpeciesDatabase database = species_argument(species_file);
  nlohmann::json document;
  {
    const py::gil_scoped_release release;
    document = render::equilibrium_json(cases::solve_equilibrium_query(query, database));
    render::require_finite_json(document);
  }
  return to_python(document);
}

}  // namespace

void add_equilibrium_function(py::module_& module) {
  module.def("equilibrium", &equilibrium, py::arg("feed"), py::arg("temperature") = py::none(),
             py::arg("pressure") = "1 atm", py::arg("adiabatic") = false, py::arg("residence_time") = py::none(),
             py::kw_only(), py::arg("feed_temperature") = py::none(), py::arg("heat_loss") = py::none(),
             py::arg("species") = py::none(), py::arg("species_file") = py::none(),
             R"(Chemical equilibrium of a feed at a fixed T and P, or at its adiabatic flame temperature.

feed: reactants in mol, "CH4 + 2.4 O2 + 9.03 N2" (docs/composition-notation.md).
temperature: fixed temperature with unit ("1800 K", "1500 degC"); or adiabatic=True.
pressure: absolute pressure with unit (default "1 atm").
residence_time: also estimate thermal NO after this time at the solved state ("20 ms").
feed_temperature, heat_loss: with adiabatic=True, as --feed-temperature and --heat-loss.
species: restrict the products ("CO2,CO,O2" or a list of names).
species_file: extra species data (YAML), as --species-file.

Returns the document of `stackbound equilibrium ... --format json` (mole fractions of the gas phase,
moles, temperature_K, pressure_Pa, ...). Raises stackbound.InputError with the command line's message
(naming its options: --temperature, --pressure, ...), stackbound.ConvergenceError if the solver does
not converge. The values are an equilibrium bound, not a measurement.

Example:
    stackbound.equilibrium("CH4 + 2.4 O2 + 9.03 N2", "1800 K")["mole_fractions"]["NO"]
)");
}

}  // namespace stackbound::python
