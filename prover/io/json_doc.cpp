#include "io/json_doc.hpp"

#include <algorithm>
#include <nlohmann/json.hpp>
#include <unordered_set>

namespace sweepcert {
namespace {

constexpr std::size_t kMaxDepth = 64;
constexpr std::size_t kMaxText = 1000;

// `pos` counts the characters nlohmann read, the offending one included (one past the end at
// end of input): the offending character is at offset pos - 1.
std::string line_column(const std::string& bytes, std::size_t pos) {
  const std::size_t offset = std::min(pos == 0 ? 0 : pos - 1, bytes.size());
  std::size_t line = 1, col = 1;
  for (std::size_t i = 0; i < offset; ++i) {
    if (bytes[i] == '\n') { ++line; col = 1; } else { ++col; }
  }
  return "line " + std::to_string(line) + ", column " + std::to_string(col);
}

void escape_token(std::string& out, std::string_view token) {
  for (char c : token) {
    if (c == '~') out += "~0";
    else if (c == '/') out += "~1";
    else out += c;
  }
}

}  // namespace

// SAX handler that appends nodes to the document as they arrive.
class JsonBuilder {
 public:
  using json = nlohmann::json;
  JsonBuilder(JsonDoc& doc, const std::string& bytes) : doc_(doc), bytes_(bytes) {}

  bool null() { return leaf(JKind::Null); }
  bool boolean(bool b) { return leaf(JKind::Bool) && (doc_.nodes_.back().boolean = b, true); }
  bool number_integer(json::number_integer_t v) { return number(std::to_string(v)); }
  bool number_unsigned(json::number_unsigned_t v) { return number(std::to_string(v)); }
  bool number_float(json::number_float_t, const std::string& raw) { return number(raw); }
  bool string(std::string& s) {
    if (s.size() > kMaxText) return error(too_long("a string", s.size()));
    if (!leaf(JKind::String)) return false;
    set_text(doc_.nodes_.back(), s);
    return true;
  }
  bool binary(json::binary_t&) { return error("binary values are not JSON"); }
  bool start_object(std::size_t) { return open(JKind::Object); }
  bool end_object() { return close(); }
  bool start_array(std::size_t) { return open(JKind::Array); }
  bool end_array() { return close(); }
  bool key(std::string& k) {
    if (k.size() > kMaxText) return error(too_long("a key", k.size()));
    auto& keys = keys_.back();
    if (!keys.insert(k).second) return error("duplicate key \"" + k + "\"");
    pending_key_ = k;
    level_key_.back() = k;
    return true;
  }
  bool parse_error(std::size_t pos, const std::string& last_token, const nlohmann::detail::exception& ex) {
    where_ = line_column(bytes_, pos);
    // A token over the length limit is refused for that (nlohmann fails on a long integer as
    // an overflow), and never quoted whole.
    if (last_token.size() > kMaxText) {
      what_ = too_long("a token", last_token.size());
      return false;
    }
    std::string what = ex.what();
    if (auto p = what.find("syntax error"); p != std::string::npos) what = what.substr(p);
    else if (auto q = what.find("] "); what.rfind("[json.exception.", 0) == 0 && q != std::string::npos)
      what = what.substr(q + 2);
    if (what.size() > 2 * kMaxText) what = what.substr(0, 2 * kMaxText) + "...";
    what_ = "malformed JSON: " + what;
    return false;
  }

  std::string where_, what_;

 private:
  static std::string too_long(const char* what, std::size_t length) {
    return std::string(what) + " of " + std::to_string(length) + " characters exceeds the length limit of " +
           std::to_string(kMaxText) + " (schema §1.5)";
  }
  bool error(std::string what) {
    where_ = current_pointer();
    what_ = std::move(what);
    return false;
  }
  // The JSON pointer of the value being read, from the open containers.
  std::string current_pointer() const {
    std::string out;
    for (std::size_t level = 0; level < open_.size(); ++level) {
      const JNode& n = doc_.nodes_[open_[level]];
      out += '/';
      // An open container below this level is already its last child; the value being read
      // at the innermost level is not yet a child.
      if (n.kind == JKind::Object) escape_token(out, level_key_[level]);
      else out += std::to_string(level + 1 < open_.size() ? n.count - 1 : n.count);
    }
    return out.empty() ? "/" : out;
  }
  void set_text(JNode& n, std::string_view s) {
    n.text = static_cast<std::uint32_t>(doc_.arena_.size());
    n.text_len = static_cast<std::uint32_t>(s.size());
    doc_.arena_.append(s);
  }
  bool number(const std::string& raw) {
    if (raw.size() > kMaxText) return error(too_long("a number", raw.size()));
    if (!leaf(JKind::Number)) return false;
    set_text(doc_.nodes_.back(), raw);
    return true;
  }
  bool leaf(JKind kind) {
    if (doc_.nodes_.size() >= UINT32_MAX - 1) return error("too many JSON values");
    std::uint32_t id = static_cast<std::uint32_t>(doc_.nodes_.size());
    doc_.nodes_.push_back(JNode{});
    doc_.nodes_.back().kind = kind;
    if (!open_.empty()) {
      std::uint32_t parent = open_.back();
      JNode& p = doc_.nodes_[parent];
      if (p.kind == JKind::Object) {
        JNode& n = doc_.nodes_.back();
        n.key = static_cast<std::uint32_t>(doc_.arena_.size());
        n.key_len = static_cast<std::uint32_t>(pending_key_.size());
        doc_.arena_.append(pending_key_);
      }
      if (last_child_.back() == UINT32_MAX) doc_.nodes_[parent].first = id;
      else doc_.nodes_[last_child_.back()].next = id;
      last_child_.back() = id;
      ++doc_.nodes_[parent].count;
    }
    return true;
  }
  bool open(JKind kind) {
    if (open_.size() >= kMaxDepth)
      return error("nesting deeper than the depth limit of " + std::to_string(kMaxDepth) + " levels (schema §1.5)");
    if (!leaf(kind)) return false;
    open_.push_back(static_cast<std::uint32_t>(doc_.nodes_.size() - 1));
    last_child_.push_back(UINT32_MAX);
    level_key_.emplace_back();
    if (kind == JKind::Object) keys_.emplace_back();
    return true;
  }
  bool close() {
    if (doc_.nodes_[open_.back()].kind == JKind::Object) keys_.pop_back();
    open_.pop_back();
    last_child_.pop_back();
    level_key_.pop_back();
    return true;
  }

  JsonDoc& doc_;
  const std::string& bytes_;
  std::vector<std::uint32_t> open_, last_child_;
  std::vector<std::unordered_set<std::string>> keys_;
  std::vector<std::string> level_key_;
  std::string pending_key_;
};

JsonDoc JsonDoc::parse(const std::string& bytes) {
  JsonDoc doc;
  doc.nodes_.reserve(bytes.size() / 8 + 16);
  JsonBuilder builder(doc, bytes);
  bool ok = nlohmann::json::sax_parse(bytes, &builder, nlohmann::json::input_format_t::json,
                                      /*strict=*/true);
  if (!ok || doc.nodes_.empty()) {
    throw InputError(builder.where_.empty() ? "line 1, column 1" : builder.where_,
                     builder.what_.empty() ? "malformed JSON" : builder.what_);
  }
  return doc;
}

std::string Ref::pointer() const {
  std::vector<const Ref*> chain;
  for (const Ref* r = this; r->parent_; r = r->parent_) chain.push_back(r);
  std::string out;
  for (auto it = chain.rbegin(); it != chain.rend(); ++it) {
    const Ref* r = *it;
    out += '/';
    if (r->parent_->kind() == JKind::Object) escape_token(out, doc_->key(r->id_));
    else out += std::to_string(r->index_);
  }
  return out.empty() ? "/" : out;
}

void Ref::fail(const std::string& what) const { throw InputError(pointer(), what); }

void Ref::expect_object(std::initializer_list<const char*> allowed,
                        std::initializer_list<const char*> required) const {
  if (kind() != JKind::Object) fail("expected an object");
  for_each([&](const Ref& m) {
    std::string_view k = doc_->key(m.id_);
    bool known = std::any_of(allowed.begin(), allowed.end(),
                             [&](const char* a) { return k == a; });
    if (!known) m.fail("unknown key \"" + std::string(k) + "\"");
  });
  for (const char* r : required)
    if (!find(r)) fail(std::string("missing key \"") + r + "\"");
}

std::optional<Ref> Ref::find(const char* key) const {
  if (kind() != JKind::Object) return std::nullopt;
  std::size_t index = 0;
  for (std::uint32_t c = doc_->node(id_).first; c != UINT32_MAX; c = doc_->node(c).next, ++index)
    if (doc_->key(c) == key) return Ref(*this, c, index);
  return std::nullopt;
}

Ref Ref::at(const char* key) const {
  auto r = find(key);
  if (!r) fail(std::string("missing key \"") + key + "\"");
  return *r;
}

std::size_t Ref::expect_array(std::size_t min_items, std::size_t max_items) const {
  if (kind() != JKind::Array) fail("expected an array");
  std::size_t n = doc_->node(id_).count;
  if (n < min_items || n > max_items) {
    if (min_items == max_items) fail("expected exactly " + std::to_string(min_items) + " items");
    if (n < min_items) fail("expected at least " + std::to_string(min_items) + " items");
    fail("expected at most " + std::to_string(max_items) + " items");
  }
  return n;
}

Ref Ref::item(std::size_t i) const {
  std::size_t index = 0;
  for (std::uint32_t c = doc_->node(id_).first; c != UINT32_MAX; c = doc_->node(c).next, ++index)
    if (index == i) return Ref(*this, c, index);
  fail("missing item " + std::to_string(i));
}

std::string_view Ref::string() const {
  if (kind() != JKind::String) fail("expected a string");
  return doc_->text(id_);
}

std::string Ref::id() const {
  if (kind() != JKind::String) fail("expected a sensor id (a string)");
  std::string_view s = doc_->text(id_);
  if (s.empty()) fail("empty sensor id");
  if (s.size() > 64) fail("sensor id longer than 64 bytes");
  return std::string(s);
}

Rational Ref::number() const {
  if (kind() != JKind::Number && kind() != JKind::String)
    fail("expected an exact number (e.g. \"12.75\", \"-3e-2\" or \"7/3\")");
  std::string why;
  auto q = parse_exact(doc_->text(id_), &why);
  if (!q) fail("malformed number \"" + std::string(doc_->text(id_)) + "\": " + why);
  return *q;
}

}  // namespace sweepcert
