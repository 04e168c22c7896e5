#include "case_argument.hpp"

#include <fmt/format.h>

#include "python_values.hpp"
#include "stackbound/cases/species_file.hpp"
#include "stackbound/units/input_error.hpp"

namespace stackbound::python {

cases::LoadedCase load_case_argument(py::handle value) {
  if (const auto path = path_text(value)) return cases::load_case_file(*path);
  if (py::isinstance<py::dict>(value)) return cases::read_case_document(to_yaml(value), std::string(kDictOrigin));
  throw units::InputError(fmt::format(
      "case = {}: a {}; expected the path of a case file or a dict with the case-file "
      "schema (docs/case-file.md)",
      py::repr(value).cast<std::string>(), py::type::handle_of(value).attr("__name__").cast<std::string>()));
}

core::SpeciesDatabase species_argument(py::handle species_file) {
  if (species_file.is_none()) return cases::species_database("");
  const auto path = path_text(species_file);
  if (!path) {
    throw units::InputError(fmt::format("--species-file = {}: expected the path of a species file",
                                        py::repr(species_file).cast<std::string>()));
  }
  return cases::species_database(*path);
}

}  // namespace stackbound::python
