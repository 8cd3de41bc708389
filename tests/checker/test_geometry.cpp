// Orientation signs (§3.2) and the exact presence tests of §3.1.
#include <catch2/catch.hpp>

#include "geometry.hpp"
#include "stack.hpp"

using namespace sweepcheck;

TEST_CASE("canonical order returns the sign of the permutation", "[orientation]") {
  std::uint32_t a[3] = {1, 2, 3};
  CHECK(canonical_order(a, 3) == 1);
  std::uint32_t b[3] = {2, 1, 3};  // one swap
  CHECK(canonical_order(b, 3) == -1);
  CHECK((b[0] == 1 && b[1] == 2 && b[2] == 3));
  std::uint32_t c[3] = {3, 1, 2};  // cyclic shift: even
  CHECK(canonical_order(c, 3) == 1);
  std::uint32_t d[3] = {3, 2, 1};  // reversal of three: odd
  CHECK(canonical_order(d, 3) == -1);
  std::uint32_t e[3] = {2, 3, 1};
  CHECK(canonical_order(e, 3) == 1);
  std::uint32_t f[3] = {1, 3, 2};
  CHECK(canonical_order(f, 3) == -1);
  std::uint32_t p[2] = {5, 4};
  CHECK(canonical_order(p, 2) == -1);
  std::uint32_t q[2] = {4, 5};
  CHECK(canonical_order(q, 2) == 1);
}

TEST_CASE("pair test is exact at tangency", "[geometry]") {
  // Centres 3 apart, radii 1 and 2: |c_a - c_b|^2 = 9 = (1 + 2)^2, tangent disks meet.
  Point a{0, 0}, b{3, 0};
  CHECK(disks_meet(a, Rat(1), b, Rat(2)));
  CHECK_FALSE(disks_meet(a, Rat(1), b, Rat(2) - Rat(1, 1000000000)));
  // Irrational distance sqrt(2): (1/2 + 1) vs sqrt(2) = 1.414...
  CHECK(disks_meet(a, Rat(1, 2), Point{1, 1}, Rat(1)));
  CHECK_FALSE(disks_meet(a, Rat(7, 10), Point{1, 1}, Rat(7, 10)));  // 1.4 < sqrt 2
}

namespace {
bool meet(Point a, Point b, Point c, Rat ra, Rat rb, Rat rc) {
  const Point cs[3] = {a, b, c};
  const Rat rs[3] = {ra, rb, rc};
  return three_disks_meet(cs, rs);
}
}  // namespace

TEST_CASE("triple test: acute triangle, the radical centre is the tight witness", "[geometry]") {
  // Jung's bound is attained by the equilateral triangle (r^2 = s^2/3), but no equilateral
  // triangle has rational vertices and r = sqrt(3) for s = 3 is irrational, so the exact
  // boundary case is taken on an acute triangle inscribed in a rational circle instead:
  // (5,0), (-3,4), (-3,-4) lie on the circle of radius 5 about the origin; the triangle is
  // acute (dot products at the vertices are 48, 32, 32 > 0), so its smallest enclosing circle
  // is the circumcircle. Equal radii r: common point iff r >= 5, and at r = 5 the only common
  // point is the origin, the radical centre.
  Point a{5, 0}, b{-3, 4}, c{-3, -4};
  CHECK(meet(a, b, c, 5, 5, 5));
  CHECK_FALSE(meet(a, b, c, Rat(4999, 1000), 5, 5));
  CHECK_FALSE(meet(a, b, c, Rat(4999999, 1000000), Rat(4999999, 1000000), Rat(4999999, 1000000)));
  // Same with the ids permuted: the test does not depend on the order.
  CHECK(meet(c, a, b, 5, 5, 5));
}

TEST_CASE("triple test: obtuse triangle, the radical-line projection is the tight witness", "[geometry]") {
  // Disks (0,0) r 1 and (4,0) r 3 touch only at (1,0): d^2 = 16, lambda = (16 + 1 - 9)/32 = 1/4,
  // the projection of (0,0) onto their radical line. A third disk about (1,5) of radius 5
  // contains (1,0) exactly.
  Point a{0, 0}, b{4, 0}, c{1, 5};
  CHECK(meet(a, b, c, 1, 3, 5));
  CHECK_FALSE(meet(a, b, c, 1, 3, Rat(499, 100)));
  // Equal radii on an obtuse triangle: midpoint of the long side.
  CHECK(meet(Point{0, 0}, Point{10, 0}, Point{5, 1}, 5, 5, 5));
  CHECK_FALSE(meet(Point{0, 0}, Point{10, 0}, Point{5, 1}, Rat(4999, 1000), 5, 5));
}

TEST_CASE("triple test: centres, collinear and concentric cases", "[geometry]") {
  // One big disk holds the two small ones' common point at its own centre.
  CHECK(meet(Point{0, 0}, Point{1, 0}, Point{-1, 0}, 10, 1, 1));
  // Collinear centres 2 apart with radius 1: (0,0),(2,0) touch at (1,0), far from (4,0).
  CHECK_FALSE(meet(Point{0, 0}, Point{2, 0}, Point{4, 0}, 1, 1, 1));
  CHECK(meet(Point{0, 0}, Point{2, 0}, Point{4, 0}, 2, 2, 2));  // (2,0) is in all three
  // Concentric pair (0,0) r 1, (0,0) r 2 with (0,3) r 2: the only common point is (0,1), the
  // projection of (0,3) onto the radical line of the last and first disk (lambda = 2/3).
  CHECK(meet(Point{0, 0}, Point{0, 0}, Point{0, 3}, 1, 2, 2));
  CHECK_FALSE(meet(Point{0, 0}, Point{0, 0}, Point{0, 3}, 1, 2, Rat(1999, 1000)));
  // Pairwise meeting but no common point: three unit disks on a triangle of side 2 - a bit.
  // Centres (0,0), (2,0), (1,2): pairwise distances 2, sqrt5, sqrt5 > 2 -> no pair even.
  CHECK_FALSE(meet(Point{0, 0}, Point{2, 0}, Point{1, 2}, 1, 1, 1));
  // Radii 6/5: pairs meet (sqrt5 < 2.4), the circumcentre (1, 3/4) is at distance 5/4 > 6/5.
  CHECK_FALSE(meet(Point{0, 0}, Point{2, 0}, Point{1, 2}, Rat(6, 5), Rat(6, 5), Rat(6, 5)));
  CHECK(meet(Point{0, 0}, Point{2, 0}, Point{1, 2}, Rat(5, 4), Rat(5, 4), Rat(5, 4)));
}

TEST_CASE("closed segment intersection", "[geometry]") {
  CHECK(segments_meet(Point{0, 0}, Point{2, 2}, Point{0, 2}, Point{2, 0}));        // crossing
  CHECK(segments_meet(Point{0, 0}, Point{2, 0}, Point{2, 0}, Point{3, 5}));        // shared end
  CHECK(segments_meet(Point{0, 0}, Point{2, 0}, Point{1, 0}, Point{1, 5}));        // T junction
  CHECK(segments_meet(Point{0, 0}, Point{2, 0}, Point{1, 0}, Point{3, 0}));        // collinear overlap
  CHECK_FALSE(segments_meet(Point{0, 0}, Point{1, 0}, Point{2, 0}, Point{3, 0}));  // collinear apart
  CHECK_FALSE(segments_meet(Point{0, 0}, Point{2, 0}, Point{0, 1}, Point{2, 1}));  // parallel
  CHECK_FALSE(segments_meet(Point{0, 0}, Point{2, 2}, Point{3, 0}, Point{2, 1}));  // would cross if extended
}
