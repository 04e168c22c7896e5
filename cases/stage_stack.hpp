#pragma once
// Stage 4 of a run, stack: the gas that reaches the stack. The firing-state equilibrium gas phase
// frozen unchanged (the post-flame stage gives its estimates beside the bound and does not change this
// gas); its moisture, O2 and CO2 on wet and dry bases, and its flows at the feed rate.

#include "stackbound/cases/case_definition.hpp"
#include "stackbound/cases/stage_fire.hpp"
#include "stackbound/cases/stage_resolve.hpp"
#include "stackbound/emissions/concentration.hpp"

namespace stackbound::cases {

struct StackGas {
  double h2o_wet = 0.0;  // mole fractions of the wet gas
  double o2_wet = 0.0;
  double co2_wet = 0.0;
  double o2_dry = 0.0;  // of the dry gas
  double co2_dry = 0.0;
  double wet_mol_per_s = 0.0;
  double dry_mol_per_s = 0.0;
  double actual_m3_per_s = 0.0;  // at stack temperature and pressure
  // The stack gas as the context of concentration conversions (moisture, O2 and CO2 dry, the
  // report's O2 basis; factor lists kept or not as the run asks).
  emissions::ConcentrationContext context;
};

// Runs the stage on the gas leaving the firing zone.
StackGas stack_stage(const StackSpec& stack, emissions::O2Basis o2_basis, const ResolvedCase& resolved,
                     const FiringState& fired, bool record_factors);

}  // namespace stackbound::cases
