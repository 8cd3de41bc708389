// `--explain` (checker.hpp Options): the auditor's account, one per certificate kind, on
// hand-built certificates. The counts it prints are compared with numbers the test knows
// independently: rows it wrote itself, tokens of its own trees, pieces derived by hand.
#include <catch2/catch.hpp>

#include <cstdio>
#include <sstream>
#include <vector>

#include "helpers.hpp"

using namespace sweepcheck_test;
using Catch::Matchers::Contains;
using Catch::Matchers::StartsWith;

namespace {

Run explained(const std::string& input, std::string cert, const std::string& name = "scene.json") {
  replace_all(cert, "@HASH", sweepcheck::sha256_hex(input));
  sweepcheck::Options options;
  options.explain = true;
  options.input_name = name;
  std::ostringstream out, err;
  Run r;
  r.code = sweepcheck::check_texts(input, cert, out, err, options);
  r.out = out.str();
  r.err = err.str();
  return r;
}

// The line of `out` that begins with `prefix` ("" if none).
std::string line(const std::string& out, const std::string& prefix) {
  std::istringstream in(out);
  for (std::string l; std::getline(in, l);)
    if (starts_with(l, prefix)) return l;
  return "";
}

// The account comes first, then the findings, then the verdict.
void account_before_findings(const Run& r) {
  INFO(r.out);
  const auto account = r.out.find("== sweepcheck --explain");
  const auto findings = r.out.find("\ninput: sweepcert-");
  CHECK(account == 0);
  CHECK(findings != std::string::npos);
  CHECK(r.out.find("== findings follow; the last line gives the verdict ==\ninput: ") < findings + 1);
}

std::string join(const std::vector<std::string>& rows) {
  std::string s = "[";
  for (std::size_t i = 0; i < rows.size(); ++i) s += (i ? ", " : "") + rows[i];
  return s + "]";
}

// The room with a title, and C standing at (2,2) with waypoints at t = 0, 5 and 10.
std::string titled_room() {
  std::string s = room(R"({"id": "C", "radius": "1.5", "track": [["0", "2", "2"], ["5", "2", "2"], ["10", "2", "2"]]})");
  replace_all(s, R"({"format": "sweepcert-scenario-1",)", R"({"format": "sweepcert-scenario-1", "title": "Pump room, test",)");
  return s;
}

const char* kFence[8] = {"F0", "F1", "F2", "F3", "F4", "F5", "F6", "F7"};

// The fan around C at frame k (witness: the midpoint of the hypotenuse of each right isosceles
// triple, sqrt 2 from all three centres; see test_margin.cpp).
std::vector<std::string> fan(int k) {
  const char* w[8] = {R"("1", "1")", R"("3", "1")", R"("3", "1")", R"("3", "3")",
                      R"("3", "3")", R"("1", "3")", R"("1", "3")", R"("1", "1")"};
  std::vector<std::string> rows;
  for (int i = 0; i < 8; ++i)
    rows.push_back("[" + std::to_string(k) + R"(, "C", ")" + kFence[i] + R"(", ")" + kFence[(i + 1) % 8] + R"(", "1", )" +
                   w[i] + "]");
  return rows;
}

// The fence prisms over slab k: d = L_k - L_{k+1} (the fence verticals cancel in pairs).
std::vector<std::string> fence_prisms(int k) {
  std::vector<std::string> rows;
  for (int i = 0; i < 8; ++i)
    rows.push_back("[" + std::to_string(k) + R"(, ")" + kFence[i] + R"(", ")" + kFence[(i + 1) % 8] + R"(", "1"])");
  return rows;
}

}  // namespace

TEST_CASE("--explain on a positional sheet", "[explain][sheet]") {
  const std::string input = titled_room();
  // Frames 0, 5, 10; fence prisms over slabs 0 and 1 and the fan at frame 2:
  // d = (L_0 - L_1) + (L_1 - L_2) + L_2 = L_0, winding 1.
  std::vector<std::string> triangles = fan(2), prisms = fence_prisms(0);
  for (const std::string& p : fence_prisms(1)) prisms.push_back(p);
  const std::size_t T = triangles.size(), P = prisms.size();
  const std::string cert = certificate("sheet", "sweepcert-scenario-1", "z", R"(["0", "5", "10"])",
                                       R"("winding": "1", "triangles": )" + join(triangles) + R"(, "prisms": )" + join(prisms));
  Run r = explained(input, cert, "pump.json");
  INFO(r.out << r.err);
  REQUIRE(r.code == 0);
  CHECK_THAT(r.last(), StartsWith("ACCEPTED"));
  account_before_findings(r);
  CHECK(line(r.out, "  claim:") == "  claim: no-evasion, by the method \"sheet\" over the ring z (the integers).");
  CHECK_THAT(r.out, Contains("(covered: the frames [0, 10], hence the whole horizon)"));
  CHECK_THAT(r.out, Contains("  margin: 0. Positions and radii are taken exactly as stated"));
  CHECK(line(r.out, "  file:") == "  file: pump.json (" + std::to_string(input.size()) + " bytes)");
  CHECK(line(r.out, "  title:") == "  title: \"Pump room, test\"");
  CHECK(line(r.out, "  SHA-256:") == "  SHA-256: " + sweepcheck::sha256_hex(input));
  CHECK(line(r.out, "  sensors:") == "  sensors: 8 fence, 1 mobile");
  CHECK(line(r.out, "  horizon:") == "  horizon: [0, 10]");
  CHECK_THAT(r.out, Contains("moves in a straight line at constant speed between consecutive waypoints"));
  CHECK_THAT(r.out, Contains("site-specific security practice"));
  CHECK(line(r.out, "  hash binding:") ==
        "  hash binding: 1 file (" + std::to_string(input.size()) + " bytes) has the SHA-256 the certificate names");
  // C's waypoint t=5 is the one strictly between the first and last frame.
  CHECK(line(r.out, "  frames:") ==
        "  frames: 3 checked within the horizon; 1 waypoint times between the first and last frame found among them");
  CHECK(line(r.out, "  cells exist:") == "  cells exist: " + std::to_string(T) + " triangles (exact witness for " +
                                              std::to_string(T) + " triples), " + std::to_string(P) +
                                              " prisms (edge present at both ends: " + std::to_string(2 * P) + " tests)");
  CHECK(line(r.out, "  distinct cells") == "  distinct cells, nonzero coefficients: " + std::to_string(T + P) + " rows");
  // Faces: 3 per triangle, 4 per prism. Distinct 1-cells, frame by frame: at 0 the 8 fence edges
  // and 8 fence verticals (slab 0); at 1 the same 8 edges at frame 1 (tops of slab 0, bottoms of
  // slab 1) and 8 verticals of slab 1; at 2 the 8 fence edges (prism tops and fan rims) and the 8
  // spokes [C, F_i]: 48 cells. Nonzero: only L_0's 8 edges (the rest cancel as in d above).
  CHECK(line(r.out, "  boundary:") == "  boundary: " + std::to_string(3 * T + 4 * P) +
                                          " faces summed into 48 cells; the 8 nonzero ones all lie on the fence cylinder");
  CHECK_THAT(line(r.out, "  winding:"), StartsWith("  winding: winding number 1 along each of the 8 fence edges"));

  // Without --explain nothing of the account is printed.
  Run plain = run(input, cert);
  CHECK(plain.code == 0);
  CHECK(plain.out.find("==") == std::string::npos);
  CHECK(plain.out.find("What is claimed") == std::string::npos);
  CHECK(r.out.substr(r.out.find("\ninput: sweepcert-") + 1) == plain.out);
}

TEST_CASE("--explain on a contact-log sheet", "[explain][sheet]") {
  // The hub log of test_sheet.cpp: four fence ids and a hub H, fan triples at t=0 and t=1.
  const std::string log = R"({"format": "sweepcert-contacts-1", "fence": ["F0", "F1", "F2", "F3"], "sensors": ["H"],
    "triangles": "listed",
    "frames": [
      {"t": "0", "pairs": [["F0", "F1"], ["F1", "F2"], ["F2", "F3"], ["F3", "F0"], ["H", "F0"], ["H", "F1"], ["H", "F2"], ["H", "F3"]],
       "triples": [["H", "F0", "F1"], ["H", "F1", "F2"], ["H", "F2", "F3"], ["H", "F3", "F0"]]},
      {"t": "1", "pairs": [["F0", "F1"], ["F1", "F2"], ["F2", "F3"], ["F3", "F0"], ["H", "F0"], ["H", "F1"], ["H", "F2"], ["H", "F3"]],
       "triples": [["H", "F0", "F1"], ["H", "F1", "F2"], ["H", "F2", "F3"], ["H", "F3", "F0"]]}]})";
  // Fan at 1 (4 triangles) + fence prisms over slab 0 (4): d = L_1 + (L_0 - L_1) = L_0.
  const std::string cert = certificate("sheet", "sweepcert-contacts-1", "z2", R"(["0", "1"])",
      R"("winding": "1", "triangles": [[1, "H", "F0", "F1", "1"], [1, "H", "F1", "F2", "1"], [1, "H", "F2", "F3", "1"],
        [1, "H", "F3", "F0", "1"]], "prisms": [[0, "F0", "F1", "1"], [0, "F1", "F2", "1"], [0, "F2", "F3", "1"], [0, "F3", "F0", "1"]])");
  Run r = explained(log, cert);
  INFO(r.out << r.err);
  REQUIRE(r.code == 0);
  account_before_findings(r);
  CHECK(line(r.out, "  claim:") == "  claim: no-evasion, by the method \"sheet\" over the ring z2 (the integers mod 2).");
  CHECK_THAT(r.out, Contains("(covered: the log frames [0, 1])"));
  CHECK(line(r.out, "  margin:") == "  margin: not applicable to a contact log (it has no positions); contacts are taken as logged.");
  CHECK(line(r.out, "  title:") == "  title: (none)");
  CHECK(line(r.out, "  sensors:") == "  sensors: 4 fence, 1 mobile");
  CHECK(line(r.out, "  log frames:") == "  log frames: 2, t=0..1");
  CHECK_THAT(r.out, Contains("a contact or triple present at two consecutive frames holds throughout the time between them"));
  // 2 frames x 8 pairs and 2 x 4 triples listed.
  CHECK(line(r.out, "  input (§2):") == "  input (§2): 2 frames, 16 pair listings, 8 triple listings valid; 4 fence links in every frame");
  CHECK(line(r.out, "  frames:") == "  frames: 2 matched to log frames 0..1");
  CHECK(line(r.out, "  cells exist:") ==
        "  cells exist: 4 triangles (listed triples of the log), 4 prisms (edge present at both ends: 8 tests)");
  // 3*4 + 4*4 faces. Frame 0: 4 fence edges, 4 fence verticals; frame 1: 4 fence edges, 4 spokes.
  CHECK(line(r.out, "  boundary:") == "  boundary: 28 faces summed into 16 cells; the 4 nonzero ones all lie on the fence cylinder");
}

TEST_CASE("--explain on a cocycle", "[explain][cocycle]") {
  const std::string ring4 = R"({"format": "sweepcert-contacts-1", "fence": ["F0", "F1", "F2", "F3"], "triangles": "listed",
    "frames": [{"t": "0", "pairs": [["F0", "F1"], ["F1", "F2"], ["F2", "F3"], ["F3", "F0"]], "triples": []},
               {"t": "1", "pairs": [["F0", "F1"], ["F1", "F2"], ["F2", "F3"], ["F3", "F0"]], "triples": []}]})";
  // phi = 1 on E(F0,F1,0), E(F3,F0,1), V(F0,0) (test_cocycle.cpp). The 2-cells on each listed
  // face (no triples, so no triangles): E(F0,F1,0) lies on the prism [F0,F1] over slab 0;
  // E(F0,F3,1) on the prism [F0,F3] over slab 0; V(F0,0) on the prisms of F0's two fence
  // neighbours over slab 0. 4 prisms evaluated, one per listed face met.
  const std::string cert = certificate("cocycle", "sweepcert-contacts-1", "z", R"(["0", "1"])",
      R"("fence_value": "1", "edges": [[0, "F0", "F1", "1"], [1, "F3", "F0", "1"]], "verticals": [[0, "F0", "1"]])");
  Run r = explained(ring4, cert);
  INFO(r.out << r.err);
  REQUIRE(r.code == 0);
  account_before_findings(r);
  CHECK(line(r.out, "  claim:") == "  claim: no-sheet, by the method \"cocycle\" over the ring z (the integers).");
  CHECK_THAT(r.out, Contains("This is not a statement that an intruder can evade"));
  CHECK(line(r.out, "  margin:") == "  margin: not applicable (a cocycle certificate carries none).");
  CHECK(line(r.out, "  sensors:") == "  sensors: 4 fence, 0 mobile");
  CHECK(line(r.out, "  cochain:") == "  cochain: 2 edge values, 1 vertical values, each on a cell that exists");
  CHECK(line(r.out, "  coboundary:") ==
        "  coboundary: zero on 0 triangles and 4 prisms (every 2-cell touching a labelled cell, enumerated from the input)");
  CHECK(line(r.out, "  fence loop:") == "  fence loop: the labels sum to 1 != 0 over the 4 fence edges");
}

TEST_CASE("--explain on chambers, with a margin", "[explain][chambers]") {
  const std::string input = room(R"({"id": "C", "radius": "1.5", "track": [["0", "2", "2"]]})");
  const std::vector<int> tree = {-1,
                                 -1, -3, -3, -3, -1, 0, 1, 7, 8,
                                 -1, -3, -3, -1, 1, 2, 8, 3, -3,
                                 -1, -3, -1, 7, 8, 6, 5, -3, -3,
                                 -1, -1, 8, 3, 5, 4, -3, -3, -3};  // test_margin.cpp: P in 16 covered unit cells
  std::size_t leaves = 0, covered = 0, outside = 0, open = 0;
  std::string text;
  for (int t : tree) {
    text += (text.empty() ? "" : ", ") + std::to_string(t);
    leaves += t != -1;
    covered += t >= 0;
    outside += t == -3;
    open += t == -2;
  }
  const std::string cert = R"({"format": "sweepcert-certificate-1", "claim": "no-evasion", "method": "chambers",
    "margin": "1/20", "input_sha256": "@HASH", "input_format": "sweepcert-scenario-1",
    "square": {"origin": ["-2", "-2"], "side": "8"}, "sensors": ["F0", "F1", "F2", "F3", "F4", "F5", "F6", "F7", "C"],
    "slabs": [{"t": ["1", "5"], "tree": [)" + text + R"(]}, {"t": ["5", "9"], "tree": [)" + text + "]}]}";
  Run r = explained(input, cert);
  INFO(r.out << r.err);
  REQUIRE(r.code == 0);
  account_before_findings(r);
  CHECK(line(r.out, "  claim:") == "  claim: no-evasion, by the method \"chambers\".");
  CHECK(line(r.out, "  margin:") == "  margin: 1/20. Checked with every radius shrunk to r - 1/20, so the conclusion still holds");
  // 9 sensors, 8 fence links.
  CHECK(line(r.out, "  margin: 9") == "  margin: 9 radii shrunk by 1/20 and found > 0; 8 fence links re-checked");
  CHECK(line(r.out, "  square:") == "  square: holds 8 fence centres; sensor table: 9 ids; slabs: 2 consecutive within the horizon");
  CHECK(line(r.out, "  cells:") == "  cells: " + std::to_string(2 * leaves) + " in 2 slabs");
  // Every sensor stands still: one distinct disk per slab, so 4 corner tests per covered cell.
  CHECK(line(r.out, "  covered cells:") == "  covered cells: " + std::to_string(2 * covered) + " checked over 2 slabs (" +
                                               std::to_string(4 * 2 * covered) + " exact corner-in-disk tests)");
  // The second slab's outside boxes repeat the first's: tested once.
  CHECK(line(r.out, "  outside cells:") == "  outside cells: " + std::to_string(2 * outside) + " checked (" +
                                               std::to_string(outside) + " distinct boxes tested against the fence polygon)");
  CHECK(line(r.out, "  open cells:") == "  open cells: " + std::to_string(2 * open) +
                                            "; live set: 0 live cells over the slabs, at most 0 in one, empty from slab 0");

  // Shrunk by 1/10 the first covered cell fails (test_margin.cpp): counts stop there. Before token
  // 6 come the outside cells 2, 3, 4.
  std::string tight = cert;
  replace_all(tight, R"("margin": "1/20")", R"("margin": "1/10")");
  Run f = explained(input, tight);
  INFO(f.out);
  CHECK(f.code == 1);
  CHECK_THAT(f.last(), StartsWith("REJECTED: /slabs/0/tree/6 "));
  CHECK_THAT(f.out, Contains("Which checks ran (items verified; the check stopped at the failing item named on the last line)"));
  CHECK(line(f.out, "  cells:") == "  cells: 0 in 0 slabs");
  CHECK(line(f.out, "  covered cells:") == "  covered cells: 0 checked over 0 slabs (3 exact corner-in-disk tests)");
  CHECK(line(f.out, "  outside cells:") == "  outside cells: 3 checked (3 distinct boxes tested against the fence polygon)");
}

TEST_CASE("--explain on a route, with a margin", "[explain][route]") {
  // N (radius 1/4) visits (2, 5/2) at t=4, half a unit from the route standing at (2,2).
  const std::string input =
      room(R"({"id": "N", "radius": "1/4", "track": [["0", "20", "20"], ["4", "2", "2.5"], ["6", "20", "20"]]})");
  const std::string cert = R"({"format": "sweepcert-certificate-1", "claim": "evasion", "method": "route",
    "margin": "1/5", "input_sha256": "@HASH", "input_format": "sweepcert-scenario-1",
    "route": [["0", "2", "2"], ["5", "2", "2"], ["10", "2", "2"]]})";
  Run r = explained(input, cert);
  INFO(r.out << r.err);
  REQUIRE(r.code == 0);
  account_before_findings(r);
  CHECK(line(r.out, "  claim:") == "  claim: evasion, by the method \"route\".");
  CHECK_THAT(r.out, Contains("stays strictly outside every sensor's disk over the whole horizon [0, 10]"));
  CHECK(line(r.out, "  margin:") == "  margin: 1/5. Checked with every radius grown to r + 1/5, so the route keeps clear of");
  CHECK(line(r.out, "  margin: 9") == "  margin: 9 radii grown by 1/5");
  CHECK(line(r.out, "  route:") == "  route: 3 rows; the start lies strictly inside the fence polygon");
  // Pieces: each fence sensor has no waypoint inside the horizon, so its pieces are the 2 route
  // legs: 16. N's waypoints 4 and 6 (t=0 is not strictly inside) and the route time 5 cut
  // [0,10] into [0,4], [4,5], [5,6], [6,10]: 4. In all 20, tested exactly or cleared by the boxes.
  const std::string clearance = line(r.out, "  clearance:");
  unsigned long exact = 0, filtered = 0, clear = 0, all = 0;
  REQUIRE(std::sscanf(clearance.c_str(),
                      "  clearance: %lu pieces checked exactly, %lu cleared by integer bounding boxes (farther apart than the radius); %lu of %lu sensors",
                      &exact, &filtered, &clear, &all) == 4);
  CHECK(exact + filtered == 20);
  CHECK(clear == 9);
  CHECK(all == 9);
}

TEST_CASE("--explain when the header fails", "[explain]") {
  const std::string input = room("");
  std::string cert = R"({"format": "sweepcert-certificate-1", "claim": "evasion", "method": "route",
    "input_sha256": "@HASH", "input_format": "sweepcert-scenario-1", "route": [["0", "2", "2"], ["10", "2", "2"]]})";
  Run ok = explained(input, cert);
  CHECK(ok.code == 0);
  replace_all(cert, "@HASH", std::string(64, '0'));
  Run r = explained(input, cert);
  INFO(r.out);
  CHECK(r.code == 1);
  CHECK_THAT(r.last(), StartsWith("REJECTED: /input_sha256"));
  CHECK_THAT(r.out, Contains("What is claimed\n  nothing established: the certificate's header"));
  CHECK(line(r.out, "  hash binding:").empty());
  CHECK(line(r.out, "  sensors:") == "  sensors: 8 fence, 0 mobile");
  // An unreadable input: exit 2, nothing on stdout, explain or not.
  Run bad = explained("{", cert);
  CHECK(bad.code == 2);
  CHECK(bad.out.empty());
}
