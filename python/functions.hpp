#pragma once
// The functions of the `stackbound` Python module, one file each (as cli/ has one file a command).
// Each registers itself on the module; its body calls the same library functions as the command of
// the same name, and throws units::InputError for bad input (stackbound.InputError in Python).

#include <pybind11/pybind11.h>

namespace stackbound::python {

namespace py = pybind11;

void add_run_function(py::module_& module);
void add_convert_function(py::module_& module);
void add_equilibrium_function(py::module_& module);
void add_fuel_function(py::module_& module);
void add_sweep_function(py::module_& module);
void add_reduce_function(py::module_& module);

}  // namespace stackbound::python
