#include "numbers.hpp"

#include <cstddef>

namespace sweepcheck {
namespace {

bool is_digit(char c) { return c >= '0' && c <= '9'; }

// Length of the run of digits starting at `pos`.
std::size_t digits_at(std::string_view s, std::size_t pos) {
  std::size_t n = 0;
  while (pos + n < s.size() && is_digit(s[pos + n])) ++n;
  return n;
}

Int digits_value(std::string_view digits) {
  Int v = 0;
  // Chunks of 18 digits keep the big multiplications few.
  std::size_t i = 0;
  while (i < digits.size()) {
    std::size_t len = std::min<std::size_t>(18, digits.size() - i);
    std::uint64_t chunk = 0, scale = 1;
    for (std::size_t j = 0; j < len; ++j) { chunk = chunk * 10 + std::uint64_t(digits[i + j] - '0'); scale *= 10; }
    v = v * scale + chunk;
    i += len;
  }
  return v;
}

Int pow10(unsigned n) { return boost::multiprecision::pow(Int(10), n); }

}  // namespace

std::string parse_rational(std::string_view s, Rat& out) {
  if (s.empty()) return "empty number";
  if (s.size() > 1000) return "number longer than 1000 characters";
  std::size_t pos = 0;
  bool negative = false;
  if (s[pos] == '-') { negative = true; ++pos; }
  std::size_t int_len = digits_at(s, pos);
  if (int_len == 0) return "malformed number '" + std::string(s) + "': digits expected";
  std::string_view int_digits = s.substr(pos, int_len);
  pos += int_len;
  if (pos < s.size() && s[pos] == '/') {
    ++pos;
    std::size_t den_len = digits_at(s, pos);
    if (den_len == 0 || pos + den_len != s.size()) return "malformed fraction '" + std::string(s) + "'";
    Int den = digits_value(s.substr(pos, den_len));
    if (den == 0) return "fraction '" + std::string(s) + "' has a zero denominator";
    Int num = digits_value(int_digits);
    out = Rat(negative ? Int(-num) : num, den);
    return "";
  }
  std::string_view frac_digits;
  if (pos < s.size() && s[pos] == '.') {
    ++pos;
    std::size_t frac_len = digits_at(s, pos);
    if (frac_len == 0) return "malformed number '" + std::string(s) + "': digits expected after '.'";
    frac_digits = s.substr(pos, frac_len);
    pos += frac_len;
  }
  long exponent = 0;
  if (pos < s.size() && (s[pos] == 'e' || s[pos] == 'E')) {
    ++pos;
    bool exp_negative = false;
    if (pos < s.size() && (s[pos] == '+' || s[pos] == '-')) { exp_negative = s[pos] == '-'; ++pos; }
    std::size_t exp_len = digits_at(s, pos);
    if (exp_len == 0) return "malformed number '" + std::string(s) + "': exponent digits expected";
    for (std::size_t i = 0; i < exp_len; ++i) {
      exponent = exponent * 10 + (s[pos + i] - '0');
      if (exponent > 1000) return "exponent of '" + std::string(s) + "' exceeds 1000 in absolute value";
    }
    if (exp_negative) exponent = -exponent;
    pos += exp_len;
  }
  if (pos != s.size()) return "malformed number '" + std::string(s) + "'";
  std::string mantissa(int_digits);
  mantissa += frac_digits;
  Int m = digits_value(mantissa);
  if (negative) m = -m;
  long shift = exponent - static_cast<long>(frac_digits.size());
  if (shift >= 0) out = Rat(m * pow10(static_cast<unsigned>(shift)));
  else out = Rat(m, pow10(static_cast<unsigned>(-shift)));
  return "";
}

std::string parse_integer(std::string_view s, Int& out) {
  std::size_t pos = (!s.empty() && s[0] == '-') ? 1 : 0;
  std::size_t len = digits_at(s, pos);
  if (len == 0 || pos + len != s.size()) return "malformed integer '" + std::string(s.substr(0, 40)) + "'";
  if (len > 1000) return "integer longer than 1000 digits";
  if (len > 1 && s[pos] == '0') return "integer '" + std::string(s.substr(0, 40)) + "' has a leading zero";
  out = digits_value(s.substr(pos));
  if (pos == 1) out = -out;
  return "";
}

bool parse_small_integer(std::string_view s, std::int64_t& out) {
  std::size_t pos = (!s.empty() && s[0] == '-') ? 1 : 0;
  std::size_t len = digits_at(s, pos);
  if (len == 0 || len > 18 || pos + len != s.size()) return false;  // 18 digits always fit
  if (len > 1 && s[pos] == '0') return false;
  std::int64_t v = 0;
  for (std::size_t i = pos; i < s.size(); ++i) v = v * 10 + (s[i] - '0');
  out = pos == 1 ? -v : v;
  return true;
}

std::string to_text(const Rat& q) {
  if (denominator(q) == 1) return numerator(q).str();
  return numerator(q).str() + "/" + denominator(q).str();
}

}  // namespace sweepcheck
