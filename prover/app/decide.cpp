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
  if (method == "chambers" || method == "route")
    throw UsageError("--method " + method + " is not available in this version (use auto or sheet)");
  if (method != "auto" && method != "sheet") throw UsageError("--method must be auto or sheet");
  const std::string ring_text = args.get("--ring");
  if (ring_text != "z" && ring_text != "z2") throw UsageError("--ring must be z or z2");
  Ring ring = ring_text == "z" ? Ring::Z : Ring::Z2;
  long max_frames = std::atol(args.get("--max-frames").c_str());
  if (max_frames < 2) throw UsageError("--max-frames must be a whole number >= 2");
  bool quiet = args.has("--quiet");

  Input input = read_input(args.positional[0]);
  Stack stack;
  std::size_t mobile = 0;
  if (auto* sweep = std::get_if<Sweep>(&input.content)) {
    FramePlan plan;
    plan.max_frames = static_cast<std::size_t>(max_frames);
    stack = stack_of_sweep(*sweep, plan);
    mobile = sweep->sensors.size() - sweep->fence_count;
  } else {
    const auto& log = std::get<ContactLog>(input.content);
    stack = stack_of_log(log);
    mobile = log.ids.size() - log.fence_count;
  }
  double t_stack = seconds_since(t0);

  bool progress_wanted = !quiet && ::isatty(STDERR_FILENO);
  auto last = std::chrono::steady_clock::now();
  Progress progress = [&](std::size_t done, std::size_t all) {
    if (!progress_wanted || seconds_since(last) < 1.0) return;
    last = std::chrono::steady_clock::now();
    std::fprintf(stderr, "\rsweepcert: eliminating %zu / %zu 2-cells", done, all);
  };
  SheetOutcome o = solve_sheet(stack, ring, progress);
  if (progress_wanted) std::fprintf(stderr, "\r%60s\r", "");
  double t_solve = seconds_since(t0) - t_stack;

  StackSize size = measure(stack);
  CertificateHeader h;
  h.claim = o.sheet ? "no-evasion" : "no-sheet";
  h.method = o.sheet ? "sheet" : "cocycle";
  h.input_sha256 = input.sha256;
  h.input_format = input.format;
  h.ring = ring_name(ring);
  h.frames.assign(stack.times.begin(), stack.times.begin() + o.last_frame + 1);

  std::string claim_words;
  if (o.sheet) {
    claim_words = "no evasion path: a separating sheet over " + std::string(h.ring) +
                  " (winding " + o.winding.get_str() + ") closes by frame " +
                  std::to_string(o.last_frame) + " (t = " + to_text(stack.times[o.last_frame]) + ")";
  } else if (stack.positional) {
    claim_words = "no separating sheet over " + std::string(h.ring) + " on these " +
                  std::to_string(stack.frame_count()) +
                  " frames. For positional input this does not decide whether an evasion path "
                  "exists; the chamber argument (a later version) decides that.";
  } else {
    claim_words = "no separating sheet over " + std::string(h.ring) +
                  ": the contacts alone cannot prove coverage; positions are needed.";
  }
  nlohmann::json notes = {
      {"summary", claim_words},
      {"covers", kCovers},
      {"prover", "sweepcert 0.1.0"},
      {"stack", {{"frames", stack.frame_count()}, {"sensors", stack.vertex_count()},
                 {"edges", size.edges}, {"triangles", size.triangles}, {"prisms", size.prisms}}},
  };
  if (!stack.positional) notes["assumptions"] = {kBetweenFrames};

  h.notes_json = notes.dump();
  JsonCertificateWriter writer(args.get("-o"));
  CountingSink counter;
  emit_certificate(stack, o, h, writer);
  emit_certificate(stack, o, h, counter);
  writer.commit();
  double t_all = seconds_since(t0);

  if (!quiet) {
    std::printf("input:       %s (%s), %zu fence + %zu mobile sensors\n", input.path.c_str(),
                stack.positional ? "positional" : "contact log", stack.fence_count, mobile);
    std::printf("stack:       %zu frames, %zu edges, %zu triangles, %zu prisms (%zu 2-cells)\n",
                stack.frame_count(), size.edges, size.triangles, size.prisms,
                size.triangles + size.prisms);
    std::printf("claim:       %s\n", h.claim.c_str());
    std::printf("             %s\n", claim_words.c_str());
    if (o.sheet)
      std::printf("certificate: %s, sheet of %zu triangles + %zu prisms, %.1f KB\n",
                  args.get("-o").c_str(), counter.triangles, counter.prisms,
                  writer.bytes_written() / 1024.0);
    else
      std::printf("certificate: %s, cocycle on %zu edges + %zu verticals, %.1f KB\n",
                  args.get("-o").c_str(), counter.edges, counter.verticals,
                  writer.bytes_written() / 1024.0);
    std::printf("time:        %.2f s (stack %.2f s, elimination %.2f s, %llu column additions)\n",
                t_all, t_stack, t_solve, static_cast<unsigned long long>(o.additions));
    std::printf("scope:       %s\n", kCovers);
  }
  return kOk;
}

}  // namespace sweepcert
