#include "report/scene.hpp"

#include <algorithm>

namespace sweepcert {

std::vector<Circle> disks_at(const Sweep& sweep, const Rational& t) {
  std::vector<Circle> out;
  for (std::size_t i = 0; i < sweep.sensors.size(); ++i) {
    Point p = sweep.position(i, t);
    out.push_back({{approx(p.x), approx(p.y)}, approx(sweep.sensors[i].radius)});
  }
  return out;
}

int slab_at(const CertView& cert, const Rational& t) {
  for (std::size_t j = 0; j < cert.slabs.size(); ++j)
    if (cert.slabs[j].a <= t && (t < cert.slabs[j].b || (j + 1 == cert.slabs.size() && t == cert.slabs[j].b)))
      return static_cast<int>(j);
  return -1;
}

namespace {

void describe_claim(const CertView& c, Scene& s) {
  auto t = [](const Rational& q) { return to_text(q); };
  if (c.method == "sheet") {
    s.headline = "No evasion path";
    s.claim_words = "A separating sheet (ring " + c.ring + ", winding " + c.winding +
                    ") made of covered triangles and prisms spans the fence by t = " +
                    t(c.frames.back()) + " (" + std::to_string(c.frames.size()) +
                    " frames). Every intruder path starting inside the fence at t = " +
                    t(c.frames.front()) + " would have to cross it, and it lies in covered space-time.";
  } else if (c.method == "cocycle") {
    s.headline = "No separating sheet on these frames";
    s.claim_words = "On these " + std::to_string(c.frames.size()) + " frames (ring " + c.ring +
                    ") no separating sheet exists. For positional input this alone does not say "
                    "whether an intruder can evade: the time-ordered chambers or a route decide that.";
  } else if (c.method == "chambers") {
    s.headline = "No evasion path";
    s.claim_words = "The live set (the cells where an intruder could still be, carried forward "
                    "through " + std::to_string(c.slabs.size()) + " time slabs) is empty by t = " +
                    t(c.slabs.back().b) + ". An intruder inside the fence at t = " +
                    t(c.slabs.front().a) + " has nowhere left to be.";
  } else {
    s.headline = "Evasion possible";
    s.claim_words = "The intruder route drawn here starts strictly inside the fence and stays "
                    "outside every disk from t = " + t(c.route.front()[0]) + " to t = " +
                    t(c.route.back()[0]) + " (" + std::to_string(c.route.size()) + " waypoints).";
  }
}

void picture_slabs(const CertView& c, Scene& s) {
  s.qx = approx(c.x0), s.qy = approx(c.y0), s.qside = approx(c.side);
  std::vector<LiveSet> live = live_sets(c.slabs, s.qside);
  int depth = 0;
  for (const Slab& slab : c.slabs)
    for (std::size_t i = 0; i < slab.tree.size(); ++i) depth = std::max<int>(depth, slab.tree.at(i).depth);
  for (int g = std::min(depth, kMaxGridLog2);; --g) {
    s.grid_log2 = g;
    s.slabs.clear();
    std::size_t total = 0;
    for (std::size_t j = 0; j < c.slabs.size(); ++j) {
      SlabPicture p{approx(c.slabs[j].a), approx(c.slabs[j].b), live[j].cells, live[j].regions,
                    live[j].area, live_rectangles(c.slabs[j], live[j], g)};
      total += p.rects.size() / 4;
      s.slabs.push_back(std::move(p));
    }
    if (total <= kMaxLiveRects || g <= 4) break;
  }
}

}  // namespace

Scene build_scene(const Sweep& sweep, const CertView& cert) {
  Scene s;
  s.cert = &cert;
  s.title = sweep.title.empty() ? "Untitled sweep" : sweep.title;
  s.prover_note = cert.summary;
  s.t0 = approx(sweep.t_start), s.t1 = approx(sweep.t_end);
  for (std::size_t i = 0; i < sweep.sensors.size(); ++i) {
    const Sensor& sen = sweep.sensors[i];
    if (i < sweep.fence_count) {
      Vec2 c{approx(sen.track[0].x), approx(sen.track[0].y)};
      s.region.push_back(c);
      s.fence.push_back({c, approx(sen.radius)});
      continue;
    }
    MobileTrack m{sen.id, approx(sen.radius), {}};
    for (const Waypoint& w : sen.track) m.track.push_back({approx(w.t), approx(w.x), approx(w.y)});
    s.mobile.push_back(std::move(m));
  }
  s.region_area = polygon_area(s.region);

  for (int k = 0; k <= kAreaSteps; ++k)
    s.sample_times.push_back(sweep.t_start + (sweep.t_end - sweep.t_start) * k / kAreaSteps);
  for (const Rational& t : sweep.waypoint_times(sweep.t_start, sweep.t_end)) s.sample_times.push_back(t);
  std::sort(s.sample_times.begin(), s.sample_times.end());
  s.sample_times.erase(std::unique(s.sample_times.begin(), s.sample_times.end()), s.sample_times.end());
  for (const Rational& t : s.sample_times) s.uncovered.push_back(uncovered_area(s.region, disks_at(sweep, t)));

  for (const Rational& f : cert.frames) s.frames.push_back(approx(f));
  for (const auto& r : cert.route) s.route.push_back({approx(r[0]), approx(r[1]), approx(r[2])});
  if (cert.method == "chambers") picture_slabs(cert, s);
  describe_claim(cert, s);
  return s;
}

}  // namespace sweepcert
