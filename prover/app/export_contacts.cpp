// `sweepcert contacts`: the contact log a network of these sensors would record.
//
// Listed mode writes the exact Čech complex at each frame (pairs and triples). Pairs-only mode
// writes pairs of centres within the contact range R and lets readers form triangles from
// pairs (schema §2.2); that is sound only when every disk has radius r with 3r² >= R² (Jung's
// theorem: three points pairwise within R lie in a disk of radius R/√3), so we refuse otherwise.
#include <algorithm>
#include <cstdio>

#include "app/commands.hpp"
#include "cert/sink.hpp"
#include "exact/predicates.hpp"
#include "io/input_error.hpp"
#include "io/read_input.hpp"
#include "io/write_atomic.hpp"
#include "stack/stack.hpp"

namespace sweepcert {
namespace {

Rational squared_distance(const Point& a, const Point& b) {
  Rational dx = a.x - b.x, dy = a.y - b.y;
  return dx * dx + dy * dy;
}

// Pairs-only mode: refuse a range for which the log would be unsound or invalid.
void check_range(const Sweep& sweep, const Rational& range, const std::string& path) {
  Rational r2 = range * range;
  for (const auto& s : sweep.sensors)
    if (3 * s.radius * s.radius < r2)
      throw InputError(path, "contact range " + to_text(range) + " is too long for sensor " + s.id +
                                 " of radius " + to_text(s.radius) + ": 3*r^2 = " +
                                 to_text(3 * s.radius * s.radius) + " < R^2 = " + to_text(r2) +
                                 ", so pairwise contacts would not prove a common point (Jung's theorem)");
  for (std::size_t i = 0; i < sweep.fence_count; ++i) {
    std::size_t j = (i + 1) % sweep.fence_count;
    Rational d2 = squared_distance(sweep.position(i, sweep.t_start), sweep.position(j, sweep.t_start));
    if (d2 > r2)
      throw InputError(path, "consecutive fence sensors " + sweep.sensors[i].id + " and " +
                                 sweep.sensors[j].id + " are farther apart than the contact range " +
                                 to_text(range) + " (squared distance " + to_text(d2) + " > R^2 = " +
                                 to_text(r2) + "), so the log would have a fence gap");
  }
}

// Pairs-only mode: centres at most `range` apart, i.e. disks of radius range/2 meet.
std::vector<Pair> pairs_within(const Sweep& sweep, const Rational& t, const Rational& range) {
  std::size_t n = sweep.sensors.size();
  Rational half = range / 2;
  std::vector<Point> c(n);
  for (std::size_t i = 0; i < n; ++i) c[i] = sweep.position(i, t);
  std::vector<Pair> out;
  for (std::size_t i = 0; i < n; ++i)
    for (std::size_t j = i + 1; j < n; ++j)
      if (disks_meet(c[i], half, c[j], half)) out.emplace_back(Vertex(i), Vertex(j));
  return out;
}

}  // namespace

int run_contacts(const ParsedArgs& args) {
  if (args.positional.size() != 1) throw UsageError("contacts takes exactly one SCENARIO file");
  if (!args.has("-o")) throw UsageError("contacts needs -o LOG");
  if (!args.has("--every")) throw UsageError("contacts needs --every DT");
  std::string why;
  auto dt = parse_exact(args.get("--every"), &why);
  if (!dt || *dt <= 0) throw UsageError("--every must be an exact number > 0");
  const bool pairs_only = args.has("--pairs-only");
  if (pairs_only != args.has("--contact-range"))
    throw UsageError("--pairs-only and --contact-range R go together");
  Rational range;
  if (pairs_only) {
    auto r = parse_exact(args.get("--contact-range"), &why);
    if (!r || *r <= 0) throw UsageError("--contact-range must be an exact number > 0");
    range = *r;
  }

  Input input = read_input(args.positional[0]);
  const Sweep* sweep = std::get_if<Sweep>(&input.content);
  if (!sweep) throw InputError(args.positional[0], "contacts needs a positional scenario");
  if (pairs_only) check_range(*sweep, range, args.positional[0]);

  std::vector<Rational> times;
  for (Rational t = sweep->t_start; t < sweep->t_end; t += *dt) times.push_back(t);
  for (const auto& t : sweep->waypoint_times(sweep->t_start, sweep->t_end)) times.push_back(t);
  times.push_back(sweep->t_end);
  std::sort(times.begin(), times.end());
  times.erase(std::unique(times.begin(), times.end()), times.end());

  std::string out = "{\n \"format\": \"sweepcert-contacts-1\",\n \"title\": ";
  std::string every = "every " + to_text(*dt);
  append_json_string(out, sweep->title + (pairs_only ? " (pairs within " + to_text(range) + ", " + every + ")"
                                                     : " (contacts " + every + ")"));
  auto id = [&](Vertex v) { std::string s; append_json_string(s, sweep->sensors[v].id); return s; };
  out += ",\n \"fence\": [";
  for (std::size_t i = 0; i < sweep->fence_count; ++i) out += (i ? ", " : "") + id(static_cast<Vertex>(i));
  out += "],\n \"sensors\": [";
  for (std::size_t i = sweep->fence_count; i < sweep->sensors.size(); ++i)
    out += (i > sweep->fence_count ? ", " : "") + id(static_cast<Vertex>(i));
  out += "],\n \"triangles\": ";
  if (pairs_only) {
    Rational rs = sweep->sensors[0].radius;
    for (const auto& s : sweep->sensors) rs = std::min(rs, s.radius);
    out += "{\"from-pairs\": {\"contact-range\": \"" + to_text(range) + "\", \"sensing-radius\": \"" +
           to_text(rs) + "\"}}";
  } else {
    out += "\"listed\"";
  }
  out += ",\n \"frames\": [";
  for (std::size_t k = 0; k < times.size(); ++k) {
    FrameCells cells;
    if (pairs_only) cells.edges = pairs_within(*sweep, times[k], range);
    else cells = cech_at(*sweep, times[k]);
    out += k ? ",\n  {\"t\": \"" : "\n  {\"t\": \"";
    out += to_text(times[k]) + "\",\n   \"pairs\": [";
    for (std::size_t i = 0; i < cells.edges.size(); ++i)
      out += (i ? ", [" : "[") + id(cells.edges[i].first) + ", " + id(cells.edges[i].second) + "]";
    if (pairs_only) {
      out += "]}";
      continue;
    }
    out += "],\n   \"triples\": [";
    for (std::size_t i = 0; i < cells.triangles.size(); ++i) {
      const auto& t = cells.triangles[i];
      out += (i ? ", [" : "[") + id(t[0]) + ", " + id(t[1]) + ", " + id(t[2]) + "]";
    }
    out += "]}";
  }
  out += "\n ]\n}\n";
  write_file_atomically(args.get("-o"), out);
  if (!args.has("--quiet"))
    std::printf("wrote %s: %zu frames\n", args.get("-o").c_str(), times.size());
  return kOk;
}

}  // namespace sweepcert
