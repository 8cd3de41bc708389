// The whole check, check_texts (checker/checker.hpp), on a fuzzed INPUT and CERT pair split at
// fuzz_common.hpp's separator. It must return 0, 1 or 2, and accept only with a final
// ACCEPTED line; any crash, hang or sanitizer report is a finding.
#include <cstddef>
#include <cstdint>
#include <sstream>
#include <string>

#include "checker.hpp"
#include "fuzz_common.hpp"

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
  sweepfuzz::Parts parts = sweepfuzz::split(data, size);
  if (!parts.ok) return 0;
  std::ostringstream out, err;
  const int code = sweepcheck::check_texts(std::string(parts.input), std::string(parts.cert), out, err);
  const std::string said = out.str();
  const bool accepted_line = said.find("\nACCEPTED: ") != std::string::npos || said.rfind("ACCEPTED: ", 0) == 0;
  if (code < 0 || code > 2) __builtin_trap();
  if ((code == 0) != accepted_line) __builtin_trap();
  // An internal error is an exception the checker did not expect: a bug, even at exit 2. (Only
  // the start of the message counts: quoted input may say "internal error" anywhere else.)
  if (err.str().rfind("sweepcheck: internal error: ", 0) == 0) __builtin_trap();
  return 0;
}
