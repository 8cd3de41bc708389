// A compact read-only JSON document that keeps the raw text of every number.
//
// Inputs must be read exactly (schema §1.1), so numbers are never converted to double: the
// SAX parser of nlohmann-json hands us their raw text. Nodes live in one flat array and all text
// in one arena, so a 1-million-pair contact log costs tens of megabytes, not hundreds.
// `Ref` walks the document while remembering its path, so every error names its JSON pointer.
#pragma once
#include <cstdint>
#include <initializer_list>
#include <optional>
#include <string>
#include <string_view>
#include <vector>

#include "exact/number.hpp"
#include "io/input_error.hpp"

namespace sweepcert {

enum class JKind : std::uint8_t { Null, Bool, Number, String, Array, Object };

struct JNode {
  JKind kind = JKind::Null;
  bool boolean = false;
  std::uint32_t first = UINT32_MAX;  // first child (arrays, objects)
  std::uint32_t next = UINT32_MAX;   // next sibling
  std::uint32_t count = 0;           // number of children
  std::uint32_t text = 0, text_len = 0;  // string value or raw number text
  std::uint32_t key = 0, key_len = 0;    // member key, when the parent is an object
};

class JsonDoc {
 public:
  // Parses bytes; throws InputError (where = "line L, column C") on malformed JSON, duplicate
  // keys, nesting deeper than 64 or strings/numbers longer than 1000 characters.
  static JsonDoc parse(const std::string& bytes);

  const JNode& node(std::uint32_t i) const { return nodes_[i]; }
  std::string_view text(std::uint32_t i) const {
    return {arena_.data() + nodes_[i].text, nodes_[i].text_len};
  }
  std::string_view key(std::uint32_t i) const {
    return {arena_.data() + nodes_[i].key, nodes_[i].key_len};
  }

 private:
  friend class JsonBuilder;
  std::vector<JNode> nodes_;
  std::string arena_;
};

// A node plus the path that led to it. Paths are rendered only when an error is raised.
class Ref {
 public:
  Ref(const JsonDoc& doc) : doc_(&doc), id_(0) {}  // the root

  JKind kind() const { return doc_->node(id_).kind; }
  std::string pointer() const;
  [[noreturn]] void fail(const std::string& what) const;

  // Object access. `expect_object` checks that only `allowed` keys occur and `required` do.
  void expect_object(std::initializer_list<const char*> allowed,
                     std::initializer_list<const char*> required) const;
  std::optional<Ref> find(const char* key) const;
  Ref at(const char* key) const;  // a required member

  // Array access.
  std::size_t expect_array(std::size_t min_items, std::size_t max_items = SIZE_MAX) const;
  template <class F> void for_each(F&& f) const {
    std::size_t index = 0;
    for (std::uint32_t c = doc_->node(id_).first; c != UINT32_MAX; c = doc_->node(c).next)
      f(Ref(*this, c, index++));
  }
  Ref item(std::size_t i) const;

  // Leaves.
  std::string_view string() const;      // a JSON string
  std::string id() const;               // a sensor id: non-empty string of at most 64 bytes
  Rational number() const;              // schema §1.1: JSON number or string

 private:
  Ref(const Ref& parent, std::uint32_t id, std::size_t index)
      : doc_(parent.doc_), id_(id), parent_(&parent), index_(index) {}
  const JsonDoc* doc_;
  std::uint32_t id_;
  const Ref* parent_ = nullptr;
  std::size_t index_ = 0;
};

}  // namespace sweepcert
