// The protected region P (the fence polygon) against points and axis-aligned boxes, exactly.
#pragma once
#include <vector>

#include "model/sweep.hpp"

namespace sweepcert {

struct BoxD {  // a closed axis-aligned box whose corners are exact doubles (dyadic)
  double x0, y0, x1, y1;
};

class Region {
 public:
  explicit Region(const Sweep& sweep);
  // Strictly inside P (not on its boundary)?
  bool strictly_inside(const Point& p) const;
  // Does the closed box have no point in the interior of P? Exact: no edge meets the open box
  // and the centre is not inside P.
  bool box_outside(const BoxD& b) const;
  const std::vector<Point>& vertices() const { return v_; }
  double min_x() const { return minx_; }
  double min_y() const { return miny_; }
  double max_x() const { return maxx_; }
  double max_y() const { return maxy_; }

 private:
  bool edge_meets_open_box(std::size_t e, const BoxD& b) const;
  int classify_point(const Point& p) const;  // +1 inside, 0 on boundary, -1 outside
  // The same for a point with exact double coordinates, filtered; exact when in doubt.
  int classify_point(double px, double py) const;
  std::vector<Point> v_;
  std::vector<double> vx_, vy_;
  std::vector<BoxD> edge_bbox_;
  double minx_, miny_, maxx_, maxy_;
};

}  // namespace sweepcert
