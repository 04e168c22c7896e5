#include "stackbound/emissions/gas_turbine_iso.hpp"

#include <cmath>

#include <fmt/format.h>

#include "stackbound/units/input_error.hpp"

namespace stackbound::emissions {

double gas_turbine_iso_factor(const GasTurbineAmbient& ambient) {
  const double t_K = ambient.ambient_temperature.value();
  if (!(t_K > 0.0) || !std::isfinite(t_K)) {
    throw units::InputError(fmt::format("ambient temperature = {} K: must be finite and above 0 K", t_K));
  }
  const double h = ambient.humidity_ratio_kg_per_kg;
  if (!(h >= 0.0 && h <= 0.2)) {
    throw units::InputError(fmt::format("ambient humidity ratio = {} kg/kg: must be between 0 and 0.2 kg/kg", h));
  }
  double pressure_term = 1.0;
  if (ambient.observed_inlet_pressure && ambient.reference_inlet_pressure) {
    const double observed = ambient.observed_inlet_pressure->value();
    const double reference = ambient.reference_inlet_pressure->value();
    if (!(observed > 0.0) || !(reference > 0.0) || !std::isfinite(observed) || !std::isfinite(reference)) {
      throw units::InputError(fmt::format("combustor inlet pressure = {} Pa (reference {} Pa): must be above 0 Pa",
                                          observed, reference));
    }
    pressure_term = std::sqrt(reference / observed);
  }
  return pressure_term * std::exp(19.0 * (h - kIsoHumidityRatio)) * std::pow(kIsoAmbientTemperature_K / t_K, 1.53);
}

}  // namespace stackbound::emissions
