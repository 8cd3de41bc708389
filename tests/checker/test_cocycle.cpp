// Hand-built cocycle certificates (§4.4) and their tampered variants.
#include <catch2/catch.hpp>

#include "helpers.hpp"

using namespace sweepcheck_test;
using Catch::Matchers::Contains;
using Catch::Matchers::StartsWith;

namespace {

// Four fence sensors in a cycle, no triples, at t=0 and t=1: no triangle exists, so no sheet.
const std::string kRing4 = R"({"format": "sweepcert-contacts-1", "fence": ["F0", "F1", "F2", "F3"], "triangles": "listed",
  "frames": [{"t": "0", "pairs": [["F0", "F1"], ["F1", "F2"], ["F2", "F3"], ["F3", "F0"]], "triples": []},
             {"t": "1", "pairs": [["F0", "F1"], ["F1", "F2"], ["F2", "F3"], ["F3", "F0"]], "triples": []}]})";

std::string cocycle(const std::string& input_format, const std::string& frames, const std::string& edges,
                    const std::string& verticals, const std::string& fence_value = "1", const std::string& ring = "z") {
  return certificate("cocycle", input_format, ring, frames,
                     R"("fence_value": ")" + fence_value + R"(", "edges": )" + edges + R"(, "verticals": )" + verticals);
}

std::string ring4(const std::string& edges, const std::string& verticals, const std::string& fence_value = "1",
                  const std::string& ring = "z") {
  return cocycle("sweepcert-contacts-1", R"(["0", "1"])", edges, verticals, fence_value, ring);
}

// phi = 1 on E(F0,F1,0), 1 on E(F3,F0,1) (= -1 on the canonical [F0,F3]), 1 on V(F0,0):
//   prism [F0,F1]: phi V(F1) - phi V(F0) - phi E(F0,F1,1) + phi E(F0,F1,0) = 0 - 1 - 0 + 1 = 0
//   prism [F0,F3]: phi V(F3) - phi V(F0) - phi E(F0,F3,1) + phi E(F0,F3,0) = 0 - 1 + 1 + 0 = 0
//   prisms [F1,F2], [F2,F3]: all terms 0.  phi(L_0) = phi E(F0,F1,0) = 1.
const std::string kEdges = R"([[0, "F0", "F1", "1"], [1, "F3", "F0", "1"]])";
const std::string kVerticals = R"([[0, "F0", "1"]])";


}  // namespace

TEST_CASE("a four-sensor fence without triples has a cocycle", "[cocycle]") {
  // phi = 1 on E(F0,F1,0) and on E(F0,F1,1): every prism sums to 0, phi(L_0) = 1.
  accepted(kRing4, ring4(R"([[0, "F0", "F1", "1"], [1, "F0", "F1", "1"]])", "[]"));
  accepted(kRing4, ring4(R"([[0, "F0", "F1", "1"], [1, "F0", "F1", "1"]])", "[]", "1", "z2"));
  accepted(kRing4, ring4(R"([[0, "F1", "F0", "-1"], [1, "F1", "F0", "-1"]])", "[]"));  // same cochain
  accepted(kRing4, ring4(kEdges, kVerticals));
  // Single frame: no prisms at all.
  accepted(kRing4, cocycle("sweepcert-contacts-1", R"(["1"])", R"([[0, "F2", "F3", "-7"]])", "[]", "-7"));
  // Values beyond 64 bits take the exact path.
  accepted(kRing4, ring4(R"([[0, "F0", "F1", "99999999999999999999999"], [1, "F0", "F1", "99999999999999999999999"]])", "[]",
                         "99999999999999999999999"));
}

TEST_CASE("tampered cocycles are rejected", "[cocycle]") {
  // Removed row: the prism [F0,F1] sums to -0 - 0 - 0 + 1 = 1.
  CHECK_THAT(rejected(kRing4, ring4(kEdges, "[]")),
             Contains("REJECTED: /edges/0 prism [F0,F1] over slab 0 (t=0..1): phi(boundary) = 1, but a cocycle must vanish"));
  // Changed value: prism [F0,F3] sums to 0 - 1 + 2 + 0 = 1; the first row on it is /edges/1.
  CHECK_THAT(rejected(kRing4, ring4(R"([[0, "F0", "F1", "1"], [1, "F3", "F0", "2"]])", kVerticals)),
             Contains("REJECTED: /edges/1 prism [F0,F3] over slab 0 (t=0..1): phi(boundary) = 1"));
  CHECK_THAT(rejected(kRing4, ring4(kEdges, kVerticals, "2")),
             Contains("REJECTED: /fence_value fence loop L_0 at frame 0 (t=0): phi(L_0) = 1 but fence_value is 2 (rule 4.4.3)"));
  CHECK_THAT(rejected(kRing4, ring4(kEdges, kVerticals, "0")), Contains("REJECTED: /fence_value: must be nonzero"));
  CHECK_THAT(rejected(kRing4, ring4(R"([[0, "F0", "F2", "1"]])", "[]")),
             Contains("REJECTED: /edges/0 edge [F0,F2] at frame 0 (t=0): the edge is not present at this frame (rule 4.4.1)"));
  CHECK_THAT(rejected(kRing4, ring4(kEdges, R"([[1, "F0", "1"]])")), Contains("REJECTED: /verticals/0/0: slab index 1 out of range"));
  CHECK_THAT(rejected(kRing4, ring4(kEdges, R"([[0, "F0", "1"], [0, "F0", "1"]])")),
             Contains("REJECTED: /verticals/1 vertical V(F0) over slab 0 (t=0..1): the cell appears twice"));
  CHECK_THAT(rejected(kRing4, ring4(R"([[0, "F0", "F1", "1"], [0, "F1", "F0", "1"]])", "[]")),
             Contains("REJECTED: /edges/1 edge [F1,F0] at frame 0 (t=0): the cell appears twice (also /edges/0"));
  CHECK_THAT(rejected(kRing4, ring4(R"([[0, "F0", "F1", "2"], [1, "F0", "F1", "2"]])", "[]", "1", "z2")),
             Contains("REJECTED: /edges/0/3: over z2 every value must be \"1\""));
  CHECK_THAT(rejected(kRing4, ring4(R"([[0, "F0", "F1", "0"]])", "[]")), Contains("REJECTED: /edges/0/3: zero value"));
  std::string cert = ring4(kEdges, kVerticals);
  replace_all(cert, R"("fence_value")", R"("winding": "1", "fence_value")");
  CHECK_THAT(rejected(kRing4, cert), Contains("REJECTED: /winding: key not allowed with method \"cocycle\""));
}

TEST_CASE("cocycle sums that overflow 64 bits are redone exactly", "[cocycle]") {
  // prism [F0,F1]: phi V(F1) - phi V(F0) - phi E(F0,F1,1) + phi E(F0,F1,0)
  //              = 0 + 6e18 - 0 + 6e18 = 1.2e19, beyond int64: the exact path reports it.
  CHECK_THAT(rejected(kRing4, ring4(R"([[0, "F0", "F1", "6000000000000000000"]])", R"([[0, "F0", "-6000000000000000000"]])",
                                    "6000000000000000000")),
             Contains("REJECTED: /edges/0 prism [F0,F1] over slab 0 (t=0..1): phi(boundary) = 12000000000000000000"));
}

TEST_CASE("the checker enumerates triangles itself", "[cocycle]") {
  // Listed triple [F0,F1,F2]: phi(d[F0,F1,F2]) = phi E(F1,F2) - phi E(F0,F2) + phi E(F0,F1) = 1.
  const std::string log3 = R"({"format": "sweepcert-contacts-1", "fence": ["F0", "F1", "F2"], "triangles": "listed",
    "frames": [{"t": "0", "pairs": [["F0", "F1"], ["F1", "F2"], ["F2", "F0"]], "triples": [["F2", "F1", "F0"]]}]})";
  CHECK_THAT(rejected(log3, cocycle("sweepcert-contacts-1", R"(["0"])", R"([[0, "F0", "F1", "1"]])", "[]")),
             Contains("REJECTED: /edges/0 triangle [F0,F1,F2] at frame 0 (t=0): phi(boundary) = 1"));
  // From pairs: the diagonal F0-F2 closes the triangles [F0,F1,F2] and [F0,F2,F3].
  std::string fp = R"({"format": "sweepcert-contacts-1", "fence": ["F0", "F1", "F2", "F3"],
    "triangles": {"from-pairs": {"contact-range": "1", "sensing-radius": "1"}},
    "frames": [{"t": "0", "pairs": [["F0", "F1"], ["F1", "F2"], ["F2", "F3"], ["F3", "F0"]PLUS]}]})";
  std::string without = fp, with = fp;
  replace_all(without, "PLUS", "");
  replace_all(with, "PLUS", R"(, ["F2", "F0"])");
  accepted(without, cocycle("sweepcert-contacts-1", R"(["0"])", R"([[0, "F0", "F1", "1"]])", "[]"));
  CHECK_THAT(rejected(with, cocycle("sweepcert-contacts-1", R"(["0"])", R"([[0, "F0", "F1", "1"]])", "[]")),
             Contains("REJECTED: /edges/0 triangle [F0,F1,F2] at frame 0 (t=0)"));
  // phi = 1 on E(F0,F1) and E(F0,F2): [F0,F1,F2] gives 0 - 1 + 1 = 0, [F0,F2,F3] gives 0 - 0 + 1.
  CHECK_THAT(rejected(with, cocycle("sweepcert-contacts-1", R"(["0"])", R"([[0, "F0", "F1", "1"], [0, "F0", "F2", "1"]])", "[]")),
             Contains("REJECTED: /edges/1 triangle [F0,F2,F3] at frame 0 (t=0): phi(boundary) = 1"));
}

TEST_CASE("positional cocycles: pairs and triples computed exactly", "[cocycle][positional]") {
  // Square of side 4, radius 2: only the sides are pairs (the diagonal is sqrt 32 > 4), so there
  // is no triangle. A sensor D of radius 1 at (2,2) touches every fence disk (sqrt 8 <= 3), yet
  // no triple exists: F0 and F1 share only (2,0), at distance 2 > 1 from D.
  std::string square = R"({"format": "sweepcert-scenario-1", "horizon": ["0", "10"],
    "fence": [{"id": "F0", "at": ["0", "0"], "radius": "2"}, {"id": "F1", "at": ["4", "0"], "radius": "2"},
              {"id": "F2", "at": ["4", "4"], "radius": "2"}, {"id": "F3", "at": ["0", "4"], "radius": "2"}],
    "sensors": [{"id": "D", "radius": "RD", "track": [["0", "2", "2"]]}]})";
  std::string small = square, big = square;
  replace_all(small, "RD", "1");
  replace_all(big, "RD", "2");
  const std::string phi = R"([[0, "F0", "F1", "1"], [1, "F0", "F1", "1"]])";
  accepted(small, cocycle("sweepcert-scenario-1", R"(["0", "10"])", phi, "[]"));
  // Radius 2: (2,0) lies in D, so [D,F0,F1] is present and phi(d[D,F0,F1]) = phi E(F0,F1) = 1.
  CHECK_THAT(rejected(big, cocycle("sweepcert-scenario-1", R"(["0", "10"])", phi, "[]")),
             Contains("REJECTED: /edges/0 triangle [D,F0,F1] at frame 0 (t=0): phi(boundary) = 1"));
  CHECK_THAT(rejected(small, cocycle("sweepcert-scenario-1", R"(["0", "10"])", R"([[0, "D", "F2", "1"]])", "[]")),
             Contains("REJECTED: /edges/0 prism [D,F2] over slab 0 (t=0..10): phi(boundary) = 1"));
}

TEST_CASE("only the 2-cells incident to the support are evaluated", "[cocycle][incident]") {
  // One frame: the fence square, a sensor X touching F0 and F1 (listed triple [F0,F1,X]) and,
  // far from everything, a listed triangle [A,B,C] whose edges phi never lists.
  const std::string log = R"({"format": "sweepcert-contacts-1", "fence": ["F0", "F1", "F2", "F3"], "triangles": "listed",
    "frames": [{"t": "0", "pairs": [["F0", "F1"], ["F1", "F2"], ["F2", "F3"], ["F3", "F0"], ["F0", "X"], ["F1", "X"],
                                    ["A", "B"], ["B", "C"], ["A", "C"]],
                "triples": [["A", "B", "C"], ["F0", "F1", "X"]]}]})";
  auto one_frame = [](const std::string& edges) { return cocycle("sweepcert-contacts-1", R"(["0"])", edges, "[]"); };
  // Wrong only on [F0,F1,X], which has the listed face E(F0,F1): phi(d) = 0 - 0 + 1.
  CHECK_THAT(rejected(log, one_frame(R"([[0, "F0", "F1", "1"]])")),
             Contains("REJECTED: /edges/0 triangle [F0,F1,X] at frame 0 (t=0): phi(boundary) = 1"));
  // Right: phi(E(F0,X)) = 1 as well gives 0 - 1 + 1 = 0. [A,B,C] exists but has no listed face,
  // so it is not evaluated (its value is 0 anyway); [F0,F1,X] is met once per listed face.
  Run r = accepted(log, one_frame(R"([[0, "F0", "F1", "1"], [0, "F0", "X", "1"]])"));
  CHECK_THAT(r.out, Contains("phi vanishes on the 2 triangles and 0 prisms incident to its support"));
  // A listed face on [A,B,C] makes it a candidate: phi(d[A,B,C]) = phi E(A,B) = 1.
  CHECK_THAT(rejected(log, one_frame(R"([[0, "F0", "F1", "1"], [0, "F0", "X", "1"], [0, "A", "B", "1"]])")),
             Contains("REJECTED: /edges/2 triangle [A,B,C] at frame 0 (t=0): phi(boundary) = 1"));
}

TEST_CASE("the first failing cell follows the visiting order, not the order found", "[cocycle][incident]") {
  // Frame 0 lists [F1,F2] before [F0,F1], so the prism [F1,F2] over slab 0 is visited first,
  // although it is found from a row at frame 1 and [F0,F1]'s from a row at frame 0.
  const std::string log = R"({"format": "sweepcert-contacts-1", "fence": ["F0", "F1", "F2", "F3"], "triangles": "listed",
    "frames": [{"t": "0", "pairs": [["F1", "F2"], ["F0", "F1"], ["F2", "F3"], ["F3", "F0"]], "triples": []},
               {"t": "1", "pairs": [["F0", "F1"], ["F1", "F2"], ["F2", "F3"], ["F3", "F0"]], "triples": []}]})";
  CHECK_THAT(rejected(log, ring4(R"([[1, "F1", "F2", "1"], [0, "F0", "F1", "1"]])", "[]")),
             Contains("REJECTED: /edges/0 prism [F1,F2] over slab 0 (t=0..1): phi(boundary) = -1"));
  // A vertical's prisms: V(F1, 0) lies on the prisms [F0,F1] and [F1,F2] over slab 0; the first
  // visited is [F1,F2], where phi(d) = phi V(F2) - phi V(F1) = -1.
  CHECK_THAT(rejected(log, ring4(R"([[0, "F0", "F1", "1"], [1, "F0", "F1", "1"]])", R"([[0, "F1", "1"]])")),
             Contains("REJECTED: /verticals/0 prism [F1,F2] over slab 0 (t=0..1): phi(boundary) = -1"));
}
