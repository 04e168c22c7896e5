// Output files and standard output under hostile targets: nothing but a regular file (or a missing
// path) is ever replaced, a user's own files beside the target are left alone, no temporary file is
// left behind, and a failed write is an error, never exit 0.

#include <gtest/gtest.h>
#include <sys/stat.h>
#include <unistd.h>

#include <filesystem>
#include <fstream>
#include <iterator>
#include <string>

#include "tests/support/run_binary.hpp"

namespace stackbound::cli {
namespace {

namespace fs = std::filesystem;
using testing::run_stackbound;

std::string read_file(const fs::path& path) {
  std::ifstream in(path);
  return {std::istreambuf_iterator<char>(in), std::istreambuf_iterator<char>()};
}

void write_file(const fs::path& path, const std::string& text) { std::ofstream(path) << text; }

// A fresh, empty directory per test, removed at the end.
class OutputFile : public ::testing::Test {
 protected:
  void SetUp() override {
    std::string name = (fs::temp_directory_path() / "stackbound_output_test_XXXXXX").string();
    ASSERT_NE(::mkdtemp(name.data()), nullptr);
    directory_ = name;
  }
  void TearDown() override { fs::remove_all(directory_); }

  // Every entry of the directory except the named ones: a left-over temporary file shows here.
  std::size_t other_entries(std::initializer_list<std::string> known) const {
    std::size_t count = 0;
    for (const auto& entry : fs::directory_iterator(directory_)) {
      if (std::find(known.begin(), known.end(), entry.path().filename().string()) == known.end()) ++count;
    }
    return count;
  }

  static testing::ProcessResult species_to(const fs::path& output) {
    return run_stackbound({"species", "CO2", "--temperature", "1000K", "--format", "json", "--output", output.string()});
  }

  fs::path directory_;
};

// Wrong if a user's own FILE.partial were overwritten or consumed (the old fixed temporary name).
TEST_F(OutputFile, UsersOwnPartialFileBesideTheTargetIsLeftAlone) {
  write_file(directory_ / "out.json.partial", "mine");
  const auto run = species_to(directory_ / "out.json");
  ASSERT_EQ(run.exit_code, 0) << run.err;
  EXPECT_EQ(read_file(directory_ / "out.json.partial"), "mine");
  EXPECT_NE(read_file(directory_ / "out.json").find("cp_J_per_mol_K"), std::string::npos);
  EXPECT_EQ(other_entries({"out.json", "out.json.partial"}), 0U) << "a temporary file was left behind";
}

// Wrong if a symbolic link were replaced by a regular file: the link must stay and its target get the output.
TEST_F(OutputFile, SymbolicLinkIsFollowedAndKept) {
  write_file(directory_ / "real.json", "old");
  fs::create_symlink(directory_ / "real.json", directory_ / "link.json");
  const auto run = species_to(directory_ / "link.json");
  ASSERT_EQ(run.exit_code, 0) << run.err;
  EXPECT_TRUE(fs::is_symlink(directory_ / "link.json"));
  EXPECT_NE(read_file(directory_ / "real.json").find("cp_J_per_mol_K"), std::string::npos);
  EXPECT_EQ(other_entries({"real.json", "link.json"}), 0U);
}

// Wrong if a read-only file were silently replaced by a new writable one (as root, rename would do it).
TEST_F(OutputFile, ReadOnlyFileIsRefusedAndUnchanged) {
  const fs::path target = directory_ / "locked.json";
  write_file(target, "keep");
  fs::permissions(target, fs::perms::owner_read | fs::perms::group_read | fs::perms::others_read);
  const auto run = species_to(target);
  EXPECT_EQ(run.exit_code, 2);
  EXPECT_NE(run.err.find("--output = \"" + target.string() + "\": the file is read-only; it is not replaced"),
            std::string::npos)
      << run.err;
  EXPECT_EQ(read_file(target), "keep");
  EXPECT_EQ(other_entries({"locked.json"}), 0U);
}

// Wrong if a device were replaced by a regular file (it was, as root, with --output /dev/full): the link
// to /dev/full is followed, the device written directly, the write failure reported with exit 2.
TEST_F(OutputFile, DeviceIsWrittenDirectlyAndItsFailureReported) {
  ASSERT_TRUE(fs::is_character_file("/dev/full"));
  fs::create_symlink("/dev/full", directory_ / "full");
  const auto run = species_to(directory_ / "full");
  EXPECT_EQ(run.exit_code, 2);
  EXPECT_NE(run.err.find("writing failed"), std::string::npos) << run.err;
  EXPECT_TRUE(fs::is_symlink(directory_ / "full"));
  EXPECT_TRUE(fs::is_character_file("/dev/full"));
  EXPECT_EQ(other_entries({"full"}), 0U);
}

// Wrong if a directory given as the output were replaced or written into.
TEST_F(OutputFile, DirectoryIsRefused) {
  const auto run = species_to(directory_);
  EXPECT_EQ(run.exit_code, 2);
  EXPECT_NE(run.err.find("is a directory; give a file name"), std::string::npos) << run.err;
}

// What the shell prints for `script` (its stdout), read whole.
std::string shell_output(const std::string& script) {
  FILE* pipe = ::popen(script.c_str(), "r");
  if (pipe == nullptr) return "popen failed";
  std::string text;
  char buffer[4096];
  std::size_t count = 0;
  while ((count = std::fread(buffer, 1, sizeof buffer, pipe)) > 0) text.append(buffer, count);
  ::pclose(pipe);
  return text;
}

// Wrong if a failed write to standard output (a full disk) still exited 0.
TEST(StandardOutput, FailedWriteIsAnErrorWithExitCode2) {
  const std::string command = testing::shell_quote(STACKBOUND_BINARY) + " species >/dev/full 2>&1";
  const std::string text = shell_output(command + " ; echo \"exit=$?\"");
  EXPECT_NE(text.find("exit=2"), std::string::npos) << text;
}

// Wrong if a run with standard output closed still exited 0 (nothing was written, and nobody was told).
TEST(StandardOutput, ClosedStandardOutputIsAnErrorWithExitCode2) {
  const std::string command = testing::shell_quote(STACKBOUND_BINARY) + " species >&- 2>&1; echo \"exit=$?\"";
  const std::string text = shell_output("{ " + command + " ; } 3>&1");
  EXPECT_NE(text.find("exit=2"), std::string::npos) << text;
}

// Wrong if a command-line mistake exited with CLI11's own codes (105, 106, 109 ...) instead of 2.
TEST(CommandLine, ParseErrorsAndUnknownCommandsExit2AndNameTheProblem) {
  const auto unknown = run_stackbound({"frobnicate"});
  EXPECT_EQ(unknown.exit_code, 2);
  EXPECT_NE(unknown.err.find("frobnicate"), std::string::npos) << unknown.err;
  const auto missing = run_stackbound({"run"});
  EXPECT_EQ(missing.exit_code, 2);
  EXPECT_NE(missing.err.find("CASE"), std::string::npos) << missing.err;
  const auto bad_format = run_stackbound({"species", "--format", "xml"});
  EXPECT_EQ(bad_format.exit_code, 2);
  EXPECT_NE(bad_format.err.find("xml"), std::string::npos) << bad_format.err;
  const auto help = run_stackbound({"run", "--help"});
  EXPECT_EQ(help.exit_code, 0) << "--help is not an error";
}

}  // namespace
}  // namespace stackbound::cli
