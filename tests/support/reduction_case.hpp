#pragma once
// A small case file with a readings section, and a reduction of CSV text with it, for the tests of
// `reduce` (tests/cases/reduction_test.cpp, tests/reference/analyser_data_test.cpp).

#include <sstream>
#include <string>

#include "stackbound/cases/case_file.hpp"
#include "stackbound/cases/reduction.hpp"
#include "stackbound/cases/species_file.hpp"

namespace stackbound::testing {

// A methane boiler reported at 3 % O2 (21 % O2 basis), 0 degC normal conditions, a NOx limit of
// 100 mg/Nm3 at 3 % O2; `readings` is the body of the readings section (indented two spaces).
inline std::string reduction_case_text(const std::string& readings) {
  return "case:\n  title: test boiler\n  plant_type: ied-liquid-gaseous\n"
         "fuel:\n  gas: {CH4: 100 %}\n  feed_rate: 1 MW\n"
         "operating_point:\n  excess_air: 15 %\n"
         "firing:\n  temperature: 1700 K\n"
         "report:\n  reference_o2: 3 %\n  o2_basis: \"21\"\n  normal_conditions: 0C\n  pollutants: [CO, NOx]\n"
         "  limits:\n    - {pollutant: NOx, limit: \"100 mg/Nm3, dry, O2=3%\"}\n"
         "readings:\n" +
         readings;
}

// Columns time, O2, NOx (ppm dry), status with the CAL/FAULT statuses; `zone` of the time column.
inline std::string basic_readings(const std::string& zone = "UTC") {
  return "  time: {column: time, zone: " + zone + "}\n  o2: {column: O2, basis: dry}\n"
         "  nox: {column: NOx, unit: ppm, basis: dry}\n"
         "  status: {column: status, exclude: [CAL, FAULT], calibration: [CAL]}\n";
}

inline cases::ReductionDocument reduce_text(const std::string& case_text, const std::string& csv,
                                            cases::ReduceOptions options = {}) {
  const cases::CaseDefinition definition = cases::parse_case(case_text, "test.yaml");
  std::istringstream input(csv);
  return cases::reduce_readings(definition, cases::builtin_species(), input, "test.csv", options);
}

}  // namespace stackbound::testing
