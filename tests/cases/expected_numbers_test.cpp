// The four example cases keep their numbers: every number of the stored JSON report
// (tests/cases/expected/*.json, written by `stackbound run EXAMPLE --format json`) is found at the
// same place in today's report and agrees within 1e-12 relative. A change to any of them must be
// deliberate: regenerate the stored file and say why in the commit.

#include <cmath>
#include <fstream>
#include <string>

#include <gtest/gtest.h>

#include <nlohmann/json.hpp>

#include "tests/support/run_binary.hpp"

namespace stackbound::cases {
namespace {

using nlohmann::json;

// Counts the numbers of `expected` compared against `actual`, reporting each that is missing or differs.
void compare_numbers(const json& expected, const json& actual, const std::string& path, int& compared) {
  if (expected.is_number()) {
    ++compared;
    ASSERT_TRUE(actual.is_number()) << path << ": expected a number, found " << actual.dump();
    const double want = expected.get<double>();
    const double got = actual.get<double>();
    const double scale = std::max(std::abs(want), 1e-300);
    EXPECT_LE(std::abs(got - want) / scale, 1e-12) << path << ": stored " << want << ", now " << got;
    return;
  }
  if (expected.is_object()) {
    for (const auto& [key, value] : expected.items()) {
      ASSERT_TRUE(actual.is_object() && actual.contains(key)) << path << "/" << key << " is missing";
      compare_numbers(value, actual.at(key), path + "/" + key, compared);
    }
  } else if (expected.is_array()) {
    ASSERT_TRUE(actual.is_array() && actual.size() == expected.size()) << path << ": array length changed";
    for (std::size_t i = 0; i < expected.size(); ++i) {
      compare_numbers(expected[i], actual[i], path + "/" + std::to_string(i), compared);
    }
  }
}

// Wrong if a refactoring (or anything else) moved a reported number of an example case.
TEST(ExpectedNumbers, ExampleReportsKeepEveryStoredNumber) {
  for (const char* name : {"gas_boiler", "oil_heater", "wood_chip_boiler", "gas_turbine"}) {
    const std::string source = STACKBOUND_SOURCE_DIR;
    const auto run = testing::run_stackbound({"run", source + "/cases/examples/" + name + ".yaml", "--format", "json"});
    ASSERT_EQ(run.exit_code, 0) << name << ": " << run.err;
    std::ifstream stored(source + "/tests/cases/expected/" + name + ".json");
    ASSERT_TRUE(stored) << "missing stored report for " << name;
    int compared = 0;
    compare_numbers(json::parse(stored), json::parse(run.out), name, compared);
    EXPECT_GT(compared, 100) << name << ": too few numbers compared";
  }
}

}  // namespace
}  // namespace stackbound::cases
