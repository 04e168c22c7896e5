#pragma once
// Terminal progress of a long command on stderr, shown only when stderr is a terminal.

#include <cstddef>
#include <string>

namespace stackbound::cli {

class ProgressBar {
 public:
  // `unit` names what is counted ("points", "bytes").
  explicit ProgressBar(std::string unit = "points");
  void update(std::size_t done, std::size_t total) const;

 private:
  bool shown_;
  std::string unit_;
};

}  // namespace stackbound::cli
