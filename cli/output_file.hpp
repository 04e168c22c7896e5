#pragma once
// Where a command's output goes: standard output, or a file that appears whole or not at all.
//
// A missing path or a regular file is written through a uniquely named temporary file in the same
// directory (mkstemp), renamed over the target only when everything was written; a symbolic link is
// followed and its target treated the same way (the link stays). A device or FIFO is written directly
// (there is nothing to replace); a directory, a read-only file or anything else is refused with a
// message. The temporary file is removed on every error path and on SIGINT / SIGTERM. Writes to standard
// output are checked: a failed write (a full disk, a closed pipe) is an InputError naming it.

#include <cstdio>
#include <string>
#include <string_view>

namespace stackbound::cli {

class OutputStream {
 public:
  // Empty or "-": standard output. Throws units::InputError naming --output for a refused target.
  explicit OutputStream(const std::string& path);
  OutputStream(const OutputStream&) = delete;
  OutputStream& operator=(const OutputStream&) = delete;
  ~OutputStream();
  void write(std::string_view text);
  // Flushes (standard output) or closes and renames the temporary file over the target.
  void commit();

 private:
  enum class Target { standard_output, replace, direct };
  void fail(std::string_view what) const;

  std::string path_;       // as given
  std::string target_;     // the file written or replaced (a link's target)
  std::string temporary_;  // when replacing
  std::FILE* file_ = nullptr;
  Target kind_ = Target::standard_output;
  bool committed_ = false;
};

// Writes `content` to `path` whole or not at all (see OutputStream), or to standard output when `path`
// is empty or "-".
void write_output(const std::string& path, std::string_view content);

// Flushes standard output and checks every earlier write; throws units::InputError on failure.
void finish_standard_output();

}  // namespace stackbound::cli
