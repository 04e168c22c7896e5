#pragma once
// Umbrella header of the core layer: elements and species data, chemical equilibrium (TP and HP),
// fuels and the notation of compositions, oxidant, humidity, complete-combustion stoichiometry and the
// post-flame kinetics (thermal NO, CO burnout, fuel-nitrogen NO).
#include "stackbound/core/adiabatic_flame.hpp"
#include "stackbound/core/co_burnout.hpp"
#include "stackbound/core/combustion.hpp"
#include "stackbound/core/composition_notation.hpp"
#include "stackbound/core/element_amounts.hpp"
#include "stackbound/core/elements.hpp"
#include "stackbound/core/equilibrium.hpp"
#include "stackbound/core/fuel.hpp"
#include "stackbound/core/fuel_nitrogen.hpp"
#include "stackbound/core/fuel_presets.hpp"
#include "stackbound/core/humidity.hpp"
#include "stackbound/core/oxidant.hpp"
#include "stackbound/core/post_flame.hpp"
#include "stackbound/core/primary_zone.hpp"
#include "stackbound/core/species.hpp"
#include "stackbound/core/species_database.hpp"
#include "stackbound/core/thermal_no.hpp"
