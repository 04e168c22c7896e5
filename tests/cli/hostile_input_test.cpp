// Hostile command lines and input files: bounded work, refused before anything runs, with a message
// that names the field, the value and what is accepted.

#include <gtest/gtest.h>
#include <unistd.h>

#include <filesystem>
#include <fstream>
#include <string>

#include "stackbound/cases/input_file.hpp"
#include "tests/support/run_binary.hpp"

namespace stackbound::cli {
namespace {

namespace fs = std::filesystem;
using testing::run_stackbound;

const std::string kGasBoiler = std::string(STACKBOUND_SOURCE_DIR) + "/cases/examples/gas_boiler.yaml";

// Wrong if a grid of 10^9 points were accepted (it streamed until the disk filled).
TEST(HostileInput, SweepGridAboveTheCapIsRefusedBeforeAnyWork) {
  const auto run = run_stackbound({"sweep", kGasBoiler, "--vary", "excess_air=5%:45%:31623", "--vary",
                                   "heat_loss=0%:20%:31623"});
  EXPECT_EQ(run.exit_code, 2);
  EXPECT_EQ(run.out, "") << "no partial output";
  EXPECT_NE(run.err.find("--vary: the grid of 31623 x 31623 points exceeds the cap of 10000000 points; use fewer "
                         "STEPS, or raise the cap with --max-points"),
            std::string::npos)
      << run.err;
}

// Wrong if the cap counted points wrongly (a product that overflowed would pass), or could not be lowered.
TEST(HostileInput, SweepCapIsOverridableAndSaturatesInsteadOfOverflowing) {
  const auto small = run_stackbound({"sweep", kGasBoiler, "--vary", "excess_air=5%:45%:3", "--max-points", "2"});
  EXPECT_EQ(small.exit_code, 2);
  EXPECT_NE(small.err.find("the grid of 3 points exceeds the cap of 2 points"), std::string::npos) << small.err;
  const std::string big = "=5%:45%:1000000";
  const auto huge = run_stackbound({"sweep", kGasBoiler, "--vary", "excess_air" + big, "--vary", "heat_loss=0%:20%:1000000",
                                    "--vary", "humidity=0%:50%:1000000", "--vary", "air_preheat=20degC:300degC:1000000"});
  EXPECT_EQ(huge.exit_code, 2);
  EXPECT_NE(huge.err.find("1000000 x 1000000 x 1000000 x 1000000 points exceeds the cap"), std::string::npos) << huge.err;
}

// Wrong if /dev/zero were read (16 s and a bare bad_alloc before) or a directory called "not a YAML mapping".
TEST(HostileInput, CaseFileMustBeARegularFile) {
  const auto device = run_stackbound({"run", "/dev/zero"});
  EXPECT_EQ(device.exit_code, 2);
  EXPECT_NE(device.err.find("CASE = \"/dev/zero\": is not a regular file (a device or a pipe); give a case file"),
            std::string::npos)
      << device.err;
  const auto directory = run_stackbound({"run", STACKBOUND_SOURCE_DIR});
  EXPECT_EQ(directory.exit_code, 2);
  EXPECT_NE(directory.err.find("is a directory; give the case file itself"), std::string::npos) << directory.err;
  const auto missing = run_stackbound({"run", "/nonexistent/boiler.yaml"});
  EXPECT_EQ(missing.exit_code, 2);
  EXPECT_NE(missing.err.find("CASE = \"/nonexistent/boiler.yaml\": no such case file"), std::string::npos) << missing.err;
}

// Wrong if a 50 MB case file were read and parsed: the cap is stated in the message.
TEST(HostileInput, CaseFileAboveTheSizeCapIsRefused) {
  std::string name = (fs::temp_directory_path() / "stackbound_big_case_XXXXXX").string();
  const int descriptor = ::mkstemp(name.data());
  ASSERT_GE(descriptor, 0);
  ::close(descriptor);
  {
    std::ofstream out(name);
    out << "# " << std::string(cases::kMaxInputFileBytes, 'x') << "\n";
  }
  const auto run = run_stackbound({"run", name});
  fs::remove(name);
  EXPECT_EQ(run.exit_code, 2);
  EXPECT_NE(run.err.find("bytes, more than the 1048576 bytes (1 MiB) an input file may hold"), std::string::npos)
      << run.err;
}

}  // namespace
}  // namespace stackbound::cli
