#pragma once
// The subcommands of the `stackbound` program. Each registers itself on the app; its callback does
// the work and throws units::InputError for bad input (main() prints it and exits with code 2).

#include <CLI/CLI.hpp>

#include "stackbound/cli/cli_support.hpp"

namespace stackbound::cli {

void add_species_command(CLI::App& app, const GlobalOptions& global);
void add_equilibrium_command(CLI::App& app, const GlobalOptions& global);
void add_run_command(CLI::App& app, const GlobalOptions& global);
void add_compare_command(CLI::App& app, const GlobalOptions& global);
void add_sweep_command(CLI::App& app, const GlobalOptions& global);
void add_convert_command(CLI::App& app, const GlobalOptions& global);
void add_fuel_command(CLI::App& app, const GlobalOptions& global);
void add_reduce_command(CLI::App& app, const GlobalOptions& global);

}  // namespace stackbound::cli
