// Shared helpers of the checker unit tests: run the whole check on in-memory texts.
#pragma once
#include <sstream>
#include <string>

#include <catch2/catch.hpp>

#include "checker.hpp"
#include "sha256.hpp"

namespace sweepcheck_test {

struct Run {
  int code = -1;
  std::string out, err;
  // The final line of stdout (ACCEPTED... / REJECTED...).
  std::string last() const {
    std::string s = out;
    while (!s.empty() && s.back() == '\n') s.pop_back();
    auto nl = s.rfind('\n');
    return nl == std::string::npos ? s : s.substr(nl + 1);
  }
};

inline void replace_all(std::string& s, const std::string& from, const std::string& to) {
  for (auto p = s.find(from); p != std::string::npos; p = s.find(from, p + to.size())) s.replace(p, from.size(), to);
}

// Runs sweepcheck on (input, cert); "@HASH" in cert becomes the SHA-256 of input.
inline Run run(const std::string& input, std::string cert) {
  replace_all(cert, "@HASH", sweepcheck::sha256_hex(input));
  std::ostringstream out, err;
  Run r;
  r.code = sweepcheck::check_texts(input, cert, out, err);
  r.out = out.str();
  r.err = err.str();
  return r;
}

// A certificate with the common fields filled in; `rest` holds the method's keys.
inline std::string certificate(const std::string& method, const std::string& input_format, const std::string& ring,
                               const std::string& frames, const std::string& rest) {
  const bool sheet = method == "sheet";
  return std::string(R"({"format":"sweepcert-certificate-1","claim":")") + (sheet ? "no-evasion" : "no-sheet") +
         R"(","method":")" + method + R"(","input_sha256":"@HASH","input_format":")" + input_format +
         R"(","ring":")" + ring + R"(","frames":)" + frames + "," + rest + "}";
}

// Checks acceptance / rejection with the output shown on failure.
inline Run accepted(const std::string& input, const std::string& cert) {
  Run r = run(input, cert);
  INFO(r.out << r.err);
  CHECK(r.code == 0);
  CHECK_THAT(r.last(), Catch::Matchers::StartsWith("ACCEPTED"));
  return r;
}

inline std::string rejected(const std::string& input, const std::string& cert) {
  Run r = run(input, cert);
  INFO(r.out << r.err);
  CHECK(r.code == 1);
  CHECK_THAT(r.last(), Catch::Matchers::StartsWith("REJECTED: "));
  return r.last();
}

// The room of the positional tests: a 4 x 4 square fence, disks of radius 3/2 every 2 units
// (consecutive centres 2 apart, 2 <= 3/2 + 3/2), listed counter-clockwise F0 (0,0), F1 (2,0),
// F2 (4,0), F3 (4,2), F4 (4,4), F5 (2,4), F6 (0,4), F7 (0,2); P = [0,4]^2; horizon [0, 10].
// `extra` adds mobile sensors.
inline std::string room(const std::string& extra) {
  return R"({"format": "sweepcert-scenario-1", "horizon": ["0", "10"],
  "fence": [{"id": "F0", "at": ["0", "0"], "radius": "1.5"}, {"id": "F1", "at": ["2", "0"], "radius": "1.5"},
            {"id": "F2", "at": ["4", "0"], "radius": "1.5"}, {"id": "F3", "at": ["4", "2"], "radius": "1.5"},
            {"id": "F4", "at": ["4", "4"], "radius": "1.5"}, {"id": "F5", "at": ["2", "4"], "radius": "1.5"},
            {"id": "F6", "at": ["0", "4"], "radius": "1.5"}, {"id": "F7", "at": ["0", "2"], "radius": "1.5"}],
  "sensors": [)" + extra + "]}";
}

inline bool starts_with(const std::string& s, const std::string& prefix) { return s.rfind(prefix, 0) == 0; }

}  // namespace sweepcheck_test
