#pragma once
// The one exception type for bad input: case files, command-line options, unit text, species names.
// Its message names the field, the value and the rule it broke, e.g.
//   boiler.yaml:14:18: firing.excess_air = "-5 %": must be >= 0 %

#include <stdexcept>
#include <string>

namespace stackbound::units {

class InputError : public std::runtime_error {
 public:
  using std::runtime_error::runtime_error;
};

}  // namespace stackbound::units
