// Uncovered area: the area of the part of a simple polygon P covered by no disk of a set.
//
// Green's theorem: area(R) = ∮ x dy over the boundary of R = P \ (union of closed disks), with R
// on the left. That boundary consists of the pieces of P's edges outside every disk (traversed
// counter-clockwise around P) and of the arcs of circles inside P and outside every other disk
// (traversed clockwise: R lies outside each disk). Every piece has a closed-form integral, so
// the only error is double rounding — in the crossing points and in classifying each piece by
// its midpoint. A piece can be misclassified only when its midpoint lies within rounding
// distance of another circle (near-tangent or near-coincident circles), and then the piece is
// tiny. Coordinates are shifted to the centre of P's bounding box so |x| stays small.
//
// Stated tolerance: |computed − true| <= kAreaRelTolerance * area(P). This is the bound the
// reference test holds the result to against CGAL's exact arrangement (tests/reference/
// cgal_report_area.cpp); the observed error there is many orders of magnitude smaller.
// Display only: nothing in any proof depends on these numbers.
#pragma once
#include <vector>

namespace sweepcert {

constexpr double kAreaRelTolerance = 1e-7;

struct Vec2 {
  double x, y;
};

struct Circle {
  Vec2 c;
  double r;
};

// P is given by its vertices in order (either orientation), simple (schema §2.1).
double polygon_area(const std::vector<Vec2>& polygon);
double uncovered_area(const std::vector<Vec2>& polygon, const std::vector<Circle>& disks);

}  // namespace sweepcert
