// The parts of a sweepcert-certificate-1 common to both methods (schema/README.md §4.1, §4.2)
// and the readers for certificate rows. Every failure is a Rejected naming the pointer.
#pragma once
#include <cstdint>
#include <ostream>
#include <string>
#include <type_traits>
#include <vector>

#include "checked64.hpp"
#include "fields.hpp"
#include "input.hpp"
#include "stack.hpp"
#include "tally.hpp"

namespace sweepcheck {

enum class Ring { Z, Z2 };

// Where a row value sits: base/row/col. The pointer text is only built for a message, since
// certificates may have millions of rows.
struct Where {
  const char* base;
  std::size_t row;
  int col = -1;
  Where at(int c) const { return Where{base, row, c}; }
  std::string str() const;
};

// A coefficient or cochain value (§1.2): machine-sized when it fits, otherwise an Int.
struct Value {
  std::int64_t small = 0;
  std::int32_t big = -1;  // index into Values' big store, or -1
};

class Values {
 public:
  // Reads a nonzero integer string; over z2 it must be "1". `rule` is quoted in messages.
  Value read(json::Ref v, const Where& where, Ring ring, const char* rule);
  bool any_big() const { return !bigs_.empty(); }
  // As Checked64 (only when !any_big()) or as Int.
  template <class V>
  V get(const Value& x) const {
    if constexpr (std::is_same_v<V, Checked64>) {
      if (x.big >= 0) throw std::overflow_error("value beyond 64 bits");
      return V(x.small);
    } else {
      return x.big < 0 ? V(x.small) : V(bigs_.at(static_cast<std::size_t>(x.big)));
    }
  }

 private:
  std::vector<Int> bigs_;
};

struct Certificate {
  Members members;
  std::string claim, method;
  Ring ring = Ring::Z;
  std::vector<Rat> frames;
  std::size_t log_start = 0;  // contact log: certificate frame k is log frame log_start + k
  bool has_margin = false;    // §4.1.1: the key `margin` is present
  Rat margin;                 // M >= 0 (0 when absent)
};

// §4.1, §4.1.1 and §4.2 in this order: format, claim and method, the key set of that method,
// input_sha256, input_format, margin, ring, frames, notes (no duplicated keys inside), frames
// against the input. Prints one finding line.
Certificate read_header(json::Ref root, const Input& in, const std::string& input_sha256, std::ostream& out,
                        Tally& tally);

// §4.1.1: the one place where the certificate's margin changes the input model. For claim
// no-evasion every radius becomes r - M, which must stay > 0, and consecutive fence disks must
// still meet; for claim evasion every radius becomes r + M. Every later check reads the adjusted
// radii. No-op without a margin. Prints one finding line when there is a margin.
void apply_margin(const Certificate& cert, Input& in, std::ostream& out, Tally& tally);

// A frame index: a non-negative JSON integer below `limit`.
std::uint32_t read_index(json::Ref v, const Where& where, std::size_t limit, const char* what);
// A known sensor id.
std::uint32_t read_sensor(json::Ref v, const Where& where, const Input& in);
// Reads a row: an array of exactly `length` values; `shape` describes it for the message.
void expect_row(json::Ref v, const Where& where, std::size_t length, const char* shape);

// The method checks (check_sheet.cpp, check_cocycle.cpp). They print findings and return a
// summary for the ACCEPTED line, or throw Rejected at the first failing item.
std::string check_sheet(const Certificate& cert, Stack& stack, std::ostream& out, Tally& tally);
std::string check_cocycle(const Certificate& cert, Stack& stack, std::ostream& out, Tally& tally);

std::string ring_name(Ring r);

inline Int to_int(const Int& x) { return x; }
inline Int to_int(const Checked64& x) { return Int(x.value()); }

}  // namespace sweepcheck
