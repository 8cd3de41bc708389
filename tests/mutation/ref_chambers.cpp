// Reference for time-ordered chambers (§4.5). Cells are kept as integer boxes on the finest
// grid any slab uses (side S/2^D, D ≤ 40, so coordinates fit in 64 bits); touching is then an
// integer interval test, and the live sets are recomputed by flooding through spatial buckets.
//
// Covered cells: a box is inside a disk iff its four corners are (the disk is convex), and the
// farthest corner from a centre is found per axis: max(dx0², dx1²) + max(dy0², dy1²). A
// corner p is covered throughout [a, b] iff it is covered at a, at b and at every waypoint of
// the sensor strictly between: between consecutive such times the centre moves linearly, so
// |p − c(t)|² is a convex quadratic in t and its maximum on a closed interval is at an end.
#include <algorithm>
#include <cstdint>
#include <map>
#include <optional>
#include <string>
#include <unordered_set>

#include "ref_internal.hpp"

namespace mutref {

namespace {

struct Cell {
  int depth;
  std::int64_t x, y;  // in units of the cell's own side at its depth
  long token;
};

struct Box {
  std::int64_t x0, y0, x1, y1;  // on the finest grid, closed
};

bool touch(const Box& a, const Box& b) { return a.x0 <= b.x1 && b.x0 <= a.x1 && a.y0 <= b.y1 && b.y0 <= a.y1; }

// Boxes filed in buckets of side 2^(finest-6) on the finest grid; a closed box joins every
// bucket it meets, so two touching boxes always share a bucket.
class Buckets {
 public:
  Buckets(const std::vector<Box>& boxes, int finest) : boxes_(boxes), shift_(std::max(0, finest - 6)) {
    for (std::size_t i = 0; i < boxes.size(); ++i)
      for (std::int64_t bx = boxes[i].x0 >> shift_; bx <= boxes[i].x1 >> shift_; ++bx)
        for (std::int64_t by = boxes[i].y0 >> shift_; by <= boxes[i].y1 >> shift_; ++by) map_[{bx, by}].push_back(i);
  }
  template <class F>
  void each_touching(const Box& b, F f) const {
    for (std::int64_t bx = b.x0 >> shift_; bx <= b.x1 >> shift_; ++bx)
      for (std::int64_t by = b.y0 >> shift_; by <= b.y1 >> shift_; ++by) {
        auto it = map_.find({bx, by});
        if (it == map_.end()) continue;
        for (std::size_t k : it->second)
          if (touch(b, boxes_[k])) f(k);
      }
  }

 private:
  const std::vector<Box>& boxes_;
  int shift_;
  std::map<std::pair<std::int64_t, std::int64_t>, std::vector<std::size_t>> map_;
};

void parse_tree(const json& tree, std::size_t& at, int depth, std::int64_t x, std::int64_t y, std::size_t table,
                std::vector<Cell>& out, const std::string& w) {
  if (depth > 40) refuse(w + ": deeper than 40");
  if (at >= tree.size()) refuse(w + ": the tree ends early");
  const json& tok = tree[at];
  if (!tok.is_number_integer()) refuse(w + "/" + std::to_string(at) + ": not an integer token");
  long v = tok.is_number_unsigned() ? static_cast<long>(std::min<json::number_unsigned_t>(tok.get<json::number_unsigned_t>(), 1L << 40))
                                    : static_cast<long>(tok.get<json::number_integer_t>());
  ++at;
  if (v == -1) {
    for (int q = 0; q < 4; ++q)
      parse_tree(tree, at, depth + 1, 2 * x + (q & 1), 2 * y + (q >> 1), table, out, w);
    return;
  }
  if (v < -3 || (v >= 0 && static_cast<std::size_t>(v) >= table))
    refuse(w + "/" + std::to_string(at - 1) + ": bad token " + std::to_string(v));
  out.push_back({depth, x, y, v});
}

// Does the closed segment a–b meet the open box (x0, x1) × (y0, y1)?
bool segment_meets_open_box(const Point& a, const Point& b, const Q& x0, const Q& y0, const Q& x1, const Q& y1) {
  // The segment's bounding box must overlap the open box (a cheap exact filter).
  if ((a.x <= x0 && b.x <= x0) || (a.x >= x1 && b.x >= x1) || (a.y <= y0 && b.y <= y0) || (a.y >= y1 && b.y >= y1))
    return false;
  // Parameter u ∈ [0, 1]; each axis not parallel to the segment gives an open interval of u.
  std::optional<Q> lo, hi;
  auto clip = [&](const Q& p, const Q& d, const Q& m0, const Q& m1) {
    if (d == 0) return m0 < p && p < m1;
    Q u0 = (m0 - p) / d, u1 = (m1 - p) / d;
    if (u0 > u1) std::swap(u0, u1);
    if (!lo || u0 > *lo) lo = u0;
    if (!hi || u1 < *hi) hi = u1;
    return true;
  };
  if (!clip(a.x, b.x - a.x, x0, x1) || !clip(a.y, b.y - a.y, y0, y1)) return false;
  if (!lo) return true;  // a single point strictly inside the box
  return *lo < *hi && *lo < 1 && *hi > 0;
}

}  // namespace

void verify_chambers(const Input& in, const json& cert) {
  if (!in.positional) refuse("chambers need a positional input");
  const json& sq = cert.at("square");
  keys_exactly(sq, {"origin", "side"}, {}, "/square");
  if (!sq["origin"].is_array() || sq["origin"].size() != 2) refuse("/square/origin: two numbers expected");
  const Q ox = rational(sq["origin"][0], "/square/origin/0"), oy = rational(sq["origin"][1], "/square/origin/1");
  const Q side = rational(sq["side"], "/square/side");
  if (side <= 0) refuse("/square/side: must be positive");
  for (int f : in.fence) {
    Point c = in.centre(f, Q(0));
    if (c.x < ox || c.x > ox + side || c.y < oy || c.y > oy + side) refuse("/square: fence centre outside Q");
  }

  const json& table = cert.at("sensors");
  if (!table.is_array()) refuse("/sensors: not an array");
  std::vector<int> sensor;
  for (std::size_t i = 0; i < table.size(); ++i) {
    std::string id = id_text(table[i], "/sensors/" + std::to_string(i));
    auto it = in.index.find(id);
    if (it == in.index.end()) refuse("/sensors/" + std::to_string(i) + ": unknown sensor");
    if (std::find(sensor.begin(), sensor.end(), it->second) != sensor.end()) refuse("/sensors: id twice");
    sensor.push_back(it->second);
  }

  const json& slabs = cert.at("slabs");
  if (!slabs.is_array() || slabs.empty()) refuse("/slabs: must be a non-empty array");
  std::vector<std::vector<Cell>> cells(slabs.size());
  std::vector<std::pair<Q, Q>> span;
  int finest = 0;
  for (std::size_t j = 0; j < slabs.size(); ++j) {
    std::string w = "/slabs/" + std::to_string(j);
    keys_exactly(slabs[j], {"t", "tree"}, {}, w);
    const json& t = slabs[j]["t"];
    if (!t.is_array() || t.size() != 2) refuse(w + "/t: two times expected");
    Q a = rational(t[0], w + "/t/0"), b = rational(t[1], w + "/t/1");
    if (!(a < b)) refuse(w + "/t: a < b required");
    if (j == 0 && a < in.h0) refuse(w + "/t/0: before the horizon");
    if (j > 0 && a != span.back().second) refuse(w + "/t/0: slabs must be contiguous");
    if (j + 1 == slabs.size() && b > in.h1) refuse(w + "/t/1: after the horizon");
    span.push_back({a, b});
    const json& tree = slabs[j]["tree"];
    if (!tree.is_array()) refuse(w + "/tree: not an array");
    std::size_t at = 0;
    parse_tree(tree, at, 0, 0, 0, sensor.size(), cells[j], w + "/tree");
    if (at != tree.size()) refuse(w + "/tree: tokens after the complete tree");
    for (const Cell& c : cells[j]) finest = std::max(finest, c.depth);
  }

  // Rules 1 and 2, exactly. Centres are computed once per slab and sensor.
  for (std::size_t j = 0; j < slabs.size(); ++j) {
    const auto& [a, b] = span[j];
    std::map<int, std::vector<Point>> centres;
    for (const Cell& c : cells[j]) {
      if (c.token < 0 || centres.count(sensor[c.token])) continue;
      int s = sensor[c.token];
      std::vector<Point>& at = centres[s];
      at.push_back(in.centre(s, a));
      at.push_back(in.centre(s, b));
      for (const Q& w : in.waypoint_times(s))
        if (a < w && w < b) at.push_back(in.centre(s, w));
    }
    // Verdicts already proved for the same input, square, slab times, box and sensor are
    // remembered (only successes; a failure refuses at once). Mutants repeat most cells.
    static std::unordered_set<std::string> proved;
    const std::string slab_key = in.sha256 + "|" + ox.get_str() + "," + oy.get_str() + "," + side.get_str() + "|" +
                                 a.get_str() + "," + b.get_str() + "|";
    for (const Cell& c : cells[j]) {
      if (c.token == -2) continue;
      std::string key = slab_key + std::to_string(c.depth) + "," + std::to_string(c.x) + "," + std::to_string(c.y) + "," +
                        (c.token >= 0 ? in.ids[sensor[c.token]] : std::string("outside"));
      if (proved.count(key)) continue;
      Q h = side / Q(Z(1) << c.depth);
      Q x0 = ox + h * Q(Z(static_cast<long>(c.x))), y0 = oy + h * Q(Z(static_cast<long>(c.y)));
      Q x1 = x0 + h, y1 = y0 + h;
      if (c.token >= 0) {
        int s = sensor[c.token];
        Q r2 = in.radius[s] * in.radius[s];
        for (const Point& ctr : centres[s]) {
          Q dx0 = x0 - ctr.x, dx1 = x1 - ctr.x, dy0 = y0 - ctr.y, dy1 = y1 - ctr.y;
          // The farthest corner decides: max of the squared offsets on each axis.
          Q fx = std::max(Q(dx0 * dx0), Q(dx1 * dx1)), fy = std::max(Q(dy0 * dy0), Q(dy1 * dy1));
          if (fx + fy > r2) refuse("/slabs/" + std::to_string(j) + ": a corner of a cell escapes " + in.ids[s]);
        }
      } else {
        std::size_t m = in.fence.size();
        for (std::size_t i = 0; i < m; ++i)
          if (segment_meets_open_box(in.polygon[i], in.polygon[(i + 1) % m], x0, y0, x1, y1))
            refuse("/slabs/" + std::to_string(j) + ": an outside cell meets a fence edge");
        Point centre{(x0 + x1) / 2, (y0 + y1) / 2};
        if (locate(in, centre) != Where::outside) refuse("/slabs/" + std::to_string(j) + ": an outside cell is inside P");
      }
      proved.insert(std::move(key));
    }
  }

  // Live sets (rule 4), on integer boxes of the finest grid.
  std::vector<Box> prev;
  for (std::size_t j = 0; j < slabs.size(); ++j) {
    std::vector<Box> open;
    for (const Cell& c : cells[j]) {
      if (c.token != -2) continue;
      int shift = finest - c.depth;
      std::int64_t s = std::int64_t(1) << shift;
      open.push_back({c.x * s, c.y * s, (c.x + 1) * s, (c.y + 1) * s});
    }
    Buckets here(open, finest), before(prev, finest);
    std::vector<char> live(open.size(), 0);
    std::vector<std::size_t> queue;
    for (std::size_t i = 0; i < open.size(); ++i) {
      bool seed = j == 0;
      before.each_touching(open[i], [&](std::size_t) { seed = true; });
      if (seed) live[i] = 1, queue.push_back(i);
    }
    while (!queue.empty()) {
      std::size_t i = queue.back();
      queue.pop_back();
      here.each_touching(open[i], [&](std::size_t k) {
        if (!live[k]) live[k] = 1, queue.push_back(k);
      });
    }
    prev.clear();
    for (std::size_t i = 0; i < open.size(); ++i)
      if (live[i]) prev.push_back(open[i]);
  }
  if (!prev.empty()) refuse("the live set of the last slab is not empty (" + std::to_string(prev.size()) + " cells)");
}

}  // namespace mutref
