#include "chambers/quadtree.hpp"

namespace sweepcert {

std::uint32_t Quadtree::split(std::uint32_t i) {
  auto first = static_cast<std::uint32_t>(cells_.size());
  Cell parent = cells_[i];
  for (std::uint32_t k = 0; k < 4; ++k) {
    Cell c;
    c.depth = static_cast<std::uint8_t>(parent.depth + 1);
    c.ix = parent.ix * 2 + (k & 1);
    c.iy = parent.iy * 2 + (k >> 1);
    cells_.push_back(c);
  }
  cells_[i].kind = CellKind::Split;
  cells_[i].free = false;
  cells_[i].child = first;
  return first;
}

std::vector<std::uint32_t> Quadtree::preorder_leaves() const {
  std::vector<std::uint32_t> out, st{0};
  while (!st.empty()) {
    std::uint32_t i = st.back();
    st.pop_back();
    if (cells_[i].kind != CellKind::Split) { out.push_back(i); continue; }
    for (std::uint32_t k = 4; k-- > 0;) st.push_back(cells_[i].child + k);
  }
  return out;
}

}  // namespace sweepcert
