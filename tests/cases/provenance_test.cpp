// Provenance of every output: the tool version, the run time (injected, never read from a global
// clock here) and the SHA-256 of the case file's bytes.

#include "stackbound/cases/provenance.hpp"

#include <gtest/gtest.h>

#include <chrono>
#include <string>

#include "stackbound/cases/case_file.hpp"
#include "stackbound/cases/input_file.hpp"
#include "stackbound/cases/sha256.hpp"
#include "stackbound/version.hpp"

namespace stackbound::cases {
namespace {

using std::chrono::seconds;
using std::chrono::system_clock;

// Wrong if the digest were not SHA-256, or not written as lower-case hex.
TEST(Provenance, Sha256OfTheStandardTestMessages) {
  // Source: FIPS 180-2, Appendix B.1 (the message "abc"); the empty message's digest as published in
  // NIST's SHA-256 example values (csrc.nist.gov, "SHA256.pdf"; from memory).
  EXPECT_EQ(sha256_hex("abc"), "ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad");
  EXPECT_EQ(sha256_hex(""), "e3b0c44298fc1c149afbf4c8996fb92427ae41e4649b934ca495991b7852b855");
  // Source: FIPS 180-2, Appendix B.2 (the 448-bit message, two blocks).
  EXPECT_EQ(sha256_hex("abcdbcdecdefdefgefghfghighijhijkijkljklmklmnlmnomnopnopq"),
            "248d6a61d20638b8e5c026930c3e6039a33ce45964ff2167f6ecedd419db06c1");
}

// Wrong if the run time were printed in local time, with the wrong calendar, or with fractions.
TEST(Provenance, RunTimeIsUtcIso8601ToTheSecond) {
  // 1 700 000 000 s after the Unix epoch is 2023-11-14 22:13:20 UTC (POSIX time: 86400 s a day).
  EXPECT_EQ(format_run_time(system_clock::time_point(seconds(1700000000))), "2023-11-14T22:13:20Z");
  // A leap day of a year divisible by 400 (951 782 400 s = 11 016 days).
  EXPECT_EQ(format_run_time(system_clock::time_point(seconds(951782400)) + std::chrono::milliseconds(999)),
            "2000-02-29T00:00:00Z");
  EXPECT_EQ(format_run_time(system_clock::time_point{}), "1970-01-01T00:00:00Z");
}

// Wrong if the fingerprint were of anything but the case file's bytes, or the version not the build's.
TEST(Provenance, FingerprintIsOfTheCaseFileBytes) {
  const std::string path = std::string(STACKBOUND_SOURCE_DIR) + "/cases/examples/gas_boiler.yaml";
  const CaseDefinition definition = load_case(path);
  const std::string bytes = read_input_file(path, "case", "case file");
  const Provenance p = make_provenance(definition, system_clock::time_point(seconds(1700000000)));
  EXPECT_EQ(p.case_sha256, sha256_hex(bytes));
  EXPECT_EQ(p.case_sha256.size(), 64U);
  EXPECT_EQ(p.version, kVersion);
  EXPECT_EQ(p.run_at, "2023-11-14T22:13:20Z");
  EXPECT_EQ(provenance_line(p), "stackbound " + std::string(kVersion) +
                                    ", run at 2023-11-14T22:13:20Z, case file SHA-256 " + p.case_sha256);
  // One byte more (a trailing blank line) is another file.
  EXPECT_NE(parse_case(bytes + "\n", "gas_boiler.yaml").source_sha256, p.case_sha256);
}

}  // namespace
}  // namespace stackbound::cases
