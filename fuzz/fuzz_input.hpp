#pragma once
// Reading a fuzzer's bytes as the inputs of a harness, and the one way a harness reports a broken
// property (abort, which libFuzzer records as a crash with the input that caused it).

#include <cstddef>
#include <cstdint>
#include <cstdio>
#include <cstdlib>
#include <string_view>

namespace stackbound::fuzz {

// The bytes as text (parsers take any bytes: invalid UTF-8 and NUL included).
inline std::string_view as_text(const std::uint8_t* data, std::size_t size) {
  return {reinterpret_cast<const char*>(data), size};
}

// Consumes the bytes one at a time; past the end every read gives 0.
class ByteReader {
 public:
  ByteReader(const std::uint8_t* data, std::size_t size) : data_(data), size_(size) {}
  std::uint8_t next() { return position_ < size_ ? data_[position_++] : 0; }
  // A value in [low, high] from two bytes.
  double in_range(double low, double high) {
    const double unit = static_cast<double>(next() * 256 + next()) / 65535.0;
    return low + unit * (high - low);
  }

 private:
  const std::uint8_t* data_;
  std::size_t size_;
  std::size_t position_ = 0;
};

// A violated property: say which, and stop (libFuzzer keeps the input).
[[noreturn]] inline void property_failed(const char* what) {
  std::fprintf(stderr, "property failed: %s\n", what);
  std::abort();
}

}  // namespace stackbound::fuzz
