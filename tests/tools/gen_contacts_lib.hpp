// Random contact logs in the `sweepcert-contacts-1` format (schema/README.md §2.2).
//
// Standalone: no project code. Shared by tests/tools/gen_contacts.cpp (the command-line tool)
// and tests/reference/gudhi_sheet_reference.cpp (the GUDHI reference test).
//
// Randomness comes from std::mt19937_64 (its output sequence is fixed by the standard) and our
// own helpers below, never from <random> distributions (whose results differ between standard
// libraries), so a seed gives the same log everywhere.
#pragma once

#include <algorithm>
#include <array>
#include <cmath>
#include <cstdint>
#include <cstdio>
#include <iterator>
#include <map>
#include <ostream>
#include <random>
#include <set>
#include <sstream>
#include <stdexcept>
#include <string>
#include <utility>
#include <vector>

namespace gen_contacts {

// ---------------------------------------------------------------------------------------------
// Random helpers (portable).
struct Rng {
  std::mt19937_64 g;
  explicit Rng(std::uint64_t seed) : g(seed * 0x9E3779B97F4A7C15ULL + 0x1234567ULL) {}
  std::uint64_t next() { return g(); }
  // Uniform integer in [lo, hi] (inclusive); the modulo bias is irrelevant here.
  long long uniform_int(long long lo, long long hi) {
    return lo + static_cast<long long>(next() % static_cast<std::uint64_t>(hi - lo + 1));
  }
  double uniform01() { return static_cast<double>(next() >> 11) * (1.0 / 9007199254740992.0); }
  double uniform(double lo, double hi) { return lo + (hi - lo) * uniform01(); }
  bool chance(double p) { return uniform01() < p; }
  template <class T>
  void shuffle(std::vector<T>& v) {
    for (std::size_t i = v.size(); i > 1; --i) std::swap(v[i - 1], v[next() % i]);
  }
};

// ---------------------------------------------------------------------------------------------
// In-memory contact log.
struct Frame {
  std::string t;      // raw JSON text of the time: either a quoted string or a bare number
  double t_value = 0; // the time as a double (only for sanity checks)
  std::vector<std::pair<std::string, std::string>> pairs;
  std::vector<std::array<std::string, 3>> triples;  // only with triangles = "listed"
};

struct Log {
  std::string title;
  std::vector<std::string> fence;    // cyclic order
  std::vector<std::string> sensors;  // mobile ids
  bool write_sensors = true;         // the `sensors` key is optional
  bool listed = true;                // "listed" or from-pairs
  std::string contact_range = "10";  // from-pairs parameters (JSON strings)
  std::string sensing_radius = "6";
  std::vector<Frame> frames;
};

inline std::string json_string(const std::string& s) {
  std::string out = "\"";
  for (char c : s) {
    if (c == '"' || c == '\\') {
      out += '\\';
      out += c;
    } else if (static_cast<unsigned char>(c) < 0x20) {
      char buf[8];
      std::snprintf(buf, sizeof buf, "\\u%04x", static_cast<unsigned>(static_cast<unsigned char>(c)));
      out += buf;
    } else {
      out += c;
    }
  }
  return out + "\"";
}

inline void write_json(std::ostream& os, const Log& log) {
  os << "{\"format\": \"sweepcert-contacts-1\",\n";
  if (!log.title.empty()) os << " \"title\": " << json_string(log.title) << ",\n";
  os << " \"fence\": [";
  for (std::size_t i = 0; i < log.fence.size(); ++i) os << (i ? ", " : "") << json_string(log.fence[i]);
  os << "],\n";
  if (log.write_sensors) {
    os << " \"sensors\": [";
    for (std::size_t i = 0; i < log.sensors.size(); ++i)
      os << (i ? ", " : "") << json_string(log.sensors[i]);
    os << "],\n";
  }
  if (log.listed)
    os << " \"triangles\": \"listed\",\n";
  else
    os << " \"triangles\": {\"from-pairs\": {\"contact-range\": " << json_string(log.contact_range)
       << ", \"sensing-radius\": " << json_string(log.sensing_radius) << "}},\n";
  os << " \"frames\": [\n";
  for (std::size_t k = 0; k < log.frames.size(); ++k) {
    const Frame& f = log.frames[k];
    os << "  {\"t\": " << f.t << ", \"pairs\": [";
    for (std::size_t i = 0; i < f.pairs.size(); ++i)
      os << (i ? ", " : "") << "[" << json_string(f.pairs[i].first) << ", "
         << json_string(f.pairs[i].second) << "]";
    os << "]";
    if (log.listed) {
      os << ", \"triples\": [";
      for (std::size_t i = 0; i < f.triples.size(); ++i)
        os << (i ? ", " : "") << "[" << json_string(f.triples[i][0]) << ", "
           << json_string(f.triples[i][1]) << ", " << json_string(f.triples[i][2]) << "]";
      os << "]";
    }
    os << "}" << (k + 1 < log.frames.size() ? "," : "") << "\n";
  }
  os << " ]}\n";
}

// ---------------------------------------------------------------------------------------------
// Combinatorial view of a log, shared by the reference test: vertex set, and per frame the
// edges and the triangles (listed ones, or every pairwise triangle with from-pairs).
struct Combinatorial {
  std::vector<std::string> ids;  // vertex set (§2.2): fence, sensors, every id used; sorted
  std::map<std::string, int> index;
  std::vector<int> fence;  // fence as indices into ids, cyclic order
  std::vector<std::set<std::pair<int, int>>> edges;           // per frame, (a < b)
  std::vector<std::set<std::array<int, 3>>> triangles;        // per frame, sorted
};

inline Combinatorial combinatorial(const Log& log) {
  Combinatorial c;
  std::set<std::string> ids(log.fence.begin(), log.fence.end());
  ids.insert(log.sensors.begin(), log.sensors.end());
  for (const Frame& f : log.frames) {
    for (auto& p : f.pairs) ids.insert({p.first, p.second});
    for (auto& t : f.triples) ids.insert(t.begin(), t.end());
  }
  c.ids.assign(ids.begin(), ids.end());  // std::set<std::string> order == byte order
  for (std::size_t i = 0; i < c.ids.size(); ++i) c.index[c.ids[i]] = static_cast<int>(i);
  for (auto& f : log.fence) c.fence.push_back(c.index.at(f));
  for (const Frame& f : log.frames) {
    std::set<std::pair<int, int>> e;
    for (auto& p : f.pairs) {
      int a = c.index.at(p.first), b = c.index.at(p.second);
      e.insert({std::min(a, b), std::max(a, b)});
    }
    std::set<std::array<int, 3>> tri;
    if (log.listed) {
      for (auto& t : f.triples) {
        std::array<int, 3> s{c.index.at(t[0]), c.index.at(t[1]), c.index.at(t[2])};
        std::sort(s.begin(), s.end());
        tri.insert(s);
      }
    } else {
      std::vector<std::vector<int>> nb(c.ids.size());
      for (auto& [a, b] : e) nb[a].push_back(b);  // forward neighbours (b > a), sorted
      for (auto& [a, b] : e)
        for (int x : nb[b])
          if (e.count({a, x})) tri.insert({a, b, x});
    }
    c.edges.push_back(std::move(e));
    c.triangles.push_back(std::move(tri));
  }
  return c;
}

// ---------------------------------------------------------------------------------------------
// Mode a): small random logs for the reference test.
//
// Geometry: the fence sits on a circle of radius 8 around (10, 10), slightly jittered; mobile
// sensors start anywhere in [1, 19]^2 and take a random step each frame. A pair is in contact
// when within `pair_range`; with "listed" a triple is listed when its three sensors are pairwise
// within `triple_range` (and all three pairs are present) and not randomly dropped. Consecutive
// fence ids are always in contact; other fence-fence contacts come from geometry or from a
// random chord. Probabilities are tuned so that sheet / no sheet both occur often (see the
// reference test, which reports the counts).
inline Log generate_small(std::uint64_t seed) {
  Rng rng(seed);
  Log log;
  log.title = "random small log, seed " + std::to_string(seed);
  const int m = static_cast<int>(rng.uniform_int(4, 8));
  const int n_mobile = static_cast<int>(rng.uniform_int(2, 8));
  const int n_frames = static_cast<int>(rng.uniform_int(1, 6));
  log.listed = rng.chance(0.6);
  log.write_sensors = rng.chance(0.8);

  // Fence names: F0..F(m-1) assigned by a random permutation, so the listed cyclic order is
  // unrelated to the byte order of the ids.
  std::vector<int> perm(m);
  for (int i = 0; i < m; ++i) perm[i] = i;
  rng.shuffle(perm);
  for (int i = 0; i < m; ++i) log.fence.push_back("F" + std::to_string(perm[i]));
  // Mobile names: a mixed pool (upper/lower case, digits), so byte order is exercised.
  std::vector<std::string> pool = {"A", "B", "C", "D", "a", "b", "c", "m1", "m10", "m2",
                                   "Z", "z9", "G7", "Fx", "f0", "q"};
  rng.shuffle(pool);
  for (int i = 0; i < n_mobile; ++i) log.sensors.push_back(pool[i]);

  const double pair_range = rng.uniform(6.0, 12.5);
  const double triple_range = pair_range * rng.uniform(0.85, 1.0);
  const double drop_triple = rng.chance(0.5) ? 0.0 : 0.15;
  const double chord_prob = rng.chance(0.7) ? 0.0 : 0.3;  // extra random fence chords
  const double step = rng.uniform(0.5, 4.0);

  const int n = m + n_mobile;  // sensor k < m: fence k; else mobile k - m
  std::vector<double> x(n), y(n);
  const double phase = rng.uniform(0, 6.283185307179586);
  for (int i = 0; i < m; ++i) {
    double ang = phase + 6.283185307179586 * (i + rng.uniform(-0.2, 0.2)) / m;
    x[i] = 10 + 8 * std::cos(ang);
    y[i] = 10 + 8 * std::sin(ang);
  }
  for (int i = m; i < n; ++i) {  // uniform in the disk of radius 7 around (10, 10)
    double r = 7 * std::sqrt(rng.uniform01()), ang = rng.uniform(0, 6.283185307179586);
    x[i] = 10 + r * std::cos(ang);
    y[i] = 10 + r * std::sin(ang);
  }
  auto name = [&](int i) { return i < m ? log.fence[i] : log.sensors[i - m]; };
  auto d2 = [&](int i, int j) { return (x[i] - x[j]) * (x[i] - x[j]) + (y[i] - y[j]) * (y[i] - y[j]); };

  auto consecutive_fence = [m](int i, int j) {
    if (i > j) std::swap(i, j);
    return j < m && (j == i + 1 || (i == 0 && j == m - 1));
  };
  const int t_style = static_cast<int>(rng.uniform_int(0, 2));
  for (int k = 0; k < n_frames; ++k) {
    if (k > 0)
      for (int i = m; i < n; ++i) {
        x[i] = std::clamp(x[i] + rng.uniform(-step, step), 0.0, 20.0);
        y[i] = std::clamp(y[i] + rng.uniform(-step, step), 0.0, 20.0);
      }
    Frame f;
    switch (t_style) {
      case 0: f.t = "\"" + std::to_string(k) + "\""; f.t_value = k; break;
      case 1: f.t = "\"" + std::to_string(3 * k + 1) + "/2\""; f.t_value = 1.5 * k + 0.5; break;
      default: {
        // bare JSON number, e.g. 0.25, 1.5, 2.75
        int q = 5 * k + 1;  // value q/4
        f.t = std::to_string(q / 4) + "." + std::string(q % 4 == 0 ? "0" : q % 4 == 1 ? "25" : q % 4 == 2 ? "5" : "75");
        f.t_value = q / 4.0;
      }
    }
    std::vector<std::vector<bool>> adj(n, std::vector<bool>(n, false));
    for (int i = 0; i < n; ++i)
      for (int j = i + 1; j < n; ++j) {
        bool fence_pair = i < m && j < m;
        bool consecutive = consecutive_fence(i, j);
        bool on = consecutive || d2(i, j) <= pair_range * pair_range;
        if (fence_pair && !consecutive && !on && rng.chance(chord_prob)) on = true;
        if (on) {
          adj[i][j] = adj[j][i] = true;
          if (rng.chance(0.5))
            f.pairs.push_back({name(i), name(j)});
          else
            f.pairs.push_back({name(j), name(i)});
        }
      }
    rng.shuffle(f.pairs);
    if (log.listed) {
      const double tr2 = triple_range * triple_range;
      for (int i = 0; i < n; ++i)
        for (int j = i + 1; j < n; ++j)
          for (int l = j + 1; l < n; ++l) {
            if (!(adj[i][j] && adj[i][l] && adj[j][l])) continue;
            // consecutive fence ids are in contact by fiat: their distance is not tested
            auto far = [&](int u, int w) { return !consecutive_fence(u, w) && d2(u, w) > tr2; };
            if (far(i, j) || far(i, l) || far(j, l)) continue;
            if (rng.chance(drop_triple)) continue;
            std::array<std::string, 3> t{name(i), name(j), name(l)};
            std::swap(t[0], t[rng.uniform_int(0, 2)]);
            std::swap(t[1], t[rng.uniform_int(1, 2)]);
            f.triples.push_back(t);
          }
      rng.shuffle(f.triples);
    }
    log.frames.push_back(std::move(f));
  }
  return log;
}

// ---------------------------------------------------------------------------------------------
// Mode b): large benchmark log of lattice walkers. Written directly (streamed) to `os`.
struct WalkerParams {
  int n = 1200;
  int box = 240;
  int frames = 240;
  std::string range = "10";  // decimal, e.g. "10" or "9.5"
  std::uint64_t seed = 1;
};

struct WalkerStats {
  std::string range, sensing_radius;
  int fence = 0;
  long long pairs = 0;          // sum over frames
  long long triangles = 0;      // pairwise triangles, sum over frames
  long long persisting = 0;     // pairs present in both of two consecutive frames (prisms)
  long long two_cells() const { return triangles + persisting; }
};

// Parse a non-negative decimal "123" or "123.456" into (p, q) with value p / 10^q.
inline bool parse_decimal(const std::string& s, long long& p, int& q) {
  p = 0;
  q = 0;
  bool dot = false, digit = false;
  for (char c : s) {
    if (c == '.' && !dot) {
      dot = true;
    } else if (c >= '0' && c <= '9') {
      if (p > 100000000000LL) return false;
      p = p * 10 + (c - '0');
      if (dot) ++q;
      digit = true;
    } else {
      return false;
    }
  }
  return digit && q <= 6;
}

inline std::string decimal_string(long long p, int q) {
  std::string s = std::to_string(p);
  if (q == 0) return s;
  while (static_cast<int>(s.size()) <= q) s = "0" + s;
  return s.substr(0, s.size() - q) + "." + s.substr(s.size() - q);
}

inline WalkerStats generate_walkers(const WalkerParams& prm, std::ostream& os) {
  WalkerStats st;
  long long rp;
  int rq;
  if (!parse_decimal(prm.range, rp, rq) || rp == 0) throw std::runtime_error("bad --range: " + prm.range);
  st.range = decimal_string(rp, rq);
  const double R = static_cast<double>(rp) / std::pow(10.0, rq);
  // Squared distances are integers d2; contact iff d2 <= R^2 iff d2 * 10^(2q) <= p^2, exactly.
  __int128 scale = 1;
  for (int i = 0; i < 2 * rq; ++i) scale *= 10;
  const __int128 p2 = static_cast<__int128>(rp) * rp;
  auto in_range = [&](long long d2) { return static_cast<__int128>(d2) * scale <= p2; };

  // Sensing radius: the smallest 4-decimal R_s with 3 R_s^2 >= R^2, checked exactly:
  // R_s = s / 10^4, R = p / 10^q:  3 s^2 10^(2q) >= p^2 10^8.
  {
    __int128 s = static_cast<__int128>(std::floor(R / std::sqrt(3.0) * 1e4)) - 2;
    if (s < 1) s = 1;
    __int128 e8 = 100000000;
    while (!(3 * s * s * scale >= p2 * e8)) ++s;
    st.sensing_radius = decimal_string(static_cast<long long>(s), 4);
  }

  Rng rng(prm.seed);
  const int B = prm.box;
  // Fence: on the boundary of [0,B]^2, per side ms equal-ish gaps of at most floor(R) (so
  // consecutive fence sensors are within R), counter-clockwise from (0,0).
  const long long rfloor = rp / static_cast<long long>(std::pow(10, rq) + 0.5);
  if (rfloor < 1) throw std::runtime_error("--range must be at least 1");
  const int ms = static_cast<int>((B + rfloor - 1) / rfloor);
  std::vector<std::pair<int, int>> fence_pos;
  for (int side = 0; side < 4; ++side)
    for (int j = 0; j < ms; ++j) {
      int u = static_cast<int>((static_cast<long long>(j) * B) / ms);  // gaps <= ceil(B/ms) <= rfloor
      switch (side) {
        case 0: fence_pos.push_back({u, 0}); break;
        case 1: fence_pos.push_back({B, u}); break;
        case 2: fence_pos.push_back({B - u, B}); break;
        default: fence_pos.push_back({0, B - u}); break;
      }
    }
  const int m = static_cast<int>(fence_pos.size());
  st.fence = m;
  const int n = m + prm.n;  // sensor i < m: fence "F<i>"; else walker "w<i-m>"
  std::vector<std::string> name(n);
  for (int i = 0; i < m; ++i) name[i] = "F" + std::to_string(i);
  for (int i = m; i < n; ++i) name[i] = "w" + std::to_string(i - m);
  std::vector<int> x(n), y(n);
  for (int i = 0; i < m; ++i) {
    x[i] = fence_pos[i].first;
    y[i] = fence_pos[i].second;
  }
  for (int i = m; i < n; ++i) {
    x[i] = static_cast<int>(rng.uniform_int(0, B));
    y[i] = static_cast<int>(rng.uniform_int(0, B));
  }
  for (int i = 0; i < m; ++i) {  // guard: consecutive fence sensors in contact
    int j = (i + 1) % m;
    long long dx = x[i] - x[j], dy = y[i] - y[j];
    if (!in_range(dx * dx + dy * dy)) throw std::runtime_error("fence spacing exceeds range");
  }

  os << "{\"format\": \"sweepcert-contacts-1\",\n \"title\": "
     << json_string(std::to_string(prm.n) + " lattice walkers in [0," + std::to_string(B) +
                    "]^2, range " + st.range + ", seed " + std::to_string(prm.seed))
     << ",\n \"fence\": [";
  for (int i = 0; i < m; ++i) os << (i ? "," : "") << '"' << name[i] << '"';
  os << "],\n \"sensors\": [";
  for (int i = m; i < n; ++i) os << (i > m ? "," : "") << '"' << name[i] << '"';
  os << "],\n \"triangles\": {\"from-pairs\": {\"contact-range\": \"" << st.range
     << "\", \"sensing-radius\": \"" << st.sensing_radius << "\"}},\n \"frames\": [\n";

  const int cell = static_cast<int>(rfloor + 1);  // cell side > R
  const int gw = B / cell + 1;
  std::vector<std::vector<int>> grid(static_cast<std::size_t>(gw) * gw);
  std::vector<long long> prev_pairs, cur_pairs;
  std::vector<std::vector<int>> nb(n);
  std::string buf;
  for (int k = 0; k < prm.frames; ++k) {
    if (k > 0)
      for (int i = m; i < n; ++i) {
        switch (rng.uniform_int(0, 4)) {
          case 0: x[i] = std::min(x[i] + 1, B); break;
          case 1: x[i] = std::max(x[i] - 1, 0); break;
          case 2: y[i] = std::min(y[i] + 1, B); break;
          case 3: y[i] = std::max(y[i] - 1, 0); break;
          default: break;  // stay
        }
      }
    for (auto& g : grid) g.clear();
    for (int i = 0; i < n; ++i) grid[static_cast<std::size_t>(y[i] / cell) * gw + x[i] / cell].push_back(i);
    cur_pairs.clear();
    for (auto& v : nb) v.clear();
    for (int i = 0; i < n; ++i) {
      int cx = x[i] / cell, cy = y[i] / cell;
      for (int gy = std::max(cy - 1, 0); gy <= std::min(cy + 1, gw - 1); ++gy)
        for (int gx = std::max(cx - 1, 0); gx <= std::min(cx + 1, gw - 1); ++gx)
          for (int j : grid[static_cast<std::size_t>(gy) * gw + gx]) {
            if (j <= i) continue;
            long long dx = x[i] - x[j], dy = y[i] - y[j];
            if (in_range(dx * dx + dy * dy)) {
              cur_pairs.push_back(static_cast<long long>(i) * n + j);
              nb[i].push_back(j);
            }
          }
    }
    std::sort(cur_pairs.begin(), cur_pairs.end());
    for (auto& v : nb) std::sort(v.begin(), v.end());
    st.pairs += static_cast<long long>(cur_pairs.size());
    // Pairwise triangles i < j < l: l in nb[i] ∩ nb[j].
    for (int i = 0; i < n; ++i)
      for (int j : nb[i]) {
        auto a = nb[i].begin(), b = nb[j].begin();
        while (a != nb[i].end() && b != nb[j].end()) {
          if (*a < *b) ++a;
          else if (*b < *a) ++b;
          else { ++st.triangles; ++a; ++b; }
        }
      }
    if (k > 0) {
      std::vector<long long> both;
      std::set_intersection(prev_pairs.begin(), prev_pairs.end(), cur_pairs.begin(), cur_pairs.end(),
                            std::back_inserter(both));
      st.persisting += static_cast<long long>(both.size());
    }
    std::swap(prev_pairs, cur_pairs);
    // Write the frame.
    buf.clear();
    buf += "  {\"t\": \"" + std::to_string(k) + "\", \"pairs\": [";
    bool first = true;
    for (long long code : prev_pairs) {
      int i = static_cast<int>(code / n), j = static_cast<int>(code % n);
      if (!first) buf += ',';
      first = false;
      buf += "[\"";
      buf += name[i];
      buf += "\",\"";
      buf += name[j];
      buf += "\"]";
    }
    buf += (k + 1 < prm.frames) ? "]},\n" : "]}\n";
    os << buf;
  }
  os << " ]}\n";
  return st;
}

}  // namespace gen_contacts
