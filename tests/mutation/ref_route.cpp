// Reference for evasion routes (§4.6).
//
// Exact part: on a piece between consecutive breakpoints (route times and the sensor's
// waypoints) both the route point and the centre move linearly, so their difference is
// g(u) = g0 + u·e for u ∈ [0, 1]; |g(u)|² is minimised at u* = −(g0·e)/|e|² clamped to [0, 1].
// The route avoids the closed disk on the piece iff |g(u*)|² > r², evaluated with rationals.
// Sampled part: a cross-check of the exact part from a different formula — positions at
// `samples` evenly spaced times per piece, computed in doubles from the raw rows; every sample
// must be outside every disk and inside the fence polygon.
#include <algorithm>
#include <cmath>

#include "ref_internal.hpp"

namespace mutref {

namespace {

Point route_at(const std::vector<std::array<Q, 3>>& r, const Q& t) {
  for (std::size_t i = 0; i + 1 < r.size(); ++i)
    if (t <= r[i + 1][0]) {
      Q f = (t - r[i][0]) / (r[i + 1][0] - r[i][0]);
      return {r[i][1] + f * (r[i + 1][1] - r[i][1]), r[i][2] + f * (r[i + 1][2] - r[i][2])};
    }
  return {r.back()[1], r.back()[2]};
}

struct DPoint {
  double x, y;
};

DPoint lerp_rows(const std::vector<std::array<double, 3>>& r, double t) {
  if (t <= r.front()[0]) return {r.front()[1], r.front()[2]};
  for (std::size_t i = 0; i + 1 < r.size(); ++i)
    if (t <= r[i + 1][0]) {
      double f = (t - r[i][0]) / (r[i + 1][0] - r[i][0]);
      return {r[i][1] + f * (r[i + 1][1] - r[i][1]), r[i][2] + f * (r[i + 1][2] - r[i][2])};
    }
  return {r.back()[1], r.back()[2]};
}

bool inside_polygon(const std::vector<DPoint>& poly, DPoint p) {
  bool in = false;
  for (std::size_t i = 0, j = poly.size() - 1; i < poly.size(); j = i++)
    if ((poly[i].y > p.y) != (poly[j].y > p.y) &&
        p.x < poly[j].x + (p.y - poly[j].y) * (poly[i].x - poly[j].x) / (poly[i].y - poly[j].y))
      in = !in;
  return in;
}

}  // namespace

void verify_route(const Input& in, const json& cert, int samples) {
  if (!in.positional) refuse("a route needs a positional input");
  const json& rows = cert.at("route");
  if (!rows.is_array() || rows.size() < 2) refuse("/route: at least two rows");
  std::vector<std::array<Q, 3>> r;
  for (std::size_t i = 0; i < rows.size(); ++i) {
    std::string w = "/route/" + std::to_string(i);
    if (!rows[i].is_array() || rows[i].size() != 3) refuse(w + ": rows are [t, x, y]");
    r.push_back({rational(rows[i][0], w + "/0"), rational(rows[i][1], w + "/1"), rational(rows[i][2], w + "/2")});
    if (i > 0 && !(r[i - 1][0] < r[i][0])) refuse(w + "/0: times must strictly increase");
  }
  if (r.front()[0] != in.h0) refuse("/route/0/0: must be the horizon start");
  if (r.back()[0] != in.h1) refuse("/route: the last time must be the horizon end");
  if (locate(in, {r[0][1], r[0][2]}) != Where::inside) refuse("/route/0: the first point is not strictly inside P");

  const int V = static_cast<int>(in.ids.size());
  std::vector<std::vector<Q>> pieces(V);
  for (int v = 0; v < V; ++v) {
    std::vector<Q> cut;
    for (const auto& row : r) cut.push_back(row[0]);
    for (const Q& w : in.waypoint_times(v))
      if (in.h0 <= w && w <= in.h1) cut.push_back(w);
    std::sort(cut.begin(), cut.end());
    cut.erase(std::unique(cut.begin(), cut.end()), cut.end());
    Q r2 = in.radius[v] * in.radius[v];
    for (std::size_t i = 0; i + 1 < cut.size(); ++i) {
      Point a = route_at(r, cut[i]), ca = in.centre(v, cut[i]);
      Point b = route_at(r, cut[i + 1]), cb = in.centre(v, cut[i + 1]);
      Q g0x = a.x - ca.x, g0y = a.y - ca.y;
      Q ex = (b.x - cb.x) - g0x, ey = (b.y - cb.y) - g0y;
      Q ee = ex * ex + ey * ey;
      Q u = 0;
      if (ee != 0) {
        u = -(g0x * ex + g0y * ey) / ee;
        u = std::max(Q(0), std::min(Q(1), u));
      }
      Q gx = g0x + u * ex, gy = g0y + u * ey;
      if (gx * gx + gy * gy <= r2)
        refuse("route meets the disk of " + in.ids[v] + " between t = " + text_of(cut[i]) + " and " + text_of(cut[i + 1]));
    }
    pieces[v] = std::move(cut);
  }

  // Sampled cross-check in doubles.
  std::vector<std::array<double, 3>> rd;
  for (const auto& row : r) rd.push_back({row[0].get_d(), row[1].get_d(), row[2].get_d()});
  std::vector<DPoint> poly;
  for (int f : in.fence) poly.push_back({in.track[f][0][1].get_d(), in.track[f][0][2].get_d()});
  for (int v = 0; v < V; ++v) {
    std::vector<std::array<double, 3>> track;
    for (const auto& row : in.track[v]) track.push_back({row[0].get_d(), row[1].get_d(), row[2].get_d()});
    double rr = in.radius[v].get_d();
    for (std::size_t i = 0; i + 1 < pieces[v].size(); ++i) {
      double t0 = pieces[v][i].get_d(), t1 = pieces[v][i + 1].get_d();
      for (int s = 0; s <= samples; ++s) {
        double t = t0 + (t1 - t0) * s / samples;
        DPoint g = lerp_rows(rd, t), c = lerp_rows(track, t);
        double dx = g.x - c.x, dy = g.y - c.y;
        if (dx * dx + dy * dy <= rr * rr) refuse("a sample at t = " + std::to_string(t) + " lies in the disk of " + in.ids[v]);
        if (v == 0 && !inside_polygon(poly, g)) refuse("a sample at t = " + std::to_string(t) + " is outside P");
      }
    }
  }
}

}  // namespace mutref
