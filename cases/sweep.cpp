#include "stackbound/cases/sweep.hpp"

#include <algorithm>
#include <array>
#include <charconv>
#include <cmath>
#include <thread>

#include <fmt/format.h>

#include "stackbound/units/input_error.hpp"
#include "stackbound/units/nearest_name.hpp"
#include "stackbound/units/quantity_parser.hpp"

namespace stackbound::cases {

namespace {

using units::Dimension;

constexpr std::array<std::string_view, 10> kNames{"excess_air",    "flue_o2",  "firing_temperature",
                                                  "heat_loss",     "air_preheat", "humidity",
                                                  "o2_enrichment", "pressure", "blend_fraction",
                                                  "reference_o2"};

Dimension dimension_of(SweepParameter parameter) {
  switch (parameter) {
    case SweepParameter::firing_temperature:
    case SweepParameter::air_preheat: return Dimension::temperature;
    case SweepParameter::pressure: return Dimension::pressure;
    default: return Dimension::fraction;
  }
}

[[noreturn]] void reject(std::string_view text, const std::string& problem) {
  throw units::InputError(fmt::format("--vary = \"{}\": {}", text, problem));
}

}  // namespace

std::span<const std::string_view> sweep_parameter_names() { return kNames; }

// The post-flame stage reads the firing state (temperature, pressure, equilibrium solver), the fuel's
// nitrogen, firing.residence_time, post_flame and the stack temperature: every parameter that reaches
// it reaches an earlier stage first, so none starts there. A step of reference_o2 keeps it (and its
// path equilibria); a step of firing_temperature, heat_loss or pressure reruns it with the fire stage.
Stage first_stage_reading(SweepParameter parameter) {
  switch (parameter) {
    case SweepParameter::excess_air:
    case SweepParameter::flue_o2:
    case SweepParameter::air_preheat:
    case SweepParameter::humidity:
    case SweepParameter::o2_enrichment:
    case SweepParameter::blend_fraction: return Stage::resolve;
    case SweepParameter::firing_temperature:
    case SweepParameter::heat_loss:
    case SweepParameter::pressure: return Stage::fire;
    case SweepParameter::reference_o2: return Stage::emissions;
  }
  return Stage::resolve;
}

std::string_view sweep_parameter_name(SweepParameter parameter) { return kNames[static_cast<std::size_t>(parameter)]; }

std::string sweep_parameter_label(SweepParameter parameter) {
  return std::string(sweep_parameter_name(parameter)) + " [" + std::string(sweep_parameter_unit(parameter)) + "]";
}

std::string_view sweep_parameter_unit(SweepParameter parameter) {
  switch (dimension_of(parameter)) {
    case Dimension::temperature: return "K";
    case Dimension::pressure: return "kPa";
    default: return "%";
  }
}

double sweep_parameter_display(SweepParameter parameter, double value_si) {
  switch (dimension_of(parameter)) {
    case Dimension::temperature: return value_si;
    case Dimension::pressure: return value_si / 1e3;
    default: return value_si * 100.0;
  }
}

VarySpec parse_vary(std::string_view text) {
  const std::size_t equals = text.find('=');
  if (equals == std::string_view::npos) {
    reject(text, "expected PARAM=FROM:TO:STEPS, e.g. excess_air=5%:45%:9");
  }
  const std::string name(text.substr(0, equals));
  const auto known = std::find(kNames.begin(), kNames.end(), name);
  if (known == kNames.end()) {
    const std::vector<std::string> names(kNames.begin(), kNames.end());
    std::string problem = fmt::format("unknown parameter \"{}\"", name);
    if (const auto suggestion = units::nearest_name(name, names)) problem += fmt::format(" (did you mean \"{}\"?)", *suggestion);
    reject(text, problem + fmt::format("; accepted: {}", fmt::join(names, ", ")));
  }
  const auto parameter = static_cast<SweepParameter>(known - kNames.begin());
  const std::string_view range = text.substr(equals + 1);
  const std::size_t first = range.find(':');
  const std::size_t second = first == std::string_view::npos ? first : range.find(':', first + 1);
  if (first == std::string_view::npos || second == std::string_view::npos || range.find(':', second + 1) != std::string_view::npos) {
    reject(text, "expected FROM:TO:STEPS after the parameter, e.g. excess_air=5%:45%:9");
  }
  const std::string field = fmt::format("--vary {}", name);
  const Dimension dimension = dimension_of(parameter);
  const double from = units::parse_quantity(range.substr(0, first), field + " FROM", {dimension}).value_si;
  const double to = units::parse_quantity(range.substr(first + 1, second - first - 1), field + " TO", {dimension}).value_si;
  const std::string_view steps_text = range.substr(second + 1);
  long steps = 0;
  const auto [end, error] = std::from_chars(steps_text.data(), steps_text.data() + steps_text.size(), steps);
  if (error != std::errc() || end != steps_text.data() + steps_text.size()) {
    reject(text, fmt::format("STEPS = \"{}\" must be a whole number of points (2 or more)", steps_text));
  }
  if (steps < 2) reject(text, fmt::format("STEPS = {} : a range needs 2 or more points", steps));
  if (steps > 1'000'000) reject(text, fmt::format("STEPS = {} : at most 1000000 points per parameter", steps));
  if (!(from < to)) {
    reject(text, "FROM must be below TO (the range is reversed or empty); write the smaller value first");
  }
  VarySpec spec{parameter, {}, std::string(text)};
  spec.values.reserve(static_cast<std::size_t>(steps));
  for (long i = 0; i < steps; ++i) {
    spec.values.push_back(i + 1 == steps ? to : from + (to - from) * static_cast<double>(i) / static_cast<double>(steps - 1));
  }
  return spec;
}

void apply_parameter(CaseDefinition& definition, SweepParameter parameter, double value) {
  switch (parameter) {
    case SweepParameter::excess_air:
      definition.operating.mode = OperatingMode::excess_air;
      definition.operating.value = value;
      break;
    case SweepParameter::flue_o2:
      definition.operating.mode = OperatingMode::flue_o2;
      definition.operating.value = value;
      break;
    case SweepParameter::firing_temperature:
      definition.firing.adiabatic = false;
      definition.firing.heat_loss_fraction = 0.0;
      definition.firing.temperature_K = value;
      break;
    case SweepParameter::heat_loss:
      if (!definition.firing.adiabatic) {
        throw units::InputError("--vary heat_loss: the case states a firing temperature; heat_loss applies only to "
                                "cases with firing.adiabatic: true");
      }
      definition.firing.heat_loss_fraction = value;
      break;
    case SweepParameter::air_preheat: definition.air.temperature_K = value; break;
    case SweepParameter::humidity:
      definition.air.relative_humidity = value;
      definition.air.humidity_ratio_kg_per_kg.reset();
      break;
    case SweepParameter::o2_enrichment: definition.air.o2_fraction = value; break;
    case SweepParameter::pressure: definition.firing.pressure_Pa = value; break;
    case SweepParameter::blend_fraction: {
      auto& blend = definition.fuel.fuel.blend;
      if (blend.size() < 2) {
        throw units::InputError("--vary blend_fraction: the case's fuel is not a blend (fuel.blend with two or more fuels)");
      }
      // The first component takes `value`; the others keep their proportions in the rest.
      double others = 0.0;
      for (std::size_t i = 1; i < blend.size(); ++i) others += blend[i].fraction;
      for (std::size_t i = 1; i < blend.size(); ++i) {
        blend[i].fraction = others > 0.0 ? blend[i].fraction / others * (1.0 - value)
                                         : (1.0 - value) / static_cast<double>(blend.size() - 1);
      }
      blend[0].fraction = value;
      break;
    }
    case SweepParameter::reference_o2:
      if (!(value >= 0.0 && value <= 0.2)) {
        throw units::InputError(fmt::format("--vary reference_o2 = {:.6g} %: must be between 0 % and 20 %", value * 100.0));
      }
      definition.report.reference_o2_fraction = value;
      break;
  }
}

std::vector<emissions::Caution> sweep_cautions(const CaseDefinition& definition, const std::vector<VarySpec>& vary) {
  std::vector<emissions::Caution> cautions(emissions::standard_cautions().begin(),
                                           emissions::standard_cautions().end());
  const auto moves_flame_temperature = [](const VarySpec& v) {
    switch (v.parameter) {
      case SweepParameter::excess_air:
      case SweepParameter::flue_o2:
      case SweepParameter::air_preheat:
      case SweepParameter::humidity:
      case SweepParameter::o2_enrichment:
      case SweepParameter::blend_fraction:
        return true;
      case SweepParameter::firing_temperature:
      case SweepParameter::heat_loss:
      case SweepParameter::pressure:
      case SweepParameter::reference_o2:
        return false;
    }
    return false;
  };
  if (!definition.firing.adiabatic && std::any_of(vary.begin(), vary.end(), moves_flame_temperature)) {
    cautions.push_back(emissions::Caution::sweep_fixed_temperature);
  }
  return cautions;
}

void check_sweep(const CaseDefinition& definition, const std::vector<VarySpec>& vary) {
  if (vary.empty()) throw units::InputError("--vary: give at least one, e.g. --vary excess_air=5%:45%:9");
  for (std::size_t i = 0; i < vary.size(); ++i) {
    for (std::size_t j = 0; j < i; ++j) {
      if (vary[i].parameter == vary[j].parameter) {
        throw units::InputError(fmt::format("--vary = \"{}\": {} is varied twice", vary[i].text,
                                            sweep_parameter_name(vary[i].parameter)));
      }
    }
    const bool operating = vary[i].parameter == SweepParameter::excess_air || vary[i].parameter == SweepParameter::flue_o2;
    for (std::size_t j = 0; j < i; ++j) {
      const bool other = vary[j].parameter == SweepParameter::excess_air || vary[j].parameter == SweepParameter::flue_o2;
      if (operating && other) {
        throw units::InputError(fmt::format("--vary = \"{}\": excess_air and flue_o2 both set the operating point; vary one",
                                            vary[i].text));
      }
    }
    if (vary[i].parameter == SweepParameter::heat_loss && vary.end() != std::find_if(vary.begin(), vary.end(), [](const VarySpec& v) {
          return v.parameter == SweepParameter::firing_temperature;
        })) {
      throw units::InputError("--vary heat_loss cannot go with --vary firing_temperature (one fixes the temperature)");
    }
    CaseDefinition copy = definition;
    apply_parameter(copy, vary[i].parameter, vary[i].values.front());
  }
}

std::size_t sweep_size(const std::vector<VarySpec>& vary) {
  std::size_t size = 1;
  for (const VarySpec& spec : vary) size *= spec.values.size();
  return vary.empty() ? 0 : size;
}

std::size_t checked_sweep_size(const std::vector<VarySpec>& vary, std::size_t max_points) {
  std::size_t total = 1;
  std::string grid;
  for (const VarySpec& spec : vary) {
    const std::size_t n = spec.values.size();
    total = (n != 0 && total > max_points / n) ? max_points + 1 : total * n;
    grid += (grid.empty() ? "" : " x ") + std::to_string(n);
  }
  if (total > max_points) {
    throw units::InputError(fmt::format("--vary: the grid of {} points exceeds the cap of {} points; use fewer STEPS, "
                                        "or raise the cap with --max-points",
                                        grid, max_points));
  }
  return total;
}

namespace {

std::vector<double> values_at(const std::vector<VarySpec>& vary, std::size_t index) {
  std::vector<double> values(vary.size());
  for (std::size_t k = vary.size(); k-- > 0;) {
    const std::size_t count = vary[k].values.size();
    values[k] = vary[k].values[index % count];
    index /= count;
  }
  return values;
}

// One worker's state between its points: its last point with a result (in the current batch, or
// `kept` across batches), whose stage results the next point keeps where it may.
struct WorkerState {
  const SweepPoint* previous = nullptr;
  std::optional<SweepPoint> kept;
};

// How a point runs after `previous`: from the first stage reading a parameter whose value changed,
// keeping the fuel unless the blend changed.
RunOptions point_options(const std::vector<VarySpec>& vary, const SweepPoint& point, const SweepPoint* previous) {
  RunOptions options;
  options.record_factors = false;
  options.full_report = false;
  if (previous == nullptr) return options;
  options.previous = &*previous->result;
  options.rerun_from = Stage::screening;
  options.keep_fuel = true;
  for (std::size_t k = 0; k < vary.size(); ++k) {
    if (point.values[k] == previous->values[k]) continue;
    options.rerun_from = std::min(options.rerun_from, first_stage_reading(vary[k].parameter));
    if (vary[k].parameter == SweepParameter::blend_fraction) options.keep_fuel = false;
  }
  // A repeated point (no change) still computes its figures.
  options.rerun_from = std::min(options.rerun_from, Stage::emissions);
  return options;
}

void run_point(const CaseDefinition& base, const std::vector<VarySpec>& vary, const core::SpeciesDatabase& database,
               const SourceMap* sources, SweepPoint& point, WorkerState& state) {
  try {
    CaseDefinition definition = base;
    for (std::size_t k = 0; k < vary.size(); ++k) apply_parameter(definition, vary[k].parameter, point.values[k]);
    point.result = run_case(std::move(definition), database, point_options(vary, point, state.previous));
    state.previous = &point;
  } catch (const std::exception& error) {
    point.error = sources != nullptr ? sources->locate(error.what()) : error.what();
  }
}

}  // namespace

std::size_t run_sweep(const CaseDefinition& base, const std::vector<VarySpec>& vary, const core::SpeciesDatabase& database,
                      const std::function<void(const SweepPoint&)>& sink, const SweepOptions& options) {
  check_sweep(base, vary);
  const std::size_t total = sweep_size(vary);
  const unsigned threads = std::max(1u, options.threads != 0 ? options.threads : std::thread::hardware_concurrency());
  const std::size_t batch_points = std::max<std::size_t>(options.batch_points, threads);
  std::vector<WorkerState> workers_state(threads);
  std::vector<SweepPoint> batch;
  std::size_t failed = 0;
  for (std::size_t start = 0; start < total; start += batch_points) {
    const std::size_t count = std::min(batch_points, total - start);
    batch.assign(count, SweepPoint{});
    for (std::size_t i = 0; i < count; ++i) {
      batch[i].index = start + i;
      batch[i].values = values_at(vary, start + i);
    }
    const std::size_t slice = (count + threads - 1) / threads;
    std::vector<std::thread> workers;
    for (unsigned t = 0; t < threads; ++t) {
      const std::size_t begin = t * slice;
      const std::size_t end = std::min(count, begin + slice);
      if (begin >= end) break;
      workers.emplace_back([&, t, begin, end] {
        WorkerState& state = workers_state[t];
        for (std::size_t i = begin; i < end; ++i) run_point(base, vary, database, options.sources, batch[i], state);
        // The batch is handed to the sink next: keep a copy of the last point for the next batch.
        if (state.previous != nullptr && !(state.kept && state.previous == &*state.kept)) {
          state.kept = *state.previous;
          state.previous = &*state.kept;
        }
      });
    }
    for (std::thread& worker : workers) worker.join();
    for (const SweepPoint& point : batch) {
      if (!point.result) ++failed;
      sink(point);
    }
    if (options.progress) options.progress(start + count, total);
  }
  return failed;
}

}  // namespace stackbound::cases
