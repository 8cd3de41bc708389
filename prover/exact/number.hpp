// Exact rationals as they appear in files.
//
// Every quantity in sweepcert is an exact rational (schema/README.md §1.1). This header is the
// single place where text becomes a number and a number becomes text; nothing in the prover
// goes through a binary floating-point value to decide anything.
#pragma once
#include <gmpxx.h>
#include <optional>
#include <string>
#include <string_view>

namespace sweepcert {

using Rational = mpq_class;
using Integer = mpz_class;

// Parses a decimal ("12.75", "-3e-2") or a fraction ("7/3"). On failure returns nullopt and
// sets *why to a short reason.
std::optional<Rational> parse_exact(std::string_view text, std::string* why);

// Canonical text: "3", "-7/3". Integers have no denominator.
std::string to_text(const Rational& q);

// A double near q, for filters and display only.
inline double approx(const Rational& q) { return q.get_d(); }

// num/den in lowest terms. (mpq_class(num, den) does not reduce, and GMP's rational arithmetic
// assumes reduced operands: an unreduced value can compare or divide wrongly.)
inline Rational fraction(long num, long den) {
  Rational q(num, den);
  q.canonicalize();
  return q;
}

}  // namespace sweepcert
