// Čech complexes of a positional sweep, and the choice of frames.
#include <algorithm>
#include <cmath>

#include "exact/predicates.hpp"
#include "stack/stack.hpp"

namespace sweepcert {

FrameCells cech_at(const Sweep& sweep, const Rational& t) {
  std::size_t n = sweep.sensors.size();
  std::vector<Point> c(n);
  std::vector<double> cx(n);
  double rmax = 0;
  for (std::size_t i = 0; i < n; ++i) {
    c[i] = sweep.position(i, t);
    cx[i] = c[i].x.get_d();
    rmax = std::max(rmax, sweep.sensors[i].radius.get_d());
  }
  // Candidate pairs by a sweep over x; the slack covers double rounding generously (the exact
  // test decides every candidate).
  std::vector<std::size_t> order(n);
  for (std::size_t i = 0; i < n; ++i) order[i] = i;
  std::sort(order.begin(), order.end(), [&](std::size_t a, std::size_t b) { return cx[a] < cx[b]; });
  FrameCells out;
  for (std::size_t p = 0; p < n; ++p) {
    std::size_t i = order[p];
    double reach = sweep.sensors[i].radius.get_d() + rmax;
    double slack = 1e-9 * (std::fabs(cx[i]) + reach) + 1e-300;
    for (std::size_t q = p + 1; q < n; ++q) {
      std::size_t j = order[q];
      if (cx[j] - cx[i] > reach + slack) break;
      if (disks_meet(c[i], sweep.sensors[i].radius, c[j], sweep.sensors[j].radius))
        out.edges.emplace_back(static_cast<Vertex>(std::min(i, j)), static_cast<Vertex>(std::max(i, j)));
    }
  }
  std::sort(out.edges.begin(), out.edges.end());
  for (const Triple& tri : triangles_from_pairs(out.edges, n)) {
    Point centres[3] = {c[tri[0]], c[tri[1]], c[tri[2]]};
    Rational radii[3] = {sweep.sensors[tri[0]].radius, sweep.sensors[tri[1]].radius,
                         sweep.sensors[tri[2]].radius};
    if (auto w = triple_witness(centres, radii)) {
      out.triangles.push_back(tri);
      out.witnesses.push_back(std::move(*w));
    }
  }
  return out;
}

namespace {

// Does the slab lose some simplex and gain another? Then a frame inside may hold both.
template <class T>
bool mixed(const std::vector<T>& a, const std::vector<T>& b, bool& lost, bool& gained) {
  std::size_t i = 0, j = 0;
  while (i < a.size() && j < b.size() && !(lost && gained)) {
    if (a[i] < b[j]) { lost = true; ++i; }
    else if (b[j] < a[i]) { gained = true; ++j; }
    else { ++i; ++j; }
  }
  if (i < a.size()) lost = true;
  if (j < b.size()) gained = true;
  return lost && gained;
}

bool slab_is_mixed(const FrameCells& a, const FrameCells& b) {
  bool lost = false, gained = false;
  mixed(a.edges, b.edges, lost, gained);
  mixed(a.triangles, b.triangles, lost, gained);
  return lost && gained;
}

}  // namespace

Stack stack_of_sweep(const Sweep& sweep, const FramePlan& plan) {
  Stack s;
  for (const auto& sensor : sweep.sensors) s.ids.push_back(sensor.id);
  s.fence_count = sweep.fence_count;
  s.positional = true;
  s.times.push_back(sweep.t_start);
  for (auto& t : sweep.waypoint_times(sweep.t_start, sweep.t_end)) s.times.push_back(t);
  s.times.push_back(sweep.t_end);
  for (const auto& t : s.times) s.frames.push_back(cech_at(sweep, t));

  for (int round = 0; round < plan.max_rounds; ++round) {
    std::vector<Rational> times;
    std::vector<FrameCells> frames;
    std::size_t added = 0;
    for (std::size_t k = 0; k < s.times.size(); ++k) {
      times.push_back(s.times[k]);
      frames.push_back(std::move(s.frames[k]));
      if (k + 1 < s.times.size() && s.times.size() + added < plan.max_frames &&
          slab_is_mixed(frames.back(), s.frames[k + 1])) {
        Rational mid = (s.times[k] + s.times[k + 1]) / 2;
        times.push_back(mid);
        frames.push_back(cech_at(sweep, mid));
        ++added;
      }
    }
    s.times = std::move(times);
    s.frames = std::move(frames);
    if (added == 0) break;
  }
  return s;
}

}  // namespace sweepcert
