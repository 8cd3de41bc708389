// `sweepcert import`: a positional scenario from two CSV tables (tracks and fence).
//
// The tables are turned into scenario JSON text, and that text goes through the prover's own
// reader (read_input.cpp), so an imported scenario obeys exactly the rules of schema §2.1. Errors
// found there carry JSON pointers of the produced scenario; we add the CSV line they came from.
#include <algorithm>
#include <cstdio>
#include <map>

#include "app/commands.hpp"
#include "cert/sink.hpp"
#include "io/csv.hpp"
#include "io/input_error.hpp"
#include "io/read_input.hpp"
#include "io/write_atomic.hpp"

namespace sweepcert {
namespace {

struct Row {
  Rational t, x, y;
  std::size_t line;
};

struct Mobile {
  std::string id;
  Rational radius;
  std::size_t radius_line;  // of the sensor's first row
  std::vector<Row> rows;
};

Rational number_at(const CsvTable& table, std::size_t row, std::size_t k, const char* name) {
  const CsvField& f = table.get(row, k);
  std::string why;
  auto q = parse_exact(f.text, &why);
  if (!q)
    throw InputError(table.where(f), std::string("column \"") + name + "\": \"" + f.text +
                                         "\" is not an exact number: " + why);
  return *q;
}

std::pair<Rational, Rational> parse_horizon(const std::string& horizon) {
  auto colon = horizon.find(':');
  if (colon == std::string::npos || horizon.find(':', colon + 1) != std::string::npos)
    throw UsageError("--horizon must be START:END, got \"" + horizon + "\"");
  std::string why;
  auto start = parse_exact(horizon.substr(0, colon), &why);
  if (!start) throw UsageError("--horizon START \"" + horizon.substr(0, colon) + "\": " + why);
  auto end = parse_exact(horizon.substr(colon + 1), &why);
  if (!end) throw UsageError("--horizon END \"" + horizon.substr(colon + 1) + "\": " + why);
  return {*start, *end};  // START < END is checked with the scenario
}

// Mobile sensors in the order of their first row; rows of one sensor sorted by time, one radius
// per sensor, no two rows of a sensor at the same time, no id shared with the fence.
std::vector<Mobile> gather_mobiles(const CsvTable& tracks, const CsvTable& fence) {
  std::map<std::string, std::size_t> fence_line_of, index;
  for (std::size_t r = 0; r < fence.rows.size(); ++r)
    fence_line_of.emplace(fence.get(r, 0).text, fence.get(r, 0).line);
  std::vector<Mobile> mobiles;
  for (std::size_t r = 0; r < tracks.rows.size(); ++r) {
    const CsvField& id = tracks.get(r, 0);
    if (auto f = fence_line_of.find(id.text); f != fence_line_of.end())
      throw InputError(tracks.where(id), "mobile sensor id \"" + id.text + "\" is also a fence id (" +
                                             fence.path + " line " + std::to_string(f->second) + ")");
    Rational radius = number_at(tracks, r, 4, "radius");
    auto [it, fresh] = index.emplace(id.text, mobiles.size());
    if (fresh) mobiles.push_back({id.text, radius, id.line, {}});
    Mobile& m = mobiles[it->second];
    if (radius != m.radius)
      throw InputError(tracks.where(tracks.get(r, 4)),
                       "sensor \"" + m.id + "\" has radius " + to_text(radius) + " here but " +
                           to_text(m.radius) + " on line " + std::to_string(m.radius_line) +
                           " (one radius per sensor)");
    m.rows.push_back({number_at(tracks, r, 1, "t"), number_at(tracks, r, 2, "x"),
                      number_at(tracks, r, 3, "y"), id.line});
  }
  for (Mobile& m : mobiles) {
    std::stable_sort(m.rows.begin(), m.rows.end(), [](const Row& a, const Row& b) { return a.t < b.t; });
    for (std::size_t k = 1; k < m.rows.size(); ++k)
      if (m.rows[k - 1].t == m.rows[k].t) {
        std::size_t l1 = std::min(m.rows[k - 1].line, m.rows[k].line);
        std::size_t l2 = std::max(m.rows[k - 1].line, m.rows[k].line);
        throw InputError(tracks.path + ":" + std::to_string(l2),
                         "sensor \"" + m.id + "\" has two rows at t = " + to_text(m.rows[k].t) +
                             " (lines " + std::to_string(l1) + " and " + std::to_string(l2) + ")");
      }
  }
  return mobiles;
}

// The CSV place of a JSON pointer into the produced scenario, or "" if there is none.
struct LineMap {
  std::string fence_path, tracks_path;
  std::vector<std::size_t> fence_lines;
  std::vector<std::vector<std::size_t>> track_lines;  // per mobile sensor, in sorted row order

  std::string place(const std::string& pointer) const {
    std::size_t a = 0, b = 0;
    if (std::sscanf(pointer.c_str(), "/fence/%zu", &a) == 1 && a < fence_lines.size())
      return fence_path + ":" + std::to_string(fence_lines[a]);
    if (std::sscanf(pointer.c_str(), "/sensors/%zu/track/%zu", &a, &b) == 2 &&
        a < track_lines.size() && b < track_lines[a].size())
      return tracks_path + ":" + std::to_string(track_lines[a][b]);
    if (std::sscanf(pointer.c_str(), "/sensors/%zu", &a) == 1 && a < track_lines.size())
      return tracks_path + ":" + std::to_string(track_lines[a].front());
    if (pointer.rfind("/horizon", 0) == 0) return "--horizon";
    return "";
  }
};

}  // namespace

int run_import(const ParsedArgs& args) {
  if (args.positional.size() != 1) throw UsageError("import takes exactly one TRACKS.csv file");
  for (const char* needed : {"--fence", "--horizon", "-o"})
    if (!args.has(needed)) throw UsageError(std::string("import needs ") + needed);
  auto [start, end] = parse_horizon(args.get("--horizon"));

  LineMap map;
  map.fence_path = args.get("--fence");
  map.tracks_path = args.positional[0];
  CsvTable fence = read_csv(map.fence_path, {"sensor", "x", "y", "radius"});
  CsvTable tracks = read_csv(map.tracks_path, {"sensor", "t", "x", "y", "radius"});

  std::string text = "{\n \"format\": \"sweepcert-scenario-1\",\n";
  if (args.has("--title")) {
    text += " \"title\": ";
    append_json_string(text, args.get("--title"));
    text += ",\n";
  }
  text += " \"horizon\": [\"" + to_text(start) + "\", \"" + to_text(end) + "\"],\n \"fence\": [";
  for (std::size_t r = 0; r < fence.rows.size(); ++r) {
    const CsvField& id = fence.get(r, 0);
    map.fence_lines.push_back(id.line);
    text += r ? ",\n  {\"id\": " : "\n  {\"id\": ";
    append_json_string(text, id.text);
    text += ", \"at\": [\"" + to_text(number_at(fence, r, 1, "x")) + "\", \"" +
            to_text(number_at(fence, r, 2, "y")) + "\"], \"radius\": \"" +
            to_text(number_at(fence, r, 3, "radius")) + "\"}";
  }
  text += "\n ],\n \"sensors\": [";

  std::vector<Mobile> mobiles = gather_mobiles(tracks, fence);
  std::size_t waypoints = 0;
  for (std::size_t i = 0; i < mobiles.size(); ++i) {
    const Mobile& m = mobiles[i];
    map.track_lines.emplace_back();
    text += i ? ",\n  {\"id\": " : "\n  {\"id\": ";
    append_json_string(text, m.id);
    text += ", \"radius\": \"" + to_text(m.radius) + "\", \"track\": [";
    for (std::size_t k = 0; k < m.rows.size(); ++k) {
      const Row& w = m.rows[k];
      map.track_lines.back().push_back(w.line);
      text += (k ? ", [\"" : "[\"") + to_text(w.t) + "\", \"" + to_text(w.x) + "\", \"" +
              to_text(w.y) + "\"]";
    }
    text += "]}";
    waypoints += m.rows.size();
  }
  text += "\n ]\n}\n";

  try {
    parse_scenario(text);  // the prover's own validation (schema §2.1)
  } catch (const InputError& e) {
    std::string place = map.place(e.where);
    throw InputError(e.where + " of the produced scenario" + (place.empty() ? "" : " (" + place + ")"),
                     e.what());
  }
  write_file_atomically(args.get("-o"), text);
  if (!args.has("--quiet"))
    std::printf("wrote %s: %zu fence sensors, %zu mobile sensors with %zu waypoints, horizon [%s, %s]\n",
                args.get("-o").c_str(), fence.rows.size(), mobiles.size(), waypoints,
                to_text(start).c_str(), to_text(end).c_str());
  return kOk;
}

}  // namespace sweepcert
