// Hand-built evasion routes (§4.6) and their tampered variants.
#include <catch2/catch.hpp>

#include "helpers.hpp"

using namespace sweepcheck_test;
using Catch::Matchers::Contains;
using Catch::Matchers::StartsWith;

namespace {

// The room of helpers.hpp without an interior sensor: the centre (2,2) is a hole, at distance 2
// from the nearest fence centres (2,0), (4,2), (2,4), (0,2), and 2^2 - (3/2)^2 = 7/4 > 0.
const std::string kHole = room("");

std::string route(const std::string& rows) {
  return R"({"format": "sweepcert-certificate-1", "claim": "evasion", "method": "route",
    "input_sha256": "@HASH", "input_format": "sweepcert-scenario-1", "route": )" + rows + "}";
}
const std::string kStay = R"([["0", "2", "2"], ["10", "2", "2"]])";


}  // namespace

TEST_CASE("standing still in a hole is an evasion route", "[route]") {
  Run r = accepted(kHole, route(kStay));
  CHECK_THAT(r.last(), Contains("an evasion path exists"));
  // Extra rows change nothing; a wander to (11/5, 2) and back keeps 9/5 > 3/2 from F3 = (4,2)
  // and more from every other fence centre.
  accepted(kHole, route(R"([["0", "2", "2"], ["3", "2", "2"], ["10", "2", "2"]])"));
  accepted(kHole, route(R"([["0", "2", "2"], ["5", "2.2", "2"], ["10", "2", "2"]])"));
  // A static interior sensor at the hole closes it: f(0) = 0 - 9/4.
  const std::string covered = room(R"({"id": "C", "radius": "1.5", "track": [["0", "2", "2"]]})");
  CHECK(rejected(covered, route(kStay)) ==
        "REJECTED: /route/1 piece t=[0, 10]: the route comes within the disk of sensor \"C\" at t=0 "
        "(|route - centre|^2 - r^2 = -9/4 <= 0) (rule 4.6.2)");
}

TEST_CASE("a route through a disk is rejected, naming the piece", "[route]") {
  // M, radius 1/4, drives from (2,1) at t=0 to (2,3) at t=10 past the standing route at (2,2):
  // d(t) = (0, 1 - t/5), f(t) = (1 - t/5)^2 - 1/16. f(0) = f(10) = 15/16 > 0, but on the piece
  // [0,10] (sigma = t/10): A = 4, B = -4, C = 15/16; the vertex sigma = 1/2 is inside and
  // 4AC - B^2 = 15 - 16 < 0: minimum (4AC - B^2)/(4A) = -1/16 at t = 5.
  const std::string passing = room(R"({"id": "M", "radius": "1/4", "track": [["0", "2", "1"], ["10", "2", "3"]]})");
  CHECK(rejected(passing, route(kStay)) ==
        "REJECTED: /route/1 piece t=[0, 10]: the route comes within the disk of sensor \"M\" inside the piece: the "
        "squared distance minus r^2 has its minimum -1/16 <= 0 at t=5 (rule 4.6.2)");
  // With a route row at t=5 the failure is at a piece end: f(5) = -1/16.
  CHECK(rejected(passing, route(R"([["0", "2", "2"], ["5", "2", "2"], ["10", "2", "2"]])")) ==
        "REJECTED: /route/1 piece t=[0, 5]: the route comes within the disk of sensor \"M\" at t=5 "
        "(|route - centre|^2 - r^2 = -1/16 <= 0) (rule 4.6.2)");
  // Tangent at the vertex is still a touch of the closed disk: M, radius 1, drives along x = 3
  // from (3,0) to (3,4); d = (-1, 2 - 2t/5), A = 16, B = -16, C = 4, 4AC - B^2 = 0 at t = 5.
  const std::string tangent = room(R"({"id": "M", "radius": "1", "track": [["0", "3", "0"], ["10", "3", "4"]]})");
  CHECK_THAT(rejected(tangent, route(kStay)), Contains("minimum 0 <= 0 at t=5"));
  // A route that walks into a fence disk: at t=5 it is at (2, 1/5), 1/5 from F1 = (2,0).
  CHECK(rejected(kHole, route(R"([["0", "2", "2"], ["5", "2", "0.2"], ["10", "2", "2"]])")) ==
        "REJECTED: /route/1 piece t=[0, 5]: the route comes within the disk of sensor \"F1\" at t=5 "
        "(|route - centre|^2 - r^2 = -221/100 <= 0) (rule 4.6.2)");
  // Later legs are named by the row that ends them.
  CHECK_THAT(rejected(kHole, route(R"([["0", "2", "2"], ["5", "2", "2"], ["10", "2", "0.2"]])")),
             StartsWith("REJECTED: /route/2 piece t=[5, 10]: the route comes within the disk of sensor \"F1\""));
}

TEST_CASE("sensor waypoints split the pieces", "[route]") {
  // N visits (2, 5/2) at t=4 and is far away at t=0 and t=6: the pieces for N are [0,4],
  // [4,6], [6,10]. With radius 1/4 the route at (2,2) is 1/2 from it at t=4: f(4) = 3/16 > 0,
  // and on [0,4] and [4,6] the distance is smallest at t=4 (N heads straight at (2, 5/2)).
  accepted(room(R"({"id": "N", "radius": "1/4", "track": [["0", "20", "20"], ["4", "2", "2.5"], ["6", "20", "20"]]})"),
           route(kStay));
  // With radius 3/4, f(4) = 1/4 - 9/16 < 0: the first piece [0,4] fails at its end.
  CHECK(rejected(room(R"({"id": "N", "radius": "3/4", "track": [["0", "20", "20"], ["4", "2", "2.5"], ["6", "20", "20"]]})"),
                 route(kStay)) ==
        "REJECTED: /route/1 piece t=[0, 4]: the route comes within the disk of sensor \"N\" at t=4 "
        "(|route - centre|^2 - r^2 = -5/16 <= 0) (rule 4.6.2)");
  // Waypoints outside the horizon do not split anything; N stays still at (20,20) after t=6.
  accepted(room(R"({"id": "N", "radius": "1", "track": [["-5", "2", "2"], ["-1", "20", "20"], ["20", "20", "20"]]})"),
           route(kStay));
  // The earliest failing piece wins across sensors: N touches the route on [0,4] (at t=4),
  // the route walks into F1 on [5,10].
  CHECK_THAT(rejected(room(R"({"id": "N", "radius": "3/4", "track": [["0", "20", "20"], ["4", "2", "2.5"], ["6", "20", "20"]]})"),
                      route(R"([["0", "2", "2"], ["5", "2", "2"], ["10", "2", "0.2"]])")),
             StartsWith("REJECTED: /route/1 piece t=[0, 4]: the route comes within the disk of sensor \"N\""));
}

TEST_CASE("the route must start strictly inside P and span the horizon", "[route]") {
  CHECK(rejected(kHole, route(R"([["0", "1", "0"], ["10", "2", "2"]])")) ==
        "REJECTED: /route/0 point (1, 0): the first point lies on the boundary of the fence polygon, on the edge "
        "sensor \"F0\" - sensor \"F1\", not strictly inside P (rule 4.6.1)");
  CHECK_THAT(rejected(kHole, route(R"([["0", "4", "4"], ["10", "2", "2"]])")),
             Contains("/route/0 point (4, 4): the first point lies on the boundary"));
  CHECK_THAT(rejected(kHole, route(R"([["0", "5", "2"], ["10", "5", "2"]])")),
             Contains("/route/0 point (5, 2): the first point lies outside the fence polygon"));
  // Ending early, starting late, out of order, too short, malformed rows.
  CHECK(rejected(kHole, route(R"([["0", "2", "2"], ["9", "2", "2"]])")) ==
        "REJECTED: /route/1/0 t=9: the route must end at the horizon end t=10 (§4.6)");
  CHECK_THAT(rejected(kHole, route(R"([["1", "2", "2"], ["10", "2", "2"]])")),
             Contains("REJECTED: /route/0/0 t=1: the route must start at the horizon start t=0"));
  CHECK_THAT(rejected(kHole, route(R"([["0", "2", "2"], ["5", "2", "2"], ["5", "2", "2"], ["10", "2", "2"]])")),
             Contains("REJECTED: /route/2/0 t=5: route times must increase strictly"));
  CHECK_THAT(rejected(kHole, route(R"([["0", "2", "2"]])")), Contains("/route: array has 1 elements"));
  CHECK_THAT(rejected(kHole, route(R"([["0", "2", "2"], ["10", "2"]])")), Contains("/route/1: array has 2 elements"));
  CHECK_THAT(rejected(kHole, route(R"([["0", "2", "2"], ["10", "2", "2.x"]])")), Contains("/route/1/2: malformed number"));
  // Header: the claim must be evasion, no keys of other methods, positional input only.
  std::string c = route(kStay);
  replace_all(c, R"("claim": "evasion")", R"("claim": "no-evasion")");
  CHECK_THAT(rejected(kHole, c), Contains("REJECTED: /method: method \"route\" does not go with claim \"no-evasion\""));
  c = route(kStay);
  replace_all(c, R"("route": [)", R"("frames": ["0"], "route": [)");
  CHECK_THAT(rejected(kHole, c), Contains("REJECTED: /frames: key not allowed with method \"route\""));
  c = route(kStay);
  replace_all(c, R"("route": [)", R"("notes": {"a": 1, "a": 2}, "route": [)");
  CHECK_THAT(rejected(kHole, c), Contains("REJECTED: /notes/a: duplicated key"));
  c = route(kStay);
  replace_all(c, R"("route": )", R"("rout": )");
  CHECK_THAT(rejected(kHole, c), Contains("REJECTED: /rout: unknown key"));
}
