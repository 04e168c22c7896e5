#pragma once
// Loading the `readings` section of a case file (docs/case-file.md): every column mapping, unit and
// basis parsed and checked at load, errors at file:line:column naming the field.

#include "stackbound/cases/readings_spec.hpp"
#include "stackbound/cases/yaml_reader.hpp"
#include "stackbound/units/normal_conditions.hpp"

namespace stackbound::cases {

// `normal`: the report's normal conditions, for mass units that name none.
ReadingsSpec readings_section(const YamlField& readings, const units::NormalConditions& normal);

}  // namespace stackbound::cases
