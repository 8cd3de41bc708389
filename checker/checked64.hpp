// A 64-bit integer that throws std::overflow_error instead of wrapping: the fast path for
// coefficient sums, redone with cpp_int when it throws (or when an input value needs more than
// 64 bits). Only the operations the checks use.
#pragma once
#include <cstdint>
#include <ostream>
#include <sstream>
#include <stdexcept>
#include <string>

#include "errors.hpp"
#include "numbers.hpp"

namespace sweepcheck {

class Checked64 {
 public:
  Checked64() = default;
  explicit Checked64(std::int64_t v) : v_(v) {}

  Checked64 operator-() const {
    if (v_ == INT64_MIN) throw std::overflow_error("64-bit overflow");
    return Checked64(-v_);
  }
  Checked64& operator+=(const Checked64& o) {
    if (__builtin_add_overflow(v_, o.v_, &v_)) throw std::overflow_error("64-bit overflow");
    return *this;
  }
  Checked64& operator-=(const Checked64& o) {
    if (__builtin_sub_overflow(v_, o.v_, &v_)) throw std::overflow_error("64-bit overflow");
    return *this;
  }
  friend Checked64 operator+(Checked64 a, const Checked64& b) { return a += b; }
  friend Checked64 operator-(Checked64 a, const Checked64& b) { return a -= b; }
  bool operator!=(int o) const { return v_ != o; }
  int operator%(int m) const { return static_cast<int>(v_ % m); }
  std::int64_t value() const { return v_; }
  std::string str() const { return std::to_string(v_); }

 private:
  std::int64_t v_ = 0;
};

template <class T>
struct Use {  // selects the integer type of a check: Use<Checked64> or Use<Int>
  using type = T;
};

// Runs `check(Use<Checked64>{}, out)`, or `check(Use<Int>{}, out)` when some value needs more than
// 64 bits or a sum overflows. The fast path's findings are buffered so they are printed once,
// whichever path finishes; a rejection from the fast path is final (it is exact when it is made).
template <class Check>
std::string fast_then_exact(bool try_fast, std::ostream& out, Check&& check) {
  if (try_fast) {
    std::ostringstream findings;
    try {
      std::string summary = check(Use<Checked64>{}, findings);
      out << findings.str();
      return summary;
    } catch (const Rejected&) {
      out << findings.str();
      throw;
    } catch (const std::overflow_error&) {
      // A sum left 64 bits: redo exactly.
    }
  }
  return check(Use<Int>{}, out);
}

}  // namespace sweepcheck
