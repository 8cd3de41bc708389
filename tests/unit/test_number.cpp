// Exact number parsing (schema §1.1) and the JSON reader that keeps raw number text.
#include <catch2/catch.hpp>

#include "exact/number.hpp"
#include "io/json_doc.hpp"

using namespace sweepcert;

static Rational Q(const char* s) {
  std::string why;
  auto q = parse_exact(s, &why);
  INFO(s << ": " << why);
  REQUIRE(q.has_value());
  return *q;
}

TEST_CASE("decimals and fractions parse to exact rationals") {
  CHECK(Q("12.75") == Rational(51, 4));
  CHECK(Q("-3e-2") == Rational(-3, 100));
  CHECK(Q("7/3") == Rational(7, 3));
  CHECK(Q("1.5") == Q("3/2"));
  CHECK(Q("15e-1") == Q("3/2"));
  CHECK(Q("0.1") == Rational(1, 10));  // never through a double
  CHECK(Q("-0") == 0);
  CHECK(Q("6/4") == Rational(3, 2));
  CHECK(Q("1E+3") == 1000);
  CHECK(Q("0.49") == Rational(49, 100));  // leading zeros are decimal, never octal
  CHECK(Q("010") == 10);
  CHECK(Q("08/09") == Rational(8, 9));
  CHECK(to_text(Q("6/4")) == "3/2");
  CHECK(to_text(Q("-12")) == "-12");
}

TEST_CASE("malformed numbers are refused with a reason") {
  for (const char* bad : {"", "1.", ".5", "1/0", "--1", "+1", "1e", "1e+", "abc", "1/2/3", "1.5/2",
                          " 1", "1 ", "0x10", "1e1001", "-/3"}) {
    std::string why;
    INFO("input: '" << bad << "'");
    CHECK_FALSE(parse_exact(bad, &why).has_value());
    CHECK_FALSE(why.empty());
  }
  std::string long_number(1001, '7');
  std::string why;
  CHECK_FALSE(parse_exact(long_number, &why).has_value());
  CHECK(why.find("1000") != std::string::npos);
}

TEST_CASE("JSON numbers are read from their raw text") {
  JsonDoc doc = JsonDoc::parse(R"({"a": 0.1, "b": 123456789012345678901234567890, "c": -3e-2})");
  Ref root(doc);
  CHECK(root.at("a").number() == Rational(1, 10));
  CHECK(root.at("b").number() == Rational(mpz_class("123456789012345678901234567890")));
  CHECK(root.at("c").number() == Rational(-3, 100));
}

TEST_CASE("JSON errors name where they are") {
  try {
    JsonDoc::parse("{\"a\": 1,\n \"a\": 2}");
    FAIL("duplicate key accepted");
  } catch (const InputError& e) {
    CHECK(std::string(e.what()).find("duplicate key") != std::string::npos);
    CHECK(e.where == "/a");
  }
  try {
    JsonDoc::parse("{\"a\": [1, 2,\n ]}");
    FAIL("bad JSON accepted");
  } catch (const InputError& e) {
    CHECK(e.where.find("line 2") != std::string::npos);
  }
  std::string deep(200000, '[');
  try {
    JsonDoc::parse(deep);
    FAIL("bracket bomb accepted");
  } catch (const InputError& e) {
    CHECK(std::string(e.what()).find("64") != std::string::npos);
  }
}

TEST_CASE("fractions built from integers are in lowest terms") {
  // GMP's mpq functions require canonical operands (GMP manual, "Rational Number Functions");
  // 105/5 left unreduced once made a route's times compare and divide wrongly.
  Rational q = fraction(105, 5);
  CHECK(q.get_num() == 21);
  CHECK(q.get_den() == 1);
  CHECK(fraction(44, 2) == Rational(22));
  CHECK(fraction(-6, 4) == parse_exact("-3/2", nullptr).value());
  CHECK(fraction(-6, 4).get_den() == 2);
}
