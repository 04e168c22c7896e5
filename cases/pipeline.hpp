#pragma once
// A run of a case is a pipeline of named stages, each a function with its own typed result, in
// data-flow order:
//
//   loaded case   case_file.hpp        CaseDefinition: every value parsed and checked at load
//   1 resolve     stage_resolve.hpp    ResolvedCase: fuel, oxidant, operating point, feed, complete combustion
//   2 fire        stage_fire.hpp       FiringState: firing temperature and pressure, the equilibrium
//     (post-flame: a later stage goes here, from FiringState to the gas entering the stack; today the
//      fire result passes straight on)
//   3 stack       stage_stack.hpp      StackGas: the frozen gas, its moisture, O2, CO2 and flows
//   4 emissions   stage_emissions.hpp  EmissionFigures: each pollutant's bound on the report's bases, rates
//   5 screening   stage_screening.hpp  Screening: limits, measured values, findings, assumptions, cautions
//   6 document    run_document.hpp     Report: the document the renderers print
//
// run_case() composes stages 1-5; the document stage is run by whoever prints the result. Each stage
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
#include "stackbound/cases/stage_resolve.hpp"
#include "stackbound/cases/stage_screening.hpp"
#include "stackbound/cases/stage_stack.hpp"
#include "stackbound/core/species_database.hpp"

namespace stackbound::cases {

// The stages run_case() composes, in order.
enum class Stage { resolve, fire, stack, emissions, screening };

// Which stages computed a result; the others were kept from RunOptions::previous (or skipped:
// screening without RunOptions::full_report).
struct StagesRun {
  bool resolve = false;
  bool fire = false;
  bool stack = false;
  bool emissions = false;
  bool screening = false;
};

struct RunResult {
  CaseDefinition definition;
  ResolvedCase resolved;
  FiringState fired;
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

// Runs one case through stages 1-5. Throws units::InputError naming the field path for bad input,
// and core::ConvergenceError if the equilibrium does not converge. Takes the definition by value: it
// ends up in RunResult::definition (pass an rvalue to avoid a copy).
RunResult run_case(CaseDefinition definition, const core::SpeciesDatabase& database, const RunOptions& options = {});

}  // namespace stackbound::cases
