// Validation of the inputs (§2): every violation exits 2 naming the pointer and the rule.
#include <catch2/catch.hpp>

#include "helpers.hpp"

using namespace sweepcheck_test;

namespace {

// Square fence of side 4 with radius 2 (consecutive disks tangent), one mobile sensor.
const std::string kScenario = R"({"format": "sweepcert-scenario-1", "title": "square",
  "horizon": ["0", "10"],
  "fence": [{"id": "F0", "at": ["0", "0"], "radius": "2"}, {"id": "F1", "at": ["4", "0"], "radius": "2"},
            {"id": "F2", "at": ["4", "4"], "radius": "2"}, {"id": "F3", "at": ["0", "4"], "radius": "2"}],
  "sensors": [{"id": "D", "radius": "2", "track": [["0", "2", "2"], ["10", "2", "3"]]}]})";

const std::string kLog = R"({"format": "sweepcert-contacts-1", "fence": ["F0", "F1", "F2"], "sensors": ["A"],
  "triangles": "listed",
  "frames": [{"t": "0", "pairs": [["F0", "F1"], ["F1", "F2"], ["F2", "F0"], ["A", "F0"]], "triples": []}]})";

// Any certificate: input errors come first.
const std::string kCert = R"({"format": "sweepcert-certificate-1"})";

// Runs with `from` replaced by `to` in `input`; expects exit 2 and returns the message.
std::string invalid(std::string input, const std::string& from, const std::string& to) {
  REQUIRE(input.find(from) != std::string::npos);
  replace_all(input, from, to);
  Run r = run(input, kCert);
  INFO(r.out << r.err);
  CHECK(r.code == 2);
  CHECK(r.out.empty());
  return r.err;
}

}  // namespace

TEST_CASE("valid inputs pass validation", "[input]") {
  // The certificate is then rejected (exit 1), which shows the input itself was accepted.
  CHECK(run(kScenario, kCert).code == 1);
  CHECK(run(kLog, kCert).code == 1);
}

TEST_CASE("positional scenario violations", "[input]") {
  using Catch::Matchers::Contains;
  CHECK_THAT(invalid(kScenario, "sweepcert-scenario-1", "sweepcert-scenario-9"), Contains("INPUT /format: unknown format"));
  CHECK_THAT(invalid(kScenario, R"(["10", "2", "3"])", R"(["0", "2", "3"])"), Contains("INPUT /sensors/0/track/1/0: track times must increase strictly"));
  CHECK_THAT(invalid(kScenario, R"("F1", "at": ["4", "0"], "radius": "2")", R"("F1", "at": ["4", "0"], "radius": "0")"),
             Contains("INPUT /fence/1/radius: radius must be > 0"));
  CHECK_THAT(invalid(kScenario, R"("id": "D")", R"("id": "F2")"), Contains("INPUT /sensors/0/id: duplicate sensor id \"F2\""));
  // Moving F1 to (4.5, 0) opens a gap between F0 and F1 (4.5 > 2 + 2).
  CHECK_THAT(invalid(kScenario, R"(["4", "0"])", R"(["4.5", "0"])"), Contains("INPUT /fence/1: fence gap"));
  // A bow tie with radius 3 (consecutive centres at most sqrt 32 < 6 apart, so no gap):
  // (0,0) (4,4) (4,0) (0,4); the edges F0-F1 and F2-F3 cross at (2,2).
  const std::string bow = R"({"format": "sweepcert-scenario-1", "horizon": ["0", "1"], "sensors": [],
    "fence": [{"id": "F0", "at": [0, 0], "radius": 3}, {"id": "F1", "at": [4, 4], "radius": 3},
              {"id": "F2", "at": [4, 0], "radius": 3}, {"id": "F3", "at": [0, 4], "radius": 3}]})";
  CHECK_THAT(invalid(bow, "[4, 4]", "[4, 4]"), Contains("INPUT /fence/2/at: fence polygon not simple: edge \"F2\"-\"F3\" meets edge \"F0\"-\"F1\""));
  // Centres (0,0) (4,0) (2,0) (0,2): no gap, but the polygon folds back at F1 (collinear,
  // second edge turning back along the first).
  std::string fold = kScenario;
  replace_all(fold, R"(["4", "4"])", R"(["2", "0"])");
  CHECK_THAT(invalid(fold, R"(["0", "4"])", R"(["0", "2"])"), Contains("INPUT /fence/1/at: fence polygon not simple: it folds back"));
  CHECK_THAT(invalid(kScenario, R"(["4", "4"])", R"(["0", "0"])"), Contains("INPUT /fence/2/at: fence polygon not simple: centre repeats"));
  CHECK_THAT(invalid(kScenario, R"(["0", "10"])", R"(["1.", "10"])"), Contains("INPUT /horizon/0: malformed number"));
  CHECK_THAT(invalid(kScenario, R"(["0", "10"])", R"(["10", "10"])"), Contains("INPUT /horizon/1: horizon end"));
  CHECK_THAT(invalid(kScenario, R"("title": "square")", R"("colour": "red")"), Contains("INPUT /colour: unknown key"));
  CHECK_THAT(invalid(kScenario, R"("title": "square")", R"("horizon": ["0", "1"])"), Contains("INPUT /horizon: duplicated key"));
  CHECK_THAT(invalid(kScenario, R"("radius": "2", "track")", R"("radius": "2", "radius": "3", "track")"),
             Contains("INPUT /sensors/0/radius: duplicated key"));
  CHECK_THAT(invalid(kScenario, R"("track": [["0", "2", "2"], )", R"("track": [["0", "2"], )"),
             Contains("INPUT /sensors/0/track/0: array has 2 elements"));
  CHECK_THAT(invalid(kScenario, R"("id": "D")", R"("id": "")"), Contains("INPUT /sensors/0/id:"));
}

TEST_CASE("contact log violations", "[input]") {
  using Catch::Matchers::Contains;
  CHECK_THAT(invalid(kLog, R"("triples": [])", R"("triples": [["F0", "F1", "A"]])"),
             Contains("INPUT /frames/0/triples/0: pair {A, F1} of this triple is not listed"));
  CHECK_THAT(invalid(kLog, R"(["A", "F0"])", R"(["A", "B"])"), Contains("INPUT /frames/0/pairs/3/1: unknown id \"B\""));
  CHECK_THAT(invalid(kLog, R"(["A", "F0"])", R"(["F1", "F0"])"), Contains("INPUT /frames/0/pairs/3: pair {F0, F1} listed twice"));
  CHECK_THAT(invalid(kLog, R"(["A", "F0"])", R"(["A", "A"])"), Contains("INPUT /frames/0/pairs/3: pair of identical ids"));
  CHECK_THAT(invalid(kLog, R"(["F1", "F2"], )", ""), Contains("INPUT /frames/0/pairs: consecutive fence ids {F1, F2}"));
  CHECK_THAT(invalid(kLog, R"("sensors": ["A"])", R"("sensors": ["F1"])"), Contains("INPUT /sensors/0: id \"F1\" already used"));
  CHECK_THAT(invalid(kLog, R"(, "triples": [])", ""), Contains("INPUT /frames/0/triples: required"));
  // Two frames with equal times.
  std::string twice = kLog;
  replace_all(twice, R"("triples": []}])", R"("triples": []}, {"t": "0/5", "pairs": [], "triples": []}])");
  Run r = run(twice, kCert);
  CHECK(r.code == 2);
  CHECK_THAT(r.err, Contains("INPUT /frames/1/t: frame times must increase strictly"));
  // from-pairs: 3 R_s^2 >= R_c^2 exactly. R_s = 1: R_c = 1.732 passes (2.999824 <= 3),
  // R_c = 1.733 fails (3.003289 > 3). (Equality needs R_c = sqrt(3), not rational.)
  std::string fp = kLog;
  replace_all(fp, R"(, "triples": [])", "");
  replace_all(fp, R"("triangles": "listed")", R"("triangles": {"from-pairs": {"contact-range": "1.732", "sensing-radius": 1}})");
  CHECK(run(fp, kCert).code == 1);
  CHECK_THAT(invalid(fp, "1.732", "1.733"), Contains("INPUT /triangles/from-pairs: 3*R_s^2 < R_c^2"));
  CHECK_THAT(invalid(fp, R"("pairs": [)", R"("triples": [], "pairs": [)"), Contains("INPUT /frames/0/triples: not allowed"));
}

TEST_CASE("unreadable files and limits exit 2", "[input][json]") {
  CHECK(run("{", kCert).code == 2);
  CHECK(run(kLog, "{\"format\": ").code == 2);
  std::string deep = std::string(65, '[') + std::string(65, ']');
  Run r = run(kLog, deep);
  CHECK(r.code == 2);
  CHECK_THAT(r.err, Catch::Matchers::Contains("CERT: nested deeper than the depth limit of 64"));
  std::string long_title = kLog;
  replace_all(long_title, R"("fence")", "\"title\": \"" + std::string(1001, 'x') + "\", \"fence\"");
  r = run(long_title, kCert);
  CHECK(r.code == 2);
  CHECK_THAT(r.err, Catch::Matchers::Contains("INPUT: string of 1001 characters exceeds the length limit of 1000"));
  std::ostringstream out, err;
  CHECK(sweepcheck::check_files("/nonexistent/input.json", "/nonexistent/cert.json", out, err) == 2);
  CHECK_THAT(err.str(), Catch::Matchers::Contains("cannot open file"));
}
