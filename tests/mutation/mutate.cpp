// The mutation operators. Sites are found by walking the certificate by key name (§4), so an
// operator knows whether a string is a coefficient, a rational, an id or a field.
#include "mutate.hpp"

#include <algorithm>
#include <map>
#include <tuple>

#include "ref_internal.hpp"  // exact-number parsing (test code shared with the reference)

namespace mutation {

using json = nlohmann::json;
using Ptr = json::json_pointer;

namespace {

enum Site { kInteger, kRational, kTime, kId, kIndex, kToken, kList, kRowList, kOrdered, kField, kHash, kSiteCount };

struct Sites {
  std::vector<Ptr> at[kSiteCount];
  std::vector<std::pair<Ptr, int>> coef_rows;  // chain row and the position of its coefficient
};

Sites collect_sites(const json& c);

// Operators only ever read sites of an original certificate, which lives as long as the
// campaign: cache by address (a megabyte chamber tree has a quarter of a million tokens).
const Sites& collect(const json& c) {
  static std::map<const json*, Sites> cache;
  auto it = cache.find(&c);
  if (it == cache.end()) it = cache.emplace(&c, collect_sites(c)).first;
  return it->second;
}

Sites collect_sites(const json& c) {
  Sites s;
  Ptr root;
  for (const char* f : {"format", "claim", "method", "ring", "input_format"})
    if (c.contains(f)) s.at[kField].push_back(root / f);
  if (c.contains("input_sha256")) s.at[kHash].push_back(root / "input_sha256");
  for (const char* f : {"winding", "fence_value"})
    if (c.contains(f)) s.at[kInteger].push_back(root / f);
  if (c.contains("frames")) {
    s.at[kList].push_back(root / "frames");
    s.at[kOrdered].push_back(root / "frames");
    for (std::size_t i = 0; i < c["frames"].size(); ++i) {
      s.at[kRational].push_back(root / "frames" / i);
      s.at[kTime].push_back(root / "frames" / i);
    }
  }
  // Chain rows: [k, ids..., coefficient, witness...].
  struct Shape { const char* key; int ids; };
  for (Shape sh : {Shape{"triangles", 3}, Shape{"prisms", 2}, Shape{"edges", 2}, Shape{"verticals", 1}}) {
    if (!c.contains(sh.key)) continue;
    Ptr list = root / sh.key;
    s.at[kList].push_back(list);
    s.at[kRowList].push_back(list);
    for (std::size_t i = 0; i < c[sh.key].size(); ++i) {
      Ptr row = list / i;
      s.at[kList].push_back(row);
      s.at[kIndex].push_back(row / 0);
      for (int j = 1; j <= sh.ids; ++j) s.at[kId].push_back(row / j);
      s.at[kInteger].push_back(row / (sh.ids + 1));
      s.coef_rows.push_back({row, sh.ids + 1});
      for (std::size_t j = sh.ids + 2; j < c[sh.key][i].size(); ++j) s.at[kRational].push_back(row / j);
    }
  }
  if (c.contains("square")) {
    s.at[kRational].push_back(root / "square" / "origin" / 0);
    s.at[kRational].push_back(root / "square" / "origin" / 1);
    s.at[kRational].push_back(root / "square" / "side");
  }
  if (c.contains("sensors")) {
    s.at[kList].push_back(root / "sensors");
    for (std::size_t i = 0; i < c["sensors"].size(); ++i) s.at[kId].push_back(root / "sensors" / i);
  }
  if (c.contains("slabs")) {
    s.at[kList].push_back(root / "slabs");
    s.at[kOrdered].push_back(root / "slabs");
    for (std::size_t j = 0; j < c["slabs"].size(); ++j) {
      Ptr slab = root / "slabs" / j;
      for (int e = 0; e < 2; ++e) {
        s.at[kRational].push_back(slab / "t" / e);
        s.at[kTime].push_back(slab / "t" / e);
      }
      s.at[kList].push_back(slab / "tree");
      for (std::size_t i = 0; i < c["slabs"][j]["tree"].size(); ++i) s.at[kToken].push_back(slab / "tree" / i);
    }
  }
  if (c.contains("route")) {
    s.at[kList].push_back(root / "route");
    s.at[kOrdered].push_back(root / "route");
    for (std::size_t i = 0; i < c["route"].size(); ++i) {
      s.at[kList].push_back(root / "route" / i);
      for (int e = 0; e < 3; ++e) s.at[kRational].push_back(root / "route" / i / e);
      s.at[kTime].push_back(root / "route" / i / 0);
    }
  }
  return s;
}

std::size_t below(Rng& rng, std::size_t n) { return static_cast<std::size_t>(rng() % n); }

template <class T>
const T* pick(const std::vector<T>& v, Rng& rng) {
  return v.empty() ? nullptr : &v[below(rng, v.size())];
}

std::optional<Mutant> done(const json& m, std::string what) { return Mutant{m.dump(), std::move(what)}; }

mutref::Q value_of(const json& v) { return mutref::rational(v, "mutation site"); }

std::string short_text(const json& v) {
  std::string s = v.dump();
  return s.size() > 40 ? s.substr(0, 37) + "..." : s;
}

std::optional<Mutant> set_at(const json& cert, const Ptr& p, json v, const char* op) {
  json m = cert;
  std::string what = std::string(op) + " " + p.to_string() + ": " + short_text(m[p]) + " -> " + short_text(v);
  if (m[p] == v) return std::nullopt;
  m[p] = std::move(v);
  return done(m, what);
}

// ---- list operators -------------------------------------------------------------------------

std::optional<Mutant> drop_item(const json& c, const Context&, Rng& rng) {
  const Sites& s = collect(c);
  const Ptr* p = pick(s.at[kList], rng);
  if (!p || c[*p].empty()) return std::nullopt;
  json m = c;
  std::size_t i = below(rng, m[*p].size());
  std::string what = "drop " + p->to_string() + "/" + std::to_string(i) + " " + short_text(m[*p][i]);
  m[*p].erase(i);
  return done(m, what);
}

std::optional<Mutant> duplicate_item(const json& c, const Context&, Rng& rng) {
  const Sites& s = collect(c);
  const Ptr* p = pick(s.at[kList], rng);
  if (!p || c[*p].empty()) return std::nullopt;
  json m = c;
  auto& a = m[*p];
  std::size_t i = below(rng, a.size()), j = below(rng, a.size() + 1);
  json copy = a[i];
  a.insert(a.begin() + static_cast<long>(j), copy);
  return done(m, "duplicate " + p->to_string() + "/" + std::to_string(i) + " at " + std::to_string(j));
}

std::optional<Mutant> swap_items(const json& c, const Context&, Rng& rng) {
  const Sites& s = collect(c);
  const Ptr* p = pick(s.at[kList], rng);
  if (!p || c[*p].size() < 2) return std::nullopt;
  json m = c;
  auto& a = m[*p];
  std::size_t i = below(rng, a.size()), j = below(rng, a.size());
  if (a[i] == a[j]) return std::nullopt;
  std::swap(a[i], a[j]);
  return done(m, "swap " + p->to_string() + " items " + std::to_string(i) + "," + std::to_string(j));
}

std::optional<Mutant> shuffle_rows(const json& c, const Context&, Rng& rng) {
  const Sites& s = collect(c);
  const Ptr* p = pick(s.at[kRowList], rng);
  if (!p || c[*p].size() < 2) return std::nullopt;
  json m = c;
  std::vector<json> rows(m[*p].begin(), m[*p].end());
  std::shuffle(rows.begin(), rows.end(), rng);
  m[*p] = rows;
  if (m == c) return std::nullopt;
  return done(m, "shuffle " + p->to_string());
}

std::optional<Mutant> reorder_frames(const json& c, const Context&, Rng& rng) {
  const Sites& s = collect(c);
  const Ptr* p = pick(s.at[kOrdered], rng);
  if (!p || c[*p].size() < 2) return std::nullopt;
  json m = c;
  std::size_t i = below(rng, m[*p].size() - 1);
  if (rng() % 4 == 0) {
    std::reverse(m[*p].begin(), m[*p].end());
    return done(m, "reverse " + p->to_string());
  }
  std::swap(m[*p][i], m[*p][i + 1]);
  return done(m, "swap adjacent " + p->to_string() + " " + std::to_string(i));
}

// ---- number operators -----------------------------------------------------------------------

std::optional<Mutant> integer_pm1(const json& c, const Context&, Rng& rng) {
  const Sites& s = collect(c);
  const Ptr* p = pick(s.at[kInteger], rng);
  if (!p) return std::nullopt;
  mpz_class z(c[*p].get<std::string>());
  z += rng() % 2 ? 1 : -1;
  return set_at(c, *p, z.get_str(), "integer+-1");
}

std::optional<Mutant> negate(const json& c, const Context&, Rng& rng) {
  const Sites& s = collect(c);
  const Ptr* p = rng() % 2 ? pick(s.at[kInteger], rng) : pick(s.at[kRational], rng);
  if (!p) return std::nullopt;
  std::string t = c[*p].get<std::string>();
  return set_at(c, *p, t[0] == '-' ? t.substr(1) : "-" + t, "negate");
}

std::optional<Mutant> digit(const json& c, const Context&, Rng& rng) {
  const Sites& s = collect(c);
  const Ptr* p = rng() % 2 ? pick(s.at[kInteger], rng) : pick(s.at[kRational], rng);
  if (!p) return std::nullopt;
  std::string t = c[*p].get<std::string>();
  std::vector<std::size_t> digits;
  for (std::size_t i = 0; i < t.size(); ++i)
    if (t[i] >= '0' && t[i] <= '9') digits.push_back(i);
  if (digits.empty()) return std::nullopt;
  std::size_t i = *pick(digits, rng);
  char d = static_cast<char>('0' + (t[i] - '0' + 1 + below(rng, 9)) % 10);
  t[i] = d;
  return set_at(c, *p, t, "digit");
}

std::optional<Mutant> nudge(const json& c, const Context&, Rng& rng) {
  const Sites& s = collect(c);
  const Ptr* p = pick(s.at[kRational], rng);
  if (!p) return std::nullopt;
  static const char* deltas[] = {"1/1000", "-1/1000", "1/1000000", "-1/1000000", "1/3", "-1/7"};
  mutref::Q q = value_of(c[*p]) + mutref::Q(deltas[below(rng, 6)]);
  return set_at(c, *p, q.get_str(), "nudge");
}

std::optional<Mutant> shift_time(const json& c, const Context&, Rng& rng) {
  const Sites& s = collect(c);
  bool index = rng() % 2 && !s.at[kIndex].empty();
  const Ptr* p = index ? pick(s.at[kIndex], rng) : pick(s.at[kTime], rng);
  if (!p) return std::nullopt;
  int d = rng() % 2 ? 1 : -1;
  if (index) {
    long k = c[*p].get<long>() + d;
    if (k < 0) return std::nullopt;
    return set_at(c, *p, k, "shift-time");
  }
  return set_at(c, *p, mutref::Q(value_of(c[*p]) + d).get_str(), "shift-time");
}

std::optional<Mutant> equal_number(const json& c, const Context&, Rng& rng) {
  const Sites& s = collect(c);
  const Ptr* p = pick(s.at[kRational], rng);
  if (!p) return std::nullopt;
  mutref::Q q = value_of(c[*p]);
  std::vector<std::string> forms;
  long k = 2 + static_cast<long>(below(rng, 8));
  forms.push_back(mpz_class(q.get_num() * k).get_str() + "/" + mpz_class(q.get_den() * k).get_str());
  if (q.get_den() == 1) {
    forms.push_back(q.get_num().get_str() + ".0");
    forms.push_back(q.get_num().get_str() + "0e-1");
  }
  mpz_class d = q.get_den();  // a finite decimal when the denominator divides 10^20
  mpz_class p20;
  mpz_ui_pow_ui(p20.get_mpz_t(), 10, 20);
  if (p20 % d == 0) {
    mpz_class scaled = q.get_num() * (p20 / d);
    forms.push_back(scaled.get_str() + "e-20");
  }
  return set_at(c, *p, *pick(forms, rng), "equal-number");
}

std::optional<Mutant> scale_all(const json& c, const Context&, Rng& rng) {
  const Sites& s = collect(c);
  if (s.coef_rows.empty() && !c.contains("winding") && !c.contains("fence_value")) return std::nullopt;
  long k = rng() % 2 ? -1 : 2;
  json m = c;
  auto times = [&](json& v) { v = mpz_class(mpz_class(v.get<std::string>()) * k).get_str(); };
  for (const auto& [row, at] : s.coef_rows) times(m[row][at]);
  for (const char* f : {"winding", "fence_value"})
    if (m.contains(f)) times(m[f]);
  return done(m, "scale-all x" + std::to_string(k));
}

// ---- id and cell operators ------------------------------------------------------------------

std::optional<Mutant> reorient(const json& c, bool negate_too, Rng& rng) {
  const Sites& s = collect(c);
  std::vector<std::pair<Ptr, int>> rows;
  for (const auto& r : s.coef_rows)
    if (r.second >= 3) rows.push_back(r);  // rows with at least two ids
  const auto* r = pick(rows, rng);
  if (!r) return std::nullopt;
  json m = c;
  json& row = m[r->first];
  std::size_t i = 1 + below(rng, r->second - 1), j = 1 + below(rng, r->second - 1);
  if (i == j) j = i == 1 ? 2 : 1;
  std::swap(row[i], row[j]);
  std::string what = std::string(negate_too ? "reorient-negate " : "reorient ") + r->first.to_string();
  if (negate_too) {
    std::string t = row[r->second].get<std::string>();
    row[r->second] = t[0] == '-' ? t.substr(1) : "-" + t;
  }
  return done(m, what);
}
std::optional<Mutant> swap_ids(const json& c, const Context&, Rng& rng) { return reorient(c, false, rng); }
std::optional<Mutant> swap_ids_negate(const json& c, const Context&, Rng& rng) { return reorient(c, true, rng); }

std::optional<Mutant> replace_id(const json& c, const Context& ctx, Rng& rng) {
  const Sites& s = collect(c);
  const Ptr* p = pick(s.at[kId], rng);
  if (!p) return std::nullopt;
  std::string id = rng() % 8 == 0 ? std::string("ghost") : *pick(ctx.input_ids, rng);
  return set_at(c, *p, id, "replace-id");
}

// ---- chambers -------------------------------------------------------------------------------

std::optional<Mutant> tree_token(const json& c, const Context&, Rng& rng) {
  const Sites& s = collect(c);
  const Ptr* p = pick(s.at[kToken], rng);
  if (!p) return std::nullopt;
  long table = static_cast<long>(c["sensors"].size());
  long choices[] = {-1, -2, -3, -4, table, table > 0 ? static_cast<long>(below(rng, table)) : 0};
  return set_at(c, *p, choices[below(rng, 6)], "tree-token");
}

// Replaces a leaf by a split into four copies of itself: the same cover, so still valid.
std::optional<Mutant> split_leaf(const json& c, const Context&, Rng& rng) {
  if (!c.contains("slabs") || !c["slabs"].is_array() || c["slabs"].empty()) return std::nullopt;
  std::size_t j = below(rng, c["slabs"].size());
  const json& tree = c["slabs"][j]["tree"];
  std::vector<std::size_t> leaves;
  std::vector<int> open{0};  // depth stack of pending children: depth of each pending slot
  for (std::size_t i = 0; i < tree.size() && !open.empty(); ++i) {
    int depth = open.back();
    open.pop_back();
    if (tree[i] == -1) {
      for (int q = 0; q < 4; ++q) open.push_back(depth + 1);
    } else if (depth < 40) {
      leaves.push_back(i);
    }
  }
  const std::size_t* i = pick(leaves, rng);
  if (!i) return std::nullopt;
  json m = c;
  json& t = m["slabs"][j]["tree"];
  json leaf = t[*i];
  t[*i] = -1;
  for (int q = 0; q < 4; ++q) t.insert(t.begin() + static_cast<long>(*i) + 1, leaf);
  return done(m, "split-leaf /slabs/" + std::to_string(j) + "/tree/" + std::to_string(*i) + " " + leaf.dump());
}

// Swaps two entries of the chamber sensor table and renumbers every token: still valid.
std::optional<Mutant> swap_table(const json& c, const Context&, Rng& rng) {
  if (!c.contains("sensors") || c["sensors"].size() < 2) return std::nullopt;
  long n = static_cast<long>(c["sensors"].size());
  long a = static_cast<long>(below(rng, n)), b = static_cast<long>(below(rng, n));
  if (a == b) return std::nullopt;
  json m = c;
  std::swap(m["sensors"][a], m["sensors"][b]);
  for (auto& slab : m["slabs"])
    for (auto& tok : slab["tree"]) {
      if (tok == a) tok = b;
      else if (tok == b) tok = a;
    }
  return done(m, "swap-table " + std::to_string(a) + "," + std::to_string(b));
}

// Splits a slab [a, b] at its midpoint into two slabs with the same tree: covered cells stay
// covered at the midpoint and the live sets are unchanged, so still valid.
std::optional<Mutant> split_slab(const json& c, const Context&, Rng& rng) {
  if (!c.contains("slabs") || c["slabs"].empty()) return std::nullopt;
  json m = c;
  std::size_t j = below(rng, m["slabs"].size());
  json first = m["slabs"][j], second = m["slabs"][j];
  std::string mid = mutref::Q((value_of(first["t"][0]) + value_of(first["t"][1])) / 2).get_str();
  first["t"][1] = mid;
  second["t"][0] = mid;
  m["slabs"][j] = first;
  m["slabs"].insert(m["slabs"].begin() + static_cast<long>(j) + 1, second);
  return done(m, "split-slab " + std::to_string(j));
}

// Adds the coboundary of a vertex at one frame to a cocycle: δφ stays 0 and φ(L_0) does not
// change (the two fence edges at a fence vertex cancel in L_0), so still valid.
std::optional<Mutant> add_coboundary(const json& c, const Context& ctx, Rng& rng) {
  if (!c.contains("edges") || !c.contains("frames") || !ctx.input_text) return std::nullopt;
  const mutref::Input& in = mutref::input_for(*ctx.input_text);
  const mutref::Stack& st = mutref::stack_for(in, c["frames"], false);
  const bool z2 = c["ring"] == "z2";
  const int v = static_cast<int>(below(rng, in.ids.size()));
  const std::size_t k = below(rng, st.frames()), n = st.frames() - 1;
  // Values by canonical cell: ("e", k, a, b) with a < b by byte order, or ("v", k, v).
  std::map<std::tuple<char, std::size_t, int, int>, mpz_class> phi;
  for (const auto& r : c["edges"]) {
    int a = in.index.at(r[1].get<std::string>()), b = in.index.at(r[2].get<std::string>());
    mpz_class x(r[3].get<std::string>());
    phi[{'e', r[0].get<std::size_t>(), std::min(a, b), std::max(a, b)}] += a < b ? x : mpz_class(-x);
  }
  for (const auto& r : c["verticals"]) phi[{'v', r[0].get<std::size_t>(), in.index.at(r[1].get<std::string>()), 0}] += mpz_class(r[2].get<std::string>());
  for (int u = 0; u < st.V; ++u)
    if (st.edge_at(k, u, v)) phi[{'e', k, std::min(u, v), std::max(u, v)}] += v > u ? 1 : -1;
  if (k >= 1) phi[{'v', k - 1, v, 0}] += 1;
  if (k < n) phi[{'v', k, v, 0}] -= 1;
  json m = c;
  m["edges"] = json::array();
  m["verticals"] = json::array();
  for (const auto& [cell, x] : phi) {
    mpz_class y = z2 ? mpz_class(x % 2 != 0 ? 1 : 0) : x;
    if (y == 0) continue;
    const auto& [kind, kk, a, b] = cell;
    if (kind == 'e') m["edges"].push_back({kk, in.ids[a], in.ids[b], y.get_str()});
    else m["verticals"].push_back({kk, in.ids[a], y.get_str()});
  }
  return done(m, "add-coboundary " + in.ids[v] + " at frame " + std::to_string(k));
}

// ---- routes ---------------------------------------------------------------------------------

// Inserts the exact midpoint row between two route rows: the same path, so still valid.
std::optional<Mutant> split_route(const json& c, const Context&, Rng& rng) {
  if (!c.contains("route") || c["route"].size() < 2) return std::nullopt;
  json m = c;
  std::size_t i = below(rng, m["route"].size() - 1);
  json row = json::array();
  for (int e = 0; e < 3; ++e) row.push_back(mutref::Q((value_of(c["route"][i][e]) + value_of(c["route"][i + 1][e])) / 2).get_str());
  m["route"].insert(m["route"].begin() + static_cast<long>(i) + 1, row);
  return done(m, "split-route at " + std::to_string(i));
}

// ---- fields ---------------------------------------------------------------------------------

std::optional<Mutant> change_field(const json& c, const Context&, Rng& rng) {
  const Sites& s = collect(c);
  const Ptr* p = pick(s.at[kField], rng);
  if (!p) return std::nullopt;
  static const std::map<std::string, std::vector<std::string>> values{
      {"/format", {"sweepcert-certificate-2", "sweepcert-scenario-1"}},
      {"/claim", {"no-evasion", "no-sheet", "evasion"}},
      {"/method", {"sheet", "cocycle", "chambers", "route"}},
      {"/ring", {"z", "z2", "q"}},
      {"/input_format", {"sweepcert-scenario-1", "sweepcert-contacts-1"}}};
  return set_at(c, *p, *pick(values.at(p->to_string()), rng), "change-field");
}

std::optional<Mutant> hash_digit(const json& c, const Context&, Rng& rng) {
  if (!c.contains("input_sha256") || !c["input_sha256"].is_string()) return std::nullopt;
  std::string h = c["input_sha256"].get<std::string>();
  std::size_t i = below(rng, h.size());
  if (rng() % 3 == 0 && h[i] >= 'a' && h[i] <= 'f') h[i] = static_cast<char>(h[i] - 'a' + 'A');
  else h[i] = "0123456789abcdef"[(std::string("0123456789abcdef").find(h[i]) + 1 + below(rng, 15)) % 16];
  return set_at(c, Ptr("/input_sha256"), h, "hash-digit");
}

std::optional<Mutant> retype(const json& c, const Context&, Rng& rng) {
  const Sites& s = collect(c);
  switch (rng() % 3) {
    case 0: {  // a rational with an integer value as a JSON integer: the same number (§1.1)
      std::vector<Ptr> whole;
      for (const auto& p : s.at[kRational]) {
        mutref::Q q = value_of(c[p]);
        if (q.get_den() == 1 && q.get_num().fits_slong_p()) whole.push_back(p);
      }
      const Ptr* p = pick(whole, rng);
      if (!p) return std::nullopt;
      return set_at(c, *p, value_of(c[*p]).get_num().get_si(), "retype");
    }
    case 1: {  // a coefficient as a JSON integer: must be a string (§1.2)
      const Ptr* p = pick(s.at[kInteger], rng);
      if (!p) return std::nullopt;
      mpz_class z(c[*p].get<std::string>());
      if (!z.fits_slong_p()) return std::nullopt;
      return set_at(c, *p, z.get_si(), "retype");
    }
    default: {  // a frame index or token as a string
      const Ptr* p = rng() % 2 ? pick(s.at[kIndex], rng) : pick(s.at[kToken], rng);
      if (!p) return std::nullopt;
      return set_at(c, *p, c[*p].dump(), "retype");
    }
  }
}

std::optional<Mutant> drop_key(const json& c, const Context&, Rng& rng) {
  std::vector<std::string> keys;
  for (auto it = c.begin(); it != c.end(); ++it) keys.push_back(it.key());
  json m = c;
  std::string k = *pick(keys, rng);
  m.erase(k);
  return done(m, "drop-key " + k);
}

std::optional<Mutant> add_key(const json& c, const Context&, Rng& rng) {
  static const std::vector<std::pair<const char*, json>> extra{
      {"extra", 0},           {"ring", "z"},       {"frames", json::array({"0"})}, {"winding", "1"},
      {"fence_value", "1"},   {"triangles", json::array()}, {"prisms", json::array()}, {"edges", json::array()},
      {"verticals", json::array()}, {"square", json::object()}, {"sensors", json::array()},
      {"slabs", json::array()}, {"route", json::array()}, {"Notes", "x"}};
  const auto& [k, v] = *pick(extra, rng);
  if (c.contains(k)) return std::nullopt;
  json m = c;
  m[k] = v;
  return done(m, std::string("add-key ") + k);
}

std::optional<Mutant> notes(const json& c, const Context&, Rng& rng) {
  json m = c;
  json v[] = {json(nullptr), json("edited"), json::object({{"claim", "evasion"}}), json::array({1, 2.5, "x"})};
  m["notes"] = v[below(rng, 4)];
  if (m == c) return std::nullopt;
  return done(m, "notes -> " + m["notes"].dump());
}

// Text level: a key written twice (nlohmann objects cannot hold that), §1.4.
std::optional<Mutant> duplicate_key(const json& c, const Context&, Rng& rng) {
  std::vector<std::string> keys;
  for (auto it = c.begin(); it != c.end(); ++it)
    if (it.key() != "notes") keys.push_back(it.key());
  std::string k = *pick(keys, rng);
  std::string text = c.dump();
  text.insert(1, json(k).dump() + ":" + c[k].dump() + ",");
  return Mutant{text, "duplicate-key " + k};
}

}  // namespace

const std::vector<NamedOperator>& operators() {
  static const std::vector<NamedOperator> table{
      {"drop-item", drop_item},       {"duplicate-item", duplicate_item}, {"swap-items", swap_items},
      {"shuffle-rows", shuffle_rows}, {"reorder-frames", reorder_frames}, {"integer+-1", integer_pm1},
      {"negate", negate},             {"digit", digit},                   {"nudge", nudge},
      {"shift-time", shift_time},     {"equal-number", equal_number},     {"scale-all", scale_all},
      {"swap-ids", swap_ids},         {"swap-ids-negate", swap_ids_negate}, {"replace-id", replace_id},
      {"tree-token", tree_token},     {"split-leaf", split_leaf},         {"swap-table", swap_table},
      {"split-route", split_route},   {"change-field", change_field},     {"hash-digit", hash_digit},
      {"retype", retype},             {"drop-key", drop_key},             {"add-key", add_key},
      {"notes", notes},               {"duplicate-key", duplicate_key},   {"split-slab", split_slab},
      {"add-coboundary", add_coboundary}};
  return table;
}

}  // namespace mutation
