#pragma once
// The warnings of a run before screening: those raised at load (CaseDefinition::warnings), by the
// fuel and the complete-combustion step (normalised sums, estimated heating values ...), and those
// only the resolved fuel can show (a plant type that does not fit the fuel). The screening stage adds
// its own; sweeps, which run no screening, print these. Documented in docs/case-file.md ("Warnings").

#include <vector>

#include "stackbound/cases/case_definition.hpp"
#include "stackbound/cases/stage_resolve.hpp"
#include "stackbound/units/warning.hpp"

namespace stackbound::cases {

std::vector<units::Warning> run_warnings(const CaseDefinition& definition, const ResolvedCase& resolved);

// Appends `warning` unless an equal one is already there.
void add_warning(std::vector<units::Warning>& warnings, units::Warning warning);

}  // namespace stackbound::cases
