// The space-time stack complex on a list of frames (schema/README.md §3).
//
// For each frame we keep the simplices present then: sorted edges and triangles on sensor
// indices (fence first). Prisms are implied: an edge present at frames k and k+1 spans the slab
// between them. Positional stacks also keep, per triangle, the rational witness point that
// proves its three disks share a point.
#pragma once
#include <cstdint>
#include <string>
#include <vector>

#include "model/sweep.hpp"

namespace sweepcert {

struct FrameCells {
  std::vector<Pair> edges;         // sorted
  std::vector<Triple> triangles;   // sorted
  std::vector<Point> witnesses;    // parallel to triangles; empty for contact logs
};

struct Stack {
  std::vector<std::string> ids;  // sensor ids, fence first in cyclic order
  std::size_t fence_count = 0;
  bool positional = false;
  std::vector<Rational> times;
  std::vector<FrameCells> frames;

  std::size_t vertex_count() const { return ids.size(); }
  std::size_t frame_count() const { return frames.size(); }
  // Position of edge (a<b) in frame k's sorted list, or -1.
  std::int64_t edge_index(std::size_t k, Pair e) const;
};

// Statistics for summaries.
struct StackSize {
  std::size_t edges = 0, triangles = 0, prisms = 0, verticals = 0;
};
StackSize measure(const Stack& s);

// The Čech complex of a sweep at time t: pairs by exact distance, triples with witnesses.
FrameCells cech_at(const Sweep& sweep, const Rational& t);

// Pairwise triangles of a sorted edge list (Jung's theorem makes them true triples for logs
// with "from-pairs").
std::vector<Triple> triangles_from_pairs(const std::vector<Pair>& edges, std::size_t n_vertices);

// The stack of a contact log on all its frames.
Stack stack_of_log(const ContactLog& log);

// The stack of a positional sweep. Frames: the horizon ends, every waypoint time inside, and
// midpoints wherever a slab both loses and gains simplices (so that the intermediate state,
// which holds both, is seen), up to `max_frames`.
struct FramePlan {
  std::size_t max_frames = 20000;
  int max_rounds = 40;
};
Stack stack_of_sweep(const Sweep& sweep, const FramePlan& plan);

}  // namespace sweepcert
