#pragma once
// Built-in typical fuels. Each is a set of TYPICAL values for its class, not the analysis of any real
// fuel lot; every preset carries its provenance (source, or "common practice, no source", or "from
// memory") in Fuel::source(). Permit work needs the plant's own fuel analysis.

#include <span>
#include <string>
#include <string_view>

#include "stackbound/core/fuel.hpp"

namespace stackbound::core {

struct FuelPreset {
  std::string_view key;          // command-line / case-file name: "natural_gas", "distillate_oil_no2" ...
  std::string_view description;  // one line for listings
  std::string_view source;       // provenance of the typical values
};

// The presets, in listing order.
std::span<const FuelPreset> fuel_presets();

// Builds the preset's Fuel (with its source attached). Throws units::InputError naming `field`, the
// key and the accepted keys (with a did-you-mean suggestion) for an unknown key.
Fuel preset_fuel(std::string_view key, const SpeciesDatabase& database, std::string_view field = "fuel.preset");

}  // namespace stackbound::core
