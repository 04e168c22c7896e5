#pragma once
// Umbrella header of the cases layer: case files, species and fuel files, the run's pipeline of
// stages and its report, sweeps, comparisons, and the report documents they end in (rendered by
// render/render.hpp).
#include "stackbound/cases/case_definition.hpp"
#include "stackbound/cases/case_file.hpp"
#include "stackbound/cases/comparison.hpp"
#include "stackbound/cases/f_factor_choice.hpp"
#include "stackbound/cases/fuel_file.hpp"
#include "stackbound/cases/fuel_spec.hpp"
#include "stackbound/cases/pipeline.hpp"
#include "stackbound/cases/report_document.hpp"
#include "stackbound/cases/run_document.hpp"
#include "stackbound/cases/run_metrics.hpp"
#include "stackbound/cases/run_warnings.hpp"
#include "stackbound/cases/source_map.hpp"
#include "stackbound/cases/species_file.hpp"
#include "stackbound/cases/stage_emissions.hpp"
#include "stackbound/cases/stage_fire.hpp"
#include "stackbound/cases/stage_resolve.hpp"
#include "stackbound/cases/stage_screening.hpp"
#include "stackbound/cases/stage_stack.hpp"
#include "stackbound/cases/sweep.hpp"
#include "stackbound/cases/yaml_reader.hpp"
