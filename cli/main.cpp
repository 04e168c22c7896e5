// The `stackbound` command-line program.

#include <exception>
#include <iostream>

#include <CLI/CLI.hpp>

#include "stackbound/cli/commands.hpp"
#include "stackbound/units/input_error.hpp"

int main(int argc, char** argv) {
  namespace sb = stackbound::cli;
  CLI::App app{"stackbound - equilibrium-based emissions and stack-gas estimator.\n"
               "Results are equilibrium bounds at stated firing conditions, not measurements;\n"
               "permits, regulators, local codes and licensed practice govern."};
  app.require_subcommand(1);
  app.footer("Run `stackbound COMMAND --help` for a command's options and examples.");
  sb::GlobalOptions global;
  app.add_option("--species-file", global.species_file, "Extra species data (YAML, stackbound-species/1 schema)")
      ->check(CLI::ExistingFile);
  sb::add_run_command(app, global);
  sb::add_species_command(app, global);
  sb::add_sweep_command(app, global);
  sb::add_compare_command(app, global);
  sb::add_equilibrium_command(app, global);
  sb::add_convert_command(app, global);
  sb::add_fuel_command(app, global);
  try {
    app.parse(argc, argv);
  } catch (const CLI::ParseError& error) {
    return app.exit(error);
  } catch (const sb::PartialFailure& error) {
    std::cerr << "stackbound: " << error.what() << '\n';
    return 4;
  } catch (const stackbound::units::InputError& error) {
    std::cerr << "stackbound: error: " << error.what() << '\n';
    return 2;
  } catch (const std::exception& error) {
    std::cerr << "stackbound: failed: " << error.what() << '\n';
    return 3;
  }
  return 0;
}
