// Reference for sheets (§4.3) and cocycles (§4.4): dense vectors over every 1-cell of the stack.
// A sheet's boundary is summed cell by cell from §3.2's formulas; a cocycle's coboundary is
// evaluated on every 2-cell the stack has, enumerated here from the input (not from the
// certificate).
#include <algorithm>

#include "ref_internal.hpp"

namespace mutref {

namespace {

bool zero_in_ring(const Z& z, bool z2) { return z2 ? mpz_even_p(z.get_mpz_t()) != 0 : z == 0; }

// Slot and sign of the oriented edge [a, b] at frame k relative to the canonical orientation.
std::pair<std::size_t, int> edge_cell(const Stack& st, std::size_t k, int a, int b) {
  return a < b ? std::make_pair(st.edge_slot(k, a, b), 1) : std::make_pair(st.edge_slot(k, b, a), -1);
}

int vertex(const Input& in, const json& v, const std::string& where) {
  std::string id = id_text(v, where);
  auto it = in.index.find(id);
  if (it == in.index.end()) refuse(where + ": unknown sensor \"" + id + "\"");
  return it->second;
}

Z coefficient(const json& v, bool z2, const std::string& where) {
  Z c = integer_text(v, where);
  if (c == 0) refuse(where + ": zero coefficient");
  if (z2 && c != 1) refuse(where + ": over z2 every coefficient is \"1\"");
  return c;
}

const json& array_field(const json& cert, const char* key) {
  const json& a = cert.at(key);
  if (!a.is_array()) refuse(std::string("/") + key + ": not an array");
  return a;
}

const json& row_of(const json& rows, std::size_t i, std::size_t size, const std::string& where) {
  const json& r = rows[i];
  if (!r.is_array() || r.size() != size) refuse(where + ": a row of " + std::to_string(size) + " items is expected");
  return r;
}

}  // namespace

void verify_sheet(const Input& in, const json& cert, bool z2) {
  const Stack& st = stack_for(in, cert.at("frames"), false);
  const std::size_t n = st.frames() - 1;
  Z winding = integer_text(cert.at("winding"), "/winding");
  if (z2 ? winding != 1 : winding == 0) refuse("/winding: must be nonzero (z) or 1 (z2)");

  std::vector<Z> boundary(st.slots());
  std::set<std::vector<long>> named;  // (kind, k, sorted vertices)
  auto add_edge = [&](std::size_t k, int a, int b, const Z& c) {
    auto [slot, sign] = edge_cell(st, k, a, b);
    boundary[slot] += sign * c;
  };

  const json& tris = array_field(cert, "triangles");
  for (std::size_t i = 0; i < tris.size(); ++i) {
    std::string w = "/triangles/" + std::to_string(i);
    const json& r = row_of(tris, i, in.positional ? 7 : 5, w);
    long k = frame_index(r[0], w + "/0");
    if (static_cast<std::size_t>(k) > n) refuse(w + "/0: frame out of range");
    int v[3] = {vertex(in, r[1], w + "/1"), vertex(in, r[2], w + "/2"), vertex(in, r[3], w + "/3")};
    if (v[0] == v[1] || v[0] == v[2] || v[1] == v[2]) refuse(w + ": ids not distinct");
    Z c = coefficient(r[4], z2, w + "/4");
    if (in.positional) {
      Point wp{rational(r[5], w + "/5"), rational(r[6], w + "/6")};
      for (int x : v)
        if (dist2(wp, in.centre(x, st.t[k])) > in.radius[x] * in.radius[x])
          refuse(w + ": witness outside the disk of " + in.ids[x]);
    } else {
      std::array<int, 3> s{v[0], v[1], v[2]};
      std::sort(s.begin(), s.end());
      bool present = in.from_pairs ? st.edge_at(k, s[0], s[1]) && st.edge_at(k, s[0], s[2]) && st.edge_at(k, s[1], s[2])
                                   : in.log_triples[st.log_start + k].count(s) > 0;
      if (!present) refuse(w + ": triangle not in the log frame");
    }
    std::vector<long> key{0, k, v[0], v[1], v[2]};
    std::sort(key.begin() + 2, key.end());
    if (!named.insert(key).second) refuse(w + ": cell named twice");
    add_edge(k, v[1], v[2], c);
    add_edge(k, v[0], v[2], -c);
    add_edge(k, v[0], v[1], c);
  }

  const json& prisms = array_field(cert, "prisms");
  for (std::size_t i = 0; i < prisms.size(); ++i) {
    std::string w = "/prisms/" + std::to_string(i);
    const json& r = row_of(prisms, i, 4, w);
    long k = frame_index(r[0], w + "/0");
    if (static_cast<std::size_t>(k) >= n) refuse(w + "/0: slab out of range");
    int a = vertex(in, r[1], w + "/1"), b = vertex(in, r[2], w + "/2");
    if (a == b) refuse(w + ": ids not distinct");
    Z c = coefficient(r[3], z2, w + "/3");
    if (!st.edge_at(k, a, b) || !st.edge_at(k + 1, a, b)) refuse(w + ": edge not present at both slab ends");
    if (!named.insert({1, k, std::min(a, b), std::max(a, b)}).second) refuse(w + ": cell named twice");
    boundary[st.vertical_slot(b, k)] += c;
    boundary[st.vertical_slot(a, k)] -= c;
    add_edge(k + 1, a, b, -c);
    add_edge(k, a, b, c);
  }

  // The fence cylinder: fence verticals and fence edges; everything else must vanish.
  const std::size_t m = in.fence.size();
  std::vector<char> cylinder(st.slots(), 0);
  for (int f : in.fence)
    for (std::size_t k = 0; k < n; ++k) cylinder[st.vertical_slot(f, k)] = 1;
  for (std::size_t i = 0; i < m; ++i)
    for (std::size_t k = 0; k <= n; ++k) cylinder[edge_cell(st, k, in.fence[i], in.fence[(i + 1) % m]).first] = 1;
  for (std::size_t s = 0; s < st.slots(); ++s)
    if (!cylinder[s] && !zero_in_ring(boundary[s], z2)) refuse("boundary has a nonzero coefficient off the fence cylinder");
  for (std::size_t i = 0; i < m; ++i) {
    Z sum = 0;
    for (std::size_t k = 0; k <= n; ++k) {
      auto [slot, sign] = edge_cell(st, k, in.fence[i], in.fence[(i + 1) % m]);
      sum += sign * boundary[slot];
    }
    bool ok = z2 ? mpz_odd_p(sum.get_mpz_t()) != 0 : sum == winding;
    if (!ok) refuse("winding along fence edge " + std::to_string(i) + " is " + sum.get_str());
  }
}

void verify_cocycle(const Input& in, const json& cert, bool z2) {
  const Stack& st = stack_for(in, cert.at("frames"), true);
  const std::size_t n = st.frames() - 1;
  Z fence_value = integer_text(cert.at("fence_value"), "/fence_value");
  if (z2 ? fence_value != 1 : fence_value == 0) refuse("/fence_value: must be nonzero (z) or 1 (z2)");

  std::vector<Z> phi(st.slots());
  std::vector<char> named(st.slots(), 0);
  const json& edges = array_field(cert, "edges");
  for (std::size_t i = 0; i < edges.size(); ++i) {
    std::string w = "/edges/" + std::to_string(i);
    const json& r = row_of(edges, i, 4, w);
    long k = frame_index(r[0], w + "/0");
    if (static_cast<std::size_t>(k) > n) refuse(w + "/0: frame out of range");
    int a = vertex(in, r[1], w + "/1"), b = vertex(in, r[2], w + "/2");
    if (a == b) refuse(w + ": ids not distinct");
    Z value = coefficient(r[3], z2, w + "/3");
    if (!st.edge_at(k, a, b)) refuse(w + ": no such edge at that frame");
    auto [slot, sign] = edge_cell(st, k, a, b);
    if (named[slot]++) refuse(w + ": cell named twice");
    phi[slot] = sign * value;
  }
  const json& verticals = array_field(cert, "verticals");
  for (std::size_t i = 0; i < verticals.size(); ++i) {
    std::string w = "/verticals/" + std::to_string(i);
    const json& r = row_of(verticals, i, 3, w);
    long k = frame_index(r[0], w + "/0");
    if (static_cast<std::size_t>(k) >= n) refuse(w + "/0: slab out of range");
    int v = vertex(in, r[1], w + "/1");
    Z value = coefficient(r[2], z2, w + "/2");
    std::size_t slot = st.vertical_slot(v, k);
    if (named[slot]++) refuse(w + ": cell named twice");
    phi[slot] = value;
  }

  auto at_edge = [&](std::size_t k, int a, int b) { return phi[st.edge_slot(k, a, b)]; };  // a < b
  for (std::size_t k = 0; k <= n; ++k)
    for (const auto& s : st.triangles[k]) {
      Z d = at_edge(k, s[1], s[2]) - at_edge(k, s[0], s[2]) + at_edge(k, s[0], s[1]);
      if (!zero_in_ring(d, z2))
        refuse("coboundary nonzero on triangle " + in.ids[s[0]] + "," + in.ids[s[1]] + "," + in.ids[s[2]] +
               " at frame " + std::to_string(k));
    }
  for (std::size_t k = 0; k < n; ++k)
    for (int a = 0; a < st.V; ++a)
      for (int b = a + 1; b < st.V; ++b) {
        if (!st.edge_at(k, a, b) || !st.edge_at(k + 1, a, b)) continue;
        Z d = phi[st.vertical_slot(b, k)] - phi[st.vertical_slot(a, k)] - at_edge(k + 1, a, b) + at_edge(k, a, b);
        if (!zero_in_ring(d, z2))
          refuse("coboundary nonzero on prism " + in.ids[a] + "," + in.ids[b] + " over slab " + std::to_string(k));
      }
  const std::size_t m = in.fence.size();
  Z loop = 0;
  for (std::size_t i = 0; i < m; ++i) {
    auto [slot, sign] = edge_cell(st, 0, in.fence[i], in.fence[(i + 1) % m]);
    loop += sign * phi[slot];
  }
  bool ok = z2 ? mpz_odd_p(loop.get_mpz_t()) != 0 : loop == fence_value;
  if (!ok) refuse("phi(L_0) = " + loop.get_str() + " differs from fence_value");
}

}  // namespace mutref
