// Cocycle certificates (schema/README.md §4.4): a 1-cochain phi with delta(phi) = 0 on every
// 2-cell of the stack and phi(L_0) != 0, proving that no sheet exists on these frames.
#include <algorithm>
#include <sstream>

#include "certificate.hpp"
#include "errors.hpp"

namespace sweepcheck {
namespace {

using json::Ref;

struct Entry {
  int sign;  // row orientation = sign * canonical orientation
  Value value;
  std::uint64_t key;  // the cell: pack(pair id, frame) for an edge, pack(vertex, slab) for a vertical
};

struct Cochain {
  std::vector<Entry> edge_rows, vertical_rows;
  FlatMap<std::uint32_t> edges;      // pack(pair id, k) -> edge row
  FlatMap<std::uint32_t> verticals;  // pack(vertex, k) -> vertical row
};

constexpr std::uint64_t kVerticalRow = std::uint64_t(1) << 40;  // row numbers: edges, then verticals

// phi on canonical cells, and the row defining it (rows are ordered edges first, then
// verticals; ~0 when phi is 0 there).
template <class V>
struct Phi {
  const Cochain& c;
  const Values& values;
  std::uint64_t first_row = ~std::uint64_t(0);
  V at(const FlatMap<std::uint32_t>& map, const std::vector<Entry>& rows, std::uint64_t key, std::uint64_t offset) {
    const std::uint32_t* row = map.find(key);
    if (!row) return V(0);
    first_row = std::min(first_row, offset + *row);
    const Entry& e = rows[*row];
    V x = values.get<V>(e.value);
    return e.sign < 0 ? V(-x) : x;
  }
  V edge(std::uint64_t key) { return at(c.edges, c.edge_rows, key, 0); }
  V vertical(std::uint64_t key) { return at(c.verticals, c.vertical_rows, key, kVerticalRow); }
};

std::string row_pointer(std::uint64_t row) {
  if (row >= kVerticalRow) return "/verticals/" + std::to_string(row - kVerticalRow);
  return "/edges/" + std::to_string(row);
}

template <class V>
bool nonzero(const V& x, Ring ring) { return ring == Ring::Z ? x != 0 : (x % 2) != 0; }

// phi(boundary of cell), by §3.2; then phi.first_row is the first row (edges before verticals)
// listing a face of the cell.
template <class V>
V boundary_value(const TwoCell& cell, Stack& stack, Phi<V>& phi) {
  const std::uint32_t a = cell.v[0], b = cell.v[1], k = cell.k;
  if (cell.prism) {  // phi(V(b,k)) - phi(V(a,k)) - phi(E(a,b,k+1)) + phi(E(a,b,k))
    const std::uint32_t ab = stack.pair_id(a, b);
    return phi.vertical(pack(b, k)) - phi.vertical(pack(a, k)) - phi.edge(pack(ab, k + 1)) + phi.edge(pack(ab, k));
  }
  const std::uint32_t c = cell.v[2];  // phi(E(b,c)) - phi(E(a,c)) + phi(E(a,b))
  return phi.edge(pack(stack.pair_id(b, c), k)) - phi.edge(pack(stack.pair_id(a, c), k)) +
         phi.edge(pack(stack.pair_id(a, b), k));
}

// Rules 2 and 3 with values of type V: Checked64, or Int when a value does not fit 64 bits or a
// Checked64 sum overflowed.
//
// Rule 2 asks phi(boundary of sigma) = 0 for every 2-cell sigma of the stack. That value is a
// signed sum of phi over the faces of sigma, and phi is 0 on every 1-cell that no row lists
// (its support). So a 2-cell with no face in the support passes trivially, and only the
// 2-cells incident to a listed 1-cell need evaluating. Each of those is found from a listed
// face f (Stack::cells_on_edge, cells_on_vertical), enumerated from INPUT:
// - f = E(a,b,k): a triangle {a,b,c} at k (its pairs {a,c} and {b,c} are present at k, so c is
//   a common neighbour of a and b at k), or the prism of [a,b] over slab k-1 or k;
// - f = V(v,k): the prism over slab k of an edge {u,v} present at k and k+1 (u a neighbour of
//   v at k).
// The work is thus bounded by the support and its neighbourhood, not the size of the stack. A
// cell with several listed faces is evaluated once per such face. The cell reported is the
// first failing one in the visiting order of NOTES.md reading 10 (visited_before), whatever the
// order in which cells are found.
template <class V>
std::string evaluate(const Cochain& c, const Values& values, Stack& stack, Ring ring, const Int& fence_value,
                     std::ostream& out, Tally& tally) {
  // The listed cells, frame by frame: the adjacency of a log frame is built once.
  std::vector<std::pair<std::uint32_t, std::uint64_t>> listed;  // (frame or slab, row number)
  listed.reserve(c.edge_rows.size() + c.vertical_rows.size());
  for (std::size_t i = 0; i < c.edge_rows.size(); ++i)
    listed.emplace_back(static_cast<std::uint32_t>(c.edge_rows[i].key), i);
  for (std::size_t i = 0; i < c.vertical_rows.size(); ++i)
    listed.emplace_back(static_cast<std::uint32_t>(c.vertical_rows[i].key), kVerticalRow + i);
  std::sort(listed.begin(), listed.end());

  std::size_t triangles = 0, prisms = 0;
  std::vector<TwoCell> around;
  bool failed = false;
  TwoCell first_failure;
  for (const auto& [k, row] : listed) {
    if (row >= kVerticalRow) {
      stack.cells_on_vertical(static_cast<std::uint32_t>(c.vertical_rows[row - kVerticalRow].key >> 32), k, around);
    } else {
      auto [a, b] = stack.pair_ends(static_cast<std::uint32_t>(c.edge_rows[row].key >> 32));
      stack.cells_on_edge(a, b, k, around);
    }
    for (const TwoCell& cell : around) {
      Phi<V> phi{c, values};
      ++(cell.prism ? prisms : triangles);
      if (nonzero(boundary_value(cell, stack, phi), ring) && (!failed || visited_before(cell, first_failure))) {
        failed = true;
        first_failure = cell;
      }
    }
  }
  if (failed) {  // a nonzero sum needs a nonzero phi, so first_row names a row
    Phi<V> phi{c, values};
    const V d = boundary_value(first_failure, stack, phi);
    throw Rejected(row_pointer(phi.first_row), stack.cell_text(first_failure),
                   "phi(boundary) = " + d.str() + (ring == Ring::Z2 ? " (odd)" : "") +
                       ", but a cocycle must vanish on every 2-cell (rule 4.4.2; the row named is one on its boundary)");
  }
  tally.cocycle_triangles = triangles;
  tally.cocycle_prisms = prisms;
  tally.coboundary_zero = true;
  out << "coboundary: phi vanishes on the " << triangles << " triangles and " << prisms
      << " prisms incident to its support, enumerated from INPUT (once per listed face); the other 2-cells have no "
         "face where phi is nonzero (rule 2)\n";
  Phi<V> phi{c, values};
  V loop(0);
  for (std::size_t i = 0; i < stack.fence_size(); ++i) {
    V x = phi.edge(pack(stack.fence_pair(i), 0));
    loop += stack.fence_sign(i) < 0 ? V(-x) : x;
  }
  bool ok = ring == Ring::Z ? to_int(loop) == fence_value : nonzero(loop, ring);
  if (!ok)
    throw Rejected("/fence_value", "fence loop L_0 at " + stack.frame_text(0),
                   "phi(L_0) = " + loop.str() + " but fence_value is " + fence_value.str() +
                       (ring == Ring::Z2 ? " (mod 2)" : "") + " (rule 4.4.3)");
  tally.fence_loop = true;
  out << "fence loop: phi(L_0) = " << fence_value << (ring == Ring::Z2 ? " (mod 2)" : "") << " != 0 (rule 3)\n";
  return "no sheet exists over " + ring_name(ring) + " on these " + std::to_string(stack.frame_count()) +
         " frames (t=" + to_text(stack.time(0)) + ".." + to_text(stack.time(stack.frame_count() - 1)) + ")";
}

}  // namespace

std::string check_cocycle(const Certificate& cert, Stack& stack, std::ostream& out, Tally& tally) {
  const Input& in = stack.input();
  const Members& m = cert.members;
  const Ring ring = cert.ring;
  const std::uint32_t n = static_cast<std::uint32_t>(stack.frame_count() - 1);
  Int fence_value;
  try {
    fence_value = get_integer(m.need("fence_value"), "/fence_value");
  } catch (const FieldError& e) {
    throw Rejected(e.pointer, "", e.message);
  }
  if (ring == Ring::Z && fence_value == 0) throw Rejected("/fence_value", "", "must be nonzero over z (§4.4)");
  if (ring == Ring::Z2 && fence_value != 1) throw Rejected("/fence_value", "", "must be \"1\" over z2 (§4.4)");

  Values values;
  Cochain c;
  Ref edges = m.need("edges");
  if (!edges.is(json::Kind::Array)) throw Rejected("/edges", "", "expected an array (§4.4)");
  for (std::size_t i = 0; i < edges.size(); ++i) {
    const Where w{"/edges", i};
    Ref row = edges[i];
    expect_row(row, w, 4, "[k, a, b, value]");
    const std::uint32_t k = read_index(row[0], w.at(0), n + 1, "frame");
    std::uint32_t v[2] = {read_sensor(row[1], w.at(1), in), read_sensor(row[2], w.at(2), in)};
    if (v[0] == v[1]) throw Rejected(w.at(2).str(), "sensor \"" + stack.name(v[0]) + "\"", "repeated in one cell (rule 4.4.1)");
    const std::uint32_t a = v[0], b = v[1];  // as written
    auto item = [&] { return "edge [" + stack.name(a) + "," + stack.name(b) + "] at " + stack.frame_text(k); };
    Entry e{canonical_order(v, 2), values.read(row[3], w.at(3), ring, "rule 4.4.1"), 0};
    if (!stack.edge_present(v[0], v[1], k)) throw Rejected(w.str(), item(), "the edge is not present at this frame (rule 4.4.1)");
    e.key = pack(stack.pair_id(v[0], v[1]), k);
    auto [first, fresh] = c.edges.insert(e.key, static_cast<std::uint32_t>(i));
    if (!fresh) throw Rejected(w.str(), item(), "the cell appears twice (also /edges/" + std::to_string(*first) + ", rule 4.4.1)");
    ++tally.edge_values;
    c.edge_rows.push_back(e);
  }
  Ref verticals = m.need("verticals");
  if (!verticals.is(json::Kind::Array)) throw Rejected("/verticals", "", "expected an array (§4.4)");
  for (std::size_t i = 0; i < verticals.size(); ++i) {
    const Where w{"/verticals", i};
    Ref row = verticals[i];
    expect_row(row, w, 3, "[k, v, value]");
    const std::uint32_t k = read_index(row[0], w.at(0), n, "slab");
    const std::uint32_t v = read_sensor(row[1], w.at(1), in);
    Entry e{1, values.read(row[2], w.at(2), ring, "rule 4.4.1"), pack(v, k)};
    auto [first, fresh] = c.verticals.insert(e.key, static_cast<std::uint32_t>(i));
    if (!fresh)
      throw Rejected(w.str(), "vertical V(" + stack.name(v) + ") over " + stack.slab_text(k),
                     "the cell appears twice (also /verticals/" + std::to_string(*first) + ", rule 4.4.1)");
    ++tally.vertical_values;
    c.vertical_rows.push_back(e);
  }
  out << "cochain: " << edges.size() << " edge values and " << verticals.size()
      << " vertical values, every cell present, none twice, no zero value (rule 1)\n";

  return fast_then_exact(!values.any_big(), out, [&](auto use, std::ostream& sink) {
    using T = typename decltype(use)::type;
    return evaluate<T>(c, values, stack, ring, fence_value, sink, tally);
  });
}

}  // namespace sweepcheck
