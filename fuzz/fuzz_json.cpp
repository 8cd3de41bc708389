// The JSON reader alone (checker/json_reader.*): any byte string must parse to a document or
// throw Unreadable; walking the document and the duplicate-key search must stay in bounds.
#include <cstddef>
#include <cstdint>
#include <string_view>

#include "errors.hpp"
#include "json_reader.hpp"

namespace {

// Touches every value once with an explicit stack, as the validators do.
std::size_t walk(sweepcheck::json::Ref root) {
  using sweepcheck::json::Kind;
  std::size_t seen = 0;
  std::vector<sweepcheck::json::Ref> todo{root};
  while (!todo.empty()) {
    sweepcheck::json::Ref v = todo.back();
    todo.pop_back();
    ++seen;
    switch (v.kind()) {
      case Kind::Array:
        for (std::size_t i = 0; i < v.size(); ++i) todo.push_back(v[i]);
        break;
      case Kind::Object:
        for (std::size_t i = 0; i < v.size(); ++i) {
          seen += v.key(i).size();
          todo.push_back(v.value(i));
        }
        break;
      case Kind::String: seen += v.text().size(); break;
      case Kind::Unsigned:
      case Kind::Signed:
      case Kind::Float: seen += v.number_text().size(); break;
      default: break;
    }
  }
  return seen;
}

}  // namespace

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
  std::string_view bytes(reinterpret_cast<const char*>(data), size);
  try {
    sweepcheck::json::Document doc = sweepcheck::json::parse(bytes, "INPUT");
    volatile std::size_t sink = walk(doc.root());
    (void)sink;
    (void)sweepcheck::json::find_duplicate_key(doc.root(), "");
  } catch (const sweepcheck::Unreadable&) {
  }
  return 0;
}
