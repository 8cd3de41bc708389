// Exact plane geometry on rationals: the presence tests of §3.1 and the fence-polygon test of
// §2.1. All comparisons are exact; closed disks, closed segments.
#pragma once
#include "numbers.hpp"

namespace sweepcheck {

struct Point {
  Rat x, y;
};

Rat dist2(const Point& a, const Point& b);

// Sign of the cross product (b - a) x (c - a): +1 left turn, -1 right turn, 0 collinear.
int orientation(const Point& a, const Point& b, const Point& c);

// |a - b|^2 <= (ra + rb)^2: the closed disks share a point.
bool disks_meet(const Point& a, const Rat& ra, const Point& b, const Rat& rb);

// |w - c|^2 <= r^2.
bool in_disk(const Point& w, const Point& c, const Rat& r);

// Do three closed disks share a point? The largest power distance max_i(|p - c_i|^2 - r_i^2)
// is minimised where one, two or three of the power functions are active, i.e. at a centre, at
// the projection of a centre onto the radical line of a non-concentric pair, or at the radical
// centre of non-collinear centres. The disks share a point iff that minimiser lies in all
// three, so testing these seven candidates is exact and complete.
bool three_disks_meet(const Point c[3], const Rat r[3]);

// Do the closed segments [p1, p2] and [q1, q2] share a point?
bool segments_meet(const Point& p1, const Point& p2, const Point& q1, const Point& q2);

}  // namespace sweepcheck
