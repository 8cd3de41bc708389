// A 64-bit integer that throws std::overflow_error instead of wrapping: the fast path for
// coefficient sums, redone with cpp_int when it throws (or when an input value needs more than
// 64 bits). Only the operations the checks use.
#pragma once
#include <cstdint>
#include <stdexcept>
#include <string>

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

}  // namespace sweepcheck
