// Margins (§4.1.1): the certificate is checked against the scenario with radii r - M (claim
// no-evasion) or r + M (claim evasion). Hand-built scenarios with the thresholds derived below.
#include <catch2/catch.hpp>

#include <vector>

#include "helpers.hpp"

using namespace sweepcheck_test;
using Catch::Matchers::Contains;
using Catch::Matchers::StartsWith;

namespace {

// `"margin": M, ` to put in front of a method's keys (empty M: no margin key).
std::string margin_key(const std::string& m) { return m.empty() ? "" : R"("margin": )" + m + ", "; }

// The room of helpers.hpp with C, radius 3/2, standing at its centre (2,2).
const std::string kCentre = room(R"({"id": "C", "radius": "1.5", "track": [["0", "2", "2"]]})");

// The fan around C at frame 0: d[C,F_i,F_i+1] = E(F_i,F_i+1) - E(C,F_i+1) + E(C,F_i); the
// spokes telescope away and the boundary is L_0, winding 1. Each triple is a right isosceles
// triangle with legs 2 (right angle at the fence sensor on a side's midpoint), so its smallest
// enclosing disk is the one on its hypotenuse: centre at the hypotenuse's midpoint, radius
// sqrt 2. That midpoint is the witness; the triple shares a point iff every radius >= sqrt 2.
const std::string kFan =
    R"([[0, "C", "F0", "F1", "1", "1", "1"], [0, "C", "F1", "F2", "1", "3", "1"], [0, "C", "F2", "F3", "1", "3", "1"],
        [0, "C", "F3", "F4", "1", "3", "3"], [0, "C", "F4", "F5", "1", "3", "3"], [0, "C", "F5", "F6", "1", "1", "3"],
        [0, "C", "F6", "F7", "1", "1", "3"], [0, "C", "F7", "F0", "1", "1", "1"]])";

std::string fan_sheet(const std::string& margin, const std::string& triangles = kFan) {
  return certificate("sheet", "sweepcert-scenario-1", "z", R"(["0"])",
                     margin_key(margin) + R"("winding": "1", "triangles": )" + triangles + R"(, "prisms": [])");
}

std::string route(const std::string& margin, const std::string& rows) {
  return R"({"format": "sweepcert-certificate-1", "claim": "evasion", "method": "route", )" + margin_key(margin) +
         R"("input_sha256": "@HASH", "input_format": "sweepcert-scenario-1", "route": )" + rows + "}";
}

// The cover tree of test_chambers.cpp over Q = [-2, 6]^2 for kCentre: P = [0,4]^2 as sixteen
// unit cells, each covered by the sensor at one of its corners or its own corner nearest C; the
// far corner of every covered cell is at distance sqrt 2 from its sensor (e.g. [0,1]^2 by F0 at
// (0,0), far corner (1,1)). Table: F0..F7 are entries 0..7, C is 8.
std::vector<int> cover_tree() {
  return {-1,
          -1, -3, -3, -3, -1, 0, 1, 7, 8,
          -1, -3, -3, -1, 1, 2, 8, 3, -3,
          -1, -3, -1, 7, 8, 6, 5, -3, -3,
          -1, -1, 8, 3, 5, 4, -3, -3, -3};
}

std::string chambers(const std::string& margin) {
  std::string tree;
  for (int t : cover_tree()) tree += (tree.empty() ? "" : ", ") + std::to_string(t);
  return R"({"format": "sweepcert-certificate-1", "claim": "no-evasion", "method": "chambers", )" + margin_key(margin) +
         R"("input_sha256": "@HASH", "input_format": "sweepcert-scenario-1",
    "square": {"origin": ["-2", "-2"], "side": "8"}, "sensors": ["F0", "F1", "F2", "F3", "F4", "F5", "F6", "F7", "C"],
    "slabs": [{"t": ["0", "10"], "tree": [)" + tree + "]}]}";
}

}  // namespace

TEST_CASE("a sheet whose triangle stops existing when the radii shrink", "[margin][sheet]") {
  accepted(kCentre, fan_sheet(""));
  // M = 0 written out is the same as no margin.
  accepted(kCentre, fan_sheet(R"("0")"));
  // M = 1/20: radii 29/20, (29/20)^2 = 841/400 >= 2: every witness still in all three disks.
  // Fence links: consecutive centres 2 apart, 29/20 + 29/20 >= 2.
  Run r = accepted(kCentre, fan_sheet(R"("1/20")"));
  CHECK_THAT(r.out, Contains("margin: 1/20, every radius shrunk to r - 1/20"));
  CHECK_THAT(r.last(), Contains("with margin 1/20: this holds even if each sensor's centre is anywhere within 1/20"));
  // M = 1/10: radii 7/5, (7/5)^2 = 49/25 < 2 = |(1,1) - (2,2)|^2. The row names C first.
  CHECK(rejected(kCentre, fan_sheet(R"("1/10")")) ==
        "REJECTED: /triangles/0/5 triangle [C,F0,F1] at frame 0 (t=0): witness (1, 1) lies outside the disk of sensor "
        "\"C\" (rule 4.3.1)");
  // Not just this witness: the triple's smallest enclosing disk has radius sqrt 2 > 7/5, so no
  // point works; e.g. the centroid (4/3, 2/3) is 20/9 > 49/25 from C (and from F0).
  std::string centroid = kFan;
  replace_all(centroid, R"([0, "C", "F0", "F1", "1", "1", "1"])", R"([0, "C", "F0", "F1", "1", "4/3", "2/3"])");
  CHECK_THAT(rejected(kCentre, fan_sheet(R"("1/10")", centroid)),
             Contains("/triangles/0/5 triangle [C,F0,F1] at frame 0 (t=0): witness (4/3, 2/3) lies outside"));
}

TEST_CASE("prism edges are tested with the shrunk radii", "[margin][sheet]") {
  // A mobile sensor S (radius 1/2) stands at (1, -1.4) for t in [0, 10], below the fence edge
  // F0-F1. {F0, S}: |(1, -7/5)|^2 = 1 + 49/25 = 74/25, (3/2 + 1/2)^2 = 4: present at both ends of
  // slab 0. With M = 1/5: (13/10 + 3/10)^2 = 64/25 < 74/25: absent. The sheet is only the prism
  // [F0, S] (its boundary is off the cylinder), so without a margin it passes rule 1 and fails
  // rule 3; with the margin it fails rule 1.
  const std::string outside = room(R"({"id": "S", "radius": "0.5", "track": [["0", "1", "-1.4"]]})");
  const auto cert = [](const std::string& margin) {
    return certificate("sheet", "sweepcert-scenario-1", "z", R"(["0", "10"])",
                       margin_key(margin) + R"("winding": "1", "triangles": [], "prisms": [[0, "F0", "S", "1"]])");
  };
  CHECK_THAT(rejected(outside, cert("")), Contains("the boundary has a nonzero coefficient outside the fence cylinder"));
  CHECK(rejected(outside, cert(R"("1/5")")) ==
        "REJECTED: /prisms/0 prism [F0,S] over slab 0 (t=0..10): the edge is not present at frame 0 (t=0) (rule 4.3.1)");
}

TEST_CASE("a route that passes at distance 1/2 from a disk of radius 1/4", "[margin][route]") {
  // The route stands at (2,2) in the hole of the room; M (radius 1/4) drives along x = 5/2 from
  // (5/2, 0) at t=0 to (5/2, 4) at t=10, closest at t=5: d = 1/2. The route clears the grown disk
  // iff 1/4 + margin < 1/2, i.e. margin < d - r = 1/4. On the piece [0,10], sigma = t/10:
  // route - centre = (-1/2, 2 - 4 sigma): A = 16, B = -16, C = 17/4 - (1/4 + m)^2; the vertex
  // sigma = 1/2 is inside, and 4AC - B^2 = 64 C - 256 > 0 iff C > 4 iff (1/4 + m)^2 < 1/4.
  // The fence (centres 2 or more from (2,2), radii 3/2 + m) asks only m < 1/2.
  const std::string driver = room(R"({"id": "M", "radius": "1/4", "track": [["0", "2.5", "0"], ["10", "2.5", "4"]]})");
  const std::string stay = R"([["0", "2", "2"], ["10", "2", "2"]])";
  accepted(driver, route("", stay));
  accepted(driver, route(R"("1/5")", stay));
  // m = 0.2499: C = 17/4 - 0.4999^2 = 4.00009999 > 4.
  Run r = accepted(driver, route(R"("0.2499")", stay));
  CHECK_THAT(r.out, Contains("margin: 2499/10000, every radius grown to r + 2499/10000 (§4.1.1)"));
  CHECK_THAT(r.last(), Contains("with margin 2499/10000: the route keeps clear of every disk"));
  // m = 1/4: C = 4, 4AC - B^2 = 0, a touch at t = 5: minimum (4AC - B^2)/(4A) = 0.
  CHECK(rejected(driver, route(R"("1/4")", stay)) ==
        "REJECTED: /route/1 piece t=[0, 10]: the route comes within the disk of sensor \"M\" inside the piece: the "
        "squared distance minus r^2 has its minimum 0 <= 0 at t=5 (rule 4.6.2)");
  // m = 1/2: the fence disks reach (2,2) as well; at t=0 F1 at (2,0) gives 4 - 2^2 = 0, and F1 is
  // the first in byte order among the sensors failing on the earliest piece.
  CHECK(rejected(driver, route(R"("1/2")", stay)) ==
        "REJECTED: /route/1 piece t=[0, 10]: the route comes within the disk of sensor \"F1\" at t=0 "
        "(|route - centre|^2 - r^2 = 0 <= 0) (rule 4.6.2)");
}

TEST_CASE("a chamber cell no longer covered after shrinking", "[margin][chambers]") {
  accepted(kCentre, chambers(""));
  // Every covered cell has its far corner sqrt 2 from its sensor: M = 1/20 keeps (29/20)^2 >= 2.
  accepted(kCentre, chambers(R"("1/20")"));
  // M = 1/10: the first covered cell in token order, [0,1]^2 by F0: corners (0,0), (1,0), (0,1)
  // are within 7/5, the fourth (1,1) is sqrt 2 > 7/5 away.
  CHECK(rejected(kCentre, chambers(R"("1/10")")) ==
        "REJECTED: /slabs/0/tree/6 cell [0, 1]x[0, 1] in slab t=[0, 10]: corner (1, 1) is outside the disk of sensor "
        "\"F0\" at t=0 (rule 4.5.1)");
}

TEST_CASE("a margin is refused on cocycles and contact logs", "[margin]") {
  // Three fence disks of radius 23/10 around the triangle (0,0), (4,0), (2,4): links of length 4
  // and sqrt 20 < 46/10 meet; the circumradius 5/2 > 23/10, so no triple. phi = 1 on E(F0,F1) at
  // the single frame: no 2-cell to test, phi(L_0) = 1.
  const std::string tri = R"({"format": "sweepcert-scenario-1", "horizon": ["0", "1"],
    "fence": [{"id": "F0", "at": ["0", "0"], "radius": "2.3"}, {"id": "F1", "at": ["4", "0"], "radius": "2.3"},
              {"id": "F2", "at": ["2", "4"], "radius": "2.3"}], "sensors": []})";
  const auto cocycle = [](const std::string& margin) {
    return certificate("cocycle", "sweepcert-scenario-1", "z", R"(["0"])",
                       margin_key(margin) + R"("fence_value": "1", "edges": [[0, "F0", "F1", "1"]], "verticals": [])");
  };
  accepted(tri, cocycle(""));
  CHECK(rejected(tri, cocycle(R"("0")")) == "REJECTED: /margin: a margin is not allowed on a cocycle certificate (§4.1.1)");

  const std::string log = R"({"format": "sweepcert-contacts-1", "fence": ["F0", "F1", "F2"], "triangles": "listed",
    "frames": [{"t": "0", "pairs": [["F0", "F1"], ["F1", "F2"], ["F2", "F0"]], "triples": [["F0", "F1", "F2"]]}]})";
  const auto sheet = [](const std::string& margin) {
    return certificate("sheet", "sweepcert-contacts-1", "z", R"(["0"])",
                       margin_key(margin) + R"("winding": "1", "triangles": [[0, "F0", "F1", "F2", "1"]], "prisms": [])");
  };
  accepted(log, sheet(""));
  CHECK(rejected(log, sheet(R"("1/10")")) ==
        "REJECTED: /margin: a margin needs a positional scenario (sweepcert-scenario-1) as input, not a contact log "
        "(§4.1.1)");
}

TEST_CASE("malformed and negative margins", "[margin]") {
  CHECK(rejected(kCentre, fan_sheet(R"("-1/10")")) == "REJECTED: /margin M=-1/10: the margin must be >= 0 (§4.1.1)");
  CHECK(rejected(kCentre, fan_sheet("-0.5")) == "REJECTED: /margin M=-1/2: the margin must be >= 0 (§4.1.1)");
  for (const char* bad : {R"("1/0")", R"("0x1")", R"(" 1")", "true", "[1]", R"("")"}) {
    INFO(bad);
    CHECK_THAT(rejected(kCentre, fan_sheet(bad)), StartsWith("REJECTED: /margin: "));
  }
  // Duplicated: §1.4.
  CHECK_THAT(rejected(kCentre, fan_sheet(R"("0", "margin": "0")")), StartsWith("REJECTED: /margin"));
}

TEST_CASE("a margin that empties a disk or opens the fence", "[margin]") {
  // Rectangle fence F0 (0,0) and F1 (4,0) of radius 3, F2 (4,2) and F3 (0,2) of radius 5/2.
  // Links: F0-F1 length 4 <= 6, F1-F2 2 <= 11/2, F2-F3 4 <= 5, F3-F0 2 <= 11/2.
  // Sheet: [F0,F1,F2] + [F0,F2,F3] has boundary E(F0,F1) + E(F1,F2) + E(F2,F3) - E(F0,F3) = L_0
  // (the diagonal E(F0,F2) cancels). Witness (2,1): |.|^2 = 5 from every centre, <= 25/4 and 9.
  const std::string rect = R"({"format": "sweepcert-scenario-1", "horizon": ["0", "1"],
    "fence": [{"id": "F0", "at": ["0", "0"], "radius": "3"}, {"id": "F1", "at": ["4", "0"], "radius": "3"},
              {"id": "F2", "at": ["4", "2"], "radius": "2.5"}, {"id": "F3", "at": ["0", "2"], "radius": "2.5"}],
    "sensors": [{"id": "A", "radius": "1/10", "track": [["0", "20", "20"]]}]})";
  const auto sheet = [](const std::string& margin) {
    return certificate("sheet", "sweepcert-scenario-1", "z", R"(["0"])",
                       margin_key(margin) + R"("winding": "1", "triangles": [[0, "F0", "F1", "F2", "1", "2", "1"],
                         [0, "F0", "F2", "F3", "1", "2", "1"]], "prisms": [])");
  };
  accepted(rect, sheet(""));
  // M = 1/20: A keeps 1/20 > 0; 5 <= (49/20)^2 = 2401/400; F2-F3: (49/10)^2 >= 16.
  accepted(rect, sheet(R"("1/20")"));
  // M = 1/10: A's radius becomes 0 (A is first in byte order).
  CHECK(rejected(rect, sheet(R"("1/10")")) ==
        "REJECTED: /margin sensor \"A\": its radius 1/10 minus the margin 1/10 is 0, not > 0 (§4.1.1)");
  // The same scenario without A: M = 3 brings F0 to 0 (F0 is checked before F2, whose 5/2 - 3 < 0).
  std::string no_a = rect;
  replace_all(no_a, R"({"id": "A", "radius": "1/10", "track": [["0", "20", "20"]]})", "");
  CHECK(rejected(no_a, sheet(R"("3")")) ==
        "REJECTED: /margin sensor \"F0\": its radius 3 minus the margin 3 is 0, not > 0 (§4.1.1)");
  // M = 3/4: F0-F1 (9/4 + 9/4 = 9/2 >= 4) holds; F2-F3: 7/4 + 7/4 = 7/2 < 4 opens.
  CHECK(rejected(no_a, sheet(R"("3/4")")) ==
        "REJECTED: /margin fence pair \"F2\", \"F3\": with radii shrunk by the margin 3/4 the two fence disks no "
        "longer meet: |c_i - c_j|^2 = 16 > (r_i + r_j)^2 = 49/4 (§2.1 rule, §4.1.1)");
  // M = 1/2 keeps F2-F3 tangent (2 + 2 = 4), but the witness is then sqrt 5 > 2 from F2.
  CHECK_THAT(rejected(no_a, sheet(R"("1/2")")), Contains("/triangles/0/5 triangle [F0,F1,F2] at frame 0 (t=0): witness (2, 1)"));
}
