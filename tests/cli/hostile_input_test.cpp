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

namespace stackbound::cli {
namespace {

// Wrong if `equilibrium` at 1e308 Pa returned H2O2 mole fraction 1 after 0 iterations, or `fuel --rate
// "1e308 kg/h"` printed inf: both refused with the accepted range.
TEST(HostileInput, CommandLinePressuresAndRatesOutsideThePlausibleRangesAreRefused) {
  const auto eq = testing::run_stackbound(
      {"equilibrium", "--feed", "CH4 + 2 O2 + 7.52 N2", "--temperature", "2000K", "--pressure", "1e308 Pa"});
  EXPECT_EQ(eq.exit_code, 2);
  EXPECT_NE(eq.err.find("--pressure = \"1e308 Pa\": outside 1 kPa to 10000 kPa"), std::string::npos) << eq.err;
  const auto fuel = testing::run_stackbound({"fuel", "--preset", "natural_gas", "--rate", "1e308 kg/h"});
  EXPECT_EQ(fuel.exit_code, 2);
  EXPECT_NE(fuel.err.find("--rate = \"1e308 kg/h\": outside 1e-07 kg/s to 10000 kg/s, the range this tool accepts for a fuel feed"),
            std::string::npos)
      << fuel.err;
  EXPECT_EQ(fuel.out.find("inf"), std::string::npos);
}

}  // namespace
}  // namespace stackbound::cli

namespace stackbound::cli {
namespace {

// Wrong if a feed of only C(gr) named an option (--species = "(all)") the user never gave.
TEST(HostileInput, AFeedWithoutAnyGasSaysSoWithoutNamingAnOptionNotGiven) {
  const auto run = testing::run_stackbound({"equilibrium", "--feed", "C(gr)", "--temperature", "1800K"});
  EXPECT_EQ(run.exit_code, 2);
  EXPECT_NE(run.err.find("feed: its elements (C) form no gas species in the species data, and the equilibrium needs "
                         "a gas phase; add a gas to the feed (e.g. O2 or N2)"),
            std::string::npos)
      << run.err;
  EXPECT_EQ(run.err.find("--species"), std::string::npos) << run.err;
}

// Wrong if the excess-air message contradicted itself ("-75 %: must be between -75 % and 1000 %").
TEST(HostileInput, TheExcessAirBoundIsStatedAsExclusive) {
  std::string name = (std::filesystem::temp_directory_path() / "stackbound_ea_XXXXXX").string();
  const int descriptor = ::mkstemp(name.data());
  ASSERT_GE(descriptor, 0);
  ::close(descriptor);
  std::ofstream(name) << "case:\n  title: t (invented)\nfuel:\n  preset: natural_gas\n  feed_rate: 100 Nm3/h\n"
                         "operating_point:\n  excess_air: -75 %\nfiring:\n  temperature: 1800 K\n";
  const auto run = testing::run_stackbound({"run", name});
  std::filesystem::remove(name);
  EXPECT_EQ(run.exit_code, 2);
  EXPECT_NE(run.err.find(":7:15: operating_point.excess_air = \"-75 %\": must be above -75 % (a mixture 4 times "
                         "richer than stoichiometric) and at most 1000 %"),
            std::string::npos)
      << run.err;
}

// Wrong if an argument with an invalid byte or a control character ran: it could reach a report or a
// JSON document, which refuses such bytes.
TEST(HostileInput, ArgumentsThatAreNotPlainTextAreRefusedBeforeAnythingRuns) {
  const auto invalid = run_stackbound({"run", kGasBoiler, "--format", "js\xffon"});
  EXPECT_EQ(invalid.exit_code, 2);
  EXPECT_EQ(invalid.out, "");
  EXPECT_NE(invalid.err.find("command-line argument 4 \"js\\xffon\": byte 0xFF is not valid UTF-8 (byte 3); type it as "
                             "UTF-8 text"),
            std::string::npos)
      << invalid.err;
  const auto control = run_stackbound({"convert", "12\x01 ppm", "NO"});
  EXPECT_EQ(control.exit_code, 2);
  EXPECT_NE(control.err.find("control character U+0001"), std::string::npos) << control.err;
}

}  // namespace
}  // namespace stackbound::cli
