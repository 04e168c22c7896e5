#pragma once
// The F-factors a run's rates per heat input use (report.f_factors): the fuel's own, computed from its
// composition by the Method 19 definitions (the default); the published defaults of Method 19 Table
// 19-2 for the fuel's type; or the case's own. The report names which.

#include <string>

#include "stackbound/cases/case_definition.hpp"
#include "stackbound/core/combustion.hpp"
#include "stackbound/emissions/emission_rate.hpp"

namespace stackbound::cases {

struct FFactorsUsed {
  emissions::FFactor fd{emissions::FFactorKind::dry, 0.0};
  emissions::FFactor fw{emissions::FFactorKind::wet, 0.0};
  emissions::FFactor fc{emissions::FFactorKind::carbon, 0.0};
  FFactorChoice choice = FFactorChoice::computed;
  std::string source;  // for the report, e.g. "published: US EPA Method 19 ..., natural gas"
};

std::string_view f_factor_choice_name(FFactorChoice choice);  // "computed", "published", "stated"

// `computed`: the fuel's (core::f_factors). Throws units::InputError naming report.f_factors when the
// published table is asked for a fuel that is not a preset with an entry and no entry is named.
FFactorsUsed choose_f_factors(const FFactorSpec& spec, const FuelSpec& fuel, const core::FFactors& computed);

}  // namespace stackbound::cases
