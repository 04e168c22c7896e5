#pragma once
// The one tolerance helper of the test suites: relative closeness with an absolute floor near zero.
// Never compare floating output with EXPECT_EQ.

#include <cmath>
#include <string>

#include <gtest/gtest.h>

namespace stackbound::testing {

// |actual - expected| <= max(relative * |expected|, absolute)
inline ::testing::AssertionResult is_close(double actual, double expected, double relative, double absolute = 0.0) {
  const double allowed = std::max(relative * std::abs(expected), absolute);
  const double difference = std::abs(actual - expected);
  if (std::isfinite(actual) && difference <= allowed) return ::testing::AssertionSuccess();
  return ::testing::AssertionFailure() << "actual " << actual << " differs from expected " << expected << " by "
                                       << difference << " (allowed " << allowed << ")";
}

// Named tolerances used across the suites.
inline constexpr double kRoundTrip = 1e-12;  // a conversion and its inverse
inline constexpr double kExact = 1e-14;      // a defining value reproduced by arithmetic

}  // namespace stackbound::testing

// EXPECT_THROW with a check of the message text: the message must contain `fragment`.
#define EXPECT_THROW_WITH(statement, exception_type, fragment)                                   \
  do {                                                                                           \
    try {                                                                                        \
      statement;                                                                                 \
      ADD_FAILURE() << "expected " #exception_type " containing \"" << (fragment) << "\"";       \
    } catch (const exception_type& thrown_) {                                                    \
      EXPECT_NE(std::string(thrown_.what()).find(fragment), std::string::npos)                   \
          << "message was: " << thrown_.what() << "\nexpected to contain: " << (fragment);       \
    }                                                                                            \
  } while (false)
