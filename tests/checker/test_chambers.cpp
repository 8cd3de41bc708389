// Hand-built chamber certificates (§4.5) and their tampered variants.
#include <catch2/catch.hpp>

#include <vector>

#include "helpers.hpp"
#include "polygon.hpp"
#include "input.hpp"
#include "json_reader.hpp"

using namespace sweepcheck_test;
using Catch::Matchers::Contains;
using Catch::Matchers::StartsWith;

namespace {

// One static interior sensor C at (2,2), radius 3/2.
const std::string kStatic = room(R"({"id": "C", "radius": "1.5", "track": [["0", "2", "2"]]})");

const std::string kTable = R"(["F0", "F1", "F2", "F3", "F4", "F5", "F6", "F7", "C"])";  // C is entry 8

// Q = [-2, 6]^2 (side 8). Depth 1 cells have side 4, depth 2 side 2, depth 3 side 1: the lines
// x, y = 0, 2, 4 are depth-2 cell boundaries, so P = [0,4]^2 is four depth-2 cells, each split
// into four unit cells. Every unit cell of P has a corner at distance 0 from one sensor and its
// other corners at distance 1 or sqrt(2) <= 3/2 from it:
//   [0,1]x[0,1] F0 (0,0)   [1,2]x[0,1] F1 (2,0)   [2,3]x[0,1] F1   [3,4]x[0,1] F2 (4,0)
//   [0,1]x[1,2] F7 (0,2)   [1,2]x[1,2] C  (2,2)   [2,3]x[1,2] C    [3,4]x[1,2] F3 (4,2)
//   [0,1]x[2,3] F7         [1,2]x[2,3] C          [2,3]x[2,3] C    [3,4]x[2,3] F3
//   [0,1]x[3,4] F6 (0,4)   [1,2]x[3,4] F5 (2,4)   [2,3]x[3,4] F5   [3,4]x[3,4] F4 (4,4)
// The other depth-2 cells lie outside P: their open boxes miss every fence edge (which run on
// the lines x, y = 0, 4 between 0 and 4) and their centres are outside. No open cell: the live
// set of the first slab is empty. Token indices (preorder) are given beside each leaf.
std::vector<int> cover_tree() {
  return {-1,                                         // 0  Q
          -1, -3, -3, -3, -1, 0, 1, 7, 8,             // 1  SW [-2,2]^2: 2..4 outside, 5 split [0,2]^2: 6 F0, 7 F1, 8 F7, 9 C [1,2]^2
          -1, -3, -3, -1, 1, 2, 8, 3, -3,             // 10 SE [2,6]x[-2,2]: 13 split [2,4]x[0,2]: 14 F1, 15 F2, 16 C, 17 F3
          -1, -3, -1, 7, 8, 6, 5, -3, -3,             // 19 NW [-2,2]x[2,6]: 21 split [0,2]x[2,4]: 22 F7, 23 C, 24 F6, 25 F5
          -1, -1, 8, 3, 5, 4, -3, -3, -3};            // 28 NE [2,6]^2: 29 split [2,4]^2: 30 C [2,3]^2, 31 F3, 32 F5, 33 F4 [3,4]^2
}

std::string tree_text(const std::vector<int>& t) {
  std::string s = "[";
  for (std::size_t i = 0; i < t.size(); ++i) s += (i ? ", " : "") + std::to_string(t[i]);
  return s + "]";
}

std::string slab(const std::string& a, const std::string& b, const std::string& tree) {
  return R"({"t": [")" + a + R"(", ")" + b + R"("], "tree": )" + tree + "}";
}
std::string slab(const std::string& a, const std::string& b, const std::vector<int>& tree) {
  return slab(a, b, tree_text(tree));
}

std::string chambers(const std::string& slabs, const std::string& table = kTable,
                     const std::string& square = R"({"origin": ["-2", "-2"], "side": "8"})") {
  return R"({"format": "sweepcert-certificate-1", "claim": "no-evasion", "method": "chambers",
    "input_sha256": "@HASH", "input_format": "sweepcert-scenario-1", "square": )" +
         square + R"(, "sensors": )" + table + R"(, "slabs": [)" + slabs + "]}";
}

std::vector<int> with(std::vector<int> t, std::size_t i, int token) {
  t.at(i) = token;
  return t;
}


}  // namespace

TEST_CASE("a quadtree that covers P leaves no live cell", "[chambers]") {
  Run r = accepted(kStatic, chambers(slab("0", "10", cover_tree())));
  CHECK_THAT(r.out, Contains("28 cells (16 covered, 12 outside, 0 open)"));
  CHECK_THAT(r.last(), Contains("no evasion path"));
  // Two slabs, and slabs inside the horizon need not span it.
  accepted(kStatic, chambers(slab("1", "5", cover_tree()) + "," + slab("5", "9", cover_tree())));
}

TEST_CASE("live sets follow touching cells, corners included, forward in time", "[chambers][live]") {
  // Marking a coverable cell open is allowed (rule 3); it only makes the live set bigger.
  const auto open_sw = with(cover_tree(), 9, -2);   // [1,2]^2
  const auto open_ne = with(cover_tree(), 30, -2);  // [2,3]^2, meets [1,2]^2 at the corner (2,2)
  const auto open_far = with(cover_tree(), 33, -2); // [3,4]^2, meets [2,3]^2 at (3,3), not [1,2]^2
  // One slab with an open cell: the first live set is all open cells.
  CHECK(rejected(kStatic, chambers(slab("0", "10", open_sw))) ==
        "REJECTED: /slabs/0 slab t=[0, 10]: the live set is not empty (1 open cells remain live, e.g. "
        "/slabs/0/tree/9 [1, 2]x[1, 2]) (rule 4.5.4)");
  // [1,2]^2 live in slab 0; in slab 1 [2,3]^2 touches it at a corner: live.
  CHECK_THAT(rejected(kStatic, chambers(slab("0", "1", open_sw) + "," + slab("1", "2", open_ne))),
             Contains("/slabs/1 slab t=[1, 2]: the live set is not empty (1 open cells remain live, e.g. "
                      "/slabs/1/tree/30 [2, 3]x[2, 3])"));
  // [3,4]^2 does not touch [1,2]^2: the live set dies in slab 1 and stays dead.
  Run r = accepted(kStatic, chambers(slab("0", "1", open_sw) + "," + slab("1", "2", open_far) + "," +
                                     slab("2", "3", open_sw)));
  CHECK_THAT(r.out, Contains("the live set is empty from slab 1 (t=[1, 2]) on"));
  // Closure within the slab: [2,3]^2 is live through [1,2]^2, then [3,4]^2 through [2,3]^2.
  CHECK_THAT(rejected(kStatic, chambers(slab("0", "1", open_sw) + "," + slab("1", "2", with(open_ne, 33, -2)))),
             Contains("(2 open cells remain live, e.g. /slabs/1/tree/30 [2, 3]x[2, 3]) (rule 4.5.4)"));
  // Touching is between closed boxes: the big outside-P cell [4,6]x[0,2] marked open touches
  // [3,4]x[1,2] only along x = 4; open [3,4]x[1,2] (token 17) in slab 0, open [4,6]x[0,2]
  // (token 18) in slab 1: live.
  CHECK_THAT(rejected(kStatic, chambers(slab("0", "1", with(cover_tree(), 17, -2)) + "," +
                                        slab("1", "2", with(cover_tree(), 18, -2)))),
             Contains("e.g. /slabs/1/tree/18 [4, 6]x[0, 2])"));
}

TEST_CASE("covered cells must be inside the disk at the slab ends and waypoints", "[chambers][rule1]") {
  // C arrives: at (20,2) until t=1, at (2,2) from t=2 on.
  const std::string arrives = room(R"({"id": "C", "radius": "1.5", "track": [["1", "20", "2"], ["2", "2", "2"]]})");
  const auto open_c = [] {
    auto t = cover_tree();
    for (std::size_t i : {9, 16, 23, 30}) t[i] = -2;  // the four cells of C
    return t;
  }();
  // Slabs [0,1], [1,2] leave C's cells open; from slab [2,3] they are covered: accepted.
  accepted(arrives, chambers(slab("0", "1", open_c) + "," + slab("1", "2", open_c) + "," + slab("2", "3", cover_tree())));
  // Claiming C's cells covered in [1,2]: at t=1 C is at (20,2).
  CHECK(rejected(arrives, chambers(slab("0", "1", open_c) + "," + slab("1", "2", cover_tree()))) ==
        "REJECTED: /slabs/1/tree/9 cell [1, 2]x[1, 2] in slab t=[1, 2]: corner (1, 1) is outside the disk of sensor "
        "\"C\" at t=1 (rule 4.5.1)");
  // A waypoint strictly inside the slab counts: C leaves and comes back between the slab ends.
  const std::string blinks =
      room(R"({"id": "C", "radius": "1.5", "track": [["0", "2", "2"], ["1/2", "20", "2"], ["1", "2", "2"]]})");
  CHECK_THAT(rejected(blinks, chambers(slab("0", "1", cover_tree()))),
             Contains("/slabs/0/tree/9 cell [1, 2]x[1, 2] in slab t=[0, 1]: corner (1, 1) is outside the disk of "
                      "sensor \"C\" at t=1/2 (rule 4.5.1)"));
  // The wrong sensor for a cell: F0 at (0,0) does not reach the corner (2,0) of [1,2]x[0,1].
  CHECK(rejected(kStatic, chambers(slab("0", "1", with(cover_tree(), 7, 0)))) ==
        "REJECTED: /slabs/0/tree/7 cell [1, 2]x[0, 1] in slab t=[0, 1]: corner (2, 0) is outside the disk of sensor "
        "\"F0\" at t=0 (rule 4.5.1)");
}

TEST_CASE("exact corner tests at every arithmetic width", "[chambers][rule1][exact]") {
  // E, radius 1, at (2/5, 1/5): the corner (1,1) of [0,1]^2 is at (3/5, 4/5), distance exactly
  // 1 (on the closed disk); the other corners are nearer (|.|^2 = 4/5, 2/5, 1/5). Token 6 is
  // [0,1]^2; E is table entry 9. Moving E left by eps puts (1,1) outside; right keeps it in.
  // In the frame of Q (2^41 units over side 8) the centre has denominator 5 (128-bit path),
  // 5 * 10000019 (512-bit path) and about 2^230 with eps = 1e-80 (rational path).
  const std::string table = R"(["F0", "F1", "F2", "F3", "F4", "F5", "F6", "F7", "C", "E"])";
  auto input = [](const std::string& x, const std::string& r = "1") {
    return room(R"({"id": "C", "radius": "1.5", "track": [["0", "2", "2"]]}, {"id": "E", "radius": ")" + r +
                R"(", "track": [["0", ")" + x + R"(", "1/5"]]})");
  };
  const std::string cert = chambers(slab("0", "1", with(cover_tree(), 6, 9)), table);
  accepted(input("2/5"), cert);
  CHECK_THAT(rejected(input("2/5", "0.99999"), cert),
             Contains("/slabs/0/tree/6 cell [0, 1]x[0, 1] in slab t=[0, 1]: corner (1, 1) is outside the disk of "
                      "sensor \"E\" at t=0 (rule 4.5.1)"));
  for (const std::string eps : {"1/10000019", "1e-50", "1e-80"}) {
    INFO("eps " << eps);
    sweepcheck::Rat x;
    REQUIRE(sweepcheck::parse_rational(eps, x).empty());
    accepted(input(sweepcheck::to_text(sweepcheck::Rat(2, 5) + x)), cert);
    CHECK_THAT(rejected(input(sweepcheck::to_text(sweepcheck::Rat(2, 5) - x)), cert),
               Contains("corner (1, 1) is outside the disk of sensor \"E\""));
  }
}

TEST_CASE("outside cells must miss the interior of P", "[chambers][rule2]") {
  // [0,1]^2 (token 6) marked outside: no fence edge meets the open box (0,1)^2, but its centre
  // (1/2, 1/2) is inside P.
  CHECK(rejected(kStatic, chambers(slab("0", "1", with(cover_tree(), 6, -3)))) ==
        "REJECTED: /slabs/0/tree/6 cell [0, 1]x[0, 1] in slab t=[0, 1]: an outside cell must have no point in the "
        "interior of P, but its centre (1/2, 1/2) lies inside the fence polygon (rule 4.5.2)");
  // The whole SW quadrant [-2,2]^2 as one outside cell: the fence edge F0-F1 (y = 0, x in
  // [0,2]) crosses its open box.
  std::vector<int> t = cover_tree();
  t.erase(t.begin() + 2, t.begin() + 10);
  t[1] = -3;
  CHECK(rejected(kStatic, chambers(slab("0", "1", t))) ==
        "REJECTED: /slabs/0/tree/1 cell [-2, 2]x[-2, 2] in slab t=[0, 1]: an outside cell must have no point in the "
        "interior of P, but the fence edge sensor \"F0\" - sensor \"F1\" meets the open box (rule 4.5.2)");
  // A fence vertex on the corner of an outside cell is fine: [-2,0]^2 has F0 at its corner.
  accepted(kStatic, chambers(slab("0", "1", cover_tree())));
}

TEST_CASE("quadtree syntax", "[chambers][syntax]") {
  const std::vector<int> good = cover_tree();
  // A dropped cell: the tiling is incomplete.
  std::vector<int> dropped(good.begin(), good.end() - 1);
  CHECK(rejected(kStatic, chambers(slab("0", "1", dropped))) ==
        "REJECTED: /slabs/0/tree: incomplete tree: the tokens end inside the split at /slabs/0/tree/28, which has 3 "
        "of its 4 children (it must be exactly one complete tree, §4.5)");
  CHECK_THAT(rejected(kStatic, chambers(slab("0", "1", "[]"))), Contains("/slabs/0/tree: empty tree"));
  // Extra tokens after a complete tree.
  std::vector<int> extra = good;
  extra.push_back(-2);
  CHECK_THAT(rejected(kStatic, chambers(slab("0", "1", extra))),
             Contains("REJECTED: /slabs/0/tree/37: extra token after the complete tree"));
  CHECK_THAT(rejected(kStatic, chambers(slab("0", "1", "[-3, -3]"))), Contains("/slabs/0/tree/1: extra token"));
  // Index out of range: the table has 9 entries.
  CHECK(rejected(kStatic, chambers(slab("0", "1", with(good, 6, 9)))) ==
        "REJECTED: /slabs/0/tree/6: sensor-table index 9 out of range (the table `sensors` has 9 entries, §4.5)");
  CHECK_THAT(rejected(kStatic, chambers(slab("0", "1", with(good, 6, -4)))), Contains("/slabs/0/tree/6: invalid cell token -4"));
  CHECK_THAT(rejected(kStatic, chambers(slab("0", "1", R"([-1, -3, -3, "-3", -3])"))),
             Contains("/slabs/0/tree/3: a cell token must be a JSON integer, found string"));
  CHECK_THAT(rejected(kStatic, chambers(slab("0", "1", R"([-1, -3, -3, -3, -3.0])"))),
             Contains("/slabs/0/tree/4: a cell token must be a JSON integer without fraction or exponent"));
  CHECK_THAT(rejected(kStatic, chambers(slab("0", "1", R"([-1, -3, -0, -3, -3])"))), Contains("/slabs/0/tree/2"));
  CHECK_THAT(rejected(kStatic, chambers(slab("0", "1", R"({"a": 1})"))), Contains("/slabs/0/tree: expected an array"));

  // Depth: a chain of splits towards the south-west corner of Q, all leaves open (so the live
  // set is not empty, but the tree is well formed: the check gets as far as rule 4).
  auto chain = [](int splits) {
    std::vector<int> t(static_cast<std::size_t>(splits), -1);
    t.insert(t.end(), 4, -2);                                          // children of the deepest split
    t.insert(t.end(), 3 * static_cast<std::size_t>(splits - 1), -2);  // the other children above
    return t;
  };
  // Cells at depth 40 are allowed: 4 + 3 * 39 = 121 open cells, the first of side 8 / 2^40 = 2^-37.
  CHECK_THAT(rejected(kStatic, chambers(slab("0", "1", chain(40)))),
             Contains("(121 open cells remain live, e.g. /slabs/0/tree/40 [-2, -274877906943/137438953472]x") &&
                 Contains("(rule 4.5.4)"));
  CHECK(rejected(kStatic, chambers(slab("0", "1", chain(41)))) ==
        "REJECTED: /slabs/0/tree/40: split of a cell at depth 40: the depth is at most 40 (§4.5)");
  // A hostile, very deep token list stops at depth 40 without recursion.
  CHECK_THAT(rejected(kStatic, chambers(slab("0", "1", std::vector<int>(100000, -1)))), Contains("/slabs/0/tree/40: split"));
}

TEST_CASE("square, sensor table and slab times", "[chambers][header]") {
  const std::string s = slab("0", "1", cover_tree());
  CHECK(rejected(kStatic, chambers(s, kTable, R"({"origin": ["-2", "-2"], "side": "5.5"})")) ==
        "REJECTED: /square fence sensor \"F2\" at (4, 0): the fence centre lies outside the square "
        "Q = [-2, 7/2]x[-2, 7/2] (§4.5)");
  CHECK_THAT(rejected(kStatic, chambers(s, kTable, R"({"origin": ["-2", "-2"], "side": "0"})")),
             Contains("/square/side: the side must be > 0"));
  CHECK_THAT(rejected(kStatic, chambers(s, kTable, R"({"origin": ["-2", "-2"], "side": "8", "x": 1})")),
             Contains("/square/x: unknown key"));
  CHECK_THAT(rejected(kStatic, chambers(s, R"(["F0", "F1", "F2", "F3", "F4", "F5", "F6", "F7", "X"])")),
             Contains("REJECTED: /sensors/8 sensor \"X\": unknown sensor id"));
  CHECK_THAT(rejected(kStatic, chambers(s, R"(["F0", "F1", "F2", "F3", "F4", "F5", "F6", "F0", "C"])")),
             Contains("REJECTED: /sensors/7 sensor \"F0\": listed twice in the sensor table (also at /sensors/0"));
  CHECK_THAT(rejected(kStatic, chambers(slab("0", "1", cover_tree()) + "," + slab("2", "3", cover_tree()))),
             Contains("REJECTED: /slabs/1/t/0 t=2: a slab must start where the previous one ends, at t=1"));
  CHECK_THAT(rejected(kStatic, chambers(slab("-1", "1", cover_tree()))),
             Contains("REJECTED: /slabs/0/t/0 t=-1: the first slab starts before the horizon start 0"));
  CHECK_THAT(rejected(kStatic, chambers(slab("9", "11", cover_tree()))),
             Contains("REJECTED: /slabs/0/t/1 t=11: the last slab ends after the horizon end 10"));
  CHECK_THAT(rejected(kStatic, chambers(slab("1", "1", cover_tree()))),
             Contains("REJECTED: /slabs/0/t/1 slab t=[1, 1]: a slab must end after it starts"));
  CHECK_THAT(rejected(kStatic, chambers("")), Contains("/slabs: array has 0 elements"));
  // Keys of other methods, and the claim.
  std::string c = chambers(s);
  replace_all(c, R"("method": "chambers",)", R"("method": "chambers", "ring": "z",)");
  CHECK_THAT(rejected(kStatic, c), Contains("REJECTED: /ring: key not allowed with method \"chambers\""));
  c = chambers(s);
  replace_all(c, R"("claim": "no-evasion")", R"("claim": "evasion")");
  CHECK_THAT(rejected(kStatic, c), Contains("REJECTED: /method: method \"chambers\" does not go with claim \"evasion\""));
  c = chambers(s);
  replace_all(c, R"("slabs")", R"("slabz")");
  CHECK_THAT(rejected(kStatic, c), Contains("REJECTED: /slabz: unknown key"));
  // A contact log is no input for chambers.
  const std::string log = R"({"format": "sweepcert-contacts-1", "fence": ["F0", "F1", "F2"], "triangles": "listed",
    "frames": [{"t": "0", "pairs": [["F0", "F1"], ["F1", "F2"], ["F2", "F0"]], "triples": []}]})";
  c = chambers(s);
  replace_all(c, "sweepcert-scenario-1", "sweepcert-contacts-1");
  CHECK_THAT(rejected(log, c), Contains("REJECTED: /input_format: method \"chambers\" needs a positional scenario"));
}

TEST_CASE("fence polygon: exact location and open-box tests", "[chambers][polygon]") {
  const std::string text = kStatic;
  const sweepcheck::json::Document doc = sweepcheck::json::parse(text, "INPUT");
  auto in = sweepcheck::load_input(doc);
  const sweepcheck::FencePolygon p(*in);
  using sweepcheck::Point;
  using sweepcheck::Rat;
  using sweepcheck::Side;
  std::size_t edge = 99;
  CHECK(p.locate(Point{Rat(1), Rat(0)}, &edge) == Side::Boundary);
  CHECK(edge == 0);
  CHECK(p.locate(Point{Rat(4), Rat(4)}, &edge) == Side::Boundary);  // a vertex
  CHECK(p.locate(Point{Rat(2), Rat(2)}) == Side::Inside);
  CHECK(p.locate(Point{Rat(1, 1000000), Rat(4)}) == Side::Boundary);
  CHECK(p.locate(Point{Rat(1, 1000000), Rat(3)}) == Side::Inside);
  CHECK(p.locate(Point{Rat(-1, 1000000), Rat(3)}) == Side::Outside);
  CHECK(p.locate(Point{Rat(5), Rat(2)}) == Side::Outside);  // on the line of an edge's ray, outside
  // Q = [-2, 6]^2 in units of 2^41 / 8 = 2^38: x = -2 + u / 2^38.
  const sweepcheck::BoxTester b(p, Point{Rat(-2), Rat(-2)}, Rat(8));
  const std::int64_t u = std::int64_t(1) << 38;
  CHECK(b.meets_interior(0, 0, 2 * u) == -1);          // [-2,0]^2: F0 on its corner only
  CHECK(b.meets_interior(2 * u, 0, 2 * u) == -1);      // [0,2]x[-2,0]: edge F0-F1 on its side only
  CHECK(b.meets_interior(2 * u, 2 * u, u) == 8);       // [0,1]^2: inside, no edge
  CHECK(b.meets_interior(u, u, 2 * u) == 0);           // [-1,1]^2: F0-F1 crosses it
  CHECK(b.meets_interior(6 * u, 6 * u, 2 * u) == -1);  // [4,6]^2
  CHECK(b.meets_interior(5 * u, 5 * u, 2 * u) == 3);   // [3,5]^2: F3-F4 (x = 4, y in [2,4]) is the first edge met
}
