#include "stackbound/core/humidity.hpp"

#include <array>
#include <cmath>
#include <cstdint>

#include <boost/math/tools/roots.hpp>
#include <fmt/format.h>

#include "stackbound/units/input_error.hpp"

namespace stackbound::core {

namespace {

// IAPWS-IF97 region-4 coefficients n1..n10 (Table 34 of the IF97 release).
constexpr std::array<double, 10> kN{0.11670521452767e4,  -0.72421316703206e6, -0.17073846940092e2,
                                    0.12020824702470e5,  -0.32325550322333e7, 0.14915108613530e2,
                                    -0.48232657361591e4, 0.40511340542057e6,  -0.23855557567849,
                                    0.65017534844798e3};
constexpr double kIf97ReferencePressure_Pa = 1.0e6;  // p* = 1 MPa
constexpr double kIf97LowestTemperature_K = 273.15;
constexpr double kIf97LowestPressure_Pa = 611.213;  // p_s(273.15 K), the lower end of Eq. 31

// IAPWS R14-08(2011), Eq. 6: ln(p/p_t) = theta^-1 * sum a_i theta^b_i, theta = T/T_t.
constexpr std::array<double, 3> kSublimationA{-0.212144006e2, 0.273203819e2, -0.610598130e1};
constexpr std::array<double, 3> kSublimationB{0.333333333e-2, 0.120666667e1, 0.170333333e1};
constexpr double kSublimationLowest_K = 50.0;

[[noreturn]] void out_of_range(std::string_view field, double value, std::string_view unit, std::string_view rule) {
  throw units::InputError(fmt::format("{} = {:.6g} {}: {}", field, value, unit, rule));
}

// The equations on raw SI numbers; the typed functions below are their public face.
double water_saturation_pressure_Pa(double temperature_K, std::string_view field) {
  if (!std::isfinite(temperature_K) || temperature_K < kIf97LowestTemperature_K ||
      temperature_K > kWaterCriticalTemperature_K) {
    out_of_range(field, temperature_K, "K",
                 "outside the range of the IAPWS-IF97 saturation equation (273.15 K to 647.096 K)");
  }
  const double T = temperature_K;  // T* = 1 K
  const double theta = T + kN[8] / (T - kN[9]);
  const double A = theta * theta + kN[0] * theta + kN[1];
  const double B = kN[2] * theta * theta + kN[3] * theta + kN[4];
  const double C = kN[5] * theta * theta + kN[6] * theta + kN[7];
  const double ratio = 2.0 * C / (-B + std::sqrt(B * B - 4.0 * A * C));
  return kIf97ReferencePressure_Pa * std::pow(ratio, 4);
}

double water_saturation_temperature_K(double pressure_Pa, std::string_view field) {
  if (!std::isfinite(pressure_Pa) || pressure_Pa < kIf97LowestPressure_Pa || pressure_Pa > kWaterCriticalPressure_Pa) {
    out_of_range(field, pressure_Pa, "Pa",
                 "outside the range of the IAPWS-IF97 saturation equation (611.213 Pa to 22.064 MPa)");
  }
  const double beta = std::pow(pressure_Pa / kIf97ReferencePressure_Pa, 0.25);
  const double E = beta * beta + kN[2] * beta + kN[5];
  const double F = kN[0] * beta * beta + kN[3] * beta + kN[6];
  const double G = kN[1] * beta * beta + kN[4] * beta + kN[7];
  const double D = 2.0 * G / (-F - std::sqrt(F * F - 4.0 * E * G));
  const double sum = kN[9] + D;
  return 0.5 * (sum - std::sqrt(sum * sum - 4.0 * (kN[8] + kN[9] * D)));
}

double ice_sublimation_pressure_Pa(double temperature_K, std::string_view field = "temperature") {
  if (!std::isfinite(temperature_K) || temperature_K < kSublimationLowest_K || temperature_K > kWaterTriplePoint_K) {
    out_of_range(field, temperature_K, "K",
                 "outside the range of the IAPWS sublimation equation over ice (50 K to 273.16 K)");
  }
  const double theta = temperature_K / kWaterTriplePoint_K;
  double sum = 0.0;
  for (std::size_t i = 0; i < kSublimationA.size(); ++i) sum += kSublimationA[i] * std::pow(theta, kSublimationB[i]);
  return kWaterTriplePoint_Pa * std::exp(sum / theta);
}

double water_vapour_pressure_Pa(double temperature_K, std::string_view field) {
  if (std::isfinite(temperature_K) && temperature_K < kWaterTriplePoint_K) {
    return ice_sublimation_pressure_Pa(temperature_K, field);
  }
  return water_saturation_pressure_Pa(temperature_K, field);
}

std::optional<double> water_dew_point_K(double water_partial_pressure_Pa, std::string_view field) {
  if (!std::isfinite(water_partial_pressure_Pa)) out_of_range(field, water_partial_pressure_Pa, "Pa", "not a finite number");
  if (water_partial_pressure_Pa <= 0.0) return std::nullopt;
  if (water_partial_pressure_Pa > kWaterCriticalPressure_Pa) {
    out_of_range(field, water_partial_pressure_Pa, "Pa", "above the critical pressure of water (22.064 MPa)");
  }
  if (water_partial_pressure_Pa >= kWaterTriplePoint_Pa) {
    return water_saturation_temperature_K(water_partial_pressure_Pa, field);
  }
  // Frost point: invert the sublimation equation, which is monotonic in T, in log p.
  const double target = std::log(water_partial_pressure_Pa);
  const auto residual = [target](double T) { return std::log(ice_sublimation_pressure_Pa(T)) - target; };
  if (residual(kSublimationLowest_K) > 0.0) return std::nullopt;
  std::uintmax_t iterations = 200;
  const auto [low, high] = boost::math::tools::toms748_solve(residual, kSublimationLowest_K, kWaterTriplePoint_K,
                                                             boost::math::tools::eps_tolerance<double>(48), iterations);
  return 0.5 * (low + high);
}

}  // namespace

units::Pressure water_saturation_pressure(units::Temperature temperature, std::string_view field) {
  return units::pascals(water_saturation_pressure_Pa(temperature.value(), field));
}

units::Temperature water_saturation_temperature(units::Pressure pressure, std::string_view field) {
  return units::kelvin(water_saturation_temperature_K(pressure.value(), field));
}

units::Pressure ice_sublimation_pressure(units::Temperature temperature, std::string_view field) {
  return units::pascals(ice_sublimation_pressure_Pa(temperature.value(), field));
}

units::Pressure water_vapour_pressure(units::Temperature temperature, std::string_view field) {
  return units::pascals(water_vapour_pressure_Pa(temperature.value(), field));
}

std::optional<units::Temperature> water_dew_point(units::Pressure water_partial_pressure, std::string_view field) {
  const std::optional<double> dew_point_K = water_dew_point_K(water_partial_pressure.value(), field);
  if (!dew_point_K) return std::nullopt;
  return units::kelvin(*dew_point_K);
}

}  // namespace stackbound::core
