// Mutation campaign: every certificate the prover writes for the bundled cases is mutated many
// times (seeded, deterministic) and each mutant is checked in-process by sweepcheck. A mutant the
// checker accepts is re-verified by the slow reference (reference.hpp); if the reference refuses
// it, the checker accepted a wrong certificate and this program fails, printing the mutant.
// The reference is itself exercised: it must accept every original and refuse (nearly) every
// sampled mutant the checker rejected.
//
// Environment: SWEEPCERT_MUTATIONS (total mutants; default MUTATION_DEFAULT),
// SWEEPCERT_MUTATIONS_PER_CERT (floor per certificate; default MUTATION_MIN_PER_CERT),
// SWEEPCERT_MUTATION_SEED, SWEEPCERT_REFERENCE_SAMPLE (check one rejected mutant in N with the
// reference; default 4).
#include <chrono>
#include <cmath>
#include <cstdio>
#include <cstdlib>
#include <fstream>
#include <iomanip>
#include <iostream>
#include <map>
#include <optional>
#include <set>
#include <sstream>
#include <stdexcept>
#include <string>
#include <vector>

#include <nlohmann/json.hpp>
#include <sys/wait.h>

#include "checker.hpp"
#include "mutate.hpp"
#include "reference.hpp"

using nlohmann::json;

namespace {

struct Cert {
  std::string label, kind, input_text, text;
  json doc;
  mutation::Context ctx;
  double check_ms = 0, cost_ms = 0;  // cost: checker plus a share of reference runs
};

struct Tally {
  long tried = 0, rejected = 0, valid = 0, wrong = 0;
};

std::string slurp(const std::string& path) {
  std::ifstream f(path, std::ios::binary);
  std::ostringstream s;
  s << f.rdbuf();
  return s.str();
}

long env_long(const char* name, long fallback) {
  const char* v = std::getenv(name);
  return v && *v ? std::atol(v) : fallback;
}

int run(const std::string& cmd) {
  int status = std::system((cmd + " > /dev/null 2>&1").c_str());
  return WIFEXITED(status) ? WEXITSTATUS(status) : -1;
}

std::string last_line(const std::string& s) {
  std::string t = s;
  while (!t.empty() && t.back() == '\n') t.pop_back();
  auto nl = t.rfind('\n');
  return nl == std::string::npos ? t : t.substr(nl + 1);
}

std::string kind_of(const json& c) {
  std::string k = c.value("method", std::string("?"));
  if (c.contains("ring")) k += " " + c["ring"].get<std::string>();
  k += c.value("input_format", std::string()) == "sweepcert-contacts-1" ? " log" : " pos";
  return k;
}

std::vector<std::string> input_ids(const std::string& input_text) {
  json in = json::parse(input_text);
  std::vector<std::string> ids;
  if (in["format"] == "sweepcert-scenario-1") {
    for (const auto& f : in["fence"]) ids.push_back(f["id"]);
    for (const auto& s : in["sensors"]) ids.push_back(s["id"]);
  } else {
    for (const auto& f : in["fence"]) ids.push_back(f);
    for (const auto& s : in.value("sensors", json::array())) ids.push_back(s);
  }
  return ids;
}

// Proves every bundled case in every way listed in the brief of this test.
std::vector<Cert> make_certificates() {
  const std::string work = WORK_DIR;
  if (run("mkdir -p " + work) != 0) throw std::runtime_error("cannot create " + work);
  std::vector<Cert> out;
  std::set<std::string> seen;
  for (const char* name : {"static-cover", "static-hole", "column-sweep", "column-gap", "pocket-wall", "pocket-wall-mirror"}) {
    const std::string scenario = std::string(CASES_DIR) + "/" + name + ".json";
    const std::string log = work + "/" + name + ".log.json";
    if (run(std::string(SWEEPCERT_BIN) + " contacts " + scenario + " --every 1/4 -o " + log + " --quiet") != 0)
      throw std::runtime_error(std::string("contacts failed on ") + name);
    struct Way { const char* label; const std::string* input; const char* options; };
    for (Way w : {Way{"auto", &scenario, ""}, Way{"sheet-z", &scenario, "--method sheet --ring z"},
                  Way{"sheet-z2", &scenario, "--method sheet --ring z2"}, Way{"chambers", &scenario, "--method chambers --rounds 1"},
                  Way{"log-z", &log, "--ring z"}, Way{"log-z2", &log, "--ring z2"}}) {
      const std::string path = work + "/" + name + "." + w.label + ".cert.json";
      std::remove(path.c_str());
      int code = run(std::string(SWEEPCERT_BIN) + " prove " + *w.input + " -o " + path + " --quiet " + w.options);
      if (code == 3 && std::string(w.label) == "chambers") continue;  // undecided: chambers do not succeed here
      if (code != 0) throw std::runtime_error(std::string("prove failed (exit ") + std::to_string(code) + ") on " + name + " " + w.label);
      Cert c;
      c.label = std::string(name) + " " + w.label;
      c.input_text = slurp(*w.input);
      c.doc = json::parse(slurp(path));
      c.doc.erase("notes");  // timings differ between runs; the checker ignores notes
      c.text = c.doc.dump();
      if (!seen.insert(c.input_text + c.text).second) continue;  // e.g. auto = sheet z
      c.kind = kind_of(c.doc);
      c.ctx.input_ids = input_ids(c.input_text);
      out.push_back(std::move(c));
    }
  }
  return out;
}

void print_table(const char* title, const std::map<std::string, Tally>& rows) {
  std::cout << "\n" << std::left << std::setw(22) << title << std::right << std::setw(9) << "tried" << std::setw(10)
            << "rejected" << std::setw(16) << "accepted-valid" << std::setw(16) << "accepted-wrong" << "\n";
  Tally all;
  for (const auto& [name, t] : rows) {
    std::cout << std::left << std::setw(22) << name << std::right << std::setw(9) << t.tried << std::setw(10) << t.rejected
              << std::setw(16) << t.valid << std::setw(16) << t.wrong << "\n";
    all.tried += t.tried, all.rejected += t.rejected, all.valid += t.valid, all.wrong += t.wrong;
  }
  std::cout << std::left << std::setw(22) << "total" << std::right << std::setw(9) << all.tried << std::setw(10) << all.rejected
            << std::setw(16) << all.valid << std::setw(16) << all.wrong << "\n";
}

}  // namespace

int main() {
  using clock = std::chrono::steady_clock;
  const auto start = clock::now();
  const long total = env_long("SWEEPCERT_MUTATIONS", MUTATION_DEFAULT);
  const long seed = env_long("SWEEPCERT_MUTATION_SEED", 20261201);
  const long sample_every = std::max(1L, env_long("SWEEPCERT_REFERENCE_SAMPLE", 4));
  const int timing_runs = MUTATION_MIN_PER_CERT >= 12 ? 3 : 1;
  int failures = 0;

  std::vector<Cert> certs;
  try {
    certs = make_certificates();
  } catch (const std::exception& e) {
    std::cout << "FAIL: " << e.what() << "\n";
    return 1;
  }
  for (Cert& c : certs) c.ctx.input_text = &c.input_text;  // the vector no longer moves
  const double prove_seconds = std::chrono::duration<double>(clock::now() - start).count();

  // The originals: the checker and the reference must both accept every one.
  mutref::Options full;  // 1000 samples per route piece
  std::cout << "certificates (" << certs.size() << "), proved in " << std::fixed << std::setprecision(1) << prove_seconds
            << " s:\n";
  for (Cert& c : certs) {
    std::ostringstream out, err;
    int code = 0;
    double ms = 1e9;
    for (int r = 0; r < timing_runs; ++r) {  // the fastest run estimates the cost of a mutant
      std::ostringstream o, e;
      auto t0 = clock::now();
      code = sweepcheck::check_texts(c.input_text, c.text, r == 0 ? out : o, r == 0 ? err : e);
      ms = std::min(ms, std::chrono::duration<double, std::milli>(clock::now() - t0).count());
    }
    c.check_ms = ms;
    auto t0 = clock::now();
    t0 = clock::now();
    mutref::Verdict v = mutref::verify(c.input_text, c.text, full);
    double ref_ms = std::chrono::duration<double, std::milli>(clock::now() - t0).count();
    c.cost_ms = c.check_ms + 0.3 * ref_ms;
    std::cout << "  " << std::left << std::setw(34) << c.label << std::setw(18) << c.kind << std::right << std::setw(9)
              << c.text.size() << " bytes  check " << std::setw(7) << std::setprecision(1) << ms << " ms  reference "
              << std::setw(8) << ref_ms << " ms\n";
    if (code != 0) {
      std::cout << "FAIL: the checker refuses the original " << c.label << ": " << last_line(out.str() + err.str()) << "\n";
      ++failures;
    }
    if (!v.ok) {
      std::cout << "FAIL: the reference refuses the original " << c.label << ": " << v.why << "\n";
      ++failures;
    }
  }
  if (failures) return 1;

  const auto& ops = mutation::operators();
  mutation::Rng rng(static_cast<std::uint64_t>(seed));
  mutref::Options quick;
  quick.route_samples = 200;  // per mutant; the exact per-piece test decides, samples cross-check
  std::map<std::string, Tally> by_kind, by_op;
  long sampled = 0, sample_refused = 0, wrong_shown = 0, lax_shown = 0, skipped = 0;
  std::map<std::string, long> lax_by_op;
  std::map<std::string, std::pair<long, long>> sample_by_kind;  // sampled, refused by the reference
  double checker_seconds = 0, reference_seconds = 0;
  const auto loop_start = clock::now();
  // Mutants per certificate: proportional to 1/sqrt(cost), at least min_per_cert, so cheap
  // certificates get many mutants and the megabyte ones still get some.
  const long min_per_cert = env_long("SWEEPCERT_MUTATIONS_PER_CERT", MUTATION_MIN_PER_CERT);
  std::vector<long> quota(certs.size());
  double weight_sum = 0;
  for (const Cert& c : certs) weight_sum += 1 / std::sqrt(std::max(1.0, c.cost_ms));
  for (std::size_t k = 0; k < certs.size(); ++k)
    quota[k] = std::max(min_per_cert, static_cast<long>(std::ceil(total / std::sqrt(std::max(1.0, certs[k].cost_ms)) / weight_sum)));
  std::vector<std::size_t> schedule;
  for (std::size_t k = 0; k < certs.size(); ++k) schedule.insert(schedule.end(), quota[k], k);
  std::cout << "mutants per certificate:";
  for (std::size_t k = 0; k < certs.size(); ++k) std::cout << " " << quota[k];
  std::cout << "\n";
  for (std::size_t i = 0; i < schedule.size(); ++i) {
    const Cert& c = certs[schedule[i]];
    std::optional<mutation::Mutant> m;
    std::size_t op = 0;
    for (int attempt = 0; attempt < 100 && !m; ++attempt) {
      op = static_cast<std::size_t>(rng() % ops.size());
      m = ops[op].apply(c.doc, c.ctx, rng);
      if (m && m->text == c.text) m.reset();
    }
    if (!m) {
      ++skipped;
      continue;
    }
    Tally& tk = by_kind[c.kind];
    Tally& to = by_op[ops[op].name];
    ++tk.tried, ++to.tried;
    std::ostringstream out, err;
    auto t0 = clock::now();
    int code = sweepcheck::check_texts(c.input_text, m->text, out, err);
    checker_seconds += std::chrono::duration<double>(clock::now() - t0).count();
    t0 = clock::now();
    struct Stopwatch {  // reference time, whichever way this iteration ends
      double& sum;
      clock::time_point t0;
      ~Stopwatch() { sum += std::chrono::duration<double>(clock::now() - t0).count(); }
    } stopwatch{reference_seconds, t0};
    if (code != 0) {
      ++tk.rejected, ++to.rejected;
      if (static_cast<long>(i) % sample_every == 0) {
        ++sampled;
        ++sample_by_kind[c.kind].first;
        mutref::Verdict v = mutref::verify(c.input_text, m->text, quick);
        if (!v.ok) {
          ++sample_refused;
          ++sample_by_kind[c.kind].second;
        } else {
          ++lax_by_op[ops[op].name];
          if (lax_shown++ < 8)
            std::cout << "note: checker rejects, reference accepts: " << c.label << ": " << m->what << "\n      checker: "
                      << last_line(out.str() + err.str()) << "\n";
        }
      }
      continue;
    }
    mutref::Verdict v = mutref::verify(c.input_text, m->text, quick);
    if (v.ok) {
      ++tk.valid, ++to.valid;
      continue;
    }
    ++tk.wrong, ++to.wrong;
    if (wrong_shown++ < 20) {
      std::string path = std::string(WORK_DIR) + "/wrong-" + std::to_string(wrong_shown) + ".json";
      std::ofstream(path) << m->text;
      std::cout << "ACCEPTED-AND-WRONG: " << c.label << ": " << m->what << "\n  reference: " << v.why
                << "\n  mutant written to " << path << "\n";
    }
  }

  print_table("kind", by_kind);
  print_table("operator", by_op);
  Tally all;
  for (const auto& [k, t] : by_kind) all.tried += t.tried, all.rejected += t.rejected, all.valid += t.valid, all.wrong += t.wrong;
  const double seconds = std::chrono::duration<double>(clock::now() - start).count();
  std::cout << "\nreference on the originals: " << certs.size() << " of " << certs.size() << " accepted\n"
            << "reference on sampled rejected mutants: refused " << sample_refused << " of " << sampled << "\n";
  for (const auto& [kind, n] : sample_by_kind)
    std::cout << "  " << std::left << std::setw(16) << kind << std::right << " refused " << n.second << " of " << n.first << "\n";
  for (const auto& [op, n] : lax_by_op) std::cout << "  accepted by the reference after " << op << ": " << n << "\n";
  std::cout << "time: proving " << std::setprecision(1) << prove_seconds << " s, mutation loop "
            << std::chrono::duration<double>(clock::now() - loop_start).count() << " s (checker " << checker_seconds
            << " s, reference " << reference_seconds << " s)\n";
  std::cout << "mutants: " << all.tried << " (seed " << seed << ", " << skipped << " draws without a site)"
            << "; runtime " << std::setprecision(1) << seconds << " s\n";

  if (all.wrong > 0) {
    std::cout << "FAIL: " << all.wrong << " mutants accepted by the checker and refused by the reference\n";
    ++failures;
  }
  if (all.tried < total) {
    std::cout << "FAIL: only " << all.tried << " mutants of " << total << " requested\n";
    ++failures;
  }
  if (sampled == 0 || sample_refused * 10 < sampled * 9) {
    std::cout << "FAIL: the reference refuses fewer than 90% of the sampled rejected mutants\n";
    ++failures;
  }
  if (all.valid == 0) {
    std::cout << "FAIL: no mutant was accepted; the reference never judged an accepted mutant\n";
    ++failures;
  }
  std::cout << (failures ? "FAILED" : "PASSED") << "\n";
  return failures ? 1 : 0;
}
