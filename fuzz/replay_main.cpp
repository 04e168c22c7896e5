// Replays a harness on every file of the given directories, without libFuzzer: the regression test of
// the fuzzed corpus (tests/fuzz/CMakeLists.txt), run by CTest with any compiler. A harness reports a
// broken property by aborting (fuzz_input.hpp); an exception other than the documented ones escaping
// the harness is what the command line would turn into "internal error" (exit 3). Either fails the
// test, naming the input. Prints how many inputs ran.

#include <cstdint>
#include <cstdio>
#include <exception>
#include <filesystem>
#include <fstream>
#include <iterator>
#include <vector>

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size);

int main(int argc, char** argv) {
  namespace fs = std::filesystem;
  std::size_t replayed = 0;
  for (int i = 1; i < argc; ++i) {
    std::vector<fs::path> files;
    for (const fs::directory_entry& entry : fs::directory_iterator(argv[i])) {
      if (entry.is_regular_file()) files.push_back(entry.path());
    }
    for (const fs::path& file : files) {
      std::ifstream in(file, std::ios::binary);
      const std::vector<char> bytes{std::istreambuf_iterator<char>(in), std::istreambuf_iterator<char>()};
      try {
        (void)LLVMFuzzerTestOneInput(reinterpret_cast<const std::uint8_t*>(bytes.data()), bytes.size());
      } catch (const std::exception& error) {
        std::fprintf(stderr, "%s: reaches the internal-error line: %s\n", file.c_str(), error.what());
        return 1;
      } catch (...) {
        std::fprintf(stderr, "%s: reaches the internal-error line (a non-standard exception)\n", file.c_str());
        return 1;
      }
      ++replayed;
    }
  }
  std::printf("%zu inputs replayed, none reached the internal-error line\n", replayed);
  return replayed > 0 ? 0 : 1;
}
