// `sweepcert prove`: read, build the stack, choose the method, write the certificate.
//
// With --margin M > 0 (positional input, schema §4.1.1) no-evasion is proved on the sweep with
// every radius reduced by M and a route is sought on the sweep with every radius increased by
// M. A disk of radius r − M around a stated centre lies inside the true disk of any centre
// within M of it, and a route clear of radius r + M is clear of it; between the two the answer
// can depend on the position errors, and then it is reported undecided.
#include <chrono>
#include <cstdio>
#include <iostream>
#include <optional>
#include <nlohmann/json.hpp>
#include <unistd.h>

#include "app/commands.hpp"
#include "cert/emit.hpp"
#include "io/read_input.hpp"
#include "sheet/solve.hpp"

namespace sweepcert {
namespace {

const char* kCovers =
    "The certificate covers the model as given: closed disks of the stated radii, the fence as "
    "listed, and the tracks or contact log as given. It does not cover sensor faults, occlusion, "
    "wrong positions or wrong logs; follow site-specific security practice.";
const char* kBetweenFrames =
    "Contact log: a contact present in two consecutive frames is taken to hold in between "
    "(true for linear motion, an assumption otherwise).";

// The `covers` note: what the certificate's proof relies on.
std::string covers_text(const Rational& margin) {
  if (margin == 0) return kCovers;
  return "The certificate covers the model as given -- closed disks of the stated radii, the fence "
         "as listed and the tracks as given -- with every sensor's centre, fence included, "
         "anywhere within " + to_text(margin) + " of its stated position at every time. It does "
         "not cover sensor faults, occlusion or larger position errors; follow site-specific "
         "security practice.";
}

// What a margin adds to the summary of a claim.
std::string margin_words(const Rational& margin, bool safe) {
  if (margin == 0) return "";
  const std::string m = to_text(margin);
  return safe ? "; this holds even if every sensor, fence included, is up to " + m +
                    " away from its stated position at every time"
              : "; the route keeps clear of every disk even if each sensor is up to " + m +
                    " away from its stated position";
}

double seconds_since(std::chrono::steady_clock::time_point t0) {
  return std::chrono::duration<double>(std::chrono::steady_clock::now() - t0).count();
}

}  // namespace

int run_prove(const ParsedArgs& args) {
  auto t0 = std::chrono::steady_clock::now();
  if (args.positional.size() != 1) throw UsageError("prove takes exactly one INPUT file");
  if (!args.has("-o")) throw UsageError("prove needs -o CERT");
  const std::string method = args.get("--method");
  if (method != "auto" && method != "sheet" && method != "chambers" && method != "route")
    throw UsageError("--method must be auto, sheet, chambers or route");
  const std::string ring_text = args.get("--ring");
  if (ring_text != "z" && ring_text != "z2") throw UsageError("--ring must be z or z2");
  Ring ring = ring_text == "z" ? Ring::Z : Ring::Z2;
  long max_frames = std::atol(args.get("--max-frames").c_str());
  if (max_frames < 2) throw UsageError("--max-frames must be a whole number >= 2");
  long rounds = std::atol(args.get("--rounds").c_str());
  if (rounds < 0 || rounds > 12) throw UsageError("--rounds must be a whole number from 0 to 12");
  std::string why_not;
  std::optional<Rational> margin_read = parse_exact(args.get("--margin"), &why_not);
  if (!margin_read || *margin_read < 0)
    throw UsageError("--margin must be an exact number >= 0, not '" + args.get("--margin") + "'" +
                     (margin_read ? "" : " (" + why_not + ")"));
  const Rational margin = *margin_read;
  const std::string m = to_text(margin);
  bool quiet = args.has("--quiet");
  const std::string out_path = args.get("-o");

  Input input = read_input(args.positional[0]);
  const Sweep* sweep = std::get_if<Sweep>(&input.content);
  if (!sweep && (method == "chambers" || method == "route"))
    throw UsageError("--method " + method + " needs positions (a sweepcert-scenario-1 input)");
  if (!sweep && margin > 0)
    throw UsageError("--margin needs positions (a sweepcert-scenario-1 input): a contact log "
                     "has no radii to adjust");
  bool progress_wanted = !quiet && ::isatty(STDERR_FILENO);
  auto last = std::chrono::steady_clock::now();
  auto tick = [&](const std::string& what) {
    if (!progress_wanted || seconds_since(last) < 1.0) return;
    last = std::chrono::steady_clock::now();
    std::fprintf(stderr, "\rsweepcert: %-70s", what.c_str());
  };
  auto clear_progress = [&] { if (progress_wanted) std::fprintf(stderr, "\r%80s\r", ""); };

  std::size_t mobile = sweep ? sweep->sensors.size() - sweep->fence_count
                             : std::get<ContactLog>(input.content).ids.size() -
                                   std::get<ContactLog>(input.content).fence_count;
  std::size_t fence = sweep ? sweep->fence_count : std::get<ContactLog>(input.content).fence_count;
  if (!quiet)
    std::printf("input:       %s (%s), %zu fence + %zu mobile sensors\n", input.path.c_str(),
                sweep ? "positional" : "contact log", fence, mobile);

  // No-evasion is proved on `safe_sweep` (radii reduced by the margin; null when the reduced
  // sweep breaks §2.1), routes are sought on `route_sweep` (radii increased).
  Sweep shrunk, grown;
  const Sweep* safe_sweep = sweep;
  const Sweep* route_sweep = sweep;
  std::vector<std::string> safe_failures, route_failures;  // why each side failed, for the message
  if (margin > 0) {
    shrunk = adjusted(*sweep, -margin);
    grown = adjusted(*sweep, margin);
    route_sweep = &grown;
    std::string problem = radius_problem(shrunk);
    if (problem.empty()) safe_sweep = &shrunk;
    else {
      safe_sweep = nullptr;
      safe_failures.push_back("no-evasion cannot be certified (" + problem + ")");
    }
    if (!quiet) {
      std::printf("margin:      %s: no-evasion is proved with every radius reduced by %s, a route "
                  "must clear every radius increased by %s\n", m.c_str(), m.c_str(), m.c_str());
      if (!problem.empty())
        std::printf("             with radii reduced by %s no-evasion cannot be certified (%s)\n",
                    m.c_str(), problem.c_str());
    }
  }

  // Which chamber and route searches follow a failed sheet: without a margin one search on the
  // sweep does both; with one, chambers on the reduced sweep, then routes on the enlarged one.
  // Under auto the reduced search also looks for routes: one found there settles quickly that
  // no-evasion cannot hold at this margin, where failing chambers would refine for long.
  struct Search { const Sweep* sweep; bool chambers, route; };
  std::vector<Search> searches;
  bool want_chambers = method == "auto" || method == "chambers";
  bool want_route = method == "auto" || method == "route";
  if (margin == 0 && sweep && (want_chambers || want_route))
    searches.push_back({sweep, want_chambers, want_route});
  if (margin > 0 && want_chambers && safe_sweep) searches.push_back({safe_sweep, true, want_route});
  if (margin > 0 && want_route) searches.push_back({route_sweep, false, true});

  CertificateHeader h;
  h.input_sha256 = input.sha256;
  h.input_format = input.format;
  h.margin = margin;
  const std::string covers = covers_text(margin);

  if ((method == "auto" || method == "sheet") && (safe_sweep || !sweep)) {
    Stack stack;
    if (sweep) {
      FramePlan plan;
      plan.max_frames = static_cast<std::size_t>(max_frames);
      stack = stack_of_sweep(*safe_sweep, plan);
    } else {
      stack = stack_of_log(std::get<ContactLog>(input.content));
    }
    double t_stack = seconds_since(t0);
    SheetOutcome o = solve_sheet(stack, ring, [&](std::size_t done, std::size_t all) {
      tick("eliminating " + std::to_string(done) + " / " + std::to_string(all) + " 2-cells");
    });
    clear_progress();
    double t_solve = seconds_since(t0) - t_stack;
    StackSize size = measure(stack);
    if (!quiet)
      std::printf("stack:       %zu frames, %zu edges, %zu triangles, %zu prisms (%zu 2-cells), %.2f s\n",
                  stack.frame_count(), size.edges, size.triangles, size.prisms,
                  size.triangles + size.prisms, t_stack + t_solve);
    // A cocycle may not carry a margin (§4.1.1): with one, a missing sheet is only a failure.
    if (o.sheet || (margin == 0 && (!sweep || method == "sheet"))) {
      h.claim = o.sheet ? "no-evasion" : "no-sheet";
      h.method = o.sheet ? "sheet" : "cocycle";
      h.ring = ring_name(ring);
      h.frames.assign(stack.times.begin(), stack.times.begin() + o.last_frame + 1);
      std::string words;
      if (o.sheet)
        words = "no evasion path: a separating sheet over " + h.ring + " (winding " +
                o.winding.get_str() + ") closes by frame " + std::to_string(o.last_frame) +
                " (t = " + to_text(stack.times[o.last_frame]) + ")" + margin_words(margin, true);
      else if (sweep)
        words = "no separating sheet over " + h.ring + " on these " + std::to_string(stack.frame_count()) +
                " frames. For positional input this does not decide whether an evasion path "
                "exists; --method auto or chambers decides that.";
      else
        words = "no separating sheet over " + h.ring +
                ": the contacts alone cannot prove coverage; positions are needed.";
      nlohmann::json notes = {{"summary", words}, {"covers", covers}, {"prover", "sweepcert 0.2.0"},
                              {"stack", {{"frames", stack.frame_count()}, {"sensors", stack.vertex_count()},
                                         {"edges", size.edges}, {"triangles", size.triangles},
                                         {"prisms", size.prisms}}}};
      if (!sweep) notes["assumptions"] = {kBetweenFrames};
      h.notes_json = notes.dump();
      JsonCertificateWriter writer(out_path);
      CountingSink counter;
      emit_certificate(stack, o, h, writer);
      emit_certificate(stack, o, h, counter);
      writer.commit();
      if (!quiet) {
        std::printf("claim:       %s\n             %s\n", h.claim.c_str(), words.c_str());
        if (o.sheet)
          std::printf("certificate: %s, sheet of %zu triangles + %zu prisms, %.1f KB\n",
                      out_path.c_str(), counter.triangles, counter.prisms, writer.bytes_written() / 1024.0);
        else
          std::printf("certificate: %s, cocycle on %zu edges + %zu verticals, %.1f KB\n",
                      out_path.c_str(), counter.edges, counter.verticals, writer.bytes_written() / 1024.0);
        std::printf("time:        %.2f s (stack %.2f s, elimination %.2f s, %llu column additions)\n",
                    seconds_since(t0), t_stack, t_solve, static_cast<unsigned long long>(o.additions));
        std::printf("scope:       %s\n", covers.c_str());
      }
      return kOk;
    }
    safe_failures.push_back("no separating sheet over " + std::string(ring_name(ring)) + " on " +
                            std::to_string(stack.frame_count()) + " frames");
    if (!quiet)
      std::printf("sheet:       none exists on these frames%s\n",
                  searches.empty() ? "" : "; deciding by chambers and routes");
  }

  // Positional input without a sheet: time-ordered chambers, else an evasion route.
  using Outcome = ChamberResult::Outcome;
  ChamberResult r;
  double t_ch = 0;
  ChamberPlan plan;
  for (const Search& search : searches) {
    auto t1 = std::chrono::steady_clock::now();
    plan.try_chambers = search.chambers;
    plan.try_route = search.route;
    plan.rounds = static_cast<int>(rounds);
    r = decide_by_chambers(*search.sweep, plan, tick);
    clear_progress();
    t_ch = seconds_since(t1);
    bool reduced = margin > 0 && search.chambers;
    if (r.outcome == Outcome::NoEvasion || (r.outcome == Outcome::Evasion && !reduced)) break;
    if (r.outcome == Outcome::Evasion) {
      safe_failures.push_back("an intruder route exists even then");
      r.outcome = Outcome::Undecided;
      continue;
    }
    std::string why = "undecided after " + std::to_string(r.rounds_used) +
                      " rounds, narrowest call: " + r.narrowest;
    if (reduced) safe_failures.push_back("chambers " + why);
    else if (r.no_route) route_failures.push_back(r.narrowest);
    else route_failures.push_back("no route found; " + why);
  }
  if (r.outcome == Outcome::Undecided && margin == 0) {
    std::fprintf(stderr,
                 "sweepcert: undecided after %d rounds (%.2f s): neither %s could be certified.\n"
                 "  Narrowest call: %s%s.\n  Widen coverage there, or allow more rounds (--rounds). "
                 "No certificate written.\n",
                 r.rounds_used, t_ch,
                 plan.try_chambers && plan.try_route ? "an empty live set nor a route"
                 : plan.try_chambers               ? "an empty live set"
                                                   : "a route",
                 r.narrowest.c_str(),
                 r.no_route ? " (use --method chambers or auto to certify that)" : "");
    return kUndecided;
  }
  if (r.outcome == Outcome::Undecided) {
    bool tried_safe = method != "route";
    std::string head;
    if (tried_safe) head = "no evasion is provable with radii reduced by " + m;
    if (want_route)
      head += std::string(tried_safe ? ", and no route" : "no route") +
              " keeps clear of radii increased by " + m;
    auto joined = [](const std::vector<std::string>& v) {
      std::string out;
      for (const auto& s : v) out += (out.empty() ? "" : "; ") + s;
      return out;
    };
    std::fprintf(stderr, "sweepcert: undecided at margin %s (%.2f s): %s.\n", m.c_str(),
                 seconds_since(t0), head.c_str());
    if (tried_safe)
      std::fprintf(stderr, "  radii reduced by %s: %s.\n", m.c_str(), joined(safe_failures).c_str());
    if (want_route)
      std::fprintf(stderr, "  radii increased by %s: %s.\n", m.c_str(), joined(route_failures).c_str());
    if (method != "auto") std::fprintf(stderr, "  Only --method %s was tried.\n", method.c_str());
    std::fprintf(stderr,
                 "  The answer may depend on position errors below %s; a smaller --margin may "
                 "decide it. No certificate written.\n", m.c_str());
    return kUndecided;
  }
  bool safe = r.outcome == Outcome::NoEvasion;
  h.claim = safe ? "no-evasion" : "evasion";
  h.method = safe ? "chambers" : "route";
  std::string words;
  if (safe) {
    words = "no evasion path: the live set of time-ordered chambers is empty by t = " +
            to_text(r.slabs.back().b) + " (" + std::to_string(r.slabs.size()) + " slabs)";
  } else {
    const auto& p = r.route.front();
    words = "an intruder can evade: starting at (" + to_text(p[1]) + ", " + to_text(p[2]) +
            ") at t = " + to_text(p[0]) + " it stays outside every disk until t = " +
            to_text(r.route.back()[0]) + " (" + std::to_string(r.route.size()) + " waypoints)";
  }
  words += margin_words(margin, safe);
  nlohmann::json notes = {{"summary", words}, {"covers", covers}, {"prover", "sweepcert 0.2.0"},
                          {"rounds", r.rounds_used}, {"cells", r.cells}};
  h.notes_json = notes.dump();
  JsonCertificateWriter writer(out_path);
  CountingSink counter;
  if (safe) {
    emit_chambers(*safe_sweep, r, h, writer);
    emit_chambers(*safe_sweep, r, h, counter);
  } else {
    emit_route(r, h, writer);
    emit_route(r, h, counter);
  }
  writer.commit();
  if (!quiet) {
    std::printf("claim:       %s\n             %s\n", h.claim.c_str(), words.c_str());
    if (safe)
      std::printf("certificate: %s, %zu slabs, %zu cells, %.1f KB\n", out_path.c_str(), counter.slabs,
                  counter.cells, writer.bytes_written() / 1024.0);
    else
      std::printf("certificate: %s, route of %zu waypoints, %.1f KB\n", out_path.c_str(),
                  counter.route_points, writer.bytes_written() / 1024.0);
    std::printf("time:        %.2f s (chambers and routes %.2f s, %d round%s, %zu cells built)\n",
                seconds_since(t0), t_ch, r.rounds_used, r.rounds_used == 1 ? "" : "s", r.cells);
    std::printf("scope:       %s\n", covers.c_str());
  }
  return kOk;
}

}  // namespace sweepcert
