// One slab's quadtree of cells (schema/README.md §4.5): parsed from its preorder token list
// with an explicit stack, stored in preorder (node i is token i of the `tree` array), with the
// touching queries the live-set computation needs.
//
// Boxes are in integer frame units: Q = [0, 2^kLevel]^2, and a node at depth d has side
// 2^(kLevel - d). kLevel = 41 keeps the centre of a depth-40 cell an integer.
#pragma once
#include <cstdint>
#include <string>
#include <vector>

#include "json_reader.hpp"

namespace sweepcheck {

class Quadtree {
 public:
  static constexpr int kLevel = 41;
  static constexpr int kMaxDepth = 40;  // §4.5
  static constexpr std::int32_t kSplit = -1, kOpen = -2, kOutside = -3;

  struct Node {
    std::int64_t x, y;     // lower-left corner
    std::uint32_t end;     // one past the last node of this subtree
    std::int32_t token;    // kSplit, kOpen, kOutside, or a sensor-table index k >= 0
    std::uint8_t depth;
    std::int64_t side() const { return std::int64_t(1) << (kLevel - depth); }
    bool leaf() const { return token != kSplit; }
  };

  // Parses `tree` (a JSON array) as exactly one complete tree of depth <= 40 whose covered
  // tokens index a table of `table_size` sensors. Throws Rejected naming `pointer`/i.
  Quadtree(json::Ref tree, const std::string& pointer, std::size_t table_size);

  const std::vector<Node>& nodes() const { return nodes_; }
  std::size_t open_cells() const { return open_before_.back(); }

  std::uint32_t parent(std::uint32_t i) const { return parent_[i]; }  // the root's is itself
  std::uint32_t open_below(std::uint32_t i) const { return open_before_[nodes_[i].end] - open_before_[i]; }

  // The lowest node whose subtree holds every cell touching leaf i: the first ancestor whose box
  // holds leaf i's box away from its sides (a side on the boundary of Q has nothing beyond it).
  std::uint32_t touch_root(std::uint32_t i) const {
    const Node& c = nodes_[i];
    const std::int64_t q = std::int64_t(1) << kLevel, x1 = c.x + c.side(), y1 = c.y + c.side();
    std::uint32_t a = i;
    for (;;) {
      const Node& n = nodes_[a];
      const std::int64_t s = n.side();
      if ((c.x > n.x || n.x == 0) && (x1 < n.x + s || n.x + s == q) && (c.y > n.y || n.y == 0) &&
          (y1 < n.y + s || n.y + s == q))
        return a;
      if (a == 0) return 0;
      a = parent_[a];
    }
  }

  // Calls f(node index) for every open cell below node `from` whose closed box meets the closed
  // box [x0, x1] x [y0, y1]: a descent into children whose boxes meet the query and for which
  // pending[child] > 0 (the caller's count of open cells below that it still wants; open_below
  // for all of them), so the cost is about (depth + results). `stack` is scratch space.
  template <class F>
  void for_each_open_touching(std::uint32_t from, std::int64_t x0, std::int64_t y0, std::int64_t x1, std::int64_t y1,
                              const std::vector<std::uint32_t>& pending, std::vector<std::uint32_t>& stack, F&& f) const {
    stack.clear();
    stack.push_back(from);
    while (!stack.empty()) {
      const std::uint32_t i = stack.back();
      stack.pop_back();
      if (pending[i] == 0) continue;  // no (wanted) open cell below
      const Node& n = nodes_[i];
      const std::int64_t s = n.side();
      if (n.x > x1 || n.x + s < x0 || n.y > y1 || n.y + s < y0) continue;
      if (n.token == kOpen) { f(i); continue; }
      const std::uint32_t c0 = i + 1, c1 = nodes_[c0].end, c2 = nodes_[c1].end, c3 = nodes_[c2].end;
      stack.push_back(c3);
      stack.push_back(c2);
      stack.push_back(c1);
      stack.push_back(c0);
    }
  }

 private:
  std::vector<Node> nodes_;
  std::vector<std::uint32_t> open_before_;  // open cells among nodes [0, i)
  std::vector<std::uint32_t> parent_;
};

}  // namespace sweepcheck
