// stackbound.run(case): the `run --format json` document of a case file or a case dict.

#include <chrono>

#include "case_argument.hpp"
#include "functions.hpp"
#include "python_values.hpp"
#include "stackbound/cases/pipeline.hpp"
#include "stackbound/cases/provenance.hpp"
#include "stackbound/render/finite_figures.hpp"
#include "stackbound/render/run_json.hpp"

namespace stackbound::python {

namespace {

py::object run(py::handle case_value, py::handle species_file) {
  cases::LoadedCase loaded = load_case_argument(case_value);
  const core::SpeciesDatabase database = species_argument(species_file);
  const cases::Provenance provenance = cases::make_provenance(loaded.definition, std::chrono::system_clock::now());
  nlohmann::json document;
  {
    const py::gil_scoped_release release;
    const cases::RunResult result =
        cases::with_positions(loaded.sources, [&] { return cases::run_case(std::move(loaded.definition), database); });
    document = render::run_json(result, provenance);
    render::require_finite_json(document);
  }
  return to_python(document);
}

}  // namespace

void add_run_function(py::module_& module) {
  module.def("run", &run, py::arg("case"), py::kw_only(), py::arg("species_file") = py::none(),
             R"(Runs a case: the equilibrium bound, flue gas and emissions on permit bases.

case: the path of a case file (YAML, docs/case-file.md), or a dict with the same schema
      ({"case": {"title": ...}, "fuel": {...}, "operating_point": {...}, "firing": {...}, ...}).
species_file: extra species data (YAML), as --species-file.

Returns the document of `stackbound run CASE --format json` (docs/report-json.md) as dicts and
lists. Raises stackbound.InputError (a ValueError) with the command line's message: file:line:column
for a file, "<dict>: <field path>" for a dict; stackbound.ConvergenceError if the equilibrium does
not converge. The CO and NO figures are an equilibrium bound at the stated firing conditions, not a
measurement; permits, regulators, local codes and licensed practice govern.

Example:
    report = stackbound.run("cases/examples/gas_boiler.yaml")
)");
}

}  // namespace stackbound::python
