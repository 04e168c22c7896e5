#pragma once
// Screening of a concentration or a rate against a limit stated in any basis: the value is converted
// to the limit's unit and basis (emissions/concentration.hpp), then
//   margin = limit - value   (positive: below the limit)      fraction of limit = value / limit.
// The wording always reads "screening against the stated limit" and never calls anything compliant:
// a screening compares two numbers; compliance is determined by the permit's test methods, averaging
// periods and the regulator.

#include <string>
#include <string_view>
#include <vector>

#include "stackbound/emissions/concentration.hpp"
#include "stackbound/emissions/emission_rate.hpp"
#include "stackbound/units/quantities.hpp"

namespace stackbound::emissions {

enum class ScreeningOutcome { below_limit, at_limit, above_limit };
std::string_view screening_outcome_name(ScreeningOutcome outcome);  // "below the stated limit", ...

struct ScreeningResult {
  double value = 0.0;              // in the limit's unit and basis
  double limit = 0.0;
  std::string unit;                // the limit's unit: "mg/Nm3", "kg/h", "lb/MMBtu"
  std::string basis;               // the limit's basis text ("" for rates)
  double margin = 0.0;             // limit - value, in `unit`
  double fraction_of_limit = 0.0;  // value / limit
  ScreeningOutcome outcome = ScreeningOutcome::below_limit;
  std::vector<AppliedFactor> factors;  // the conversion of the value to the limit's basis
  // "Screening against the stated limit: 42.6 mg/Nm3 is 42.6 % of the stated limit 100 mg/Nm3 (dry,
  //  O2=3%, normal=0C); margin 57.4 mg/Nm3 below it. Not a compliance determination."
  std::string wording;
};

// Within this relative distance of the limit the outcome is "at the stated limit".
inline constexpr double kAtLimitRelative = 1e-9;

// A concentration against a concentration limit of the same pollutant (limit value > 0).
ScreeningResult screen_concentration(const Concentration& value, const Concentration& limit,
                                     const ConcentrationContext& context);

// A rate limit as written: mass rates (kg/h, kg/s, g/s, t/h, t/d, t/yr, lb/h, lb/hr), rates per heat
// input (lb/MMBtu, g/GJ, ng/J, mg/MJ), rates per useful output (mg/kWh, g/MWh).
enum class RateKind { mass_flow, per_heat_input, per_useful_output };
struct RateLimit {
  RateKind kind = RateKind::mass_flow;
  double value = 0.0;     // as written, in `unit`
  std::string unit;
  double value_si = 0.0;  // kg/s, or kg/J of heat input, or kg/J of useful output
};
// "10 kg/h", "0.1 lb/MMBtu", "30 g/GJ", "250 mg/kWh". Value > 0. Throws units::InputError naming the
// field and the accepted units.
RateLimit parse_rate_limit(std::string_view text, std::string_view field);

// A rate against a rate limit of the same kind (InputError otherwise).
ScreeningResult screen_mass_rate(units::MassFlow rate, const RateLimit& limit);
ScreeningResult screen_heat_input_rate(const HeatInputRate& rate, const RateLimit& limit);
ScreeningResult screen_output_rate(const OutputRate& rate, const RateLimit& limit);

}  // namespace stackbound::emissions
