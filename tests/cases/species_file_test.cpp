#include "stackbound/cases/species_file.hpp"

#include <gtest/gtest.h>

#include "tests/support/tolerance.hpp"
#include "stackbound/units/input_error.hpp"

namespace stackbound::cases {
namespace {

constexpr const char* kUserRecord = R"(schema: stackbound-species/1
species:
  - formula: "Xe"
    composition: {He: 1}
    phase: gas
    range_K: {low: 200.0, mid: 1000.0, high: 6000.0}
    below_mid: [2.5, 0, 0, 0, 0, -745.375, 5.0]
    above_mid: [2.5, 0, 0, 0, 0, -745.375, 5.0]
    source: invented test record
)";

// Wrong if a user file could not add a species to the built-in data.
TEST(SpeciesFile, UserRecordsAreAddedToTheBuiltinData) {
  const auto extra = parse_species_yaml(kUserRecord, "user.yaml");
  ASSERT_EQ(extra.size(), 1u);
  const core::SpeciesDatabase merged = builtin_species().with(extra);
  EXPECT_EQ(merged.size(), builtin_species().size() + 1);
  EXPECT_NE(merged.find("Xe"), nullptr);
}

// Wrong if errors in a species file lost their location.
TEST(SpeciesFile, ErrorsNameFileLineAndField) {
  std::string text = kUserRecord;
  text.replace(text.find("[2.5, 0, 0, 0, 0, -745.375, 5.0]"), 32, "[2.5, 0, 0]");
  EXPECT_THROW_WITH(parse_species_yaml(text, "user.yaml"), units::InputError,
                    "user.yaml:7:16: species Xe.below_mid: expected a list of 7 NASA coefficients");
}

TEST(SpeciesFile, UnknownElementIsRefused) {
  std::string text = kUserRecord;
  text.replace(text.find("{He: 1}"), 7, "{Xe: 1}");
  EXPECT_THROW_WITH(parse_species_yaml(text, "user.yaml"), units::InputError, "unknown element");
}

TEST(SpeciesFile, MissingFileIsNamed) {
  EXPECT_THROW_WITH(read_species_file("/nonexistent/x.yaml"), units::InputError,
                    "--species-file = \"/nonexistent/x.yaml\": no such species file");
}

}  // namespace
}  // namespace stackbound::cases
