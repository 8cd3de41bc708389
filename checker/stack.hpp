// The stack complex on a certificate's frames (schema/README.md §3): which cells exist, their
// canonical orientation, the fence cylinder, and the 2-cells around a given 1-cell used by the
// cocycle check.
#pragma once
#include <cstdint>
#include <array>
#include <deque>
#include <string>
#include <tuple>
#include <vector>

#include "input.hpp"

namespace sweepcheck {

// Sorts n (2 or 3) vertex indices into canonical order (= byte-wise order of ids, §3.2) and
// returns the sign of the permutation applied: the row's oriented cell = sign * canonical cell.
int canonical_order(std::uint32_t* v, int n);

// A 2-cell in canonical orientation: a triangle [v0, v1, v2] at frame k, or the prism of the
// edge [v0, v1] over slab k. `pos` places it among the triangles at k (or the prisms over slab
// k) in the visiting order of NOTES.md reading 10: the slot of its listed triple (of its pair
// at frame k) in a contact log, otherwise its canonical ids.
struct TwoCell {
  bool prism = false;
  std::uint32_t k = 0;
  std::uint32_t v[3] = {0, 0, 0};
  std::array<std::uint64_t, 3> pos{};
};

// The visiting order: frame by frame, the triangles at k before the prisms over slab k, then pos.
inline bool visited_before(const TwoCell& x, const TwoCell& y) {
  return std::tie(x.k, x.prism, x.pos) < std::tie(y.k, y.prism, y.pos);
}

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

  // The 2-cells whose boundary contains a given 1-cell, each present cell once, into `out`:
  // - the edge [a, b] at frame k (present, a < b): the triangles {a, b, c} present at k, found
  //   among the common neighbours c of a and b at k (the three pairs of a triangle are present
  //   with it), and the prisms of [a, b] over slabs k - 1 and k when it is present at both ends;
  // - the vertical V(v, k), k < n: the prisms over slab k of the edges {u, v} present at k and
  //   at k + 1, found among the neighbours u of v at k.
  // A contact log's adjacency is built per frame on demand: visit the cells frame by frame.
  void cells_on_edge(std::uint32_t a, std::uint32_t b, std::uint32_t k, std::vector<TwoCell>& out);
  void cells_on_vertical(std::uint32_t v, std::uint32_t k, std::vector<TwoCell>& out);

  // For messages.
  std::string name(std::uint32_t v) const { return in_.names.at(v); }
  std::string frame_text(std::uint32_t k) const;  // "frame 2 (t=3/2)"
  std::string slab_text(std::uint32_t k) const;   // "slab 2 (t=3/2..2)"
  std::string cell_text(const TwoCell& c) const;

 private:
  // The sensors in contact with v at frame k, into `out`. Contact log: from the adjacency of
  // frame k (rebuilt when k changes). Positional: every other sensor is tested exactly.
  void neighbours(std::uint32_t v, std::uint32_t k, std::vector<std::uint32_t>& out);
  void build_adjacency(std::uint32_t k);
  // Listed logs: the slot of the triple a < b < c listed at frame k, or Input::kAbsent.
  std::size_t triple_slot(std::uint32_t a, std::uint32_t b, std::uint32_t c, std::uint32_t k) const;
  // Appends the prism of [a, b] over slab j when [a, b] is present at j and j + 1.
  void add_prism(std::uint32_t a, std::uint32_t b, std::uint32_t j, std::vector<TwoCell>& out);

  Input& in_;
  std::vector<Rat> frames_;
  std::size_t log_start_;
  std::vector<std::uint32_t> fence_pairs_;
  std::vector<int> fence_signs_;
  FlatMap<std::uint32_t> fence_index_;  // pair id -> fence edge index
  FlatMap<char> edge_memo_;             // positional: pack(pair, k) -> 1 present, 2 absent
  FlatMap<std::uint32_t> position_index_;
  std::deque<Point> positions_;
  // Adjacency of log frame adjacency_frame_: the neighbours of v are adjacency_[begin_[v],
  // end_[v]); only the vertices in `touched_` have a nonempty range.
  std::uint32_t adjacency_frame_ = ~std::uint32_t(0);
  std::vector<std::uint32_t> adjacency_, begin_, end_, touched_;
  // Work space of cells_on_edge; mark_ is indexed by vertex.
  std::vector<std::uint32_t> around_a_, around_b_;
  std::vector<std::uint64_t> mark_;
  std::uint64_t stamp_ = 0;
};

}  // namespace sweepcheck
