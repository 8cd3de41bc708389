// Exact number grammar (§1.1, §1.2) and the JSON reader's limits (§1.4, §1.5).
#include <catch2/catch.hpp>

#include "errors.hpp"
#include "fields.hpp"
#include "json_reader.hpp"
#include "numbers.hpp"

using namespace sweepcheck;

namespace {
Rat rat(const std::string& s) {
  Rat q;
  std::string why = parse_rational(s, q);
  INFO(s << ": " << why);
  REQUIRE(why.empty());
  return q;
}
bool bad(const std::string& s) {
  Rat q;
  return !parse_rational(s, q).empty();
}
}  // namespace

TEST_CASE("decimal and fraction texts denote exact rationals", "[numbers]") {
  CHECK(rat("-3e-2") == Rat(-3, 100));
  CHECK(rat("7/3") == Rat(7, 3));
  CHECK(rat("-1/10") == Rat(-1, 10));
  CHECK(rat("12.75") == Rat(51, 4));
  CHECK(rat("0.1") == Rat(1, 10));  // exactly 1/10, no binary rounding
  // "1.5", "3/2", "15e-1" all denote 3/2 (§1.1)
  CHECK(rat("1.5") == Rat(3, 2));
  CHECK(rat("3/2") == Rat(3, 2));
  CHECK(rat("15e-1") == Rat(3, 2));
  CHECK(rat("2E+3") == Rat(2000));
  CHECK(rat("007") == Rat(7));  // leading zeros are allowed by the §1.1 pattern
  CHECK(rat("1e1000") == Rat(boost::multiprecision::pow(Int(10), 1000)));
  CHECK(rat("1e-1000") == Rat(Int(1), boost::multiprecision::pow(Int(10), 1000)));
}

TEST_CASE("malformed numbers are refused", "[numbers]") {
  CHECK(bad("1."));
  CHECK(bad(".5"));
  CHECK(bad("1/0"));
  CHECK(bad("--1"));
  CHECK(bad("+1"));
  CHECK(bad("1e"));
  CHECK(bad("1e+"));
  CHECK(bad(" 1"));
  CHECK(bad("1 "));
  CHECK(bad("1/2/3"));
  CHECK(bad("1.5/2"));
  CHECK(bad("-"));
  CHECK(bad(""));
  CHECK(bad("0x10"));
  CHECK(bad("1e1001"));  // exponent beyond 1000
  CHECK(bad(std::string(1001, '1')));  // longer than 1000 characters
  CHECK_FALSE(bad(std::string(1000, '1')));
}

TEST_CASE("integer strings follow §1.2", "[numbers]") {
  Int n;
  CHECK(parse_integer("0", n).empty());
  CHECK(parse_integer("-12", n).empty());
  CHECK(n == -12);
  CHECK_FALSE(parse_integer("007", n).empty());
  CHECK_FALSE(parse_integer("1.0", n).empty());
  CHECK_FALSE(parse_integer("+1", n).empty());
  CHECK_FALSE(parse_integer("", n).empty());
  CHECK(parse_integer("1" + std::string(999, '0'), n).empty());
  CHECK_FALSE(parse_integer("1" + std::string(1000, '0'), n).empty());
  std::int64_t s = 0;
  CHECK(parse_small_integer("-123456789012345678", s));
  CHECK(s == -123456789012345678LL);
  CHECK_FALSE(parse_small_integer("1234567890123456789", s));  // 19 digits: taken by the Int path
}

TEST_CASE("JSON numbers are read from their raw text", "[numbers][json]") {
  // 0.1 has no exact double; 123456789012345678901234567890 overflows uint64 and arrives as
  // a float token whose raw text we keep; -7 and 2 arrive as integers.
  json::Document doc = json::parse(R"([0.1, 123456789012345678901234567890, -7, 2, 15e-1, "7/3"])", "T");
  json::Ref a = doc.root();
  REQUIRE(a.size() == 6);
  CHECK(get_rational(a[0], "/0") == Rat(1, 10));
  CHECK(get_rational(a[1], "/1") == Rat(Int("123456789012345678901234567890")));
  CHECK(get_rational(a[2], "/2") == Rat(-7));
  CHECK(get_rational(a[3], "/3") == Rat(2));
  CHECK(get_rational(a[4], "/4") == Rat(3, 2));
  CHECK(get_rational(a[5], "/5") == Rat(7, 3));
  CHECK_THROWS_AS(get_rational(json::parse(R"(["1."])", "T").root()[0], "/0"), FieldError);
}

TEST_CASE("JSON limits of §1.5 are unreadable", "[json]") {
  std::string ok = std::string(64, '[') + std::string(64, ']');
  CHECK_NOTHROW(json::parse(ok, "T"));
  std::string deep = std::string(65, '[') + std::string(65, ']');
  CHECK_THROWS_AS(json::parse(deep, "T"), Unreadable);
  CHECK_THROWS_AS(json::parse("[\"" + std::string(1001, 'a') + "\"]", "T"), Unreadable);
  CHECK_NOTHROW(json::parse("[\"" + std::string(1000, 'a') + "\"]", "T"));
  CHECK_THROWS_AS(json::parse("[1" + std::string(1000, '0') + "]", "T"), Unreadable);  // 1001-digit number
  CHECK_THROWS_AS(json::parse("{\"a\":1} x", "T"), Unreadable);                       // trailing text
  CHECK_THROWS_AS(json::parse("{\"a\":1", "T"), Unreadable);
}

namespace {
std::string parse_error_of(const std::string& text) {
  try {
    json::parse(text, "T");
  } catch (const Unreadable& e) {
    return e.what();
  }
  return "";
}
}  // namespace

TEST_CASE("limit messages name the limit; bad syntax names line and column", "[json]") {
  using Catch::Matchers::Contains;
  CHECK_THAT(parse_error_of(std::string(200000, '[')), Contains("depth limit of 64"));
  CHECK_THAT(parse_error_of("[\"" + std::string(1001, 'a') + "\"]"), Contains("length limit of 1000"));
  CHECK_THAT(parse_error_of("{\"" + std::string(1001, 'a') + "\": 1}"), Contains("length limit of 1000"));
  // 2000 digits overflow nlohmann's integer and double: refused for the length, not quoted.
  const std::string long_number = parse_error_of("[" + std::string(2000, '7') + "]");
  CHECK_THAT(long_number, Contains("token of 2000 characters exceeds the length limit"));
  CHECK(long_number.size() < 200);
  CHECK_THAT(parse_error_of("{\n \"a\":\n  [12 3]}"), Contains("T: line 3, column 7: bad JSON: syntax error"));
  CHECK_THAT(parse_error_of("{\"a\": 1,\n"), Contains("T: line 2, column 1: bad JSON"));
  CHECK_THAT(parse_error_of(""), Contains("T: line 1, column 1: bad JSON"));
  CHECK(json::line_column("ab\ncd", 4) == "line 2, column 2");
  CHECK(json::line_column("ab\ncd", 2) == "line 1, column 3");  // the newline itself
  CHECK(json::line_column("ab", 99) == "line 1, column 3");      // past the end
}

TEST_CASE("duplicated and unknown keys are found with their pointer", "[json]") {
  json::Document doc = json::parse(R"({"a": 1, "b": {"c": 2, "c": 3}, "a": 4})", "T");
  try {
    Members m(doc.root(), "", {"a", "b"});
    FAIL("duplicate not found");
  } catch (const FieldError& e) {
    CHECK(e.pointer == "/a");
  }
  CHECK(json::find_duplicate_key(doc.root().value(1), "/b") == "/b/c");
  CHECK(json::find_duplicate_key(doc.root(), "") == "/a");
  json::Document other = json::parse(R"({"a": 1, "x/y~": 2})", "T");
  try {
    Members m(other.root(), "", {"a"});
    FAIL("unknown key not found");
  } catch (const FieldError& e) {
    CHECK(e.pointer == "/x~1y~0");  // RFC 6901 escaping
  }
}
