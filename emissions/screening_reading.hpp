#pragma once
// What a screening against a stated limit says, in words an engineer can act on. Each stated limit
// is screened with up to four values of the same pollutant, each converted to the limit's basis:
//   measured  the stack measurement stated in the case file,
//   estimate  the post-flame kinetic estimate (not conservative: it can lie below a measurement),
//   ceiling   the post-flame ceiling (the most the modelled path can give),
//   bound     the equilibrium at the stated firing conditions.
// Each row reads "<source> below / at / above the stated limit"; a ceiling below the limit adds
// "not reachable at these conditions (screening)" (for CO: in a well-mixed flame only, since poor
// mixing and quenching raise CO above every equilibrium figure). The conclusion of a limit combines
// the rows: the measurement first, then what the model can and cannot rule out. Never "compliant":
// a screening compares numbers; compliance is for the permit's methods and the regulator.

#include <optional>
#include <string>
#include <string_view>

#include "stackbound/emissions/limit_screening.hpp"

namespace stackbound::emissions {

enum class ScreeningSource { measured, estimate, ceiling, bound };
// "measured", "estimate", "ceiling", "bound" (the JSON `source` values).
std::string_view screening_source_name(ScreeningSource source);

// The words of one row, e.g. "measured above the stated limit", "ceiling below the stated limit: not
// reachable at these conditions (screening)". `pollutant` as in the report ("CO", "NOx").
std::string screening_reading(ScreeningSource source, ScreeningOutcome outcome, std::string_view pollutant);

// The outcomes of one limit's rows; nullopt for a source that has no row (no measurement; no
// estimate or ceiling for NO2 and SO2, or when the kinetics could not run).
struct LimitOutcomes {
  std::optional<ScreeningOutcome> measured;
  std::optional<ScreeningOutcome> estimate;
  std::optional<ScreeningOutcome> ceiling;
  ScreeningOutcome bound = ScreeningOutcome::below_limit;
};

// The conclusion of one limit, e.g. "estimate below, ceiling above: cannot be ruled out by screening",
// or "measured above the stated limit; ceiling below the stated limit: ... the measurement shows what
// the model leaves out ...".
std::string screening_conclusion(const LimitOutcomes& outcomes, std::string_view pollutant);

}  // namespace stackbound::emissions
