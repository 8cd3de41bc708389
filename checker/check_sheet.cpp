// Sheet certificates (schema/README.md §4.3): a 2-chain alpha on the stack whose boundary lies
// on the fence cylinder and winds `winding` times around it.
#include <sstream>

#include "certificate.hpp"
#include "errors.hpp"

namespace sweepcheck {
namespace {

using json::Ref;

struct Row {
  bool prism;
  std::uint32_t index;  // row number in its array
  std::uint32_t k;
  std::uint32_t v[3];   // canonical order
  int sign;             // row orientation = sign * canonical orientation
  Value coef;
};

std::string row_pointer(const Row& r) {
  return std::string(r.prism ? "/prisms/" : "/triangles/") + std::to_string(r.index);
}

// The boundary of a row's canonical cell (§3.2) as f(is_vertical, key, sign), where an edge's
// key is pack(pair id, frame) and a vertical's is pack(vertex, slab).
template <class F>
void for_each_face(const Row& r, Stack& stack, F&& f) {
  const std::uint32_t a = r.v[0], b = r.v[1], c = r.v[2], k = r.k;
  if (r.prism) {  // d(prism of [a,b] over slab k) = V(b,k) - V(a,k) - E(a,b,k+1) + E(a,b,k)
    const std::uint32_t ab = stack.pair_id(a, b);
    f(true, pack(b, k), 1);
    f(true, pack(a, k), -1);
    f(false, pack(ab, k + 1), -1);
    f(false, pack(ab, k), 1);
  } else {  // d[a,b,c] = E(b,c) - E(a,c) + E(a,b)
    f(false, pack(stack.pair_id(b, c), k), 1);
    f(false, pack(stack.pair_id(a, c), k), -1);
    f(false, pack(stack.pair_id(a, b), k), 1);
  }
}

std::string face_text(Stack& stack, bool vertical, std::uint64_t key) {
  const std::uint32_t high = static_cast<std::uint32_t>(key >> 32), k = static_cast<std::uint32_t>(key);
  if (vertical) return "vertical V(" + stack.name(high) + ") over " + stack.slab_text(k);
  auto [a, b] = stack.pair_ends(high);
  return "edge [" + stack.name(a) + "," + stack.name(b) + "] at " + stack.frame_text(k);
}

template <class V>
bool nonzero(const V& x, Ring ring) { return ring == Ring::Z ? x != 0 : (x % 2) != 0; }

// Rules 3 and 4 with coefficients of type V: Checked64, or Int when some coefficient does not
// fit 64 bits or a Checked64 sum overflowed. Throws Rejected, or std::overflow_error from
// Checked64.
//
// The boundary is summed one frame at a time: the cells at frame k (edges at k, verticals over
// slab k) are faces only of the rows at frames k - 1 (a prism's top edge) and k. Small maps per
// frame are much faster than one map of every cell of a large sheet.
template <class V>
std::string boundary_and_winding(const std::vector<Row>& rows, const Values& values, Stack& stack, Ring ring,
                                 const Int& winding, std::ostream& out, Tally& tally) {
  // Set afresh: the exact path may redo this after the fast one overflowed.
  tally.faces_summed = tally.boundary_cells = tally.cylinder_cells = tally.fence_edges_wound = 0;
  tally.on_cylinder = false;
  const std::size_t frames = stack.frame_count();
  // The rows by frame, a counting sort: the rows at frame k are by_frame[begin[k], begin[k + 1]).
  std::vector<std::size_t> begin(frames + 2, 0);
  for (const Row& r : rows) ++begin[r.k + 2];
  for (std::size_t k = 2; k < begin.size(); ++k) begin[k] += begin[k - 1];
  std::vector<std::uint32_t> by_frame(rows.size());
  for (std::uint32_t i = 0; i < rows.size(); ++i) by_frame[begin[rows[i].k + 1]++] = i;

  FlatMap<V> bad_edges, bad_verticals;  // nonzero cells off the fence cylinder
  std::vector<V> wind(stack.fence_size(), V(0));
  std::size_t on_cylinder = 0;
  for (std::uint32_t k = 0; k < frames; ++k) {
    const std::size_t first = k > 0 ? begin[k - 1] : 0, last = begin[k + 1];  // rows at k - 1 and k
    if (first == last) continue;
    FlatMap<V> edges, verticals;  // at frame k: pair id -> sum, vertex -> sum
    edges.reserve(3 * (last - first));
    for (std::size_t i = first; i < last; ++i) {
      const Row& r = rows[by_frame[i]];
      const V c = r.sign < 0 ? V(-values.get<V>(r.coef)) : values.get<V>(r.coef);
      for_each_face(r, stack, [&](bool vertical, std::uint64_t key, int s) {
        if (static_cast<std::uint32_t>(key) != k) return;
        const V term = s < 0 ? V(-c) : c;
        ++tally.faces_summed;
        auto [slot, fresh] = (vertical ? verticals : edges).insert(key >> 32, term);
        if (!fresh) *slot += term;
      });
    }
    tally.boundary_cells += edges.size() + verticals.size();
    // Rule 3 (nothing outside the fence cylinder: fence edges, fence verticals), and rule 4's
    // sums: the winding along every fence edge, in listed orientation.
    edges.for_each([&](std::uint64_t pair, const V& x) {
      if (!nonzero(x, ring)) return;
      const int i = stack.fence_edge(static_cast<std::uint32_t>(pair));
      if (i < 0) {
        bad_edges.insert(pack(static_cast<std::uint32_t>(pair), k), x);
        return;
      }
      ++on_cylinder;
      wind[static_cast<std::size_t>(i)] += stack.fence_sign(static_cast<std::size_t>(i)) < 0 ? V(-x) : x;
    });
    verticals.for_each([&](std::uint64_t v, const V& x) {
      if (!nonzero(x, ring)) return;
      if (!stack.input().is_fence[v]) bad_verticals.insert(pack(static_cast<std::uint32_t>(v), k), x); else ++on_cylinder;
    });
  }
  if (bad_edges.size() + bad_verticals.size() > 0) {
    // Name the first row (in document order) whose boundary touches an offending cell.
    for (const Row& r : rows) {
      bool hit = false;
      std::string what;
      for_each_face(r, stack, [&](bool vertical, std::uint64_t key, int) {
        const V* x = (vertical ? bad_verticals : bad_edges).find(key);
        if (hit || !x) return;
        hit = true;
        what = face_text(stack, vertical, key) + " has boundary coefficient " + x->str() +
               (ring == Ring::Z2 ? " (odd)" : "");
      });
      if (hit)
        throw Rejected(row_pointer(r), what,
                       "the boundary has a nonzero coefficient outside the fence cylinder; this is the first row "
                       "touching such a cell (" + std::to_string(bad_edges.size() + bad_verticals.size()) +
                           " such cells, rule 4.3.3)");
    }
  }
  tally.cylinder_cells = on_cylinder;
  tally.on_cylinder = true;
  out << "boundary: " << on_cylinder << " nonzero cells, all on the fence cylinder (rule 3)\n";
  // Rule 4.
  const auto& fence = stack.input().fence;
  for (std::size_t i = 0; i < wind.size(); ++i) {
    bool ok = ring == Ring::Z ? to_int(wind[i]) == winding : nonzero(wind[i], ring);
    if (!ok)
      throw Rejected("/winding",
                     "fence edge [" + stack.name(fence[i]) + "," + stack.name(fence[(i + 1) % fence.size()]) + "]",
                     "the boundary winds " + wind[i].str() + " times along this fence edge, not " + winding.str() +
                         (ring == Ring::Z2 ? " (mod 2)" : "") + " (rule 4.3.4)");
    ++tally.fence_edges_wound;
  }
  out << "winding: " << winding << (ring == Ring::Z2 ? " (mod 2)" : "") << " along each of the " << wind.size()
      << " fence edges (rule 4)\n";
  // §4.3: no evasion path on [t_0, t_n], hence none on the whole horizon.
  std::string span = "[" + to_text(stack.time(0)) + ", " + to_text(stack.time(stack.frame_count() - 1)) + "]";
  if (stack.positional())
    span += ", hence none on the horizon [" + to_text(stack.input().horizon_start) + ", " +
            to_text(stack.input().horizon_end) + "]";
  return "no evasion path on " + span + " (sheet over " + ring_name(ring) + ", winding " + winding.str() + ")";
}

}  // namespace

std::string check_sheet(const Certificate& cert, Stack& stack, std::ostream& out, Tally& tally) {
  const Input& in = stack.input();
  const Members& m = cert.members;
  const Ring ring = cert.ring;
  const std::uint32_t n = static_cast<std::uint32_t>(stack.frame_count() - 1);
  Int winding;
  try {
    winding = get_integer(m.need("winding"), "/winding");
  } catch (const FieldError& e) {
    throw Rejected(e.pointer, "", e.message);
  }
  if (ring == Ring::Z && winding == 0) throw Rejected("/winding", "", "winding must be nonzero over z (§4.3)");
  if (ring == Ring::Z2 && winding != 1) throw Rejected("/winding", "", "winding must be \"1\" over z2 (§4.3)");

  Values values;
  std::vector<Row> rows;
  FlatMap<std::uint32_t> triple_ids;  // pack(pair id of (a, b), c) -> local triple id
  FlatMap<std::uint32_t> seen;        // pack(cell id, k) -> row, triangles and prisms apart
  FlatMap<std::uint32_t> seen_prisms;

  Ref triangles = m.need("triangles");
  if (!triangles.is(json::Kind::Array)) throw Rejected("/triangles", "", "expected an array (§4.3)");
  Ref prisms = m.need("prisms");
  if (!prisms.is(json::Kind::Array)) throw Rejected("/prisms", "", "expected an array (§4.3)");
  rows.reserve(triangles.size() + prisms.size());
  triple_ids.reserve(triangles.size());
  seen.reserve(triangles.size());
  seen_prisms.reserve(prisms.size());
  const bool positional = stack.positional();
  const std::size_t length = positional ? 7 : 5;
  for (std::size_t i = 0; i < triangles.size(); ++i) {
    const Where w{"/triangles", i};
    Ref row = triangles[i];
    expect_row(row, w, length, positional ? "[k, a, b, c, coef, wx, wy]" : "[k, a, b, c, coef]");
    Row r{false, static_cast<std::uint32_t>(i), read_index(row[0], w.at(0), n + 1, "frame"), {}, 1, {}};
    std::uint32_t given[3];
    for (int j = 0; j < 3; ++j) {
      given[j] = r.v[j] = read_sensor(row[static_cast<std::size_t>(1 + j)], w.at(1 + j), in);
      for (int l = 0; l < j; ++l)
        if (given[l] == given[j]) throw Rejected(w.at(1 + j).str(), "sensor \"" + stack.name(given[j]) + "\"", "repeated in one cell (rule 4.3.1)");
    }
    r.coef = values.read(row[4], w.at(4), ring, "rule 4.3.2");
    r.sign = canonical_order(r.v, 3);
    auto item = [&] {
      return "triangle [" + stack.name(given[0]) + "," + stack.name(given[1]) + "," + stack.name(given[2]) + "] at " +
             stack.frame_text(r.k);
    };
    if (positional) {
      Point p;
      try {
        p = Point{get_rational(row[5], w.at(5).str()), get_rational(row[6], w.at(6).str())};
      } catch (const FieldError& e) {
        throw Rejected(e.pointer, item(), e.message);
      }
      for (int j = 0; j < 3; ++j)
        if (!in_disk(p, stack.position(given[j], r.k), in.sensors[given[j]].radius))
          throw Rejected(w.at(5).str(), item(), "witness (" + to_text(p.x) + ", " + to_text(p.y) +
                                                    ") lies outside the disk of sensor \"" + stack.name(given[j]) +
                                                    "\" (rule 4.3.1)");
      ++tally.witnesses;
    } else if (!stack.triangle_present(r.v[0], r.v[1], r.v[2], r.k)) {
      throw Rejected(w.str(), item(), in.listed ? "not a listed triple of the log at this frame (rule 4.3.1)"
                                                : "the three sensors are not pairwise in contact at this frame (rule 4.3.1)");
    }
    const std::uint32_t tid = *triple_ids.insert(pack(stack.pair_id(r.v[0], r.v[1]), r.v[2]),
                                                 static_cast<std::uint32_t>(triple_ids.size())).first;
    auto [first, fresh] = seen.insert(pack(tid, r.k), static_cast<std::uint32_t>(i));
    if (!fresh) throw Rejected(w.str(), item(), "the cell appears twice (also /triangles/" + std::to_string(*first) + ", rule 4.3.2)");
    ++tally.triangles;
    rows.push_back(r);
  }

  for (std::size_t i = 0; i < prisms.size(); ++i) {
    const Where w{"/prisms", i};
    Ref row = prisms[i];
    expect_row(row, w, 4, "[k, a, b, coef]");
    Row r{true, static_cast<std::uint32_t>(i), read_index(row[0], w.at(0), n, "slab"), {}, 1, {}};
    r.v[0] = read_sensor(row[1], w.at(1), in);
    r.v[1] = read_sensor(row[2], w.at(2), in);
    const std::uint32_t a = r.v[0], b = r.v[1];
    if (a == b) throw Rejected(w.at(2).str(), "sensor \"" + stack.name(a) + "\"", "repeated in one cell (rule 4.3.1)");
    r.coef = values.read(row[3], w.at(3), ring, "rule 4.3.2");
    r.sign = canonical_order(r.v, 2);
    auto item = [&] { return "prism [" + stack.name(a) + "," + stack.name(b) + "] over " + stack.slab_text(r.k); };
    for (std::uint32_t end : {r.k, r.k + 1})
      if (!stack.edge_present(r.v[0], r.v[1], end))
        throw Rejected(w.str(), item(), "the edge is not present at " + stack.frame_text(end) + " (rule 4.3.1)");
      else
        ++tally.prism_end_tests;
    auto [first, fresh] = seen_prisms.insert(pack(stack.pair_id(r.v[0], r.v[1]), r.k), static_cast<std::uint32_t>(i));
    if (!fresh) throw Rejected(w.str(), item(), "the cell appears twice (also /prisms/" + std::to_string(*first) + ", rule 4.3.2)");
    ++tally.prisms;
    rows.push_back(r);
  }
  out << "sheet: " << triangles.size() << " triangles and " << prisms.size()
      << " prisms, every cell present, none twice, no zero coefficient (rules 1, 2)\n";
  tally.cells_distinct = true;

  return fast_then_exact(!values.any_big(), out, [&](auto use, std::ostream& sink) {
    using T = typename decltype(use)::type;
    return boundary_and_winding<T>(rows, values, stack, ring, winding, sink, tally);
  });
}

}  // namespace sweepcheck
