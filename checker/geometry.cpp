#include "geometry.hpp"

namespace sweepcheck {

Rat dist2(const Point& a, const Point& b) {
  Rat dx = a.x - b.x, dy = a.y - b.y;
  return dx * dx + dy * dy;
}

int orientation(const Point& a, const Point& b, const Point& c) {
  Rat cross = (b.x - a.x) * (c.y - a.y) - (b.y - a.y) * (c.x - a.x);
  return cross.sign();
}

bool disks_meet(const Point& a, const Rat& ra, const Point& b, const Rat& rb) {
  Rat sum = ra + rb;
  return dist2(a, b) <= sum * sum;
}

bool in_disk(const Point& w, const Point& c, const Rat& r) { return dist2(w, c) <= r * r; }

namespace {

bool in_all(const Point& p, const Point c[3], const Rat r2[3]) {
  for (int i = 0; i < 3; ++i)
    if (dist2(p, c[i]) > r2[i]) return false;
  return true;
}

}  // namespace

bool three_disks_meet(const Point c[3], const Rat r[3]) {
  const Rat r2[3] = {r[0] * r[0], r[1] * r[1], r[2] * r[2]};
  for (int i = 0; i < 3; ++i)
    if (in_all(c[i], c, r2)) return true;
  // Radical line of disks i, j: |p - c_i|^2 - r_i^2 = |p - c_j|^2 - r_j^2. It is perpendicular
  // to c_i c_j, so the projection of c_i onto it is c_i + lambda (c_j - c_i) with
  // lambda = (d^2 + r_i^2 - r_j^2) / (2 d^2).
  for (int i = 0; i < 3; ++i) {
    int j = (i + 1) % 3;
    Rat d2 = dist2(c[i], c[j]);
    if (d2 == 0) continue;  // concentric: the centre candidates cover this case
    Rat lambda = (d2 + r2[i] - r2[j]) / (2 * d2);
    Point p{c[i].x + lambda * (c[j].x - c[i].x), c[i].y + lambda * (c[j].y - c[i].y)};
    if (in_all(p, c, r2)) return true;
  }
  // Radical centre: 2 p.(c_j - c_0) = |c_j|^2 - |c_0|^2 - r_j^2 + r_0^2 for j = 1, 2 (Cramer).
  Rat a1 = 2 * (c[1].x - c[0].x), b1 = 2 * (c[1].y - c[0].y);
  Rat a2 = 2 * (c[2].x - c[0].x), b2 = 2 * (c[2].y - c[0].y);
  Rat det = a1 * b2 - a2 * b1;
  if (det == 0) return false;  // collinear centres: no radical centre
  Rat n0 = c[0].x * c[0].x + c[0].y * c[0].y - r2[0];
  Rat e1 = c[1].x * c[1].x + c[1].y * c[1].y - r2[1] - n0;
  Rat e2 = c[2].x * c[2].x + c[2].y * c[2].y - r2[2] - n0;
  Point p{(e1 * b2 - e2 * b1) / det, (a1 * e2 - a2 * e1) / det};
  return in_all(p, c, r2);
}

namespace {

// q lies in the bounding box of [a, b] (used once q is known to be collinear with a, b).
bool within_box(const Point& a, const Point& b, const Point& q) {
  return (q.x >= (a.x < b.x ? a.x : b.x)) && (q.x <= (a.x < b.x ? b.x : a.x)) &&
         (q.y >= (a.y < b.y ? a.y : b.y)) && (q.y <= (a.y < b.y ? b.y : a.y));
}

}  // namespace

bool segments_meet(const Point& p1, const Point& p2, const Point& q1, const Point& q2) {
  int o1 = orientation(p1, p2, q1), o2 = orientation(p1, p2, q2);
  int o3 = orientation(q1, q2, p1), o4 = orientation(q1, q2, p2);
  if (o1 * o2 < 0 && o3 * o4 < 0) return true;  // proper crossing
  if (o1 == 0 && within_box(p1, p2, q1)) return true;
  if (o2 == 0 && within_box(p1, p2, q2)) return true;
  if (o3 == 0 && within_box(q1, q2, p1)) return true;
  if (o4 == 0 && within_box(q1, q2, p2)) return true;
  return false;
}

}  // namespace sweepcheck
