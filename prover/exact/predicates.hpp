// Geometric predicates: signs and witnesses, never approximations.
//
// Callers see only yes/no answers and rational witness points. Inside, a floating-point
// evaluation with a computed error bound answers most queries; when the bound cannot decide,
// the exact rational evaluation does.
#pragma once
#include <optional>

#include "model/sweep.hpp"

namespace sweepcert {

// Do the closed disks (a, ra) and (b, rb) share a point? |a-b|^2 <= (ra+rb)^2.
bool disks_meet(const Point& a, const Rational& ra, const Point& b, const Rational& rb);

// Is p in the closed disk (c, r)? Exact.
bool in_disk(const Point& p, const Point& c, const Rational& r);

// The same question for a point given in doubles that are exact (dyadic cell corners), with a
// floating-point filter; `cd`/`rd` are the double images of c and r. Exact fallback.
bool in_disk_filtered(double px, double py, const Point& c, const Rational& r, double cx,
                      double cy, double rd);

// A rational point in all three closed disks, if there is one. It is the point minimising the
// largest power distance |x-c_i|^2 - r_i^2 whenever that minimum is <= 0: a centre, the foot of
// a centre on a radical line, or the radical centre -- all rational.
std::optional<Point> triple_witness(const Point c[3], const Rational r[3]);

// Sign of the turn p -> q -> r: +1 left, -1 right, 0 collinear.
int orientation(const Point& p, const Point& q, const Point& r);

// Do the closed segments [p1,p2] and [q1,q2] share a point?
bool segments_meet(const Point& p1, const Point& p2, const Point& q1, const Point& q2);

}  // namespace sweepcert
