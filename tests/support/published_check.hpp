#pragma once
// Records a check against a published value, so that docs/validation.md can list it with the tool's
// value (scripts/validation-table builds the table from the reference tests' JSON output; the CTest
// test validation.table_is_current fails when the committed table and the tests disagree).
//
// Use beside the assertion, with the same numbers:
//   record_published_check({"log10 Kf, CO2(g)", "2000 K, 1 bar", "10.351", "NIST-JANAF 4th ed., table C-095",
//                           "0.005 absolute (data-set difference)", tool_value});
//   EXPECT_TRUE(is_close(tool_value, 10.351, 0.0, 0.005));

#include <cmath>
#include <string>

#include <fmt/format.h>
#include <gtest/gtest.h>

#include <nlohmann/json.hpp>

namespace stackbound::testing {

struct PublishedCheck {
  std::string quantity;    // what is compared, e.g. "adiabatic flame temperature, CH4-air"
  std::string conditions;  // e.g. "phi = 1, 298.15 K, 1 atm"
  std::string published;   // the published figure as printed, with its unit: "2226 K"
  std::string source;      // the source, precise: "Turns, An Introduction to Combustion, 3rd ed., Table B.1 (from memory)"
  std::string tolerance;   // pass criterion and why: "15 K (handbook rounding, data-set difference)"
  double tool_value = 0.0; // the tool's value, in the unit of `published`
};

inline void record_published_check(const PublishedCheck& check) {
  const nlohmann::json value = {{"quantity", check.quantity},   {"conditions", check.conditions},
                                {"published", check.published}, {"source", check.source},
                                {"tolerance", check.tolerance},  {"tool", fmt::format("{:.6g}", check.tool_value)}};
  // The key is unique per check within a test: a repeated key would overwrite an earlier check.
  // GoogleTest writes keys unescaped, so quotes and backslashes are replaced; values are ASCII-escaped
  // JSON because GoogleTest escapes every byte above 127 on its own.
  std::string key = "check: " + check.quantity + " | " + check.conditions;
  for (char& c : key) {
    if (c == '"' || c == '\\') c = '\'';
  }
  ::testing::Test::RecordProperty(key, value.dump(-1, ' ', true));
}

}  // namespace stackbound::testing
