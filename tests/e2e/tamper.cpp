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
  std::string path = work("mutant.json");
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
