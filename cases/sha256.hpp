#pragma once
// SHA-256 (FIPS 180-4) of a byte string, by OpenSSL's libcrypto (EVP interface), as 64 lower-case
// hexadecimal digits: the fingerprint of a case file that the outputs carry.

#include <string>
#include <string_view>

namespace stackbound::cases {

[[nodiscard]] std::string sha256_hex(std::string_view bytes);

}  // namespace stackbound::cases
