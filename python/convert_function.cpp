// stackbound.convert(value, pollutant, from_basis, to_basis): the `convert --format json` document.

#include "functions.hpp"
#include "python_values.hpp"
#include "stackbound/cases/conversion_query.hpp"
#include "stackbound/render/conversion_json.hpp"
#include "stackbound/render/finite_figures.hpp"

namespace stackbound::python {

namespace {

py::object convert(py::handle value, py::handle pollutant, py::handle from_basis, py::handle to_basis,
                   py::handle moisture, py::handle o2, py::handle co2, py::handle normal, py::handle o2_basis,
                   py::handle molar_mass) {
  cases::ConversionQuery query;
  query.value = option_text_or_empty(value, "VALUE");
  query.pollutant = option_text_or_empty(pollutant, "POLLUTANT");
  query.from = option_text_or_empty(from_basis, "--from");
  query.to = option_text_or_empty(to_basis, "--to");
  query.moisture = option_text_or_empty(moisture, "--moisture");
  query.o2 = option_text_or_empty(o2, "--o2");
  query.co2 = option_text_or_empty(co2, "--co2");
  query.normal = option_text_or_empty(normal, "--normal");
  query.o2_basis = option_text_or_empty(o2_basis, "--o2-basis");
  query.molar_mass = option_text_or_empty(molar_mass, "--molar-mass");
  const nlohmann::json document = render::conversion_json(cases::convert_query(query));
  render::require_finite_json(document);
  return to_python(document);
}

}  // namespace

void add_convert_function(py::module_& module) {
  module.def("convert", &convert, py::arg("value"), py::arg("pollutant"), py::arg("from_basis"), py::arg("to_basis"),
             py::kw_only(), py::arg("moisture") = py::none(), py::arg("o2") = py::none(), py::arg("co2") = py::none(),
             py::arg("normal") = py::none(), py::arg("o2_basis") = py::none(), py::arg("molar_mass") = py::none(),
             R"(Converts one concentration to another basis, naming every factor applied.

value: the number with its unit ("35 ppm"), or a number whose unit is in from_basis.
pollutant: CO, NO, NO2, NOx (as NO2), SO2, ... or any name with molar_mass.
from_basis, to_basis: basis texts ("dry, O2=7.2%", "mg/Nm3, dry, O2=3%"; docs/bases.md); items
      missing from to_basis are taken from from_basis.
moisture, o2, co2, normal, o2_basis, molar_mass: as --moisture, --o2, --co2, --normal, --o2-basis,
      --molar-mass of `stackbound convert`.

Returns the document of `stackbound convert ... --format json`: value, unit, basis, factors (each
with name, value, unit, detail), context, presets and cautions. Raises stackbound.InputError with the
command line's message.

Example:
    stackbound.convert("35 ppm", "CO", "dry, O2=7.2%", "mg/Nm3, dry, O2=3%")["value"]
)");
}

}  // namespace stackbound::python
