// Every example that a command's --help prints runs as printed: the help is where users copy command
// lines from, so an example in a notation no longer accepted, or naming a file that does not exist,
// is a bug.

#include "tests/support/help_examples.hpp"

#include <gtest/gtest.h>
#include <stdlib.h>

#include <algorithm>
#include <filesystem>
#include <fstream>
#include <iterator>
#include <stdexcept>
#include <string>
#include <vector>

#include "tests/support/run_binary.hpp"

namespace {

namespace fs = std::filesystem;
using stackbound::testing::ProcessResult;
using stackbound::testing::run_stackbound;

// The commands whose examples are run; the top-level help must list exactly these (a new command
// then has its examples run too).
const std::vector<std::string> kCommands = {"run", "species", "sweep", "compare", "equilibrium", "convert", "fuel", "reduce"};

std::string read_file(const fs::path& path) {
  std::ifstream in(path);
  return {std::istreambuf_iterator<char>(in), std::istreambuf_iterator<char>()};
}

void write_file(const fs::path& path, const std::string& text) { std::ofstream(path) << text; }

// A scratch folder in which the examples run as from the project's root: cases/ links to the
// project's case folder, and the files that examples only name as placeholders are written here.
// Output files of the examples land here and are removed with it.
class ExampleFolder {
 public:
  ExampleFolder() {
    std::string name = (fs::temp_directory_path() / "stackbound_help_examples_XXXXXX").string();
    if (::mkdtemp(name.data()) == nullptr) throw std::runtime_error("mkdtemp failed for " + name);
    path_ = name;
    const fs::path source = STACKBOUND_SOURCE_DIR;
    fs::create_directory_symlink(source / "cases", path_ / "cases");
    // `stackbound fuel my_fuel.yaml`: a `fuel:` mapping as in a case file.
    write_file(path_ / "my_fuel.yaml", "fuel:\n  name: site gas\n  gas: {CH4: 93 %, C2H6: 4 %, CO2: 1 %, N2: 2 %}\n");
    // `stackbound compare base.yaml low_excess_air.yaml`: a case and the same case at lower excess air.
    const std::string base = read_file(source / "cases/examples/gas_boiler.yaml");
    write_file(path_ / "base.yaml", base);
    std::string lower = base;
    const std::string excess_air = "excess_air: 15 %";
    const std::size_t at = lower.find(excess_air);
    if (at == std::string::npos) throw std::runtime_error("gas_boiler.yaml no longer holds \"" + excess_air + "\"");
    lower.replace(at, excess_air.size(), "excess_air: 8 %");
    write_file(path_ / "low_excess_air.yaml", lower);
  }
  ~ExampleFolder() {
    std::error_code ignored;
    fs::remove_all(path_, ignored);
  }
  ExampleFolder(const ExampleFolder&) = delete;
  ExampleFolder& operator=(const ExampleFolder&) = delete;

  [[nodiscard]] const fs::path& path() const { return path_; }

 private:
  fs::path path_;
};

std::string joined(const std::vector<std::string>& arguments) {
  std::string text = "stackbound";
  for (const std::string& argument : arguments) text += " " + argument;
  return text;
}

// Wrong if a command were added or removed without this test running its examples.
TEST(HelpExamples, TheTopLevelHelpListsTheCommandsWhoseExamplesAreRun) {
  const ProcessResult help = run_stackbound({"--help"});
  ASSERT_EQ(help.exit_code, 0) << help.err;
  EXPECT_EQ(stackbound::testing::help_subcommands(help.out), kCommands) << help.out;
}

class CommandHelp : public ::testing::TestWithParam<std::string> {};

// Wrong if a command's --help showed no example, or an example failed when run as printed.
TEST_P(CommandHelp, EveryExampleRunsAsPrinted) {
  const std::string& command = GetParam();
  const ProcessResult help = run_stackbound({command, "--help"});
  ASSERT_EQ(help.exit_code, 0) << help.err;
  const auto examples = stackbound::testing::help_examples(help.out, command);
  ASSERT_FALSE(examples.empty()) << "no example in:\n" << help.out;
  const ExampleFolder folder;
  for (const std::vector<std::string>& arguments : examples) {
    const ProcessResult run = run_stackbound(arguments, folder.path());
    EXPECT_EQ(run.exit_code, 0) << joined(arguments) << "\n" << run.err;
    const auto output = std::find(arguments.begin(), arguments.end(), "--output");
    if (output != arguments.end() && output + 1 != arguments.end()) {
      const fs::path file = folder.path() / *(output + 1);
      EXPECT_TRUE(fs::exists(file) && fs::file_size(file) > 0) << joined(arguments) << ": no output file";
    } else {
      EXPECT_FALSE(run.out.empty()) << joined(arguments) << ": nothing on stdout";
    }
  }
}

INSTANTIATE_TEST_SUITE_P(AllCommands, CommandHelp, ::testing::ValuesIn(kCommands),
                         [](const ::testing::TestParamInfo<std::string>& parameter) { return parameter.param; });

}  // namespace
