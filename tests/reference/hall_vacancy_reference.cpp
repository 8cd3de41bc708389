// Reference test: the chamber computation's cells (classify_slab, schema/README.md §4.5,
// shared/DESIGN.md §3.3) against a published formula for random coverage (DESIGN §6).
//
// Published formula (P. Hall, Introduction to the Theory of Coverage Processes, Wiley 1988;
// the Boolean model): in a Poisson field of intensity lambda of closed disks of radius
// r, a fixed point is uncovered with probability exp(-lambda pi r^2) (the number of centres
// within distance r of it is Poisson with mean lambda pi r^2). By Fubini the expected
// uncovered fraction of any fixed window W is the same number.
//
// Set-up: a 40 x 40 square fence (fence disks of radius 5/4 every 2 units), four windows
// W_q = [a, a+15] x [b, b+15], a, b in {4, 20}, well inside the fence band, and a Poisson
// number of disks of radius r = 1/2 with centres uniform in the square [4 - r, 35 + r]^2 (the
// windows' hull enlarged by r: every disk that can meet a window is sampled; disks elsewhere
// would not change the windows). One slab [0, 1] of the static configuration is classified
// with cells of side 1/128 (square side 64, depth 13). Inside a window, cells are covered,
// open-and-free (no disk meets them: surely uncovered) or open-but-not-free (partly covered,
// or covered by the union without lying in one disk). So for each window, exactly,
//     free area / |W_q|  <=  uncovered fraction  <=  open area / |W_q|,
// whatever the cell size; the gap is the discretisation band (about one cell width along the
// boundary of the union, some 0.01-0.015 here). Two loads are checked, lambda pi r^2 = 1 and 2.
//
// Tolerance: the windows are 1 = 2r apart, so no disk meets two of them and the uncovered
// fractions of the 4 windows of a field, and of different fields, are independent samples
// (24 per load). The mean lower bound L and mean upper bound U bracket the mean uncovered
// fraction, whose expectation is exp(-lambda pi r^2). The sampling error of these means is
// estimated from the samples: SE = (largest sample standard deviation of the per-window lower,
// upper and mid values) / sqrt(24). The check is
//     L - 4 SE  <=  exp(-lambda pi r^2)  <=  U + 4 SE;
// by the t distribution with 23 degrees of freedom a correct computation fails one side with
// probability below 3e-4 even ignoring the band (the seeds are fixed, so the outcome is
// reproducible). The band is checked to be narrow (U - L < 0.02) so that the comparison has
// teeth, and the measured values are printed. Centres are drawn on the grid of multiples of
// 2^-20 of the sampling square (exact rationals); that discretisation of the uniform law is far
// below everything else here.
#define CATCH_CONFIG_MAIN
#include <catch2/catch.hpp>

#include <chrono>
#include <cmath>
#include <cstdint>
#include <iostream>
#include <random>
#include <thread>
#include <string>
#include <vector>

#include "chambers/engine.hpp"
#include "model/sweep.hpp"

namespace {

using sweepcert::Rational;

// Four windows W_q = [a, a + 15] x [b, b + 15], a, b in {4, 20}: 1 = 2r apart, so no disk meets
// two of them and their uncovered fractions are independent samples.
constexpr long kWin[2] = {4, 20};
constexpr long kWinSide = 15;

struct FieldResult {
  double lower[4] = {}, upper[4] = {};  // free and open area inside each W_q, over |W_q|
  std::size_t disks = 0, cells = 0;
  double cell_side = 0;
};

// One Poisson field; `load` = lambda pi r^2.
FieldResult run_field(std::uint64_t seed, double load, const Rational& r, int depth) {
  std::mt19937_64 rng(seed);
  const long side = 40, w0 = kWin[0], w1 = kWin[1] + kWinSide;  // fence [0, 40]^2, windows in [w0, w1]^2
  sweepcert::Sweep s;
  s.t_start = 0;
  s.t_end = 1;
  auto add = [&](const std::string& id, const Rational& rad, const Rational& x, const Rational& y) {
    sweepcert::Sensor sen;
    sen.id = id;
    sen.radius = rad;
    sen.track.push_back({Rational(0), x, y});  // one row: static
    s.sensors.push_back(sen);
  };
  // Fence: counter-clockwise around the square, every 2 units; consecutive disks overlap.
  std::vector<std::pair<long, long>> fence;
  for (long x = 0; x < side; x += 2) fence.push_back({x, 0});
  for (long y = 0; y < side; y += 2) fence.push_back({side, y});
  for (long x = side; x > 0; x -= 2) fence.push_back({x, side});
  for (long y = side; y > 0; y -= 2) fence.push_back({0, y});
  for (std::size_t i = 0; i < fence.size(); ++i)
    add("F" + std::to_string(i), Rational(5, 4), fence[i].first, fence[i].second);
  s.fence_count = fence.size();

  // Poisson field on the enlarged window E = [w0 - r, w1 + r]^2.
  const double rd = r.get_d();
  const double e0 = w0 - rd, e1 = w1 + rd;
  const double lambda = load / (M_PI * rd * rd);
  const long n = std::poisson_distribution<long>(lambda * (e1 - e0) * (e1 - e0))(rng);
  const std::int64_t grid = std::int64_t(1) << 20;
  const Rational lo = w0 - r, width = Rational(w1 - w0) + 2 * r;
  std::uniform_int_distribution<std::int64_t> u(0, grid);
  for (long k = 0; k < n; ++k) {
    Rational x = lo + width * Rational(u(rng)) / Rational(grid);
    Rational y = lo + width * Rational(u(rng)) / Rational(grid);
    add("D" + std::to_string(k), r, x, y);
  }

  sweepcert::Square square;
  sweepcert::Slab slab = sweepcert::classify_slab(s, Rational(0), Rational(1), depth, square);

  FieldResult out;
  out.cell_side = square.side / std::ldexp(1.0, depth);
  out.disks = std::size_t(n);
  out.cells = slab.tree.size();
  double free_area[4] = {}, open_area[4] = {};
  for (std::uint32_t i = 0; i < slab.tree.size(); ++i) {
    const sweepcert::Cell& c = slab.tree.at(i);
    if (c.kind != sweepcert::CellKind::Open) continue;
    sweepcert::BoxD b = square.box(c);
    for (int q = 0; q < 4; ++q) {
      double x0 = double(kWin[q & 1]), y0 = double(kWin[q >> 1]);
      double dx = std::min(b.x1, x0 + kWinSide) - std::max(b.x0, x0);
      double dy = std::min(b.y1, y0 + kWinSide) - std::max(b.y0, y0);
      if (dx <= 0 || dy <= 0) continue;
      open_area[q] += dx * dy;  // dyadic products and sums: exact in double
      if (c.free) free_area[q] += dx * dy;
    }
  }
  const double area = double(kWinSide) * double(kWinSide);
  for (int q = 0; q < 4; ++q) {
    out.lower[q] = free_area[q] / area;
    out.upper[q] = open_area[q] / area;
  }
  return out;
}

double mean(const std::vector<double>& v) {
  double s = 0;
  for (double x : v) s += x;
  return s / double(v.size());
}
double stddev(const std::vector<double>& v) {
  double m = mean(v), s = 0;
  for (double x : v) s += (x - m) * (x - m);
  return std::sqrt(s / double(v.size() - 1));
}

}  // namespace

TEST_CASE("uncovered area of a Poisson disk field matches exp(-lambda pi r^2) (Hall 1988)",
          "[hall][chambers]") {
  const int kFields = 6;
  const int kDepth = 13;  // square side 64 -> cells of side 1/128
  const Rational r(1, 2);
  for (double load : {1.0, 2.0}) {
    // Fields are independent (one seed each) and classified on two threads; Catch2 assertions
    // stay on this thread.
    std::vector<FieldResult> fields(kFields);
    auto t0 = std::chrono::steady_clock::now();
    auto work = [&](int first) {
      for (int k = first; k < kFields; k += 2)
        fields[k] = run_field(std::uint64_t(19880000 + 1000 * load + k), load, r, kDepth);
    };
    std::thread other(work, 1);
    work(0);
    other.join();
    std::vector<double> lower, upper, mid;
    std::size_t disks = 0, cells = 0;
    for (const FieldResult& f : fields) {
      REQUIRE(f.cell_side == 1.0 / 128);
      for (int q = 0; q < 4; ++q) {
        REQUIRE(f.lower[q] <= f.upper[q]);
        lower.push_back(f.lower[q]);
        upper.push_back(f.upper[q]);
        mid.push_back(0.5 * (f.lower[q] + f.upper[q]));
      }
      disks += f.disks;
      cells += f.cells;
    }
    double secs = std::chrono::duration<double>(std::chrono::steady_clock::now() - t0).count();
    const double expected = std::exp(-load);  // Hall (1988): vacancy probability exp(-lambda pi r^2)
    const double se = std::max({stddev(lower), stddev(upper), stddev(mid)}) / std::sqrt(double(mid.size()));
    const double L = mean(lower), U = mean(upper);
    std::cout << "[hall_vacancy_reference] lambda pi r^2 = " << load << ": exp(-" << load
              << ") = " << expected << "; mean free fraction " << L << ", mean open fraction " << U
              << ", SE " << se << ", band [" << L - 4 * se << ", " << U + 4 * se << "]; " << kFields
              << " fields (" << mid.size() << " windows), " << disks / kFields << " disks and "
              << cells / kFields << " cells per field, " << secs << " s\n";
    INFO("lambda pi r^2 = " << load << ", free " << L << ", open " << U << ", SE " << se);
    CHECK(U - L < 0.02);                 // the discretisation band is narrow
    CHECK(L - 4 * se <= expected);       // Hall (1988), exp(-lambda pi r^2)
    CHECK(expected <= U + 4 * se);
  }
}
