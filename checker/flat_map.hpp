// Open-addressing hash map from 64-bit keys to small values. The checks look up millions of
// cells keyed by compact integers (a pair id or vertex index in the high 32 bits, a frame
// index in the low 32 bits); std::unordered_map's node per entry costs several times more.
#pragma once
#include <cstdint>
#include <stdexcept>
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

  V* find(std::uint64_t key) {
    std::size_t i = slot(key);
    return keys_[i] == key ? &values_[i] : nullptr;
  }
  const V* find(std::uint64_t key) const { return const_cast<FlatMap*>(this)->find(key); }
  bool contains(std::uint64_t key) const { return find(key) != nullptr; }

  // Inserts (key, value) unless key is present. Returns the stored value and whether it was new.
  std::pair<V*, bool> insert(std::uint64_t key, const V& value) {
    if (key == kEmpty) throw std::logic_error("FlatMap: reserved key");
    if (2 * (size_ + 1) > keys_.size()) rehash(2 * keys_.size());
    std::size_t i = slot(key);
    if (keys_[i] == key) return {&values_[i], false};
    keys_[i] = key;
    values_[i] = value;
    ++size_;
    return {&values_[i], true};
  }

  // Visits every entry (in no particular order) as f(key, value).
  template <class F>
  void for_each(F&& f) const {
    for (std::size_t i = 0; i < keys_.size(); ++i)
      if (keys_[i] != kEmpty) f(keys_[i], values_[i]);
  }

 private:
  static std::uint64_t mix(std::uint64_t x) {  // splitmix64 finaliser
    x ^= x >> 30; x *= 0xbf58476d1ce4e5b9ULL;
    x ^= x >> 27; x *= 0x94d049bb133111ebULL;
    return x ^ (x >> 31);
  }
  // The slot holding key, or the empty slot where it would go (linear probing).
  std::size_t slot(std::uint64_t key) const {
    std::size_t mask = keys_.size() - 1, i = mix(key) & mask;
    while (keys_[i] != key && keys_[i] != kEmpty) i = (i + 1) & mask;
    return i;
  }
  void rehash(std::size_t capacity) {
    std::vector<std::uint64_t> old_keys(capacity, kEmpty);
    std::vector<V> old_values(capacity);
    old_keys.swap(keys_);
    old_values.swap(values_);
    size_ = 0;
    for (std::size_t i = 0; i < old_keys.size(); ++i)
      if (old_keys[i] != kEmpty) {
        std::size_t j = slot(old_keys[i]);
        keys_[j] = old_keys[i];
        values_[j] = std::move(old_values[i]);
        ++size_;
      }
  }

  std::vector<std::uint64_t> keys_;
  std::vector<V> values_;
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

}  // namespace sweepcheck
