// A harness that lets a library exception escape on every input: the control of the corpus replay
// (tests/fuzz/CMakeLists.txt), which must fail on it. Without it, a replay that caught everything
// would pass whatever the harnesses did.

#include <cstddef>
#include <cstdint>
#include <stdexcept>

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* /*data*/, std::size_t /*size*/) {
  throw std::runtime_error("bad conversion (standing in for an undocumented library exception)");
}
