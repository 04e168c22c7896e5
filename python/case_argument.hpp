#pragma once
// The `case` and `species_file` arguments that several functions take.

#include <pybind11/pybind11.h>

#include "stackbound/cases/case_file.hpp"
#include "stackbound/core/species_database.hpp"

namespace stackbound::python {

namespace py = pybind11;

// A case-file path (str or os.PathLike), loaded as `stackbound run CASE` loads it (errors at
// file:line:column), or a dict with the case-file schema (errors at "<dict>: <field path>").
cases::LoadedCase load_case_argument(py::handle value);

// The built-in species data, with the records of `species_file` (a path, or None) added, as
// `--species-file` adds them.
core::SpeciesDatabase species_argument(py::handle species_file);

}  // namespace stackbound::python
