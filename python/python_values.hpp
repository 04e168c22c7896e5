#pragma once
// Values crossing between Python and the library: JSON documents out as dicts, lists, str, int,
// float, bool and None; a case or fuel dict in as a YAML document (the case-file schema, read by
// the same loader as a file); option values in as their text, exactly as the command line takes them.

#include <cstddef>
#include <optional>
#include <string>
#include <string_view>

#include <nlohmann/json.hpp>
#include <pybind11/pybind11.h>
#include <yaml-cpp/yaml.h>

namespace stackbound::python {

namespace py = pybind11;

// The origin named in errors about a dict argument: "<dict>: operating_point.excess_air = ...".
inline constexpr std::string_view kDictOrigin = "<dict>";

// A JSON document as Python objects (integers stay int, other numbers are float).
py::object to_python(const nlohmann::json& value);

// A dict, list, str, number, bool or None as a YAML node: numbers as their shortest text (repr), True
// and False as true and false, None as null. Other objects, keys that are not text and nesting deeper
// than the YAML loader allows are a units::InputError naming the field path.
YAML::Node to_yaml(py::handle value, const std::string& path = "", std::size_t depth = 0);

// The UTF-8 text of a Python str; one that has no UTF-8 form (a lone surrogate) is a units::InputError
// naming `field`.
std::string utf8_text(py::handle text, std::string_view field);

// The same, and plain text as a case file or a command-line argument must be (units/plain_text.hpp):
// a control character (other than tab, line feed, carriage return) is a units::InputError naming `field`.
// Used for case dicts and option values; reduce cells keep utf8_text, as a bad readings row is counted,
// not refused.
std::string plain_text(py::handle text, std::string_view field);

// The text of an option value: a str as is, a number as its shortest text; None as nothing. Anything
// else is a units::InputError naming the option.
std::optional<std::string> option_text(py::handle value, std::string_view option);

// The same, empty when None.
std::string option_text_or_empty(py::handle value, std::string_view option);

// The name of a value's type, for messages ("float", "dict").
std::string type_name(py::handle value);

// A path argument: str or os.PathLike; nullopt for anything else (a dict, say).
std::optional<std::string> path_text(py::handle value);

}  // namespace stackbound::python
