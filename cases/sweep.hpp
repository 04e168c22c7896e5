#pragma once
// Sweeps: the cartesian grid of one or more case parameters, each point a run of the case's pipeline
// (pipeline.hpp) without the screening stage. Points run in order along the grid (the last --vary
// changes fastest); each point re-runs only the stages that read a parameter changed since the
// previous point of its worker and keeps that point's other stage results (a reference-O2 step needs
// no new equilibrium), and its fire stage starts from the previous equilibrium. Workers take
// contiguous slices of fixed-size batches, and the batch is handed to the sink in grid order before
// the next starts, so memory does not grow with the number of points. A point that fails is reported
// with its parameters and the sweep goes on.

#include <functional>
#include <optional>
#include <span>
#include <string>
#include <string_view>
#include <vector>

#include "stackbound/cases/case_definition.hpp"
#include "stackbound/cases/pipeline.hpp"
#include "stackbound/cases/source_map.hpp"
#include "stackbound/core/species_database.hpp"
#include "stackbound/emissions/cautions.hpp"

namespace stackbound::cases {

enum class SweepParameter {
  excess_air,
  flue_o2,
  firing_temperature,
  heat_loss,
  air_preheat,
  humidity,
  o2_enrichment,
  pressure,
  blend_fraction,
  reference_o2,
};

// The first stage that reads a parameter: a point that changes only parameters read from stage N on
// keeps the previous point's results of the stages before N.
Stage first_stage_reading(SweepParameter parameter);

// The parameter names accepted by --vary, in this order.
std::span<const std::string_view> sweep_parameter_names();
std::string_view sweep_parameter_name(SweepParameter parameter);
// Column unit of a parameter's values in outputs: "%", "K" or "kPa".
std::string_view sweep_parameter_unit(SweepParameter parameter);
// Column title with the unit, e.g. "excess_air [%]".
std::string sweep_parameter_label(SweepParameter parameter);
// SI value -> the number printed in that unit.
double sweep_parameter_display(SweepParameter parameter, double value_si);

struct VarySpec {
  SweepParameter parameter;
  std::vector<double> values;  // SI (fractions, K, Pa), evenly spaced from FROM to TO
  std::string text;            // as given
};

// Parses "excess_air=5%:45%:9" or "air_preheat=20degC:320degC:7": PARAM=FROM:TO:STEPS, FROM < TO
// with units, STEPS >= 2 points. Throws units::InputError naming --vary, the text and the rule.
VarySpec parse_vary(std::string_view text);

// Sets one parameter of a copy of the case; throws units::InputError where the case cannot take it
// (heat_loss on a case with a stated firing temperature, blend_fraction on a single fuel, a reference
// O2 outside 0-20 %).
void apply_parameter(CaseDefinition& definition, SweepParameter parameter, double value_si);

// Checks that every parameter can be applied to the case (before any point runs).
void check_sweep(const CaseDefinition& definition, const std::vector<VarySpec>& vary);

// The cautions a sweep's outputs carry: the standard ones, and sweep_fixed_temperature when the case
// states its firing temperature and the sweep varies an operating change that would move a real
// flame's temperature (excess_air, flue_o2, air_preheat, humidity, o2_enrichment, blend_fraction).
std::vector<emissions::Caution> sweep_cautions(const CaseDefinition& definition, const std::vector<VarySpec>& vary);

struct SweepPoint {
  std::size_t index = 0;
  std::vector<double> values;          // SI, one per VarySpec
  std::optional<RunResult> result;     // empty when the point failed; result->stages_run tells which
                                       // stages ran for this point (the others were kept)
  std::string error;                   // why it failed
};

// Number of points of the grid (product of the value counts).
std::size_t sweep_size(const std::vector<VarySpec>& vary);

// The default cap on the points of a grid.
inline constexpr std::size_t kDefaultMaxSweepPoints = 10'000'000;

// The number of points, checked against the cap before any work: a grid of 31623 x 31623 points would
// otherwise stream until the disk fills. Throws units::InputError naming --vary and --max-points.
std::size_t checked_sweep_size(const std::vector<VarySpec>& vary, std::size_t max_points);

struct SweepOptions {
  unsigned threads = 0;               // 0: all cores
  std::size_t batch_points = 512;     // points held in memory at once
  // Called after each batch with the number of points done so far.
  std::function<void(std::size_t done, std::size_t total)> progress;
  // Where the case's fields were written (LoadedCase::sources): errors of a point name their field's
  // file position instead of its path. Not owned; nullptr keeps the paths.
  const SourceMap* sources = nullptr;
};

// Runs the grid; `sink` receives every point once, in grid order. Returns the number of failed points.
std::size_t run_sweep(const CaseDefinition& base, const std::vector<VarySpec>& vary, const core::SpeciesDatabase& database,
                      const std::function<void(const SweepPoint&)>& sink, const SweepOptions& options = {});

}  // namespace stackbound::cases
