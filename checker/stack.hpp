// The stack complex on a certificate's frames (schema/README.md §3): which cells exist, their
// canonical orientation, the fence cylinder, and the enumeration of all 2-cells used by the
// cocycle check.
#pragma once
#include <cstdint>
#include <deque>
#include <functional>
#include <string>
#include <vector>

#include "input.hpp"

namespace sweepcheck {

// Sorts n (2 or 3) vertex indices into canonical order (= byte-wise order of ids, §3.2) and
// returns the sign of the permutation applied: the row's oriented cell = sign * canonical cell.
int canonical_order(std::uint32_t* v, int n);

// A 2-cell in canonical orientation: a triangle [v0, v1, v2] at frame k, or the prism of the
// edge [v0, v1] over slab k.
struct TwoCell {
  bool prism = false;
  std::uint32_t k = 0;
  std::uint32_t v[3] = {0, 0, 0};
};

class Stack {
 public:
  // `frames` have been checked against the input (§4.2); for a log, certificate frame k is log
  // frame log_start + k.
  Stack(Input& in, std::vector<Rat> frames, std::size_t log_start);

  const Input& input() const { return in_; }
  std::size_t frame_count() const { return frames_.size(); }  // n + 1
  const Rat& time(std::size_t k) const { return frames_.at(k); }
  bool positional() const { return in_.kind == InputKind::Scenario; }

  // Presence tests (§3.1); vertex indices in canonical order, k < frame_count().
  bool edge_present(std::uint32_t a, std::uint32_t b, std::uint32_t k);
  bool triangle_present(std::uint32_t a, std::uint32_t b, std::uint32_t c, std::uint32_t k);  // contact log
  // Centre of sensor v at frame k (positional): exact interpolation of its track (§2.1).
  const Point& position(std::uint32_t v, std::uint32_t k);

  // Compact id of the pair a < b (new ids are made as needed).
  std::uint32_t pair_id(std::uint32_t a, std::uint32_t b) { return in_.pairs.intern(a, b); }
  std::pair<std::uint32_t, std::uint32_t> pair_ends(std::uint32_t id) const { return in_.pairs.ends(id); }

  // Fence cylinder (§3.3). fence_edge(pair id) is the fence edge index i, or -1; the fence edge
  // E(F_i, F_{i+1}) equals fence_sign(i) times the canonical edge.
  int fence_edge(std::uint32_t pair) const;
  int fence_sign(std::size_t i) const { return fence_signs_.at(i); }
  std::uint32_t fence_pair(std::size_t i) const { return fence_pairs_.at(i); }
  std::size_t fence_size() const { return in_.fence.size(); }

  // Calls f on every 2-cell of the stack: at each frame k the triangles present at k, then the
  // prisms over slab k. Stops early when f returns false.
  void for_each_two_cell(const std::function<bool(const TwoCell&)>& f);

  // For messages.
  std::string name(std::uint32_t v) const { return in_.names.at(v); }
  std::string frame_text(std::uint32_t k) const;  // "frame 2 (t=3/2)"
  std::string slab_text(std::uint32_t k) const;   // "slab 2 (t=3/2..2)"
  std::string cell_text(const TwoCell& c) const;

 private:
  // Calls f(a, b, c) for every triangle of the graph with these edges (pair ids), each once,
  // in canonical order. Degree ordering bounds the work by O(E^1.5).
  void graph_triangles(const std::vector<std::uint32_t>& edges,
                       const std::function<void(std::uint32_t, std::uint32_t, std::uint32_t)>& f);
  std::vector<std::uint32_t> positional_edges(std::uint32_t k);

  Input& in_;
  std::vector<Rat> frames_;
  std::size_t log_start_;
  std::vector<std::uint32_t> fence_pairs_;
  std::vector<int> fence_signs_;
  FlatMap<std::uint32_t> fence_index_;  // pair id -> fence edge index
  FlatMap<char> edge_memo_;             // positional: pack(pair, k) -> 1 present, 2 absent
  FlatMap<std::uint32_t> position_index_;
  std::deque<Point> positions_;
  // Work space of graph_triangles, indexed by vertex.
  std::vector<std::uint32_t> degree_, out_begin_, out_end_;
  std::vector<std::uint64_t> mark_;
  std::uint64_t stamp_ = 0;
};

}  // namespace sweepcheck
