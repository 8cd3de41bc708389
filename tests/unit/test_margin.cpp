// Margins (schema §4.1.1): the adjusted sweep, the §2.1 radius rules it must still meet, and
// the decisions on the loading hall (cases/column-sweep.json, cases/column-gap.json).
//
// Geometry of the hall, from cases/make_cases.py: fence disks of radius 3/2 every 2 units
// around [0, 20] x [0, 10] (corners included, so every two consecutive centres are exactly 2
// apart); robots of radius 3/2 at heights 1, 3, 5, 7, 9 move from x = 0 to x = 20 during
// [0, 20], so the column stands on the line x = t. column-gap lacks the robot at height 5.
#include <catch2/catch.hpp>

#include "chambers/engine.hpp"
#include "io/read_input.hpp"
#include "sheet/solve.hpp"
#include "stack/stack.hpp"

using namespace sweepcert;
using Outcome = ChamberResult::Outcome;

namespace {

Sweep hall(const char* name) {
  return std::get<Sweep>(read_input(std::string(SWEEPCERT_CASES_DIR) + "/" + name + ".json").content);
}

ChamberPlan routes_only(int rounds) {
  ChamberPlan plan;
  plan.try_chambers = false;
  plan.rounds = rounds;
  return plan;
}

}  // namespace

TEST_CASE("adjusted changes every radius, fence and mobile, and nothing else") {
  Sweep s = hall("column-sweep");
  for (Rational delta : {Rational(-1, 4), Rational(1, 3)}) {
    Sweep d = adjusted(s, delta);
    REQUIRE(d.sensors.size() == s.sensors.size());
    CHECK(d.fence_count == s.fence_count);
    CHECK(d.t_start == s.t_start);
    CHECK(d.t_end == s.t_end);
    for (std::size_t i = 0; i < s.sensors.size(); ++i) {
      CHECK(d.sensors[i].id == s.sensors[i].id);
      CHECK(d.sensors[i].radius == s.sensors[i].radius + delta);
      REQUIRE(d.sensors[i].track.size() == s.sensors[i].track.size());
      for (std::size_t k = 0; k < s.sensors[i].track.size(); ++k) {
        CHECK(d.sensors[i].track[k].t == s.sensors[i].track[k].t);
        CHECK(d.sensors[i].track[k].x == s.sensors[i].track[k].x);
        CHECK(d.sensors[i].track[k].y == s.sensors[i].track[k].y);
      }
    }
  }
}

TEST_CASE("the reduced hall keeps its fence up to margin 1/2, its radii up to 3/2") {
  // Consecutive fence centres are 2 apart; reduced by M they still meet iff
  // 2 <= 2 (3/2 - M), i.e. M <= 1/2 (at 1/2 exactly they touch). Radii reach 0 at M = 3/2; the
  // first sensor, F0, is named first.
  Sweep s = hall("column-sweep");
  std::size_t at = 99;
  CHECK(radius_problem(s, &at) == "");
  CHECK(radius_problem(adjusted(s, Rational(-1, 2))) == "");
  CHECK(radius_problem(adjusted(s, Rational(-3, 5)), &at) ==
        "fence gap: the disks of F0 and F1 do not meet, so the fence edge between them is not "
        "covered");
  CHECK(at == 1);
  CHECK(radius_problem(adjusted(s, Rational(-3, 2)), &at) == "the radius of F0 is 0, not positive");
  CHECK(at == 0);
  CHECK(radius_problem(adjusted(s, Rational(-2)), &at) == "the radius of F0 is -1/2, not positive");
  // Enlarging never breaks the rules.
  CHECK(radius_problem(adjusted(s, Rational(5))) == "");
}

TEST_CASE("margin 1/4: the reduced column still has a sheet, the enlarged gap still a route") {
  // Reduced by 1/4 (radius 5/4): robots 2 apart still meet (2 <= 5/2), and the bottom robot at
  // (t, 1) meets the lens of two fence disks at (2k, 0), (2k+2, 0): the lens reaches height
  // sqrt(25/16 - 1) = 3/4 at x = 2k+1, and |(x - 2k - 1, 1/4)| <= 5/4 for |x - 2k - 1| <= 1.
  // So the column is a covered wall from the bottom fence to the top one that sweeps the hall
  // from the left side to the right side: a sheet exists.
  SheetOutcome o = solve_sheet(stack_of_sweep(adjusted(hall("column-sweep"), Rational(-1, 4)),
                                              FramePlan{}),
                               Ring::Z);
  CHECK(o.sheet);
  // Enlarged by 1/4 (radius 7/4): the robots at heights 3 and 7 leave the point (t, 5) at
  // distance 2 > 7/4, the fence is 5 > 7/4 away from height 5: standing at height 5 is safe
  // with clearance 1/4, so a route exists.
  Sweep grown = adjusted(hall("column-gap"), Rational(1, 4));
  ChamberResult r = decide_by_chambers(grown, routes_only(4));
  REQUIRE(r.outcome == Outcome::Evasion);
  CHECK(check_route(grown, r.route) == "");
  // A route clear of the enlarged disks is clear of the stated ones.
  CHECK(check_route(hall("column-gap"), r.route) == "");
}

TEST_CASE("margin 1/2: the enlarged gap closes, so no route exists") {
  // Radius 2: the robots at heights 3 and 7 touch at (t, 5) at every time, and the column,
  // touching the fence at both ends, is a closed wall sweeping the hall. No resolution can find
  // a route; one round suffices to say so.
  ChamberResult r = decide_by_chambers(adjusted(hall("column-gap"), Rational(1, 2)), routes_only(1));
  CHECK(r.outcome == Outcome::Undecided);
}

TEST_CASE("routes only: an emptied live set ends the search in the round it empties") {
  // The full column sweeps every point of the hall, so the live set empties; searching for
  // routes beyond that round is pointless. Both plans build the same slabs in every round.
  Sweep s = hall("column-sweep");
  ChamberPlan chambers_only;
  chambers_only.try_route = false;
  ChamberResult safe = decide_by_chambers(s, chambers_only);
  REQUIRE(safe.outcome == Outcome::NoEvasion);
  ChamberResult r = decide_by_chambers(s, routes_only(4));
  CHECK(r.outcome == Outcome::Undecided);
  CHECK(r.no_route);
  CHECK(r.rounds_used == safe.rounds_used);
  CHECK(r.narrowest.rfind("no route can exist: the live set is empty between t = ", 0) == 0);
}
