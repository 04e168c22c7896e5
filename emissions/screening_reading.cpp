#include "stackbound/emissions/screening_reading.hpp"

#include <fmt/format.h>

namespace stackbound::emissions {

namespace {

bool is_co(std::string_view pollutant) { return pollutant == "CO"; }

std::string not_reachable(std::string_view pollutant) {
  return is_co(pollutant) ? "not reachable at these conditions in a well-mixed flame (screening)"
                          : "not reachable at these conditions (screening)";
}

// Why a measurement above the limit can stand beside a model that cannot reach it.
std::string_view left_out(std::string_view pollutant) {
  return is_co(pollutant) ? "the model leaves out poor mixing and quenching, which raise CO above every equilibrium "
                            "figure"
                          : "the model leaves out peak flame temperatures above the stated one, superequilibrium "
                            "radicals and prompt NO";
}

std::string plain(ScreeningSource source, ScreeningOutcome outcome) {
  return fmt::format("{} {}", screening_source_name(source), screening_outcome_name(outcome));
}

// What the model (estimate, ceiling, bound) can and cannot rule out; `reachable` false when the
// highest modelled figure stays below the limit.
std::string model_part(const LimitOutcomes& o, std::string_view pollutant, bool& reachable) {
  reachable = true;
  if (o.estimate && *o.estimate == ScreeningOutcome::above_limit) {
    return "estimate above the stated limit: expected above it at these conditions (screening)";
  }
  if (o.estimate && *o.estimate == ScreeningOutcome::at_limit) {
    return "estimate at the stated limit: cannot be ruled out by screening";
  }
  if (o.ceiling) {
    if (*o.ceiling == ScreeningOutcome::below_limit) {
      reachable = false;
      return screening_reading(ScreeningSource::ceiling, *o.ceiling, pollutant);
    }
    return o.estimate ? "estimate below, ceiling above: cannot be ruled out by screening"
                      : "ceiling above the stated limit: cannot be ruled out by screening";
  }
  if (o.bound == ScreeningOutcome::below_limit) {
    reachable = false;
    return fmt::format("bound below the stated limit: {}", not_reachable(pollutant));
  }
  return fmt::format("{}: cannot be ruled out by screening", plain(ScreeningSource::bound, o.bound));
}

}  // namespace

std::string_view screening_source_name(ScreeningSource source) {
  switch (source) {
    case ScreeningSource::measured:
      return "measured";
    case ScreeningSource::estimate:
      return "estimate";
    case ScreeningSource::ceiling:
      return "ceiling";
    case ScreeningSource::bound:
      return "bound";
  }
  return "value";
}

std::string screening_reading(ScreeningSource source, ScreeningOutcome outcome, std::string_view pollutant) {
  if (source == ScreeningSource::ceiling && outcome == ScreeningOutcome::below_limit) {
    return fmt::format("{}: {}", plain(source, outcome), not_reachable(pollutant));
  }
  return plain(source, outcome);
}

std::string screening_conclusion(const LimitOutcomes& outcomes, std::string_view pollutant) {
  bool reachable = true;
  const std::string model = model_part(outcomes, pollutant, reachable);
  if (!outcomes.measured) return model;
  std::string conclusion = fmt::format("{}; {}", plain(ScreeningSource::measured, *outcomes.measured), model);
  if (*outcomes.measured != ScreeningOutcome::below_limit && !reachable) {
    conclusion += fmt::format("; the measurement governs: {}", left_out(pollutant));
  }
  return conclusion;
}

}  // namespace stackbound::emissions
