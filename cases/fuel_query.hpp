#pragma once
// The `fuel` request of the front ends (the command line's options, the Python module's keyword
// arguments): a fuel burned completely with an oxidant at an operating point, and optionally the
// flows for a feed. The option texts are parsed and checked here, once; errors name the command-line
// option ("--excess-air = ..."). Method notes: docs/fuels.md.

#include <optional>
#include <string>
#include <string_view>

#include "stackbound/cases/fuel_file.hpp"
#include "stackbound/core/combustion.hpp"
#include "stackbound/core/species_database.hpp"

namespace stackbound::cases {

inline constexpr std::string_view kFuelCaution =
    "Caution: these are complete-combustion estimates from the stated fuel, oxidant and operating point, for\n"
    "screening; they are not measurements and not a compliance determination. Permits, regulators, local\n"
    "codes and licensed practice govern.";

// Option texts as given; empty means not given (the defaults are those of `stackbound fuel --help`).
struct FuelConditions {
  std::string excess_air;             // --excess-air; at most one of excess_air, lambda, phi, flue_o2
  std::string lambda;                 // --lambda
  std::string phi;                    // --phi
  std::string flue_o2;                // --flue-o2: the excess air is solved from it
  std::string flue_o2_basis = "dry";  // --flue-o2-basis: dry or wet
  std::string air_temperature;        // --air-temperature (default 25 degC)
  std::string relative_humidity;      // --relative-humidity, measured at ambient_temperature, ambient_pressure
  std::string ambient_temperature;    // --ambient-temperature (default 15 degC)
  std::string ambient_pressure;       // --ambient-pressure (default 1 atm)
  std::string humidity_ratio;         // --humidity-ratio: kg water per kg dry air
  std::string o2_enrichment;          // --o2-enrichment: dry O2 content of the oxidant
  std::string fuel_temperature;       // --fuel-temperature (default: the fuel file's, else 25 degC)
  std::string pressure;               // --pressure: flue gas pressure for the dew point (default 1 atm)
  std::string rate;                   // --rate: fuel feed (default: the fuel file's feed_rate, if any)
  std::string heat_basis = "hhv";     // --heat-basis of a heat-input rate: hhv or lhv
};

struct FuelAnswer {
  core::Fuel fuel;
  core::Oxidant oxidant;
  core::CombustionResult result;
  std::optional<core::CombustionRates> rates;  // with a feed rate
  std::string operating_point;                 // how it was given, and the excess air, lambda and phi
};

// Burns `supply` (a fuel file's fuel, feed rate and temperature, or a fuel alone) under `conditions`.
// Throws units::InputError naming the option.
FuelAnswer burn_fuel_query(const FuelFile& supply, const FuelConditions& conditions,
                           const core::SpeciesDatabase& database);

}  // namespace stackbound::cases
