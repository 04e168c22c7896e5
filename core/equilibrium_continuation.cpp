// Continuation in the amounts of trace elements: the rescue of a TP solve that failed on a feed
// whose scarcest elements sit many decades below the bulk (see EquilibriumSolver::solve_tp).
#include <algorithm>
#include <cmath>
#include <optional>

#include "stackbound/core/equilibrium.hpp"
#include "stackbound/core/equilibrium_steps.hpp"

namespace stackbound::core {

namespace {

// An element below this share of the feed's atoms is a trace element for the continuation; the
// first solve raises every trace element to it, later solves lower it a decade at a time.
constexpr double kTraceShare = 1e-6;
constexpr double kDecade = 10.0;

// `b` with every element below share * total raised to share * total.
ElementAmounts raised_to_share(const ElementAmounts& b, double share) {
  const double floor = share * b.total();
  ElementAmounts raised = b;
  for (double& moles : raised.moles) {
    if (moles > 0.0) moles = std::max(moles, floor);
  }
  return raised;
}

}  // namespace

std::optional<EquilibriumResult> EquilibriumSolver::solve_by_trace_continuation(const ElementAmounts& b,
                                                                                 double temperature_K,
                                                                                 double pressure_Pa) const {
  const double total = b.total();
  double scarcest = total;
  for (const double moles : b.moles) {
    if (moles > 0.0) scarcest = std::min(scarcest, moles);
  }
  if (scarcest >= kTraceShare * total) return std::nullopt;
  try {
    std::optional<EquilibriumResult> previous;
    for (double share = kTraceShare; share * total > scarcest; share /= kDecade) {
      const ElementAmounts step = raised_to_share(b, share);
      previous = EquilibriumWork::solve(*this, step, temperature_K, pressure_Pa, previous ? &*previous : nullptr);
    }
    return EquilibriumWork::solve(*this, b, temperature_K, pressure_Pa, &*previous);
  } catch (const ConvergenceError&) {
    return std::nullopt;
  }
}

}  // namespace stackbound::core
