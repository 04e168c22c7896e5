#pragma once
// A run of a case is a pipeline of named stages, each a function with its own typed result, in
// data-flow order:
//
//   loaded case   case_file.hpp        CaseDefinition: every value parsed and checked at load
//   1 resolve     stage_resolve.hpp    ResolvedCase: fuel, oxidant, operating point, feed, complete combustion
//   2 fire        stage_fire.hpp       FiringState: firing temperature and pressure, the equilibrium
//   3 post-flame  stage_post_flame.hpp PostFlame: thermal NO, CO burnout and fuel-N NO along the
//                                      post-flame path (estimate and ceiling next to the bound)
//   4 stack       stage_stack.hpp      StackGas: the frozen gas, its moisture, O2, CO2 and flows
//   5 emissions   stage_emissions.hpp  EmissionFigures: each pollutant's bound (and estimate, ceiling)
//                                      on the report's bases, rates
//   6 screening   stage_screening.hpp  Screening: limits, measured values, findings, assumptions, cautions
//   7 document    run_document.hpp     Report: the document the renderers print
//
// The stack gas and the bound stay the frozen firing-state equilibrium: the post-flame stage adds the
// kinetic estimate and ceiling beside them and changes no bound.
//
// run_case() composes stages 1-6; the document stage is run by whoever prints the result. Each stage
// is a library call of core/ or emissions/ wired to the case; a run_case() call and the same calls
// made by hand give identical numbers. A stage reads only its inputs, so a run that changes a value
// read first by stage N (a sweep point) may keep the results of the stages before N: see
// RunOptions::previous.
//
// Errors name the case field concerned ("firing.temperature: ..."), never a file position; run a
// loaded case inside with_positions(loaded.sources, ...) (source_map.hpp) to report positions.

#include "stackbound/cases/case_definition.hpp"
#include "stackbound/cases/stage_emissions.hpp"
#include "stackbound/cases/stage_fire.hpp"
#include "stackbound/cases/stage_post_flame.hpp"
#include "stackbound/cases/stage_resolve.hpp"
#include "stackbound/cases/stage_screening.hpp"
#include "stackbound/cases/stage_stack.hpp"
#include "stackbound/core/species_database.hpp"

namespace stackbound::cases {

// The stages run_case() composes, in order.
enum class Stage { resolve, fire, post_flame, stack, emissions, screening };

// Which stages computed a result; the others were kept from RunOptions::previous (or skipped:
// screening without RunOptions::full_report).
struct StagesRun {
  bool resolve = false;
  bool fire = false;
  bool post_flame = false;
  bool stack = false;
  bool emissions = false;
  bool screening = false;
};

struct RunResult {
  CaseDefinition definition;
  ResolvedCase resolved;
  FiringState fired;
  PostFlame post_flame;
  StackGas stack;
  EmissionFigures emissions;
  Screening screening;  // empty without RunOptions::full_report
  StagesRun stages_run;
};

struct RunOptions {
  // Keep the list of conversion factors behind each figure (for reports that explain them). Sweeps
  // switch it off: the values are identical, the work much less.
  bool record_factors = true;
  // Run the screening stage. Sweeps, which print none of it per point (their outputs carry the
  // standard cautions once), switch it off; RunResult then holds the figures only.
  bool full_report = true;
  // An earlier run of the same case (a sweep's previous point), or nullptr. The stages before
  // `rerun_from` are not run: their results are copied from it, so the caller guarantees that the
  // definitions differ only in values those stages do not read. Its fuel is reused when `keep_fuel`
  // (the fuel spec is the same); the fire stage, when it runs, reuses its solver and starts from its
  // equilibrium (same firing.species guaranteed by the caller).
  const RunResult* previous = nullptr;
  Stage rerun_from = Stage::resolve;
  bool keep_fuel = false;
};

// Runs one case through stages 1-6. Throws units::InputError naming the field path for bad input,
// and core::ConvergenceError if the equilibrium does not converge. Takes the definition by value: it
// ends up in RunResult::definition (pass an rvalue to avoid a copy).
RunResult run_case(CaseDefinition definition, const core::SpeciesDatabase& database, const RunOptions& options = {});

}  // namespace stackbound::cases
