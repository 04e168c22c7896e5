#pragma once
// Saturation pressure of water and the water dew point of a gas.
//   Over liquid water, 273.16-647.096 K: IAPWS-IF97 region-4 saturation-pressure equation (Eq. 30) and
//   its backward equation for the saturation temperature (Eq. 31). Source: IAPWS, Revised Release on
//   the IAPWS Industrial Formulation 1997 for the Thermodynamic Properties of Water and Steam (2007).
//   Over ice, 50-273.16 K: the IAPWS sublimation-pressure equation. Source: IAPWS R14-08(2011),
//   Revised Release on the Pressure along the Melting and Sublimation Curves of Ordinary Water
//   Substance, Eq. (6) (Wagner, Riethmann, Feistel & Harvey, J. Phys. Chem. Ref. Data 40, 043103, 2011).
// Moist air is treated as an ideal mixture: the enhancement factor (about 1.004 near 1 atm) is left
// out, so water contents at saturation are low by that fraction.
// Temperatures or pressures outside the equations' ranges are an error (units::InputError), never an
// extrapolation.

#include <optional>
#include <string_view>

#include "stackbound/units/quantities.hpp"

namespace stackbound::core {

// Triple point of water. Source: IAPWS-IF97 (T_t = 273.16 K) and IAPWS R14-08(2011) (p_t = 611.657 Pa).
inline constexpr double kWaterTriplePoint_K = 273.16;
inline constexpr double kWaterTriplePoint_Pa = 611.657;
// Critical point of water. Source: IAPWS-IF97, Eqs. (4), (5).
inline constexpr double kWaterCriticalTemperature_K = 647.096;
inline constexpr double kWaterCriticalPressure_Pa = 22.064e6;

// Saturation pressure over liquid water, IAPWS-IF97 Eq. 30; valid 273.15 K <= T <= 647.096 K.
// `field` names the input in error messages.
units::Pressure water_saturation_pressure(units::Temperature temperature, std::string_view field = "temperature");

// Saturation temperature over liquid water, IAPWS-IF97 Eq. 31; valid 611.213 Pa <= p <= 22.064 MPa.
units::Temperature water_saturation_temperature(units::Pressure pressure, std::string_view field = "pressure");

// Sublimation pressure over ice Ih, IAPWS R14-08(2011) Eq. 6; valid 50 K <= T <= 273.16 K.
units::Pressure ice_sublimation_pressure(units::Temperature temperature, std::string_view field = "temperature");

// Equilibrium vapour pressure of water: over liquid water at or above the triple point (273.16 K),
// over ice below it. Valid 50 K <= T <= 647.096 K.
units::Pressure water_vapour_pressure(units::Temperature temperature, std::string_view field = "temperature");

// Water dew point of a gas whose water partial pressure is `water_partial_pressure`: the
// temperature at which water_vapour_pressure(T) equals it (a frost point over ice below 273.16 K).
// Returns nothing when the gas holds no water (p <= 0) or the frost point would lie below 50 K.
// Throws units::InputError when the partial pressure is at or above the critical pressure.
std::optional<units::Temperature> water_dew_point(units::Pressure water_partial_pressure,
                                                  std::string_view field = "water partial pressure");

}  // namespace stackbound::core
