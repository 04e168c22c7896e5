#pragma once
// Runs the built `stackbound` binary as a user does: arguments, stdout, stderr and exit code.
// STACKBOUND_BINARY is defined by tests/CMakeLists.txt.

#include <sys/wait.h>
#include <unistd.h>

#include <array>
#include <cstdio>
#include <filesystem>
#include <fstream>
#include <iterator>
#include <string>
#include <vector>

#include <gtest/gtest.h>

namespace stackbound::testing {

struct ProcessResult {
  int exit_code = -1;
  std::string out;
  std::string err;
};

inline std::string shell_quote(const std::string& argument) {
  std::string quoted = "'";
  for (const char c : argument) quoted += c == '\'' ? std::string("'\\''") : std::string(1, c);
  return quoted + "'";
}

// Runs the stackbound binary with `arguments`, capturing stdout through the pipe and stderr in a file;
// in `working_directory` when one is given (relative paths in the arguments are then read from there).
inline ProcessResult run_stackbound(const std::vector<std::string>& arguments,
                                    const std::filesystem::path& working_directory = {}) {
  std::string err_template = (std::filesystem::temp_directory_path() / "stackbound_test_stderr_XXXXXX").string();
  const int err_descriptor = ::mkstemp(err_template.data());
  if (err_descriptor < 0) {
    ADD_FAILURE() << "mkstemp failed for " << err_template;
    return {};
  }
  ::close(err_descriptor);
  const std::filesystem::path err_file = err_template;
  std::string command;
  if (!working_directory.empty()) command = "cd " + shell_quote(working_directory.string()) + " && ";
  command += shell_quote(STACKBOUND_BINARY);
  for (const std::string& argument : arguments) command += " " + shell_quote(argument);
  command += " 2>" + shell_quote(err_file.string()) + " </dev/null";
  ProcessResult run;
  FILE* pipe = ::popen(command.c_str(), "r");
  if (pipe == nullptr) {
    ADD_FAILURE() << "popen failed: " << command;
    return run;
  }
  std::array<char, 4096> buffer{};
  std::size_t count = 0;
  while ((count = std::fread(buffer.data(), 1, buffer.size(), pipe)) > 0) run.out.append(buffer.data(), count);
  const int status = ::pclose(pipe);
  run.exit_code = WIFEXITED(status) ? WEXITSTATUS(status) : -1;
  std::ifstream err(err_file);
  run.err.assign(std::istreambuf_iterator<char>(err), std::istreambuf_iterator<char>());
  std::filesystem::remove(err_file);
  return run;
}

}  // namespace stackbound::testing
