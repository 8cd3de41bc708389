// Input validation: every broken rule gives one message naming the JSON pointer (schema §2).
#include <catch2/catch.hpp>
#include <nlohmann/json.hpp>

#include "json_helpers.hpp"

#include "io/input_error.hpp"
#include "io/read_input.hpp"

using namespace sweepcert;
using nlohmann::json;


namespace {

// A 4 x 4 square yard: fence every 2 units, radius 3/2, one drone crossing it.
json yard() {
  json fence = json::array();
  int pts[8][2] = {{0, 0}, {2, 0}, {4, 0}, {4, 2}, {4, 4}, {2, 4}, {0, 4}, {0, 2}};
  for (int i = 0; i < 8; ++i)
    fence.push_back({{"id", "F" + std::to_string(i)},
                     {"at", {std::to_string(pts[i][0]), std::to_string(pts[i][1])}},
                     {"radius", "3/2"}});
  return {{"format", "sweepcert-scenario-1"},
          {"title", "Test yard"},
          {"horizon", {"0", "10"}},
          {"fence", fence},
          {"sensors", {{{"id", "D1"}, {"radius", "1.5"}, {"track", {{"0", "0", "2"}, {"10", "4", "2"}}}}}}};
}

json log3() {
  return {{"format", "sweepcert-contacts-1"},
          {"fence", {"F0", "F1", "F2"}},
          {"triangles", "listed"},
          {"frames", {{{"t", "0"}, {"pairs", A({A({"F0", "F1"}), A({"F1", "F2"}), A({"F2", "F0"})})},
                       {"triples", {{"F0", "F1", "F2"}}}}}}};
}

// Runs `parse` on the document and returns "where: what", or "" when it is accepted.
template <class F>
std::string error_of(const json& doc, F parse) {
  try {
    parse(doc.dump());
    return "";
  } catch (const InputError& e) {
    return e.where + ": " + e.what();
  }
}
std::string scenario_error(const json& d) { return error_of(d, parse_scenario); }
std::string log_error(const json& d) { return error_of(d, parse_contacts); }

}  // namespace

TEST_CASE("a valid scenario and log are accepted") {
  CHECK(scenario_error(yard()) == "");
  Sweep s = parse_scenario(yard().dump());
  CHECK(s.fence_count == 8);
  CHECK(s.sensors.size() == 9);
  Point p = s.position(8, Rational(5, 2));
  CHECK(p.x == 1);
  CHECK(p.y == 2);
  CHECK(s.position(8, Rational(-5)).x == 0);  // held before the first waypoint
  CHECK(s.position(8, Rational(50)).x == 4);  // and after the last
  CHECK(log_error(log3()) == "");
}

TEST_CASE("scenario errors name the field") {
  json d = yard();
  d["format"] = "sweepcert-scenario-9";
  CHECK(scenario_error(d) == "/format: expected \"sweepcert-scenario-1\"");

  d = yard();
  d["sensors"][0]["track"].push_back({"10", "1", "1"});
  CHECK(scenario_error(d) == "/sensors/0/track/2/0: track times must strictly increase (10 after 10)");

  d = yard();
  d["sensors"][0]["radius"] = "-1";
  CHECK(scenario_error(d) == "/sensors/0/radius: radius must be positive");

  d = yard();
  d["sensors"][0]["id"] = "F3";
  CHECK(scenario_error(d) == "/sensors/0/id: duplicate sensor id \"F3\"");

  d = yard();
  d["fence"][1]["radius"] = "1/2";  // F1 at distance 2 from F0: 3/2 + 1/2 = 2 still touches
  CHECK(scenario_error(d) == "");
  d["fence"][1]["radius"] = "0.49";
  CHECK(scenario_error(d).rfind("/fence/1: fence gap", 0) == 0);

  d = yard();
  d["horizon"][1] = "1.2.3";
  CHECK(scenario_error(d).rfind("/horizon/1: malformed number", 0) == 0);

  d = yard();
  d["sensors"][0]["colour"] = "red";
  CHECK(scenario_error(d) == "/sensors/0/colour: unknown key \"colour\"");
}

TEST_CASE("a self-crossing fence is refused") {
  // A bow tie: (0,0) (2,2) (2,0) (0,2) -- edges 0-1 and 2-3 cross at (1,1). Radii 2 close gaps.
  json d = yard();
  d["fence"] = json::array();
  int pts[4][2] = {{0, 0}, {2, 2}, {2, 0}, {0, 2}};
  for (int i = 0; i < 4; ++i)
    d["fence"].push_back({{"id", "B" + std::to_string(i)},
                          {"at", {std::to_string(pts[i][0]), std::to_string(pts[i][1])}},
                          {"radius", "2"}});
  std::string e = scenario_error(d);
  CHECK(e.rfind("/fence/2: fence polygon is not simple", 0) == 0);
}

TEST_CASE("contact log errors name the field") {
  json d = log3();
  d["frames"].push_back(d["frames"][0]);
  CHECK(log_error(d) == "/frames/1/t: frame times must strictly increase (0 after 0)");

  d = log3();
  d["frames"][0]["pairs"].erase(2);
  CHECK(log_error(d).rfind("/frames/0/pairs: fence gap", 0) == 0);

  d = log3();
  d["frames"][0]["pairs"].push_back({"F0", "X"});
  d["frames"][0]["triples"].push_back({"F0", "F1", "X"});
  CHECK(log_error(d) == "/frames/0/triples/1: triple whose three pairs are not all listed in this frame");

  d = log3();
  d["sensors"] = {"A"};
  d["frames"][0]["pairs"].push_back({"F0", "X"});
  CHECK(log_error(d) == "/frames/0/pairs/3/1: unknown sensor id \"X\" (not in fence or sensors)");

  // Jung's theorem: pairs imply triples only when 3*Rs^2 >= Rc^2. With Rs = 1 the bound is
  // Rc <= sqrt(3) = 1.7320508075...; 1.7320508 is allowed, 1.7320509 is not.
  d = log3();
  d["frames"][0].erase("triples");
  d["triangles"] = {{"from-pairs", {{"contact-range", "1.7320508"}, {"sensing-radius", "1"}}}};
  CHECK(log_error(d) == "");
  d["triangles"]["from-pairs"]["contact-range"] = "1.7320509";
  CHECK(log_error(d).rfind("/triangles/from-pairs: triangles may come from pairs only when", 0) == 0);
}
