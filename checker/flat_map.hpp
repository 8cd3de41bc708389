// Open-addressing hash map from 64-bit keys to small values. The checks look up millions of
// cells keyed by compact integers (a pair id or vertex index in the high 32 bits, a frame
// index in the low 32 bits); std::unordered_map's node per entry costs several times more.
#pragma once
#include <cstdint>
#include <stdexcept>
#include <string_view>
#include <utility>
#include <vector>

namespace sweepcheck {

inline std::uint64_t pack(std::uint32_t high, std::uint32_t low) { return (std::uint64_t(high) << 32) | low; }

template <class V>
class FlatMap {
 public:
  static constexpr std::uint64_t kEmpty = ~std::uint64_t(0);

  FlatMap() { rehash(16); }
  std::size_t size() const { return size_; }
  // Room for n entries without rehashing.
  void reserve(std::size_t n) {
    std::size_t capacity = slots_.size();
    while (capacity < 2 * n) capacity *= 2;
    if (capacity != slots_.size()) rehash(capacity);
  }

  V* find(std::uint64_t key) {
    Slot& s = slots_[slot(key)];
    return s.key == key ? &s.value : nullptr;
  }
  const V* find(std::uint64_t key) const { return const_cast<FlatMap*>(this)->find(key); }
  bool contains(std::uint64_t key) const { return find(key) != nullptr; }

  // Inserts (key, value) unless key is present. Returns the stored value and whether it was new.
  std::pair<V*, bool> insert(std::uint64_t key, const V& value) {
    if (key == kEmpty) throw std::logic_error("FlatMap: reserved key");
    if (2 * (size_ + 1) > slots_.size()) rehash(2 * slots_.size());
    Slot& s = slots_[slot(key)];
    if (s.key == key) return {&s.value, false};
    s.key = key;
    s.value = value;
    ++size_;
    return {&s.value, true};
  }

  // Visits every entry (in no particular order) as f(key, value).
  template <class F>
  void for_each(F&& f) const {
    for (const Slot& s : slots_)
      if (s.key != kEmpty) f(s.key, s.value);
  }

 private:
  struct Slot {  // key and value side by side: one cache line per probe
    std::uint64_t key = kEmpty;
    V value{};
  };
  static std::uint64_t mix(std::uint64_t x) {  // splitmix64 finaliser
    x ^= x >> 30; x *= 0xbf58476d1ce4e5b9ULL;
    x ^= x >> 27; x *= 0x94d049bb133111ebULL;
    return x ^ (x >> 31);
  }
  // The slot holding key, or the empty slot where it would go (linear probing).
  std::size_t slot(std::uint64_t key) const {
    std::size_t mask = slots_.size() - 1, i = mix(key) & mask;
    while (slots_[i].key != key && slots_[i].key != kEmpty) i = (i + 1) & mask;
    return i;
  }
  void rehash(std::size_t capacity) {
    std::vector<Slot> old(capacity);
    old.swap(slots_);
    size_ = 0;
    for (Slot& s : old)
      if (s.key != kEmpty) {
        slots_[slot(s.key)] = std::move(s);
        ++size_;
      }
  }

  std::vector<Slot> slots_;
  std::size_t size_ = 0;
};

// Compact ids for unordered pairs and triples of vertices (given in canonical order a < b < c).
class PairTable {
 public:
  static constexpr std::uint32_t kNone = ~std::uint32_t(0);
  std::uint32_t find(std::uint32_t a, std::uint32_t b) const {
    const std::uint32_t* id = ids_.find(pack(a, b));
    return id ? *id : kNone;
  }
  std::uint32_t intern(std::uint32_t a, std::uint32_t b) {
    auto [id, fresh] = ids_.insert(pack(a, b), static_cast<std::uint32_t>(ends_.size()));
    if (fresh) ends_.push_back({a, b});
    return *id;
  }
  std::pair<std::uint32_t, std::uint32_t> ends(std::uint32_t id) const { return ends_.at(id); }
  std::size_t size() const { return ends_.size(); }

 private:
  FlatMap<std::uint32_t> ids_;
  std::vector<std::pair<std::uint32_t, std::uint32_t>> ends_;
};

// Distinct strings numbered in order of insertion, by open addressing. The strings are views:
// their bytes must outlive the index. Sensor ids are looked up millions of times, and
// std::unordered_map's hashing, modulo and node per entry cost several times more.
class StringIndex {
 public:
  static constexpr std::uint32_t kNone = ~std::uint32_t(0);
  std::size_t size() const { return strings_.size(); }
  std::string_view at(std::uint32_t n) const { return strings_.at(n); }
  std::uint32_t find(std::string_view s) const { return slots_[slot(s)]; }
  // The number of s, adding it if new; and whether it was new.
  std::pair<std::uint32_t, bool> insert(std::string_view s) {
    if (2 * (strings_.size() + 1) > slots_.size()) {
      slots_.assign(2 * slots_.size(), kNone);
      for (std::uint32_t n = 0; n < strings_.size(); ++n) slots_[slot(strings_[n])] = n;
    }
    std::uint32_t& n = slots_[slot(s)];
    if (n != kNone) return {n, false};
    n = static_cast<std::uint32_t>(strings_.size());
    strings_.push_back(s);
    return {n, true};
  }

 private:
  // The slot holding s, or the empty slot where it would go (FNV-1a, linear probing).
  std::size_t slot(std::string_view s) const {
    std::uint64_t h = 0xcbf29ce484222325ULL;
    for (unsigned char c : s) h = (h ^ c) * 0x100000001b3ULL;
    std::size_t mask = slots_.size() - 1, i = (h ^ (h >> 32)) & mask;
    while (slots_[i] != kNone && strings_[slots_[i]] != s) i = (i + 1) & mask;
    return i;
  }
  std::vector<std::uint32_t> slots_ = std::vector<std::uint32_t>(16, kNone);
  std::vector<std::string_view> strings_;
};

}  // namespace sweepcheck
