#pragma once
// Umbrella header of the units layer.
#include "units/constants.hpp"
#include "units/input_error.hpp"
#include "units/normal_conditions.hpp"
#include "units/quantities.hpp"
#include "units/quantity_parser.hpp"
#include "units/nearest_name.hpp"
