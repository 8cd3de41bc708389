// SHA-256 through OpenSSL's EVP interface: binds a certificate to its input file (§4.1).
#pragma once
#include <string>
#include <string_view>

namespace sweepcheck {

// 64 lowercase hex digits.
std::string sha256_hex(std::string_view bytes);

}  // namespace sweepcheck
