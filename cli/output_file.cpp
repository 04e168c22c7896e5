#include "stackbound/cli/output_file.hpp"

#include <fcntl.h>
#include <sys/stat.h>
#include <unistd.h>

#include <cerrno>
#include <climits>
#include <csignal>
#include <cstring>
#include <filesystem>

#include <fmt/format.h>

#include "stackbound/units/input_error.hpp"

namespace stackbound::cli {

namespace {

namespace fs = std::filesystem;

// The temporary file being written, for the SIGINT / SIGTERM handler. A signal handler can reach only
// static storage, so this is the program's one piece of global mutable state; the program writes one
// output file at a time.
char g_temporary[PATH_MAX] = {};
volatile std::sig_atomic_t g_armed = 0;

extern "C" void remove_temporary_and_reraise(int signal_number) {
  if (g_armed != 0) ::unlink(g_temporary);
  std::signal(signal_number, SIG_DFL);
  std::raise(signal_number);
}

void arm_signal_cleanup(const std::string& temporary) {
  if (temporary.size() >= sizeof g_temporary) return;  // mkstemp paths are far shorter than PATH_MAX
  std::memcpy(g_temporary, temporary.c_str(), temporary.size() + 1);
  g_armed = 1;
  struct sigaction action {};
  action.sa_handler = remove_temporary_and_reraise;
  sigemptyset(&action.sa_mask);
  ::sigaction(SIGINT, &action, nullptr);
  ::sigaction(SIGTERM, &action, nullptr);
}

void disarm_signal_cleanup() { g_armed = 0; }

std::string system_error_text() { return std::strerror(errno); }

// The file a path names once symbolic links are followed (the path itself when it is not a link).
std::string link_target(const std::string& path) {
  std::error_code error;
  const fs::path resolved = fs::weakly_canonical(fs::path(path), error);
  return error ? path : resolved.string();
}

// Permission bits a new file gets from the process's umask (mkstemp creates 0600).
mode_t new_file_mode() {
  const mode_t mask = ::umask(0);
  ::umask(mask);
  return 0666 & ~mask;
}

}  // namespace

OutputStream::OutputStream(const std::string& path) : path_(path) {
  if (path.empty() || path == "-") return;
  target_ = link_target(path);
  struct stat info {};
  const bool exists = ::stat(target_.c_str(), &info) == 0;
  if (exists && S_ISDIR(info.st_mode)) fail("is a directory; give a file name");
  if (exists && (S_ISCHR(info.st_mode) || S_ISFIFO(info.st_mode))) {
    file_ = std::fopen(target_.c_str(), "wb");
    if (file_ == nullptr) fail("cannot open it for writing (" + system_error_text() + ")");
    kind_ = Target::direct;
    return;
  }
  if (exists && !S_ISREG(info.st_mode)) fail("is neither a regular file, a character device nor a FIFO");
  if (exists && ((info.st_mode & 0222) == 0 || ::access(target_.c_str(), W_OK) != 0)) {
    fail("the file is read-only; it is not replaced (make it writable or choose another path)");
  }
  const fs::path directory = fs::path(target_).parent_path();
  std::string name = (directory / ("." + fs::path(target_).filename().string() + ".stackbound-XXXXXX")).string();
  const int descriptor = ::mkstemp(name.data());
  if (descriptor < 0) fail("cannot create a temporary file in its directory (" + system_error_text() + ")");
  ::fchmod(descriptor, exists ? (info.st_mode & 07777) : new_file_mode());
  temporary_ = name;
  arm_signal_cleanup(temporary_);
  file_ = ::fdopen(descriptor, "wb");
  if (file_ == nullptr) {
    ::close(descriptor);
    ::unlink(temporary_.c_str());
    disarm_signal_cleanup();
    fail("cannot write the temporary file");
  }
  kind_ = Target::replace;
}

OutputStream::~OutputStream() {
  if (file_ != nullptr) std::fclose(file_);
  if (kind_ == Target::replace && !committed_) {
    ::unlink(temporary_.c_str());
    disarm_signal_cleanup();
  }
}

void OutputStream::fail(std::string_view what) const {
  if (kind_ == Target::standard_output && path_.empty()) {
    throw units::InputError(fmt::format("standard output: {}", what));
  }
  throw units::InputError(fmt::format("--output = \"{}\": {}", path_, what));
}

void OutputStream::write(std::string_view text) {
  std::FILE* const stream = kind_ == Target::standard_output ? stdout : file_;
  if (std::fwrite(text.data(), 1, text.size(), stream) != text.size()) {
    fail("writing failed (" + system_error_text() + "); the output is incomplete");
  }
}

void OutputStream::commit() {
  if (kind_ == Target::standard_output) {
    finish_standard_output();
    committed_ = true;
    return;
  }
  const bool written = std::fflush(file_) == 0 && std::ferror(file_) == 0;
  const bool closed = std::fclose(file_) == 0;
  file_ = nullptr;
  if (!written || !closed) fail("writing failed (" + system_error_text() + ")");
  if (kind_ == Target::replace) {
    if (::rename(temporary_.c_str(), target_.c_str()) != 0) fail("cannot replace the file (" + system_error_text() + ")");
    disarm_signal_cleanup();
  }
  committed_ = true;
}

void write_output(const std::string& path, std::string_view content) {
  OutputStream out(path);
  out.write(content);
  out.commit();
}

void finish_standard_output() {
  if (std::fflush(stdout) != 0 || std::ferror(stdout) != 0) {
    throw units::InputError(fmt::format("standard output: writing failed ({}); the output is incomplete",
                                        system_error_text()));
  }
}

}  // namespace stackbound::cli
