// Live sets of a chambers certificate (schema §4.5) and their picture on a pixel grid.
//
// L_0 is every open cell of the first slab; L_{j+1} is every open cell of slab j+1 touching a
// cell of L_j, closed under touching among the open cells of slab j+1 (closed boxes touch when
// they share a point). Regions are the connected components of a live set under touching.
// Computed on the cells themselves, with the prover's quadtree neighbour query.
#pragma once
#include <vector>

#include "chambers/engine.hpp"

namespace sweepcert {

struct LiveSet {
  std::vector<char> live;  // per cell of the slab's tree
  std::size_t cells = 0;   // live cells
  std::size_t regions = 0; // connected components under touching
  double area = 0;         // total area of the live cells (they tile, so no overlap)
};

std::vector<LiveSet> live_sets(const std::vector<Slab>& slabs, double side);

// The live cells of one slab drawn on the 2^g x 2^g pixel grid of the square: a pixel is marked
// when a live cell covers it or lies in it (cells finer than a pixel mark their whole pixel), and
// marked pixels are merged into rectangles [x, y, w, h] (pixel units, y up), first along rows,
// then rows with identical runs stacked.
std::vector<int> live_rectangles(const Slab& slab, const LiveSet& live, int g);

}  // namespace sweepcert
