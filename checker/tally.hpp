// What the checks verified, counted by the checks themselves as each item passes (not by a
// second pass), for the auditor's account of `sweepcheck --explain` (explain.cpp). Each check
// fills its own part. On a rejection the counts stop at the failing item: they count what was
// verified before it.
#pragma once
#include <cstddef>

namespace sweepcheck {

struct Tally {
  // §4.1, §4.1.1, §4.2.
  bool header = false;                     // format, claim, method, key set, hash binding, input format
  std::size_t radii_adjusted = 0;          // §4.1.1: radii changed by the margin
  std::size_t fence_links_rechecked = 0;   // §4.1.1: consecutive fence pairs re-tested with shrunk radii
  std::size_t frames_checked = 0;          // sheet, cocycle: frames checked against the input
  std::size_t waypoints_checked = 0;       // positional: waypoint times strictly inside, found among the frames

  // §4.3 sheet.
  std::size_t triangles = 0;       // triangle rows shown present
  std::size_t witnesses = 0;       // of which by an exact witness point (positional)
  std::size_t prisms = 0;          // prism rows shown present
  std::size_t prism_end_tests = 0; // edge presence tests at prism ends
  bool cells_distinct = false;     // rules 1, 2 passed for every row
  std::size_t faces_summed = 0;    // boundary terms added (3 per triangle, 4 per prism)
  std::size_t boundary_cells = 0;  // distinct 1-cells they fall on
  std::size_t cylinder_cells = 0;  // nonzero boundary cells, all on the fence cylinder (rule 3)
  bool on_cylinder = false;        // rule 3 passed
  std::size_t fence_edges_wound = 0;  // fence edges along which the winding was confirmed (rule 4)

  // §4.4 cocycle.
  std::size_t edge_values = 0, vertical_values = 0;  // rows shown present
  std::size_t cocycle_triangles = 0, cocycle_prisms = 0;  // 2-cells on which phi(boundary) = 0 was evaluated
  bool coboundary_zero = false;    // rule 2 passed
  bool fence_loop = false;         // rule 3 passed

  // §4.5 chambers.
  std::size_t fence_in_square = 0;  // fence centres found in Q
  std::size_t table = 0;            // sensor table entries
  std::size_t slabs = 0;            // slabs with times checked
  bool slab_times = false;          // every slab's times passed: the cells come next
  std::size_t slabs_done = 0;       // slabs whose tree, cells and live set were checked
  std::size_t cells = 0, covered = 0, outside = 0, open = 0;
  std::size_t corner_tests = 0;     // exact corner-in-disk tests (rule 1)
  std::size_t outside_boxes = 0;    // distinct outside boxes tested against P (rule 2)
  std::size_t live_cells = 0;       // live cells summed over the slabs
  std::size_t live_peak = 0;
  std::size_t empty_from = 0;       // the first slab with an empty live set
  bool live_empty = false;          // rule 4 passed

  // §4.6 route.
  std::size_t route_rows = 0;
  bool route_starts_inside = false;  // rule 1
  std::size_t pieces_exact = 0;      // pieces tested exactly (rule 2)
  std::size_t pieces_filtered = 0;   // pieces passed by the integer box filter
  std::size_t route_sensors = 0;     // sensors whose every piece was tested
  bool route_clear = false;          // rule 2 passed
};

}  // namespace sweepcheck
