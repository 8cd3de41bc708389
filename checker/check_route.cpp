// §4.6: an evasion route. The route's rows and the sensors' waypoints cut the horizon into
// pieces on which both move linearly; on each piece the squared distance minus r^2 is a
// quadratic, tested exactly (cpp_rational) for strict positivity on the closed piece.
#include <algorithm>
#include <limits>

#include "errors.hpp"
#include "fields.hpp"
#include "polygon.hpp"
#include "positional.hpp"

namespace sweepcheck {

using json::Ref;

Point position(const Sensor& s, const Rat& t) {
  const std::vector<Rat>& ts = s.times;
  if (t <= ts.front()) return s.points.front();
  if (t >= ts.back()) return s.points.back();
  const std::size_t k = static_cast<std::size_t>(std::upper_bound(ts.begin(), ts.end(), t) - ts.begin());  // ts[k-1] <= t < ts[k]
  const Point &p = s.points[k - 1], &q = s.points[k];
  if (t == ts[k - 1]) return p;
  const Rat u = (t - ts[k - 1]) / (ts[k] - ts[k - 1]);
  return Point{p.x + u * (q.x - p.x), p.y + u * (q.y - p.y)};
}

std::string point_text(const Point& p) { return "(" + to_text(p.x) + ", " + to_text(p.y) + ")"; }

std::string sensor_text(const Input& in, std::uint32_t v) { return "sensor \"" + in.names.at(v) + "\""; }

namespace {

struct Failure {
  bool found = false;
  Rat t0, t1;          // the piece
  std::uint32_t sensor = 0;
  std::string detail;  // what was found on it
};

// A conservative integer box around a set of points, in units of 2^-kShift: floors of the
// minima, ceilings of the maxima. `ok` is false when a value is beyond +-2^50; then the box
// filters nothing.
constexpr int kShift = 10;
struct IntBox {
  std::int64_t x0 = 0, x1 = 0, y0 = 0, y1 = 0;
  bool ok = false;
};

bool scaled(const Rat& q, bool up, std::int64_t& out) {
  Int n = numerator(q) << kShift;
  const Int& d = denominator(q);
  Int f = n / d;  // truncates toward zero
  if (f * d != n && ((n < 0) != up)) f += up ? 1 : -1;
  if (abs(f) > (Int(1) << 50)) return false;
  out = static_cast<std::int64_t>(f);
  return true;
}

IntBox int_box(const Point& p, const Point& q) {
  IntBox b;
  b.ok = scaled(std::min(p.x, q.x), false, b.x0) && scaled(std::max(p.x, q.x), true, b.x1) &&
         scaled(std::min(p.y, q.y), false, b.y0) && scaled(std::max(p.y, q.y), true, b.y1);
  return b;
}

// Are the boxes farther apart than R (a scaled upper bound of r)? Then every point of one is
// more than r from every point of the other.
bool apart(const IntBox& a, const IntBox& b, __int128 R2) {
  if (!a.ok || !b.ok) return false;
  const std::int64_t gx = std::max<std::int64_t>({0, b.x0 - a.x1, a.x0 - b.x1});
  const std::int64_t gy = std::max<std::int64_t>({0, b.y0 - a.y1, a.y0 - b.y1});
  return __int128(gx) * gx + __int128(gy) * gy > R2;
}

struct Route {
  std::vector<Rat> t;
  std::vector<Point> p;
  std::vector<IntBox> legs;  // legs[r]: around rows r-1 and r (r >= 1)
  // The route at time t within leg r (t[r-1] <= t <= t[r]).
  Point at(const Rat& time, std::size_t r) const {
    if (time == t[r]) return p[r];
    if (time == t[r - 1]) return p[r - 1];
    const Rat u = (time - t[r - 1]) / (t[r] - t[r - 1]);
    return Point{p[r - 1].x + u * (p[r].x - p[r - 1].x), p[r - 1].y + u * (p[r].y - p[r - 1].y)};
  }
};

// Rule 2 for one sensor: the first failing piece, if any. Pieces whose route leg and sensor
// segment lie in integer boxes farther apart than r are passed without rational arithmetic;
// the others get the exact test of §4.6.
Failure first_failure(const Input& in, std::uint32_t v, const Route& route, Tally& tally) {
  const Sensor& s = in.sensors[v];
  const Rat r2 = s.radius * s.radius;
  std::int64_t rs = 0;
  const bool r_ok = scaled(s.radius, true, rs);
  const __int128 R2 = __int128(rs) * rs;
  const std::vector<Rat>& ts = s.times;
  // The sensor's segment boxes: seg[k] holds it on [ts[k-1], ts[k]] (held still at the ends).
  auto seg_box = [&](std::size_t k) {
    if (!r_ok) return IntBox{};
    if (k == 0) return int_box(s.points.front(), s.points.front());
    if (k == ts.size()) return int_box(s.points.back(), s.points.back());
    return int_box(s.points[k - 1], s.points[k]);
  };
  const Rat &h0 = route.t.front(), &h1 = route.t.back();
  std::size_t leg = 1;                                                                     // the route leg of the piece
  std::size_t k = static_cast<std::size_t>(std::upper_bound(ts.begin(), ts.end(), h0) - ts.begin());  // ts[k] > t0
  IntBox box = seg_box(k);
  Rat t0 = h0;
  bool have0 = false;  // are d0, e0 (the difference and f at t0) known?
  Point d0;
  Rat e0;
  auto exact = [&](const Rat& t, Point& d, Rat& e) {
    const Point g = route.at(t, leg), c = position(s, t);
    d = Point{g.x - c.x, g.y - c.y};
    e = d.x * d.x + d.y * d.y - r2;
  };
  while (t0 < h1) {
    const bool waypoint = k < ts.size() && ts[k] < route.t[leg];
    const Rat& t1 = waypoint ? ts[k] : route.t[leg];
    if (!apart(route.legs[leg], box, R2)) {
      ++tally.pieces_exact;
      Failure f{true, t0, t1, v, ""};
      if (!have0) {
        exact(t0, d0, e0);
        if (e0 <= 0) {
          f.detail = "at t=" + to_text(t0) + " (|route - centre|^2 - r^2 = " + to_text(e0) + " <= 0)";
          return f;
        }
      }
      Point d1;
      Rat e1;
      exact(t1, d1, e1);
      if (e1 <= 0) {
        f.detail = "at t=" + to_text(t1) + " (|route - centre|^2 - r^2 = " + to_text(e1) + " <= 0)";
        return f;
      }
      // On the piece, with sigma = (t - t0)/(t1 - t0) in [0, 1], d(sigma) = d0 + sigma w and
      // g(sigma) = A sigma^2 + B sigma + C: the same quadratic as f(t) up to this affine change
      // of variable, so the vertex test and the sign of 4AC - B^2 are those of §4.6.
      const Point w{d1.x - d0.x, d1.y - d0.y};
      const Rat A = w.x * w.x + w.y * w.y;
      if (A > 0) {
        const Rat B = 2 * (d0.x * w.x + d0.y * w.y);
        if (B < 0 && -B < 2 * A && !(4 * A * e0 - B * B > 0)) {
          const Rat tstar = t0 + (t1 - t0) * (-B / (2 * A));
          f.detail = "inside the piece: the squared distance minus r^2 has its minimum " +
                     to_text((4 * A * e0 - B * B) / (4 * A)) + " <= 0 at t=" + to_text(tstar);
          return f;
        }
      }
      d0 = std::move(d1);
      e0 = std::move(e1);
      have0 = true;
    } else {
      ++tally.pieces_filtered;
      have0 = false;
    }
    t0 = t1;
    if (waypoint) {
      ++k;  // ts[k] < route.t[leg]: still the same leg
      box = seg_box(k);
    } else {
      ++leg;
      if (k < ts.size() && ts[k] == t0) {  // a waypoint at a route time: the same time once
        ++k;
        box = seg_box(k);
      }
    }
  }
  return Failure{};
}

}  // namespace

std::string check_route(const Certificate& cert, const Input& in, std::ostream& out, Tally& tally) {
  try {
    Ref route = cert.members.need("route");
    expect_array(route, "/route", 2);
    Route rt_;
    std::vector<Rat>& rt = rt_.t;
    std::vector<Point>& rp = rt_.p;
    for (std::size_t r = 0; r < route.size(); ++r) {
      const std::string p = at("/route", r);
      expect_array(route[r], p, 3, 3);
      Rat t = get_rational(route[r][0], p + "/0");
      if (!rt.empty() && !(rt.back() < t))
        throw Rejected(p + "/0", "t=" + to_text(t), "route times must increase strictly, after t=" + to_text(rt.back()) +
                                                        " (§4.6)");
      rt.push_back(std::move(t));
      rp.push_back(Point{get_rational(route[r][1], p + "/1"), get_rational(route[r][2], p + "/2")});
      ++tally.route_rows;
    }
    if (rt.front() != in.horizon_start)
      throw Rejected("/route/0/0", "t=" + to_text(rt.front()),
                     "the route must start at the horizon start t=" + to_text(in.horizon_start) + " (§4.6)");
    if (rt.back() != in.horizon_end)
      throw Rejected(at("/route", rt.size() - 1) + "/0", "t=" + to_text(rt.back()),
                     "the route must end at the horizon end t=" + to_text(in.horizon_end) + " (§4.6)");

    // Rule 1.
    const FencePolygon polygon(in);
    std::size_t edge = 0;
    const Side side = polygon.locate(rp.front(), &edge);
    if (side != Side::Inside) {
      const std::size_t m = polygon.size();
      throw Rejected("/route/0", "point " + point_text(rp.front()),
                     side == Side::Boundary
                         ? "the first point lies on the boundary of the fence polygon, on the edge " +
                               sensor_text(in, polygon.ids[edge]) + " - " + sensor_text(in, polygon.ids[(edge + 1) % m]) +
                               ", not strictly inside P (rule 4.6.1)"
                         : std::string("the first point lies outside the fence polygon, not strictly inside P (rule 4.6.1)"));
    }
    tally.route_starts_inside = true;
    out << "route: " << rt.size() << " rows over the horizon [" << to_text(rt.front()) << ", " << to_text(rt.back())
        << "], starting strictly inside P (rule 4.6.1)\n";

    // Rule 2, every sensor; the first failing piece in time (ties: byte order of ids).
    rt_.legs.resize(rt.size());
    for (std::size_t r = 1; r < rt.size(); ++r) rt_.legs[r] = int_box(rp[r - 1], rp[r]);
    Failure first;
    for (std::uint32_t v = 0; v < in.vertex_count(); ++v) {
      Failure f = first_failure(in, v, rt_, tally);
      if (f.found && (!first.found || f.t0 < first.t0)) first = std::move(f);
      if (!f.found) ++tally.route_sensors;
    }
    if (first.found) {
      const std::size_t row = static_cast<std::size_t>(std::lower_bound(rt.begin(), rt.end(), first.t1) - rt.begin());
      throw Rejected(at("/route", row), "piece t=[" + to_text(first.t0) + ", " + to_text(first.t1) + "]",
                     "the route comes within the disk of " + sensor_text(in, first.sensor) + " " + first.detail +
                         " (rule 4.6.2)");
    }
    tally.route_clear = true;
    out << "route: stays strictly outside every sensor's disk (" << in.vertex_count()
        << " sensors, fence included) on every piece (rule 4.6.2)\n";
    return "an evasion path exists: the route starts strictly inside P and avoids every disk on [" +
           to_text(rt.front()) + ", " + to_text(rt.back()) + "] (§4.6)";
  } catch (const FieldError& e) {
    throw Rejected(e.pointer, "", e.message);
  }
}

}  // namespace sweepcheck
