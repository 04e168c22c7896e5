#include "stackbound/emissions/limit_screening.hpp"

#include <array>
#include <charconv>
#include <cmath>

#include <fmt/format.h>

#include "stackbound/units/constants.hpp"
#include "stackbound/units/input_error.hpp"

namespace stackbound::emissions {

namespace {

struct RateUnit {
  std::string_view symbol;
  RateKind kind;
  double to_si;
};

constexpr double kHour_s = 3600.0;
// A year of 8760 h for "t/yr" limits; common practice in permit arithmetic, no source.
constexpr double kYear_s = 8760.0 * kHour_s;
constexpr double kMMBtu_J = 1e6 * units::kBtuIT_J;

constexpr std::array<RateUnit, 16> kRateUnits{{
    {"kg/h", RateKind::mass_flow, 1.0 / kHour_s},
    {"kg/s", RateKind::mass_flow, 1.0},
    {"g/s", RateKind::mass_flow, 1e-3},
    {"t/h", RateKind::mass_flow, 1e3 / kHour_s},
    {"t/d", RateKind::mass_flow, 1e3 / 86400.0},
    {"t/yr", RateKind::mass_flow, 1e3 / kYear_s},
    {"lb/h", RateKind::mass_flow, units::kPound_kg / kHour_s},
    {"lb/hr", RateKind::mass_flow, units::kPound_kg / kHour_s},
    {"tpy", RateKind::mass_flow, 2000.0 * units::kPound_kg / kYear_s},  // US short tons per year
    {"lb/MMBtu", RateKind::per_heat_input, units::kPound_kg / kMMBtu_J},
    {"g/GJ", RateKind::per_heat_input, 1e-12},
    {"ng/J", RateKind::per_heat_input, 1e-12},
    {"mg/MJ", RateKind::per_heat_input, 1e-12},
    {"mg/kWh", RateKind::per_useful_output, 1e-6 / 3.6e6},
    {"g/MWh", RateKind::per_useful_output, 1e-3 / 3.6e9},
    {"lb/MWh", RateKind::per_useful_output, units::kPound_kg / 3.6e9},
}};

std::string kind_name(RateKind kind) {
  switch (kind) {
    case RateKind::mass_flow: return "a mass rate";
    case RateKind::per_heat_input: return "a rate per heat input";
    case RateKind::per_useful_output: return "a rate per useful output";
  }
  return "a rate";
}

std::string number_text(double value) { return fmt::format("{:.6g}", value); }

ScreeningResult assemble(double value, double limit, std::string unit, std::string basis,
                         std::vector<AppliedFactor> factors) {
  ScreeningResult result;
  result.value = value;
  result.limit = limit;
  result.unit = std::move(unit);
  result.basis = std::move(basis);
  result.margin = limit - value;
  result.fraction_of_limit = value / limit;
  result.factors = std::move(factors);
  if (std::abs(result.margin) <= kAtLimitRelative * limit) {
    result.outcome = ScreeningOutcome::at_limit;
  } else {
    result.outcome = result.margin > 0.0 ? ScreeningOutcome::below_limit : ScreeningOutcome::above_limit;
  }
  const std::string limit_text =
      result.basis.empty() ? fmt::format("{} {}", number_text(limit), result.unit)
                           : fmt::format("{} {} ({})", number_text(limit), result.unit, result.basis);
  std::string margin_text;
  switch (result.outcome) {
    case ScreeningOutcome::below_limit:
      margin_text = fmt::format("margin {} {} below it", number_text(result.margin), result.unit);
      break;
    case ScreeningOutcome::at_limit: margin_text = "at the stated limit"; break;
    case ScreeningOutcome::above_limit:
      margin_text = fmt::format("above it by {} {}", number_text(-result.margin), result.unit);
      break;
  }
  result.wording = fmt::format(
      "Screening against the stated limit: {} {} is {} % of the stated limit {}; {}. A screening comparison, not a "
      "compliance determination.",
      number_text(value), result.unit, number_text(result.fraction_of_limit * 100.0), limit_text, margin_text);
  return result;
}

ScreeningResult screen_rate(double value_si, RateKind kind, const RateLimit& limit, const std::string& method) {
  if (limit.kind != kind) {
    throw units::InputError(fmt::format("limit = \"{} {}\": is {}, but the value screened is {} ({})",
                                        number_text(limit.value), limit.unit, kind_name(limit.kind), kind_name(kind),
                                        method));
  }
  if (!std::isfinite(value_si) || value_si < 0.0) {
    throw units::InputError(fmt::format("screened rate = {}: must be a finite number >= 0", value_si));
  }
  const double factor = limit.value / limit.value_si;
  return assemble(value_si * factor, limit.value, limit.unit, "", {});
}

}  // namespace

std::string_view screening_outcome_name(ScreeningOutcome outcome) {
  switch (outcome) {
    case ScreeningOutcome::below_limit: return "below the stated limit";
    case ScreeningOutcome::at_limit: return "at the stated limit";
    case ScreeningOutcome::above_limit: return "above the stated limit";
  }
  return "screened";
}

ScreeningResult screen_concentration(const Concentration& value, const Concentration& limit,
                                     const ConcentrationContext& context) {
  if (value.pollutant().name != limit.pollutant().name) {
    throw units::InputError(fmt::format("limit: a limit for {} cannot screen a concentration of {}", limit.pollutant().name,
                                        value.pollutant().name));
  }
  if (!(limit.value() > 0.0)) {
    throw units::InputError(fmt::format("limit = {} {}: a limit must be above 0", limit.value(), limit.basis().unit.symbol));
  }
  Conversion converted = value.convert(limit.basis(), context);
  const std::string basis = limit.basis().text();
  return assemble(converted.result.value(), limit.value(), limit.basis().unit.symbol,
                  basis.substr(limit.basis().unit.symbol.size() + 2), std::move(converted.factors));
}

RateLimit parse_rate_limit(std::string_view text, std::string_view field) {
  std::string accepted;
  for (const RateUnit& unit : kRateUnits) {
    if (!accepted.empty()) accepted += ", ";
    accepted += unit.symbol;
  }
  const auto refuse = [&](const std::string& problem) {
    throw units::InputError(fmt::format("{} = \"{}\": {}; accepted units: {}", field, text, problem, accepted));
  };
  const auto first = text.find_first_not_of(" \t");
  if (first == std::string_view::npos) refuse("empty");
  const std::string_view body = text.substr(first);
  double number = 0.0;
  const auto [end, error] = std::from_chars(body.data(), body.data() + body.size(), number);
  if (error != std::errc() || end == body.data()) refuse("no number found");
  if (!std::isfinite(number) || number <= 0.0) refuse("a limit must be a finite number above 0");
  std::string_view unit = body.substr(static_cast<std::size_t>(end - body.data()));
  const auto unit_first = unit.find_first_not_of(" \t");
  if (unit_first == std::string_view::npos) refuse("a unit is required");
  unit = unit.substr(unit_first, unit.find_last_not_of(" \t") - unit_first + 1);
  for (const RateUnit& candidate : kRateUnits) {
    if (candidate.symbol == unit) return {candidate.kind, number, std::string(unit), number * candidate.to_si};
  }
  refuse(fmt::format("unknown rate unit \"{}\" (a concentration limit takes a concentration basis instead)", unit));
  return {};
}

ScreeningResult screen_mass_rate(units::MassFlow rate, const RateLimit& limit) {
  return screen_rate(rate.value(), RateKind::mass_flow, limit, "mass rate");
}

ScreeningResult screen_heat_input_rate(const HeatInputRate& rate, const RateLimit& limit) {
  return screen_rate(rate.kg_per_J, RateKind::per_heat_input, limit, rate.method);
}

ScreeningResult screen_output_rate(const OutputRate& rate, const RateLimit& limit) {
  return screen_rate(rate.kg_per_J, RateKind::per_useful_output, limit, rate.method);
}

}  // namespace stackbound::emissions
