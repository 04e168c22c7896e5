#pragma once
// Umbrella header of the units layer.
#include "stackbound/units/constants.hpp"
#include "stackbound/units/input_error.hpp"
#include "stackbound/units/normal_conditions.hpp"
#include "stackbound/units/quantities.hpp"
#include "stackbound/units/quantity_parser.hpp"
#include "stackbound/units/warning.hpp"
#include "stackbound/units/nearest_name.hpp"
