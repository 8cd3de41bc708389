// Reading and fully validating the input the certificate speaks about (schema/README.md §2):
// a positional scenario or a contact log. Any violation is Unreadable (exit 2) naming the JSON
// pointer and the rule.
#pragma once
#include <algorithm>
#include <array>
#include <cstdint>
#include <memory>
#include <string>
#include <string_view>
#include <vector>

#include "flat_map.hpp"
#include "geometry.hpp"
#include "json_reader.hpp"

namespace sweepcheck {

enum class InputKind { Scenario, ContactLog };

// A sensor of a positional scenario. Fence sensors have one track row (their `at`).
struct Sensor {
  Rat radius;
  std::vector<Rat> times;
  std::vector<Point> points;
};

struct Input {
  InputKind kind = InputKind::Scenario;
  std::string format;  // the input's `format` string
  std::string title;   // the optional `title` ("" when absent)

  // Vertices. A vertex's index is the rank of its id in byte-wise order (§1.3), so comparing
  // indices compares ids, and the canonical orientation (§3.2) is increasing index order.
  std::vector<std::string> names;
  StringIndex index;                                           // views into `names`
  std::vector<std::uint32_t> fence;                            // listed cyclic order
  std::vector<bool> is_fence;

  // Positional scenario (§2.1), indexed by vertex.
  Rat horizon_start, horizon_end;
  std::vector<Sensor> sensors;

  // Contact log (§2.2).
  bool listed = true;  // "triangles": "listed"; otherwise from-pairs
  std::vector<Rat> times;
  PairTable pairs;                          // every pair named anywhere in the log
  std::vector<std::uint32_t> frame_pairs;   // pair ids, frame by frame
  std::vector<std::size_t> pairs_begin;     // frame f's pairs: [pairs_begin[f], pairs_begin[f+1])
  std::vector<std::uint32_t> pair_frames;   // frames of each pair id, increasing
  std::vector<std::size_t> pair_slots;      // ... and where it is listed there (index in frame_pairs)
  std::vector<std::size_t> pair_frames_begin;
  std::vector<std::array<std::uint32_t, 3>> triples;  // listed triples, canonical
  FlatMap<std::uint32_t> triple_ids;        // pack(pair id of (a, b), c) -> triple id
  std::vector<std::uint32_t> frame_triples;
  std::vector<std::size_t> triples_begin;
  std::vector<std::uint32_t> triple_frames;
  std::vector<std::size_t> triple_slots;
  std::vector<std::size_t> triple_frames_begin;

  // Where pair (triple) id is listed in log frame f: its index in frame_pairs (frame_triples),
  // which orders the listings frame by frame in log order; kAbsent if it is not listed there.
  static constexpr std::size_t kAbsent = ~std::size_t(0);
  std::size_t pair_slot(std::uint32_t pair, std::size_t f) const {
    return slot_in(pair_frames, pair_slots, pair_frames_begin, pair, f);
  }
  std::size_t triple_slot(std::uint32_t triple, std::size_t f) const {
    return slot_in(triple_frames, triple_slots, triple_frames_begin, triple, f);
  }
  bool pair_listed(std::uint32_t pair, std::size_t f) const { return pair_slot(pair, f) != kAbsent; }

  Input() = default;
  Input(const Input&) = delete;  // `index` views into `names`
  Input& operator=(const Input&) = delete;

  // The vertex named `id`, or -1.
  std::int64_t find(std::string_view id) const {
    std::uint32_t v = index.find(id);
    return v == StringIndex::kNone ? -1 : std::int64_t(v);
  }
  std::size_t vertex_count() const { return names.size(); }

 private:
  // Binary search for frame f in the id's increasing frame list.
  static std::size_t slot_in(const std::vector<std::uint32_t>& frames, const std::vector<std::size_t>& slots,
                             const std::vector<std::size_t>& begin, std::uint32_t id, std::size_t f) {
    if (std::size_t(id) + 1 >= begin.size()) return kAbsent;
    auto first = frames.begin() + static_cast<std::ptrdiff_t>(begin[id]);
    auto last = frames.begin() + static_cast<std::ptrdiff_t>(begin[id + 1]);
    auto it = std::lower_bound(first, last, f);
    return it != last && *it == f ? slots[static_cast<std::size_t>(it - frames.begin())] : kAbsent;
  }
};

// Positional scenario: the first i (in listed order) whose fence disk and that of fence sensor
// i + 1 (cyclically) share no point, |c_i - c_{i+1}|^2 > (r_i + r_{i+1})^2; or -1 when every two
// consecutive fence disks meet (the rule of §2.1, also applied to the radii adjusted by a
// certificate's margin, §4.1.1).
std::int64_t first_fence_gap(const Input& in);

// Validates `doc` as a scenario or contact log. Throws Unreadable("INPUT <pointer>: ...").
std::unique_ptr<Input> load_input(const json::Document& doc);

}  // namespace sweepcheck
