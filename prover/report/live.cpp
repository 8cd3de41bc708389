#include "report/live.hpp"

#include <algorithm>
#include <array>
#include <cmath>

namespace sweepcert {
namespace {

bool is_open(const Quadtree& t, std::uint32_t i) { return t.at(i).kind == CellKind::Open; }

}  // namespace

// The closure of the seeds under touching among open cells is the union of the components of
// the open cells that hold a seed, and those components are the live regions: one flood per
// seed not yet reached finds both.
std::vector<LiveSet> live_sets(const std::vector<Slab>& slabs, double side) {
  std::vector<LiveSet> out(slabs.size());
  std::vector<std::uint32_t> seeds, queue;
  for (std::size_t s = 0; s < slabs.size(); ++s) {
    const Quadtree& t = slabs[s].tree;
    LiveSet& L = out[s];
    L.live.assign(t.size(), 0);
    seeds.clear();
    if (s == 0) {
      for (std::uint32_t i = 0; i < t.size(); ++i)
        if (is_open(t, i)) seeds.push_back(i);
    } else {
      const Quadtree& prev = slabs[s - 1].tree;
      for (std::uint32_t i = 0; i < prev.size(); ++i)
        if (out[s - 1].live[i])
          t.for_each_leaf_meeting(span(prev.at(i)), [&](std::uint32_t j) {
            if (is_open(t, j)) seeds.push_back(j);
          });
    }
    for (std::uint32_t seed : seeds) {
      if (L.live[seed]) continue;
      ++L.regions;
      L.live[seed] = 1;
      queue.assign(1, seed);
      while (!queue.empty()) {
        std::uint32_t c = queue.back();
        queue.pop_back();
        ++L.cells;
        double h = std::ldexp(side, -t.at(c).depth);
        L.area += h * h;
        t.for_each_leaf_meeting(span(t.at(c)), [&](std::uint32_t j) {
          if (is_open(t, j) && !L.live[j]) { L.live[j] = 1; queue.push_back(j); }
        });
      }
    }
  }
  return out;
}

std::vector<int> live_rectangles(const Slab& slab, const LiveSet& live, int g) {
  const int n = 1 << g;
  std::vector<char> px(std::size_t(n) * n, 0);
  const Quadtree& t = slab.tree;
  for (std::uint32_t i = 0; i < t.size(); ++i) {
    if (!live.live[i]) continue;
    const Cell& c = t.at(i);
    std::uint32_t x0, y0, w;
    if (c.depth <= g) {
      w = 1u << (g - c.depth);
      x0 = c.ix * w, y0 = c.iy * w;
    } else {
      w = 1, x0 = c.ix >> (c.depth - g), y0 = c.iy >> (c.depth - g);
    }
    for (std::uint32_t y = y0; y < y0 + w; ++y)
      std::fill_n(px.begin() + std::size_t(y) * n + x0, w, 1);
  }
  // Runs of the previous row still open as rectangles: (x, w, index into out).
  std::vector<int> out;
  std::vector<std::array<int, 3>> open, next;
  for (int y = 0; y < n; ++y) {
    next.clear();
    std::size_t k = 0;
    for (int x = 0; x < n;) {
      if (!px[std::size_t(y) * n + x]) { ++x; continue; }
      int x1 = x;
      while (x1 < n && px[std::size_t(y) * n + x1]) ++x1;
      while (k < open.size() && open[k][0] < x) ++k;
      if (k < open.size() && open[k][0] == x && open[k][1] == x1 - x) {
        out[open[k][2] + 3] += 1;  // same run as the row below: grow that rectangle
        next.push_back(open[k]);
      } else {
        next.push_back({x, x1 - x, static_cast<int>(out.size())});
        out.insert(out.end(), {x, y, x1 - x, 1});
      }
      x = x1;
    }
    open.swap(next);
  }
  return out;
}

}  // namespace sweepcert
