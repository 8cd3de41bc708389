// Internals of the mutation-campaign reference (reference.hpp): exact numbers, the parsed
// input, and the stack complex on a certificate's frames. Every function refuses by throwing
// Refuse with the item and the rule.
#pragma once
#include <array>
#include <cstddef>
#include <map>
#include <set>
#include <string>
#include <utility>
#include <vector>

#include <gmpxx.h>
#include <nlohmann/json.hpp>

namespace mutref {

using json = nlohmann::json;
using Q = mpq_class;
using Z = mpz_class;

struct Refuse {
  std::string why;
};
[[noreturn]] inline void refuse(const std::string& why) { throw Refuse{why}; }

// A JSON number that is not an integer keeps its raw text: it becomes the string kRawMark + text
// (so it is never mistaken for an integer string of §1.2, which must be a JSON string).
constexpr char kRawMark = '\x01';
// Parses JSON; duplicated keys and bad JSON are refused.
json parse_raw(const std::string& text);

Q rational(const json& v, const std::string& where);         // §1.1
Z integer_text(const json& v, const std::string& where);      // §1.2 integer string
long frame_index(const json& v, const std::string& where);    // JSON integer >= 0
std::string id_text(const json& v, const std::string& where); // a sensor id (string)
std::string text_of(const Q& q);
// Refuses unless `obj` is an object whose keys are exactly `required` plus any of `optional`.
void keys_exactly(const json& obj, const std::set<std::string>& required, const std::set<std::string>& optional,
                  const std::string& where);

struct Point {
  Q x, y;
};
inline Q dist2(const Point& a, const Point& b) {
  Q dx = a.x - b.x, dy = a.y - b.y;
  return dx * dx + dy * dy;
}

// The input of §2. Vertices are numbered in byte-wise id order, so a < b as numbers is the
// canonical orientation of §3.2.
struct Input {
  std::string format, sha256;
  std::vector<std::string> ids;
  std::map<std::string, int> index;
  std::vector<int> fence;  // vertex numbers in listed cyclic order
  std::vector<Point> polygon;  // positional: the fence centres in that order (P of §2.1)
  bool positional = false;
  // Positional (§2.1).
  Q h0, h1;
  std::vector<Q> radius;                          // by vertex
  std::vector<std::vector<std::array<Q, 3>>> track;  // by vertex; a fence sensor has one row
  // Contact log (§2.2).
  bool from_pairs = false;
  std::vector<Q> log_t;
  std::vector<std::set<std::pair<int, int>>> log_pairs;         // a < b
  std::vector<std::set<std::array<int, 3>>> log_triples;       // sorted

  Point centre(int v, const Q& t) const;
  std::vector<Q> waypoint_times(int v) const;
  bool is_fence(int v) const;
};
const Input& input_for(const std::string& text);  // cached by text

// Exact predicates on positional inputs.
bool pair_present(const Input& in, int a, int b, const Q& t);
bool triple_present(const Input& in, int a, int b, int c, const Q& t);  // some point in all three disks

// The stack complex of §3.1 on the frames of one certificate; 1-cells have dense slots.
struct Stack {
  const Input* in = nullptr;
  std::vector<Q> t;
  std::size_t log_start = 0;
  int V = 0;
  std::vector<std::vector<char>> edge;                    // [k][a*V+b], a < b
  std::vector<std::vector<std::array<int, 3>>> triangles; // [k], sorted triples (on request)
  bool has_triangles = false;

  std::size_t frames() const { return t.size(); }
  std::size_t edge_slot(std::size_t k, int a, int b) const { return (k * V + a) * V + b; }
  std::size_t vertical_slot(int v, std::size_t k) const { return frames() * V * V + static_cast<std::size_t>(v) * frames() + k; }
  std::size_t slots() const { return frames() * V * V + static_cast<std::size_t>(V) * frames(); }
  bool edge_at(std::size_t k, int a, int b) const { return a != b && edge[k][a < b ? a * V + b : b * V + a]; }
};
// Reads and validates `frames` (§4.1, §4.2) and builds the stack (cached by input and frames).
const Stack& stack_for(const Input& in, const json& frames, bool need_triangles);

// The per-method rules of §4.3 to §4.6 (common fields already checked).
void verify_sheet(const Input& in, const json& cert, bool z2);
void verify_cocycle(const Input& in, const json& cert, bool z2);
void verify_chambers(const Input& in, const json& cert);
void verify_route(const Input& in, const json& cert, int samples);

// Point strictly inside / on the boundary of the fence polygon P.
enum class Where { inside, boundary, outside };
Where locate(const Input& in, const Point& p);

}  // namespace mutref
