// The `stackbound` command-line program.

#include <CLI/CLI.hpp>
#include <exception>
#include <iostream>
#include <string>
#include <vector>

#include "stackbound/cli/commands.hpp"
#include "stackbound/core/equilibrium.hpp"
#include "stackbound/units/input_error.hpp"
#include "stackbound/version.hpp"

int main(int argc, char** argv) {
  namespace sb = stackbound::cli;
  CLI::App app{"stackbound - equilibrium-based emissions and stack-gas estimator.\n"
               "Results are equilibrium bounds at stated firing conditions, not measurements;\n"
               "permits, regulators, local codes and licensed practice govern."};
  app.require_subcommand(1);
  app.set_version_flag("--version", std::string("stackbound ") + stackbound::kVersion, "Print the version and exit");
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
  sb::add_reduce_command(app, global);
  try {
    sb::require_plain_arguments(argc, argv);
    app.parse(argc, argv);
    sb::finish_standard_output();
  } catch (const CLI::CallForHelp& help) {
    return app.exit(help);
  } catch (const CLI::CallForAllHelp& help) {
    return app.exit(help);
  } catch (const CLI::CallForVersion& version) {
    return app.exit(version);
  } catch (const CLI::RequiredError& error) {
    // With no known command given, CLI11 says only "A subcommand is required": name what was typed.
    const std::vector<std::string> rest = app.remaining();
    if (app.get_subcommands().empty() && !rest.empty()) {
      std::string commands;
      for (const CLI::App* command : app.get_subcommands([](const CLI::App*) { return true; })) {
        commands += (commands.empty() ? "" : ", ") + command->get_name();
      }
      std::cerr << "stackbound: error: unknown command \"" << rest.front() << "\"; the commands are " << commands
                << " (stackbound --help)\n";
      return 2;
    }
    app.exit(error);
    return 2;
  } catch (const CLI::ParseError& error) {
    // Every command-line mistake (unknown command or option, a missing or malformed value) exits 2,
    // like any other input error; CLI11's message names what was wrong.
    app.exit(error);
    return 2;
  } catch (const sb::PartialFailure& error) {
    std::cerr << "stackbound: " << error.what() << '\n';
    return 4;
  } catch (const stackbound::units::InputError& error) {
    std::cerr << "stackbound: error: " << error.what() << '\n';
    return 2;
  } catch (const stackbound::core::ConvergenceError& error) {
    std::cerr << "stackbound: the equilibrium did not converge: " << error.what() << '\n';
    return 5;
  } catch (const std::exception& error) {
    // Anything else is a defect of the tool, never of the input: inputs are checked at load and
    // library exceptions are turned into located input errors there.
    std::cerr << "stackbound: internal error: " << error.what()
              << "\nThis is a defect of stackbound, not a problem with your input; nothing was written. "
                 "Please report it with the command line and input files.\n";
    return 3;
  }
  return 0;
}
