#pragma once
// Terminal progress of a long command on stderr, shown only when stderr is a terminal.

#include <cstddef>

namespace stackbound::cli {

class ProgressBar {
 public:
  ProgressBar();
  void update(std::size_t done, std::size_t total) const;

 private:
  bool shown_;
};

}  // namespace stackbound::cli
