// stackbound.sweep(case, vary): a case over a grid of operating changes, as columns for pandas.

#include <cstdint>
#include <vector>

#include <fmt/format.h>
#include <pybind11/numpy.h>

#include "case_argument.hpp"
#include "functions.hpp"
#include "python_values.hpp"
#include "stackbound/cases/sweep.hpp"
#include "stackbound/render/sweep_columns.hpp"
#include "stackbound/units/input_error.hpp"

namespace stackbound::python {

namespace {

// `vary` as the command line's --vary texts: a list of "PARAM=FROM:TO:STEPS", one such text, or a
// dict {PARAM: "FROM:TO:STEPS"} (in its order: the last changes fastest).
std::vector<std::string> vary_texts(py::handle vary) {
  std::vector<std::string> texts;
  if (py::isinstance<py::str>(vary)) {
    texts.push_back(plain_text(vary, "--vary"));
  } else if (py::isinstance<py::dict>(vary)) {
    for (const auto& [parameter, range] : py::reinterpret_borrow<py::dict>(vary)) {
      texts.push_back(option_text_or_empty(parameter, "--vary") + "=" + option_text_or_empty(range, "--vary"));
    }
  } else if (py::isinstance<py::list>(vary) || py::isinstance<py::tuple>(vary)) {
    for (const py::handle text : vary) {
      if (!py::isinstance<py::str>(text)) {
        throw units::InputError(
            fmt::format("--vary = {}: expected a text PARAM=FROM:TO:STEPS, e.g. excess_air=5%:45%:9",
                        py::repr(text).cast<std::string>()));
      }
      texts.push_back(plain_text(text, "--vary"));
    }
  } else {
    throw units::InputError(
        fmt::format("--vary = {}: expected a list of PARAM=FROM:TO:STEPS texts or a dict "
                    "{{PARAM: \"FROM:TO:STEPS\"}}",
                    py::repr(vary).cast<std::string>()));
  }
  if (texts.empty()) throw units::InputError("--vary: missing; give at least one PARAM=FROM:TO:STEPS");
  return texts;
}

std::size_t count_argument(py::handle value, std::string_view option, std::size_t low) {
  if (!py::isinstance<py::int_>(value) || py::isinstance<py::bool_>(value) || value.cast<py::int_>() < py::int_(low)) {
    throw units::InputError(
        fmt::format("{} = {}: expected a whole number >= {}", option, py::repr(value).cast<std::string>(), low));
  }
  return value.cast<std::size_t>();
}

// A column moved into a numpy array that owns it: no copy, no Python object per element.
template <typename T>
py::array_t<T> numpy_column(std::vector<T>&& values) {
  auto* owner = new std::vector<T>(std::move(values));
  const py::capsule free_owner(owner, [](void* data) { delete static_cast<std::vector<T>*>(data); });
  return py::array_t<T>(static_cast<py::ssize_t>(owner->size()), owner->data(), free_owner);
}

// A text column as a list; equal texts share one Python string ("ok", "").
py::list text_column(const std::vector<std::string>& texts) {
  py::list list(texts.size());
  py::str previous;
  std::string previous_text;
  for (std::size_t i = 0; i < texts.size(); ++i) {
    if (i == 0 || texts[i] != previous_text) {
      previous = py::str(texts[i]);
      previous_text = texts[i];
    }
    list[i] = previous;
  }
  return list;
}

py::dict sweep(py::handle case_value, py::handle vary_value, py::handle threads, py::handle max_points,
               py::handle species_file) {
  std::vector<cases::VarySpec> vary;
  for (const std::string& text : vary_texts(vary_value)) vary.push_back(cases::parse_vary(text));
  const std::size_t total = cases::checked_sweep_size(vary, count_argument(max_points, "--max-points", 1));
  cases::SweepOptions options;
  options.threads = static_cast<unsigned>(count_argument(threads, "--threads", 0));
  const cases::LoadedCase loaded = load_case_argument(case_value);
  cases::check_sweep(loaded.definition, vary);
  const core::SpeciesDatabase database = species_argument(species_file);
  options.sources = &loaded.sources;
  // After each batch of points: Ctrl-C (KeyboardInterrupt) stops the sweep, with no partial result.
  options.progress = [](std::size_t, std::size_t) {
    const py::gil_scoped_acquire acquire;
    if (PyErr_CheckSignals() != 0) throw py::error_already_set();
  };
  render::SweepColumns columns;
  {
    const py::gil_scoped_release release;
    render::SweepColumnsCollector collector(vary, total);
    cases::run_sweep(
        loaded.definition, vary, database, [&](const cases::SweepPoint& p) { collector.add(p); }, options);
    columns = std::move(collector).finish();
  }
  py::dict result;
  result["point"] = numpy_column(std::move(columns.point));
  for (render::NumberColumn& column : columns.numbers)
    result[py::str(column.key)] = numpy_column(std::move(column.values));
  result["status"] = text_column(columns.status);
  result["error"] = text_column(columns.error);
  return result;
}

}  // namespace

void add_sweep_function(py::module_& module) {
  module.def("sweep", &sweep, py::arg("case"), py::arg("vary"), py::kw_only(), py::arg("threads") = 0,
             py::arg("max_points") = cases::kDefaultMaxSweepPoints, py::arg("species_file") = py::none(),
             R"(Runs a case over a grid of operating changes; returns columns that pandas.DataFrame takes as is.

case: the path of a case file or a dict with the case-file schema (as stackbound.run).
vary: a list of "PARAM=FROM:TO:STEPS" texts as --vary takes them ("excess_air=5%:45%:9"), or a dict
      {"excess_air": "5%:45%:9", ...}; the last changes fastest. Parameters: excess_air, flue_o2,
      firing_temperature, heat_loss, air_preheat, humidity, o2_enrichment, pressure, blend_fraction,
      reference_o2.
threads: worker threads (0: all cores). max_points: refuse larger grids (default 10000000).
species_file: extra species data (YAML), as --species-file.

Returns a dict of equal-length columns in grid order: "point" (int64, from 1), one numpy float64
array per varied parameter ("vary_excess_air_percent"; units %, K or kPa as in the CSV), one per
result under the keys of docs/report-json.md (NaN where a point failed or has no post-flame
figure), and the lists "status" ("ok" or "failed") and "error" (why a point failed). The numbers are
those of `stackbound sweep CASE --vary ...` (its CSV rounds them to 8 significant digits). Raises
stackbound.InputError with the command line's message before any point runs; Ctrl-C stops it
(KeyboardInterrupt) with no result.

Example:
    import pandas
    frame = pandas.DataFrame(stackbound.sweep("cases/examples/gas_boiler.yaml", ["excess_air=5%:45%:9"]))
)");
}

}  // namespace stackbound::python
