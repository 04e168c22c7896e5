#pragma once
// Stage 1 of a run, resolve: the case's fuel, oxidant, operating point and feed, and what they give
// by complete combustion per kg of fuel (the air ratio, the reactant elements and enthalpy for the
// fire stage, F-factors, dew point) and scaled to the feed.

#include "stackbound/cases/case_definition.hpp"
#include "stackbound/cases/f_factor_choice.hpp"
#include "stackbound/core/combustion.hpp"
#include "stackbound/core/fuel.hpp"
#include "stackbound/core/oxidant.hpp"
#include "stackbound/core/species_database.hpp"

namespace stackbound::cases {

struct ResolvedCase {
  core::Fuel fuel;
  core::Oxidant oxidant;
  core::OperatingPoint operating_point;  // with the fuel temperature and the flue (stack) pressure
  core::CombustionResult combustion;     // per kg of fuel, complete combustion
  core::CombustionRates rates;           // scaled to the feed (rates.feed: mass flow, heat input)
  FFactorsUsed f_factors;                // those the rates per heat input use (report.f_factors)
};

// Runs the stage. `built_fuel`: the fuel of definition.fuel.fuel when already built (a sweep that
// does not vary the fuel builds it once); nullptr builds it. Errors name field paths ("fuel.gas: ...",
// "operating_point.flue_o2: ..."; source_map.hpp).
ResolvedCase resolve_stage(const CaseDefinition& definition, const core::SpeciesDatabase& database,
                           const core::Fuel* built_fuel = nullptr);

}  // namespace stackbound::cases
