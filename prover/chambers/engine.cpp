#include "chambers/engine.hpp"

#include <algorithm>
#include <cmath>
#include <unordered_map>

#include "exact/predicates.hpp"

namespace sweepcert {
namespace {

// Sensor i over one slab: centres at the slab ends and at its waypoints inside the slab.
struct Track {
  std::vector<Point> c;
  std::vector<double> cx, cy;
  Rational r;
  double rd = 0;
  BoxD reach;  // bounding box of every disk position over the slab (padded)
};

std::vector<Track> tracks_over(const Sweep& s, const Rational& a, const Rational& b) {
  std::vector<Track> out(s.sensors.size());
  for (std::size_t i = 0; i < s.sensors.size(); ++i) {
    Track& t = out[i];
    t.r = s.sensors[i].radius;
    t.rd = t.r.get_d();
    std::vector<Rational> times{a};
    for (const auto& w : s.sensors[i].track)
      if (a < w.t && w.t < b) times.push_back(w.t);
    times.push_back(b);
    double x0 = 1e300, y0 = 1e300, x1 = -1e300, y1 = -1e300;
    for (const auto& tm : times) {
      t.c.push_back(s.position(i, tm));
      t.cx.push_back(t.c.back().x.get_d());
      t.cy.push_back(t.c.back().y.get_d());
      x0 = std::min(x0, t.cx.back()); x1 = std::max(x1, t.cx.back());
      y0 = std::min(y0, t.cy.back()); y1 = std::max(y1, t.cy.back());
    }
    double pad = t.rd * (1 + 1e-9) + 1e-9 * (std::fabs(x0) + std::fabs(x1) + std::fabs(y0) + std::fabs(y1) + 1);
    t.reach = {x0 - pad, y0 - pad, x1 + pad, y1 + pad};
  }
  return out;
}

bool boxes_meet(const BoxD& a, const BoxD& b) {
  return a.x0 <= b.x1 && b.x0 <= a.x1 && a.y0 <= b.y1 && b.y0 <= a.y1;
}

double point_box_dist2(double px, double py, const BoxD& b) {
  double dx = std::max({b.x0 - px, 0.0, px - b.x1});
  double dy = std::max({b.y0 - py, 0.0, py - b.y1});
  return dx * dx + dy * dy;
}

double point_segment_dist2(double px, double py, double ax, double ay, double bx, double by) {
  double vx = bx - ax, vy = by - ay;
  double len2 = vx * vx + vy * vy;
  double s = len2 > 0 ? std::clamp(((px - ax) * vx + (py - ay) * vy) / len2, 0.0, 1.0) : 0.0;
  double dx = ax + s * vx - px, dy = ay + s * vy - py;
  return dx * dx + dy * dy;
}

bool segment_meets_box(double ax, double ay, double bx, double by, const BoxD& b) {
  double lo = 0, hi = 1;
  auto clip = [&](double d, double num) {
    if (d == 0) return num >= 0;
    double s = num / d;
    if (d > 0) hi = std::min(hi, s); else lo = std::max(lo, s);
    return lo <= hi;
  };
  return clip(-(bx - ax), ax - b.x0) && clip(bx - ax, b.x1 - ax) && clip(-(by - ay), ay - b.y0) &&
         clip(by - ay, b.y1 - ay);
}

// Squared distance from box to the polyline of centres (0 if they meet). Doubles: the result
// only marks cells free for the route search, and every route is re-checked exactly.
double track_box_dist2(const Track& t, const BoxD& b) {
  double best = 1e300;
  for (std::size_t k = 0; k < t.c.size(); ++k) {
    best = std::min(best, point_box_dist2(t.cx[k], t.cy[k], b));
    if (k + 1 < t.c.size()) {
      if (segment_meets_box(t.cx[k], t.cy[k], t.cx[k + 1], t.cy[k + 1], b)) return 0;
      for (double cx : {b.x0, b.x1})
        for (double cy : {b.y0, b.y1})
          best = std::min(best, point_segment_dist2(cx, cy, t.cx[k], t.cy[k], t.cx[k + 1], t.cy[k + 1]));
    }
  }
  return best;
}

// Exact: are all four corners in disk i at every check time of the slab?
bool covers(const Track& t, const BoxD& b) {
  for (std::size_t k = 0; k < t.c.size(); ++k) {
    // Quick rejection: the box must lie within the disk's bounding square.
    if (b.x0 < t.cx[k] - t.rd * (1 + 1e-12) - 1e-12 || b.x1 > t.cx[k] + t.rd * (1 + 1e-12) + 1e-12 ||
        b.y0 < t.cy[k] - t.rd * (1 + 1e-12) - 1e-12 || b.y1 > t.cy[k] + t.rd * (1 + 1e-12) + 1e-12)
      return false;
    for (double px : {b.x0, b.x1})
      for (double py : {b.y0, b.y1})
        if (!in_disk_filtered(px, py, t.c[k], t.r, t.cx[k], t.cy[k], t.rd)) return false;
  }
  return true;
}

using OutsideMemo = std::unordered_map<std::uint64_t, bool>;

std::uint64_t cell_key(const Cell& c) {
  return (std::uint64_t(c.depth) << 58) | (std::uint64_t(c.ix) << 29) | std::uint64_t(c.iy);
}

class SlabBuilder {
 public:
  SlabBuilder(const Sweep& s, const Region& region, const Square& sq, OutsideMemo& memo,
              Slab& slab, int max_depth)
      : region_(region), sq_(sq), memo_(memo), slab_(slab), max_depth_(max_depth),
        tracks_(tracks_over(s, slab.a, slab.b)) {}

  // Classifies leaf i given the candidate sensors of its parent.
  void classify(std::uint32_t i, const std::vector<std::uint32_t>& parent) {
    Cell& c = slab_.tree.at(i);
    BoxD b = sq_.box(c);
    auto key = cell_key(c);
    auto it = memo_.find(key);
    bool outside = it != memo_.end() ? it->second : (memo_[key] = region_.box_outside(b));
    if (outside) { c.kind = CellKind::Outside; return; }
    std::vector<std::uint32_t> near;
    for (std::uint32_t s : parent)
      if (boxes_meet(tracks_[s].reach, b)) near.push_back(s);
    for (std::uint32_t s : near)
      if (covers(tracks_[s], b)) {
        c.kind = CellKind::Covered;
        c.sensor = s;
        return;
      }
    c.kind = CellKind::Open;
    c.free = true;
    for (std::uint32_t s : near) {
      double margin = tracks_[s].rd * (1 + 1e-9) + 1e-9;
      if (track_box_dist2(tracks_[s], b) <= margin * margin) { c.free = false; break; }
    }
    if (!c.free) candidates_[i] = std::move(near);
  }

  void start() {
    std::vector<std::uint32_t> all(tracks_.size());
    for (std::uint32_t s = 0; s < all.size(); ++s) all[s] = s;
    classify(0, all);
  }

  // Live set given the previous slab's live cells (nullptr: first slab). Returns live flags.
  std::vector<char> live_set(const std::vector<Span>* prev) {
    const Quadtree& t = slab_.tree;
    std::vector<char> live(t.size(), 0);
    std::vector<std::uint32_t> queue;
    auto add = [&](std::uint32_t i) {
      if (t.at(i).kind == CellKind::Open && !live[i]) { live[i] = 1; queue.push_back(i); }
    };
    if (!prev) {
      for (std::uint32_t i = 0; i < t.size(); ++i)
        if (t.at(i).kind == CellKind::Open) add(i);
    } else {
      for (const Span& s : *prev) t.for_each_leaf_meeting(s, add);
    }
    for (std::size_t q = 0; q < queue.size(); ++q) t.for_each_leaf_meeting(span(t.at(queue[q])), add);
    return live;
  }

  // Refines live mixed cells until none is left above the depth limit; returns live flags.
  std::vector<char> refine(const std::vector<Span>* prev, std::size_t& budget) {
    for (;;) {
      std::vector<char> live = live_set(prev);
      std::vector<std::uint32_t> todo;
      for (std::uint32_t i = 0; i < slab_.tree.size(); ++i) {
        const Cell& c = slab_.tree.at(i);
        if (live[i] && c.kind == CellKind::Open && !c.free && c.depth < max_depth_) todo.push_back(i);
      }
      if (todo.empty() || slab_.tree.size() + 4 * todo.size() > budget) return live;
      // Refine each live mixed cell two levels at once: recomputing the live set after every
      // level costs more than the few cells that an extra level adds where it was not needed.
      for (std::uint32_t i : todo) split_down(i, 3, budget);
    }
  }

  void split_down(std::uint32_t i, int levels, std::size_t budget) {
    const Cell& c = slab_.tree.at(i);
    if (levels == 0 || c.kind != CellKind::Open || c.free || c.depth >= max_depth_ ||
        slab_.tree.size() + 4 > budget)
      return;
    std::vector<std::uint32_t> near = std::move(candidates_[i]);
    candidates_.erase(i);
    std::uint32_t first = slab_.tree.split(i);
    for (std::uint32_t k = 0; k < 4; ++k) classify(first + k, near);
    for (std::uint32_t k = 0; k < 4; ++k) split_down(first + k, levels - 1, budget);
  }



 private:
  const Region& region_;
  const Square& sq_;
  OutsideMemo& memo_;
  Slab& slab_;
  int max_depth_;
  std::vector<Track> tracks_;
  std::unordered_map<std::uint32_t, std::vector<std::uint32_t>> candidates_;
};

// Slab ends: horizon ends and every waypoint time inside; then each slab cut evenly so that no
// mobile sensor moves more than half its radius within one.
std::vector<Rational> initial_slab_ends(const Sweep& s) {
  std::vector<Rational> ends{s.t_start};
  for (const auto& t : s.waypoint_times(s.t_start, s.t_end)) ends.push_back(t);
  ends.push_back(s.t_end);
  std::vector<Rational> out{ends[0]};
  for (std::size_t k = 0; k + 1 < ends.size(); ++k) {
    const Rational &a = ends[k], &b = ends[k + 1];
    double pieces = 1;
    for (std::size_t i = s.fence_count; i < s.sensors.size(); ++i) {
      Point p = s.position(i, a), q = s.position(i, b);
      double d = std::hypot(Rational(q.x - p.x).get_d(), Rational(q.y - p.y).get_d());
      pieces = std::max(pieces, std::ceil(d / (0.5 * s.sensors[i].radius.get_d())));
    }
    long n = static_cast<long>(std::min(pieces, 4096.0));
    for (long j = 1; j < n; ++j) out.push_back(a + (b - a) * fraction(j, n));
    out.push_back(b);
  }
  return out;
}

Square square_around(const Region& region) {
  double x0 = std::floor(region.min_x()) - 1, y0 = std::floor(region.min_y()) - 1;
  double extent = std::max(region.max_x() - x0, region.max_y() - y0) + 1;
  double side = 1;
  while (side < extent) side *= 2;
  return {x0, y0, side};
}

std::vector<Span> live_spans(const Quadtree& t, const std::vector<char>& live) {
  std::vector<Span> out;
  for (std::uint32_t i = 0; i < t.size(); ++i)
    if (live[i]) out.push_back(span(t.at(i)));
  return out;
}

Rational exact(double d) { return Rational(d); }  // cell corners are exact doubles

// A route through free cells: forward reachability over (slab, cell), then back-tracking.
bool find_route(const Region& region, const Square& sq,
                const std::vector<Slab>& slabs, std::vector<std::array<Rational, 3>>& route) {
  const std::size_t n = slabs.size();
  std::vector<std::vector<std::int64_t>> parent(n);  // -2 unreached, -1 start, else packed
  auto pack = [](std::size_t s, std::uint32_t i) { return (std::int64_t(s) << 32) | i; };
  for (std::size_t s = 0; s < n; ++s) {
    const Quadtree& t = slabs[s].tree;
    parent[s].assign(t.size(), -2);
    std::vector<std::uint32_t> queue;
    auto free_leaf = [&](std::uint32_t i) { return t.at(i).kind == CellKind::Open && t.at(i).free; };
    if (s == 0) {
      for (std::uint32_t i = 0; i < t.size(); ++i) {
        if (!free_leaf(i)) continue;
        BoxD b = sq.box(t.at(i));
        Point c{(exact(b.x0) + exact(b.x1)) / 2, (exact(b.y0) + exact(b.y1)) / 2};
        if (region.strictly_inside(c)) { parent[0][i] = -1; queue.push_back(i); }
      }
    } else {
      const Quadtree& prev = slabs[s - 1].tree;
      for (std::uint32_t j = 0; j < prev.size(); ++j) {
        if (parent[s - 1][j] == -2) continue;
        t.for_each_leaf_meeting(span(prev.at(j)), [&](std::uint32_t i) {
          if (free_leaf(i) && parent[s][i] == -2) { parent[s][i] = pack(s - 1, j); queue.push_back(i); }
        });
      }
    }
    for (std::size_t q = 0; q < queue.size(); ++q) {
      std::uint32_t from = queue[q];
      t.for_each_leaf_meeting(span(t.at(from)), [&](std::uint32_t i) {
        if (free_leaf(i) && parent[s][i] == -2) { parent[s][i] = pack(s, from); queue.push_back(i); }
      });
    }
    if (queue.empty()) return false;
  }
  // Back-track from any reached cell of the last slab.
  std::vector<std::pair<std::size_t, std::uint32_t>> chain;
  for (std::uint32_t i = 0; i < slabs[n - 1].tree.size(); ++i)
    if (parent[n - 1][i] != -2) { chain.push_back({n - 1, i}); break; }
  while (parent[chain.back().first][chain.back().second] >= 0) {
    std::int64_t p = parent[chain.back().first][chain.back().second];
    chain.push_back({std::size_t(p >> 32), std::uint32_t(p & 0xffffffff)});
  }
  std::reverse(chain.begin(), chain.end());

  // Points: start at the first cell's centre; at each step move (if needed) to a point in both
  // cells. Within a slab, moves are spread evenly; the intruder waits when it need not move.
  auto box_of = [&](std::size_t s, std::uint32_t i) { return sq.box(slabs[s].tree.at(i)); };
  auto contains = [](const BoxD& b, const Point& p) {
    return exact(b.x0) <= p.x && p.x <= exact(b.x1) && exact(b.y0) <= p.y && p.y <= exact(b.y1);
  };
  auto meet_centre = [&](const BoxD& a, const BoxD& b) {
    double x0 = std::max(a.x0, b.x0), x1 = std::min(a.x1, b.x1);
    double y0 = std::max(a.y0, b.y0), y1 = std::min(a.y1, b.y1);
    return Point{(exact(x0) + exact(x1)) / 2, (exact(y0) + exact(y1)) / 2};
  };
  BoxD b0 = box_of(chain[0].first, chain[0].second);
  Point here{(exact(b0.x0) + exact(b0.x1)) / 2, (exact(b0.y0) + exact(b0.y1)) / 2};
  route.clear();
  route.push_back({slabs[0].a, here.x, here.y});
  std::size_t k = 0;
  for (std::size_t s = 0; s < n; ++s) {
    // Points visited in slab s, ending with the point carried into slab s+1 (or the last).
    std::vector<Point> pts;
    const Point start = here;
    while (k + 1 < chain.size() && chain[k + 1].first == s) {
      BoxD cur = box_of(s, chain[k].second), next = box_of(s, chain[k + 1].second);
      if (!contains(next, here)) { here = meet_centre(cur, next); pts.push_back(here); }
      ++k;
    }
    if (k + 1 < chain.size()) {
      BoxD cur = box_of(s, chain[k].second), next = box_of(s + 1, chain[k + 1].second);
      if (!contains(next, here)) { here = meet_centre(cur, next); pts.push_back(here); }
      ++k;
    }
    const Rational &a = slabs[s].a, &b = slabs[s].b;
    // Wait at the start point until this slab begins; route rows interpolate linearly.
    if (!pts.empty() && route.back()[0] < a) route.push_back({a, start.x, start.y});
    for (std::size_t j = 0; j < pts.size(); ++j) {
      Rational t = a + (b - a) * fraction(long(j + 1), long(pts.size()));
      route.push_back({t, pts[j].x, pts[j].y});
    }
  }
  if (route.back()[0] != slabs[n - 1].b) route.push_back({slabs[n - 1].b, here.x, here.y});
  return true;
}

}  // namespace

Slab classify_slab(const Sweep& sweep, const Rational& a, const Rational& b, int depth, Square& square) {
  Region region(sweep);
  square = square_around(region);
  OutsideMemo memo;
  Slab slab;
  slab.a = a;
  slab.b = b;
  SlabBuilder builder(sweep, region, square, memo, slab, std::clamp(depth, 1, 24));
  builder.start();
  std::size_t budget = SIZE_MAX;
  std::vector<char> live = builder.refine(nullptr, budget);  // first slab: every open cell is live
  slab.live = std::count(live.begin(), live.end(), 1);
  return slab;
}

std::string check_route(const Sweep& s, const std::vector<std::array<Rational, 3>>& route) {
  if (route.size() < 2) return "route has fewer than two points";
  Region region(s);
  if (!region.strictly_inside({route[0][1], route[0][2]})) return "route does not start strictly inside the fence";
  auto at = [&](const Rational& t) {
    auto hi = std::upper_bound(route.begin(), route.end(), t,
                               [](const Rational& x, const std::array<Rational, 3>& r) { return x < r[0]; });
    if (hi == route.begin()) return Point{route.front()[1], route.front()[2]};
    if (hi == route.end()) return Point{route.back()[1], route.back()[2]};
    auto lo = hi - 1;
    Rational f = (t - (*lo)[0]) / ((*hi)[0] - (*lo)[0]);
    return Point{(*lo)[1] + f * ((*hi)[1] - (*lo)[1]), (*lo)[2] + f * ((*hi)[2] - (*lo)[2])};
  };
  for (std::size_t i = 0; i < s.sensors.size(); ++i) {
    std::vector<Rational> times;
    for (const auto& r : route) times.push_back(r[0]);
    for (const auto& w : s.sensors[i].track)
      if (route.front()[0] < w.t && w.t < route.back()[0]) times.push_back(w.t);
    std::sort(times.begin(), times.end());
    times.erase(std::unique(times.begin(), times.end()), times.end());
    const Rational& r = s.sensors[i].radius;
    for (std::size_t k = 0; k + 1 < times.size(); ++k) {
      const Rational &t0 = times[k], &t1 = times[k + 1];
      // d(t) = D0 + (t - t0) * V: the difference of two linear motions on the piece.
      Point g0 = at(t0), g1 = at(t1), c0 = s.position(i, t0), c1 = s.position(i, t1);
      Rational Dx = g0.x - c0.x, Dy = g0.y - c0.y;
      Rational h = t1 - t0;
      Rational Vx = ((g1.x - c1.x) - Dx) / h, Vy = ((g1.y - c1.y) - Dy) / h;
      // f(u) = A u^2 + B u + C, u = t - t0 in [0, h].
      Rational A = Vx * Vx + Vy * Vy, B = 2 * (Dx * Vx + Dy * Vy), C = Dx * Dx + Dy * Dy - r * r;
      Rational f1 = A * h * h + B * h + C;
      bool ok = C > 0 && f1 > 0;
      if (ok && A > 0) {
        Rational u = -B / (2 * A);
        if (0 < u && u < h) ok = 4 * A * C - B * B > 0;
      }
      if (!ok)
        return "route meets the disk of " + s.sensors[i].id + " between t = " + to_text(t0) +
               " and t = " + to_text(t1);
    }
  }
  return "";
}

ChamberResult decide_by_chambers(const Sweep& sweep, const ChamberPlan& plan,
                                 const ChamberProgress& progress) {
  ChamberResult out;
  Region region(sweep);
  out.square = square_around(region);
  int depth = plan.max_depth;
  if (depth <= 0) {
    double rmin = 1e300;
    for (const auto& s : sweep.sensors) rmin = std::min(rmin, s.radius.get_d());
    depth = static_cast<int>(std::ceil(std::log2(out.square.side / (rmin / 4))));
  }
  depth = std::clamp(depth, 1, 24);
  std::vector<Rational> ends = initial_slab_ends(sweep);
  OutsideMemo memo;

  for (int round = 0; round <= plan.rounds; ++round) {
    out.rounds_used = round + 1;
    std::vector<Slab> slabs(ends.size() - 1);
    std::vector<Span> prev;
    std::size_t budget = plan.max_cells, cells = 0;
    bool emptied = false;
    std::size_t narrow_slab = 0, narrow_live = SIZE_MAX, first_empty = 0;
    for (std::size_t j = 0; j + 1 < ends.size(); ++j) {
      Slab& slab = slabs[j];
      slab.a = ends[j];
      slab.b = ends[j + 1];
      SlabBuilder builder(sweep, region, out.square, memo, slab, depth);
      builder.start();
      std::size_t left = budget > cells ? budget - cells : 0;
      std::vector<char> live = builder.refine(j == 0 ? nullptr : &prev, left);
      cells += slab.tree.size();
      prev = live_spans(slab.tree, live);
      slab.live = prev.size();
      if (slab.live > 0 && slab.live < narrow_live) { narrow_live = slab.live; narrow_slab = j; }
      if (slab.live == 0 && !first_empty) first_empty = j + 1;
      if (progress && j % 16 == 0)
        progress("round " + std::to_string(round + 1) + ": slab " + std::to_string(j + 1) + "/" +
                 std::to_string(ends.size() - 1) + ", " + std::to_string(cells) + " cells");
      if (plan.try_chambers && slab.live == 0) {
        slabs.resize(j + 1);
        emptied = true;
        break;
      }
    }
    out.cells = cells;
    if (emptied) {
      out.outcome = ChamberResult::Outcome::NoEvasion;
      out.slabs = std::move(slabs);
      return out;
    }
    if (plan.try_route) {
      std::vector<std::array<Rational, 3>> route;
      if (find_route(region, out.square, slabs, route) && check_route(sweep, route).empty()) {
        out.outcome = ChamberResult::Outcome::Evasion;
        out.route = std::move(route);
        return out;
      }
    }
    // Where did resolution run out? The slab whose live set was smallest, at a live cell of
    // the finest size. (With routes only, an empty live set means no route can exist, at this
    // resolution or any finer one: refining would not help.)
    if (first_empty) {
      const Slab& s = slabs[first_empty - 1];
      out.narrowest = "no route can exist: the live set is empty between t = " + to_text(s.a) +
                      " and t = " + to_text(s.b);
      out.no_route = true;
      break;
    } else {
      const Slab& s = slabs[narrow_slab];
      std::string where;
      double h = out.square.side / double(std::uint64_t(1) << depth);
      for (std::uint32_t i = 0; i < s.tree.size() && where.empty(); ++i) {
        const Cell& c = s.tree.at(i);
        if (c.kind == CellKind::Open && !c.free && c.depth == depth) {
          BoxD b = out.square.box(c);
          char buf[200];
          std::snprintf(buf, sizeof buf, "near (%.3f, %.3f)", (b.x0 + b.x1) / 2, (b.y0 + b.y1) / 2);
          where = buf;
        }
      }
      char buf[400];
      std::snprintf(buf, sizeof buf,
                    "between t = %.4g and t = %.4g %s: the uncovered region narrows below cells "
                    "of side %.4g (%zu live cells there)",
                    s.a.get_d(), s.b.get_d(), where.empty() ? "" : where.c_str(), h, s.live);
      out.narrowest = buf;
    }
    if (round == plan.rounds) break;
    // Refine: halve every slab, allow one level deeper.
    std::vector<Rational> finer{ends[0]};
    for (std::size_t j = 0; j + 1 < ends.size(); ++j) {
      finer.push_back((ends[j] + ends[j + 1]) / 2);
      finer.push_back(ends[j + 1]);
    }
    ends = std::move(finer);
    depth = std::min(depth + 1, 24);
  }
  out.outcome = ChamberResult::Outcome::Undecided;
  return out;
}

}  // namespace sweepcert
