#pragma once
// Umbrella header of the cases layer: case files, species and fuel files, the runner and its report,
// sweeps. (The command-line subcommands are in cases/commands.hpp, for the program only.)
#include "cases/case_definition.hpp"
#include "cases/case_file.hpp"
#include "cases/fuel_file.hpp"
#include "cases/fuel_spec.hpp"
#include "cases/run_metrics.hpp"
#include "cases/run_report.hpp"
#include "cases/runner.hpp"
#include "cases/species_file.hpp"
#include "cases/sweep.hpp"
#include "cases/yaml_reader.hpp"
