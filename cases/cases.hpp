#pragma once
// Umbrella header of the cases layer: case files, species and fuel files, the runner and its report,
// sweeps. (The command-line subcommands are in cases/commands.hpp, for the program only.)
#include "stackbound/cases/case_definition.hpp"
#include "stackbound/cases/case_file.hpp"
#include "stackbound/cases/fuel_file.hpp"
#include "stackbound/cases/fuel_spec.hpp"
#include "stackbound/cases/run_metrics.hpp"
#include "stackbound/cases/run_report.hpp"
#include "stackbound/cases/runner.hpp"
#include "stackbound/cases/species_file.hpp"
#include "stackbound/cases/sweep.hpp"
#include "stackbound/cases/yaml_reader.hpp"
