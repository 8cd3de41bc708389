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
  begin_.assign(in_.vertex_count(), 0);
  end_.assign(in_.vertex_count(), 0);
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

std::size_t Stack::triple_slot(std::uint32_t a, std::uint32_t b, std::uint32_t c, std::uint32_t k) const {
  std::uint32_t ab = in_.pairs.find(a, b);
  if (ab == PairTable::kNone) return Input::kAbsent;
  const std::uint32_t* id = in_.triple_ids.find(pack(ab, c));
  return id ? in_.triple_slot(*id, log_start_ + k) : Input::kAbsent;
}

bool Stack::triangle_present(std::uint32_t a, std::uint32_t b, std::uint32_t c, std::uint32_t k) {
  if (!in_.listed) return edge_present(a, b, k) && edge_present(a, c, k) && edge_present(b, c, k);
  return triple_slot(a, b, c, k) != Input::kAbsent;
}

void Stack::build_adjacency(std::uint32_t k) {
  // A counting sort of frame k's pairs by end, over the vertices they touch only.
  for (std::uint32_t v : touched_) begin_[v] = end_[v] = 0;
  touched_.clear();
  const std::size_t f = log_start_ + k;
  const std::uint32_t* first = in_.frame_pairs.data() + in_.pairs_begin[f];
  const std::uint32_t* last = in_.frame_pairs.data() + in_.pairs_begin[f + 1];
  for (const std::uint32_t* p = first; p != last; ++p) {
    auto [a, b] = in_.pairs.ends(*p);
    if (end_[a]++ == 0) touched_.push_back(a);  // end_ counts the degree for now
    if (end_[b]++ == 0) touched_.push_back(b);
  }
  std::uint32_t next = 0;
  for (std::uint32_t v : touched_) {
    const std::uint32_t degree = end_[v];
    begin_[v] = end_[v] = next;
    next += degree;
  }
  adjacency_.resize(next);
  for (const std::uint32_t* p = first; p != last; ++p) {
    auto [a, b] = in_.pairs.ends(*p);
    adjacency_[end_[a]++] = b;
    adjacency_[end_[b]++] = a;
  }
  adjacency_frame_ = k;
}

void Stack::neighbours(std::uint32_t v, std::uint32_t k, std::vector<std::uint32_t>& out) {
  out.clear();
  if (positional()) {
    for (std::uint32_t u = 0; u < in_.vertex_count(); ++u)
      if (u != v && edge_present(std::min(u, v), std::max(u, v), k)) out.push_back(u);
    return;
  }
  if (k != adjacency_frame_) build_adjacency(k);
  out.assign(adjacency_.begin() + begin_[v], adjacency_.begin() + end_[v]);
}

void Stack::add_prism(std::uint32_t a, std::uint32_t b, std::uint32_t j, std::vector<TwoCell>& out) {
  if (j + 1 >= frames_.size() || !edge_present(a, b, j) || !edge_present(a, b, j + 1)) return;
  TwoCell cell{true, j, {a, b, 0}, {a, b, 0}};
  if (!positional()) cell.pos = {in_.pair_slot(in_.pairs.find(a, b), log_start_ + j), 0, 0};
  out.push_back(cell);
}

void Stack::cells_on_edge(std::uint32_t a, std::uint32_t b, std::uint32_t k, std::vector<TwoCell>& out) {
  out.clear();
  neighbours(a, k, around_a_);
  neighbours(b, k, around_b_);
  ++stamp_;
  for (std::uint32_t u : around_a_) mark_[u] = stamp_;
  for (std::uint32_t c : around_b_) {
    if (mark_[c] != stamp_) continue;
    std::uint32_t t[3] = {a, b, c};
    canonical_order(t, 3);
    TwoCell cell{false, k, {t[0], t[1], t[2]}, {t[0], t[1], t[2]}};
    if (positional()) {
      // Pairwise contact is necessary; the triple needs a common point of the three disks.
      const Point centres[3] = {position(t[0], k), position(t[1], k), position(t[2], k)};
      const Rat radii[3] = {in_.sensors[t[0]].radius, in_.sensors[t[1]].radius, in_.sensors[t[2]].radius};
      if (!three_disks_meet(centres, radii)) continue;
    } else if (in_.listed) {
      const std::size_t slot = triple_slot(t[0], t[1], t[2], k);
      if (slot == Input::kAbsent) continue;
      cell.pos = {slot, 0, 0};
    }
    out.push_back(cell);
  }
  if (k > 0) add_prism(a, b, k - 1, out);
  add_prism(a, b, k, out);
}

void Stack::cells_on_vertical(std::uint32_t v, std::uint32_t k, std::vector<TwoCell>& out) {
  out.clear();
  neighbours(v, k, around_a_);
  for (std::uint32_t u : around_a_) add_prism(std::min(u, v), std::max(u, v), k, out);
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
