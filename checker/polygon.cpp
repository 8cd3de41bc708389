#include "polygon.hpp"

#include <algorithm>

namespace sweepcheck {

FencePolygon::FencePolygon(const Input& in) {
  for (std::uint32_t v : in.fence) {
    vertices.push_back(in.sensors[v].points.at(0));
    ids.push_back(v);
  }
}

namespace {

bool within_box(const Point& a, const Point& b, const Point& q) {
  return q.x >= std::min(a.x, b.x) && q.x <= std::max(a.x, b.x) && q.y >= std::min(a.y, b.y) &&
         q.y <= std::max(a.y, b.y);
}

// Does the ray from (px, py) towards +x cross the edge a -> b? Half-open in y, so a vertex on
// the ray's line is counted once. The point must not lie on the edge.
template <class T, class W>
bool ray_crosses(const T& ax, const T& ay, const T& bx, const T& by, const T& px, const T& py) {
  if ((ay > py) == (by > py)) return false;
  W o = W(bx - ax) * W(py - ay) - W(by - ay) * W(px - ax);
  return by > ay ? o > 0 : o < 0;
}

// The box test of BoxTester::meets_interior on frame coordinates already multiplied by the
// common denominator: the open box (x0, x1) x (y0, y1), its centre (cx, cy).
template <class T, class W>
std::int64_t box_test(const std::vector<T>& vx, const std::vector<T>& vy, const T& x0, const T& y0, const T& x1,
                      const T& y1, const T& cx, const T& cy) {
  const std::size_t m = vx.size();
  for (std::size_t i = 0; i < m; ++i) {
    const std::size_t j = i + 1 == m ? 0 : i + 1;
    const T &ax = vx[i], &ay = vy[i], &bx = vx[j], &by = vy[j];
    // Separating axes (the segment and the open box are convex): x, y and the segment's normal.
    if (std::max(ax, bx) <= x0 || std::min(ax, bx) >= x1 || std::max(ay, by) <= y0 || std::min(ay, by) >= y1) continue;
    const W dx = W(bx - ax), dy = W(by - ay);
    bool pos = false, neg = false;
    const T* xs[2] = {&x0, &x1};
    const T* ys[2] = {&y0, &y1};
    for (int c = 0; c < 4; ++c) {
      W o = dx * W(*ys[c >> 1] - ay) - dy * W(*xs[c & 1] - ax);
      if (o > 0) pos = true;
      if (o < 0) neg = true;
    }
    if (pos && neg) return static_cast<std::int64_t>(i);
  }
  // No edge meets the open box, so the box lies wholly inside or wholly outside P and its
  // centre is on no edge: the crossing number decides.
  bool inside = false;
  for (std::size_t i = 0; i < m; ++i) {
    const std::size_t j = i + 1 == m ? 0 : i + 1;
    if (ray_crosses<T, W>(vx[i], vy[i], vx[j], vy[j], cx, cy)) inside = !inside;
  }
  return inside ? static_cast<std::int64_t>(m) : -1;
}

}  // namespace

Side FencePolygon::locate(const Point& p, std::size_t* edge) const {
  const std::size_t m = vertices.size();
  for (std::size_t i = 0; i < m; ++i) {
    const Point &a = vertices[i], &b = vertices[(i + 1) % m];
    if (orientation(a, b, p) == 0 && within_box(a, b, p)) {
      if (edge) *edge = i;
      return Side::Boundary;
    }
  }
  bool inside = false;
  for (std::size_t i = 0; i < m; ++i) {
    const Point &a = vertices[i], &b = vertices[(i + 1) % m];
    if (ray_crosses<Rat, Rat>(a.x, a.y, b.x, b.y, p.x, p.y)) inside = !inside;
  }
  return inside ? Side::Inside : Side::Outside;
}

BoxTester::BoxTester(const FencePolygon& polygon, const Point& origin, const Rat& side) {
  const Rat unit = Rat(Int(1) << kLevel) / side;
  std::vector<Rat> ux, uy;
  Int scale = 1;
  for (const Point& v : polygon.vertices) {
    ux.push_back((v.x - origin.x) * unit);
    uy.push_back((v.y - origin.y) * unit);
    for (const Rat* q : {&ux.back(), &uy.back()}) scale = boost::multiprecision::lcm(scale, denominator(*q));
  }
  for (std::size_t i = 0; i < ux.size(); ++i) {
    bx_.push_back(numerator(ux[i]) * (scale / denominator(ux[i])));
    by_.push_back(numerator(uy[i]) * (scale / denominator(uy[i])));
  }
  big_scale_ = scale;
  // Small path: every coordinate (vertex or box corner times scale) in [-2^62, 2^62], so
  // differences fit int64 and a cross product of differences fits __int128.
  const Int limit = Int(1) << 62;
  small_ = scale < (Int(1) << 20);
  for (std::size_t i = 0; small_ && i < bx_.size(); ++i)
    if (abs(bx_[i]) > limit || abs(by_[i]) > limit) small_ = false;
  if (small_) {
    scale_ = static_cast<std::int64_t>(scale);
    for (std::size_t i = 0; i < bx_.size(); ++i) {
      vx_.push_back(static_cast<std::int64_t>(bx_[i]));
      vy_.push_back(static_cast<std::int64_t>(by_[i]));
    }
    bx_.clear();
    by_.clear();
  }
}

std::int64_t BoxTester::meets_interior(std::int64_t x, std::int64_t y, std::int64_t s) const {
  if (small_) {
    const std::int64_t k = scale_;
    return box_test<std::int64_t, __int128>(vx_, vy_, x * k, y * k, (x + s) * k, (y + s) * k, (x + s / 2) * k,
                                            (y + s / 2) * k);
  }
  const Int& k = big_scale_;
  return box_test<Int, Int>(bx_, by_, Int(x) * k, Int(y) * k, Int(x + s) * k, Int(y + s) * k, Int(x + s / 2) * k,
                            Int(y + s / 2) * k);
}

}  // namespace sweepcheck
