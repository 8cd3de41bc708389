// The certificate readers and method checks (checker/certificate.*, check_*.cpp) on a fuzzed
// INPUT and CERT pair (split at fuzz_common.hpp's separator). Unlike fuzz_check, the
// certificate's own input_sha256 is taken as the input's hash, so mutated inputs still reach
// the method checks. Exits must be Unreadable (either file) or Rejected.
#include <cstddef>
#include <cstdint>
#include <memory>
#include <new>
#include <sstream>
#include <string>

#include "certificate.hpp"
#include "errors.hpp"
#include "fuzz_common.hpp"
#include "input.hpp"
#include "json_reader.hpp"
#include "positional.hpp"
#include "stack.hpp"

namespace {

// The hash the certificate claims, or a string no claim can equal.
std::string claimed_hash(sweepcheck::json::Ref root) {
  using sweepcheck::json::Kind;
  if (!root.is(Kind::Object)) return "-";
  for (std::size_t i = 0; i < root.size(); ++i)
    if (root.key(i) == "input_sha256" && root.value(i).is(Kind::String)) return std::string(root.value(i).text());
  return "-";
}

}  // namespace

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
  using namespace sweepcheck;
  sweepfuzz::Parts parts = sweepfuzz::split(data, size);
  if (!parts.ok) return 0;
  std::ostringstream out;
  try {
    const json::Document input_doc = json::parse(parts.input, "INPUT");
    std::unique_ptr<Input> in = load_input(input_doc);
    const json::Document cert_doc = json::parse(parts.cert, "CERT");
    Tally tally;
    Certificate cert = read_header(cert_doc.root(), *in, claimed_hash(cert_doc.root()), out, tally);
    apply_margin(cert, *in, out, tally);
    if (cert.method == "chambers") check_chambers(cert, *in, out, tally);
    else if (cert.method == "route") check_route(cert, *in, out, tally);
    else {
      Stack stack(*in, cert.frames, cert.log_start);
      if (cert.method == "sheet") check_sheet(cert, stack, out, tally);
      else check_cocycle(cert, stack, out, tally);
    }
  } catch (const Unreadable&) {
  } catch (const Rejected&) {
  } catch (const std::bad_alloc&) {
  }
  return 0;
}
