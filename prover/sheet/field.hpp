// Coefficient fields for sparse elimination: Z/2 (entries are bare row indices, addition is
// symmetric difference) and the prime field F_p with p = 2^61 - 1 (used to solve over the
// rationals; results are lifted to integers and re-checked exactly before they are trusted).
#pragma once
#include <cstdint>
#include <vector>

namespace sweepcert {

struct FieldZ2 {
  using Entry = std::uint32_t;
  static std::uint32_t row(Entry e) { return e; }
  static std::uint64_t coef(Entry) { return 1; }
  static Entry make(std::uint32_t r, std::uint64_t) { return r; }
  static std::uint64_t from_int(long long v) { return static_cast<std::uint64_t>(v & 1); }
  static std::uint64_t add(std::uint64_t a, std::uint64_t b) { return a ^ b; }
  static std::uint64_t mul(std::uint64_t a, std::uint64_t b) { return a & b; }
  static std::uint64_t neg(std::uint64_t a) { return a; }
  static std::uint64_t inv(std::uint64_t a) { return a; }

  // target <- target + f * source (f = 1), both sorted by row.
  static void axpy(std::vector<Entry>& target, const std::vector<Entry>& source, std::uint64_t,
                   std::vector<Entry>& scratch) {
    scratch.clear();
    scratch.reserve(target.size() + source.size());
    auto a = target.begin(), ae = target.end();
    auto b = source.begin(), be = source.end();
    while (a != ae && b != be) {
      if (*a < *b) scratch.push_back(*a++);
      else if (*b < *a) scratch.push_back(*b++);
      else { ++a; ++b; }
    }
    scratch.insert(scratch.end(), a, ae);
    scratch.insert(scratch.end(), b, be);
    target.swap(scratch);
  }
};

struct FieldFp {
  static constexpr std::uint64_t P = (std::uint64_t(1) << 61) - 1;
  struct Entry {
    std::uint32_t row;
    std::uint64_t c;
  };
  static std::uint32_t row(const Entry& e) { return e.row; }
  static std::uint64_t coef(const Entry& e) { return e.c; }
  static Entry make(std::uint32_t r, std::uint64_t c) { return {r, c}; }
  static std::uint64_t from_int(long long v) {
    long long m = v % static_cast<long long>(P);
    return static_cast<std::uint64_t>(m < 0 ? m + static_cast<long long>(P) : m);
  }
  static std::uint64_t add(std::uint64_t a, std::uint64_t b) {
    std::uint64_t s = a + b;
    return s >= P ? s - P : s;
  }
  static std::uint64_t mul(std::uint64_t a, std::uint64_t b) {
    unsigned __int128 x = static_cast<unsigned __int128>(a) * b;
    std::uint64_t lo = static_cast<std::uint64_t>(x & P), hi = static_cast<std::uint64_t>(x >> 61);
    return add(lo, hi);  // 2^61 = 1 (mod P)
  }
  static std::uint64_t neg(std::uint64_t a) { return a == 0 ? 0 : P - a; }
  static std::uint64_t inv(std::uint64_t a) {
    std::uint64_t result = 1, base = a, e = P - 2;
    while (e) {
      if (e & 1) result = mul(result, base);
      base = mul(base, base);
      e >>= 1;
    }
    return result;
  }

  static void axpy(std::vector<Entry>& target, const std::vector<Entry>& source, std::uint64_t f,
                   std::vector<Entry>& scratch) {
    scratch.clear();
    scratch.reserve(target.size() + source.size());
    auto a = target.begin(), ae = target.end();
    auto b = source.begin(), be = source.end();
    while (a != ae && b != be) {
      if (a->row < b->row) scratch.push_back(*a++);
      else if (b->row < a->row) { scratch.push_back({b->row, mul(f, b->c)}); ++b; }
      else {
        std::uint64_t c = add(a->c, mul(f, b->c));
        if (c != 0) scratch.push_back({a->row, c});
        ++a; ++b;
      }
    }
    scratch.insert(scratch.end(), a, ae);
    for (; b != be; ++b) scratch.push_back({b->row, mul(f, b->c)});
    target.swap(scratch);
  }
};

}  // namespace sweepcert
