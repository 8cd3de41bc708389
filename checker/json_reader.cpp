#include "json_reader.hpp"

#include <sys/stat.h>

#include <algorithm>
#include <fstream>
#include <limits>
#include <nlohmann/json.hpp>
#include <stdexcept>
#include <unordered_set>

#include "errors.hpp"

namespace sweepcheck::json {

const char* kind_name(Kind k) {
  switch (k) {
    case Kind::Null: return "null";
    case Kind::Boolean: return "boolean";
    case Kind::Unsigned:
    case Kind::Signed:
    case Kind::Float: return "number";
    case Kind::String: return "string";
    case Kind::Array: return "array";
    case Kind::Object: return "object";
  }
  return "?";
}

const Node& Ref::node() const { return doc_->nodes_.at(index_); }
Kind Ref::kind() const { return node().kind; }

std::string_view Ref::text() const {
  const Node& n = node();
  if (n.kind != Kind::String && n.kind != Kind::Float) throw std::logic_error("Ref::text on non-text");
  return std::string_view(doc_->text_).substr(n.a, n.b);
}

std::uint64_t Ref::unsigned_value() const {
  const Node& n = node();
  if (n.kind != Kind::Unsigned) throw std::logic_error("Ref::unsigned_value");
  return (std::uint64_t(n.b) << 32) | n.a;
}

std::int64_t Ref::signed_value() const {
  const Node& n = node();
  if (n.kind != Kind::Signed) throw std::logic_error("Ref::signed_value");
  return static_cast<std::int64_t>((std::uint64_t(n.b) << 32) | n.a);
}

std::string Ref::number_text() const {
  switch (kind()) {
    case Kind::Unsigned: return std::to_string(unsigned_value());
    case Kind::Signed: return std::to_string(signed_value());
    case Kind::Float: return std::string(text());
    default: throw std::logic_error("Ref::number_text on non-number");
  }
}

std::size_t Ref::size() const {
  const Node& n = node();
  if (n.kind != Kind::Array && n.kind != Kind::Object) throw std::logic_error("Ref::size");
  return n.b;
}

Ref Ref::operator[](std::size_t i) const {
  const Node& n = node();
  if (n.kind != Kind::Array || i >= n.b) throw std::out_of_range("Ref::operator[]");
  return Ref(doc_, doc_->kids_[n.a + i]);
}

std::string_view Ref::key(std::size_t i) const {
  const Node& n = node();
  if (n.kind != Kind::Object || i >= n.b) throw std::out_of_range("Ref::key");
  return Ref(doc_, doc_->kids_[n.a + 2 * i]).text();
}

Ref Ref::value(std::size_t i) const {
  const Node& n = node();
  if (n.kind != Kind::Object || i >= n.b) throw std::out_of_range("Ref::value");
  return Ref(doc_, doc_->kids_[n.a + 2 * i + 1]);
}

// SAX handler. Containers are closed by moving their pending children (a stack shared by all
// open containers) into the document's contiguous child array, so a container's node comes
// after its children and the root is the last node made.
class Builder {
 public:
  using number_integer_t = nlohmann::json::number_integer_t;
  using number_unsigned_t = nlohmann::json::number_unsigned_t;
  using number_float_t = nlohmann::json::number_float_t;
  using string_t = nlohmann::json::string_t;
  using binary_t = nlohmann::json::binary_t;

  explicit Builder(Document& doc) : doc_(doc) {}
  std::string error;

  bool null() { return scalar(Node{0, 0, Kind::Null}); }
  bool boolean(bool v) { return scalar(Node{v ? 1u : 0u, 0, Kind::Boolean}); }
  bool number_integer(number_integer_t v) { return integer(static_cast<std::uint64_t>(v), Kind::Signed); }
  bool number_unsigned(number_unsigned_t v) { return integer(v, Kind::Unsigned); }
  bool number_float(number_float_t, const string_t& raw) {
    if (raw.size() > kMaxTextLength) return fail(too_long("number", raw.size()));
    return text_node(raw, Kind::Float, false);
  }
  bool string(string_t& s) {
    if (s.size() > kMaxTextLength) return fail(too_long("string", s.size()));
    return text_node(s, Kind::String, false);
  }
  bool key(string_t& s) {
    if (s.size() > kMaxTextLength) return fail(too_long("key", s.size()));
    return text_node(s, Kind::String, true);
  }
  bool binary(binary_t&) { return fail("binary values are not JSON"); }
  bool start_object(std::size_t) { return open(); }
  bool start_array(std::size_t) { return open(); }
  bool end_object() { return close(Kind::Object); }
  bool end_array() { return close(Kind::Array); }
  bool parse_error(std::size_t position, const std::string& last_token, const nlohmann::detail::exception& ex) {
    // nlohmann counts the characters read, the offending one included.
    error_offset = position == 0 ? 0 : position - 1;
    // A token over the length limit is refused for that (nlohmann fails on a long integer as
    // an overflow), and never quoted whole.
    if (last_token.size() > kMaxTextLength) return fail(too_long("token", last_token.size()));
    // nlohmann's message starts with its own prefix and position, which we replace by ours.
    std::string what = ex.what();
    const std::size_t cut = what.find(": ");
    if (what.rfind("[json.exception.", 0) == 0 && cut != std::string::npos) what = what.substr(cut + 2);
    if (what.size() > 2 * kMaxTextLength) what = what.substr(0, 2 * kMaxTextLength) + "...";
    return fail("bad JSON: " + what);
  }
  std::size_t error_offset = std::string::npos;  // set for syntax errors only

 private:
  static std::string too_long(const char* what, std::size_t length) {
    return std::string(what) + " of " + std::to_string(length) + " characters exceeds the length limit of " +
           std::to_string(kMaxTextLength) + " (§1.5)";
  }
  bool fail(std::string why) {
    if (error.empty()) error = std::move(why);
    return false;
  }
  std::uint32_t add(const Node& n) {
    // Counts are bounded by the 1 GiB file limit; the check keeps 32-bit indices honest anyway.
    if (doc_.nodes_.size() >= std::numeric_limits<std::uint32_t>::max() - 1) throw std::length_error("too many JSON values");
    doc_.nodes_.push_back(n);
    return static_cast<std::uint32_t>(doc_.nodes_.size() - 1);
  }
  bool place(std::uint32_t index) {
    if (depth_.empty()) doc_.root_ = index; else pending_.push_back(index);
    return true;
  }
  bool scalar(const Node& n) { return place(add(n)); }
  bool integer(std::uint64_t v, Kind k) {
    return scalar(Node{static_cast<std::uint32_t>(v), static_cast<std::uint32_t>(v >> 32), k});
  }
  bool text_node(const std::string& s, Kind k, bool is_key) {
    if (doc_.text_.size() + s.size() >= std::numeric_limits<std::uint32_t>::max()) throw std::length_error("too much text");
    Node n{static_cast<std::uint32_t>(doc_.text_.size()), static_cast<std::uint32_t>(s.size()), k};
    doc_.text_ += s;
    std::uint32_t index = add(n);
    if (is_key) { pending_.push_back(index); return true; }
    return place(index);
  }
  bool open() {
    if (depth_.size() >= kMaxDepth)
      return fail("nested deeper than the depth limit of " + std::to_string(kMaxDepth) + " (§1.5)");
    depth_.push_back(pending_.size());
    return true;
  }
  bool close(Kind k) {
    std::size_t start = depth_.back();
    depth_.pop_back();
    std::size_t count = pending_.size() - start;
    Node n{static_cast<std::uint32_t>(doc_.kids_.size()),
           static_cast<std::uint32_t>(k == Kind::Object ? count / 2 : count), k};
    doc_.kids_.insert(doc_.kids_.end(), pending_.begin() + static_cast<std::ptrdiff_t>(start), pending_.end());
    pending_.resize(start);
    return place(add(n));
  }

  Document& doc_;
  std::vector<std::uint32_t> pending_;
  std::vector<std::size_t> depth_;  // start of each open container's children in pending_
};

std::string read_file(const std::string& path, const std::string& label) {
  const std::string name = label + " " + path;
  auto too_large = [&](const std::string& size) {
    return Unreadable(name + ": file of " + size + " bytes exceeds the file size limit of 1 GiB (" +
                      std::to_string(kMaxFileBytes) + " bytes, §1.5)");
  };
  // A regular file's size decides before anything is read (a sparse 2 GiB file costs nothing).
  struct stat st {};
  const bool regular = ::stat(path.c_str(), &st) == 0 && S_ISREG(st.st_mode);
  if (regular && std::uint64_t(st.st_size) > kMaxFileBytes) throw too_large(std::to_string(st.st_size));
  std::ifstream in(path, std::ios::binary);
  if (!in) throw Unreadable(name + ": cannot open file");
  std::string bytes;
  if (regular) bytes.reserve(static_cast<std::size_t>(st.st_size));
  // Read in chunks whatever stat said: a pipe has no size, and a file may grow meanwhile.
  std::vector<char> chunk(std::size_t(1) << 20);
  while (in) {
    in.read(chunk.data(), static_cast<std::streamsize>(chunk.size()));
    bytes.append(chunk.data(), static_cast<std::size_t>(in.gcount()));
    if (bytes.size() > kMaxFileBytes) throw too_large("more than " + std::to_string(kMaxFileBytes));
  }
  if (in.bad()) throw Unreadable(name + ": read error");
  return bytes;
}

std::string line_column(std::string_view bytes, std::size_t pos) {
  pos = std::min(pos, bytes.size());
  const std::string_view before = bytes.substr(0, pos);
  const std::size_t line = 1 + static_cast<std::size_t>(std::count(before.begin(), before.end(), '\n'));
  const std::size_t last_newline = before.rfind('\n');
  const std::size_t column = last_newline == std::string_view::npos ? pos + 1 : pos - last_newline;
  return "line " + std::to_string(line) + ", column " + std::to_string(column);
}

Document parse(std::string_view bytes, const std::string& label) {
  if (bytes.size() > kMaxFileBytes)
    throw Unreadable(label + ": " + std::to_string(bytes.size()) + " bytes exceed the file size limit of 1 GiB (§1.5)");
  Document doc;
  // A guess that saves regrowing (and copying) the large arrays: one value per 4 bytes, about
  // what rows of short ids hold. Capacity never touched costs no memory.
  doc.nodes_.reserve(bytes.size() / 4);
  doc.kids_.reserve(bytes.size() / 4);
  Builder builder(doc);
  bool ok = false;
  try {
    ok = nlohmann::json::sax_parse(bytes.begin(), bytes.end(), &builder, nlohmann::json::input_format_t::json,
                                   /*strict=*/true, /*ignore_comments=*/false);
  } catch (const std::exception& e) {
    throw Unreadable(label + ": cannot read JSON: " + e.what());
  }
  if (!ok || !builder.error.empty()) {
    std::string where = builder.error_offset == std::string::npos ? "" : line_column(bytes, builder.error_offset) + ": ";
    throw Unreadable(label + ": " + where + (builder.error.empty() ? std::string("bad JSON") : builder.error));
  }
  return doc;
}

std::string pointer_token(std::string_view key) {
  std::string out;
  for (char c : key) {
    if (c == '~') out += "~0";
    else if (c == '/') out += "~1";
    else out += c;
  }
  return out;
}

std::string find_duplicate_key(Ref value, const std::string& base) {
  // Depth-first with an explicit stack of (container, next child): its height is at most
  // kMaxDepth, and a pointer is only spelled out for the duplicate found.
  struct Level { Ref container; std::size_t next; };
  std::vector<Level> path{{value, 0}};
  auto pointer = [&](std::string_view last) {
    std::string p = base;
    for (std::size_t i = 0; i + 1 < path.size(); ++i) {
      const Level& l = path[i];
      std::size_t child = l.next - 1;
      p += "/" + (l.container.is(Kind::Object) ? pointer_token(l.container.key(child)) : std::to_string(child));
    }
    return p + "/" + pointer_token(last);
  };
  while (!path.empty()) {
    Level& top = path.back();
    Ref c = top.container;
    if (!c.is(Kind::Object) && !c.is(Kind::Array)) { path.pop_back(); continue; }
    if (top.next == 0 && c.is(Kind::Object)) {
      std::unordered_set<std::string_view> seen;
      for (std::size_t i = 0; i < c.size(); ++i)
        if (!seen.insert(c.key(i)).second) return pointer(c.key(i));
    }
    if (top.next == c.size()) { path.pop_back(); continue; }
    Ref child = c.is(Kind::Object) ? c.value(top.next) : c[top.next];
    ++top.next;
    if (child.is(Kind::Object) || child.is(Kind::Array)) path.push_back({child, 0});
  }
  return "";
}

}  // namespace sweepcheck::json
