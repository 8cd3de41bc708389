// Hand-built sheet certificates (§4.3) and their tampered variants.
#include <catch2/catch.hpp>

#include "helpers.hpp"

using namespace sweepcheck_test;
using Catch::Matchers::Contains;
using Catch::Matchers::StartsWith;

namespace {

// Three fence sensors, the triple listed at t=0 only.
const std::string kLog3 = R"({"format": "sweepcert-contacts-1", "fence": ["F0", "F1", "F2"], "triangles": "listed",
  "frames": [{"t": "0", "pairs": [["F0", "F1"], ["F1", "F2"], ["F2", "F0"]], "triples": [["F0", "F1", "F2"]]},
             {"t": "1", "pairs": [["F0", "F1"], ["F1", "F2"], ["F2", "F0"]], "triples": []}]})";

std::string sheet3(const std::string& triangles, const std::string& winding = "1", const std::string& ring = "z",
                   const std::string& frames = R"(["0"])") {
  return certificate("sheet", "sweepcert-contacts-1", ring, frames,
                     R"("winding": ")" + winding + R"(", "triangles": )" + triangles + R"(, "prisms": [])");
}

// Four fence sensors and a hub H in contact with all of them; the fan triples at t=0 and t=1.
const std::string kHub = R"({"format": "sweepcert-contacts-1", "fence": ["F0", "F1", "F2", "F3"], "sensors": ["H"],
  "triangles": "listed",
  "frames": [
    {"t": "0", "pairs": [["F0", "F1"], ["F1", "F2"], ["F2", "F3"], ["F3", "F0"], ["H", "F0"], ["H", "F1"], ["H", "F2"], ["H", "F3"]],
     "triples": [["H", "F0", "F1"], ["H", "F1", "F2"], ["H", "F2", "F3"], ["H", "F3", "F0"]]},
    {"t": "1", "pairs": [["F0", "F1"], ["F1", "F2"], ["F2", "F3"], ["F3", "F0"], ["H", "F0"], ["H", "F1"], ["H", "F2"], ["H", "F3"]],
     "triples": [["H", "F0", "F1"], ["H", "F1", "F2"], ["H", "F2", "F3"], ["H", "F3", "F0"]]}]})";

// The fan at t=1 plus the four fence prisms over slab 0.
//   d(sum_i [H, F_i, F_i+1] at 1) = sum_i E(F_i, F_i+1, 1) = L_1   (the spokes cancel)
//   d(sum_i prism [F_i, F_i+1] over 0) = sum_i (V(F_i+1) - V(F_i)) - L_1 + L_0 = L_0 - L_1
// so the boundary is L_0: on the fence cylinder, winding 1 along every fence edge.
const std::string kHubTriangles =
    R"([[1, "H", "F0", "F1", "1"], [1, "H", "F1", "F2", "1"], [1, "H", "F2", "F3", "1"], [1, "H", "F3", "F0", "1"]])";
const std::string kHubPrisms = R"([[0, "F0", "F1", "1"], [0, "F1", "F2", "1"], [0, "F2", "F3", "1"], [0, "F3", "F0", "1"]])";

std::string hub_sheet(const std::string& triangles, const std::string& prisms) {
  return certificate("sheet", "sweepcert-contacts-1", "z", R"(["0", "1"])",
                     R"("winding": "1", "triangles": )" + triangles + R"(, "prisms": )" + prisms);
}

// Square fence of side 4, radius 2; D (radius 2) rests at (2,2) until t=5 and then moves to
// (6,2) at t=10.
const std::string kSquare = R"({"format": "sweepcert-scenario-1", "horizon": ["0", "10"],
  "fence": [{"id": "F0", "at": ["0", "0"], "radius": "2"}, {"id": "F1", "at": ["4", "0"], "radius": "2"},
            {"id": "F2", "at": ["4", "4"], "radius": "2"}, {"id": "F3", "at": ["0", "4"], "radius": "2"}],
  "sensors": [{"id": "D", "radius": "2", "track": [["0", "2", "2"], ["5", "2", "2"], ["10", "6", "2"]]}]})";

// The fan around D at frame k, each triangle with the midpoint of its fence edge as witness:
// (2,0) is at distance 2 from F0, F1 and from D at (2,2); likewise (4,2), (2,4), (0,2).
std::string square_fan(int k) {
  std::string s = std::to_string(k);
  return "[[" + s + R"(, "D", "F0", "F1", "1", "2", "0"], [)" + s + R"(, "D", "F1", "F2", "1", "4", "2"], [)" + s +
         R"(, "D", "F2", "F3", "1", "2", "4"], [)" + s + R"(, "D", "F3", "F0", "1", "0", "2"]])";
}

std::string square_sheet(const std::string& frames, const std::string& triangles, const std::string& prisms = "[]") {
  return certificate("sheet", "sweepcert-scenario-1", "z", frames,
                     R"("winding": "1", "triangles": )" + triangles + R"(, "prisms": )" + prisms);
}


}  // namespace

TEST_CASE("a single triangle on a three-sensor fence is a sheet", "[sheet]") {
  // d[F0,F1,F2] = E(F1,F2) - E(F0,F2) + E(F0,F1) = E(F0,F1) + E(F1,F2) + E(F2,F0) = L_0:
  // winding 1 along each fence edge, listed F0, F1, F2.
  accepted(kLog3, sheet3(R"([[0, "F0", "F1", "F2", "1"]])"));
  // [F1,F0,F2] = -[F0,F1,F2], so coefficient -1 on it is the same chain.
  accepted(kLog3, sheet3(R"([[0, "F1", "F0", "F2", "-1"]])"));
  // [F1,F2,F0] is an even permutation: the same cell, same sign.
  accepted(kLog3, sheet3(R"([[0, "F1", "F2", "F0", "1"]])"));
  // Coefficient 2 winds twice; over z2 the coefficient must be 1.
  accepted(kLog3, sheet3(R"([[0, "F0", "F1", "F2", "2"]])", "2"));
  accepted(kLog3, sheet3(R"([[0, "F0", "F1", "F2", "1"]])", "1", "z2"));
  // Beyond 64 bits: the exact path.
  accepted(kLog3, sheet3(R"([[0, "F0", "F1", "F2", "-100000000000000000000000"]])", "-100000000000000000000000"));
  // The frames may be any contiguous run of the log: here both frames, the cell at frame 0.
  accepted(kLog3, sheet3(R"([[0, "F0", "F1", "F2", "1"]])", "1", "z", R"(["0", 1])"));
}

TEST_CASE("64-bit overflow falls back to exact integers", "[sheet]") {
  // c = 6e18 on [F0,F1,F2] at 0 and on the prism [F0,F1] over slab 0: E(F0,F1,0) gets
  // c + c = 1.2e19 > 2^63 - 1, so the fast path overflows and the exact path takes over.
  // Boundary: E(F0,F1,0) 2c, E(F1,F2,0) c, E(F2,F0,0) c, E(F0,F1,1) -c, V(F1,0) c, V(F0,0) -c,
  // all on the fence cylinder; windings 2c - c = c, c, c.
  const std::string c = "6000000000000000000";
  accepted(kLog3, certificate("sheet", "sweepcert-contacts-1", "z", R"(["0", "1"])",
                              R"("winding": ")" + c + R"(", "triangles": [[0, "F0", "F1", "F2", ")" + c +
                                  R"("]], "prisms": [[0, "F0", "F1", ")" + c + R"("]])"));
  CHECK_THAT(rejected(kLog3, certificate("sheet", "sweepcert-contacts-1", "z", R"(["0", "1"])",
                                         R"("winding": "1", "triangles": [[0, "F0", "F1", "F2", ")" + c +
                                             R"("]], "prisms": [[0, "F0", "F1", ")" + c + R"("]])")),
             Contains("winds 6000000000000000000 times along this fence edge, not 1"));
}

TEST_CASE("from-pairs logs: a triangle exists when its three pairs do", "[sheet]") {
  std::string fp = R"({"format": "sweepcert-contacts-1", "fence": ["F0", "F1", "F2"],
    "triangles": {"from-pairs": {"contact-range": "1", "sensing-radius": "1"}},
    "frames": [{"t": "0", "pairs": [["F0", "F1"], ["F1", "F2"], ["F2", "F0"]]}]})";
  accepted(fp, sheet3(R"([[0, "F0", "F1", "F2", "1"]])"));
  std::string four = R"({"format": "sweepcert-contacts-1", "fence": ["F0", "F1", "F2", "F3"],
    "triangles": {"from-pairs": {"contact-range": "1", "sensing-radius": "1"}},
    "frames": [{"t": "0", "pairs": [["F0", "F1"], ["F1", "F2"], ["F2", "F3"], ["F3", "F0"]]}]})";
  CHECK_THAT(rejected(four, sheet3(R"([[0, "F0", "F1", "F2", "1"]])")),
             Contains("REJECTED: /triangles/0 triangle [F0,F1,F2] at frame 0 (t=0): the three sensors are not pairwise in contact"));
}

TEST_CASE("the fence orientation decides the sign of the winding", "[sheet][orientation]") {
  // Listed F0, F2, F1 the fence loop is E(F0,F2) + E(F2,F1) + E(F1,F0) = -d[F0,F1,F2].
  std::string reversed = kLog3;
  replace_all(reversed, R"("fence": ["F0", "F1", "F2"])", R"("fence": ["F0", "F2", "F1"])");
  CHECK_THAT(rejected(reversed, sheet3(R"([[0, "F0", "F1", "F2", "1"]])")),
             Contains("/winding fence edge [F0,F2]: the boundary winds -1 times along this fence edge, not 1 (rule 4.3.4)"));
  accepted(reversed, sheet3(R"([[0, "F0", "F1", "F2", "1"]])", "-1"));
  accepted(reversed, sheet3(R"([[0, "F0", "F1", "F2", "-1"]])", "1"));
  accepted(reversed, sheet3(R"([[0, "F0", "F1", "F2", "1"]])", "1", "z2"));  // -1 is odd
}

TEST_CASE("tampered three-sensor sheets are rejected", "[sheet]") {
  const std::string good = sheet3(R"([[0, "F0", "F1", "F2", "1"]])");
  // Removed cell: the boundary is 0, winding 0.
  CHECK_THAT(rejected(kLog3, sheet3("[]")), Contains("REJECTED: /winding fence edge [F0,F1]: the boundary winds 0 times"));
  // Changed coefficient.
  CHECK_THAT(rejected(kLog3, sheet3(R"([[0, "F0", "F1", "F2", "2"]])")), Contains("winds 2 times along this fence edge, not 1"));
  CHECK_THAT(rejected(kLog3, sheet3(R"([[0, "F0", "F1", "F2", "0"]])")), Contains("REJECTED: /triangles/0/4: zero value (rule 4.3.2)"));
  CHECK_THAT(rejected(kLog3, sheet3(R"([[0, "F0", "F1", "F2", "3"]])", "1", "z2")),
             Contains("REJECTED: /triangles/0/4: over z2 every value must be \"1\""));
  CHECK_THAT(rejected(kLog3, sheet3(R"([[0, "F0", "F1", "F2", "1"]])", "3", "z2")), Contains("REJECTED: /winding: winding must be \"1\" over z2"));
  CHECK_THAT(rejected(kLog3, sheet3(R"([[0, "F0", "F1", "F2", "1"]])", "0")), Contains("REJECTED: /winding: winding must be nonzero"));
  // The same cell twice, in another orientation.
  CHECK_THAT(rejected(kLog3, sheet3(R"([[0, "F0", "F1", "F2", "1"], [0, "F2", "F1", "F0", "1"]])")),
             Contains("REJECTED: /triangles/1 triangle [F2,F1,F0] at frame 0 (t=0): the cell appears twice (also /triangles/0"));
  // The triple is not listed at t=1.
  CHECK_THAT(rejected(kLog3, sheet3(R"([[1, "F0", "F1", "F2", "1"]])", "1", "z", R"(["0", "1"])")),
             Contains("REJECTED: /triangles/0 triangle [F0,F1,F2] at frame 1 (t=1): not a listed triple of the log at this frame (rule 4.3.1)"));
  CHECK_THAT(rejected(kLog3, sheet3(R"([[1, "F0", "F1", "F2", "1"]])")), Contains("REJECTED: /triangles/0/0: frame index 1 out of range"));
  CHECK_THAT(rejected(kLog3, sheet3(R"([[-1, "F0", "F1", "F2", "1"]])")), Contains("REJECTED: /triangles/0/0: frame index must be non-negative"));
  CHECK_THAT(rejected(kLog3, sheet3(R"([[0.0, "F0", "F1", "F2", "1"]])")), Contains("without fraction or exponent"));
  CHECK_THAT(rejected(kLog3, sheet3(R"([[0, "F0", "X", "F2", "1"]])")), Contains("REJECTED: /triangles/0/2 sensor \"X\": unknown sensor id"));
  CHECK_THAT(rejected(kLog3, sheet3(R"([[0, "F0", "F0", "F2", "1"]])")), Contains("REJECTED: /triangles/0/2 sensor \"F0\": repeated"));
  CHECK_THAT(rejected(kLog3, sheet3(R"([[0, "F0", "F1", "F2", 1]])")), Contains("REJECTED: /triangles/0/4: expected a decimal integer string"));
  CHECK_THAT(rejected(kLog3, sheet3(R"([[0, "F0", "F1", "F2", "1", "0", "0"]])")), Contains("REJECTED: /triangles/0: a row must be an array"));
  // Frames: not a log time; not contiguous.
  CHECK_THAT(rejected(kLog3, sheet3("[]", "1", "z", R"(["1/2"])")), Contains("REJECTED: /frames/0 t=1/2: not the time of any frame"));
  CHECK_THAT(rejected(kLog3, sheet3("[]", "1", "z", R"(["0", "1", "2"])")), Contains("REJECTED: /frames/2 t=2: runs past the last frame"));
  CHECK_THAT(rejected(kLog3, sheet3("[]", "1", "z", R"(["1", "0"])")), Contains("REJECTED: /frames/1 t=0: frames must increase strictly"));

  // Hash of another input.
  std::string other = kLog3;
  replace_all(other, R"("t": "1")", R"("t": "2")");
  std::string cert = good;
  replace_all(cert, "@HASH", sweepcheck::sha256_hex(other));
  CHECK_THAT(rejected(kLog3, cert), Contains("REJECTED: /input_sha256: does not match the SHA-256 of INPUT"));
  cert = good;
  replace_all(cert, "@HASH", std::string(64, 'A'));
  CHECK_THAT(rejected(kLog3, cert), Contains("REJECTED: /input_sha256: must be 64 lowercase hex digits"));
  cert = good;
  replace_all(cert, R"("input_format":"sweepcert-contacts-1")", R"("input_format":"sweepcert-scenario-1")");
  CHECK_THAT(rejected(kLog3, cert), Contains("REJECTED: /input_format: is \"sweepcert-scenario-1\" but INPUT is"));

  // Structure: duplicate key, unknown key, wrong format, wrong method keys, wrong types.
  cert = good;
  replace_all(cert, R"("ring":"z")", R"("ring":"z","ring":"z")");
  CHECK_THAT(rejected(kLog3, cert), Contains("REJECTED: /ring: duplicated key"));
  cert = good;
  replace_all(cert, R"("ring":"z")", R"("ring":"z","colour":"blue")");
  CHECK_THAT(rejected(kLog3, cert), Contains("REJECTED: /colour: unknown key"));
  cert = good;
  replace_all(cert, "sweepcert-certificate-1", "sweepcert-certificate-2");
  CHECK_THAT(rejected(kLog3, cert), Contains("REJECTED: /format: unsupported value"));
  cert = good;
  replace_all(cert, R"("ring":"z")", R"("ring":"z","fence_value":"1")");
  CHECK_THAT(rejected(kLog3, cert), Contains("REJECTED: /fence_value: key not allowed with method \"sheet\""));
  cert = good;
  replace_all(cert, R"("claim":"no-evasion")", R"("claim":"no-sheet")");
  CHECK_THAT(rejected(kLog3, cert), Contains("REJECTED: /method: method \"sheet\" does not go with claim \"no-sheet\""));
  cert = good;
  replace_all(cert, R"(, "prisms": [])", "");
  CHECK_THAT(rejected(kLog3, cert), Contains("REJECTED: /prisms: required key \"prisms\" is missing"));
  cert = good;
  replace_all(cert, R"("ring":"z")", R"("ring":"z","notes":{"a":[{"b":1,"b":2}]})");
  CHECK_THAT(rejected(kLog3, cert), Contains("REJECTED: /notes/a/0/b: duplicated key"));
  cert = good;
  replace_all(cert, R"("ring":"z")", R"("ring":"z","notes":{"anything":[1.5, null, true]})");
  accepted(kLog3, cert);
  CHECK_THAT(rejected(kLog3, "[]"), Contains("REJECTED: (root): expected object, found array"));
}

TEST_CASE("fan and fence prisms on a hub log", "[sheet]") {
  accepted(kHub, hub_sheet(kHubTriangles, kHubPrisms));
  // Rows in other orientations: prism [F1,F0] = -[F0,F1], triangle [F1,H,F2] = -[H,F1,F2].
  accepted(kHub, hub_sheet(R"([[1, "H", "F0", "F1", "1"], [1, "F1", "H", "F2", "-1"], [1, "H", "F2", "F3", "1"], [1, "H", "F3", "F0", "1"]])",
                           R"([[0, "F1", "F0", "-1"], [0, "F1", "F2", "1"], [0, "F2", "F3", "1"], [0, "F3", "F0", "1"]])"));
  // Without the prism of [F1,F2] the boundary runs up V(F1), along E(F1,F2) at t=1 and down
  // V(F2): still on the fence cylinder, winding still 1 along every edge, so still a sheet.
  accepted(kHub, hub_sheet(kHubTriangles, R"([[0, "F0", "F1", "1"], [0, "F2", "F3", "1"], [0, "F3", "F0", "1"]])"));
  // Without the triangle [H,F1,F2] the spokes E(H,F1,1), E(H,F2,1) stay in the boundary; the
  // first row touching such a cell is /triangles/0: d[H,F0,F1] contains -E(H,F1) = +[F1,H] in
  // canonical (byte) order, and [H,F1,F2] would have brought the -[F1,H] that cancels it.
  CHECK_THAT(rejected(kHub, hub_sheet(R"([[1, "H", "F0", "F1", "1"], [1, "H", "F2", "F3", "1"], [1, "H", "F3", "F0", "1"]])", kHubPrisms)),
             Contains("REJECTED: /triangles/0 edge [F1,H] at frame 1 (t=1) has boundary coefficient 1: the boundary has a nonzero "
                      "coefficient outside the fence cylinder"));
  // A prism of a pair that is not in contact.
  CHECK_THAT(rejected(kHub, hub_sheet(kHubTriangles, R"([[0, "F0", "F2", "1"]])")),
             Contains("REJECTED: /prisms/0 prism [F0,F2] over slab 0 (t=0..1): the edge is not present at frame 0 (t=0) (rule 4.3.1)"));
  CHECK_THAT(rejected(kHub, hub_sheet(kHubTriangles, R"([[1, "F0", "F1", "1"]])")), Contains("REJECTED: /prisms/0/0: slab index 1 out of range"));
  CHECK_THAT(rejected(kHub, hub_sheet(kHubTriangles, R"([[0, "F0", "F1", "1"], [0, "F1", "F0", "1"]])")),
             Contains("REJECTED: /prisms/1 prism [F1,F0] over slab 0 (t=0..1): the cell appears twice (also /prisms/0"));
}

TEST_CASE("positional sheets: witnesses, interpolation, frames", "[sheet][positional]") {
  accepted(kSquare, square_sheet(R"(["0"])", square_fan(0)));
  accepted(kSquare, square_sheet(R"(["0", "5"])", square_fan(1)));
  // Witness (2, -1/100) is at distance sqrt(4 + 1/10000) > 2 from D at (2,2).
  std::string fan = square_fan(0);
  replace_all(fan, R"("1", "2", "0"])", R"("1", "2", "-1/100"])");
  CHECK_THAT(rejected(kSquare, square_sheet(R"(["0"])", fan)),
             Contains("REJECTED: /triangles/0/5 triangle [D,F0,F1] at frame 0 (t=0): witness (2, -1/100) lies outside the disk of "
                      "sensor \"D\" (rule 4.3.1)"));
  // Waypoint t=5 lies strictly between the frames 0 and 10 but is not a frame.
  CHECK_THAT(rejected(kSquare, square_sheet(R"(["0", "10"])", square_fan(0))),
             Contains("REJECTED: /frames sensor \"D\" waypoint t=5: waypoint time strictly between"));
  CHECK_THAT(rejected(kSquare, square_sheet(R"(["-1"])", square_fan(0))), Contains("REJECTED: /frames/0 t=-1: frame outside the horizon"));
  // At t = 15/2, D is halfway from (2,2) to (6,2): at (4,2). The witness (4,2) of [D,F1,F2]
  // still works; (2,0) of [D,F0,F1] is at distance sqrt 8 > 2 from D.
  const std::string frames = R"(["0", "5", "15/2"])";
  const std::string one = R"([[2, "D", "F1", "F2", "1", "4", "2"]])";
  Run r = run(kSquare, square_sheet(frames, one));
  CHECK(r.code == 1);
  // The cell exists; but d[D,F1,F2] = E(F1,F2) - E(D,F2) + E(D,F1) leaves the spokes.
  CHECK_THAT(r.last(), Contains("/triangles/0 edge [D,F2] at frame 2 (t=15/2) has boundary coefficient -1"));
  CHECK_THAT(rejected(kSquare, square_sheet(frames, square_fan(2))),
             Contains("REJECTED: /triangles/0/5 triangle [D,F0,F1] at frame 2 (t=15/2): witness (2, 0) lies outside the disk of sensor \"D\""));
  // A positional row needs its witness.
  CHECK_THAT(rejected(kSquare, square_sheet(R"(["0"])", R"([[0, "D", "F0", "F1", "1"]])")), Contains("REJECTED: /triangles/0: a row must be an array"));
  // The fan at 5 with fence prisms over slab [0, 5]: F_i are fixed, so each fence pair is present
  // at both ends; the boundary is L_0 (see the hub log test).
  accepted(kSquare, square_sheet(R"(["0", "5"])", square_fan(1),
                                 R"([[0, "F0", "F1", "1"], [0, "F1", "F2", "1"], [0, "F2", "F3", "1"], [0, "F3", "F0", "1"]])"));
}
