#include "stackbound/cases/pipeline.hpp"

namespace stackbound::cases {

namespace {

// A stage runs unless RunOptions::previous holds its result and it comes before rerun_from;
// screening runs only for a full report.
StagesRun stages_to_run(const RunOptions& options) {
  const auto runs = [&](Stage stage) { return options.previous == nullptr || stage >= options.rerun_from; };
  return {
      .resolve = runs(Stage::resolve),
      .fire = runs(Stage::fire),
      .post_flame = runs(Stage::post_flame),
      .stack = runs(Stage::stack),
      .emissions = runs(Stage::emissions),
      .screening = options.full_report,
  };
}

}  // namespace

RunResult run_case(CaseDefinition definition, const core::SpeciesDatabase& database, const RunOptions& options) {
  const RunResult* const previous = options.previous;
  const StagesRun run = stages_to_run(options);
  // The stage results are moved into the RunResult, so they are not const.
  ResolvedCase resolved =
      run.resolve
          ? resolve_stage(definition, database, previous && options.keep_fuel ? &previous->resolved.fuel : nullptr)
          : previous->resolved;
  FiringState fired = run.fire
                          ? fire_stage(definition.firing, resolved, database, previous ? &previous->fired : nullptr)
                          : previous->fired;
  // The post-flame kinetics: estimate and ceiling beside the bound; the stack gas stays the frozen
  // firing-state equilibrium.
  PostFlame post_flame = run.post_flame ? post_flame_stage(definition, resolved, fired) : previous->post_flame;
  StackGas stack =
      run.stack ? stack_stage(definition.stack, definition.report.o2_basis, resolved, fired, options.record_factors)
                : previous->stack;
  const EmissionOptions emission_options{.record_factors = options.record_factors,
                                         .describe_reference_o2 = options.full_report};
  EmissionFigures figures =
      run.emissions ? emissions_stage(definition, resolved, fired, stack, emission_options, &post_flame) : previous->emissions;
  Screening screening = run.screening
                            ? screening_stage({definition, resolved, fired, stack, figures, post_flame}, database)
                            : Screening{};
  return {std::move(definition),
          std::move(resolved),
          std::move(fired),
          std::move(post_flame),
          std::move(stack),
          std::move(figures),
          std::move(screening),
          run};
}

}  // namespace stackbound::cases
