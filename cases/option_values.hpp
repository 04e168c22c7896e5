#pragma once
// Values given as option text by a front end (command-line options, Python keyword arguments), parsed
// and checked once: a pressure within the tool's range, a comma-separated list of names.

#include <string>
#include <string_view>
#include <vector>

#include "stackbound/cases/plausible_ranges.hpp"
#include "stackbound/units/quantities.hpp"

namespace stackbound::cases {

// A pressure option parsed and checked against the range the tool accepts for it (plausible_ranges.hpp);
// InputError '<option> = "<text>": outside ...' otherwise.
units::Pressure checked_pressure(std::string_view text, std::string_view option, const PlausibleRange& range);

// Splits "CO2,CO, O2" into trimmed names; empty items are an InputError naming the option.
std::vector<std::string> split_list(std::string_view text, std::string_view option);

}  // namespace stackbound::cases
