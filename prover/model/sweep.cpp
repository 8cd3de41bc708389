#include "model/sweep.hpp"

#include <algorithm>

namespace sweepcert {

Point Sweep::position(std::size_t i, const Rational& t) const {
  const auto& track = sensors[i].track;
  if (t <= track.front().t) return {track.front().x, track.front().y};
  if (t >= track.back().t) return {track.back().x, track.back().y};
  auto hi = std::upper_bound(track.begin(), track.end(), t,
                             [](const Rational& a, const Waypoint& w) { return a < w.t; });
  auto lo = hi - 1;
  if (lo->t == t) return {lo->x, lo->y};
  Rational s = (t - lo->t) / (hi->t - lo->t);
  return {lo->x + s * (hi->x - lo->x), lo->y + s * (hi->y - lo->y)};
}

std::vector<Rational> Sweep::waypoint_times(const Rational& a, const Rational& b) const {
  std::vector<Rational> out;
  for (const auto& s : sensors)
    for (const auto& w : s.track)
      if (a < w.t && w.t < b) out.push_back(w.t);
  std::sort(out.begin(), out.end());
  out.erase(std::unique(out.begin(), out.end()), out.end());
  return out;
}

Sweep adjusted(const Sweep& sweep, const Rational& delta) {
  Sweep out = sweep;
  for (auto& s : out.sensors) s.radius += delta;
  return out;
}

}  // namespace sweepcert
