// `sweepcert contacts`: the contact log a network of these sensors would record.
#include <algorithm>
#include <cstdio>
#include <fstream>

#include "app/commands.hpp"
#include "cert/sink.hpp"
#include "io/input_error.hpp"
#include "io/read_input.hpp"
#include "stack/stack.hpp"

namespace sweepcert {

int run_contacts(const ParsedArgs& args) {
  if (args.positional.size() != 1) throw UsageError("contacts takes exactly one SCENARIO file");
  if (!args.has("-o")) throw UsageError("contacts needs -o LOG");
  if (!args.has("--every")) throw UsageError("contacts needs --every DT");
  std::string why;
  auto dt = parse_exact(args.get("--every"), &why);
  if (!dt || *dt <= 0) throw UsageError("--every must be an exact number > 0");

  Input input = read_input(args.positional[0]);
  const Sweep* sweep = std::get_if<Sweep>(&input.content);
  if (!sweep) throw InputError(args.positional[0], "contacts needs a positional scenario");

  std::vector<Rational> times;
  for (Rational t = sweep->t_start; t < sweep->t_end; t += *dt) times.push_back(t);
  for (const auto& t : sweep->waypoint_times(sweep->t_start, sweep->t_end)) times.push_back(t);
  times.push_back(sweep->t_end);
  std::sort(times.begin(), times.end());
  times.erase(std::unique(times.begin(), times.end()), times.end());

  std::string out = "{\n \"format\": \"sweepcert-contacts-1\",\n \"title\": ";
  append_json_string(out, sweep->title + " (contacts every " + to_text(*dt) + ")");
  auto id = [&](Vertex v) { std::string s; append_json_string(s, sweep->sensors[v].id); return s; };
  out += ",\n \"fence\": [";
  for (std::size_t i = 0; i < sweep->fence_count; ++i) out += (i ? ", " : "") + id(static_cast<Vertex>(i));
  out += "],\n \"sensors\": [";
  for (std::size_t i = sweep->fence_count; i < sweep->sensors.size(); ++i)
    out += (i > sweep->fence_count ? ", " : "") + id(static_cast<Vertex>(i));
  out += "],\n \"triangles\": \"listed\",\n \"frames\": [";
  for (std::size_t k = 0; k < times.size(); ++k) {
    FrameCells cells = cech_at(*sweep, times[k]);
    out += k ? ",\n  {\"t\": \"" : "\n  {\"t\": \"";
    out += to_text(times[k]) + "\",\n   \"pairs\": [";
    for (std::size_t i = 0; i < cells.edges.size(); ++i)
      out += (i ? ", [" : "[") + id(cells.edges[i].first) + ", " + id(cells.edges[i].second) + "]";
    out += "],\n   \"triples\": [";
    for (std::size_t i = 0; i < cells.triangles.size(); ++i) {
      const auto& t = cells.triangles[i];
      out += (i ? ", [" : "[") + id(t[0]) + ", " + id(t[1]) + ", " + id(t[2]) + "]";
    }
    out += "]}";
  }
  out += "\n ]\n}\n";
  std::string tmp = args.get("-o") + ".partial";
  {
    std::ofstream f(tmp, std::ios::binary);
    f << out;
    if (!f) { std::remove(tmp.c_str()); throw std::runtime_error("cannot write " + tmp); }
  }
  if (std::rename(tmp.c_str(), args.get("-o").c_str()) != 0)
    throw std::runtime_error("cannot move log into place at " + args.get("-o"));
  if (!args.has("--quiet"))
    std::printf("wrote %s: %zu frames\n", args.get("-o").c_str(), times.size());
  return kOk;
}

}  // namespace sweepcert
