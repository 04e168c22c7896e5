#pragma once
// The `fuel:` mapping of case files and fuel files: read and checked into a FuelSpec (plain data, so
// sweeps can change a blend fraction), then built into a core::Fuel by the resolve stage. Keys:
// docs/case-file.md, section `fuel`.

#include "stackbound/cases/case_definition.hpp"
#include "stackbound/cases/yaml_reader.hpp"
#include "stackbound/core/fuel.hpp"
#include "stackbound/core/species_database.hpp"

namespace stackbound::cases {

// Reads a fuel mapping. `blend_part`: a component of a blend (takes `fraction`, no `blend`, no feed
// keys); otherwise the top-level fuel, which also allows `feed_rate` and `temperature` (read by the
// caller). Throws units::InputError with file, line and column.
// True when the fuel's heating_value_basis states the basis of its measured heating value (an
// ultimate analysis with a heating_value).
bool heating_value_basis_applies(const FuelSpec& spec);

FuelSpec read_fuel_spec(const YamlField& fuel, bool blend_part);

// Builds the fuel. What the species data refuse (an unknown species or preset, percentages that do
// not sum to 100 %) is an InputError naming the field path ("fuel.gas: ..."; source_map.hpp).
core::Fuel build_fuel(const FuelSpec& spec, const core::SpeciesDatabase& database);

}  // namespace stackbound::cases
