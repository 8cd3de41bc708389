// gen_contacts: random contact logs in the `sweepcert-contacts-1` format (schema/README.md §2.2).
//
//   gen_contacts small   --seed S -o FILE
//       a small random log (4-8 fence ids, 2-8 mobile ids, 1-6 frames, listed or from-pairs
//       triangles), as used by tests/reference/gudhi_sheet_reference.
//   gen_contacts walkers [--n 1200] [--box 240] [--frames 240] [--range R] [--seed S] -o FILE
//       a large benchmark log: n lattice walkers in [0,box]^2 plus a fence along the box
//       boundary, one frame per second, pairs = sensors within distance R (exact), triangles
//       from pairs. Prints counts of pairs, pairwise triangles and stack 2-cells to stderr.
//
// Standalone: uses only tests/tools/gen_contacts_lib.hpp and the standard library.
#include <chrono>
#include <cstdlib>
#include <fstream>
#include <iostream>
#include <string>

#include "gen_contacts_lib.hpp"

namespace {
[[noreturn]] void usage(const char* msg = nullptr) {
  if (msg) std::cerr << "gen_contacts: " << msg << "\n";
  std::cerr << "usage: gen_contacts small --seed S -o FILE\n"
               "       gen_contacts walkers [--n N] [--box B] [--frames F] [--range R] [--seed S] -o FILE\n";
  std::exit(2);
}

long long to_int(const std::string& s, const char* what) {
  try {
    std::size_t pos = 0;
    long long v = std::stoll(s, &pos);
    if (pos != s.size() || v < 0) throw 0;
    return v;
  } catch (...) {
    usage((std::string("bad value for ") + what + ": " + s).c_str());
  }
}
}  // namespace

int main(int argc, char** argv) {
  if (argc < 2) usage();
  const std::string mode = argv[1];
  std::string out;
  std::uint64_t seed = 1;
  gen_contacts::WalkerParams wp;
  for (int i = 2; i < argc; ++i) {
    std::string a = argv[i];
    auto value = [&]() -> std::string {
      if (i + 1 >= argc) usage(("missing value after " + a).c_str());
      return argv[++i];
    };
    if (a == "-o") out = value();
    else if (a == "--seed") seed = static_cast<std::uint64_t>(to_int(value(), "--seed"));
    else if (a == "--n" && mode == "walkers") wp.n = static_cast<int>(to_int(value(), "--n"));
    else if (a == "--box" && mode == "walkers") wp.box = static_cast<int>(to_int(value(), "--box"));
    else if (a == "--frames" && mode == "walkers") wp.frames = static_cast<int>(to_int(value(), "--frames"));
    else if (a == "--range" && mode == "walkers") wp.range = value();
    else usage(("unknown argument " + a).c_str());
  }
  if (out.empty()) usage("missing -o FILE");
  std::ofstream os(out, std::ios::binary);
  if (!os) usage(("cannot write " + out).c_str());
  try {
    if (mode == "small") {
      gen_contacts::write_json(os, gen_contacts::generate_small(seed));
    } else if (mode == "walkers") {
      if (wp.n < 0 || wp.box < 1 || wp.frames < 1) usage("need --box >= 1 and --frames >= 1");
      wp.seed = seed;
      auto t0 = std::chrono::steady_clock::now();
      gen_contacts::WalkerStats st = gen_contacts::generate_walkers(wp, os);
      double secs = std::chrono::duration<double>(std::chrono::steady_clock::now() - t0).count();
      std::cerr << "walkers: n=" << wp.n << " fence=" << st.fence << " box=" << wp.box
                << " frames=" << wp.frames << " range=" << st.range
                << " sensing-radius=" << st.sensing_radius << "\n"
                << "pairs (sum over frames): " << st.pairs << "\n"
                << "pairwise triangles (sum over frames): " << st.triangles << "\n"
                << "prisms (pairs present at two consecutive frames): " << st.persisting << "\n"
                << "stack 2-cells (triangles + prisms): " << st.two_cells() << "\n"
                << "generated in " << secs << " s\n";
    } else {
      usage(("unknown mode " + mode).c_str());
    }
  } catch (const std::exception& e) {
    std::cerr << "gen_contacts: " << e.what() << "\n";
    return 2;
  }
  os.close();
  if (!os) {
    std::cerr << "gen_contacts: error writing " << out << "\n";
    return 2;
  }
  return 0;
}
