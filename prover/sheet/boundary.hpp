// The boundary matrix of a stack complex, 2-cells against 1-cells, in time order.
//
// Rows (1-cells): frame 0 edges, slab 0 verticals, frame 1 edges, slab 1 verticals, ...
// Columns (2-cells): frame 0 triangles; then for k = 1..n the triangles of frame k followed by
// the prisms of slab k-1. Every column of frame <= k precedes every column of a later frame,
// which is what lets elimination report the earliest frame by which a sheet closes.
// Orientation: simplices canonically by increasing sensor index; boundaries as in schema §3.2.
#pragma once
#include <cstdint>
#include <vector>

#include "stack/stack.hpp"

namespace sweepcert {

struct TwoCell {
  enum Kind : std::uint8_t { Triangle, Prism } kind;
  std::uint32_t frame;  // frame of a triangle; slab (lower frame) of a prism
  std::uint32_t index;  // triangle index at frame, or edge index at frame `frame`
  std::uint32_t upper;  // prisms: edge index at frame + 1
};

struct OneCell {
  enum Kind : std::uint8_t { Edge, Vertical } kind;
  std::uint32_t frame;  // frame of an edge; slab of a vertical
  std::uint32_t index;  // edge index at frame, or vertex
};

struct SignedRow {
  std::uint32_t row;
  int sign;
};

class BoundaryLayout {
 public:
  explicit BoundaryLayout(const Stack& s);

  std::uint32_t rows() const { return rows_; }
  const std::vector<TwoCell>& columns() const { return columns_; }
  // Frame at which a column's cell is complete (a prism over slab k completes at k+1).
  std::uint32_t completion_frame(const TwoCell& c) const {
    return c.kind == TwoCell::Triangle ? c.frame : c.frame + 1;
  }
  std::uint32_t edge_row(std::uint32_t k, std::uint32_t i) const { return edge_start_[k] + i; }
  std::uint32_t vertical_row(std::uint32_t k, std::uint32_t v) const { return vert_start_[k] + v; }
  OneCell cell_of_row(std::uint32_t row) const;

  // Boundary of a column as (row, sign) sorted by row; at most four entries.
  int boundary(const TwoCell& c, SignedRow out[4]) const;
  // The fence loop at frame 0 in listed orientation (schema §3.3).
  std::vector<SignedRow> fence_loop() const;

 private:
  const Stack& s_;
  std::uint32_t rows_ = 0;
  std::vector<std::uint32_t> edge_start_, vert_start_;
  std::vector<TwoCell> columns_;
};

}  // namespace sweepcert
