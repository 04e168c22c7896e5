#pragma once
// A warning: an input that is legal but looks wrong (a fraction typed as a percent, a basis the run
// had to fill in). The run goes on; the warning names the field, the value as written and why it looks
// wrong, and every output carries it (report text, stderr, JSON `warnings`). Input that is wrong or
// lacks the context it needs is an error instead (input_error.hpp).

#include <string>

namespace stackbound::units {

struct Warning {
  std::string field;    // path of the field, e.g. "operating_point.flue_o2"
  std::string value;    // as written or as used, e.g. "0.03 %"; empty when the warning concerns no one value
  std::string message;  // why it looks wrong and what the run did

  friend bool operator==(const Warning&, const Warning&) = default;
};

// One line: `field = "value": message` (or `field: message` without a value).
inline std::string warning_text(const Warning& warning) {
  std::string text = warning.field;
  if (!warning.value.empty()) text += " = \"" + warning.value + "\"";
  return text + ": " + warning.message;
}

}  // namespace stackbound::units
