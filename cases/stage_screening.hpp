#pragma once
// Stage 6 of a run, screening: everything after the emission figures. The bounds against the stated
// limits, the measured values beside the model on a common basis, the findings a reader must look at
// (where they disagree, and what the model itself shows: soot, rich firing, a stack near the dew
// point), and the assumptions and cautions every report carries.

#include <optional>
#include <string>
#include <vector>

#include "stackbound/cases/case_definition.hpp"
#include "stackbound/cases/stage_emissions.hpp"
#include "stackbound/cases/stage_fire.hpp"
#include "stackbound/cases/stage_post_flame.hpp"
#include "stackbound/cases/stage_resolve.hpp"
#include "stackbound/cases/stage_stack.hpp"
#include "stackbound/core/species_database.hpp"
#include "stackbound/emissions/limit_screening.hpp"
#include "stackbound/emissions/screening_reading.hpp"
#include "stackbound/units/warning.hpp"

namespace stackbound::cases {

// One row of the screening: one value (measured, estimate, ceiling or bound) against one stated limit,
// on the limit's basis. A limit has a row per source it has a value for, in that order.
struct LimitScreening {
  std::string pollutant;
  std::string limit_text;
  std::size_t limit_index = 0;  // in report.limits
  emissions::ScreeningSource source = emissions::ScreeningSource::bound;
  emissions::ScreeningResult result;
  std::string reading;     // this row's words (emissions/screening_reading.hpp)
  std::string conclusion;  // the limit's conclusion from all its rows (the same on each of them)
};

// A measured value set beside the equilibrium bound on the same basis.
struct MeasuredComparison {
  std::string quantity;       // "O2", "CO", "NO", "NOx", "moisture"
  std::string measured_text;  // as stated in the case file
  std::string basis;          // the common basis of the two numbers
  double measured = 0.0;
  double model = 0.0;  // the bound (CO, NO, NOx) or the model's value (O2, moisture)
  std::string unit;
  std::string finding;  // empty when consistent
};

// One line of the headline (the figures an engineer reads first), on the permit's basis: the stated
// limit's, or for a pollutant without a limit mg/Nm3 dry at the reference O2. A pollutant with two
// limits has two lines.
struct HeadlineRow {
  std::string pollutant;
  std::string unit;                // "mg/Nm3", "lb/MMBtu", "kg/h"
  std::string basis;               // the rest of the basis ("dry, O2=3%, as NO2, normal=0C"; "" for rates)
  std::optional<double> estimate;  // none for NO2, SO2 or when the kinetics could not run
  std::optional<double> ceiling;
  double bound = 0.0;
  std::optional<double> measured;  // when stack.measured states the pollutant
  std::optional<double> limit;     // when a limit is stated
  std::string reading;             // the limit's conclusion; "" without a limit
};

struct Screening {
  std::vector<HeadlineRow> headline;
  std::vector<LimitScreening> limits;
  std::vector<MeasuredComparison> measured;
  std::vector<std::string> findings;  // what the reader must look at
  // Legal but implausible input, and what the run filled in: run_warnings() plus the screening's own
  // (a wet measured value converted with the model's moisture, a limit with no reference O2).
  std::vector<units::Warning> warnings;
  std::vector<std::string> assumptions;
  std::vector<std::string> cautions;  // texts, in print order
  std::vector<std::string> caution_keys;
};

// The results of the stages before screening, which it reads.
struct ScreeningInput {
  const CaseDefinition& definition;
  const ResolvedCase& resolved;
  const FiringState& fired;
  const StackGas& stack;
  const EmissionFigures& figures;
  const PostFlame& post_flame;
};

// Runs the stage. `database`: the species data of the run, named in the assumptions. Errors name the
// field of the limit or measured value concerned ("report.limits[1].limit: ..."; source_map.hpp).
Screening screening_stage(const ScreeningInput& input, const core::SpeciesDatabase& database);

// Thresholds of the findings (our choices, common practice, no source; printed in the report).
inline constexpr double kO2MismatchPoints = 0.5;        // measured vs model flue O2, percentage points (dry)
inline constexpr double kMoistureMismatchPoints = 2.0;  // measured vs model moisture, percentage points
inline constexpr double kCoAboveBoundFactor = 2.0;      // measured CO above this multiple of the bound
inline constexpr double kDewPointMarginK = 10.0;        // stack within this of the water dew point

}  // namespace stackbound::cases
