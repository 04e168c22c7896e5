// The `stackbound` Python module: the command line's calculations as functions returning Python
// objects (docs/python.md). A front end beside cli/, over the render layer; no subprocess.

#include <pybind11/pybind11.h>

#include "functions.hpp"
#include "stackbound/core/equilibrium.hpp"
#include "stackbound/render/finite_figures.hpp"
#include "stackbound/units/input_error.hpp"

namespace py = pybind11;

PYBIND11_MODULE(stackbound, module) {
  namespace sb = stackbound;
  module.doc() =
      "stackbound - equilibrium-based emissions and stack-gas estimator.\n"
      "Functions: run, convert, equilibrium, fuel, sweep, reduce (docs/python.md). Results are equilibrium bounds at stated\n"
      "firing conditions, not measurements; permits, regulators, local codes and licensed practice govern.";
  module.attr("__version__") = STACKBOUND_VERSION;
  // A figure that is not finite at the renderer boundary is a defect of the tool, never of the input.
  py::register_exception_translator([](std::exception_ptr error) {
    try {
      if (error) std::rethrow_exception(error);
    } catch (const sb::render::NonFiniteFigure& defect) {
      PyErr_SetString(PyExc_RuntimeError,
                      (std::string("internal error: ") + defect.what() +
                       "\nThis is a defect of stackbound, not a problem with your input. Please report it with the "
                       "inputs.")
                          .c_str());
    }
  });
  py::register_exception<sb::units::InputError>(module, "InputError", PyExc_ValueError);
  py::register_exception<sb::core::ConvergenceError>(module, "ConvergenceError", PyExc_RuntimeError);
  module.attr("InputError").attr("__doc__") =
      "Bad input: the message is the command line's, naming the field or option, the value and what is accepted.";
  module.attr("ConvergenceError").attr("__doc__") =
      "The equilibrium did not converge; the message carries the solver's diagnostics.";
  sb::python::add_run_function(module);
  sb::python::add_convert_function(module);
  sb::python::add_equilibrium_function(module);
  sb::python::add_fuel_function(module);
  sb::python::add_sweep_function(module);
  sb::python::add_reduce_function(module);
}
