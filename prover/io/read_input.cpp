#include "io/read_input.hpp"

#include <openssl/evp.h>
#include <sys/stat.h>

#include <algorithm>
#include <cstdio>
#include <fstream>
#include <map>
#include <sstream>
#include <unordered_map>

#include "exact/predicates.hpp"
#include "io/json_doc.hpp"

namespace sweepcert {
namespace {

// Limits of schema §1.5 (depth and text length are JsonDoc's).
constexpr std::uintmax_t kMaxFileBytes = std::uintmax_t(1) << 30;  // file size: 1 GiB
constexpr std::size_t kMaxSensors = 1000000;                       // sensor ids of an input
constexpr std::size_t kMaxFrames = 1000000;                        // frames of a contact log

// Refuses an array of more than `limit` items before any is read.
void within_limit(const Ref& array, std::size_t count, std::size_t limit, const char* what,
                  const char* limit_name) {
  if (count > limit)
    array.fail(std::to_string(count) + " " + what + " exceed the " + limit_name + " limit of " +
               std::to_string(limit) + " (schema §1.5)");
}

std::string format_of(const JsonDoc& doc) {
  Ref root(doc);
  if (root.kind() != JKind::Object) root.fail("expected an object");
  auto f = root.find("format");
  if (!f) root.fail("missing key \"format\"");
  return std::string(f->string());
}

// Fence polygon must be simple: adjacent edges meet only at their shared vertex, others not
// at all. O(m^2) segment tests, exact.
void check_simple_polygon(const Sweep& s, const Ref& fence) {
  std::size_t m = s.fence_count;
  auto P = [&](std::size_t i) -> Point { return {s.sensors[i].track[0].x, s.sensors[i].track[0].y}; };
  for (std::size_t i = 0; i < m; ++i)
    for (std::size_t j = i + 1; j < m; ++j)
      if (P(i).x == P(j).x && P(i).y == P(j).y)
        fence.item(j).at("at").fail("fence vertex repeats the centre of " + s.sensors[i].id);
  for (std::size_t i = 0; i < m; ++i) {
    Point a = P(i), b = P((i + 1) % m);
    for (std::size_t j = i + 1; j < m; ++j) {
      Point c = P(j), d = P((j + 1) % m);
      bool adjacent = (j == i + 1) || (i == 0 && j == m - 1);
      if (adjacent) {
        // Shared vertex v; the edges overlap beyond v iff they are collinear and point the
        // same way from v.
        Point v = (j == i + 1) ? b : a;
        Point p = (j == i + 1) ? a : b;
        Point q = (j == i + 1) ? d : c;
        if (orientation(v, p, q) == 0) {
          Rational dot = (p.x - v.x) * (q.x - v.x) + (p.y - v.y) * (q.y - v.y);
          if (dot > 0)
            fence.item(j).fail("fence polygon is not simple: edges at " + s.sensors[i].id +
                               " and " + s.sensors[j].id + " overlap");
        }
        continue;
      }
      if (segments_meet(a, b, c, d))
        fence.item(j).fail("fence polygon is not simple: edge " + s.sensors[j].id + "-" +
                           s.sensors[(j + 1) % m].id + " crosses edge " + s.sensors[i].id + "-" +
                           s.sensors[(i + 1) % m].id);
    }
  }
}

}  // namespace

std::string read_bytes(const std::string& path) {
  auto too_large = [&](const std::string& size) {
    return InputError(path, "file of " + size + " bytes exceeds the file size limit of 1 GiB (" +
                                std::to_string(kMaxFileBytes) + " bytes, schema §1.5)");
  };
  // A regular file's size (stat) decides before a byte is read; anything else (a pipe) is read
  // in chunks up to the limit.
  struct stat st {};
  const bool regular = ::stat(path.c_str(), &st) == 0 && S_ISREG(st.st_mode);
  if (regular && static_cast<std::uintmax_t>(st.st_size) > kMaxFileBytes)
    throw too_large(std::to_string(st.st_size));
  std::ifstream in(path, std::ios::binary);
  if (!in) throw InputError(path, "cannot open file");
  std::string bytes;
  if (regular) bytes.reserve(static_cast<std::size_t>(st.st_size));
  std::vector<char> chunk(std::size_t(1) << 20);
  while (in) {
    in.read(chunk.data(), static_cast<std::streamsize>(chunk.size()));
    bytes.append(chunk.data(), static_cast<std::size_t>(in.gcount()));
    if (bytes.size() > kMaxFileBytes) throw too_large("more than " + std::to_string(kMaxFileBytes));
  }
  if (in.bad()) throw InputError(path, "cannot read file");
  return bytes;
}

std::string sha256_hex(const std::string& bytes) {
  unsigned char digest[EVP_MAX_MD_SIZE];
  unsigned int len = 0;
  EVP_Digest(bytes.data(), bytes.size(), digest, &len, EVP_sha256(), nullptr);
  static const char* hex = "0123456789abcdef";
  std::string out;
  for (unsigned int i = 0; i < len; ++i) {
    out += hex[digest[i] >> 4];
    out += hex[digest[i] & 15];
  }
  return out;
}

std::string radius_problem(const Sweep& s, std::size_t* at) {
  std::size_t where = 0;
  std::string why;
  for (std::size_t i = 0; i < s.sensors.size() && why.empty(); ++i)
    if (s.sensors[i].radius <= 0) {
      where = i;
      why = "the radius of " + s.sensors[i].id + " is " + to_text(s.sensors[i].radius) +
            ", not positive";
    }
  for (std::size_t i = 0; i < s.fence_count && why.empty(); ++i) {
    std::size_t j = (i + 1) % s.fence_count;
    const auto& a = s.sensors[i];
    const auto& b = s.sensors[j];
    if (!disks_meet({a.track[0].x, a.track[0].y}, a.radius, {b.track[0].x, b.track[0].y}, b.radius)) {
      where = j;
      why = "fence gap: the disks of " + a.id + " and " + b.id +
            " do not meet, so the fence edge between them is not covered";
    }
  }
  if (at) *at = where;
  return why;
}

Sweep scenario_from(const JsonDoc& doc) {
  Ref root(doc);
  root.expect_object({"format", "title", "horizon", "fence", "sensors"},
                     {"format", "horizon", "fence", "sensors"});
  if (root.at("format").string() != "sweepcert-scenario-1")
    root.at("format").fail("expected \"sweepcert-scenario-1\"");
  Sweep s;
  if (auto t = root.find("title")) s.title = std::string(t->string());
  Ref horizon = root.at("horizon");
  horizon.expect_array(2, 2);
  s.t_start = horizon.item(0).number();
  s.t_end = horizon.item(1).number();
  if (!(s.t_start < s.t_end)) horizon.item(1).fail("horizon end must be after its start");

  std::unordered_map<std::string, std::size_t> seen;
  auto add_id = [&](const Ref& r) {
    std::string id = r.id();
    if (!seen.emplace(id, s.sensors.size()).second) r.fail("duplicate sensor id \"" + id + "\"");
    return id;
  };
  auto positive_radius = [](const Ref& r) {
    Rational q = r.number();
    if (q <= 0) r.fail("radius must be positive");
    return q;
  };

  Ref fence = root.at("fence");
  std::size_t fence_count = fence.expect_array(3);
  within_limit(fence, fence_count, kMaxSensors, "sensors", "sensor");
  {
    // Both lists count before any sensor is read.
    Ref sensors = root.at("sensors");
    within_limit(sensors, fence_count + sensors.expect_array(0), kMaxSensors, "sensors (fence included)",
                 "sensor");
  }
  fence.for_each([&](const Ref& f) {
    f.expect_object({"id", "at", "radius"}, {"id", "at", "radius"});
    Sensor sensor;
    sensor.id = add_id(f.at("id"));
    Ref at = f.at("at");
    at.expect_array(2, 2);
    sensor.track.push_back({Rational(0), at.item(0).number(), at.item(1).number()});
    sensor.radius = positive_radius(f.at("radius"));
    s.sensors.push_back(std::move(sensor));
  });
  s.fence_count = s.sensors.size();
  std::size_t gap = 0;
  std::string why = radius_problem(s, &gap);
  if (!why.empty()) fence.item(gap).fail(why);
  check_simple_polygon(s, fence);

  Ref sensors = root.at("sensors");
  sensors.expect_array(0);
  sensors.for_each([&](const Ref& m) {
    m.expect_object({"id", "radius", "track"}, {"id", "radius", "track"});
    Sensor sensor;
    sensor.id = add_id(m.at("id"));
    sensor.radius = positive_radius(m.at("radius"));
    Ref track = m.at("track");
    track.expect_array(1);
    track.for_each([&](const Ref& row) {
      row.expect_array(3, 3);
      Waypoint w{row.item(0).number(), row.item(1).number(), row.item(2).number()};
      if (!sensor.track.empty() && !(sensor.track.back().t < w.t))
        row.item(0).fail("track times must strictly increase (" + to_text(w.t) + " after " +
                         to_text(sensor.track.back().t) + ")");
      sensor.track.push_back(std::move(w));
    });
    s.sensors.push_back(std::move(sensor));
  });
  return s;
}

ContactLog contacts_from(const JsonDoc& doc) {
  Ref root(doc);
  root.expect_object({"format", "title", "fence", "sensors", "triangles", "frames"},
                     {"format", "fence", "triangles", "frames"});
  if (root.at("format").string() != "sweepcert-contacts-1")
    root.at("format").fail("expected \"sweepcert-contacts-1\"");
  ContactLog log;
  if (auto t = root.find("title")) log.title = std::string(t->string());

  std::unordered_map<std::string, Vertex> index;
  auto add = [&](const Ref& r) {
    std::string id = r.id();
    if (!index.emplace(id, static_cast<Vertex>(log.ids.size())).second)
      r.fail("duplicate sensor id \"" + id + "\"");
    log.ids.push_back(std::move(id));
  };
  Ref fence = root.at("fence");
  within_limit(fence, fence.expect_array(3), kMaxSensors, "sensor ids", "sensor");
  fence.for_each(add);
  log.fence_count = log.ids.size();
  bool closed_world = false;
  if (auto sensors = root.find("sensors")) {
    within_limit(*sensors, log.fence_count + sensors->expect_array(0), kMaxSensors,
                 "sensor ids (fence included)", "sensor");
    sensors->for_each(add);
    closed_world = true;
  }
  auto lookup = [&](const Ref& r) -> Vertex {
    std::string id = r.id();
    auto it = index.find(id);
    if (it != index.end()) return it->second;
    if (closed_world) r.fail("unknown sensor id \"" + id + "\" (not in fence or sensors)");
    within_limit(r, log.ids.size() + 1, kMaxSensors, "sensor ids", "sensor");
    Vertex v = static_cast<Vertex>(log.ids.size());
    index.emplace(id, v);
    log.ids.push_back(std::move(id));
    return v;
  };

  Ref triangles = root.at("triangles");
  if (triangles.kind() == JKind::String) {
    if (triangles.string() != "listed")
      triangles.fail("expected \"listed\" or {\"from-pairs\": {...}}");
    log.triples_listed = true;
  } else {
    triangles.expect_object({"from-pairs"}, {"from-pairs"});
    Ref fp = triangles.at("from-pairs");
    fp.expect_object({"contact-range", "sensing-radius"}, {"contact-range", "sensing-radius"});
    log.triples_listed = false;
    log.contact_range = fp.at("contact-range").number();
    log.sensing_radius = fp.at("sensing-radius").number();
    if (log.contact_range <= 0) fp.at("contact-range").fail("contact range must be positive");
    if (log.sensing_radius <= 0) fp.at("sensing-radius").fail("sensing radius must be positive");
    if (3 * log.sensing_radius * log.sensing_radius < log.contact_range * log.contact_range)
      fp.fail("triangles may come from pairs only when 3*Rs^2 >= Rc^2 (Jung's theorem); here "
              "3*Rs^2 < Rc^2");
  }

  Ref frames = root.at("frames");
  within_limit(frames, frames.expect_array(1), kMaxFrames, "frames", "frame");
  frames.for_each([&](const Ref& fr) {
    if (log.triples_listed) fr.expect_object({"t", "pairs", "triples"}, {"t", "pairs", "triples"});
    else fr.expect_object({"t", "pairs"}, {"t", "pairs"});
    ContactLog::Frame frame;
    frame.t = fr.at("t").number();
    if (!log.frames.empty() && !(log.frames.back().t < frame.t))
      fr.at("t").fail("frame times must strictly increase (" + to_text(frame.t) + " after " +
                      to_text(log.frames.back().t) + ")");
    Ref pairs = fr.at("pairs");
    pairs.expect_array(0);
    pairs.for_each([&](const Ref& p) {
      p.expect_array(2, 2);
      Vertex a = lookup(p.item(0)), b = lookup(p.item(1));
      if (a == b) p.fail("a pair needs two different sensors");
      frame.pairs.emplace_back(std::min(a, b), std::max(a, b));
    });
    auto sorted_pairs = frame.pairs;
    std::sort(sorted_pairs.begin(), sorted_pairs.end());
    for (std::size_t i = 1; i < sorted_pairs.size(); ++i)
      if (sorted_pairs[i] == sorted_pairs[i - 1]) {
        // Name the second occurrence.
        std::size_t count = 0;
        for (std::size_t k = 0; k < frame.pairs.size(); ++k)
          if (frame.pairs[k] == sorted_pairs[i] && count++ == 1)
            pairs.item(k).fail("pair listed twice in this frame");
      }
    frame.pairs = std::move(sorted_pairs);
    auto has_pair = [&](Vertex a, Vertex b) {
      return std::binary_search(frame.pairs.begin(), frame.pairs.end(),
                                Pair(std::min(a, b), std::max(a, b)));
    };
    for (std::size_t i = 0; i < log.fence_count; ++i) {
      Vertex a = static_cast<Vertex>(i), b = static_cast<Vertex>((i + 1) % log.fence_count);
      if (!has_pair(a, b))
        pairs.fail("fence gap: consecutive fence sensors " + log.ids[a] + " and " + log.ids[b] +
                   " are not in contact");
    }
    if (log.triples_listed) {
      Ref triples = fr.at("triples");
      triples.expect_array(0);
      triples.for_each([&](const Ref& tr) {
        tr.expect_array(3, 3);
        Triple t{lookup(tr.item(0)), lookup(tr.item(1)), lookup(tr.item(2))};
        std::sort(t.begin(), t.end());
        if (t[0] == t[1] || t[1] == t[2]) tr.fail("a triple needs three different sensors");
        if (!has_pair(t[0], t[1]) || !has_pair(t[0], t[2]) || !has_pair(t[1], t[2]))
          tr.fail("triple whose three pairs are not all listed in this frame");
        frame.triples.push_back(t);
      });
      std::vector<Triple> sorted = frame.triples;
      std::sort(sorted.begin(), sorted.end());
      if (std::adjacent_find(sorted.begin(), sorted.end()) != sorted.end())
        triples.fail("a triple is listed twice in this frame");
      frame.triples = std::move(sorted);
    }
    log.frames.push_back(std::move(frame));
  });
  return log;
}

Sweep parse_scenario(const std::string& bytes) { return scenario_from(JsonDoc::parse(bytes)); }
ContactLog parse_contacts(const std::string& bytes) { return contacts_from(JsonDoc::parse(bytes)); }

Input read_input(const std::string& path) {
  std::string bytes = read_bytes(path);
  Input in;
  in.path = path;
  in.sha256 = sha256_hex(bytes);
  try {
    JsonDoc doc = JsonDoc::parse(bytes);
    std::string().swap(bytes);
    in.format = format_of(doc);
    if (in.format == "sweepcert-scenario-1") in.content = scenario_from(doc);
    else if (in.format == "sweepcert-contacts-1") in.content = contacts_from(doc);
    else
      throw InputError("/format", "unknown format \"" + in.format +
                                      "\" (expected sweepcert-scenario-1 or sweepcert-contacts-1)");
  } catch (const InputError& e) {
    // Name the file as well as the place in it (a JSON pointer, or line and column).
    throw InputError(path + ": " + e.where, e.what());
  }
  return in;
}

}  // namespace sweepcert
