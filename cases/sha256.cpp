#include "stackbound/cases/sha256.hpp"

#include <fmt/format.h>
#include <openssl/evp.h>

#include <array>
#include <cassert>

namespace stackbound::cases {

std::string sha256_hex(std::string_view bytes) {
  std::array<unsigned char, EVP_MAX_MD_SIZE> digest{};
  unsigned int length = 0;
  // EVP_Digest: one-shot init, update and final; fails only when the library is broken.
  const int ok = EVP_Digest(bytes.data(), bytes.size(), digest.data(), &length, EVP_sha256(), nullptr);
  assert(ok == 1 && length == 32 && "OpenSSL computes SHA-256");
  (void)ok;
  std::string hex;
  hex.reserve(2 * length);
  for (unsigned int i = 0; i < length; ++i) hex += fmt::format("{:02x}", digest[i]);
  return hex;
}

}  // namespace stackbound::cases
