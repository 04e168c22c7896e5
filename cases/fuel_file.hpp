#pragma once
// A fuel file: a YAML document whose one top-level key `fuel:` holds a fuel exactly as the `fuel`
// section of a case file does (docs/case-file.md): `preset`, `gas`, `ultimate` or `blend`, with
// their options, and optionally `feed_rate` and `temperature`. Errors name the file, line and
// column, the field path, the value and what is accepted.

#include <optional>
#include <string>
#include <string_view>

#include <yaml-cpp/yaml.h>

#include "stackbound/core/fuel.hpp"
#include "stackbound/core/species_database.hpp"
#include "stackbound/units/quantity_parser.hpp"

namespace stackbound::cases {

struct FuelFile {
  core::Fuel fuel;
  std::optional<units::ParsedQuantity> feed_rate;  // mass flow, molar flow or heat input
  std::string feed_rate_text;                      // as written, with its location
  std::optional<double> temperature_K;             // fuel temperature at the burner
};

// Parses fuel-file text; `origin` is the file name used in messages.
FuelFile parse_fuel_file(std::string_view text, const std::string& origin, const core::SpeciesDatabase& database);

// The same for a document built in memory (the Python module's dict); errors read "<origin>: <field path> ...".
FuelFile read_fuel_document(const YAML::Node& document, const std::string& origin, const core::SpeciesDatabase& database);

// Reads and parses a fuel file; a file that cannot be read is an InputError naming the path.
FuelFile read_fuel_file(const std::string& path, const core::SpeciesDatabase& database);

}  // namespace stackbound::cases
