// `sweepcert prove`: read, build the stack, choose the method, write the certificate.
#include <chrono>
#include <cstdio>
#include <iostream>
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
  bool quiet = args.has("--quiet");
  const std::string out_path = args.get("-o");

  Input input = read_input(args.positional[0]);
  const Sweep* sweep = std::get_if<Sweep>(&input.content);
  if (!sweep && (method == "chambers" || method == "route"))
    throw UsageError("--method " + method + " needs positions (a sweepcert-scenario-1 input)");
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

  CertificateHeader h;
  h.input_sha256 = input.sha256;
  h.input_format = input.format;

  if (method == "auto" || method == "sheet") {
    Stack stack;
    if (sweep) {
      FramePlan plan;
      plan.max_frames = static_cast<std::size_t>(max_frames);
      stack = stack_of_sweep(*sweep, plan);
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
    if (o.sheet || !sweep || method == "sheet") {
      h.claim = o.sheet ? "no-evasion" : "no-sheet";
      h.method = o.sheet ? "sheet" : "cocycle";
      h.ring = ring_name(ring);
      h.frames.assign(stack.times.begin(), stack.times.begin() + o.last_frame + 1);
      std::string words;
      if (o.sheet)
        words = "no evasion path: a separating sheet over " + h.ring + " (winding " +
                o.winding.get_str() + ") closes by frame " + std::to_string(o.last_frame) +
                " (t = " + to_text(stack.times[o.last_frame]) + ")";
      else if (sweep)
        words = "no separating sheet over " + h.ring + " on these " + std::to_string(stack.frame_count()) +
                " frames. For positional input this does not decide whether an evasion path "
                "exists; --method auto or chambers decides that.";
      else
        words = "no separating sheet over " + h.ring +
                ": the contacts alone cannot prove coverage; positions are needed.";
      nlohmann::json notes = {{"summary", words}, {"covers", kCovers}, {"prover", "sweepcert 0.2.0"},
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
        std::printf("scope:       %s\n", kCovers);
      }
      return kOk;
    }
    if (!quiet) std::printf("sheet:       none exists on these frames; deciding by chambers and routes\n");
  }

  // Positional input without a sheet: time-ordered chambers, else an evasion route.
  auto t1 = std::chrono::steady_clock::now();
  ChamberPlan plan;
  plan.try_chambers = method != "route";
  plan.try_route = method != "chambers";
  plan.rounds = static_cast<int>(rounds);
  ChamberResult r = decide_by_chambers(*sweep, plan, tick);
  clear_progress();
  double t_ch = seconds_since(t1);
  if (r.outcome == ChamberResult::Outcome::Undecided) {
    std::fprintf(stderr,
                 "sweepcert: undecided after %d rounds (%.2f s): neither %s could be certified.\n"
                 "  Narrowest call: %s.\n  Widen coverage there, or allow more rounds (--rounds). "
                 "No certificate written.\n",
                 r.rounds_used, t_ch,
                 plan.try_chambers && plan.try_route ? "an empty live set nor a route"
                 : plan.try_chambers               ? "an empty live set"
                                                   : "a route",
                 r.narrowest.c_str());
    return kUndecided;
  }
  bool safe = r.outcome == ChamberResult::Outcome::NoEvasion;
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
  nlohmann::json notes = {{"summary", words}, {"covers", kCovers}, {"prover", "sweepcert 0.2.0"},
                          {"rounds", r.rounds_used}, {"cells", r.cells}};
  h.notes_json = notes.dump();
  JsonCertificateWriter writer(out_path);
  CountingSink counter;
  if (safe) {
    emit_chambers(*sweep, r, h, writer);
    emit_chambers(*sweep, r, h, counter);
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
    std::printf("scope:       %s\n", kCovers);
  }
  return kOk;
}

}  // namespace sweepcert
