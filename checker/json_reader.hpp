// A small read-only DOM built with nlohmann-json's SAX interface.
//
// Why not nlohmann::json itself: it turns numbers into doubles (we need their raw text, §1.1),
// silently keeps the last of duplicated keys (§1.4 makes them errors), and costs ~50 bytes
// per value, too much for certificates with millions of rows. Here every value is a 12-byte
// node; strings and raw number text live in one shared buffer; container children are
// contiguous in one index array. Object members are stored in order, duplicates included,
// so the validators can report them with their pointer.
#pragma once
#include <cstdint>
#include <string>
#include <string_view>
#include <vector>

namespace sweepcheck::json {

// The limits of schema/README.md §1.5. The count limits are enforced by the validators
// (input.cpp, certificate.cpp) on the sizes of the parsed arrays.
constexpr std::uint64_t kMaxFileBytes = std::uint64_t(1) << 30;  // file size: 1 GiB
constexpr std::size_t kMaxDepth = 64;                             // nesting depth
constexpr std::size_t kMaxTextLength = 1000;                      // strings, keys and numbers
constexpr std::size_t kMaxSensors = 1000000;                      // sensor ids of an input
constexpr std::size_t kMaxFrames = 1000000;                       // frames of a log or certificate
constexpr std::size_t kMaxItems = 100000000;                      // rows and tree tokens of a certificate

enum class Kind : std::uint8_t {
  Null, Boolean,
  Unsigned,  // a JSON integer without sign that fits uint64 (value kept, text rebuilt exactly)
  Signed,    // a JSON integer written with '-' that fits int64
  Float,     // any other JSON number: raw text kept (fraction, exponent, or beyond 64 bits)
  String, Array, Object
};
const char* kind_name(Kind k);

struct Node {
  std::uint32_t a = 0;  // text offset / children offset / low half of an integer
  std::uint32_t b = 0;  // text length / child count   / high half of an integer
  Kind kind = Kind::Null;
};

class Document;

// A handle to one value of a Document. Cheap to copy. Out-of-range access throws
// std::out_of_range; the validators check sizes first, so that is a program bug, not input.
class Ref {
 public:
  Ref(const Document* doc, std::uint32_t index) : doc_(doc), index_(index) {}
  Kind kind() const;
  bool is(Kind k) const { return kind() == k; }
  bool is_number() const { Kind k = kind(); return k == Kind::Unsigned || k == Kind::Signed || k == Kind::Float; }
  std::string_view text() const;        // String: contents; Float: raw number text
  std::uint64_t unsigned_value() const; // Unsigned only
  std::int64_t signed_value() const;    // Signed only
  std::string number_text() const;      // exact text of any number kind
  std::size_t size() const;             // Array: elements; Object: members
  Ref operator[](std::size_t i) const;  // Array element
  std::string_view key(std::size_t i) const;  // Object member key
  Ref value(std::size_t i) const;             // Object member value
  std::uint32_t index() const { return index_; }

 private:
  const Node& node() const;
  const Document* doc_;
  std::uint32_t index_;
};

class Document {
 public:
  Ref root() const { return Ref(this, root_); }

 private:
  friend class Ref;
  friend class Builder;
  friend Document parse(std::string_view bytes, const std::string& label);
  std::vector<Node> nodes_;
  std::vector<std::uint32_t> kids_;  // objects: key node, value node, key node, ...
  std::string text_;
  std::uint32_t root_ = 0;
};

// Reads a whole file, refusing files over kMaxFileBytes: a regular file by its size (stat)
// before reading a byte, anything else (a pipe) as soon as more has been read. Throws
// Unreadable naming `label`.
std::string read_file(const std::string& path, const std::string& label);

// Parses one JSON document (nothing may follow it). Throws Unreadable naming `label` on bad
// JSON (with the line and column of the offending character), a value nested deeper than
// kMaxDepth, or a string, key or number longer than kMaxTextLength.
Document parse(std::string_view bytes, const std::string& label);

// "line L, column C" of the byte at offset `pos` (0-based) of `bytes`; lines are split at
// '\n' and columns count bytes from 1.
std::string line_column(std::string_view bytes, std::size_t pos);

// RFC 6901 escaping of one reference token: '~' -> "~0", '/' -> "~1".
std::string pointer_token(std::string_view key);

// Finds a duplicated key anywhere below `value` (iteratively: no recursion driven by input).
// Returns the pointer of the second occurrence, prefixed by `base`, or "" if there is none.
std::string find_duplicate_key(Ref value, const std::string& base);

}  // namespace sweepcheck::json
