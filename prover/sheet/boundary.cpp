#include "sheet/boundary.hpp"

#include <algorithm>
#include <cassert>
#include <stdexcept>

namespace sweepcert {

BoundaryLayout::BoundaryLayout(const Stack& s) : s_(s) {
  std::uint64_t rows = 0;
  std::size_t n = s.frame_count();
  for (std::size_t k = 0; k < n; ++k) {
    edge_start_.push_back(static_cast<std::uint32_t>(rows));
    rows += s.frames[k].edges.size();
    if (k + 1 < n) {
      vert_start_.push_back(static_cast<std::uint32_t>(rows));
      rows += s.vertex_count();
    }
    if (rows >= UINT32_MAX) throw std::length_error("stack complex too large (over 2^32 1-cells)");
  }
  rows_ = static_cast<std::uint32_t>(rows);
  auto add_triangles = [&](std::uint32_t k) {
    for (std::uint32_t i = 0; i < s.frames[k].triangles.size(); ++i)
      columns_.push_back({TwoCell::Triangle, k, i, 0});
  };
  if (n > 0) add_triangles(0);
  for (std::uint32_t k = 1; k < n; ++k) {
    add_triangles(k);
    const auto& a = s.frames[k - 1].edges;
    const auto& b = s.frames[k].edges;
    std::uint32_t i = 0, j = 0;
    while (i < a.size() && j < b.size()) {
      if (a[i] < b[j]) ++i;
      else if (b[j] < a[i]) ++j;
      else { columns_.push_back({TwoCell::Prism, k - 1, i, j}); ++i; ++j; }
    }
    if (columns_.size() >= UINT32_MAX) throw std::length_error("stack complex too large");
  }
}

OneCell BoundaryLayout::cell_of_row(std::uint32_t row) const {
  auto k = static_cast<std::uint32_t>(std::upper_bound(edge_start_.begin(), edge_start_.end(), row) -
                                      edge_start_.begin() - 1);
  if (k < vert_start_.size() && row >= vert_start_[k]) return {OneCell::Vertical, k, row - vert_start_[k]};
  return {OneCell::Edge, k, row - edge_start_[k]};
}

int BoundaryLayout::boundary(const TwoCell& c, SignedRow out[4]) const {
  if (c.kind == TwoCell::Triangle) {
    const Triple& t = s_.frames[c.frame].triangles[c.index];
    auto e = [&](Vertex a, Vertex b) {
      auto i = s_.edge_index(c.frame, {a, b});
      assert(i >= 0 && "a triangle's edges are present with it");
      return edge_row(c.frame, static_cast<std::uint32_t>(i));
    };
    // ∂[a,b,c] = [b,c] - [a,c] + [a,b]
    out[0] = {e(t[1], t[2]), +1};
    out[1] = {e(t[0], t[2]), -1};
    out[2] = {e(t[0], t[1]), +1};
    std::sort(out, out + 3, [](const SignedRow& x, const SignedRow& y) { return x.row < y.row; });
    return 3;
  }
  const Pair& p = s_.frames[c.frame].edges[c.index];
  // ∂(prism of [a,b] over slab k) = V(b,k) - V(a,k) - E(a,b,k+1) + E(a,b,k); rows ascend in
  // exactly this order: E_k < V_k < E_{k+1}.
  out[0] = {edge_row(c.frame, c.index), +1};
  out[1] = {vertical_row(c.frame, p.first), -1};
  out[2] = {vertical_row(c.frame, p.second), +1};
  out[3] = {edge_row(c.frame + 1, c.upper), -1};
  return 4;
}

std::vector<SignedRow> BoundaryLayout::fence_loop() const {
  std::vector<SignedRow> loop;
  std::size_t m = s_.fence_count;
  for (std::size_t i = 0; i < m; ++i) {
    Vertex a = static_cast<Vertex>(i), b = static_cast<Vertex>((i + 1) % m);
    int sign = a < b ? +1 : -1;
    auto idx = s_.edge_index(0, {std::min(a, b), std::max(a, b)});
    if (idx < 0) throw std::logic_error("fence edge missing at frame 0");
    loop.push_back({edge_row(0, static_cast<std::uint32_t>(idx)), sign});
  }
  std::sort(loop.begin(), loop.end(), [](const SignedRow& x, const SignedRow& y) { return x.row < y.row; });
  return loop;
}

}  // namespace sweepcert
