// Chambers and routes in the prover: region predicates, slab classification, route checks.
#include <catch2/catch.hpp>

#include "chambers/engine.hpp"
#include "chambers/region.hpp"
#include "io/read_input.hpp"

using namespace sweepcert;

namespace {
Sweep load(const char* name) {
  return std::get<Sweep>(read_input(std::string(SWEEPCERT_CASES_DIR) + "/" + name + ".json").content);
}
}  // namespace

TEST_CASE("the fence polygon against points and boxes") {
  Sweep s = load("static-cover");  // fence around [0,8] x [0,8]
  Region region(s);
  CHECK(region.strictly_inside({4, 4}));
  CHECK_FALSE(region.strictly_inside({0, 4}));  // on an edge
  CHECK_FALSE(region.strictly_inside({0, 0}));  // a vertex
  CHECK_FALSE(region.strictly_inside({9, 4}));
  CHECK(region.box_outside({8, 0, 9, 1}));       // touches the boundary only
  CHECK(region.box_outside({-3, -3, -1, -1}));
  CHECK_FALSE(region.box_outside({7.5, 1, 8.5, 2}));  // straddles the edge x = 8
  CHECK_FALSE(region.box_outside({1, 1, 2, 2}));
}

TEST_CASE("a fully covered room has no open cell; a hole leaves free cells near its centre") {
  Square sq;
  Slab cover = classify_slab(load("static-cover"), 0, 1, 8, sq);
  std::size_t open = 0;
  for (std::uint32_t i = 0; i < cover.tree.size(); ++i) open += cover.tree.at(i).kind == CellKind::Open;
  CHECK(open == 0);
  Slab hole = classify_slab(load("static-hole"), 0, 1, 8, sq);
  // Hand derivation: with the sensor at (4,4) offline, (4,4) is at distance 2 > 3/2 from the
  // nearest sensors (2,4), (4,2), (6,4), (4,6), so a small box around it is free.
  bool free_at_centre = false;
  for (std::uint32_t i = 0; i < hole.tree.size(); ++i) {
    const Cell& c = hole.tree.at(i);
    BoxD b = sq.box(c);
    if (c.kind == CellKind::Open && c.free && b.x0 <= 4 && 4 <= b.x1 && b.y0 <= 4 && 4 <= b.y1)
      free_at_centre = true;
  }
  CHECK(free_at_centre);
}

TEST_CASE("route checks are exact") {
  Sweep s = load("static-hole");
  using Row = std::array<Rational, 3>;
  // Standing at the hole's centre: distance 2 from the nearest sensors of radius 3/2.
  CHECK(check_route(s, {Row{0, 4, 4}, Row{60, 4, 4}}) == "");
  // Walking onto the sensor at (2, 4) is refused, naming it.
  CHECK(check_route(s, {Row{0, 4, 4}, Row{60, 2, 4}}).find("P24") != std::string::npos);
  // Moving from (4, 4) to (4, 7/2): the end point is exactly 3/2 from the sensor at (4, 2), on
  // its closed disk -- refused (the route must stay strictly outside); 351/100 stays outside.
  CHECK_FALSE(check_route(s, {Row{0, 4, 4}, Row{60, 4, Rational(7, 2)}}).empty());
  CHECK(check_route(s, {Row{0, 4, 4}, Row{60, 4, Rational(351, 100)}}) == "");
  // Starting on the fence is refused.
  CHECK_FALSE(check_route(s, {Row{0, 0, 4}, Row{60, 4, 4}}).empty());
}

TEST_CASE("decisions on the bundled cases") {
  ChamberPlan plan;
  CHECK(decide_by_chambers(load("static-hole"), plan).outcome == ChamberResult::Outcome::Evasion);
  CHECK(decide_by_chambers(load("column-sweep"), plan).outcome == ChamberResult::Outcome::NoEvasion);
  CHECK(decide_by_chambers(load("pocket-wall"), plan).outcome == ChamberResult::Outcome::NoEvasion);
  ChamberPlan no_route = plan;
  no_route.try_route = false;
  no_route.rounds = 1;
  ChamberResult r = decide_by_chambers(load("static-hole"), no_route);
  CHECK(r.outcome == ChamberResult::Outcome::Undecided);
  CHECK(r.narrowest.find("near (") != std::string::npos);
}
