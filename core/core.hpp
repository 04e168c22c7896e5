#pragma once
// Umbrella header of the core layer: elements and species data, chemical equilibrium (TP and HP),
// fuels, oxidant, humidity and complete-combustion stoichiometry.
#include "core/adiabatic_flame.hpp"
#include "core/combustion.hpp"
#include "core/element_amounts.hpp"
#include "core/elements.hpp"
#include "core/equilibrium.hpp"
#include "core/fuel.hpp"
#include "core/fuel_presets.hpp"
#include "core/humidity.hpp"
#include "core/oxidant.hpp"
#include "core/species.hpp"
#include "core/species_database.hpp"
