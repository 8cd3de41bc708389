// The two certificate kinds that speak about positions (schema/README.md §4.5 chambers, §4.6
// route), and what they share: where a sensor is at a time, and how points are written in
// messages.
#pragma once
#include <ostream>
#include <string>

#include "certificate.hpp"
#include "geometry.hpp"
#include "input.hpp"

namespace sweepcheck {

// c_i(t) (§2.1): linear between consecutive track rows, held still before the first and after
// the last row. Exact.
Point position(const Sensor& s, const Rat& t);

// "(x, y)" and "sensor \"id\"" for messages.
std::string point_text(const Point& p);
std::string sensor_text(const Input& in, std::uint32_t v);

// The method checks (check_chambers.cpp, check_route.cpp). Positional input only. They print
// findings and return a summary for the ACCEPTED line, or throw Rejected at the first failing
// item.
std::string check_chambers(const Certificate& cert, const Input& in, std::ostream& out, Tally& tally);
std::string check_route(const Certificate& cert, const Input& in, std::ostream& out, Tally& tally);

}  // namespace sweepcheck
