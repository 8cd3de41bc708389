// Quadtrees of cells over a square, one per time slab (schema §4.5).
//
// Cell boxes are dyadic: a node at depth d with integer position (ix, iy) is the closed box
// origin + side * [ix, ix+1]/2^d x [iy, iy+1]/2^d. The origin is an integer and the side a power
// of two, so every corner is an exact double and touching tests are integer comparisons.
#pragma once
#include <cstdint>
#include <vector>

#include "chambers/region.hpp"

namespace sweepcert {

enum class CellKind : std::uint8_t { Split, Open, Outside, Covered };

struct Cell {
  CellKind kind = CellKind::Open;
  bool free = false;        // open and uncovered by every disk throughout the slab
  std::uint8_t depth = 0;
  std::uint32_t ix = 0, iy = 0;
  std::uint32_t sensor = 0;  // when covered
  std::uint32_t child = 0;   // when split: index of the first of four children (SW, SE, NW, NE)
};

struct Square {
  double x0 = 0, y0 = 0, side = 1;  // integer origin, power-of-two side
  static constexpr int kMaxDepth = 40;
  BoxD box(const Cell& c) const {
    double h = side / double(std::uint64_t(1) << c.depth);
    return {x0 + h * c.ix, y0 + h * c.iy, x0 + h * (c.ix + 1), y0 + h * (c.iy + 1)};
  }
};

// Integer extent of a cell at the finest depth, for touching tests.
struct Span {
  std::int64_t x0, y0, x1, y1;
};
inline Span span(const Cell& c) {
  int shift = Square::kMaxDepth - c.depth;
  return {std::int64_t(c.ix) << shift, std::int64_t(c.iy) << shift, std::int64_t(c.ix + 1) << shift,
          std::int64_t(c.iy + 1) << shift};
}
inline bool touch(const Span& a, const Span& b) {
  return a.x0 <= b.x1 && b.x0 <= a.x1 && a.y0 <= b.y1 && b.y0 <= a.y1;
}

class Quadtree {
 public:
  Quadtree() { cells_.push_back(Cell{}); }
  Cell& at(std::uint32_t i) { return cells_[i]; }
  const Cell& at(std::uint32_t i) const { return cells_[i]; }
  std::size_t size() const { return cells_.size(); }
  // Splits leaf i into four open children; returns the index of the first.
  std::uint32_t split(std::uint32_t i);
  // Calls f(index) for every leaf whose closed box meets the closed span s.
  template <class F> void for_each_leaf_meeting(const Span& s, F&& f) const {
    stack_.clear();
    stack_.push_back(0);
    while (!stack_.empty()) {
      std::uint32_t i = stack_.back();
      stack_.pop_back();
      const Cell& c = cells_[i];
      if (!touch(span(c), s)) continue;
      if (c.kind != CellKind::Split) { f(i); continue; }
      for (std::uint32_t k = 0; k < 4; ++k) stack_.push_back(c.child + k);
    }
  }
  // Leaves in preorder (the order of schema §4.5).
  std::vector<std::uint32_t> preorder_leaves() const;
  // Preorder tokens: -1 split, -2 open, -3 outside, k covered by table index k.
  template <class F> void preorder(F&& visit) const {
    std::vector<std::uint32_t> st{0};
    while (!st.empty()) {
      std::uint32_t i = st.back();
      st.pop_back();
      visit(cells_[i]);
      if (cells_[i].kind == CellKind::Split)
        for (std::uint32_t k = 4; k-- > 0;) st.push_back(cells_[i].child + k);
    }
  }

 private:
  std::vector<Cell> cells_;
  mutable std::vector<std::uint32_t> stack_;
};

}  // namespace sweepcert
