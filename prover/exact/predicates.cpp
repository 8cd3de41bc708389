#include "exact/predicates.hpp"

#include <cmath>
#include <limits>

namespace sweepcert {
namespace {

Rational power(const Point& x, const Point& c, const Rational& r) {
  Rational dx = x.x - c.x, dy = x.y - c.y;
  return dx * dx + dy * dy - r * r;
}

// Filter for sign(|a-b|^2 - s^2), s = ra + rb. Each input double is within 2u of its rational
// (mpq get_d truncates; u = 2^-53). With Ax = |ax|+|bx| (likewise Ay, S = |ra|+|rb|), the
// computed dx differs from the true one by at most 3u*Ax (two conversions, one subtraction),
// so dx^2 by at most 7u*Ax^2 (2|dx|*3u*Ax plus the product's rounding); likewise dy^2, s^2.
// Summing three terms adds at most 2u*(Ax^2+Ay^2+S^2). Total < 10u*(Ax^2+Ay^2+S^2); we use 16u.
// Returns +1/-1 when certain, 0 when the exact evaluation must decide.
int filtered_contact_sign(const Point& a, const Rational& ra, const Point& b,
                          const Rational& rb) {
  double ax = a.x.get_d(), ay = a.y.get_d(), bx = b.x.get_d(), by = b.y.get_d();
  double r1 = ra.get_d(), r2 = rb.get_d();
  double dx = ax - bx, dy = ay - by, s = r1 + r2;
  double v = dx * dx + dy * dy - s * s;
  double Ax = std::fabs(ax) + std::fabs(bx), Ay = std::fabs(ay) + std::fabs(by);
  double S = std::fabs(r1) + std::fabs(r2);
  double bound = 16.0 * std::numeric_limits<double>::epsilon() * 0.5 * (Ax * Ax + Ay * Ay + S * S);
  if (!std::isfinite(v) || !std::isfinite(bound)) return 0;
  if (v > bound) return +1;
  if (v < -bound) return -1;
  return 0;
}

}  // namespace

bool disks_meet(const Point& a, const Rational& ra, const Point& b, const Rational& rb) {
  int sign = filtered_contact_sign(a, ra, b, rb);
  if (sign != 0) return sign < 0;
  Rational dx = a.x - b.x, dy = a.y - b.y, s = ra + rb;
  return dx * dx + dy * dy <= s * s;
}

bool in_disk(const Point& p, const Point& c, const Rational& r) { return power(p, c, r) <= 0; }

// px, py are exact; cx, cy, rd are within 2u (relative) of c.x, c.y, r. With A = |px|+|cx|
// (likewise B), the computed dx is off by at most 3u*A, so dx^2 by at most 7u*A^2; rd^2 by at
// most 5u*rd^2; the sum's roundings add 2u*(A^2+B^2+rd^2). Bound: 16u*(A^2+B^2+rd^2).
bool in_disk_filtered(double px, double py, const Point& c, const Rational& r, double cx,
                      double cy, double rd) {
  double dx = px - cx, dy = py - cy;
  double v = dx * dx + dy * dy - rd * rd;
  double A = std::fabs(px) + std::fabs(cx), B = std::fabs(py) + std::fabs(cy);
  double bound = 8.0 * std::numeric_limits<double>::epsilon() * (A * A + B * B + rd * rd);
  if (std::isfinite(v) && std::isfinite(bound)) {
    if (v > bound) return false;
    if (v < -bound) return true;
  }
  return in_disk(Point{Rational(px), Rational(py)}, c, r);
}

std::optional<Point> triple_witness(const Point c[3], const Rational r[3]) {
  auto inside_all = [&](const Point& x) {
    for (int i = 0; i < 3; ++i)
      if (!in_disk(x, c[i], r[i])) return false;
    return true;
  };
  // Radical line of disks i, j: 2(cj-ci).x = |cj|^2-|ci|^2 - rj^2 + ri^2  (a.x = k).
  auto radical = [&](int i, int j, Rational& ax, Rational& ay, Rational& k) {
    ax = 2 * (c[j].x - c[i].x);
    ay = 2 * (c[j].y - c[i].y);
    k = c[j].x * c[j].x + c[j].y * c[j].y - c[i].x * c[i].x - c[i].y * c[i].y - r[j] * r[j] +
        r[i] * r[i];
  };
  // Radical centre first: when it is the optimum it is the deepest common point.
  {
    Rational a1, b1, k1, a2, b2, k2;
    radical(0, 1, a1, b1, k1);
    radical(0, 2, a2, b2, k2);
    Rational det = a1 * b2 - a2 * b1;
    if (det != 0) {
      Point x{(k1 * b2 - k2 * b1) / det, (a1 * k2 - a2 * k1) / det};
      if (inside_all(x)) return x;
    }
  }
  for (int i = 0; i < 3; ++i)
    for (int j = i + 1; j < 3; ++j) {
      Rational ax, ay, k;
      radical(i, j, ax, ay, k);
      Rational n2 = ax * ax + ay * ay;
      if (n2 == 0) continue;  // concentric: the centre candidate covers this case
      // Foot of c_i on the line a.x = k.
      Rational step = (k - (ax * c[i].x + ay * c[i].y)) / n2;
      Point x{c[i].x + step * ax, c[i].y + step * ay};
      if (inside_all(x)) return x;
    }
  for (int i = 0; i < 3; ++i)
    if (inside_all(c[i])) return c[i];
  return std::nullopt;
}

int orientation(const Point& p, const Point& q, const Point& r) {
  Rational v = (q.x - p.x) * (r.y - p.y) - (q.y - p.y) * (r.x - p.x);
  return sgn(v);
}

bool segments_meet(const Point& p1, const Point& p2, const Point& q1, const Point& q2) {
  auto on_segment = [](const Point& a, const Point& b, const Point& x) {
    return std::min(a.x, b.x) <= x.x && x.x <= std::max(a.x, b.x) && std::min(a.y, b.y) <= x.y &&
           x.y <= std::max(a.y, b.y);
  };
  int o1 = orientation(p1, p2, q1), o2 = orientation(p1, p2, q2);
  int o3 = orientation(q1, q2, p1), o4 = orientation(q1, q2, p2);
  if (o1 * o2 < 0 && o3 * o4 < 0) return true;
  if (o1 == 0 && on_segment(p1, p2, q1)) return true;
  if (o2 == 0 && on_segment(p1, p2, q2)) return true;
  if (o3 == 0 && on_segment(q1, q2, p1)) return true;
  if (o4 == 0 && on_segment(q1, q2, p2)) return true;
  return false;
}

}  // namespace sweepcert
