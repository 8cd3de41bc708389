#include "stack/stack.hpp"

#include <algorithm>

namespace sweepcert {

std::int64_t Stack::edge_index(std::size_t k, Pair e) const {
  const auto& edges = frames[k].edges;
  auto it = std::lower_bound(edges.begin(), edges.end(), e);
  if (it == edges.end() || *it != e) return -1;
  return it - edges.begin();
}

StackSize measure(const Stack& s) {
  StackSize out;
  for (std::size_t k = 0; k < s.frames.size(); ++k) {
    out.edges += s.frames[k].edges.size();
    out.triangles += s.frames[k].triangles.size();
    if (k + 1 < s.frames.size()) {
      const auto& a = s.frames[k].edges;
      const auto& b = s.frames[k + 1].edges;
      std::size_t i = 0, j = 0;
      while (i < a.size() && j < b.size()) {
        if (a[i] < b[j]) ++i;
        else if (b[j] < a[i]) ++j;
        else { ++out.prisms; ++i; ++j; }
      }
      out.verticals += s.vertex_count();
    }
  }
  return out;
}

std::vector<Triple> triangles_from_pairs(const std::vector<Pair>& edges, std::size_t n) {
  // Forward adjacency (neighbours with larger index), sorted; triangles by merging lists.
  std::vector<std::uint32_t> start(n + 1, 0);
  for (const auto& e : edges) ++start[e.first + 1];
  for (std::size_t i = 0; i < n; ++i) start[i + 1] += start[i];
  std::vector<Vertex> adj(edges.size());
  {
    std::vector<std::uint32_t> fill(start.begin(), start.end() - 1);
    for (const auto& e : edges) adj[fill[e.first]++] = e.second;  // edges sorted: lists sorted
  }
  std::vector<Triple> out;
  for (Vertex a = 0; a < n; ++a)
    for (std::uint32_t p = start[a]; p < start[a + 1]; ++p) {
      Vertex b = adj[p];
      // c in N+(a) ∩ N+(b), c > b.
      std::uint32_t i = p + 1, j = start[b];
      while (i < start[a + 1] && j < start[b + 1]) {
        if (adj[i] < adj[j]) ++i;
        else if (adj[j] < adj[i]) ++j;
        else { out.push_back({a, b, adj[i]}); ++i; ++j; }
      }
    }
  return out;  // sorted by construction
}

Stack stack_of_log(const ContactLog& log) {
  Stack s;
  s.ids = log.ids;
  s.fence_count = log.fence_count;
  s.positional = false;
  for (const auto& f : log.frames) {
    s.times.push_back(f.t);
    FrameCells cells;
    cells.edges = f.pairs;
    cells.triangles = log.triples_listed ? f.triples : triangles_from_pairs(f.pairs, log.ids.size());
    s.frames.push_back(std::move(cells));
  }
  return s;
}

}  // namespace sweepcert
