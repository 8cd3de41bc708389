// A standalone SVG snapshot at one exact time T, for printed audit reports: region, fence,
// sensors at T (exact positions), the live set of the slab holding T or the route and intruder
// at T, a caption with T and the claim, and a small legend. Same classes and colours as the page.
#pragma once
#include <string>

#include "report/scene.hpp"

namespace sweepcert {

std::string svg_snapshot(const Scene& s, const Sweep& sweep, const Rational& t);

}  // namespace sweepcert
