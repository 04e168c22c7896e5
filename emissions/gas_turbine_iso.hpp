#pragma once
// Gas-turbine NOx corrected to ISO standard day ambient conditions, 40 CFR 60.335(b)(1) (Subpart GG;
// the formula from memory, high confidence; ISO day 288 K, 60 % RH, 101.3 kPa per 40 CFR 60.331 and
// ISO 3977-2, from memory):
//   NOx_ISO = NOx_o * (P_r / P_o)^0.5 * exp(19 (H_o - 0.00633)) * (288 K / T_a)^1.53
// NOx_o the observed NOx in ppmvd at 15 % O2; P_r the reference combustor-inlet absolute pressure at
// 101.3 kPa ambient, P_o the observed combustor-inlet absolute pressure (the combustor inlet, not the
// ambient); H_o the observed humidity of the ambient air, kg water per kg dry air (0.00633 is that of
// air at 15 degC, 60 % RH, 101.325 kPa); T_a the ambient temperature. The rule makes the correction
// optional for some turbine types: the permit says whether it applies.

#include <optional>

#include "stackbound/units/quantities.hpp"

namespace stackbound::emissions {

// Humidity ratio of the ISO standard day, kg water / kg dry air (40 CFR 60.335(b)(1), from memory).
inline constexpr double kIsoHumidityRatio = 0.00633;
// ISO standard-day ambient temperature, K (40 CFR 60.331, from memory).
inline constexpr double kIsoAmbientTemperature_K = 288.0;

struct GasTurbineAmbient {
  units::Temperature ambient_temperature;
  double humidity_ratio_kg_per_kg = kIsoHumidityRatio;
  // Both or neither: without them the pressure term is 1 (reported as an assumption by the caller).
  std::optional<units::Pressure> observed_inlet_pressure;
  std::optional<units::Pressure> reference_inlet_pressure;
};

// The factor NOx_ISO / NOx_o of the formula above; exactly 1 at ISO conditions. Throws
// units::InputError for a temperature <= 0 K, a humidity ratio outside [0, 0.2] or a pressure <= 0.
double gas_turbine_iso_factor(const GasTurbineAmbient& ambient);

}  // namespace stackbound::emissions
