#pragma once
// Umbrella header of the emissions layer: concentration bases and conversions, O2/CO2 reference
// correction, emission rates (Method 19 F-factors), reference-O2 presets, limit screening, cautions,
// and the report document with its renderers.
#include "emissions/basis.hpp"
#include "emissions/cautions.hpp"
#include "emissions/concentration.hpp"
#include "emissions/emission_rate.hpp"
#include "emissions/limit_screening.hpp"
#include "emissions/pollutant.hpp"
#include "emissions/reference_correction.hpp"
#include "emissions/reference_o2_presets.hpp"
#include "emissions/report.hpp"
#include "emissions/svg_plot.hpp"
