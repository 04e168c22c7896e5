#include "stackbound/core/humidity.hpp"

#include <gtest/gtest.h>

#include "tests/support/tolerance.hpp"
#include "stackbound/units/input_error.hpp"

namespace stackbound::core {
namespace {

using stackbound::testing::is_close;

// Wrong if a coefficient of IAPWS-IF97 Eq. 30 were mistyped.
// Source: IAPWS-IF97 release (2007), Table 35, computer-program verification values of Eq. 30
// (from memory): T = 300, 500, 600 K -> p_s = 0.353658941e-2, 0.263889776e1, 0.123443146e2 MPa.
// The table prints 9 digits; 1e-6 relative is loose against that.
TEST(WaterSaturation, PressureReproducesIf97VerificationValues) {
  EXPECT_TRUE(is_close(water_saturation_pressure(units::kelvin(300.0)).value(), 0.353658941e-2 * 1e6, 1e-6));
  EXPECT_TRUE(is_close(water_saturation_pressure(units::kelvin(500.0)).value(), 0.263889776e1 * 1e6, 1e-6));
  EXPECT_TRUE(is_close(water_saturation_pressure(units::kelvin(600.0)).value(), 0.123443146e2 * 1e6, 1e-6));
}

// Wrong if the backward equation (Eq. 31) were miscoded.
// Source: IAPWS-IF97 release (2007), Table 36, verification values of Eq. 31 (from memory):
// p = 0.1, 1, 10 MPa -> T_s = 0.372755919e3, 0.453035632e3, 0.584149488e3 K.
TEST(WaterSaturation, TemperatureReproducesIf97VerificationValues) {
  EXPECT_TRUE(is_close(water_saturation_temperature(units::pascals(0.1e6)).value(), 0.372755919e3, 1e-6));
  EXPECT_TRUE(is_close(water_saturation_temperature(units::pascals(1.0e6)).value(), 0.453035632e3, 1e-6));
  EXPECT_TRUE(is_close(water_saturation_temperature(units::pascals(10.0e6)).value(), 0.584149488e3, 1e-6));
}

// Wrong if Eq. 30 and Eq. 31 were not inverses of each other (they solve the same quadratic, IF97 Eq. 29).
TEST(WaterSaturation, PressureAndTemperatureEquationsAreInverses) {
  for (double T = 273.16; T < 647.0; T += 17.3) {
    EXPECT_TRUE(is_close(water_saturation_temperature(water_saturation_pressure(units::kelvin(T))).value(), T, 1e-11))
        << T;
  }
}

// Wrong if the normal boiling point were off: 373.124 K at 101.325 kPa.
// Source: IAPWS-IF97 saturation temperature at 0.101325 MPa, 373.1243 K (from memory).
TEST(WaterSaturation, BoilsNearOneHundredDegreesAtOneAtmosphere) {
  EXPECT_TRUE(is_close(water_saturation_temperature(units::pascals(101325.0)).value(), 373.1243, 0.0, 0.002));
}

// Wrong if the two equations did not meet at the triple point: both give 611.657 Pa at 273.16 K.
// Source: IAPWS R14-08(2011), p_t = 611.657 Pa at T_t = 273.16 K (the sublimation equation's reference).
TEST(IceSublimation, MeetsTheLiquidCurveAtTheTriplePoint) {
  EXPECT_TRUE(is_close(ice_sublimation_pressure(units::kelvin(273.16)).value(), 611.657, 1e-9));
  EXPECT_TRUE(is_close(water_saturation_pressure(units::kelvin(273.16)).value(), 611.657, 1e-5));
}

// Wrong if a coefficient of the sublimation equation were mistyped.
// Source: IAPWS R14-08(2011), check value p_subl(230 K) = 8.94735 Pa (from memory).
TEST(IceSublimation, ReproducesTheReleaseCheckValue) {
  EXPECT_TRUE(is_close(ice_sublimation_pressure(units::kelvin(230.0)).value(), 8.94735, 1e-5));
}

// Wrong if the vapour pressure switched curves anywhere but at the triple point, or decreased with T.
TEST(WaterVapourPressure, UsesIceBelowAndLiquidAboveTheTriplePoint) {
  EXPECT_TRUE(is_close(water_vapour_pressure(units::kelvin(260.0)).value(),
                       ice_sublimation_pressure(units::kelvin(260.0)).value(), 1e-15));
  EXPECT_TRUE(is_close(water_vapour_pressure(units::kelvin(300.0)).value(),
                       water_saturation_pressure(units::kelvin(300.0)).value(), 1e-15));
  double previous = 0.0;
  for (double T = 200.0; T < 640.0; T += 1.0) {
    const double p = water_vapour_pressure(units::kelvin(T)).value();
    EXPECT_GT(p, previous) << T;
    previous = p;
  }
}

// Wrong if the dew point did not invert the vapour pressure on both sides of the triple point.
TEST(WaterDewPoint, InvertsTheVapourPressureIncludingFrostPoints) {
  for (const double T : {210.0, 240.0, 265.0, 273.0, 280.0, 320.0, 330.0, 420.0}) {
    const auto dew = water_dew_point(water_vapour_pressure(units::kelvin(T)));
    ASSERT_TRUE(dew.has_value()) << T;
    EXPECT_TRUE(is_close(dew->value(), T, 1e-9)) << T;
  }
}

// Wrong if a dry gas got a dew point, or a bad partial pressure were accepted silently.
TEST(WaterDewPoint, DryGasHasNoneAndBadPressuresAreErrors) {
  EXPECT_FALSE(water_dew_point(units::pascals(0.0)).has_value());
  EXPECT_FALSE(water_dew_point(units::pascals(1e-60)).has_value());  // frost point below 50 K
  EXPECT_THROW_WITH((void)water_dew_point(units::pascals(30e6), "flue water partial pressure"), units::InputError,
                    "flue water partial pressure = 3e+07 Pa: above the critical pressure");
}

// Wrong if temperatures outside the equations' ranges were extrapolated instead of refused.
TEST(WaterSaturation, RefusesTemperaturesOutsideItsRangeNamingTheField) {
  EXPECT_THROW_WITH(
      (void)water_saturation_pressure(units::kelvin(250.0), "air.ambient_temperature").value(), units::InputError,
      "air.ambient_temperature = 250 K: outside the range of the IAPWS-IF97 saturation equation (273.15 K "
      "to 647.096 K)");
  EXPECT_THROW_WITH((void)water_saturation_pressure(units::kelvin(700.0)).value(), units::InputError,
                    "outside the range");
  EXPECT_THROW_WITH((void)ice_sublimation_pressure(units::kelvin(280.0)).value(), units::InputError,
                    "50 K to 273.16 K");
  EXPECT_THROW_WITH((void)water_saturation_temperature(units::pascals(100.0)).value(), units::InputError,
                    "611.213 Pa to 22.064 MPa");
}

}  // namespace
}  // namespace stackbound::core
