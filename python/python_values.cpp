#include "python_values.hpp"

#include <fmt/format.h>

#include "stackbound/cases/yaml_document.hpp"
#include "stackbound/units/input_error.hpp"
#include "stackbound/units/plain_text.hpp"

namespace stackbound::python {

py::object to_python(const nlohmann::json& value) {
  switch (value.type()) {
    case nlohmann::json::value_t::null:
      return py::none();
    case nlohmann::json::value_t::boolean:
      return py::bool_(value.get<bool>());
    case nlohmann::json::value_t::number_integer:
      return py::int_(value.get<std::int64_t>());
    case nlohmann::json::value_t::number_unsigned:
      return py::int_(value.get<std::uint64_t>());
    case nlohmann::json::value_t::number_float:
      return py::float_(value.get<double>());
    case nlohmann::json::value_t::string:
      return py::str(value.get_ref<const std::string&>());
    case nlohmann::json::value_t::array: {
      py::list list(value.size());
      for (std::size_t i = 0; i < value.size(); ++i) list[i] = to_python(value[i]);
      return list;
    }
    case nlohmann::json::value_t::object: {
      py::dict dict;
      for (const auto& [key, item] : value.items()) dict[py::str(key)] = to_python(item);
      return dict;
    }
    case nlohmann::json::value_t::binary:
    case nlohmann::json::value_t::discarded:
      break;
  }
  throw std::logic_error("to_python: a JSON value of a kind our documents never hold");
}

std::string utf8_text(py::handle text, std::string_view field) {
  Py_ssize_t size = 0;
  const char* data = PyUnicode_AsUTF8AndSize(text.ptr(), &size);
  if (data == nullptr) {
    PyErr_Clear();
    throw units::InputError(
        fmt::format("{}: the text has no UTF-8 form (it holds a lone surrogate); give valid Unicode text", field));
  }
  return std::string(data, static_cast<std::size_t>(size));
}

std::string plain_text(py::handle text, std::string_view field) {
  std::string utf8 = utf8_text(text, field);
  if (const std::optional<units::TextFault> fault = units::find_text_fault(utf8)) {
    throw units::InputError(fmt::format("{} = \"{}\": {}; {}", field, units::printable(utf8), fault->what, fault->remedy));
  }
  return utf8;
}

namespace {

std::string where(const std::string& path) { return path.empty() ? "(top level)" : path; }

// A bool, an integer (int, numpy integer) or a real number (float, numpy floating) as text.
std::optional<std::string> number_text(py::handle value) {
  if (py::isinstance<py::bool_>(value)) return value.cast<bool>() ? "true" : "false";
  const py::module_ numbers = py::module_::import("numbers");
  if (py::isinstance(value, numbers.attr("Integral"))) {
    return py::str(py::int_(py::reinterpret_borrow<py::object>(value))).cast<std::string>();
  }
  if (py::isinstance(value, numbers.attr("Real"))) {
    return py::repr(py::float_(py::reinterpret_borrow<py::object>(value))).cast<std::string>();
  }
  return std::nullopt;
}

}  // namespace

std::string type_name(py::handle value) { return py::type::handle_of(value).attr("__name__").cast<std::string>(); }

YAML::Node to_yaml(py::handle value, const std::string& path, std::size_t depth) {
  if (depth > cases::kMaxYamlNesting) {
    throw units::InputError(
        fmt::format("{}: {}: nested deeper than {} levels", kDictOrigin, where(path), cases::kMaxYamlNesting));
  }
  if (value.is_none()) return YAML::Node(YAML::NodeType::Null);
  if (py::isinstance<py::str>(value))
    return YAML::Node(plain_text(value, fmt::format("{}: {}", kDictOrigin, where(path))));
  if (py::isinstance<py::dict>(value)) {
    YAML::Node map(YAML::NodeType::Map);
    for (const auto& [key, item] : py::reinterpret_borrow<py::dict>(value)) {
      if (!py::isinstance<py::str>(key)) {
        throw units::InputError(fmt::format("{}: {}: the key {} is a {}; keys are text", kDictOrigin, where(path),
                                            py::repr(key).cast<std::string>(), type_name(key)));
      }
      const std::string name = plain_text(key, fmt::format("{}: {}", kDictOrigin, where(path)));
      map[name] = to_yaml(item, path.empty() ? name : path + "." + name, depth + 1);
    }
    return map;
  }
  if (py::isinstance<py::list>(value) || py::isinstance<py::tuple>(value)) {
    YAML::Node list(YAML::NodeType::Sequence);
    std::size_t index = 0;
    for (const py::handle item : value) {
      list.push_back(to_yaml(item, fmt::format("{}[{}]", path, index++), depth + 1));
    }
    return list;
  }
  if (const auto text = number_text(value)) return YAML::Node(*text);
  throw units::InputError(fmt::format("{}: {} = {}: a {}; expected text, a number, true or false, a list or a dict",
                                      kDictOrigin, where(path), py::repr(value).cast<std::string>(), type_name(value)));
}

std::optional<std::string> option_text(py::handle value, std::string_view option) {
  if (value.is_none()) return std::nullopt;
  if (py::isinstance<py::str>(value)) return plain_text(value, option);
  if (!py::isinstance<py::bool_>(value)) {
    if (const auto text = number_text(value)) return text;
  }
  throw units::InputError(fmt::format("{} = {}: a {}; expected text such as \"15 %\" or a number", option,
                                      py::repr(value).cast<std::string>(), type_name(value)));
}

std::string option_text_or_empty(py::handle value, std::string_view option) {
  return option_text(value, option).value_or("");
}

std::optional<std::string> path_text(py::handle value) {
  if (py::isinstance<py::str>(value)) return utf8_text(value, "path");
  if (!py::hasattr(value, "__fspath__")) return std::nullopt;
  const py::object path = py::module_::import("os").attr("fspath")(value);
  if (!py::isinstance<py::str>(path)) return std::nullopt;  // a bytes path
  return utf8_text(path, "path");
}

}  // namespace stackbound::python
