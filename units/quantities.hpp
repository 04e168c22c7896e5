#pragma once
// Quantity types used at every library boundary (Boost.Units, SI system).
// Temperature is always absolute (kelvin) and is an affine quantity: two temperatures subtract to a
// TemperatureDifference, a difference adds to a temperature, but two temperatures do not add (the
// sum of 300 K and 300 K is not a temperature of anything). Boost.Units enforces that at compile time.
// Raw doubles are for dimensionless ratios and solver inner loops; their names carry the unit.

#include <boost/units/absolute.hpp>
#include <boost/units/physical_dimensions.hpp>
#include <boost/units/quantity.hpp>
#include <boost/units/systems/si.hpp>

namespace stackbound::units {

namespace bu = boost::units;

using Temperature = bu::quantity<bu::absolute<bu::si::temperature>>;  // absolute, K
using TemperatureDifference = bu::quantity<bu::si::temperature>;     // a difference of two, K
using Pressure = bu::quantity<bu::si::pressure>;
using Amount = bu::quantity<bu::si::amount>;
using Mass = bu::quantity<bu::si::mass>;
using Energy = bu::quantity<bu::si::energy>;
using Power = bu::quantity<bu::si::power>;
using Time = bu::quantity<bu::si::time>;
using Volume = bu::quantity<bu::si::volume>;

using MolarMassUnit = bu::divide_typeof_helper<bu::si::mass, bu::si::amount>::type;
using MassFlowUnit = bu::divide_typeof_helper<bu::si::mass, bu::si::time>::type;
using MolarFlowUnit = bu::divide_typeof_helper<bu::si::amount, bu::si::time>::type;
using MolarVolumeUnit = bu::divide_typeof_helper<bu::si::volume, bu::si::amount>::type;
using MolarEnergyUnit = bu::divide_typeof_helper<bu::si::energy, bu::si::amount>::type;
using SpecificEnergyUnit = bu::divide_typeof_helper<bu::si::energy, bu::si::mass>::type;
using MolarEntropyUnit = bu::divide_typeof_helper<MolarEnergyUnit, bu::si::temperature>::type;
using HeatCapacityUnit = bu::divide_typeof_helper<bu::si::energy, bu::si::temperature>::type;
using MassPerAmountUnit = MolarMassUnit;

using MolarMass = bu::quantity<MolarMassUnit>;
using MassFlow = bu::quantity<MassFlowUnit>;
using MolarFlow = bu::quantity<MolarFlowUnit>;
using MolarVolume = bu::quantity<MolarVolumeUnit>;
using MolarEnergy = bu::quantity<MolarEnergyUnit>;          // J/mol: molar enthalpy, Gibbs energy
using MolarEntropy = bu::quantity<MolarEntropyUnit>;        // J/(mol K): molar entropy, heat capacity
using SpecificEnergy = bu::quantity<SpecificEnergyUnit>;    // J/kg: heating values by mass
using HeatCapacity = bu::quantity<HeatCapacityUnit>;        // J/K: heat capacity of an amount of gas

// Constructors from SI numbers, so call sites read as `kelvin(1800.0)`.
inline Temperature kelvin(double value) { return Temperature::from_value(value); }
inline TemperatureDifference kelvin_difference(double value) { return TemperatureDifference::from_value(value); }
inline Pressure pascals(double value) { return value * bu::si::pascal; }
inline Amount moles(double value) { return value * bu::si::mole; }
inline Mass kilograms(double value) { return value * bu::si::kilogram; }
inline Energy joules(double value) { return value * bu::si::joule; }
inline Power watts(double value) { return value * bu::si::watt; }
inline Time seconds(double value) { return value * bu::si::second; }
inline MolarMass kilograms_per_mole(double value) { return MolarMass::from_value(value); }
inline MassFlow kilograms_per_second(double value) { return MassFlow::from_value(value); }
inline MolarFlow moles_per_second(double value) { return MolarFlow::from_value(value); }
inline MolarVolume cubic_metres_per_mole(double value) { return MolarVolume::from_value(value); }
inline MolarEnergy joules_per_mole(double value) { return MolarEnergy::from_value(value); }
inline MolarEntropy joules_per_mole_kelvin(double value) { return MolarEntropy::from_value(value); }
inline SpecificEnergy joules_per_kilogram(double value) { return SpecificEnergy::from_value(value); }
inline HeatCapacity joules_per_kelvin(double value) { return HeatCapacity::from_value(value); }

}  // namespace stackbound::units
