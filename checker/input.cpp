#include "input.hpp"

#include <algorithm>
#include <optional>

#include "errors.hpp"
#include "fields.hpp"

namespace sweepcheck {
namespace {

using json::Kind;
using json::Ref;

[[noreturn]] void invalid(const std::string& pointer, const std::string& what) {
  throw FieldError(pointer, what);
}

std::string id_text(std::string_view id) { return "\"" + std::string(id) + "\""; }

// §1.5 count limits, checked on array sizes before any element is read.
void within_limit(std::size_t count, std::size_t limit, const std::string& pointer, const char* what,
                  const char* limit_name) {
  if (count > limit)
    invalid(pointer, std::to_string(count) + " " + what + " exceed the " + limit_name + " limit of " +
                         std::to_string(limit) + " (§1.5)");
}

// Gives every id its byte-wise rank as vertex index.
void set_vertices(Input& in, std::vector<std::string> ids) {
  std::sort(ids.begin(), ids.end());  // std::string compares bytes as unsigned char
  ids.erase(std::unique(ids.begin(), ids.end()), ids.end());
  in.names = std::move(ids);
  for (const std::string& name : in.names) in.index.insert(name);
  in.is_fence.assign(in.names.size(), false);
}

Rat positive(Ref v, const std::string& pointer, const char* what) {
  Rat q = get_rational(v, pointer);
  if (q <= 0) invalid(pointer, std::string(what) + " must be > 0, is " + to_text(q));
  return q;
}

Point get_point(Ref v, const std::string& pointer) {
  expect_array(v, pointer, 2, 2);
  return Point{get_rational(v[0], at(pointer, 0)), get_rational(v[1], at(pointer, 1))};
}

// §2.1: consecutive fence disks meet, and the polygon through the centres is simple.
void check_fence_polygon(const Input& in) {
  const std::size_t m = in.fence.size();
  auto centre = [&](std::size_t i) -> const Point& { return in.sensors[in.fence[i % m]].points[0]; };
  auto name = [&](std::size_t i) { return id_text(in.names[in.fence[i % m]]); };
  const std::int64_t gap = first_fence_gap(in);
  if (gap >= 0) {
    const std::size_t i = static_cast<std::size_t>(gap);
    invalid(at("/fence", (i + 1) % m), "fence gap: the disks of " + name(i) + " and " + name(i + 1) +
                                           " do not meet (|c_i - c_j|^2 > (r_i + r_j)^2, §2.1)");
  }
  for (std::size_t i = 0; i < m; ++i)
    for (std::size_t j = i + 1; j < m; ++j)
      if (centre(i).x == centre(j).x && centre(i).y == centre(j).y)
        invalid(at("/fence", j) + "/at", "fence polygon not simple: centre repeats that of " + name(i) + " (§2.1)");
  for (std::size_t i = 0; i < m; ++i) {
    // Adjacent edges p_i p_{i+1} and p_{i+1} p_{i+2} meet only in p_{i+1} unless they are
    // collinear and the second turns back along the first.
    const Point &p = centre(i), &q = centre(i + 1), &r = centre(i + 2);
    Rat dot = (p.x - q.x) * (r.x - q.x) + (p.y - q.y) * (r.y - q.y);
    if (orientation(p, q, r) == 0 && dot > 0)
      invalid(at("/fence", (i + 1) % m) + "/at", "fence polygon not simple: it folds back at " + name(i + 1) + " (§2.1)");
  }
  for (std::size_t i = 0; i < m; ++i)
    for (std::size_t j = i + 2; j < m; ++j) {
      if (i == 0 && j == m - 1) continue;  // adjacent through the closing edge
      if (segments_meet(centre(i), centre(i + 1), centre(j), centre(j + 1)))
        invalid(at("/fence", j) + "/at", "fence polygon not simple: edge " + name(j) + "-" + name(j + 1) +
                                             " meets edge " + name(i) + "-" + name(i + 1) + " (§2.1)");
    }
}

// From the ids listed frame by frame, the frames listing each id (increasing) and the slot of
// each listing: a counting sort.
void invert(const std::vector<std::uint32_t>& by_frame, const std::vector<std::size_t>& frame_begin, std::size_t ids,
            std::vector<std::uint32_t>& frames, std::vector<std::size_t>& slots, std::vector<std::size_t>& begin) {
  begin.assign(ids + 1, 0);
  for (std::uint32_t id : by_frame) ++begin[id + 1];
  for (std::size_t i = 0; i < ids; ++i) begin[i + 1] += begin[i];
  std::vector<std::size_t> next(begin.begin(), begin.end() - 1);
  frames.resize(by_frame.size());
  slots.resize(by_frame.size());
  for (std::size_t f = 0; f + 1 < frame_begin.size(); ++f)
    for (std::size_t i = frame_begin[f]; i < frame_begin[f + 1]; ++i) {
      const std::size_t j = next[by_frame[i]]++;
      frames[j] = static_cast<std::uint32_t>(f);
      slots[j] = i;
    }
}

void load_scenario(const Members& root, Input& in) {
  in.kind = InputKind::Scenario;
  if (auto title = root.get("title")) in.title = std::string(get_string(*title, root.at("title")));
  Ref horizon = root.need("horizon");
  expect_array(horizon, "/horizon", 2, 2);
  in.horizon_start = get_rational(horizon[0], "/horizon/0");
  in.horizon_end = get_rational(horizon[1], "/horizon/1");
  if (!(in.horizon_start < in.horizon_end)) invalid("/horizon/1", "horizon end must be after its start (§2.1)");

  struct Pending { std::string id; Sensor sensor; };
  std::vector<Pending> all;
  std::unordered_map<std::string_view, std::string> seen;  // id -> pointer of its first use
  auto add_id = [&](std::string_view id, const std::string& pointer) {
    auto [it, fresh] = seen.emplace(id, pointer);
    if (!fresh) invalid(pointer, "duplicate sensor id " + id_text(id) + " (also at " + it->second + ", §2.1)");
  };

  Ref fence = root.need("fence");
  expect_array(fence, "/fence", 3);
  within_limit(fence.size(), json::kMaxSensors, "/fence", "sensors", "sensor");
  for (std::size_t i = 0; i < fence.size(); ++i) {
    std::string p = at("/fence", i);
    Members f(fence[i], p, {"id", "at", "radius"});
    std::string_view id = get_id(f.need("id"), f.at("id"));
    add_id(id, f.at("id"));
    Sensor s;
    s.radius = positive(f.need("radius"), f.at("radius"), "radius");
    s.points.push_back(get_point(f.need("at"), f.at("at")));
    s.times.push_back(in.horizon_start);
    all.push_back({std::string(id), std::move(s)});
  }
  Ref sensors = root.need("sensors");
  expect_array(sensors, "/sensors", 0);
  within_limit(fence.size() + sensors.size(), json::kMaxSensors, "/sensors", "sensors (fence included)", "sensor");
  for (std::size_t i = 0; i < sensors.size(); ++i) {
    std::string p = at("/sensors", i);
    Members f(sensors[i], p, {"id", "radius", "track"});
    std::string_view id = get_id(f.need("id"), f.at("id"));
    add_id(id, f.at("id"));
    Sensor s;
    s.radius = positive(f.need("radius"), f.at("radius"), "radius");
    Ref track = f.need("track");
    expect_array(track, f.at("track"), 1);
    for (std::size_t r = 0; r < track.size(); ++r) {
      std::string rp = at(f.at("track"), r);
      expect_array(track[r], rp, 3, 3);
      Rat t = get_rational(track[r][0], at(rp, 0));
      if (!s.times.empty() && !(s.times.back() < t))
        invalid(at(rp, 0), "track times must increase strictly: " + to_text(t) + " after " + to_text(s.times.back()) + " (§2.1)");
      s.times.push_back(t);
      s.points.push_back(Point{get_rational(track[r][1], at(rp, 1)), get_rational(track[r][2], at(rp, 2))});
    }
    all.push_back({std::string(id), std::move(s)});
  }

  std::vector<std::string> ids;
  for (const auto& s : all) ids.push_back(s.id);
  set_vertices(in, ids);
  in.sensors.resize(in.names.size());
  for (std::size_t i = 0; i < all.size(); ++i) {
    std::uint32_t v = static_cast<std::uint32_t>(in.find(all[i].id));
    in.sensors[v] = std::move(all[i].sensor);
    if (i < fence.size()) { in.fence.push_back(v); in.is_fence[v] = true; }
  }
  check_fence_polygon(in);
}

void load_contact_log(const Members& root, Input& in) {
  in.kind = InputKind::ContactLog;
  if (auto title = root.get("title")) in.title = std::string(get_string(*title, root.at("title")));

  // Every id, numbered in order of first appearance: the fence, `sensors`, then the frames.
  StringIndex ids;
  Ref fence = root.need("fence");
  expect_array(fence, "/fence", 3);
  within_limit(fence.size(), json::kMaxSensors, "/fence", "sensor ids", "sensor");
  const std::size_t fence_size = fence.size();
  auto first_use = [&](std::uint32_t n) {  // the pointer of a declared id
    return n < fence_size ? at("/fence", n) : at("/sensors", n - fence_size);
  };
  for (std::size_t i = 0; i < fence.size(); ++i) {
    std::string_view id = get_id(fence[i], at("/fence", i));
    auto [n, fresh] = ids.insert(id);
    if (!fresh) invalid(at("/fence", i), "duplicate fence id " + id_text(id) + " (also at " + first_use(n) + ", §2.2)");
  }
  auto sensors = root.get("sensors");
  if (sensors) {
    expect_array(*sensors, "/sensors", 0);
    within_limit(fence_size + sensors->size(), json::kMaxSensors, "/sensors", "sensor ids (fence included)", "sensor");
    for (std::size_t i = 0; i < sensors->size(); ++i) {
      std::string_view id = get_id((*sensors)[i], at("/sensors", i));
      auto [n, fresh] = ids.insert(id);
      if (!fresh) invalid(at("/sensors", i), "id " + id_text(id) + " already used at " + first_use(n) + " (§2.2)");
    }
  }

  Ref triangles = root.need("triangles");
  if (triangles.is(Kind::String)) {
    if (triangles.text() != "listed") invalid("/triangles", "must be \"listed\" or {\"from-pairs\": {...}} (§2.2)");
    in.listed = true;
  } else {
    in.listed = false;
    Members t(triangles, "/triangles", {"from-pairs"});
    Members fp(t.need("from-pairs"), t.at("from-pairs"), {"contact-range", "sensing-radius"});
    Rat rc = positive(fp.need("contact-range"), fp.at("contact-range"), "contact-range");
    Rat rs = positive(fp.need("sensing-radius"), fp.at("sensing-radius"), "sensing-radius");
    if (3 * rs * rs < rc * rc)
      invalid(t.at("from-pairs"), "3*R_s^2 < R_c^2: pairwise contacts do not imply triple contacts (§2.2)");
  }

  // Pass 1: shapes, times and the vertex set. Each id used in a pair or triple is looked up
  // once, and its number kept in `uses` for pass 2. Pointers are only built for a message: a
  // log may hold millions of pairs.
  Ref frames = root.need("frames");
  expect_array(frames, "/frames", 1);
  within_limit(frames.size(), json::kMaxFrames, "/frames", "frames", "frame");
  std::vector<std::size_t> pair_counts, triple_counts;
  std::vector<std::uint32_t> uses;
  auto use = [&](Ref v, const std::string& list, std::size_t i, std::size_t j) {
    if (!v.is(Kind::String) || v.text().empty() || v.text().size() > 64) get_id(v, at(at(list, i), j));  // throws
    std::string_view id = v.text();
    const std::uint32_t n = sensors ? ids.find(id) : ids.insert(id).first;
    if (n == StringIndex::kNone)
      invalid(at(at(list, i), j), "unknown id " + id_text(id) + ": neither a fence id nor listed in /sensors (§2.2)");
    if (n >= json::kMaxSensors) within_limit(std::size_t(n) + 1, json::kMaxSensors, at(at(list, i), j), "sensor ids", "sensor");
    uses.push_back(n);
  };
  auto tuples = [&](Ref list, const std::string& pointer, std::size_t length) {
    expect_array(list, pointer, 0);
    for (std::size_t i = 0; i < list.size(); ++i) {
      Ref t = list[i];
      if (!t.is(Kind::Array) || t.size() != length) expect_array(t, at(pointer, i), length, length);  // throws
      for (std::size_t j = 0; j < length; ++j) use(t[j], pointer, i, j);
    }
    return list.size();
  };
  for (std::size_t f = 0; f < frames.size(); ++f) {
    std::string fp = at("/frames", f);
    Members fr(frames[f], fp, {"t", "pairs", "triples"});
    Rat t = get_rational(fr.need("t"), fr.at("t"));
    if (!in.times.empty() && !(in.times.back() < t))
      invalid(fr.at("t"), "frame times must increase strictly: " + to_text(t) + " after " + to_text(in.times.back()) + " (§2.2)");
    in.times.push_back(t);
    pair_counts.push_back(tuples(fr.need("pairs"), fr.at("pairs"), 2));
    std::optional<Ref> triples = fr.get("triples");
    if (in.listed && !triples) invalid(fr.at("triples"), "required with \"triangles\": \"listed\" (§2.2)");
    if (!in.listed && triples) invalid(fr.at("triples"), "not allowed with \"from-pairs\" (§2.2)");
    triple_counts.push_back(triples ? tuples(*triples, fr.at("triples"), 3) : 0);
  }
  std::vector<std::string> names;
  for (std::uint32_t n = 0; n < ids.size(); ++n) names.emplace_back(ids.at(n));
  set_vertices(in, std::move(names));
  std::vector<std::uint32_t> vertex_of(ids.size());  // id number -> vertex index
  for (std::uint32_t n = 0; n < ids.size(); ++n) vertex_of[n] = static_cast<std::uint32_t>(in.find(ids.at(n)));
  for (std::size_t i = 0; i < fence_size; ++i) {
    in.fence.push_back(vertex_of[i]);
    in.is_fence[vertex_of[i]] = true;
  }

  // Pass 2: pairs and triples by compact ids, with the per-frame rules. last_pair[id] and
  // last_triple[id] hold 1 + the last frame that listed the id: duplicates within a frame and
  // the pairs of a triple are checked without any hashing of (id, frame).
  std::vector<std::uint32_t> last_pair, last_triple;
  std::size_t next_use = 0;
  auto vertex = [&] { return vertex_of[uses[next_use++]]; };
  auto pair_in_frame = [&](std::uint32_t a, std::uint32_t b, std::uint32_t frame) {
    std::uint32_t id = in.pairs.find(a, b);
    return id != PairTable::kNone && last_pair[id] == frame + 1;
  };
  for (std::size_t f = 0; f < frames.size(); ++f) {
    const std::uint32_t frame = static_cast<std::uint32_t>(f);
    auto where = [&](const char* list, std::size_t i) { return at(at("/frames", f) + list, i); };
    in.pairs_begin.push_back(in.frame_pairs.size());
    for (std::size_t i = 0; i < pair_counts[f]; ++i) {
      std::uint32_t a = vertex(), b = vertex();
      if (a == b) invalid(where("/pairs", i), "pair of identical ids " + id_text(in.names[a]) + " (§2.2)");
      if (b < a) std::swap(a, b);
      std::uint32_t id = in.pairs.intern(a, b);
      if (id >= last_pair.size()) last_pair.resize(id + 1, 0);
      if (last_pair[id] == frame + 1)
        invalid(where("/pairs", i), "pair {" + in.names[a] + ", " + in.names[b] + "} listed twice in this frame (§2.2)");
      last_pair[id] = frame + 1;
      in.frame_pairs.push_back(id);
    }
    in.triples_begin.push_back(in.frame_triples.size());
    for (std::size_t i = 0; i < triple_counts[f]; ++i) {
      std::array<std::uint32_t, 3> v{vertex(), vertex(), vertex()};
      std::sort(v.begin(), v.end());
      if (v[0] == v[1] || v[1] == v[2]) invalid(where("/triples", i), "triple with a repeated id (§2.2)");
      const std::pair<int, int> sides[3] = {{0, 1}, {0, 2}, {1, 2}};
      for (auto [x, y] : sides)
        if (!pair_in_frame(v[x], v[y], frame))
          invalid(where("/triples", i),
                  "pair {" + in.names[v[x]] + ", " + in.names[v[y]] + "} of this triple is not listed in the frame (§2.2)");
      std::uint32_t ab = in.pairs.find(v[0], v[1]);
      auto [tid, fresh] = in.triple_ids.insert(pack(ab, v[2]), static_cast<std::uint32_t>(in.triples.size()));
      if (fresh) { in.triples.push_back(v); last_triple.push_back(0); }
      if (last_triple[*tid] == frame + 1) invalid(where("/triples", i), "triple listed twice in this frame (§2.2)");
      last_triple[*tid] = frame + 1;
      in.frame_triples.push_back(*tid);
    }
    const std::size_t m = in.fence.size();
    for (std::size_t i = 0; i < m; ++i) {
      std::uint32_t a = in.fence[i], b = in.fence[(i + 1) % m];
      if (!pair_in_frame(std::min(a, b), std::max(a, b), frame))
        invalid(at("/frames", f) + "/pairs",
                "consecutive fence ids {" + in.names[a] + ", " + in.names[b] + "} are not a pair in this frame (§2.2)");
    }
  }
  in.pairs_begin.push_back(in.frame_pairs.size());
  in.triples_begin.push_back(in.frame_triples.size());
  invert(in.frame_pairs, in.pairs_begin, in.pairs.size(), in.pair_frames, in.pair_slots, in.pair_frames_begin);
  invert(in.frame_triples, in.triples_begin, in.triples.size(), in.triple_frames, in.triple_slots,
         in.triple_frames_begin);
}

}  // namespace

std::int64_t first_fence_gap(const Input& in) {
  const std::size_t m = in.fence.size();
  for (std::size_t i = 0; i < m; ++i) {
    const Sensor& a = in.sensors[in.fence[i]];
    const Sensor& b = in.sensors[in.fence[(i + 1) % m]];
    if (!disks_meet(a.points[0], a.radius, b.points[0], b.radius)) return static_cast<std::int64_t>(i);
  }
  return -1;
}

std::unique_ptr<Input> load_input(const json::Document& doc) {
  auto in = std::make_unique<Input>();
  try {
    Ref root = doc.root();
    expect_kind(root, Kind::Object, "");
    // Read `format` first: it decides which keys are allowed.
    std::optional<Ref> format;
    for (std::size_t i = 0; i < root.size(); ++i)
      if (root.key(i) == "format") { format = root.value(i); break; }
    if (!format) invalid("/format", "required key \"format\" is missing");
    in->format = std::string(get_string(*format, "/format"));
    if (in->format == "sweepcert-scenario-1") {
      load_scenario(Members(root, "", {"format", "title", "horizon", "fence", "sensors"}), *in);
    } else if (in->format == "sweepcert-contacts-1") {
      load_contact_log(Members(root, "", {"format", "title", "fence", "sensors", "triangles", "frames"}), *in);
    } else {
      invalid("/format", "unknown format \"" + in->format + "\" (expected sweepcert-scenario-1 or sweepcert-contacts-1)");
    }
  } catch (const FieldError& e) {
    throw Unreadable("INPUT " + (e.pointer.empty() ? std::string("(root)") : e.pointer) + ": " + e.message);
  }
  return in;
}

}  // namespace sweepcheck
