#include "certificate.hpp"

#include <algorithm>
#include <optional>

#include "errors.hpp"

namespace sweepcheck {

using json::Kind;
using json::Ref;

std::string Where::str() const {
  std::string s = std::string(base) + "/" + std::to_string(row);
  if (col >= 0) s += "/" + std::to_string(col);
  return s;
}

std::string ring_name(Ring r) { return r == Ring::Z ? "z" : "z2"; }

Value Values::read(Ref v, const Where& where, Ring ring, const char* rule) {
  if (!v.is(Kind::String)) throw Rejected(where.str(), "", std::string("expected a decimal integer string (§1.2)"));
  std::string_view text = v.text();
  Value out;
  if (parse_small_integer(text, out.small)) {
    // fast path
  } else {
    Int n;
    std::string why = parse_integer(text, n);
    if (!why.empty()) throw Rejected(where.str(), "", why + " (§1.2)");
    out.big = static_cast<std::int32_t>(bigs_.size());
    bigs_.push_back(std::move(n));
  }
  if (out.big < 0 && out.small == 0) throw Rejected(where.str(), "", std::string("zero value (") + rule + ")");
  if (ring == Ring::Z2 && text != "1")
    throw Rejected(where.str(), "", std::string("over z2 every value must be \"1\" (") + rule + ")");
  return out;
}

std::uint32_t read_index(Ref v, const Where& where, std::size_t limit, const char* what) {
  if (v.is(Kind::Unsigned)) {
    std::uint64_t k = v.unsigned_value();
    if (k >= limit)
      throw Rejected(where.str(), "", std::string(what) + " index " + std::to_string(k) + " out of range (must be < " +
                                          std::to_string(limit) + ", §4)");
    return static_cast<std::uint32_t>(k);
  }
  if (v.is(Kind::Signed)) throw Rejected(where.str(), "", std::string(what) + " index must be non-negative (§1.2)");
  if (v.is(Kind::Float)) {
    std::string_view t = v.text();
    if (t.find_first_of(".eE") != std::string_view::npos)
      throw Rejected(where.str(), "", std::string(what) + " index must be a JSON integer without fraction or exponent (§1.2)");
    throw Rejected(where.str(), "", std::string(what) + " index out of range (§4)");
  }
  throw Rejected(where.str(), "", std::string(what) + " index must be a JSON integer, found " + json::kind_name(v.kind()) + " (§1.2)");
}

std::uint32_t read_sensor(Ref v, const Where& where, const Input& in) {
  if (!v.is(Kind::String) || v.text().empty() || v.text().size() > 64)
    throw Rejected(where.str(), "", "a sensor id must be a string of 1 to 64 bytes (§1.3)");
  std::int64_t id = in.find(v.text());
  if (id < 0) throw Rejected(where.str(), "sensor \"" + std::string(v.text()) + "\"", "unknown sensor id (not in INPUT, rule 1)");
  return static_cast<std::uint32_t>(id);
}

void expect_row(Ref v, const Where& where, std::size_t length, const char* shape) {
  if (!v.is(Kind::Array) || v.size() != length)
    throw Rejected(where.str(), "", std::string("a row must be an array ") + shape + " of " + std::to_string(length) + " values");
}

namespace {

// Checks `value` of `key` is one of `allowed`; returns it.
std::string one_of(const Members& m, std::string_view key, std::initializer_list<std::string_view> allowed) {
  std::string_view s = get_string(m.need(key), m.at(key));
  if (std::find(allowed.begin(), allowed.end(), s) == allowed.end())
    throw Rejected(m.at(key), "", "unsupported value \"" + std::string(s) + "\" (§4.1)");
  return std::string(s);
}

// §1.5: the rows of every cell list and the tokens of every chamber tree, counted on array
// sizes before any is read. Shapes are checked later, by the method; here a value of another
// kind simply counts nothing.
std::size_t certificate_items(const Members& m) {
  std::size_t items = 0;
  for (const char* key : {"triangles", "prisms", "edges", "verticals", "sensors", "route", "slabs"})
    if (auto v = m.get(key); v && v->is(Kind::Array)) items += v->size();
  if (auto slabs = m.get("slabs"); slabs && slabs->is(Kind::Array))
    for (std::size_t j = 0; j < slabs->size(); ++j) {
      Ref slab = (*slabs)[j];
      if (!slab.is(Kind::Object)) continue;
      for (std::size_t i = 0; i < slab.size(); ++i)
        if (slab.key(i) == "tree" && slab.value(i).is(Kind::Array)) items += slab.value(i).size();
    }
  return items;
}

bool is_lower_hex(std::string_view s) {
  return s.size() == 64 && std::all_of(s.begin(), s.end(), [](char c) { return (c >= '0' && c <= '9') || (c >= 'a' && c <= 'f'); });
}

// §4.2.
void check_frames(const Certificate& cert, const Input& in, std::size_t& log_start, Tally& tally) {
  const std::vector<Rat>& f = cert.frames;
  if (in.kind == InputKind::Scenario) {
    for (std::size_t k = 0; k < f.size(); ++k)
      if (f[k] < in.horizon_start || f[k] > in.horizon_end)
        throw Rejected(at("/frames", k), "t=" + to_text(f[k]), "frame outside the horizon [" + to_text(in.horizon_start) + ", " +
                                                                 to_text(in.horizon_end) + "] (§4.2)");
    for (std::size_t v = 0; v < in.sensors.size(); ++v) {
      if (in.is_fence[v]) continue;
      for (const Rat& t : in.sensors[v].times) {
        if (!(f.front() < t && t < f.back())) continue;
        if (!std::binary_search(f.begin(), f.end(), t))
          throw Rejected("/frames", "sensor \"" + in.names[v] + "\" waypoint t=" + to_text(t),
                         "waypoint time strictly between the first and last frame is not a frame (§4.2)");
        ++tally.waypoints_checked;
      }
    }
    tally.frames_checked = f.size();
    return;
  }
  auto it = std::lower_bound(in.times.begin(), in.times.end(), f.front());
  if (it == in.times.end() || *it != f.front())
    throw Rejected("/frames/0", "t=" + to_text(f.front()), "not the time of any frame of the contact log (§4.2)");
  log_start = static_cast<std::size_t>(it - in.times.begin());
  for (std::size_t k = 1; k < f.size(); ++k) {
    if (log_start + k >= in.times.size())
      throw Rejected(at("/frames", k), "t=" + to_text(f[k]), "runs past the last frame of the contact log (§4.2)");
    if (f[k] != in.times[log_start + k])
      throw Rejected(at("/frames", k), "t=" + to_text(f[k]),
                     "must equal the time of log frame " + std::to_string(log_start + k) + ", t=" +
                         to_text(in.times[log_start + k]) + ": frames must be a contiguous run of the log's frames (§4.2)");
  }
  tally.frames_checked = f.size();
}

// §4.1.1: the optional margin. Allowed on positional sheets, chambers and routes only.
void read_margin(Certificate& cert, const Input& in) {
  std::optional<Ref> v = cert.members.get("margin");
  if (!v) return;
  if (cert.method == "cocycle")
    throw Rejected("/margin", "", "a margin is not allowed on a cocycle certificate (§4.1.1)");
  if (in.kind != InputKind::Scenario)
    throw Rejected("/margin", "", "a margin needs a positional scenario (sweepcert-scenario-1) as input, not a contact "
                                  "log (§4.1.1)");
  cert.margin = get_rational(*v, "/margin");
  if (cert.margin < 0) throw Rejected("/margin", "M=" + to_text(cert.margin), "the margin must be >= 0 (§4.1.1)");
  cert.has_margin = true;
}

}  // namespace

Certificate read_header(Ref root, const Input& in, const std::string& input_sha256, std::ostream& out,
                        Tally& tally) {
  try {
    Certificate cert{Members(root, "", {"format", "claim", "method", "input_sha256", "input_format", "ring", "frames",
                                        "notes", "winding", "triangles", "prisms", "fence_value", "edges", "verticals",
                                        "square", "sensors", "slabs", "route", "margin"}),
                     "", "", Ring::Z, {}, 0, false, Rat(0)};
    const Members& m = cert.members;
    // The §1.5 count limits make the file unreadable (exit 2), whatever else it says.
    if (const std::size_t items = certificate_items(m); items > json::kMaxItems)
      throw Unreadable("CERT (root): " + std::to_string(items) + " rows and tree tokens exceed the certificate item limit of " +
                       std::to_string(json::kMaxItems) + " (§1.5)");
    if (auto frames = m.get("frames"); frames && frames->is(Kind::Array) && frames->size() > json::kMaxFrames)
      throw Unreadable("CERT /frames: " + std::to_string(frames->size()) + " frames exceed the frame limit of " +
                       std::to_string(json::kMaxFrames) + " (§1.5)");
    one_of(m, "format", {"sweepcert-certificate-1"});
    cert.claim = one_of(m, "claim", {"no-evasion", "no-sheet", "evasion"});
    cert.method = one_of(m, "method", {"sheet", "cocycle", "chambers", "route"});
    const std::string claim_of = cert.method == "cocycle" ? "no-sheet" : cert.method == "route" ? "evasion" : "no-evasion";
    if (cert.claim != claim_of)
      throw Rejected("/method", "", "method \"" + cert.method + "\" does not go with claim \"" + cert.claim +
                                        "\" (sheet and chambers prove no-evasion, cocycle proves no-sheet, route proves "
                                        "evasion, §4.1)");
    // The key set of the method: its own keys are required, any other method's are not allowed.
    const bool stacked = cert.method == "sheet" || cert.method == "cocycle";
    static const std::pair<std::string_view, std::string_view> kOwner[] = {
        {"winding", "sheet"},     {"triangles", "sheet"}, {"prisms", "sheet"},    {"fence_value", "cocycle"},
        {"edges", "cocycle"},     {"verticals", "cocycle"}, {"square", "chambers"}, {"sensors", "chambers"},
        {"slabs", "chambers"},    {"route", "route"},     {"ring", ""},           {"frames", ""}};
    for (const auto& [key, owner] : kOwner) {
      // ring and frames belong to sheet and cocycle; they are read (and required) below.
      const bool own = owner.empty() ? stacked : owner == cert.method;
      if (own && !owner.empty()) m.need(key);
      else if (!own && m.get(key))
        throw Rejected(m.at(key), "", "key not allowed with method \"" + cert.method + "\" (§4.1, §4.3-§4.6)");
    }
    std::string_view hash = get_string(m.need("input_sha256"), "/input_sha256");
    if (!is_lower_hex(hash)) throw Rejected("/input_sha256", "", "must be 64 lowercase hex digits (§4.1)");
    if (hash != input_sha256)
      throw Rejected("/input_sha256", "", "does not match the SHA-256 of INPUT, " + input_sha256 +
                                              ": the certificate is for another input (§4.1)");
    std::string_view format = get_string(m.need("input_format"), "/input_format");
    if (format != in.format)
      throw Rejected("/input_format", "", "is \"" + std::string(format) + "\" but INPUT is \"" + in.format + "\" (§4.1)");
    if (!stacked) {
      if (in.kind != InputKind::Scenario)
        throw Rejected("/input_format", "", "method \"" + cert.method +
                                                "\" needs a positional scenario (sweepcert-scenario-1) as input (§4.1)");
    }
    read_margin(cert, in);
    tally.header = true;
    const std::string margin_text = cert.has_margin ? "; margin " + to_text(cert.margin) : "";
    if (!stacked) {
      if (auto notes = m.get("notes")) {
        std::string dup = json::find_duplicate_key(*notes, "/notes");
        if (!dup.empty()) throw Rejected(dup, "", "duplicated key (§1.4)");
      }
      out << "certificate: claim " << cert.claim << " by " << cert.method << margin_text
          << "; hash and input format match\n";
      return cert;
    }
    cert.ring = one_of(m, "ring", {"z", "z2"}) == "z" ? Ring::Z : Ring::Z2;
    Ref frames = m.need("frames");
    expect_array(frames, "/frames", 1);
    for (std::size_t k = 0; k < frames.size(); ++k) {
      Rat t = get_rational(frames[k], at("/frames", k));
      if (!cert.frames.empty() && !(cert.frames.back() < t))
        throw Rejected(at("/frames", k), "t=" + to_text(t), "frames must increase strictly (§4.1)");
      cert.frames.push_back(std::move(t));
    }
    if (auto notes = m.get("notes")) {
      std::string dup = json::find_duplicate_key(*notes, "/notes");
      if (!dup.empty()) throw Rejected(dup, "", "duplicated key (§1.4)");
    }
    check_frames(cert, in, cert.log_start, tally);
    out << "certificate: claim " << cert.claim << " by " << cert.method << margin_text << " over " << ring_name(cert.ring) << ", "
        << cert.frames.size() << " frames, t=" << to_text(cert.frames.front()) << ".." << to_text(cert.frames.back());
    if (in.kind == InputKind::ContactLog)
      out << " (log frames " << cert.log_start << ".." << cert.log_start + cert.frames.size() - 1 << ")";
    out << "; hash and input format match; frames obey §4.2\n";
    return cert;
  } catch (const FieldError& e) {
    throw Rejected(e.pointer, "", e.message);
  }
}

void apply_margin(const Certificate& cert, Input& in, std::ostream& out, Tally& tally) {
  if (!cert.has_margin) return;
  const Rat& m = cert.margin;
  const bool shrink = cert.claim == "no-evasion";  // read_margin allows sheet, chambers (no-evasion) and route (evasion)
  // Every radius first (in byte order of the ids), then the fence links.
  for (std::uint32_t v = 0; v < in.vertex_count(); ++v) {
    Rat& r = in.sensors[v].radius;
    Rat adjusted = shrink ? Rat(r - m) : Rat(r + m);
    if (adjusted <= 0)
      throw Rejected("/margin", "sensor \"" + in.names[v] + "\"",
                     "its radius " + to_text(r) + " minus the margin " + to_text(m) + " is " + to_text(adjusted) +
                         ", not > 0 (§4.1.1)");
    if (m != 0) ++tally.radii_adjusted;
    r = std::move(adjusted);
  }
  if (shrink) {
    const std::size_t n = in.fence.size();
    const std::int64_t gap = first_fence_gap(in);
    if (gap >= 0) {
      const std::size_t i = static_cast<std::size_t>(gap);
      const Sensor &a = in.sensors[in.fence[i]], &b = in.sensors[in.fence[(i + 1) % n]];
      const Rat reach = a.radius + b.radius;
      throw Rejected("/margin", "fence pair \"" + in.names[in.fence[i]] + "\", \"" + in.names[in.fence[(i + 1) % n]] + "\"",
                     "with radii shrunk by the margin " + to_text(m) + " the two fence disks no longer meet: |c_i - c_j|^2 = " +
                         to_text(dist2(a.points[0], b.points[0])) + " > (r_i + r_j)^2 = " + to_text(reach * reach) +
                         " (§2.1 rule, §4.1.1)");
    }
    tally.fence_links_rechecked = n;
  }
  out << "margin: " << to_text(m) << ", every radius " << (shrink ? "shrunk to r - " : "grown to r + ") << to_text(m)
      << (shrink ? "; all stay > 0 and consecutive fence disks still meet" : "") << " (§4.1.1)\n";
}

}  // namespace sweepcheck
