// Deciding a positional sweep by time-ordered chambers (DESIGN §3.3, schema §4.5) or by an
// explicit evasion route (schema §4.6).
//
// Time is cut into slabs (every waypoint time is a slab end; slabs are short enough that no
// sensor moves more than half its radius in one). In each slab, a quadtree over a square around
// P classifies cells: covered (inside one disk throughout the slab, by convexity checked at the
// corners at the slab's ends and the sensor's waypoints), outside (no point of int P), or open;
// open cells that miss every disk throughout the slab are also marked free. Live sets are
// propagated forward; only live cells that are neither covered, outside nor free are refined,
// so detail follows the live frontier. An empty live set proves no evasion. Otherwise a path
// through free cells, connected within and across slabs, is turned into a route and checked
// exactly. If neither succeeds, slabs are halved and cells allowed one level deeper, a few
// rounds; then the answer is undecided, with the place where resolution ran out.
#pragma once
#include <array>
#include <functional>
#include <string>
#include <vector>

#include "chambers/quadtree.hpp"
#include "model/sweep.hpp"

namespace sweepcert {

struct ChamberPlan {
  int max_depth = 0;        // 0: chosen from the smallest radius (cells down to about r/4)
  int rounds = 4;           // refinement rounds after the first
  bool try_chambers = true;
  bool try_route = true;
  std::size_t max_cells = 60'000'000;  // over all slabs of a round
};

struct Slab {
  Rational a, b;
  Quadtree tree;
  std::size_t live = 0;  // live cells
};

struct ChamberResult {
  enum class Outcome { NoEvasion, Evasion, Undecided } outcome = Outcome::Undecided;
  Square square;
  std::vector<Slab> slabs;                      // NoEvasion: up to the slab whose live set is empty
  std::vector<std::array<Rational, 3>> route;   // Evasion
  std::string narrowest;                        // Undecided: where and when resolution ran out
  bool no_route = false;                        // Undecided, routes only: a live set emptied
  int rounds_used = 0;
  std::size_t cells = 0;
};

using ChamberProgress = std::function<void(const std::string&)>;

ChamberResult decide_by_chambers(const Sweep& sweep, const ChamberPlan& plan,
                                 const ChamberProgress& progress = {});

// One slab classified with every mixed cell refined to `depth` (no live-set pruning), over the
// square the engine would choose. For reference tests on static configurations.
Slab classify_slab(const Sweep& sweep, const Rational& a, const Rational& b, int depth, Square& square);

// Exact check of a route against every disk (schema §4.6); returns "" or what fails.
std::string check_route(const Sweep& sweep, const std::vector<std::array<Rational, 3>>& route);

}  // namespace sweepcert
