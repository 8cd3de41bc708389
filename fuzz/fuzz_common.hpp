// Shared by the libFuzzer targets: splitting one fuzz input into an INPUT and a CERT, and the
// method dispatch of the whole check. Every target must tell a clean exit (Unreadable,
// Rejected, std::bad_alloc) from a crash; anything else escaping is a finding.
#pragma once
#include <cstddef>
#include <cstdint>
#include <string_view>
#include <utility>

namespace sweepfuzz {

// The byte that separates INPUT from CERT in a two-part fuzz input. NUL never occurs in a JSON
// text outside a string, where it is invalid too, so it cannot be part of either file.
constexpr char kSeparator = '\0';

// Everything before the first separator, and everything after it; `ok` is false without one.
struct Parts {
  std::string_view input, cert;
  bool ok = false;
};

inline Parts split(const std::uint8_t* data, std::size_t size) {
  std::string_view all(reinterpret_cast<const char*>(data), size);
  std::size_t cut = all.find(kSeparator);
  if (cut == std::string_view::npos) return {};
  return {all.substr(0, cut), all.substr(cut + 1), true};
}

}  // namespace sweepfuzz
