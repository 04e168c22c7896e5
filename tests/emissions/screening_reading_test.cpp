#include "stackbound/emissions/screening_reading.hpp"

#include <gtest/gtest.h>

#include <string>

namespace stackbound::emissions {
namespace {

constexpr auto kBelow = ScreeningOutcome::below_limit;
constexpr auto kAt = ScreeningOutcome::at_limit;
constexpr auto kAbove = ScreeningOutcome::above_limit;

// Wrong if a row's words did not name its source and outcome, or a ceiling below the limit did not say
// what that means (and, for CO, that it holds only for a well-mixed flame).
TEST(ScreeningReading, EachRowNamesItsSourceAndOutcome) {
  EXPECT_EQ(screening_reading(ScreeningSource::measured, kAbove, "NOx"), "measured above the stated limit");
  EXPECT_EQ(screening_reading(ScreeningSource::measured, kBelow, "CO"), "measured below the stated limit");
  EXPECT_EQ(screening_reading(ScreeningSource::estimate, kAt, "NO"), "estimate at the stated limit");
  EXPECT_EQ(screening_reading(ScreeningSource::ceiling, kAbove, "NOx"), "ceiling above the stated limit");
  EXPECT_EQ(screening_reading(ScreeningSource::ceiling, kBelow, "NOx"),
            "ceiling below the stated limit: not reachable at these conditions (screening)");
  EXPECT_EQ(screening_reading(ScreeningSource::ceiling, kBelow, "CO"),
            "ceiling below the stated limit: not reachable at these conditions in a well-mixed flame (screening)");
  EXPECT_EQ(screening_reading(ScreeningSource::bound, kBelow, "SO2"), "bound below the stated limit");
}

// Wrong if the JSON `source` values (a contract) changed.
TEST(ScreeningReading, SourceNamesAreTheJsonValues) {
  EXPECT_EQ(screening_source_name(ScreeningSource::measured), "measured");
  EXPECT_EQ(screening_source_name(ScreeningSource::estimate), "estimate");
  EXPECT_EQ(screening_source_name(ScreeningSource::ceiling), "ceiling");
  EXPECT_EQ(screening_source_name(ScreeningSource::bound), "bound");
}

// Wrong if the conclusion reassured where the ceiling reaches the limit, or stayed silent where the
// estimate itself is above it.
TEST(ScreeningReading, ConclusionFromTheModelAlone) {
  EXPECT_EQ(screening_conclusion({std::nullopt, kBelow, kAbove, kAbove}, "NOx"),
            "estimate below, ceiling above: cannot be ruled out by screening");
  EXPECT_EQ(screening_conclusion({std::nullopt, kBelow, kBelow, kAbove}, "NOx"),
            "ceiling below the stated limit: not reachable at these conditions (screening)");
  EXPECT_EQ(screening_conclusion({std::nullopt, kAbove, kAbove, kAbove}, "NOx"),
            "estimate above the stated limit: expected above it at these conditions (screening)");
  EXPECT_EQ(screening_conclusion({std::nullopt, kAt, kAbove, kAbove}, "NO"),
            "estimate at the stated limit: cannot be ruled out by screening");
  EXPECT_EQ(screening_conclusion({std::nullopt, kBelow, kAt, kAbove}, "NO"),
            "estimate below, ceiling above: cannot be ruled out by screening");
}

// Wrong if a pollutant without an estimate and a ceiling (NO2, SO2, or kinetics that could not run)
// were not concluded from its bound.
TEST(ScreeningReading, ConclusionFromTheBoundWhenThereIsNoEstimate) {
  EXPECT_EQ(screening_conclusion({std::nullopt, std::nullopt, std::nullopt, kBelow}, "SO2"),
            "bound below the stated limit: not reachable at these conditions (screening)");
  EXPECT_EQ(screening_conclusion({std::nullopt, std::nullopt, std::nullopt, kAbove}, "NO2"),
            "bound above the stated limit: cannot be ruled out by screening");
  EXPECT_EQ(screening_conclusion({std::nullopt, std::nullopt, std::nullopt, kBelow}, "CO"),
            "bound below the stated limit: not reachable at these conditions in a well-mixed flame (screening)");
}

// Wrong if a measurement above the limit were outweighed by a model that cannot reach it: the
// measurement governs, and the conclusion says what the model leaves out.
TEST(ScreeningReading, MeasurementComesFirstAndGovernsOverTheModel) {
  EXPECT_EQ(screening_conclusion({kAbove, kBelow, kBelow, kBelow}, "CO"),
            "measured above the stated limit; ceiling below the stated limit: not reachable at these conditions in a "
            "well-mixed flame (screening); the measurement governs: the model leaves out poor mixing and quenching, "
            "which raise CO above every equilibrium figure");
  EXPECT_EQ(screening_conclusion({kAbove, kBelow, kBelow, kAbove}, "NOx"),
            "measured above the stated limit; ceiling below the stated limit: not reachable at these conditions "
            "(screening); the measurement governs: the model leaves out peak flame temperatures above the stated "
            "one, superequilibrium radicals and prompt NO");
  EXPECT_EQ(screening_conclusion({kAbove, kBelow, kAbove, kAbove}, "NOx"),
            "measured above the stated limit; estimate below, ceiling above: cannot be ruled out by screening");
  EXPECT_EQ(screening_conclusion({kBelow, kBelow, kAbove, kAbove}, "NOx"),
            "measured below the stated limit; estimate below, ceiling above: cannot be ruled out by screening");
}

// Wrong if any reading or conclusion called a result compliant.
TEST(ScreeningReading, NoWordsCallAnythingCompliant) {
  for (const ScreeningOutcome m : {kBelow, kAt, kAbove}) {
    for (const ScreeningOutcome c : {kBelow, kAt, kAbove}) {
      for (const char* pollutant : {"CO", "NOx"}) {
        EXPECT_EQ(screening_conclusion({m, kBelow, c, c}, pollutant).find("compliant"), std::string::npos);
        EXPECT_EQ(screening_reading(ScreeningSource::ceiling, c, pollutant).find("compliant"), std::string::npos);
      }
    }
  }
}

}  // namespace
}  // namespace stackbound::emissions
