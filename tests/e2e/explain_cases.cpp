// `sweepcheck --explain` on bundled cases, one certificate per kind (positional sheet,
// contact-log sheet, cocycle, chambers, route), each proved here by the real prover. The counts
// in the account are compared with numbers this test reads from the input and the certificate
// itself: rows, tree tokens, sensors, frames, and the route's pieces.
#define CATCH_CONFIG_MAIN
#include <catch2/catch.hpp>

#include <boost/multiprecision/cpp_int.hpp>
#include <cstdio>
#include <cstdlib>
#include <fstream>
#include <nlohmann/json.hpp>
#include <set>
#include <sstream>
#include <string>
#include <sys/wait.h>

using nlohmann::json;
using Rat = boost::multiprecision::cpp_rational;
using Int = boost::multiprecision::cpp_int;

namespace {

std::string work(const std::string& name) { return std::string(WORK_DIR) + "/" + name; }
std::string case_file(const std::string& name) { return std::string(CASES_DIR) + "/" + name + ".json"; }

int run(const std::string& cmd) {
  int status = std::system((cmd + " > /dev/null 2>&1").c_str());
  return WIFEXITED(status) ? WEXITSTATUS(status) : -1;
}

// Standard output of a command and its exit code.
std::string capture(const std::string& cmd, int& code) {
  std::string out;
  FILE* p = ::popen(cmd.c_str(), "r");
  REQUIRE(p != nullptr);
  char buf[4096];
  for (std::size_t n; (n = std::fread(buf, 1, sizeof buf, p)) > 0;) out.append(buf, n);
  const int status = ::pclose(p);
  code = WIFEXITED(status) ? WEXITSTATUS(status) : -1;
  return out;
}

json load(const std::string& path) {
  std::ifstream f(path);
  return json::parse(f);
}

json prove(const std::string& input, const std::string& options, const std::string& out) {
  REQUIRE(run(std::string(SWEEPCERT_BIN) + " prove " + input + " -o " + out + " --quiet " + options) == 0);
  return load(out);
}

// Runs sweepcheck --explain; the verdict must be ACCEPTED.
std::string explain(const std::string& input, const std::string& cert) {
  int code = -1;
  std::string out = capture(std::string(SWEEPCHECK_BIN) + " --explain " + input + " " + cert, code);
  INFO(out);
  CHECK(code == 0);
  CHECK(out.rfind("== sweepcheck --explain", 0) == 0);
  CHECK(out.find("\nACCEPTED") != std::string::npos);
  return out;
}

std::string line(const std::string& out, const std::string& prefix) {
  std::istringstream in(out);
  for (std::string l; std::getline(in, l);)
    if (l.rfind(prefix, 0) == 0) return l;
  return "";
}

std::string n(std::size_t x) { return std::to_string(x); }

// An exact number of the formats (decimal, fraction), written as a string or a JSON integer.
Rat exact(const json& v) {
  std::string s = v.is_string() ? v.get<std::string>() : v.dump();
  const auto slash = s.find('/');
  if (slash != std::string::npos) return Rat(Int(s.substr(0, slash)), Int(s.substr(slash + 1)));
  int exp10 = 0;
  const auto e = s.find_first_of("eE");
  if (e != std::string::npos) {
    exp10 = std::stoi(s.substr(e + 1));
    s = s.substr(0, e);
  }
  const auto dot = s.find('.');
  if (dot != std::string::npos) {
    exp10 -= static_cast<int>(s.size() - dot - 1);
    s.erase(dot, 1);
  }
  Rat q{Int(s)};
  const Int ten = pow(Int(10), static_cast<unsigned>(exp10 < 0 ? -exp10 : exp10));
  return exp10 < 0 ? q / Rat(ten) : q * Rat(ten);
}

std::string sensors_line(const json& input) {
  return "  sensors: " + n(input["fence"].size()) + " fence, " + n(input["sensors"].size()) + " mobile";
}

}  // namespace

TEST_CASE("--explain: positional sheet and contact-log sheet of static-cover") {
  REQUIRE(run("mkdir -p " + std::string(WORK_DIR)) == 0);
  const std::string input = case_file("static-cover");
  const json scene = load(input);
  const std::string path = work("explain.static-cover.sheet.json");
  const json cert = prove(input, "--method sheet --ring z", path);
  REQUIRE(cert["method"] == "sheet");
  const std::string out = explain(input, path);
  INFO(out);
  const std::size_t T = cert["triangles"].size(), P = cert["prisms"].size();
  CHECK(line(out, "  sensors:") == sensors_line(scene));
  CHECK(line(out, "  title:") == "  title: \"" + scene["title"].get<std::string>() + "\"");
  CHECK(line(out, "  cells exist:") == "  cells exist: " + n(T) + " triangles (exact witness for " + n(T) + " triples), " +
                                           n(P) + " prisms (edge present at both ends: " + n(2 * P) + " tests)");
  CHECK(line(out, "  distinct cells") == "  distinct cells, nonzero coefficients: " + n(T + P) + " rows");
  CHECK(line(out, "  boundary:").rfind("  boundary: " + n(3 * T + 4 * P) + " faces summed into ", 0) == 0);
  CHECK(line(out, "  winding:").rfind("  winding: winding number " + cert["winding"].get<std::string>() +
                                          " along each of the " + n(scene["fence"].size()) + " fence edges", 0) == 0);
  // Waypoints of mobile sensors strictly between the first and last frame.
  const Rat first = exact(cert["frames"].front()), last = exact(cert["frames"].back());
  std::size_t waypoints = 0;
  for (const json& s : scene["sensors"])
    for (const json& row : s["track"]) {
      const Rat t = exact(row[0]);
      waypoints += first < t && t < last;
    }
  CHECK(line(out, "  frames:") == "  frames: " + n(cert["frames"].size()) + " checked within the horizon; " + n(waypoints) +
                                      " waypoint times between the first and last frame found among them");

  // The same sweep as a contact log.
  const std::string log_path = work("explain.static-cover.log.json");
  REQUIRE(run(std::string(SWEEPCERT_BIN) + " contacts " + input + " --every 1/4 -o " + log_path + " --quiet") == 0);
  const json log = load(log_path);
  const std::string lpath = work("explain.static-cover.log-sheet.json");
  const json lcert = prove(log_path, "--ring z2", lpath);
  REQUIRE(lcert["method"] == "sheet");
  const std::string lout = explain(log_path, lpath);
  INFO(lout);
  std::size_t pairs = 0, triples = 0;
  for (const json& f : log["frames"]) {
    pairs += f["pairs"].size();
    if (f.contains("triples")) triples += f["triples"].size();
  }
  CHECK(line(lout, "  log frames:").rfind("  log frames: " + n(log["frames"].size()) + ", t=", 0) == 0);
  CHECK(line(lout, "  input (§2):") == "  input (§2): " + n(log["frames"].size()) + " frames, " + n(pairs) +
                                           " pair listings, " + n(triples) + " triple listings valid; " +
                                           n(log["fence"].size()) + " fence links in every frame");
  CHECK(line(lout, "  frames:").rfind("  frames: " + n(lcert["frames"].size()) + " matched to log frames ", 0) == 0);
  const std::size_t lT = lcert["triangles"].size(), lP = lcert["prisms"].size();
  CHECK(line(lout, "  cells exist:").rfind("  cells exist: " + n(lT) + " triangles (", 0) == 0);
  CHECK(line(lout, "  boundary:").rfind("  boundary: " + n(3 * lT + 4 * lP) + " faces summed into ", 0) == 0);
}

TEST_CASE("--explain: cocycle of static-hole") {
  REQUIRE(run("mkdir -p " + std::string(WORK_DIR)) == 0);
  const std::string input = case_file("static-hole");
  const std::string path = work("explain.static-hole.cocycle.json");
  const json cert = prove(input, "--method sheet --ring z", path);
  REQUIRE(cert["method"] == "cocycle");
  const std::string out = explain(input, path);
  INFO(out);
  CHECK(line(out, "  sensors:") == sensors_line(load(input)));
  CHECK(line(out, "  cochain:") == "  cochain: " + n(cert["edges"].size()) + " edge values, " + n(cert["verticals"].size()) +
                                       " vertical values, each on a cell that exists");
  CHECK(line(out, "  fence loop:") == "  fence loop: the labels sum to " + cert["fence_value"].get<std::string>() +
                                          " != 0 over the " + n(load(input)["fence"].size()) + " fence edges");
}

TEST_CASE("--explain: chambers of pocket-wall") {
  REQUIRE(run("mkdir -p " + std::string(WORK_DIR)) == 0);
  const std::string input = case_file("pocket-wall");
  const json scene = load(input);
  const std::string path = work("explain.pocket-wall.chambers.json");
  const json cert = prove(input, "--method chambers", path);
  REQUIRE(cert["method"] == "chambers");
  const std::string out = explain(input, path);
  INFO(out);
  std::size_t cells = 0, covered = 0, outside = 0, open = 0;
  for (const json& slab : cert["slabs"])
    for (const json& token : slab["tree"]) {
      const long t = token.get<long>();
      cells += t != -1;
      covered += t >= 0;
      outside += t == -3;
      open += t == -2;
    }
  const std::size_t slabs = cert["slabs"].size();
  CHECK(line(out, "  sensors:") == sensors_line(scene));
  CHECK(line(out, "  square:") == "  square: holds " + n(scene["fence"].size()) + " fence centres; sensor table: " +
                                      n(cert["sensors"].size()) + " ids; slabs: " + n(slabs) + " consecutive within the horizon");
  CHECK(line(out, "  cells:") == "  cells: " + n(cells) + " in " + n(slabs) + " slabs");
  CHECK(line(out, "  covered cells:").rfind("  covered cells: " + n(covered) + " checked over " + n(slabs) + " slabs (", 0) == 0);
  CHECK(line(out, "  outside cells:").rfind("  outside cells: " + n(outside) + " checked (", 0) == 0);
  CHECK(line(out, "  open cells:").rfind("  open cells: " + n(open) + "; live set: ", 0) == 0);
}

TEST_CASE("--explain: route of static-hole") {
  REQUIRE(run("mkdir -p " + std::string(WORK_DIR)) == 0);
  const std::string input = case_file("static-hole");
  const json scene = load(input);
  const std::string path = work("explain.static-hole.route.json");
  const json cert = prove(input, "", path);
  REQUIRE(cert["method"] == "route");
  const std::string out = explain(input, path);
  INFO(out);
  // Pieces of a sensor: the horizon cut at the route times and at its waypoint times strictly
  // inside the horizon, each distinct time once.
  std::set<Rat> route_times;
  for (const json& row : cert["route"]) route_times.insert(exact(row[0]));
  const Rat h0 = exact(scene["horizon"][0]), h1 = exact(scene["horizon"][1]);
  std::size_t pieces = scene["fence"].size() * (route_times.size() - 1);
  for (const json& s : scene["sensors"]) {
    std::set<Rat> cuts = route_times;
    for (const json& row : s["track"]) {
      const Rat t = exact(row[0]);
      if (h0 < t && t < h1) cuts.insert(t);
    }
    pieces += cuts.size() - 1;
  }
  const std::size_t all = scene["fence"].size() + scene["sensors"].size();
  CHECK(line(out, "  route:") == "  route: " + n(cert["route"].size()) + " rows; the start lies strictly inside the fence polygon");
  unsigned long exact_pieces = 0, filtered = 0, clear = 0, sensors = 0;
  REQUIRE(std::sscanf(line(out, "  clearance:").c_str(),
                      "  clearance: %lu pieces checked exactly, %lu cleared by integer bounding boxes (farther apart than the radius); %lu of %lu sensors",
                      &exact_pieces, &filtered, &clear, &sensors) == 4);
  CHECK(exact_pieces + filtered == pieces);
  CHECK(clear == all);
  CHECK(sensors == all);
}

TEST_CASE("--help names --explain") {
  int code = -1;
  const std::string out = capture(std::string(SWEEPCHECK_BIN) + " --help", code);
  CHECK(code == 0);
  CHECK(out.find("usage: sweepcheck [--explain] INPUT CERT") != std::string::npos);
  CHECK(out.find("  --explain") != std::string::npos);
  // Misuse: an unknown option, or a missing file argument.
  CHECK(run(std::string(SWEEPCHECK_BIN) + " --explained a b") == 2);
  CHECK(run(std::string(SWEEPCHECK_BIN) + " --explain a") == 2);
}
