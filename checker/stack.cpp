#include "stack.hpp"

#include <algorithm>

namespace sweepcheck {

int canonical_order(std::uint32_t* v, int n) {
  int sign = 1;
  for (int i = 1; i < n; ++i)  // insertion sort: each swap of neighbours flips the sign
    for (int j = i; j > 0 && v[j] < v[j - 1]; --j) {
      std::swap(v[j], v[j - 1]);
      sign = -sign;
    }
  return sign;
}

Stack::Stack(Input& in, std::vector<Rat> frames, std::size_t log_start)
    : in_(in), frames_(std::move(frames)), log_start_(log_start) {
  const std::size_t m = in_.fence.size();
  for (std::size_t i = 0; i < m; ++i) {
    std::uint32_t v[2] = {in_.fence[i], in_.fence[(i + 1) % m]};
    int sign = canonical_order(v, 2);
    std::uint32_t id = pair_id(v[0], v[1]);
    fence_pairs_.push_back(id);
    fence_signs_.push_back(sign);
    fence_index_.insert(id, static_cast<std::uint32_t>(i));
  }
  degree_.assign(in_.vertex_count(), 0);
  out_begin_.assign(in_.vertex_count(), 0);
  out_end_.assign(in_.vertex_count(), 0);
  mark_.assign(in_.vertex_count(), 0);
}

int Stack::fence_edge(std::uint32_t pair) const {
  const std::uint32_t* i = fence_index_.find(pair);
  return i ? static_cast<int>(*i) : -1;
}

const Point& Stack::position(std::uint32_t v, std::uint32_t k) {
  const Sensor& s = in_.sensors.at(v);
  if (s.points.size() == 1) return s.points[0];
  if (const std::uint32_t* i = position_index_.find(pack(v, k))) return positions_[*i];
  const Rat& t = frames_.at(k);
  // Held still before the first and after the last row; linear in between.
  std::size_t next = static_cast<std::size_t>(std::upper_bound(s.times.begin(), s.times.end(), t) - s.times.begin());
  Point p;
  if (next == 0) p = s.points.front();
  else if (next == s.times.size()) p = s.points.back();
  else {
    const Point &p0 = s.points[next - 1], &p1 = s.points[next];
    Rat lambda = (t - s.times[next - 1]) / (s.times[next] - s.times[next - 1]);
    p = Point{p0.x + lambda * (p1.x - p0.x), p0.y + lambda * (p1.y - p0.y)};
  }
  position_index_.insert(pack(v, k), static_cast<std::uint32_t>(positions_.size()));
  positions_.push_back(std::move(p));
  return positions_.back();
}

bool Stack::edge_present(std::uint32_t a, std::uint32_t b, std::uint32_t k) {
  if (!positional()) {
    std::uint32_t id = in_.pairs.find(a, b);
    return id != PairTable::kNone && in_.pair_listed(id, log_start_ + k);
  }
  std::uint64_t key = pack(pair_id(a, b), k);
  if (const char* known = edge_memo_.find(key)) return *known == 1;
  bool present = disks_meet(position(a, k), in_.sensors[a].radius, position(b, k), in_.sensors[b].radius);
  edge_memo_.insert(key, present ? 1 : 2);
  return present;
}

bool Stack::triangle_present(std::uint32_t a, std::uint32_t b, std::uint32_t c, std::uint32_t k) {
  if (!in_.listed) return edge_present(a, b, k) && edge_present(a, c, k) && edge_present(b, c, k);
  std::uint32_t ab = in_.pairs.find(a, b);
  if (ab == PairTable::kNone) return false;
  const std::uint32_t* id = in_.triple_ids.find(pack(ab, c));
  return id && in_.triple_listed(*id, log_start_ + k);
}

void Stack::graph_triangles(const std::vector<std::uint32_t>& edges,
                            const std::function<void(std::uint32_t, std::uint32_t, std::uint32_t)>& f) {
  std::vector<std::uint32_t> touched;
  for (std::uint32_t id : edges) {
    auto [a, b] = in_.pairs.ends(id);
    if (degree_[a]++ == 0) touched.push_back(a);
    if (degree_[b]++ == 0) touched.push_back(b);
  }
  // Orient every edge from its lower (degree, index) end: each vertex then has at most
  // O(sqrt(E)) out-neighbours of higher rank, and each triangle is found exactly once.
  auto lower = [&](std::uint32_t u, std::uint32_t v) {
    return degree_[u] < degree_[v] || (degree_[u] == degree_[v] && u < v);
  };
  std::vector<std::pair<std::uint32_t, std::uint32_t>> arcs;
  arcs.reserve(edges.size());
  for (std::uint32_t id : edges) {
    auto [a, b] = in_.pairs.ends(id);
    arcs.push_back(lower(a, b) ? std::make_pair(a, b) : std::make_pair(b, a));
  }
  std::sort(arcs.begin(), arcs.end());
  for (std::size_t i = 0; i < arcs.size(); ++i) {
    if (i == 0 || arcs[i].first != arcs[i - 1].first) out_begin_[arcs[i].first] = static_cast<std::uint32_t>(i);
    out_end_[arcs[i].first] = static_cast<std::uint32_t>(i + 1);
  }
  for (std::uint32_t u : touched) {
    ++stamp_;
    for (std::uint32_t i = out_begin_[u]; i < out_end_[u]; ++i) mark_[arcs[i].second] = stamp_;
    for (std::uint32_t i = out_begin_[u]; i < out_end_[u]; ++i) {
      std::uint32_t v = arcs[i].second;
      for (std::uint32_t j = out_begin_[v]; j < out_end_[v]; ++j) {
        std::uint32_t w = arcs[j].second;
        if (mark_[w] != stamp_) continue;
        std::uint32_t t[3] = {u, v, w};
        canonical_order(t, 3);
        f(t[0], t[1], t[2]);
      }
    }
  }
  for (std::uint32_t v : touched) degree_[v] = out_begin_[v] = out_end_[v] = 0;
}

std::vector<std::uint32_t> Stack::positional_edges(std::uint32_t k) {
  std::vector<std::uint32_t> edges;
  const std::uint32_t n = static_cast<std::uint32_t>(in_.vertex_count());
  for (std::uint32_t a = 0; a < n; ++a)
    for (std::uint32_t b = a + 1; b < n; ++b)
      if (edge_present(a, b, k)) edges.push_back(pair_id(a, b));
  return edges;
}

void Stack::for_each_two_cell(const std::function<bool(const TwoCell&)>& f) {
  const std::uint32_t n = static_cast<std::uint32_t>(frames_.size() - 1);
  std::vector<std::uint32_t> edges, next_edges;
  if (positional()) edges = positional_edges(0);
  for (std::uint32_t k = 0; k <= n; ++k) {
    const std::size_t frame = log_start_ + k;
    if (!positional()) edges.assign(in_.frame_pairs.begin() + static_cast<std::ptrdiff_t>(in_.pairs_begin[frame]),
                                    in_.frame_pairs.begin() + static_cast<std::ptrdiff_t>(in_.pairs_begin[frame + 1]));
    bool go = true;
    if (!positional() && in_.listed) {
      for (std::size_t i = in_.triples_begin[frame]; go && i < in_.triples_begin[frame + 1]; ++i) {
        const auto& t = in_.triples[in_.frame_triples[i]];
        TwoCell c{false, k, {t[0], t[1], t[2]}};
        go = f(c);
      }
    } else {
      // From-pairs logs: every triangle of the pair graph. Positional: the pair graph's
      // triangles are the candidates; a triple is present iff the three disks share a point.
      std::vector<TwoCell> cells;
      graph_triangles(edges, [&](std::uint32_t a, std::uint32_t b, std::uint32_t c) {
        if (positional()) {
          const Point centres[3] = {position(a, k), position(b, k), position(c, k)};
          const Rat radii[3] = {in_.sensors[a].radius, in_.sensors[b].radius, in_.sensors[c].radius};
          if (!three_disks_meet(centres, radii)) return;
        }
        cells.push_back(TwoCell{false, k, {a, b, c}});
      });
      // Triangles in canonical order, so the first failure reported does not depend on hashing.
      std::sort(cells.begin(), cells.end(), [](const TwoCell& x, const TwoCell& y) {
        return std::lexicographical_compare(x.v, x.v + 3, y.v, y.v + 3);
      });
      for (std::size_t i = 0; go && i < cells.size(); ++i) go = f(cells[i]);
    }
    if (!go) return;
    if (k == n) break;
    if (positional()) next_edges = positional_edges(k + 1);
    for (std::uint32_t id : edges) {
      auto [a, b] = in_.pairs.ends(id);
      if (!edge_present(a, b, k + 1)) continue;
      if (!f(TwoCell{true, k, {a, b, 0}})) return;
    }
    if (positional()) edges.swap(next_edges);
  }
}

std::string Stack::frame_text(std::uint32_t k) const {
  return "frame " + std::to_string(k) + " (t=" + to_text(frames_.at(k)) + ")";
}

std::string Stack::slab_text(std::uint32_t k) const {
  return "slab " + std::to_string(k) + " (t=" + to_text(frames_.at(k)) + ".." + to_text(frames_.at(k + 1)) + ")";
}

std::string Stack::cell_text(const TwoCell& c) const {
  if (c.prism) return "prism [" + name(c.v[0]) + "," + name(c.v[1]) + "] over " + slab_text(c.k);
  return "triangle [" + name(c.v[0]) + "," + name(c.v[1]) + "," + name(c.v[2]) + "] at " + frame_text(c.k);
}

}  // namespace sweepcheck
