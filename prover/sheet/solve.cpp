#include "sheet/solve.hpp"

#include <algorithm>
#include <stdexcept>

#include "sheet/field.hpp"
#include "sheet/reduce.hpp"

namespace sweepcert {
namespace {

// Rational reconstruction: the fraction r/s with |r|, s <= sqrt(P/2) congruent to a mod P.
bool reconstruct(std::uint64_t a, Integer& num, Integer& den) {
  using i128 = __int128;
  const i128 P = static_cast<i128>(FieldFp::P);
  const i128 bound = 1073741823;  // floor(sqrt(P/2))
  i128 r0 = P, r1 = a, s0 = 0, s1 = 1;
  while (r1 > bound) {
    i128 q = r0 / r1;
    i128 r2 = r0 - q * r1, s2 = s0 - q * s1;
    r0 = r1; r1 = r2; s0 = s1; s1 = s2;
  }
  if (s1 == 0 || s1 > bound || -s1 > bound) return false;
  if (s1 < 0) { s1 = -s1; r1 = -r1; }
  num = Integer(static_cast<long>(r1));
  den = Integer(static_cast<long>(s1));
  Integer g = gcd(num, den);
  return g == 1;
}

// Lifts field values to integers: Z/2 values are 0/1; F_p values by reconstruction, scaled by
// the lcm of denominators (returned in `scale`).
template <class F>
std::vector<Integer> lift(const std::vector<std::uint64_t>& v, Integer& scale) {
  std::vector<Integer> out(v.size());
  scale = 1;
  if constexpr (std::is_same_v<F, FieldZ2>) {
    for (std::size_t i = 0; i < v.size(); ++i) out[i] = v[i] & 1;
    return out;
  } else {
    std::vector<Integer> dens(v.size());
    for (std::size_t i = 0; i < v.size(); ++i) {
      if (v[i] == 0) continue;
      if (!reconstruct(v[i], out[i], dens[i]))
        throw std::runtime_error("integer lift failed: a coefficient has no small fraction form");
      scale = lcm(scale, dens[i]);
    }
    for (std::size_t i = 0; i < v.size(); ++i)
      if (v[i] != 0) out[i] = out[i] * (scale / dens[i]);
    return out;
  }
}

// A prism over a fence edge has its whole boundary in the fence cylinder with zero net winding
// (V(b) - V(a) - E_{k+1} + E_k), so dropping it from a sheet leaves a sheet. We drop them so
// that every cell of a written sheet is needed.
bool is_fence_prism(const Stack& s, const TwoCell& c) {
  if (c.kind != TwoCell::Prism) return false;
  const Pair& p = s.frames[c.frame].edges[c.index];
  std::size_t m = s.fence_count;
  if (p.second >= m) return false;
  return p.second == p.first + 1 || (p.first == 0 && p.second == m - 1);
}

template <class F>
typename F::Entry entry(std::uint32_t row, int sign) {
  return F::make(row, F::from_int(sign));
}

template <class F>
SheetOutcome solve_in(const Stack& stack, const Progress& progress) {
  BoundaryLayout layout(stack);
  const auto& columns = layout.columns();
  Reduction<F> red(layout.rows());
  SheetOutcome out;
  out.rows = layout.rows();

  std::vector<typename F::Entry> rho;
  for (const auto& sr : layout.fence_loop()) rho.push_back(entry<F>(sr.row, sr.sign));
  std::vector<std::pair<std::uint32_t, std::uint64_t>> rho_record;

  SignedRow b[4];
  std::size_t done = 0;
  const std::size_t nframes = stack.frame_count();
  for (std::uint32_t k = 0; k < nframes && !rho.empty(); ++k) {
    for (; done < columns.size() && layout.completion_frame(columns[done]) == k; ++done) {
      int nb = layout.boundary(columns[done], b);
      typename Reduction<F>::Column col;
      col.reserve(nb);
      for (int i = 0; i < nb; ++i) col.push_back(entry<F>(b[i].row, b[i].sign));
      red.add(std::move(col));
      if (progress && (done & 0xffff) == 0) progress(done, columns.size());
    }
    red.eliminate(rho, rho_record);
    out.last_frame = k;
  }
  out.columns = done;
  out.additions = red.additions();

  if (rho.empty()) {
    // L_0 = -sum f R_p, so the sheet is -sum f V_p expanded into original cells.
    std::vector<std::uint64_t> c(done, 0);
    for (const auto& [p, f] : rho_record) c[p] = F::add(c[p], F::neg(f));
    red.expand(c);
    Integer scale;
    std::vector<Integer> coef = lift<F>(c, scale);
    out.sheet = true;
    out.winding = scale;
    for (std::size_t j = 0; j < done; ++j)
      if (coef[j] != 0 && !is_fence_prism(stack, columns[j])) out.cells.push_back({columns[j], coef[j]});
    return out;
  }

  // No sheet. Fully reduce rho (no entry at a pivot row), densely.
  std::vector<std::uint64_t> dense(layout.rows(), 0);
  std::vector<std::uint32_t> heap;
  for (const auto& e : rho) { dense[F::row(e)] = F::coef(e); heap.push_back(F::row(e)); }
  std::make_heap(heap.begin(), heap.end());
  std::uint32_t top = F::row(rho.back());  // not a pivot row
  while (!heap.empty()) {
    std::pop_heap(heap.begin(), heap.end());
    std::uint32_t r = heap.back();
    heap.pop_back();
    while (!heap.empty() && heap.front() == r) { std::pop_heap(heap.begin(), heap.end()); heap.pop_back(); }
    std::int64_t p = red.pivot_of_row(r);
    if (dense[r] == 0 || p < 0) continue;
    const auto& piv = red.reduced(static_cast<std::size_t>(p));
    std::uint64_t f = F::neg(F::mul(dense[r], F::inv(F::coef(piv.back()))));
    for (const auto& e : piv) {
      std::uint32_t row = F::row(e);
      if (dense[row] == 0 && row != r) { heap.push_back(row); std::push_heap(heap.begin(), heap.end()); }
      dense[row] = F::add(dense[row], F::mul(f, F::coef(e)));
    }
  }
  // φ: 1 at `top`, 0 at other non-pivot rows; at pivot rows, ascending, the value that makes
  // φ vanish on that pivot's reduced column. Then φ vanishes on every column, and
  // φ(L_0) = φ(reduced rho) = dense[top] ≠ 0.
  std::vector<std::uint64_t> phi(layout.rows(), 0);
  phi[top] = 1;
  for (std::uint32_t r = 0; r < layout.rows(); ++r) {
    std::int64_t p = red.pivot_of_row(r);
    if (p < 0) continue;
    const auto& piv = red.reduced(static_cast<std::size_t>(p));
    std::uint64_t s = 0;
    for (std::size_t i = 0; i + 1 < piv.size(); ++i) s = F::add(s, F::mul(phi[F::row(piv[i])], F::coef(piv[i])));
    phi[r] = F::neg(F::mul(s, F::inv(F::coef(piv.back()))));
  }
  Integer scale;
  std::vector<Integer> values = lift<F>(phi, scale);
  out.sheet = false;
  Integer fence_value = 0;
  for (const auto& sr : layout.fence_loop()) fence_value += sr.sign * values[sr.row];
  if constexpr (std::is_same_v<F, FieldZ2>) fence_value = fence_value % 2 == 0 ? 0 : 1;
  out.fence_value = fence_value;
  for (std::uint32_t r = 0; r < layout.rows(); ++r)
    if (values[r] != 0) out.cochain.push_back({layout.cell_of_row(r), values[r]});
  return out;
}

// Exact re-check over the integers (or mod 2) of what the elimination produced.
void verify(const Stack& stack, Ring ring, const SheetOutcome& o) {
  BoundaryLayout layout(stack);
  auto reduce = [&](Integer v) {
    if (ring == Ring::Z2) { v %= 2; if (v < 0) v += 2; }
    return v;
  };
  SignedRow b[4];
  if (o.sheet) {
    std::vector<Integer> bd(layout.rows(), 0);
    for (const auto& cell : o.cells) {
      int nb = layout.boundary(cell.cell, b);
      for (int i = 0; i < nb; ++i) bd[b[i].row] += b[i].sign * cell.coef;
    }
    // Boundary only on the fence cylinder, winding m along every fence edge (schema §4.3).
    const std::size_t m = stack.fence_count;
    std::vector<Integer> winding(m, 0);
    for (std::uint32_t r = 0; r < bd.size(); ++r) {
      if (reduce(bd[r]) == 0) continue;
      OneCell c = layout.cell_of_row(r);
      if (c.kind == OneCell::Vertical) {
        if (c.index >= m) throw std::runtime_error("internal check failed: sheet boundary off the fence");
        continue;
      }
      const Pair& p = stack.frames[c.frame].edges[c.index];
      if (p.second >= m) throw std::runtime_error("internal check failed: sheet boundary off the fence");
      if (p.second == p.first + 1) winding[p.first] += bd[r];
      else if (p.first == 0 && p.second == m - 1) winding[m - 1] -= bd[r];
      else throw std::runtime_error("internal check failed: sheet boundary on a non-fence edge");
    }
    for (const auto& w : winding)
      if (reduce(w - o.winding) != 0 || reduce(w) == 0)
        throw std::runtime_error("internal check failed: sheet does not wind around the fence");
    return;
  }
  std::vector<Integer> phi(layout.rows(), 0);
  for (const auto& cv : o.cochain) {
    std::uint32_t row = cv.cell.kind == OneCell::Edge ? layout.edge_row(cv.cell.frame, cv.cell.index)
                                                     : layout.vertical_row(cv.cell.frame, cv.cell.index);
    phi[row] = cv.value;
  }
  for (const auto& col : layout.columns()) {
    int nb = layout.boundary(col, b);
    Integer s = 0;
    for (int i = 0; i < nb; ++i) s += b[i].sign * phi[b[i].row];
    if (reduce(s) != 0) throw std::runtime_error("internal check failed: cochain is not a cocycle");
  }
  Integer f = 0;
  for (const auto& sr : layout.fence_loop()) f += sr.sign * phi[sr.row];
  if (reduce(f) == 0 || reduce(f) != reduce(o.fence_value))
    throw std::runtime_error("internal check failed: cocycle vanishes on the fence loop");
}

}  // namespace

SheetOutcome solve_sheet(const Stack& stack, Ring ring, const Progress& progress) {
  SheetOutcome o = ring == Ring::Z2 ? solve_in<FieldZ2>(stack, progress)
                                    : solve_in<FieldFp>(stack, progress);
  verify(stack, ring, o);
  return o;
}

}  // namespace sweepcert
