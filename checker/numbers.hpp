// Exact numbers (schema/README.md §1.1, §1.2). Everything is Boost.Multiprecision; no value
// ever passes through floating point.
#pragma once
#include <boost/multiprecision/cpp_int.hpp>
#include <string>
#include <string_view>

namespace sweepcheck {

using Int = boost::multiprecision::cpp_int;
using Rat = boost::multiprecision::cpp_rational;

// §1.1: decimal -?[0-9]+(\.[0-9]+)?([eE][+-]?[0-9]+)? with |exponent| <= 1000, or fraction
// -?[0-9]+/[0-9]+ with a nonzero denominator; at most 1000 characters, no white space.
// Returns "" on success, otherwise what is wrong.
std::string parse_rational(std::string_view text, Rat& out);

// §1.2: -?(0|[1-9][0-9]*) with at most 1000 digits. Returns "" or what is wrong.
std::string parse_integer(std::string_view text, Int& out);

// Same grammar; succeeds only when the value also fits int64 (the fast path of the checks).
bool parse_small_integer(std::string_view text, std::int64_t& out);

// "7/3", "-2", "0": for messages.
std::string to_text(const Rat& q);

}  // namespace sweepcheck
