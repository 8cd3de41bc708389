// The two kinds of input, after validation (schema/README.md §2).
//
// Sensors are indexed 0..n-1 with the fence first, in its listed cyclic order; every other part
// of the prover uses these indices and only the certificate writer turns them back into ids.
#pragma once
#include <array>
#include <cstdint>
#include <string>
#include <utility>
#include <vector>

#include "exact/number.hpp"

namespace sweepcert {

struct Point {
  Rational x, y;
};

struct Waypoint {
  Rational t, x, y;
};

struct Sensor {
  std::string id;
  Rational radius;
  std::vector<Waypoint> track;  // one row for a fence sensor
};

// A positional scenario: disks with known centres over time.
struct Sweep {
  std::string title;
  Rational t_start, t_end;
  std::vector<Sensor> sensors;  // fence first
  std::size_t fence_count = 0;

  // Centre of sensor i at time t: linear between waypoints, held before the first and after
  // the last.
  Point position(std::size_t i, const Rational& t) const;
  // Every waypoint time strictly inside (a, b), sorted, without repeats.
  std::vector<Rational> waypoint_times(const Rational& a, const Rational& b) const;
};

// The same sweep with every radius, fence and mobile, changed by `delta` (schema §4.1.1): by −M
// for a no-evasion proof that survives position errors up to M, by +M for a route that does.
// Radii may drop to zero or below and fence disks may stop meeting; callers validate.
Sweep adjusted(const Sweep& sweep, const Rational& delta);

using Vertex = std::uint32_t;
using Pair = std::pair<Vertex, Vertex>;        // a < b
using Triple = std::array<Vertex, 3>;          // a < b < c

// A contact log: who touched whom at each frame (minimal sensing).
struct ContactLog {
  struct Frame {
    Rational t;
    std::vector<Pair> pairs;      // sorted, unique
    std::vector<Triple> triples;  // sorted, unique; empty when triangles come from pairs
  };
  std::string title;
  std::vector<std::string> ids;  // fence first
  std::size_t fence_count = 0;
  bool triples_listed = true;
  Rational contact_range, sensing_radius;  // set when triangles come from pairs
  std::vector<Frame> frames;
};

}  // namespace sweepcert
