#pragma once
// Physical constants and defining values of units. Each cites its source in one line.

namespace stackbound::units {

// Molar gas constant, J/(mol K). Source: CODATA 2018 recommended value (exact since the 2019 SI).
inline constexpr double kGasConstant_J_per_mol_K = 8.314462618;
// Standard atmosphere, Pa. Source: defining value (CGPM 1954; ISO 80000-4).
inline constexpr double kStandardAtmosphere_Pa = 101325.0;
// Standard-state pressure of the thermodynamic data (NIST-JANAF, NASA polynomials), Pa. Source: IUPAC (1982).
inline constexpr double kStandardStatePressure_Pa = 100000.0;
// Standard reference temperature of formation enthalpies, K. Source: NIST-JANAF 4th ed. introduction.
inline constexpr double kReferenceTemperature_K = 298.15;
// International avoirdupois pound, kg. Source: International Yard and Pound Agreement (1959).
inline constexpr double kPound_kg = 0.45359237;
// International Table British thermal unit, J. Source: 5th International Conference on Properties of Steam (1956).
inline constexpr double kBtuIT_J = 1055.05585262;
// International foot, m. Source: International Yard and Pound Agreement (1959).
inline constexpr double kFoot_m = 0.3048;
// Pound-force per square inch, Pa (lbf = lb x standard gravity 9.80665 m/s^2; inch = 0.0254 m). Source: NIST SP 811.
inline constexpr double kPsi_Pa = 0.45359237 * 9.80665 / (0.0254 * 0.0254);
// Conventional inch of mercury (at 0 degC), Pa. Source: NIST SP 811, Appendix B.
inline constexpr double kInchMercury_Pa = 3386.389;
// Kelvin offset of the Celsius scale. Source: SI Brochure, 9th ed.
inline constexpr double kCelsiusOffset_K = 273.15;

}  // namespace stackbound::units
