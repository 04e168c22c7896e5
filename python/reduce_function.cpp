// stackbound.reduce(case, readings): the `reduce --format json` document of analyser readings, from a
// CSV file or from a dict of equal-length columns.

#include <algorithm>
#include <cmath>
#include <sstream>
#include <vector>

#include <fmt/format.h>
#include <pybind11/numpy.h>

#include "case_argument.hpp"
#include "functions.hpp"
#include "python_values.hpp"
#include "stackbound/cases/reduce_query.hpp"
#include "stackbound/render/finite_figures.hpp"
#include "stackbound/render/reduction_output.hpp"
#include "stackbound/units/input_error.hpp"

namespace stackbound::python {

namespace {

// The origin named in messages about a dict of readings: "<readings dict>:5: ..." (line 1 is the
// header, so line L is the row of index L - 2).
constexpr std::string_view kReadingsDictOrigin = "<readings dict>";

// One column of a readings dict: numbers (from a numeric numpy buffer) or the texts of its cells.
struct Column {
  std::string name;
  std::vector<double> numbers;
  std::vector<std::string> texts;
  bool numeric = false;
  [[nodiscard]] std::size_t size() const { return numeric ? numbers.size() : texts.size(); }
};

// A number as the shortest text the reader parses back to the same double; a missing value (NaN) as
// an empty cell, as pandas writes it to a CSV.
std::string number_cell(double value) { return std::isnan(value) ? std::string() : fmt::format("{}", value); }

// A cell: text as is, a number, None (empty), a date-time (datetime, pandas Timestamp: isoformat()).
std::string cell_text(py::handle cell, const std::string& where, const py::module_& numbers) {
  if (cell.is_none()) return "";
  if (py::isinstance<py::str>(cell)) return utf8_text(cell, where);
  if (!py::isinstance<py::bool_>(cell)) {
    if (py::isinstance(cell, numbers.attr("Integral"))) {
      return py::str(py::int_(py::reinterpret_borrow<py::object>(cell))).cast<std::string>();
    }
    if (py::isinstance(cell, numbers.attr("Real"))) return number_cell(py::float_(py::reinterpret_borrow<py::object>(cell)).cast<double>());
    if (py::hasattr(cell, "isoformat")) return utf8_text(cell.attr("isoformat")(), where);
    if (type_name(cell) == "datetime64") return utf8_text(py::str(cell), where);
  }
  throw units::InputError(fmt::format("{} = {}: a {}; expected a number, text, a date-time or None", where,
                                      py::repr(cell).cast<std::string>(), type_name(cell)));
}

// A numeric numpy array or pandas Series: read through its buffer, no Python object per value.
bool read_numeric(py::handle value, Column& column) {
  if (!py::hasattr(value, "dtype") || !py::hasattr(value.attr("dtype"), "kind")) return false;
  const std::string kind = py::str(value.attr("dtype").attr("kind")).cast<std::string>();
  if (kind != "i" && kind != "u" && kind != "f") return false;
  const auto array = py::array_t<double, py::array::forcecast>::ensure(value);
  if (!array) {
    PyErr_Clear();
    return false;
  }
  if (array.ndim() != 1) {
    throw units::InputError(fmt::format("readings[\"{}\"]: an array of {} dimensions; expected one value a row",
                                        column.name, array.ndim()));
  }
  const auto values = array.unchecked<1>();
  column.numbers.resize(static_cast<std::size_t>(values.shape(0)));
  for (py::ssize_t i = 0; i < values.shape(0); ++i) column.numbers[static_cast<std::size_t>(i)] = values(i);
  column.numeric = true;
  return true;
}

Column read_column(py::handle value, const std::string& name, const py::module_& numbers) {
  Column column;
  column.name = name;
  if (read_numeric(value, column)) return column;
  if (py::isinstance<py::str>(value) || py::isinstance<py::bytes>(value) || py::isinstance<py::dict>(value) ||
      !py::hasattr(value, "__iter__")) {
    throw units::InputError(fmt::format("readings[\"{}\"] = {}: a {}; expected a sequence of values (a list, a "
                                        "numpy array)",
                                        name, py::repr(value).cast<std::string>().substr(0, 60), type_name(value)));
  }
  std::size_t row = 0;
  for (const py::handle cell : value) {
    column.texts.push_back(cell_text(cell, fmt::format("readings[\"{}\"][{}]", name, row++), numbers));
  }
  return column;
}

// The mapped columns, in the order: time, values by slot, status; each once.
std::vector<std::string> mapped_columns(const cases::ReadingsSpec& spec) {
  std::vector<std::string> names{spec.time.column};
  const auto add = [&](const std::string& name) {
    if (!name.empty() && std::find(names.begin(), names.end(), name) == names.end()) names.push_back(name);
  };
  for (const auto& source : spec.sources) {
    if (source) add(source->column);
  }
  if (spec.status) add(spec.status->column);
  return names;
}

// A cell the reader would split or take for a comment line cannot come through the CSV text.
void check_cell(const std::string& text, const Column& column, std::size_t row, char delimiter, bool first) {
  const bool breaks = text.find_first_of(std::string{delimiter, '"', '\n', '\r'}) != std::string::npos;
  const std::size_t start = text.find_first_not_of(" \t");
  if (breaks || (first && start != std::string::npos && text[start] == '#')) {
    throw units::InputError(fmt::format(
        "readings[\"{}\"][{}] = \"{}\": holds the delimiter \"{}\", a quote or a line break, or starts the row with "
        "'#'; the readings reader takes none of these in a value",
        column.name, row, text, delimiter));
  }
}

// The columns as the CSV text of a readings file (header row, then one line a row).
std::string csv_text(const std::vector<Column>& columns, char delimiter) {
  std::string text;
  for (std::size_t c = 0; c < columns.size(); ++c) text += (c == 0 ? "" : std::string{delimiter}) + columns[c].name;
  text += '\n';
  const std::size_t rows = columns.front().size();
  for (std::size_t row = 0; row < rows; ++row) {
    for (std::size_t c = 0; c < columns.size(); ++c) {
      if (c > 0) text += delimiter;
      const Column& column = columns[c];
      if (column.numeric) {
        text += number_cell(column.numbers[row]);
      } else {
        check_cell(column.texts[row], column, row, delimiter, c == 0);
        text += column.texts[row];
      }
    }
    text += '\n';
  }
  return text;
}

// A dict of columns keyed by the CSV column names the case's readings section maps.
std::vector<Column> dict_columns(const py::dict& readings, const cases::ReadingsSpec& spec) {
  const py::module_ numbers = py::module_::import("numbers");
  std::vector<Column> columns;
  for (const std::string& name : mapped_columns(spec)) {
    if (!readings.contains(py::str(name))) {
      std::string keys;
      for (const auto& item : readings) keys += (keys.empty() ? "" : ", ") + py::str(item.first).cast<std::string>();
      throw units::InputError(fmt::format("readings: no column \"{}\", which the case's readings section maps; the "
                                          "dict's columns are {}",
                                          name, keys.empty() ? "(none)" : keys));
    }
    columns.push_back(read_column(readings[py::str(name)], name, numbers));
  }
  for (const Column& column : columns) {
    if (column.size() != columns.front().size()) {
      throw units::InputError(fmt::format(
          "readings: column \"{}\" has {} values, column \"{}\" has {}; the columns must be of equal length",
          column.name, column.size(), columns.front().name, columns.front().size()));
    }
  }
  return columns;
}

// A whole number (int, numpy integer); None as not given. The library checks the range.
std::optional<int> optional_int(py::handle value, std::string_view option) {
  if (value.is_none()) return std::nullopt;
  const bool integral = !py::isinstance<py::bool_>(value) && py::hasattr(value, "__index__");
  const py::int_ number = integral ? py::int_(py::reinterpret_borrow<py::object>(value)) : py::int_(0);
  if (!integral || number < py::int_(-1000000) || number > py::int_(1000000)) {
    throw units::InputError(
        fmt::format("{} = {}: expected a whole number", option, py::repr(value).cast<std::string>()));
  }
  return number.cast<int>();
}

cases::ReduceQuery reduce_query(py::handle average, py::handle rules, py::handle strict, py::handle list_bad_rows,
                                py::handle min_quadrants, py::handle min_hour_coverage, py::handle max_invalid_hours,
                                py::handle min_valid_hours) {
  if (!py::isinstance<py::bool_>(strict)) {
    throw units::InputError(fmt::format("--strict = {}: expected True or False", py::repr(strict).cast<std::string>()));
  }
  const std::optional<int> listed = optional_int(list_bad_rows, "--list-bad-rows");
  if (!listed || *listed < 0) {
    throw units::InputError(
        fmt::format("--list-bad-rows = {}: expected a whole number >= 0", py::repr(list_bad_rows).cast<std::string>()));
  }
  cases::ReduceQuery query;
  query.average = option_text_or_empty(average, "--average");
  query.rules = option_text_or_empty(rules, "--rules");
  query.strict = strict.cast<bool>();
  query.listed_problems = static_cast<std::size_t>(*listed);
  query.min_quadrants = optional_int(min_quadrants, "--min-quadrants");
  query.min_hour_coverage = option_text_or_empty(min_hour_coverage, "--min-hour-coverage");
  query.max_invalid_hours = optional_int(max_invalid_hours, "--max-invalid-hours");
  query.min_valid_hours = option_text_or_empty(min_valid_hours, "--min-valid-hours");
  return query;
}

py::object reduce(py::handle case_value, py::handle readings, py::handle average, py::handle rules, py::handle strict,
                  py::handle list_bad_rows, py::handle min_quadrants, py::handle min_hour_coverage,
                  py::handle max_invalid_hours, py::handle min_valid_hours, py::handle species_file) {
  const cases::ReduceOptions options =
      cases::reduce_options(reduce_query(average, rules, strict, list_bad_rows, min_quadrants, min_hour_coverage,
                                         max_invalid_hours, min_valid_hours));
  const cases::LoadedCase loaded = load_case_argument(case_value);
  const core::SpeciesDatabase database = species_argument(species_file);
  std::optional<cases::ReadingsFile> file;
  std::vector<Column> columns;
  std::string origin;
  if (const auto path = path_text(readings)) {
    file = cases::open_readings_file(*path);
    origin = *path;
  } else if (py::isinstance<py::dict>(readings)) {
    if (loaded.definition.readings) columns = dict_columns(py::reinterpret_borrow<py::dict>(readings), *loaded.definition.readings);
    origin = kReadingsDictOrigin;
  } else {
    throw units::InputError(fmt::format(
        "readings = {}: a {}; expected the path of a readings CSV or a dict of equal-length columns",
        py::repr(readings).cast<std::string>().substr(0, 60), type_name(readings)));
  }
  nlohmann::json document;
  {
    const py::gil_scoped_release release;
    std::istringstream text;
    if (!columns.empty()) text.str(csv_text(columns, loaded.definition.readings->delimiter));
    std::istream& input = file ? static_cast<std::istream&>(file->stream) : text;
    const cases::ReductionDocument reduction = cases::with_positions(
        loaded.sources, [&] { return cases::reduce_readings(loaded.definition, database, input, origin, options); });
    document = render::reduction_json(reduction);
    render::require_finite_json(document);
  }
  return to_python(document);
}

}  // namespace

void add_reduce_function(py::module_& module) {
  module.def("reduce", &reduce, py::arg("case"), py::arg("readings"), py::kw_only(), py::arg("average") = "hour",
             py::arg("rules") = "none", py::arg("strict") = false, py::arg("list_bad_rows") = 5,
             py::arg("min_quadrants") = py::none(), py::arg("min_hour_coverage") = py::none(),
             py::arg("max_invalid_hours") = py::none(), py::arg("min_valid_hours") = py::none(),
             py::arg("species_file") = py::none(),
             R"(Reduces analyser readings to corrected, validated averages on the case's bases.

case: the path of a case file with a readings section, or a dict with the case-file schema (as
      stackbound.run).
readings: the path of the readings CSV, or a dict of equal-length columns keyed by the column names
      the case's readings section maps (a DataFrame's to_dict("list"), lists, numpy arrays); other
      keys are ignored. The columns are written as the CSV text of a readings file (numbers
      in their shortest exact form, NaN and None as an empty cell, date-times by isoformat()) and
      read by the same reader as a file: messages name "<readings dict>:LINE", line 1 being the header, so line L
      is the row of index L - 2.
average: "hour", "day", "month", "Nh", "Nd", optionally followed by " rolling" (as --average).
rules: "us-part60", "eu-ied" or "none" (as --rules). strict: stop at the first malformed row.
list_bad_rows: malformed rows listed with their lines (all are counted).
min_quadrants, min_hour_coverage ("75 %"), max_invalid_hours, min_valid_hours ("75 %"): override
      the rule set's coverage thresholds, as the options of the same names.
species_file: extra species data (YAML), as --species-file.

Returns the document of `stackbound reduce CASE READINGS --format json` (docs/report-json.md,
"reduce") as dicts and lists. Raises stackbound.InputError with the command line's message. Averages,
validity and counts above a limit are screening figures, not a compliance determination: the permit,
the regulation and the competent authority govern.

Example:
    summary = stackbound.reduce("cases/examples/gas_turbine.yaml",
                                "cases/examples/gas_turbine_readings.csv", rules="us-part60")["summary"]
)");
}

}  // namespace stackbound::python
