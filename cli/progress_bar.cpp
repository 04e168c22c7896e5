#include "stackbound/cli/progress_bar.hpp"

#include <unistd.h>

#include <algorithm>
#include <cstdio>
#include <string>
#include <utility>

namespace stackbound::cli {

ProgressBar::ProgressBar(std::string unit) : shown_(::isatty(::fileno(stderr)) != 0), unit_(std::move(unit)) {}

void ProgressBar::update(std::size_t done, std::size_t total) const {
  if (!shown_) return;
  constexpr int kWidth = 40;
  const int filled = static_cast<int>(kWidth * done / std::max<std::size_t>(total, 1));
  std::fprintf(stderr, "\r[%s%s] %3d %% %zu/%zu %s", std::string(static_cast<std::size_t>(filled), '#').c_str(),
               std::string(static_cast<std::size_t>(kWidth - filled), ' ').c_str(),
               static_cast<int>(100 * done / std::max<std::size_t>(total, 1)), done, total, unit_.c_str());
  if (done == total) std::fprintf(stderr, "\n");
  std::fflush(stderr);
}

}  // namespace stackbound::cli
