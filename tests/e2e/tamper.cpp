// Tampering: every single-item change to a valid certificate must be rejected by sweepcheck.
// Certificates come from the real prover on bundled cases; mutants are written to files and
// the checker binary is run on each (exit 1 = rejected).
#define CATCH_CONFIG_MAIN
#include <catch2/catch.hpp>

#include <cstdlib>
#include <fstream>
#include <nlohmann/json.hpp>
#include <string>
#include <sys/wait.h>
#include <unistd.h>
#include <cmath>

using nlohmann::json;

namespace {

int run(const std::string& cmd) {
  int status = std::system((cmd + " > /dev/null 2>&1").c_str());
  return WIFEXITED(status) ? WEXITSTATUS(status) : -1;
}

std::string work(const std::string& name) { return std::string(WORK_DIR) + "/" + name; }

json prove(const std::string& input, const std::string& ring, const std::string& out) {
  REQUIRE(run(std::string(SWEEPCERT_BIN) + " prove " + input + " -o " + out + " --ring " + ring) == 0);
  std::ifstream f(out);
  return json::parse(f);
}

int check(const std::string& input, const json& cert) {
  static const std::string path = work("mutant-" + std::to_string(::getpid()) + ".json");
  std::ofstream(path) << cert.dump(1);
  return run(std::string(SWEEPCHECK_BIN) + " " + input + " " + path);
}

std::string bump(const std::string& integer, long delta) {
  return std::to_string(std::stol(integer) + delta);
}

}  // namespace

TEST_CASE("sheets: removing a cell, changing a coefficient or moving a witness is rejected") {
  REQUIRE(run("mkdir -p " + std::string(WORK_DIR)) == 0);
  struct Case { const char* name; const char* ring; };
  std::size_t tried = 0, rejected = 0;
  for (Case c : {Case{"static-cover", "z"}, Case{"column-sweep", "z"}, Case{"column-sweep", "z2"}}) {
    std::string input = std::string(CASES_DIR) + "/" + c.name + ".json";
    json cert = prove(input, c.ring + std::string(" --method sheet"), work(std::string(c.name) + "." + c.ring + ".json"));
    REQUIRE(cert["claim"] == "no-evasion");
    REQUIRE(check(input, cert) == 0);  // the untouched certificate is accepted
    for (const char* section : {"triangles", "prisms"}) {
      std::size_t n = cert[section].size();
      int coef_at = std::string(section) == "triangles" ? 4 : 3;
      for (std::size_t i = 0; i < n; ++i) {
        INFO(c.name << " " << c.ring << " " << section << "[" << i << "]");
        json removed = cert;
        removed[section].erase(i);
        CHECK(check(input, removed) == 1);
        ++tried;
        if (std::string(c.ring) == "z") {
          for (long delta : {+1L, -2L}) {
            json changed = cert;
            auto& cell = changed[section][i][coef_at];
            cell = bump(cell.get<std::string>(), delta);
            if (cell == "0") continue;
            CHECK(check(input, changed) == 1);
            ++tried;
          }
        }
        if (std::string(section) == "triangles" && cert[section][i].size() == 7) {
          json moved = cert;
          moved[section][i][5] = "1000";  // far outside every disk of the sweep
          CHECK(check(input, moved) == 1);
          ++tried;
        }
      }
    }
    rejected = tried;  // every CHECK above asserted a rejection
  }
  WARN("sheet mutants tried (each must be rejected): " << tried);
  CHECK(tried > 300);
  (void)rejected;
}

TEST_CASE("a certificate is bound to its input") {
  std::string cover = std::string(CASES_DIR) + "/static-cover.json";
  json cert = prove(cover, "z", work("bind.json"));
  REQUIRE(check(cover, cert) == 0);
  // A sibling input (the same room with one sensor offline).
  CHECK(check(std::string(CASES_DIR) + "/static-hole.json", cert) == 1);
  // The same scenario with one extra byte: a different file, so a different hash.
  std::string copy = work("static-cover-copy.json");
  {
    std::ifstream in(cover, std::ios::binary);
    std::ofstream out(copy, std::ios::binary);
    out << in.rdbuf() << "\n";
  }
  CHECK(check(copy, cert) == 1);
}

TEST_CASE("cocycles: removing or changing a value is rejected") {
  std::string input = std::string(CASES_DIR) + "/static-hole.json";
  json cert = prove(input, "z --method sheet", work("hole.z.json"));
  REQUIRE(cert["claim"] == "no-sheet");
  REQUIRE(check(input, cert) == 0);
  std::size_t tried = 0;
  for (const char* section : {"edges", "verticals"}) {
    int value_at = std::string(section) == "edges" ? 3 : 2;
    for (std::size_t i = 0; i < cert[section].size(); ++i) {
      INFO(section << "[" << i << "]");
      json removed = cert;
      removed[section].erase(i);
      CHECK(check(input, removed) == 1);
      json changed = cert;
      changed[section][i][value_at] = bump(changed[section][i][value_at].get<std::string>(), 1);
      if (changed[section][i][value_at] != "0") CHECK(check(input, changed) == 1);
      tried += 2;
    }
  }
  json zero = cert;
  zero["fence_value"] = "0";
  CHECK(check(input, zero) == 1);
  WARN("cocycle mutants tried: " << tried + 1);
  CHECK(tried > 0);
}

namespace {

// Exact-number text to double (for choosing far-away sensors only).
double num_text(const json& v) {
  std::string s = v.get<std::string>();
  auto slash = s.find('/');
  return slash == std::string::npos ? std::stod(s) : std::stod(s.substr(0, slash)) / std::stod(s.substr(slash + 1));
}

// Sensor centre at time t from the scenario JSON (doubles, for choosing far-away sensors only).
std::pair<double, double> centre_at(const json& sensor, double t) {
  if (sensor.contains("at")) return {num_text(sensor["at"][0]), num_text(sensor["at"][1])};
  const auto& tr = sensor["track"];
  auto num = [](const json& v) { return num_text(v); };
  if (t <= num(tr[0][0])) return {num(tr[0][1]), num(tr[0][2])};
  for (std::size_t i = 0; i + 1 < tr.size(); ++i) {
    double t0 = num(tr[i][0]), t1 = num(tr[i + 1][0]);
    if (t <= t1) {
      double f = (t - t0) / (t1 - t0);
      return {num(tr[i][1]) + f * (num(tr[i + 1][1]) - num(tr[i][1])), num(tr[i][2]) + f * (num(tr[i + 1][2]) - num(tr[i][2]))};
    }
  }
  return {num(tr.back()[1]), num(tr.back()[2])};
}


}  // namespace

TEST_CASE("routes: moving any waypoint into a disk is rejected") {
  for (const char* name : {"column-gap", "static-hole", "pocket-wall-mirror"}) {
    std::string input = std::string(CASES_DIR) + "/" + name + ".json";
    json cert = prove(input, "z --method route", work(std::string(name) + ".route.json"));
    REQUIRE(cert["claim"] == "evasion");
    REQUIRE(check(input, cert) == 0);
    json scenario;
    std::ifstream(input) >> scenario;
    for (std::size_t i = 0; i < cert["route"].size(); ++i) {
      INFO(name << " /route/" << i);
      // Onto the centre of a fence sensor: inside its disk at every time.
      json moved = cert;
      moved["route"][i][1] = scenario["fence"][i % scenario["fence"].size()]["at"][0];
      moved["route"][i][2] = scenario["fence"][i % scenario["fence"].size()]["at"][1];
      CHECK(check(input, moved) == 1);
    }
    // Re-bound to a sibling input (same hall, other sensors).
    std::string sibling = std::string(CASES_DIR) + "/" +
                          (std::string(name) == "column-gap" ? "column-sweep" : std::string(name) == "static-hole" ? "static-cover" : "pocket-wall") + ".json";
    CHECK(check(sibling, cert) == 1);
  }
}

TEST_CASE("chambers: relabelled, dropped or rebound cells are rejected") {
  std::string input = std::string(CASES_DIR) + "/column-sweep.json";
  json cert = prove(input, "z --method chambers", work("column-sweep.chambers.json"));
  REQUIRE(cert["method"] == "chambers");
  REQUIRE(check(input, cert) == 0);
  json scenario;
  std::ifstream(input) >> scenario;
  std::vector<json> sensors;  // by id
  for (const auto& f : scenario["fence"]) sensors.push_back(f);
  for (const auto& m : scenario["sensors"]) sensors.push_back(m);
  auto sensor = [&](const std::string& id) {
    for (const auto& s : sensors) if (s["id"] == id) return s;
    FAIL("unknown id " << id);
    return json();
  };
  double x0 = num_text(cert["square"]["origin"][0]), y0 = num_text(cert["square"]["origin"][1]);
  double side = num_text(cert["square"]["side"]);
  std::size_t relabelled = 0, dropped = 0;
  for (std::size_t s = 0; s < cert["slabs"].size(); s += 3) {
    const json& slab = cert["slabs"][s];
    double a = num_text(slab["t"][0]), b = num_text(slab["t"][1]);
    // Walk the preorder tree to know each token's box.
    struct Node { double x, y, h; };
    std::vector<Node> stack{{x0, y0, side}};
    for (std::size_t k = 0; k < slab["tree"].size(); ++k) {
      Node n = stack.back();
      stack.pop_back();
      int token = slab["tree"][k];
      if (token == -1) {
        double h = n.h / 2;
        stack.push_back({n.x + h, n.y + h, h});
        stack.push_back({n.x, n.y + h, h});
        stack.push_back({n.x + h, n.y, h});
        stack.push_back({n.x, n.y, h});
        continue;
      }
      if (token < 0 || k % 7 != 0) continue;  // a sample of covered cells
      // A table sensor certainly not covering this cell: its disk stays more than one unit away
      // from the cell centre at both slab ends (far beyond rounding).
      double cx = n.x + n.h / 2, cy = n.y + n.h / 2;
      for (std::size_t j = 0; j < cert["sensors"].size(); ++j) {
        json sj = sensor(cert["sensors"][j]);
        double r = num_text(sj["radius"]);
        bool far = true;
        for (double t : {a, b}) {
          auto [sx, sy] = centre_at(sj, t);
          if (std::hypot(sx - cx, sy - cy) < r + n.h + 1) far = false;
        }
        if (!far) continue;
        INFO("slab " << s << " token " << k << " relabelled to " << cert["sensors"][j]);
        json changed = cert;
        changed["slabs"][s]["tree"][k] = static_cast<int>(j);
        CHECK(check(input, changed) == 1);
        ++relabelled;
        break;
      }
    }
    // Dropping any one cell leaves an incomplete tree.
    for (std::size_t k = 1; k < slab["tree"].size(); k += 11) {
      json removed = cert;
      removed["slabs"][s]["tree"].erase(k);
      CHECK(check(input, removed) == 1);
      ++dropped;
    }
  }
  WARN("chamber mutants: " << relabelled << " relabelled covered cells, " << dropped << " dropped cells");
  CHECK(relabelled > 20);
  CHECK(check(std::string(CASES_DIR) + "/column-gap.json", cert) == 1);  // sibling input
}
