#pragma once
// Umbrella header of the emissions layer: concentration bases and conversions, O2/CO2 reference
// correction, emission rates (Method 19 F-factors), reference-O2 presets, limit screening, cautions.
#include "stackbound/emissions/basis.hpp"
#include "stackbound/emissions/cautions.hpp"
#include "stackbound/emissions/concentration.hpp"
#include "stackbound/emissions/emission_rate.hpp"
#include "stackbound/emissions/fo_factor.hpp"
#include "stackbound/emissions/gas_turbine_iso.hpp"
#include "stackbound/emissions/limit_screening.hpp"
#include "stackbound/emissions/pollutant.hpp"
#include "stackbound/emissions/published_f_factors.hpp"
#include "stackbound/emissions/reference_correction.hpp"
#include "stackbound/emissions/reference_o2_presets.hpp"
#include "stackbound/emissions/screening_reading.hpp"
