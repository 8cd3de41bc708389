#include "report/area.hpp"

#include <algorithm>
#include <cmath>

namespace sweepcert {
namespace {

constexpr double kTwoPi = 6.28318530717958647692;

double angle_in_turn(double a) {  // into [0, 2π)
  a = std::fmod(a, kTwoPi);
  return a < 0 ? a + kTwoPi : a;
}

double signed_area2(const std::vector<Vec2>& p) {
  double s = 0;
  for (std::size_t i = 0; i < p.size(); ++i) {
    const Vec2 &a = p[i], &b = p[(i + 1) % p.size()];
    s += a.x * b.y - a.y * b.x;
  }
  return s;
}

// Crossing-number test. The points asked about are midpoints of boundary pieces, which lie on
// P's boundary only in degenerate (measure-zero) configurations.
bool inside(const std::vector<Vec2>& p, Vec2 q) {
  bool in = false;
  for (std::size_t i = 0, j = p.size() - 1; i < p.size(); j = i++)
    if ((p[i].y > q.y) != (p[j].y > q.y) &&
        q.x < (p[j].x - p[i].x) * (q.y - p[i].y) / (p[j].y - p[i].y) + p[i].x)
      in = !in;
  return in;
}

bool strictly_in(const Circle& d, Vec2 q) {
  double dx = q.x - d.c.x, dy = q.y - d.c.y;
  return dx * dx + dy * dy < d.r * d.r;
}

// ∫ x dy along the counter-clockwise arc of d from angle a to angle b >= a.
double arc_integral(const Circle& d, double a, double b) {
  return d.c.x * d.r * (std::sin(b) - std::sin(a)) +
         d.r * d.r * ((b - a) / 2 + (std::sin(2 * b) - std::sin(2 * a)) / 4);
}

}  // namespace

double polygon_area(const std::vector<Vec2>& polygon) { return std::abs(signed_area2(polygon)) / 2; }

double uncovered_area(const std::vector<Vec2>& polygon, const std::vector<Circle>& disks) {
  double x0 = polygon[0].x, x1 = x0, y0 = polygon[0].y, y1 = y0;
  for (const Vec2& v : polygon) {
    x0 = std::min(x0, v.x), x1 = std::max(x1, v.x);
    y0 = std::min(y0, v.y), y1 = std::max(y1, v.y);
  }
  const Vec2 o{(x0 + x1) / 2, (y0 + y1) / 2};
  std::vector<Vec2> P;
  for (const Vec2& v : polygon) P.push_back({v.x - o.x, v.y - o.y});
  const double orient = signed_area2(P) > 0 ? 1 : -1;

  // Shifted circles; a repeated circle (to 1e-12 of the scene's size) would hide both copies'
  // arcs from each other, so keep one.
  const double same = 1e-12 * std::max(x1 - x0, y1 - y0);
  std::vector<Circle> C;
  for (const Circle& d : disks) {
    Circle e{{d.c.x - o.x, d.c.y - o.y}, d.r};
    bool repeated = e.r <= 0;
    for (const Circle& f : C)
      repeated = repeated || (std::abs(f.c.x - e.c.x) <= same && std::abs(f.c.y - e.c.y) <= same &&
                              std::abs(f.r - e.r) <= same);
    if (!repeated) C.push_back(e);
  }
  const std::size_t n = C.size();
  std::vector<std::vector<double>> angles(n);
  std::vector<std::vector<std::size_t>> overlapping(n);
  std::vector<char> meets_edge(n, 0);
  for (std::size_t i = 0; i < n; ++i)
    for (std::size_t j = i + 1; j < n; ++j) {
      double dx = C[j].c.x - C[i].c.x, dy = C[j].c.y - C[i].c.y;
      double s = C[i].r + C[j].r;
      if (std::abs(dx) >= s || std::abs(dy) >= s) continue;
      double d2 = dx * dx + dy * dy, d = std::sqrt(d2);
      if (d >= s) continue;
      overlapping[i].push_back(j);
      overlapping[j].push_back(i);
      if (d <= std::abs(C[i].r - C[j].r)) continue;  // nested: the circles do not cross
      double phi = std::atan2(dy, dx);
      double ai = std::acos(std::clamp((d2 + C[i].r * C[i].r - C[j].r * C[j].r) / (2 * d * C[i].r), -1.0, 1.0));
      double aj = std::acos(std::clamp((d2 + C[j].r * C[j].r - C[i].r * C[i].r) / (2 * d * C[j].r), -1.0, 1.0));
      angles[i].push_back(angle_in_turn(phi + ai));
      angles[i].push_back(angle_in_turn(phi - ai));
      angles[j].push_back(angle_in_turn(phi + kTwoPi / 2 + aj));
      angles[j].push_back(angle_in_turn(phi + kTwoPi / 2 - aj));
    }

  double total = 0;
  // Edges of P: pieces outside every disk, in P's own direction times its orientation.
  std::vector<double> cuts;
  std::vector<std::size_t> near;
  for (std::size_t e = 0; e < P.size(); ++e) {
    const Vec2 p = P[e], q = P[(e + 1) % P.size()];
    const Vec2 u{q.x - p.x, q.y - p.y};
    const double A = u.x * u.x + u.y * u.y;
    cuts.assign({0.0, 1.0});
    near.clear();
    for (std::size_t i = 0; i < n; ++i) {
      Vec2 w{p.x - C[i].c.x, p.y - C[i].c.y};
      double B = u.x * w.x + u.y * w.y, Cc = w.x * w.x + w.y * w.y - C[i].r * C[i].r;
      double disc = B * B - A * Cc;
      if (disc <= 0) continue;
      double root = std::sqrt(disc), s0 = (-B - root) / A, s1 = (-B + root) / A;
      if (s1 <= 0 || s0 >= 1) continue;
      near.push_back(i);
      for (double s : {s0, s1}) {
        if (s < 0 || s > 1) continue;
        if (s > 0 && s < 1) cuts.push_back(s);
        angles[i].push_back(angle_in_turn(std::atan2(w.y + s * u.y, w.x + s * u.x)));
        meets_edge[i] = 1;
      }
    }
    std::sort(cuts.begin(), cuts.end());
    for (std::size_t k = 0; k + 1 < cuts.size(); ++k) {
      double s0 = cuts[k], s1 = cuts[k + 1];
      if (s1 <= s0) continue;
      Vec2 m{p.x + u.x * (s0 + s1) / 2, p.y + u.y * (s0 + s1) / 2};
      if (std::any_of(near.begin(), near.end(), [&](std::size_t i) { return strictly_in(C[i], m); }))
        continue;
      total += orient * (p.x + u.x * (s0 + s1) / 2) * (u.y * (s1 - s0));
    }
  }
  // Circles: arcs inside P and outside every other disk, clockwise.
  for (std::size_t i = 0; i < n; ++i) {
    std::vector<double>& a = angles[i];
    std::sort(a.begin(), a.end());
    if (a.empty()) a.push_back(0.0);
    int in_p = -1;  // constant along the circle when it meets no edge of P
    for (std::size_t k = 0; k < a.size(); ++k) {
      double from = a[k], to = k + 1 < a.size() ? a[k + 1] : a[0] + kTwoPi;
      if (to <= from) continue;
      double mid = (from + to) / 2;
      Vec2 m{C[i].c.x + C[i].r * std::cos(mid), C[i].c.y + C[i].r * std::sin(mid)};
      if (std::any_of(overlapping[i].begin(), overlapping[i].end(),
                      [&](std::size_t j) { return strictly_in(C[j], m); }))
        continue;
      bool in = meets_edge[i] || in_p < 0 ? inside(P, m) : in_p == 1;
      if (!meets_edge[i]) in_p = in;
      if (in) total -= arc_integral(C[i], from, to);
    }
  }
  return total;
}

}  // namespace sweepcert
