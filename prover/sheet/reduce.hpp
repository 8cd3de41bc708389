// Sparse column elimination of the boundary matrix, with a record of every column operation.
//
// Standard reduction: a column's pivot is its largest row; a new column is reduced against the
// pivots of earlier columns until its pivot is new or it vanishes. The record (which earlier
// reduced columns were added, with which factor) is kept for pivot columns only, so that any
// combination of reduced columns can be expanded back into original 2-cells.
#pragma once
#include <cstdint>
#include <utility>
#include <vector>

namespace sweepcert {

template <class F>
class Reduction {
 public:
  using Entry = typename F::Entry;
  using Column = std::vector<Entry>;

  explicit Reduction(std::uint32_t rows) : pivot_of_row_(rows, -1) {}

  // Adds the next column (entries sorted by row) and reduces it.
  void add(Column col) {
    auto j = static_cast<std::uint32_t>(reduced_.size());
    std::size_t mark = record_.size();
    record_start_.push_back(mark);
    eliminate(col, record_);
    if (col.empty()) {
      record_.resize(mark);  // a vanished column is never used again
    } else {
      pivot_of_row_[F::row(col.back())] = static_cast<std::int64_t>(j);
      ++pivots_;
    }
    entries_ += col.size();
    reduced_.push_back(std::move(col));
    record_end_.push_back(record_.size());
  }

  // Reduces `col` against the current pivots, appending (column, factor) to `record`.
  void eliminate(Column& col, std::vector<std::pair<std::uint32_t, std::uint64_t>>& record) {
    while (!col.empty()) {
      std::int64_t p = pivot_of_row_[F::row(col.back())];
      if (p < 0) break;
      const Column& piv = reduced_[static_cast<std::size_t>(p)];
      std::uint64_t f = F::neg(F::mul(F::coef(col.back()), F::inv(F::coef(piv.back()))));
      F::axpy(col, piv, f, scratch_);
      record.emplace_back(static_cast<std::uint32_t>(p), f);
      ++additions_;
    }
  }

  // Expands sum_j c[j] * (reduced column j) into original columns: afterwards c[j] is the
  // coefficient of original column j. Uses R_j = D_j + sum f * R_i over j's record.
  void expand(std::vector<std::uint64_t>& c) const {
    for (std::size_t j = reduced_.size(); j-- > 0;) {
      if (c[j] == 0) continue;
      for (std::size_t r = record_start_[j]; r < record_end_[j]; ++r)
        c[record_[r].first] = F::add(c[record_[r].first], F::mul(c[j], record_[r].second));
    }
  }

  std::int64_t pivot_of_row(std::uint32_t row) const { return pivot_of_row_[row]; }
  const Column& reduced(std::size_t j) const { return reduced_[j]; }
  std::size_t columns() const { return reduced_.size(); }
  std::uint64_t additions() const { return additions_; }
  std::uint64_t entries() const { return entries_; }
  std::uint64_t pivots() const { return pivots_; }
  std::size_t record_size() const { return record_.size(); }

 private:
  std::vector<Column> reduced_;
  std::vector<std::int64_t> pivot_of_row_;
  std::vector<std::pair<std::uint32_t, std::uint64_t>> record_;
  std::vector<std::size_t> record_start_, record_end_;
  Column scratch_;
  std::uint64_t additions_ = 0, entries_ = 0, pivots_ = 0;
};

}  // namespace sweepcert
