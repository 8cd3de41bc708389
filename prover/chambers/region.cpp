#include "chambers/region.hpp"

#include <algorithm>
#include <cmath>
#include <limits>

#include "exact/predicates.hpp"

namespace sweepcert {

Region::Region(const Sweep& sweep) {
  for (std::size_t i = 0; i < sweep.fence_count; ++i)
    v_.push_back({sweep.sensors[i].track[0].x, sweep.sensors[i].track[0].y});
  minx_ = miny_ = 1e300;
  maxx_ = maxy_ = -1e300;
  for (std::size_t i = 0; i < v_.size(); ++i) {
    const Point& a = v_[i];
    const Point& b = v_[(i + 1) % v_.size()];
    double ax = a.x.get_d(), ay = a.y.get_d(), bx = b.x.get_d(), by = b.y.get_d();
    vx_.push_back(ax);
    vy_.push_back(ay);
    // Widened by a relative hair so the double box surely contains the exact edge.
    double pad = 1e-9 * (std::max({std::fabs(ax), std::fabs(bx), std::fabs(ay), std::fabs(by)}) + 1);
    edge_bbox_.push_back({std::min(ax, bx) - pad, std::min(ay, by) - pad, std::max(ax, bx) + pad,
                          std::max(ay, by) + pad});
    minx_ = std::min(minx_, edge_bbox_.back().x0);
    miny_ = std::min(miny_, edge_bbox_.back().y0);
    maxx_ = std::max(maxx_, edge_bbox_.back().x1);
    maxy_ = std::max(maxy_, edge_bbox_.back().y1);
  }
}

int Region::classify_point(const Point& p) const {
  // Crossing number with exact orientation; the boundary is detected exactly.
  bool inside = false;
  for (std::size_t i = 0; i < v_.size(); ++i) {
    const Point& a = v_[i];
    const Point& b = v_[(i + 1) % v_.size()];
    int o = orientation(a, b, p);
    if (o == 0 && std::min(a.x, b.x) <= p.x && p.x <= std::max(a.x, b.x) &&
        std::min(a.y, b.y) <= p.y && p.y <= std::max(a.y, b.y))
      return 0;
    if ((a.y > p.y) != (b.y > p.y)) {
      // The edge crosses the horizontal line through p; is the crossing right of p?
      bool right = (b.y > a.y) ? o > 0 : o < 0;
      if (right) inside = !inside;
    }
  }
  return inside ? +1 : -1;
}

int Region::classify_point(double px, double py) const {
  // Crossing number in doubles. Vertices are within 2u (relative) of their rationals, the point
  // is exact. Each orientation is certain when it exceeds 16u times the sum of the magnitudes of
  // its products (a generous bound for two rounded inputs and four roundings); each comparison
  // of y values is certain when they differ by more than 4u|y|. Otherwise: exact.
  const double u = std::numeric_limits<double>::epsilon() / 2;
  bool inside = false;
  std::size_t m = vx_.size();
  for (std::size_t i = 0; i < m; ++i) {
    std::size_t j = (i + 1) % m;
    double ay = vy_[i], by = vy_[j];
    double tol_a = 4 * u * std::fabs(ay), tol_b = 4 * u * std::fabs(by);
    if (std::fabs(ay - py) <= tol_a + 1e-300 || std::fabs(by - py) <= tol_b + 1e-300)
      return classify_point(Point{Rational(px), Rational(py)});
    if ((ay > py) == (by > py)) {
      continue;  // no crossing; the point may still lie on this edge only if py is between
    }
    double ax = vx_[i], bx = vx_[j];
    double l = (bx - ax) * (py - ay), r = (by - ay) * (px - ax);
    double det = l - r;
    double bound = 16 * u * ((std::fabs(bx) + std::fabs(ax)) * (std::fabs(py) + std::fabs(ay)) +
                             (std::fabs(by) + std::fabs(ay)) * (std::fabs(px) + std::fabs(ax)));
    if (std::fabs(det) <= bound) return classify_point(Point{Rational(px), Rational(py)});
    int o = det > 0 ? 1 : -1;
    bool right = (by > ay) ? o > 0 : o < 0;
    if (right) inside = !inside;
  }
  return inside ? +1 : -1;
}

bool Region::strictly_inside(const Point& p) const { return classify_point(p) > 0; }

bool Region::edge_meets_open_box(std::size_t e, const BoxD& b) const {
  const BoxD& eb = edge_bbox_[e];
  if (eb.x1 <= b.x0 || eb.x0 >= b.x1 || eb.y1 <= b.y0 || eb.y0 >= b.y1) {
    // The padded bbox misses the open box, so the exact edge does too... unless the padding
    // decided it; the padded bbox contains the edge, so missing the open box is conclusive.
    return false;
  }
  // Exact: clip the segment against the open box (Liang-Barsky with strict bounds).
  const Point& p = v_[e];
  const Point& q = v_[(e + 1) % v_.size()];
  Rational dx = q.x - p.x, dy = q.y - p.y;
  Rational lo = 0, hi = 1;
  bool lo_open = false, hi_open = false;  // whether the bound is strict
  auto clip = [&](const Rational& d, const Rational& num) {
    // Constraint: d * s < num (strict), s in [lo, hi].
    if (d == 0) return num > 0;
    Rational s = num / d;
    if (d > 0) {  // s < num/d
      if (s < hi || (s == hi && !hi_open)) { hi = s; hi_open = true; }
    } else {  // s > num/d
      if (s > lo || (s == lo && !lo_open)) { lo = s; lo_open = true; }
    }
    return true;
  };
  Rational X0(b.x0), X1(b.x1), Y0(b.y0), Y1(b.y1);
  if (!clip(-dx, p.x - X0)) return false;  // x > X0
  if (!clip(dx, X1 - p.x)) return false;   // x < X1
  if (!clip(-dy, p.y - Y0)) return false;
  if (!clip(dy, Y1 - p.y)) return false;
  if (lo < hi) return true;
  return lo == hi && !lo_open && !hi_open;
}

bool Region::box_outside(const BoxD& b) const {
  if (b.x0 >= maxx_ || b.x1 <= minx_ || b.y0 >= maxy_ || b.y1 <= miny_) {
    // Entirely beyond the polygon's (padded) bounding box: the centre is outside and no edge
    // can reach the open box.
    return true;
  }
  for (std::size_t e = 0; e < v_.size(); ++e)
    if (edge_meets_open_box(e, b)) return false;
  // The centre of a dyadic box is an exact double.
  return classify_point((b.x0 + b.x1) / 2, (b.y0 + b.y1) / 2) < 0;
}

}  // namespace sweepcert
