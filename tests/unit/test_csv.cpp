// CSV splitting (RFC 4180): fields, their lines and columns, and the errors, derived by hand.
#include <catch2/catch.hpp>

#include "io/csv.hpp"
#include "io/input_error.hpp"

using namespace sweepcert;

namespace {

// The fields of every record as text, for comparison with a hand-written table.
std::vector<std::vector<std::string>> texts(const std::string& bytes) {
  std::vector<std::vector<std::string>> out;
  for (const auto& record : split_csv("t.csv", bytes)) {
    out.emplace_back();
    for (const auto& f : record) out.back().push_back(f.text);
  }
  return out;
}

std::string error_of(const std::string& bytes) {
  try {
    split_csv("t.csv", bytes);
  } catch (const InputError& e) {
    return e.where + ": " + e.what();
  }
  return "";
}

}  // namespace

TEST_CASE("CSV: plain records with LF or CRLF line ends and blank trailing lines", "[csv]") {
  using Table = std::vector<std::vector<std::string>>;
  Table want = {{"a", "b"}, {"1", "2"}};
  CHECK(texts("a,b\n1,2\n") == want);
  CHECK(texts("a,b\r\n1,2\r\n") == want);
  CHECK(texts("a,b\n1,2") == want);
  CHECK(texts("a,b\n1,2\n\n\r\n") == want);               // blank trailing lines dropped
  CHECK(texts("\xEF\xBB\xBF" "a,b\n1,2\n") == want);      // a byte-order mark is skipped
  CHECK(texts("a,b\n\n1,2\n") == Table{{"a", "b"}, {""}, {"1", "2"}});  // inner blank line kept
  CHECK(texts("a,\n,\n") == Table{{"a", ""}, {"", ""}});  // empty fields
  CHECK(texts("a,") == Table{{"a", ""}});
}

TEST_CASE("CSV: quoted fields with doubled quotes and separators inside", "[csv]") {
  auto records = split_csv("t.csv", "id,v\n\"a,\"\"b\"\"\nc\",\"7/3\"\nz,1\n");
  REQUIRE(records.size() == 3);
  CHECK(records[1][0].text == "a,\"b\"\nc");
  CHECK(records[1][1].text == "7/3");
  // The quoted field starts on line 2, column 1; the next field on line 3 after `c",`.
  CHECK(records[1][0].line == 2);
  CHECK(records[1][0].column == 1);
  CHECK(records[1][1].line == 3);
  CHECK(records[1][1].column == 4);
  // The record after the two-line field starts on line 4.
  CHECK(records[2][0].line == 4);
  CHECK(records[2][1].column == 3);
}

TEST_CASE("CSV: malformed quoting is refused with line and column", "[csv]") {
  CHECK(error_of("a,b\n1,\"2\n3,4\n") == "t.csv:2:3: unterminated quoted field (no closing '\"')");
  CHECK(error_of("a,b\n\"1\"x,2\n") == "t.csv:2:4: text after the closing quote of a quoted field");
  CHECK(error_of("a,b\n1\"2,3\n") == "t.csv:2:2: quote inside an unquoted field");
  CHECK(error_of("a,b\r1,2\n") == "t.csv:1:4: carriage return not followed by a line feed");
}
