// The report's own computations: uncovered area (report/area), certificate reading and live sets
// (report/certificate, report/live). Every expected value is derived by hand beside its check.
#include <catch2/catch.hpp>

#include <cmath>

#include "io/input_error.hpp"
#include "report/area.hpp"
#include "report/certificate.hpp"
#include "report/live.hpp"

using namespace sweepcert;

namespace {
const double kPi = std::acos(-1.0);
const double kSqrt3 = std::sqrt(3.0);

std::vector<Vec2> square(double side) { return {{0, 0}, {side, 0}, {side, side}, {0, side}}; }

// The tolerance the report states: kAreaRelTolerance of area(P).
void check_area(const std::vector<Vec2>& p, const std::vector<Circle>& disks, double expected) {
  double got = uncovered_area(p, disks);
  INFO("got " << got << ", expected " << expected);
  CHECK(std::abs(got - expected) <= kAreaRelTolerance * polygon_area(p));
}
}  // namespace

TEST_CASE("uncovered area of hand-derived configurations", "[report][area]") {
  // Empty set of disks: the polygon's own area (shoelace), 6 x 6 = 36.
  check_area(square(6), {}, 36);
  // One disk inside a square: side^2 - pi r^2 = 64 - 2.25 pi.
  check_area(square(8), {{{3, 4}, 1.5}}, 64 - 2.25 * kPi);
  // The same polygon listed clockwise gives the same area.
  check_area({{0, 0}, {0, 8}, {8, 8}, {8, 0}}, {{{3, 4}, 1.5}}, 64 - 2.25 * kPi);
  // A disk centred on a corner covers a quarter of itself: 16 - pi/4.
  check_area(square(4), {{{0, 0}, 1}}, 16 - kPi / 4);
  // Centred on an edge's midpoint: half of it, 16 - pi/2.
  check_area(square(4), {{{2, 0}, 1}}, 16 - kPi / 2);
  // Tangent to an edge from inside: the whole disk, 16 - pi.
  check_area(square(4), {{{2, 1}, 1}}, 16 - kPi);
  // Crossing an edge at distance h = 1/2 from the centre: the circular segment outside has area
  // r^2 acos(h/r) - h sqrt(r^2 - h^2) = pi/3 - sqrt(3)/4 (circular segment formula), so the part
  // inside is pi - pi/3 + sqrt(3)/4 and the uncovered area 16 - 2pi/3 - sqrt(3)/4.
  check_area(square(4), {{{2, 0.5}, 1}}, 16 - 2 * kPi / 3 - kSqrt3 / 4);
  // Two unit disks at distance d = 1 overlap in a lens 2 acos(d/2) - (d/2) sqrt(4 - d^2)
  // = 2pi/3 - sqrt(3)/2 (circle-circle intersection area); union = 2pi - lens.
  check_area(square(8), {{{3, 4}, 1}, {{4, 4}, 1}}, 64 - (2 * kPi - (2 * kPi / 3 - kSqrt3 / 2)));
  // A disk inside another counts once: 64 - 4 pi.
  check_area(square(8), {{{4, 4}, 2}, {{4.5, 4}, 1}}, 64 - 4 * kPi);
  // The same disk listed twice counts once.
  check_area(square(8), {{{3, 4}, 1.5}, {{3, 4}, 1.5}}, 64 - 2.25 * kPi);
  // A disk outside P changes nothing; a disk containing P leaves nothing.
  check_area(square(4), {{{10, 10}, 2}}, 16);
  check_area(square(4), {{{2, 2}, 3}}, 0);
  // Equilateral triangle of side 6 (area 9 sqrt 3) with a unit disk on a vertex: the 60-degree
  // sector pi/6 is covered.
  check_area({{0, 0}, {6, 0}, {3, 3 * kSqrt3}}, {{{0, 0}, 1}}, 9 * kSqrt3 - kPi / 6);
  // Non-convex P: an L of area 16 - 4 = 12 (4 x 4 without its 2 x 2 north-east block) and a disk of
  // radius 1 centred at the reflex corner (2, 2): three quarters of it lie in P: 12 - 3pi/4.
  check_area({{0, 0}, {4, 0}, {4, 2}, {2, 2}, {2, 4}, {0, 4}}, {{{2, 2}, 1}}, 12 - 3 * kPi / 4);
}

namespace {
Input hand_input() {
  Input in;
  in.path = "hand.json";
  in.format = "sweepcert-scenario-1";
  in.sha256 = std::string(64, 'a');
  return in;
}

std::string chambers_cert(const std::string& slabs, const std::string& sha = std::string(64, 'a')) {
  return R"({"format": "sweepcert-certificate-1", "claim": "no-evasion", "method": "chambers",
             "input_sha256": ")" + sha + R"(", "input_format": "sweepcert-scenario-1",
             "square": {"origin": ["0", "0"], "side": "4"}, "sensors": ["A"], "slabs": [)" + slabs + "]}";
}
}  // namespace

TEST_CASE("live sets of a hand-made chambers certificate", "[report][live]") {
  // Square [0,4]^2. Slab 0: the south-west and north-east quarters are split; only their
  // outermost children [0,1]^2 and [3,4]^2 are open. These do not touch: 2 regions of area 1 each.
  // Slab 1: the whole square is one open cell; it touches both, so 1 region of area 16.
  // Slab 2: one covered cell: the live set is empty.
  CertView v = read_certificate(chambers_cert(R"(
      {"t": ["0", "1"], "tree": [-1, -1, -2, 0, 0, 0, 0, 0, -1, 0, 0, 0, -2]},
      {"t": ["1", "2"], "tree": [-2]},
      {"t": ["2", "3"], "tree": [0]})"),
                                hand_input());
  REQUIRE(v.slabs.size() == 3);
  std::vector<LiveSet> L = live_sets(v.slabs, 4.0);
  CHECK(L[0].cells == 2);
  CHECK(L[0].regions == 2);
  CHECK(L[0].area == 2.0);
  CHECK(L[1].cells == 1);
  CHECK(L[1].regions == 1);
  CHECK(L[1].area == 16.0);
  CHECK(L[2].cells == 0);
  CHECK(L[2].regions == 0);
  // On a 4 x 4 grid (pixel side 1) the two cells are exactly the pixels (0,0) and (3,3); on a
  // 2 x 2 grid each is finer than a pixel and marks its pixel (0,0) and (1,1); the open square
  // is one 4 x 4 rectangle.
  CHECK(live_rectangles(v.slabs[0], L[0], 2) == std::vector<int>{0, 0, 1, 1, 3, 3, 1, 1});
  CHECK(live_rectangles(v.slabs[0], L[0], 1) == std::vector<int>{0, 0, 1, 1, 1, 1, 1, 1});
  CHECK(live_rectangles(v.slabs[1], L[1], 2) == std::vector<int>{0, 0, 4, 4});
  CHECK(live_rectangles(v.slabs[2], L[2], 2).empty());

  // Corners count as touching (schema §4.5): [0,2]^2 and [2,4]^2 share only (2,2): one region.
  // Slab 1 opens only the north-west quarter, which touches the live south-west quarter (an
  // edge); slab 2 opens only the south-east quarter, which touches the north-west one at the
  // corner (2,2) only; slab 3 opens only [0,1]^2, which does not touch [2,4] x [0,2]: it stays dead.
  CertView w = read_certificate(chambers_cert(R"(
      {"t": ["0", "1"], "tree": [-1, -2, 0, 0, -2]},
      {"t": ["1", "2"], "tree": [-1, 0, 0, -2, 0]},
      {"t": ["2", "3"], "tree": [-1, 0, -2, 0, 0]},
      {"t": ["3", "4"], "tree": [-1, -1, -2, 0, 0, 0, 0, 0, 0]})"),
                                hand_input());
  std::vector<LiveSet> M = live_sets(w.slabs, 4.0);
  CHECK(M[0].regions == 1);
  CHECK(M[0].area == 8.0);
  CHECK(M[1].cells == 1);
  CHECK(M[2].cells == 1);
  CHECK(M[2].area == 4.0);
  CHECK(M[3].cells == 0);
}

TEST_CASE("the report refuses certificates it cannot draw or that belong to another input", "[report]") {
  auto refused = [](const std::string& cert, const std::string& where, const std::string& what) {
    try {
      read_certificate(cert, hand_input());
      FAIL("accepted: " << cert);
    } catch (const InputError& e) {
      CHECK(e.where == where);
      CHECK_THAT(e.what(), Catch::Contains(what));
    }
  };
  refused(chambers_cert(R"({"t": ["0", "1"], "tree": [-2]})", std::string(64, 'b')), "/input_sha256",
          "does not match the SHA-256 of hand.json");
  refused(chambers_cert(R"({"t": ["0", "1"], "tree": [-1, -2, -2]})"), "/slabs/0/tree", "incomplete quadtree");
  refused(chambers_cert(R"({"t": ["0", "1"], "tree": [-2, -2]})"), "/slabs/0/tree/1", "already complete");
  refused(chambers_cert(R"({"t": ["0", "1"], "tree": [1]})"), "/slabs/0/tree/0", "sensor table index");
  refused(chambers_cert(R"({"t": ["0", "1"], "tree": [-2]}, {"t": ["2", "3"], "tree": [-2]})"),
          "/slabs/1/t/0", "start where the previous one ends");
}
