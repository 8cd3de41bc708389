// Reference: JSON with raw number text, exact numbers (§1), inputs (§2), presence (§3.1) and
// the stack complex on a certificate's frames.
#include <algorithm>
#include <cctype>
#include <memory>

#include <openssl/sha.h>

#include "ref_internal.hpp"

namespace mutref {

namespace {

// Builds a json value from SAX events, keeping the raw text of non-integer numbers and
// refusing duplicated keys and the limits of §1.5.
class RawSax {
 public:
  json root;
  std::string error;

  bool null() { return put(json(nullptr)); }
  bool boolean(bool b) { return put(json(b)); }
  bool number_integer(json::number_integer_t v) { return put(json(v)); }
  bool number_unsigned(json::number_unsigned_t v) { return put(json(v)); }
  bool number_float(json::number_float_t, const std::string& raw) {
    if (raw.size() > 1000) return fail("number longer than 1000 characters");
    return put(json(std::string(1, kRawMark) + raw));
  }
  bool string(std::string& s) {
    if (s.size() > 1000) return fail("string longer than 1000 characters");
    return put(json(s));
  }
  bool binary(json::binary_t&) { return fail("binary value"); }
  bool start_object(std::size_t) { return open(json::object()); }
  bool key(std::string& k) {
    if (!keys_.back().insert(k).second) return fail("duplicated key \"" + k + "\"");
    key_ = k;
    return true;
  }
  bool end_object() { return close(); }
  bool start_array(std::size_t) { return open(json::array()); }
  bool end_array() { return close(); }
  bool parse_error(std::size_t, const std::string&, const nlohmann::detail::exception& e) {
    return fail(std::string("bad JSON: ") + e.what());
  }

 private:
  std::vector<json*> stack_;
  std::vector<std::set<std::string>> keys_;
  std::string key_;

  bool fail(const std::string& why) {
    if (error.empty()) error = why;
    return false;
  }
  json* place(json v) {
    if (stack_.empty()) {
      root = std::move(v);
      return &root;
    }
    json& top = *stack_.back();
    if (top.is_array()) {
      top.push_back(std::move(v));
      return &top.back();
    }
    top[key_] = std::move(v);
    return &top[key_];
  }
  bool put(json v) {
    place(std::move(v));
    return true;
  }
  bool open(json v) {
    if (stack_.size() >= 64) return fail("nested deeper than 64");
    stack_.push_back(place(std::move(v)));
    keys_.emplace_back();
    return true;
  }
  bool close() {
    stack_.pop_back();
    keys_.pop_back();
    return true;
  }
};

}  // namespace

json parse_raw(const std::string& text) {
  RawSax sax;
  bool ok = json::sax_parse(text, &sax);
  if (!ok || !sax.error.empty()) refuse(sax.error.empty() ? "bad JSON" : sax.error);
  return std::move(sax.root);
}

namespace {

bool all_digits(const std::string& s, std::size_t from, std::size_t to) {
  if (from >= to) return false;
  for (std::size_t i = from; i < to; ++i)
    if (!std::isdigit(static_cast<unsigned char>(s[i]))) return false;
  return true;
}

Z ten_to(long e) {
  Z p;
  mpz_ui_pow_ui(p.get_mpz_t(), 10, static_cast<unsigned long>(e));
  return p;
}

// §1.1 on the text alone; false when it matches neither grammar.
bool parse_rational(const std::string& s, Q* out) {
  if (s.empty() || s.size() > 1000) return false;
  std::size_t i = s[0] == '-' ? 1 : 0;
  bool negative = i == 1;
  auto slash = s.find('/');
  if (slash != std::string::npos) {
    if (!all_digits(s, i, slash) || !all_digits(s, slash + 1, s.size())) return false;
    Z num(s.substr(i, slash - i)), den(s.substr(slash + 1));
    if (den == 0) return false;
    *out = Q(num, den);
    out->canonicalize();
    if (negative) *out = -*out;
    return true;
  }
  std::size_t e = s.find_first_of("eE");
  std::string mant = s.substr(i, (e == std::string::npos ? s.size() : e) - i);
  long exponent = 0;
  if (e != std::string::npos) {
    std::size_t j = e + 1;
    bool eneg = false;
    if (j < s.size() && (s[j] == '+' || s[j] == '-')) eneg = s[j++] == '-';
    if (!all_digits(s, j, s.size())) return false;
    if (s.size() - j > 5) return false;  // certainly beyond 1000
    exponent = std::stol(s.substr(j));
    if (exponent > 1000) return false;
    if (eneg) exponent = -exponent;
  }
  auto dot = mant.find('.');
  std::string digits = mant;
  if (dot != std::string::npos) {
    if (!all_digits(mant, 0, dot) || !all_digits(mant, dot + 1, mant.size())) return false;
    digits = mant.substr(0, dot) + mant.substr(dot + 1);
    exponent -= static_cast<long>(mant.size() - dot - 1);
  } else if (!all_digits(mant, 0, mant.size())) {
    return false;
  }
  Z m(digits);
  Q v = exponent >= 0 ? Q(m * ten_to(exponent)) : Q(m, ten_to(-exponent));
  v.canonicalize();
  *out = negative ? Q(-v) : v;
  return true;
}

}  // namespace

Q rational(const json& v, const std::string& where) {
  std::string s;
  if (v.is_number_integer()) s = v.dump();
  else if (v.is_string()) s = v.get<std::string>();
  else refuse(where + ": not an exact number");
  if (!s.empty() && s[0] == kRawMark) s = s.substr(1);
  Q q;
  if (!parse_rational(s, &q)) refuse(where + ": \"" + s + "\" is not an exact number (§1.1)");
  return q;
}

Z integer_text(const json& v, const std::string& where) {
  if (!v.is_string()) refuse(where + ": an integer must be a JSON string (§1.2)");
  const std::string s = v.get<std::string>();
  std::size_t i = !s.empty() && s[0] == '-' ? 1 : 0;
  if (!all_digits(s, i, s.size()) || s.size() - i > 1000 || (s[i] == '0' && s.size() - i > 1))
    refuse(where + ": \"" + s + "\" is not an integer string (§1.2)");
  return Z(s);
}

long frame_index(const json& v, const std::string& where) {
  if (!v.is_number_integer()) refuse(where + ": not a JSON integer");
  if (v.is_number_unsigned()) {
    auto u = v.get<json::number_unsigned_t>();
    if (u > 1000000000ULL) refuse(where + ": frame index far out of range");
    return static_cast<long>(u);
  }
  auto i = v.get<json::number_integer_t>();
  if (i < 0) refuse(where + ": negative frame index");
  return static_cast<long>(i);
}

std::string id_text(const json& v, const std::string& where) {
  if (!v.is_string()) refuse(where + ": an id must be a string");
  std::string s = v.get<std::string>();
  if (s.empty() || s.size() > 64 || s[0] == kRawMark) refuse(where + ": bad id");
  return s;
}

std::string text_of(const Q& q) { return q.get_str(); }

void keys_exactly(const json& obj, const std::set<std::string>& required, const std::set<std::string>& optional,
                  const std::string& where) {
  if (!obj.is_object()) refuse(where + ": not an object");
  for (const auto& k : required)
    if (!obj.contains(k)) refuse(where + ": missing key \"" + k + "\"");
  for (auto it = obj.begin(); it != obj.end(); ++it)
    if (!required.count(it.key()) && !optional.count(it.key())) refuse(where + ": unknown key \"" + it.key() + "\"");
}

// ---------------------------------------------------------------------------------------------
// Inputs.

bool Input::is_fence(int v) const { return std::find(fence.begin(), fence.end(), v) != fence.end(); }

Point Input::centre(int v, const Q& t) const {
  const auto& tr = track[v];
  if (t <= tr.front()[0]) return {tr.front()[1], tr.front()[2]};
  if (t >= tr.back()[0]) return {tr.back()[1], tr.back()[2]};
  for (std::size_t i = 0; i + 1 < tr.size(); ++i) {
    if (t <= tr[i + 1][0]) {
      Q f = (t - tr[i][0]) / (tr[i + 1][0] - tr[i][0]);
      return {tr[i][1] + f * (tr[i + 1][1] - tr[i][1]), tr[i][2] + f * (tr[i + 1][2] - tr[i][2])};
    }
  }
  return {tr.back()[1], tr.back()[2]};
}

std::vector<Q> Input::waypoint_times(int v) const {
  std::vector<Q> out;
  if (is_fence(v)) return out;  // a fence sensor is still: no waypoints
  for (const auto& row : track[v]) out.push_back(row[0]);
  return out;
}

namespace {

std::string sha256_hex(const std::string& bytes) {
  unsigned char d[SHA256_DIGEST_LENGTH];
  SHA256(reinterpret_cast<const unsigned char*>(bytes.data()), bytes.size(), d);
  static const char* hex = "0123456789abcdef";
  std::string s;
  for (unsigned char c : d) {
    s += hex[c >> 4];
    s += hex[c & 15];
  }
  return s;
}

void number_vertices(Input& in, std::set<std::string> all) {
  in.ids.assign(all.begin(), all.end());  // std::string order is byte order
  for (std::size_t i = 0; i < in.ids.size(); ++i) in.index[in.ids[i]] = static_cast<int>(i);
}

std::unique_ptr<Input> read_input(const std::string& text) {
  auto in = std::make_unique<Input>();
  json j = parse_raw(text);
  in->sha256 = sha256_hex(text);
  in->format = j.at("format").get<std::string>();
  std::set<std::string> all;
  if (in->format == "sweepcert-scenario-1") {
    in->positional = true;
    in->h0 = rational(j["horizon"][0], "/horizon/0");
    in->h1 = rational(j["horizon"][1], "/horizon/1");
    for (const auto& f : j["fence"]) all.insert(f["id"].get<std::string>());
    for (const auto& s : j["sensors"]) all.insert(s["id"].get<std::string>());
    number_vertices(*in, all);
    in->radius.resize(all.size());
    in->track.resize(all.size());
    for (const auto& f : j["fence"]) {
      int v = in->index[f["id"].get<std::string>()];
      in->fence.push_back(v);
      in->radius[v] = rational(f["radius"], "fence radius");
      in->track[v].push_back({Q(0), rational(f["at"][0], "fence x"), rational(f["at"][1], "fence y")});
      in->polygon.push_back({in->track[v][0][1], in->track[v][0][2]});
    }
    for (const auto& s : j["sensors"]) {
      int v = in->index[s["id"].get<std::string>()];
      in->radius[v] = rational(s["radius"], "radius");
      for (const auto& row : s["track"])
        in->track[v].push_back({rational(row[0], "t"), rational(row[1], "x"), rational(row[2], "y")});
    }
    return in;
  }
  if (in->format != "sweepcert-contacts-1") refuse("input: unknown format");
  for (const auto& f : j["fence"]) all.insert(f.get<std::string>());
  if (j.contains("sensors"))
    for (const auto& s : j["sensors"]) all.insert(s.get<std::string>());
  for (const auto& fr : j["frames"]) {
    for (const auto& p : fr["pairs"])
      for (const auto& id : p) all.insert(id.get<std::string>());
    if (fr.contains("triples"))
      for (const auto& p : fr["triples"])
        for (const auto& id : p) all.insert(id.get<std::string>());
  }
  number_vertices(*in, all);
  for (const auto& f : j["fence"]) in->fence.push_back(in->index[f.get<std::string>()]);
  in->from_pairs = j["triangles"].is_object();
  for (const auto& fr : j["frames"]) {
    in->log_t.push_back(rational(fr["t"], "log t"));
    std::set<std::pair<int, int>> pairs;
    for (const auto& p : fr["pairs"]) {
      int a = in->index[p[0].get<std::string>()], b = in->index[p[1].get<std::string>()];
      pairs.insert({std::min(a, b), std::max(a, b)});
    }
    std::set<std::array<int, 3>> triples;
    if (fr.contains("triples"))
      for (const auto& p : fr["triples"]) {
        std::array<int, 3> s{in->index[p[0].get<std::string>()], in->index[p[1].get<std::string>()],
                             in->index[p[2].get<std::string>()]};
        std::sort(s.begin(), s.end());
        triples.insert(s);
      }
    in->log_pairs.push_back(std::move(pairs));
    in->log_triples.push_back(std::move(triples));
  }
  return in;
}

}  // namespace

const Input& input_for(const std::string& text) {
  static std::map<std::string, std::unique_ptr<Input>> cache;
  auto it = cache.find(text);
  if (it == cache.end()) it = cache.emplace(text, read_input(text)).first;
  return *it->second;
}

// ---------------------------------------------------------------------------------------------
// Presence (§3.1).

bool pair_present(const Input& in, int a, int b, const Q& t) {
  Q r = in.radius[a] + in.radius[b];
  return dist2(in.centre(a, t), in.centre(b, t)) <= r * r;
}

namespace {

// Sign of a + b·√s (s ≥ 0), exactly.
int sign_with_root(const Q& a, const Q& b, const Q& s) {
  int sa = sgn(a), sb = s == 0 ? 0 : sgn(b);
  if (sb == 0) return sa;
  if (sa == 0) return sb;
  if (sa == sb) return sa;
  // Opposite signs: compare a² with b²·s.
  int c = cmp(Q(a * a), Q(b * b * s));
  return c > 0 ? sa : c < 0 ? sb : 0;
}

}  // namespace

// The intersection I of three closed disks, when nonempty, is either a whole disk (then that
// disk's centre is in I) or its boundary has a corner where two circles cross, or I is one
// point lying on two circles (disks are strictly convex). So it suffices to test the three
// centres and the (at most six) circle-circle crossing points, the latter exactly with √.
bool triple_present(const Input& in, int a, int b, int c, const Q& t) {
  Point p[3] = {in.centre(a, t), in.centre(b, t), in.centre(c, t)};
  Q r2[3] = {in.radius[a] * in.radius[a], in.radius[b] * in.radius[b], in.radius[c] * in.radius[c]};
  for (int i = 0; i < 3; ++i) {
    bool all = true;
    for (int j = 0; j < 3; ++j) all = all && dist2(p[i], p[j]) <= r2[j];
    if (all) return true;
  }
  for (int i = 0; i < 3; ++i) {
    int j = (i + 1) % 3, k = (i + 2) % 3;
    Q dx = p[j].x - p[i].x, dy = p[j].y - p[i].y;
    Q d2 = dx * dx + dy * dy;
    if (d2 == 0) continue;
    Q f = (d2 + r2[i] - r2[j]) / (2 * d2);
    Point m{p[i].x + f * dx, p[i].y + f * dy};
    Q h2 = r2[i] - f * f * d2;  // squared half-chord
    if (h2 < 0) continue;
    Q s = h2 / d2;                 // crossing points m ± √s·n with n = (−dy, dx)
    Q wx = m.x - p[k].x, wy = m.y - p[k].y;
    Q A = wx * wx + wy * wy + s * d2 - r2[k];
    Q B = 2 * (wx * -dy + wy * dx);
    if (sign_with_root(A, B, s) <= 0 || sign_with_root(A, Q(-B), s) <= 0) return true;
  }
  return false;
}

Where locate(const Input& in, const Point& p) {
  bool inside = false;
  std::size_t m = in.fence.size();
  for (std::size_t i = 0; i < m; ++i) {
    const Point& a = in.polygon[i];
    const Point& b = in.polygon[(i + 1) % m];
    bool in_box = std::min(a.x, b.x) <= p.x && p.x <= std::max(a.x, b.x) && std::min(a.y, b.y) <= p.y &&
                  p.y <= std::max(a.y, b.y);
    if (in_box && (b.x - a.x) * (p.y - a.y) == (b.y - a.y) * (p.x - a.x)) return Where::boundary;
    if ((a.y > p.y) != (b.y > p.y)) {
      Q x = a.x + (p.y - a.y) * (b.x - a.x) / (b.y - a.y);
      if (x > p.x) inside = !inside;
    }
  }
  return inside ? Where::inside : Where::outside;
}

// ---------------------------------------------------------------------------------------------
// The stack on a certificate's frames.

namespace {

std::vector<Q> read_frames(const Input& in, const json& frames, std::size_t* log_start) {
  if (!frames.is_array() || frames.empty()) refuse("/frames: must be a non-empty array");
  std::vector<Q> t;
  for (std::size_t k = 0; k < frames.size(); ++k) {
    t.push_back(rational(frames[k], "/frames/" + std::to_string(k)));
    if (k > 0 && !(t[k - 1] < t[k])) refuse("/frames/" + std::to_string(k) + ": frames must strictly increase");
  }
  if (in.positional) {
    for (std::size_t k = 0; k < t.size(); ++k)
      if (t[k] < in.h0 || t[k] > in.h1) refuse("/frames/" + std::to_string(k) + ": outside the horizon (§4.2)");
    std::set<Q> have(t.begin(), t.end());
    for (std::size_t v = 0; v < in.ids.size(); ++v)
      for (const Q& w : in.waypoint_times(static_cast<int>(v)))
        if (t.front() < w && w < t.back() && !have.count(w))
          refuse("/frames: waypoint time " + text_of(w) + " of " + in.ids[v] + " is not a frame (§4.2)");
    return t;
  }
  std::size_t s = 0;
  while (s < in.log_t.size() && in.log_t[s] != t[0]) ++s;
  if (s == in.log_t.size()) refuse("/frames/0: no log frame at this time (§4.2)");
  for (std::size_t k = 0; k < t.size(); ++k)
    if (s + k >= in.log_t.size() || in.log_t[s + k] != t[k])
      refuse("/frames/" + std::to_string(k) + ": not the next log frame (§4.2)");
  *log_start = s;
  return t;
}

void add_triangles(Stack& st) {
  const Input& in = *st.in;
  int V = st.V;
  st.triangles.assign(st.frames(), {});
  for (std::size_t k = 0; k < st.frames(); ++k) {
    if (!in.positional && !in.from_pairs) {
      for (const auto& tri : in.log_triples[st.log_start + k]) st.triangles[k].push_back(tri);
      continue;
    }
    for (int a = 0; a < V; ++a)
      for (int b = a + 1; b < V; ++b) {
        if (!st.edge_at(k, a, b)) continue;
        for (int c = b + 1; c < V; ++c) {
          if (!st.edge_at(k, a, c) || !st.edge_at(k, b, c)) continue;
          if (in.positional && !triple_present(in, a, b, c, st.t[k])) continue;
          st.triangles[k].push_back({a, b, c});
        }
      }
  }
  st.has_triangles = true;
}

}  // namespace

const Stack& stack_for(const Input& in, const json& frames, bool need_triangles) {
  static std::map<std::pair<const Input*, std::string>, std::unique_ptr<Stack>> cache;
  std::size_t start = 0;
  std::vector<Q> t = read_frames(in, frames, &start);  // validated on every call
  std::string key;
  for (const Q& q : t) key += q.get_str() + ",";
  auto& slot = cache[{&in, key}];
  if (!slot) {
    slot = std::make_unique<Stack>();
    Stack& st = *slot;
    st.in = &in;
    st.t = t;
    st.log_start = start;
    st.V = static_cast<int>(in.ids.size());
    st.edge.assign(t.size(), std::vector<char>(static_cast<std::size_t>(st.V) * st.V, 0));
    for (std::size_t k = 0; k < t.size(); ++k) {
      if (in.positional) {
        for (int a = 0; a < st.V; ++a)
          for (int b = a + 1; b < st.V; ++b) st.edge[k][a * st.V + b] = pair_present(in, a, b, t[k]);
      } else {
        for (const auto& p : in.log_pairs[start + k]) st.edge[k][p.first * st.V + p.second] = 1;
      }
    }
  }
  if (need_triangles && !slot->has_triangles) add_triangles(*slot);
  return *slot;
}

}  // namespace mutref
