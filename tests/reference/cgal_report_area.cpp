// Reference test: the uncovered-area samples that `sweepcert report` writes into its page
// (report/area.cpp: Green's theorem on the boundary pieces, in doubles) against CGAL.
//
// CGAL's 2D regularized Boolean set operations (General_polygon_set_2 with
// Gps_circle_segment_traits_2 over Epeck) compute R = P \ (union of all disks) exactly: its
// boundary is a set of segments and circular arcs with algebraic endpoints. The area of R is then
// summed from that boundary with Green's theorem, area = sum over polygons with holes of
// |∮ x dy over the outer boundary| - |∮ x dy over each hole|, where a segment contributes
// (x1 + x2)/2 (y2 - y1) and an arc of the circle (c, r) from angle a to b (in its own direction)
// c_x r (sin b - sin a) + r^2 ((b - a)/2 + (sin 2b - sin 2a)/4). Only that final sum is in
// doubles. The report's stated tolerance (report/area.hpp, also written into the page) is
// kAreaRelTolerance x area(P) per sample.
#define CATCH_CONFIG_MAIN
#include <catch2/catch.hpp>

#include <CGAL/Exact_predicates_exact_constructions_kernel.h>
#include <CGAL/General_polygon_set_2.h>
#include <CGAL/Gps_circle_segment_traits_2.h>

#include <boost/variant.hpp>

#include <algorithm>
#include <cmath>
#include <cstdlib>
#include <fstream>
#include <iostream>
#include <list>
#include <random>
#include <nlohmann/json.hpp>
#include <sstream>
#include <type_traits>

#include "io/read_input.hpp"
#include "report/area.hpp"

namespace {

using Kernel = CGAL::Exact_predicates_exact_constructions_kernel;
using Traits = CGAL::Gps_circle_segment_traits_2<Kernel>;
using PolygonSet = CGAL::General_polygon_set_2<Traits>;
using GPolygon = Traits::General_polygon_2;
using KPoint = Kernel::Point_2;
using KCircle = Kernel::Circle_2;
using FT = Kernel::FT;
using ET = std::decay_t<decltype(CGAL::exact(FT()))>;
const double kPi = std::acos(-1.0);

FT ft(const sweepcert::Rational& q) { return FT(ET(q.get_mpq_t())); }

struct ExactDisk {
  sweepcert::Rational x, y, r;
};

GPolygon circle_polygon(const ExactDisk& d) {
  Traits traits;
  Traits::Curve_2 curve(KCircle(KPoint(ft(d.x), ft(d.y)), ft(d.r) * ft(d.r)));
  std::list<boost::variant<Traits::Point_2, Traits::X_monotone_curve_2>> pieces;
  traits.make_x_monotone_2_object()(curve, std::back_inserter(pieces));
  GPolygon pgn;
  for (const auto& p : pieces) pgn.push_back(boost::get<Traits::X_monotone_curve_2>(p));
  return pgn;
}

// P through the given vertices, made counter-clockwise, collinear vertices dropped.
GPolygon region_polygon(const std::vector<std::pair<sweepcert::Rational, sweepcert::Rational>>& v) {
  std::vector<KPoint> pts;
  for (std::size_t i = 0; i < v.size(); ++i) {
    KPoint p(ft(v[(i + v.size() - 1) % v.size()].first), ft(v[(i + v.size() - 1) % v.size()].second));
    KPoint q(ft(v[i].first), ft(v[i].second));
    KPoint r(ft(v[(i + 1) % v.size()].first), ft(v[(i + 1) % v.size()].second));
    if (CGAL::orientation(p, q, r) != CGAL::COLLINEAR) pts.push_back(q);
  }
  FT twice_area = 0;
  for (std::size_t i = 0; i < pts.size(); ++i) {
    const KPoint &a = pts[i], &b = pts[(i + 1) % pts.size()];
    twice_area += a.x() * b.y() - b.x() * a.y();
  }
  if (twice_area < 0) std::reverse(pts.begin(), pts.end());
  GPolygon pgn;
  for (std::size_t i = 0; i < pts.size(); ++i)
    pgn.push_back(Traits::X_monotone_curve_2(pts[i], pts[(i + 1) % pts.size()]));
  return pgn;
}

double boundary_integral(const GPolygon& pgn) {
  double sum = 0;
  for (auto it = pgn.curves_begin(); it != pgn.curves_end(); ++it) {
    double sx = CGAL::to_double(it->source().x()), sy = CGAL::to_double(it->source().y());
    double tx = CGAL::to_double(it->target().x()), ty = CGAL::to_double(it->target().y());
    if (it->is_linear()) {
      sum += (sx + tx) / 2 * (ty - sy);
      continue;
    }
    const KCircle& c = it->supporting_circle();
    double cx = CGAL::to_double(c.center().x()), cy = CGAL::to_double(c.center().y());
    double r = std::sqrt(CGAL::to_double(c.squared_radius()));
    double a = std::atan2(sy - cy, sx - cx), b = std::atan2(ty - cy, tx - cx);
    // An x-monotone arc spans at most a half turn, in the direction orientation() gives.
    double d = std::remainder(b - a, 2 * kPi);
    if (it->orientation() == CGAL::COUNTERCLOCKWISE && d < -kPi / 2) d += 2 * kPi;
    if (it->orientation() == CGAL::CLOCKWISE && d > kPi / 2) d -= 2 * kPi;
    b = a + d;
    sum += cx * r * (std::sin(b) - std::sin(a)) + r * r * ((b - a) / 2 + (std::sin(2 * b) - std::sin(2 * a)) / 4);
  }
  return sum;
}

double cgal_uncovered_area(const std::vector<std::pair<sweepcert::Rational, sweepcert::Rational>>& region,
                           const std::vector<ExactDisk>& disks) {
  std::vector<GPolygon> circles;
  for (const ExactDisk& d : disks) circles.push_back(circle_polygon(d));
  PolygonSet uni;
  uni.join(circles.begin(), circles.end());
  PolygonSet rest(region_polygon(region));
  rest.difference(uni);
  std::list<Traits::General_polygon_with_holes_2> parts;
  rest.polygons_with_holes(std::back_inserter(parts));
  double area = 0;
  for (const auto& pwh : parts) {
    area += std::abs(boundary_integral(pwh.outer_boundary()));
    for (auto h = pwh.holes_begin(); h != pwh.holes_end(); ++h) area -= std::abs(boundary_integral(*h));
  }
  return area;
}

using sweepcert::Rational;

}  // namespace

TEST_CASE("the CGAL reference itself on hand-derived areas", "[cgal][report]") {
  std::vector<std::pair<Rational, Rational>> sq = {{0, 0}, {4, 0}, {4, 4}, {0, 4}};
  // One disk inside: 16 - pi (hole in the result).
  CHECK(std::abs(cgal_uncovered_area(sq, {{2, 2, 1}}) - (16 - kPi)) < 1e-12);
  // Centred on a corner: 16 - pi/4 (arc on the outer boundary).
  CHECK(std::abs(cgal_uncovered_area(sq, {{0, 0, 1}}) - (16 - kPi / 4)) < 1e-12);
  // Two unit disks at distance 1: union 2pi - (2pi/3 - sqrt(3)/2) (circle-circle lens).
  CHECK(std::abs(cgal_uncovered_area(sq, {{Rational(3, 2), 2, 1}, {Rational(5, 2), 2, 1}}) -
                 (16 - 2 * kPi + 2 * kPi / 3 - std::sqrt(3.0) / 2)) < 1e-12);
}

TEST_CASE("report uncovered-area samples agree with CGAL's exact region", "[cgal][report]") {
  const std::string bin = SWEEPCERT_BIN, work = REPORT_WORKDIR, input = std::string(CASES_DIR) + "/pocket-wall.json";
  REQUIRE(std::system(("mkdir -p " + work).c_str()) == 0);
  const std::string cert = work + "/pocket-wall.cert.json", page = work + "/pocket-wall.html";
  REQUIRE(std::system((bin + " prove " + input + " -o " + cert + " --quiet").c_str()) == 0);
  REQUIRE(std::system((bin + " report " + input + " " + cert + " -o " + page).c_str()) == 0);

  std::ifstream f(page);
  std::stringstream ss;
  ss << f.rdbuf();
  const std::string html = ss.str(), open = "<script type=\"application/json\" id=\"report-data\">";
  auto p = html.find(open);
  REQUIRE(p != std::string::npos);
  p += open.size();
  nlohmann::json data = nlohmann::json::parse(html.substr(p, html.find("</script>", p) - p));
  const auto& area = data.at("area");
  const std::size_t n = area.at("t_exact").size();
  REQUIRE(n >= 201);

  sweepcert::Sweep sweep = std::get<sweepcert::Sweep>(sweepcert::read_input(input).content);
  std::vector<std::pair<Rational, Rational>> region;
  for (std::size_t i = 0; i < sweep.fence_count; ++i) region.push_back({sweep.sensors[i].track[0].x, sweep.sensors[i].track[0].y});
  const double tolerance = area.at("tolerance").get<double>();
  REQUIRE(tolerance > 0);
  for (std::size_t k : {n / 4, n / 2, 3 * n / 4}) {
    std::string why;
    Rational t = *sweepcert::parse_exact(area.at("t_exact")[k].get<std::string>(), &why);
    std::vector<ExactDisk> disks;
    for (std::size_t i = 0; i < sweep.sensors.size(); ++i) {
      sweepcert::Point c = sweep.position(i, t);
      disks.push_back({c.x, c.y, sweep.sensors[i].radius});
    }
    double expected = cgal_uncovered_area(region, disks);
    double got = area.at("uncovered")[k].get<double>();
    std::cout << "[cgal_report_area] t = " << sweepcert::to_text(t) << ": report " << got << ", CGAL "
              << expected << ", difference " << std::abs(got - expected) << " (tolerance " << tolerance << ")\n";
    INFO("t = " << sweepcert::to_text(t));
    CHECK(std::abs(got - expected) <= tolerance);
  }
}

TEST_CASE("uncovered_area agrees with CGAL on random and degenerate configurations", "[cgal][report]") {
  // Random disks on an L-shaped P (12 x 8 without its 6 x 4 north-east block, area 72). Centres and
  // radii on a grid of quarters, so exact tangencies, circles through polygon vertices, repeated
  // disks and three circles through one point all occur; the stated tolerance must hold anyway.
  std::mt19937_64 rng(7);
  auto quarter = [&](int lo, int hi) { return Rational(std::uniform_int_distribution<int>(lo, hi)(rng), 4); };
  std::vector<std::pair<Rational, Rational>> region = {{0, 0}, {12, 0}, {12, 4}, {6, 4}, {6, 8}, {0, 8}};
  std::vector<sweepcert::Vec2> poly;
  for (const auto& [x, y] : region) poly.push_back({x.get_d(), y.get_d()});
  const double tolerance = sweepcert::kAreaRelTolerance * 72;
  double worst = 0;
  for (int trial = 0; trial < 60; ++trial) {
    std::vector<ExactDisk> disks;
    std::vector<sweepcert::Circle> circles;
    int n = std::uniform_int_distribution<int>(1, 25)(rng);
    for (int i = 0; i < n; ++i) {
      ExactDisk d{quarter(-4, 52), quarter(-4, 36), quarter(2, 12)};
      if (i > 0 && trial % 5 == 0) d = disks[std::size_t(i) / 2];  // repeats
      disks.push_back(d);
      circles.push_back({{d.x.get_d(), d.y.get_d()}, d.r.get_d()});
    }
    double expected = cgal_uncovered_area(region, disks);
    double got = sweepcert::uncovered_area(poly, circles);
    worst = std::max(worst, std::abs(got - expected));
    INFO("trial " << trial << ": " << n << " disks");
    CHECK(std::abs(got - expected) <= tolerance);
  }
  std::cout << "[cgal_report_area] 60 random configurations: largest difference " << worst << " (tolerance "
            << tolerance << ")\n";
}
