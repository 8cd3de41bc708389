// The fence polygon P of a positional scenario (schema/README.md §2.1) and the exact tests the
// chamber and route certificates need on it (§4.5 rule 2, §4.6 rule 1).
#pragma once
#include <cstdint>
#include <vector>

#include "geometry.hpp"
#include "input.hpp"

namespace sweepcheck {

// Where a point lies with respect to P.
enum class Side { Outside, Boundary, Inside };

struct FencePolygon {
  std::vector<Point> vertices;      // fence centres in listed (cyclic) order
  std::vector<std::uint32_t> ids;   // their vertex ids

  explicit FencePolygon(const Input& in);
  std::size_t size() const { return vertices.size(); }
  // Exact: on an edge (closed segment) is Boundary; otherwise the crossing number decides.
  // When on the boundary, *edge is set to the index i of the edge from vertex i to i+1.
  Side locate(const Point& p, std::size_t* edge = nullptr) const;
};

// Tests of open axis-parallel boxes against P in an integer frame: a point p of the plane has
// frame coordinates (p - origin) / side * 2^kLevel, and a box is given by its lower-left corner
// (X, Y) and side s in those units. The fence vertices are put on a common denominator once, so
// a test is a few integer products (128-bit when the numbers allow, cpp_int otherwise).
class BoxTester {
 public:
  static constexpr int kLevel = 41;

  BoxTester(const FencePolygon& polygon, const Point& origin, const Rat& side);

  // Does the open box (X, X+s) x (Y, Y+s) have no point in the interior of P? Returns -1 if so
  // (no fence edge meets the open box and its centre is outside P); otherwise the index of the
  // first fence edge meeting the open box, or size() when no edge meets it but its centre lies
  // inside P. X, Y >= 0, s >= 2 and even, X + s, Y + s <= 2^kLevel.
  std::int64_t meets_interior(std::int64_t x, std::int64_t y, std::int64_t s) const;
  std::size_t size() const { return small_ ? vx_.size() : bx_.size(); }

 private:
  bool small_ = false;       // the int64 / __int128 path is exact for these numbers
  std::int64_t scale_ = 1;   // the common denominator of the vertex frame coordinates
  std::vector<std::int64_t> vx_, vy_;  // vertices * scale_ (small path)
  Int big_scale_;
  std::vector<Int> bx_, by_;           // vertices * scale_ (exact path)
};

}  // namespace sweepcheck
