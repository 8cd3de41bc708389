// Čech pair and triple tests, against hand derivations and Jung's theorem.
#include <catch2/catch.hpp>

#include "exact/predicates.hpp"

using namespace sweepcert;

TEST_CASE("pairs: closed disks that touch are in contact") {
  // Centres 3 apart, radii 3/2 each: tangent, the closed disks share (3/2, 0).
  CHECK(disks_meet({0, 0}, Rational(3, 2), {3, 0}, Rational(3, 2)));
  CHECK_FALSE(disks_meet({0, 0}, Rational(3, 2), {Rational(3000000001, 1000000000), 0}, Rational(3, 2)));
  // A 3-4-5 triangle: distance 5, radii 2 + 3 touch; 2 + 2.999999999 do not.
  CHECK(disks_meet({0, 0}, 2, {3, 4}, 3));
  CHECK_FALSE(disks_meet({0, 0}, 2, {3, 4}, Rational(2999999999, 1000000000)));
  // Huge coordinates where doubles cannot tell: the exact fallback decides.
  Rational big("1000000000000000000000");
  CHECK(disks_meet({big, 0}, Rational(1, 2), {big + 1, 0}, Rational(1, 2)));
  CHECK_FALSE(disks_meet({big, 0}, Rational(1, 2), {big + 1, 0}, Rational(1, 2) - Rational(1, big.get_num())));
}

TEST_CASE("triples: witness points are common points") {
  // Three unit disks at (0,0), (1,0), (0,1): the origin region is shared.
  Point c[3] = {{0, 0}, {1, 0}, {0, 1}};
  Rational r[3] = {1, 1, 1};
  auto w = triple_witness(c, r);
  REQUIRE(w);
  for (int i = 0; i < 3; ++i) CHECK(in_disk(*w, c[i], r[i]));
  // Pairwise overlapping but no common point: three disks of radius 0.55 at the corners of a
  // unit-ish triangle (0,0), (1,0), (1/2, 0.9). Circumradius = (1/4 + 0.81)/(2*0.9) = 0.5889 > 0.55.
  Point d[3] = {{0, 0}, {1, 0}, {Rational(1, 2), Rational(9, 10)}};
  Rational s[3] = {Rational(55, 100), Rational(55, 100), Rational(55, 100)};
  CHECK_FALSE(triple_witness(d, s));
  // Collinear centres: the middle disk bridges; the witness is a pair candidate.
  Point e[3] = {{0, 0}, {2, 0}, {4, 0}};
  Rational t[3] = {3, 1, 3};
  CHECK(triple_witness(e, t));
  Rational u[3] = {1, Rational(1, 2), 1};  // outer disks do not meet at all
  CHECK_FALSE(triple_witness(e, u));
}

TEST_CASE("Jung's theorem: an equilateral triple of side s needs radius s/sqrt(3)") {
  // Published fact (Jung 1901, planar case): three points pairwise within distance s lie in a
  // disk of radius s/sqrt(3), with equality for the equilateral triangle. No equilateral
  // triangle has rational vertices, so we take isosceles triangles (0,0), (2,0), (1,h) with
  // rational h on both sides of sqrt(3). For an acute triangle the common point of equal disks
  // appears exactly at the circumradius R = (1 + h^2) / (2h) (hand derivation: the circumcentre
  // (1, y) satisfies 1 + y^2 = (h - y)^2, so y = (h^2 - 1)/(2h) and R = h - y).
  for (Rational h : {Rational(17320508, 10000000), Rational(17320509, 10000000)}) {
    Rational R = (1 + h * h) / (2 * h);
    Point c[3] = {{0, 0}, {2, 0}, {1, h}};
    Rational at[3] = {R, R, R};
    Rational below[3] = {R - Rational(1, 1000000000), R - Rational(1, 1000000000), R - Rational(1, 1000000000)};
    CHECK(triple_witness(c, at));
    CHECK_FALSE(triple_witness(c, below));
    // R^2 tends to s^2/3 = 4/3 as h tends to sqrt(3).
    CHECK(abs(R * R - Rational(4, 3)) < Rational(1, 1000000));
  }
}

TEST_CASE("segments and orientation") {
  CHECK(orientation({0, 0}, {1, 0}, {0, 1}) == 1);
  CHECK(orientation({0, 0}, {1, 0}, {2, 0}) == 0);
  CHECK(segments_meet({0, 0}, {2, 2}, {2, 0}, {0, 2}));
  CHECK(segments_meet({0, 0}, {2, 0}, {2, 0}, {3, 5}));  // touching at an endpoint
  CHECK_FALSE(segments_meet({0, 0}, {1, 0}, {2, 0}, {3, 0}));
  CHECK(segments_meet({0, 0}, {2, 0}, {1, 0}, {3, 0}));  // collinear overlap
}
