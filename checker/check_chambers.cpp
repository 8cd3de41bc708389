// §4.5: time-ordered chambers. The checker reads the square, the sensor table and the slabs,
// then slab by slab parses the quadtree (quadtree.cpp), verifies every covered cell (rule 1)
// and every outside cell (rule 2), and carries the live set forward (rule 4). Only two slabs'
// trees are held at a time.
//
// Arithmetic: a corner of a cell is origin + side * U / 2^41 with an integer U in [0, 2^41]. For
// each (sensor, time) the disk is moved into that frame once, over a common denominator D:
// |p - c|^2 <= r^2  <=>  (D*U - Cx)^2 + (D*V - Cy)^2 <= floor(D^2 r^2 (2^41/side)^2), all
// integers. That runs in __int128 when the numbers are small, in checked 512-bit integers
// when they are not, and in cpp_rational beyond that. No floating point anywhere.
#include <algorithm>
#include <memory>
#include <unordered_set>

#include <boost/multiprecision/cpp_int.hpp>

#include "errors.hpp"
#include "fields.hpp"
#include "polygon.hpp"
#include "positional.hpp"
#include "quadtree.hpp"
#include "tally.hpp"

namespace sweepcheck {

using json::Kind;
using json::Ref;
using Wide = boost::multiprecision::checked_int512_t;

namespace {

constexpr int kLevel = Quadtree::kLevel;
static_assert(BoxTester::kLevel == Quadtree::kLevel, "one frame for trees and polygon tests");

__int128 to_i128(const Int& x) {  // |x| < 2^127
  const Int m = abs(x);
  const std::uint64_t lo = static_cast<std::uint64_t>(m & Int(~std::uint64_t(0)));
  const std::uint64_t hi = static_cast<std::uint64_t>(m >> 64);
  const __int128 v = static_cast<__int128>((static_cast<unsigned __int128>(hi) << 64) | lo);
  return x < 0 ? -v : v;
}

// The closed disk of one sensor at one time, in the integer frame of Q.
struct DiskAt {
  Rat t;
  Point c;
  int tier = 3;              // 1: __int128, 2: checked 512-bit, 3: rationals
  __int128 d1 = 0, cx1 = 0, cy1 = 0, rr1 = 0;
  Wide d2, cx2, cy2, rr2;
  Rat r2;  // tier 3 only: r^2, made once here rather than per cell
};

struct Frame {
  Point origin;
  Rat side;
  Rat unit;  // 2^41 / side
  Point corner(std::int64_t u, std::int64_t v) const {
    return Point{origin.x + side * Rat(u) / Rat(Int(1) << kLevel), origin.y + side * Rat(v) / Rat(Int(1) << kLevel)};
  }
};

// ru2 = r^2 * unit^2 of the sensor, made once per sensor by the caller.
DiskAt make_disk(const Sensor& s, const Rat& ru2, const Rat& t, const Frame& f) {
  DiskAt d;
  d.t = t;
  d.c = position(s, t);
  const Rat ux = (d.c.x - f.origin.x) * f.unit, uy = (d.c.y - f.origin.y) * f.unit;
  const Int D = boost::multiprecision::lcm(denominator(ux), denominator(uy));
  const Int cx = numerator(ux) * (D / denominator(ux)), cy = numerator(uy) * (D / denominator(uy));
  const Int R = numerator(ru2) * D * D / denominator(ru2);  // floor of ru2 * D^2 (> 0); the left side is an integer
  auto bits = [](const Int& x) -> std::size_t { return x == 0 ? 0 : msb(abs(x)) + 1; };
  if (bits(D) <= 20 && bits(cx) <= 62 && bits(cy) <= 62) {
    // |D*U - Cx| < 2^61 + 2^62 < 2^63, so the sum of two squares is below 2^127.
    d.tier = 1;
    d.d1 = to_i128(D);
    d.cx1 = to_i128(cx);
    d.cy1 = to_i128(cy);
    const Int cap = (Int(1) << 127) - 1;
    d.rr1 = to_i128(R < cap ? R : cap);
  } else if (bits(D) <= 200 && bits(cx) <= 240 && bits(cy) <= 240) {
    // |D*U - Cx| < 2^242: the sum of two squares is below 2^485.
    d.tier = 2;
    d.d2 = Wide(D);
    d.cx2 = Wide(cx);
    d.cy2 = Wide(cy);
    const Int cap = Int(1) << 486;
    d.rr2 = Wide(R < cap ? R : cap);
  } else {
    d.r2 = s.radius * s.radius;
  }
  return d;
}

bool corner_in(const DiskAt& d, std::int64_t u, std::int64_t v, const Frame& f) {
  if (d.tier == 1) {
    const __int128 dx = d.d1 * u - d.cx1, dy = d.d1 * v - d.cy1;
    return dx * dx + dy * dy <= d.rr1;
  }
  if (d.tier == 2) {
    const Wide dx = d.d2 * u - d.cx2, dy = d.d2 * v - d.cy2;
    return dx * dx + dy * dy <= d.rr2;
  }
  return dist2(f.corner(u, v), d.c) <= d.r2;
}

std::string cell_text(const Quadtree::Node& n, const Frame& f) {
  const Point lo = f.corner(n.x, n.y), hi = f.corner(n.x + n.side(), n.y + n.side());
  return "[" + to_text(lo.x) + ", " + to_text(hi.x) + "]x[" + to_text(lo.y) + ", " + to_text(hi.y) + "]";
}

struct Slab {
  Rat a, b;
  Ref tree;
};

struct BoxKey {
  std::uint64_t a, b;
  bool operator==(const BoxKey& o) const { return a == o.a && b == o.b; }
};
struct BoxKeyHash {
  std::size_t operator()(const BoxKey& k) const {
    std::uint64_t h = k.a * 0x9E3779B97F4A7C15ull ^ (k.b + 0x632BE59BD9B4E019ull + (k.a << 6) + (k.a >> 2));
    h ^= h >> 31;
    h *= 0xBF58476D1CE4E5B9ull;
    return static_cast<std::size_t>(h ^ (h >> 29));
  }
};

class ChamberCheck {
 public:
  ChamberCheck(const Input& in, const Frame& frame, const FencePolygon& polygon, std::vector<std::uint32_t> table,
               Tally& tally)
      : tally_(tally), in_(in), f_(frame), polygon_(polygon), boxes_(polygon, frame.origin, frame.side), table_(std::move(table)),
        disks_(table_.size()), made_(table_.size(), false), end_(table_.size()), end_slab_(table_.size(), -1) {
    for (std::uint32_t v : table_) {
      const Rat ru = in_.sensors[v].radius * f_.unit;
      ru2_.push_back(ru * ru);
    }
  }

  // Rules 1 and 2 for every cell of slab j, in token order.
  void check_cells(const Quadtree& tree, const Slab& slab, std::size_t j) {
    // Forget the previous slab's disks (only the entries it used: the table may be long).
    for (std::size_t k : used_) {
      disks_[k].clear();
      made_[k] = false;
    }
    used_.clear();
    const auto& nodes = tree.nodes();
    for (std::size_t i = 0; i < nodes.size(); ++i) {
      const Quadtree::Node& n = nodes[i];
      if (n.token >= 0) {
        check_covered(n, i, slab, j);
        ++tally_.covered;
      } else if (n.token == Quadtree::kOutside) {
        check_outside(n, i, slab, j);
        ++tally_.outside;
      } else if (n.token == Quadtree::kOpen) {
        ++tally_.open;
      }
    }
  }

 private:
  std::string where(std::size_t j, std::size_t i) const {
    return "/slabs/" + std::to_string(j) + "/tree/" + std::to_string(i);
  }
  std::string item(const Quadtree::Node& n, const Slab& slab) const {
    return "cell " + cell_text(n, f_) + " in slab t=[" + to_text(slab.a) + ", " + to_text(slab.b) + "]";
  }

  // The distinct disks of table entry k over the slab: at a, at every waypoint strictly inside,
  // at b (a repeat of the previous centre is dropped: it is the same disk).
  const std::vector<DiskAt>& disks(std::size_t k, const Slab& slab, std::size_t j) {
    if (made_[k]) return disks_[k];
    made_[k] = true;
    used_.push_back(k);
    const Sensor& s = in_.sensors[table_[k]];
    std::vector<DiskAt>& out = disks_[k];
    auto add = [&](DiskAt d, bool at_b) {
      const bool repeat = !out.empty() && out.back().c.x == d.c.x && out.back().c.y == d.c.y;
      if (at_b) {
        // The disk at b is the next slab's disk at a (slabs are consecutive): keep it, so each
        // slab end costs one make_disk (exact rational work) rather than two.
        if (!repeat) out.push_back(d);
        end_[k] = std::move(d);
        end_slab_[k] = static_cast<std::int64_t>(j);
      } else if (!repeat) {
        out.push_back(std::move(d));
      }
    };
    if (j > 0 && end_slab_[k] == static_cast<std::int64_t>(j) - 1)
      add(std::move(end_[k]), false);  // made at the previous slab's b == slab.a
    else
      add(make_disk(s, ru2_[k], slab.a, f_), false);
    for (auto it = std::upper_bound(s.times.begin(), s.times.end(), slab.a); it != s.times.end() && *it < slab.b; ++it)
      add(make_disk(s, ru2_[k], *it, f_), false);
    add(make_disk(s, ru2_[k], slab.b, f_), true);
    return out;
  }

  void check_covered(const Quadtree::Node& n, std::size_t i, const Slab& slab, std::size_t j) {
    const std::size_t k = static_cast<std::size_t>(n.token);
    const std::uint32_t v = table_[k];
    const std::int64_t s = n.side();
    const std::int64_t us[4] = {n.x, n.x + s, n.x, n.x + s}, vs[4] = {n.y, n.y, n.y + s, n.y + s};
    for (const DiskAt& d : disks(k, slab, j))
      for (int c = 0; c < 4; ++c)
        if (!corner_in(d, us[c], vs[c], f_))
          throw Rejected(where(j, i), item(n, slab),
                         "corner " + point_text(f_.corner(us[c], vs[c])) + " is outside the disk of " + sensor_text(in_, v) +
                             " at t=" + to_text(d.t) + " (rule 4.5.1)");
        else
          ++tally_.corner_tests;
  }

  void check_outside(const Quadtree::Node& n, std::size_t i, const Slab& slab, std::size_t j) {
    const BoxKey key{static_cast<std::uint64_t>(n.x) | (static_cast<std::uint64_t>(n.depth) << 42),
                     static_cast<std::uint64_t>(n.y)};
    if (outside_ok_.count(key)) return;
    ++tally_.outside_boxes;
    const std::int64_t hit = boxes_.meets_interior(n.x, n.y, n.side());
    if (hit < 0) {
      outside_ok_.insert(key);
      return;
    }
    const std::size_t m = polygon_.size();
    if (static_cast<std::size_t>(hit) < m) {
      const std::size_t e = static_cast<std::size_t>(hit);
      throw Rejected(where(j, i), item(n, slab),
                     "an outside cell must have no point in the interior of P, but the fence edge " +
                         sensor_text(in_, polygon_.ids[e]) + " - " + sensor_text(in_, polygon_.ids[(e + 1) % m]) +
                         " meets the open box (rule 4.5.2)");
    }
    const std::int64_t h = n.side() / 2;
    throw Rejected(where(j, i), item(n, slab),
                   "an outside cell must have no point in the interior of P, but its centre " +
                       point_text(f_.corner(n.x + h, n.y + h)) + " lies inside the fence polygon (rule 4.5.2)");
  }

  Tally& tally_;
  const Input& in_;
  const Frame& f_;
  const FencePolygon& polygon_;
  BoxTester boxes_;
  std::vector<std::uint32_t> table_;
  std::vector<std::vector<DiskAt>> disks_;
  std::vector<bool> made_;
  std::vector<Rat> ru2_;             // per table entry: r^2 * unit^2
  std::vector<DiskAt> end_;          // per table entry: its disk at the end of slab end_slab_
  std::vector<std::int64_t> end_slab_;
  std::vector<std::size_t> used_;
  std::unordered_set<BoxKey, BoxKeyHash> outside_ok_;
};

// The live set of a slab (node indices of its open cells, in token order), from the live
// set of the previous slab (or all open cells for the first slab), closed under touching.
//
// Speed (the benchmark's live sets carry ~3 million cells): pending[i] counts the open cells
// below node i not yet live, so a descent skips every subtree already wholly live; and a live
// cell's neighbours are searched from its touch_root, not from the root. Neither changes the
// set found: only cells already in it are skipped.
std::vector<std::uint32_t> live_set(const Quadtree& cur, const Quadtree* prev, const std::vector<std::uint32_t>& prev_live,
                                    std::vector<std::uint32_t>& stack) {
  const auto& nodes = cur.nodes();
  std::vector<std::uint32_t> live;
  if (!prev) {
    for (std::size_t i = 0; i < nodes.size(); ++i)
      if (nodes[i].token == Quadtree::kOpen) live.push_back(static_cast<std::uint32_t>(i));
    return live;  // all open cells: already closed under touching
  }
  std::vector<std::uint32_t> pending(nodes.size());
  for (std::uint32_t i = 0; i < nodes.size(); ++i) pending[i] = cur.open_below(i);
  auto add = [&](std::uint32_t i) {  // i is open and pending (the descent skips live cells)
    live.push_back(i);
    for (std::uint32_t a = i;; a = cur.parent(a)) {
      --pending[a];
      if (a == 0) break;
    }
  };
  for (std::uint32_t p : prev_live) {
    if (pending[0] == 0) break;  // every open cell is live already
    const Quadtree::Node& n = prev->nodes()[p];
    cur.for_each_open_touching(0, n.x, n.y, n.x + n.side(), n.y + n.side(), pending, stack, add);
  }
  for (std::size_t q = 0; q < live.size() && pending[0] > 0; ++q) {
    const Quadtree::Node& n = nodes[live[q]];
    cur.for_each_open_touching(cur.touch_root(live[q]), n.x, n.y, n.x + n.side(), n.y + n.side(), pending, stack, add);
  }
  // In token order (Z-order in space), the next slab's seed queries read this tree sequentially
  // and visit nearby parts of its own tree one after another: fewer cache misses.
  std::sort(live.begin(), live.end());
  return live;
}

}  // namespace

std::string check_chambers(const Certificate& cert, const Input& in, std::ostream& out, Tally& tally) {
  try {
    const Members& m = cert.members;
    // The square Q, which must hold every fence centre.
    Members sq(m.need("square"), "/square", {"origin", "side"});
    Ref origin = sq.need("origin");
    expect_array(origin, "/square/origin", 2, 2);
    Frame f;
    f.origin = Point{get_rational(origin[0], "/square/origin/0"), get_rational(origin[1], "/square/origin/1")};
    f.side = get_rational(sq.need("side"), "/square/side");
    if (f.side <= 0) throw Rejected("/square/side", "", "the side must be > 0, is " + to_text(f.side) + " (§4.5)");
    f.unit = Rat(Int(1) << kLevel) / f.side;
    const Point far{f.origin.x + f.side, f.origin.y + f.side};
    const std::string q_text = "Q = [" + to_text(f.origin.x) + ", " + to_text(far.x) + "]x[" + to_text(f.origin.y) +
                               ", " + to_text(far.y) + "]";
    const FencePolygon polygon(in);
    for (std::size_t i = 0; i < polygon.size(); ++i) {
      const Point& c = polygon.vertices[i];
      if (c.x < f.origin.x || c.x > far.x || c.y < f.origin.y || c.y > far.y)
        throw Rejected("/square", "fence " + sensor_text(in, polygon.ids[i]) + " at " + point_text(c),
                       "the fence centre lies outside the square " + q_text + " (§4.5)");
      ++tally.fence_in_square;
    }

    // The sensor table.
    Ref table = m.need("sensors");
    expect_array(table, "/sensors", 0);
    std::vector<std::uint32_t> table_v;
    std::vector<std::int64_t> first(in.vertex_count(), -1);
    for (std::size_t k = 0; k < table.size(); ++k) {
      const std::string p = at("/sensors", k);
      std::string_view id = get_id(table[k], p);
      const std::int64_t v = in.find(id);
      if (v < 0) throw Rejected(p, "sensor \"" + std::string(id) + "\"", "unknown sensor id (not in INPUT, §4.5)");
      if (first[v] >= 0)
        throw Rejected(p, "sensor \"" + std::string(id) + "\"",
                       "listed twice in the sensor table (also at /sensors/" + std::to_string(first[v]) + ", §4.5)");
      first[v] = static_cast<std::int64_t>(k);
      table_v.push_back(static_cast<std::uint32_t>(v));
      ++tally.table;
    }
    if (table_v.size() > 0x7FFFFFF0u) throw Rejected("/sensors", "", "too many entries");

    // The slabs' times: consecutive, within the horizon.
    Ref slabs_ref = m.need("slabs");
    expect_array(slabs_ref, "/slabs", 1);
    std::vector<Slab> slabs;
    for (std::size_t j = 0; j < slabs_ref.size(); ++j) {
      const std::string p = at("/slabs", j);
      Members s(slabs_ref[j], p, {"t", "tree"});
      Ref t = s.need("t");
      Ref tree = s.need("tree");
      expect_array(t, p + "/t", 2, 2);
      Slab slab{get_rational(t[0], p + "/t/0"), get_rational(t[1], p + "/t/1"), tree};
      if (!(slab.a < slab.b))
        throw Rejected(p + "/t/1", "slab t=[" + to_text(slab.a) + ", " + to_text(slab.b) + "]",
                       "a slab must end after it starts (§4.5)");
      if (j == 0 && slab.a < in.horizon_start)
        throw Rejected(p + "/t/0", "t=" + to_text(slab.a),
                       "the first slab starts before the horizon start " + to_text(in.horizon_start) + " (§4.5)");
      if (j > 0 && slab.a != slabs.back().b)
        throw Rejected(p + "/t/0", "t=" + to_text(slab.a),
                       "a slab must start where the previous one ends, at t=" + to_text(slabs.back().b) + " (§4.5)");
      slabs.push_back(std::move(slab));
      ++tally.slabs;
    }
    if (slabs.back().b > in.horizon_end)
      throw Rejected(at("/slabs", slabs.size() - 1) + "/t/1", "t=" + to_text(slabs.back().b),
                     "the last slab ends after the horizon end " + to_text(in.horizon_end) + " (§4.5)");
    tally.slab_times = true;
    out << "chambers: square " << q_text << " holds the fence; " << table_v.size() << " sensors in the table; "
        << slabs.size() << " slabs, t=" << to_text(slabs.front().a) << ".." << to_text(slabs.back().b) << "\n";

    // Slab by slab: the tree, rules 1 and 2, the live set.
    ChamberCheck check(in, f, polygon, table_v, tally);
    std::unique_ptr<Quadtree> prev;
    std::vector<std::uint32_t> live, stack;
    std::size_t empty_from = slabs.size(), peak = 0;
    for (std::size_t j = 0; j < slabs.size(); ++j) {
      auto cur = std::make_unique<Quadtree>(slabs[j].tree, at("/slabs", j) + "/tree", table_v.size());
      check.check_cells(*cur, slabs[j], j);
      live = live_set(*cur, prev.get(), live, stack);
      peak = std::max(peak, live.size());
      tally.cells += cur->nodes().size() - (cur->nodes().size() - 1) / 4;  // leaves of a full 4-ary tree
      tally.live_cells += live.size();
      tally.live_peak = peak;
      ++tally.slabs_done;
      if (live.empty() && empty_from == slabs.size()) empty_from = j;
      prev = std::move(cur);
    }
    out << "chambers: " << tally.cells << " cells (" << tally.covered << " covered, " << tally.outside << " outside, "
        << tally.open << " open); covered cells stay covered through their slabs (rule 4.5.1); outside cells miss "
        << "the interior of P (rule 4.5.2, " << tally.outside_boxes << " distinct boxes tested)\n";
    if (!live.empty()) {
      const std::size_t j = slabs.size() - 1;
      const std::uint32_t first_live = *std::min_element(live.begin(), live.end());
      throw Rejected(at("/slabs", j), "slab t=[" + to_text(slabs[j].a) + ", " + to_text(slabs[j].b) + "]",
                     "the live set is not empty (" + std::to_string(live.size()) + " open cells remain live, e.g. " +
                         at("/slabs", j) + "/tree/" + std::to_string(first_live) + " " +
                         cell_text(prev->nodes()[first_live], f) + ") (rule 4.5.4)");
    }
    tally.live_empty = true;
    tally.empty_from = empty_from;
    const Slab& e = slabs[empty_from];
    out << "chambers: the live set is empty from slab " << empty_from << " (t=[" << to_text(e.a) << ", "
        << to_text(e.b) << "]) on; at most " << peak << " live cells in a slab (rule 4.5.4)\n";
    return "no evasion path on [" + to_text(slabs.front().a) + ", " + to_text(slabs.back().b) +
           "]: the live set of time-ordered chambers dies out by slab " + std::to_string(empty_from) + " of " +
           std::to_string(slabs.size()) + " (§4.5)";
  } catch (const FieldError& e) {
    throw Rejected(e.pointer, "", e.message);
  }
}

}  // namespace sweepcheck
