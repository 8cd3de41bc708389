#include "exact/number.hpp"

#include <cctype>

namespace sweepcert {
namespace {

constexpr std::size_t kMaxNumberText = 1000;
constexpr long kMaxExponent = 1000;

bool all_digits(std::string_view s) {
  if (s.empty()) return false;
  for (char c : s)
    if (!std::isdigit(static_cast<unsigned char>(c))) return false;
  return true;
}

Rational pow10(long e) {
  mpz_class p;
  mpz_ui_pow_ui(p.get_mpz_t(), 10, static_cast<unsigned long>(e));
  return Rational(p);
}

}  // namespace

std::optional<Rational> parse_exact(std::string_view text, std::string* why) {
  auto fail = [&](const char* reason) -> std::optional<Rational> {
    if (why) *why = reason;
    return std::nullopt;
  };
  if (text.empty()) return fail("empty number");
  if (text.size() > kMaxNumberText) return fail("number longer than 1000 characters");
  bool negative = text[0] == '-';
  std::string_view body = negative ? text.substr(1) : text;

  if (auto slash = body.find('/'); slash != std::string_view::npos) {
    std::string_view num = body.substr(0, slash), den = body.substr(slash + 1);
    if (!all_digits(num) || !all_digits(den))
      return fail("not a fraction of two whole numbers (expected e.g. \"7/3\")");
    mpz_class n(std::string(num), 10), d(std::string(den), 10);
    if (d == 0) return fail("zero denominator");
    Rational q(n, d);
    q.canonicalize();
    if (negative) q = -q;
    return q;
  }

  std::string_view mant = body, expo;
  if (auto e = body.find_first_of("eE"); e != std::string_view::npos) {
    mant = body.substr(0, e);
    expo = body.substr(e + 1);
    if (expo.empty()) return fail("empty exponent");
  }
  std::string_view ipart = mant, fpart;
  if (auto dot = mant.find('.'); dot != std::string_view::npos) {
    ipart = mant.substr(0, dot);
    fpart = mant.substr(dot + 1);
    if (!all_digits(fpart)) return fail("malformed decimal (digits needed after '.')");
  }
  if (!all_digits(ipart)) return fail("malformed decimal (expected e.g. \"12.75\" or \"-3e-2\")");
  long exponent = 0;
  if (!expo.empty()) {
    bool eneg = expo[0] == '-';
    std::string_view edigits = (expo[0] == '-' || expo[0] == '+') ? expo.substr(1) : expo;
    if (!all_digits(edigits)) return fail("malformed exponent");
    if (edigits.size() > 4) return fail("exponent out of range (at most 1000)");
    exponent = std::stol(std::string(edigits));
    if (exponent > kMaxExponent) return fail("exponent out of range (at most 1000)");
    if (eneg) exponent = -exponent;
  }
  mpz_class digits(std::string(ipart) + std::string(fpart), 10);
  exponent -= static_cast<long>(fpart.size());
  Rational q(digits);
  if (exponent > 0) q *= pow10(exponent);
  if (exponent < 0) q /= pow10(-exponent);
  q.canonicalize();
  if (negative) q = -q;
  return q;
}

std::string to_text(const Rational& q) {
  if (q.get_den() == 1) return q.get_num().get_str();
  return q.get_num().get_str() + "/" + q.get_den().get_str();
}

}  // namespace sweepcert
