// stackbound.fuel(spec, ...): the `fuel FILE.yaml --format json` document of a fuel file or dict.

#include <fmt/format.h>

#include "case_argument.hpp"
#include "functions.hpp"
#include "python_values.hpp"
#include "stackbound/cases/fuel_file.hpp"
#include "stackbound/cases/fuel_query.hpp"
#include "stackbound/render/finite_figures.hpp"
#include "stackbound/render/fuel_json.hpp"
#include "stackbound/units/input_error.hpp"

namespace stackbound::python {

namespace {

// A fuel-file path, a fuel-file dict ({"fuel": {...}}) or the fuel mapping alone ({"preset": ...}).
cases::FuelFile fuel_supply(py::handle spec, const core::SpeciesDatabase& database) {
  if (const auto path = path_text(spec)) return cases::read_fuel_file(*path, database);
  if (!py::isinstance<py::dict>(spec)) {
    throw units::InputError(fmt::format(
        "spec = {}: a {}; expected the path of a fuel file or a dict with the fuel "
        "keys of a case file (docs/case-file.md, section fuel)",
        py::repr(spec).cast<std::string>(), py::type::handle_of(spec).attr("__name__").cast<std::string>()));
  }
  const py::dict mapping = py::reinterpret_borrow<py::dict>(spec);
  const bool whole_document = mapping.size() == 1 && mapping.contains("fuel");
  py::dict document;
  if (whole_document) {
    document = mapping;
  } else {
    document["fuel"] = mapping;
  }
  return cases::read_fuel_document(to_yaml(document), std::string(kDictOrigin), database);
}

struct FuelArguments {
  py::handle spec;
  cases::FuelConditions conditions;
  py::handle species_file;
};

py::object fuel(const FuelArguments& arguments) {
  const core::SpeciesDatabase database = species_argument(arguments.species_file);
  const cases::FuelFile supply = fuel_supply(arguments.spec, database);
  const nlohmann::json document = render::fuel_json(cases::burn_fuel_query(supply, arguments.conditions, database));
  render::require_finite_json(document);
  return to_python(document);
}

}  // namespace

void add_fuel_function(py::module_& module) {
  module.def(
      "fuel",
      [](py::handle spec, py::handle excess_air, py::handle lambda_, py::handle phi, py::handle flue_o2,
         py::handle flue_o2_basis, py::handle air_temperature, py::handle relative_humidity,
         py::handle ambient_temperature, py::handle ambient_pressure, py::handle humidity_ratio,
         py::handle o2_enrichment, py::handle fuel_temperature, py::handle pressure, py::handle rate,
         py::handle heat_basis, py::handle species_file) {
        FuelArguments arguments{spec, {}, species_file};
        cases::FuelConditions& c = arguments.conditions;
        c.excess_air = option_text_or_empty(excess_air, "--excess-air");
        c.lambda = option_text_or_empty(lambda_, "--lambda");
        c.phi = option_text_or_empty(phi, "--phi");
        c.flue_o2 = option_text_or_empty(flue_o2, "--flue-o2");
        c.flue_o2_basis = option_text_or_empty(flue_o2_basis, "--flue-o2-basis");
        c.air_temperature = option_text_or_empty(air_temperature, "--air-temperature");
        c.relative_humidity = option_text_or_empty(relative_humidity, "--relative-humidity");
        c.ambient_temperature = option_text_or_empty(ambient_temperature, "--ambient-temperature");
        c.ambient_pressure = option_text_or_empty(ambient_pressure, "--ambient-pressure");
        c.humidity_ratio = option_text_or_empty(humidity_ratio, "--humidity-ratio");
        c.o2_enrichment = option_text_or_empty(o2_enrichment, "--o2-enrichment");
        c.fuel_temperature = option_text_or_empty(fuel_temperature, "--fuel-temperature");
        c.pressure = option_text_or_empty(pressure, "--pressure");
        c.rate = option_text_or_empty(rate, "--rate");
        c.heat_basis = option_text_or_empty(heat_basis, "--heat-basis");
        return fuel(arguments);
      },
      py::arg("spec"), py::kw_only(), py::arg("excess_air") = py::none(), py::arg("lambda_") = py::none(),
      py::arg("phi") = py::none(), py::arg("flue_o2") = py::none(), py::arg("flue_o2_basis") = "dry",
      py::arg("air_temperature") = py::none(), py::arg("relative_humidity") = py::none(),
      py::arg("ambient_temperature") = py::none(), py::arg("ambient_pressure") = py::none(),
      py::arg("humidity_ratio") = py::none(), py::arg("o2_enrichment") = py::none(),
      py::arg("fuel_temperature") = py::none(), py::arg("pressure") = py::none(), py::arg("rate") = py::none(),
      py::arg("heat_basis") = "hhv", py::arg("species_file") = py::none(),
      R"(A fuel's heating values, stoichiometric air, complete-combustion flue gas, dew point and F-factors.

spec: the path of a fuel file (YAML with a `fuel:` mapping), or a dict: the fuel keys of a case file
      ({"preset": "natural_gas"}, {"gas": {"CH4": "95 %", ...}}, {"ultimate": {...}, "hhv": ...}),
      optionally wrapped as {"fuel": {...}} like a fuel file.
excess_air, lambda_, phi, flue_o2 (at most one; default stoichiometric), flue_o2_basis,
air_temperature, relative_humidity, ambient_temperature, ambient_pressure, humidity_ratio,
o2_enrichment, fuel_temperature, pressure, rate, heat_basis: as the options of `stackbound fuel`
      (--excess-air, --lambda, ...), with the same texts ("15 %", "25 MMBtu/h").
species_file: extra species data (YAML), as --species-file.

Returns the document of `stackbound fuel FILE.yaml ... --format json`. Raises stackbound.InputError
with the command line's message. The figures are complete-combustion estimates for screening.

Example:
    stackbound.fuel({"preset": "natural_gas"}, excess_air="15 %")["Fd_dscf_per_MMBtu"]
)");
}

}  // namespace stackbound::python
