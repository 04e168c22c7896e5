#pragma once
// The `readings` section of a case file, typed at load (readings_section.hpp): how the columns of an
// analyser-data CSV map to quantities, with their units and bases. Plain data; the reduction
// (reduction.hpp) reads it as it is. Field-by-field documentation: docs/case-file.md, "readings".

#include <array>
#include <cstddef>
#include <optional>
#include <string>
#include <vector>

#include "stackbound/emissions/basis.hpp"
#include "stackbound/emissions/fo_factor.hpp"
#include "stackbound/emissions/pollutant.hpp"

namespace stackbound::cases {

// What a column holds. Values are stored per reading in this order.
enum class ReadingSlot : std::size_t {
  o2,                   // fraction of the gas on its stated basis (wet or dry)
  co2,                  // likewise
  co,                   // a concentration in the column's unit, on its stated basis
  no,
  nox,
  so2,
  moisture,             // H2O mole fraction of the wet gas
  flow,                 // stack gas flow as an amount rate, mol/s (from Nm3/h ...), on its stated wet/dry basis
  load,                 // W or a fraction (as stated), reported; 0 marks the unit as not operating
  ambient_temperature,  // K
  ambient_pressure,     // Pa
  ambient_humidity,     // relative humidity, fraction
  inlet_pressure,       // gas-turbine combustor inlet, Pa
};
inline constexpr std::size_t kReadingSlots = 13;

// One mapped quantity: a CSV column or a stated constant, converted to the slot's unit by
// si = raw * scale + offset.
struct ReadingSource {
  std::string key;                     // "nox"
  std::string field;                   // "readings.nox", for messages
  std::string column;                  // header name; empty when `constant` is stated
  std::optional<double> constant;      // `value:` in the slot's unit
  double scale = 1.0;
  double offset = 0.0;
  std::string unit;                    // as written ("ppm", "%", "Nm3/h")
};

// A mapped pollutant: its concentration basis as stated.
struct PollutantReading {
  ReadingSlot slot = ReadingSlot::co;
  emissions::Pollutant pollutant;
  emissions::Basis basis;              // the column's unit, wet/dry, diluent level (usually as measured)
};

struct ReadingTimeSpec {
  std::string column;
  std::string zone = "UTC";            // IANA name ("Europe/Berlin") or UTC; a time with an offset is taken as is
  std::string format;                  // empty: ISO 8601; else a date::parse format ("%d.%m.%Y %H:%M")
};

struct ReadingStatusSpec {
  std::string column;
  std::vector<std::string> exclude;       // values whose readings are left out of the averages
  std::vector<std::string> calibration;   // of those, values that mark calibration or maintenance (60.13(h)(2))
};

struct ReadingsSpec {
  ReadingTimeSpec time;
  std::array<std::optional<ReadingSource>, kReadingSlots> sources;  // by ReadingSlot
  bool o2_dry = true;                  // basis of the O2 column
  bool co2_dry = true;
  bool flow_dry = false;               // basis of the flow column
  std::vector<PollutantReading> pollutants;  // in slot order
  std::optional<ReadingStatusSpec> status;
  double interval_s = 60.0;            // the logging interval: expected readings per period, gaps
  char delimiter = ',';
  // Fo range of the fuel type (Method 3B); nullopt: the fuel preset's, if any.
  std::optional<emissions::FoRange> fo_range;
  // Gas turbines: the reference combustor-inlet pressure of 40 CFR 60.335(b)(1), Pa.
  std::optional<double> reference_inlet_pressure_Pa;

  [[nodiscard]] const std::optional<ReadingSource>& source(ReadingSlot slot) const {
    return sources[static_cast<std::size_t>(slot)];
  }
};

}  // namespace stackbound::cases
