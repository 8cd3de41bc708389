#include "fields.hpp"

#include <algorithm>

namespace sweepcheck {

using json::Kind;
using json::Ref;

Members::Members(Ref object, std::string pointer, std::initializer_list<std::string_view> allowed)
    : object_(object), pointer_(std::move(pointer)) {
  expect_kind(object, Kind::Object, pointer_);
  for (std::size_t i = 0; i < object.size(); ++i) {
    std::string_view key = object.key(i);
    if (std::find(allowed.begin(), allowed.end(), key) == allowed.end())
      throw FieldError(at(key), "unknown key \"" + std::string(key) + "\" (§1.4)");
    for (const auto& m : members_)
      if (m.first == key) throw FieldError(at(key), "duplicated key \"" + std::string(key) + "\" (§1.4)");
    members_.emplace_back(key, object.value(i));
  }
}

std::optional<Ref> Members::get(std::string_view key) const {
  for (const auto& m : members_)
    if (m.first == key) return m.second;
  return std::nullopt;
}

Ref Members::need(std::string_view key) const {
  if (auto v = get(key)) return *v;
  throw FieldError(at(key), "required key \"" + std::string(key) + "\" is missing");
}

void expect_kind(Ref v, Kind k, const std::string& pointer) {
  if (v.kind() != k)
    throw FieldError(pointer, std::string("expected ") + json::kind_name(k) + ", found " + json::kind_name(v.kind()));
}

void expect_array(Ref v, const std::string& pointer, std::size_t min, std::size_t max) {
  expect_kind(v, Kind::Array, pointer);
  if (v.size() < min || v.size() > max) {
    std::string want = min == max ? std::to_string(min)
                       : max == ~std::size_t(0) ? "at least " + std::to_string(min)
                                                : std::to_string(min) + " to " + std::to_string(max);
    throw FieldError(pointer, "array has " + std::to_string(v.size()) + " elements, expected " + want);
  }
}

std::string_view get_string(Ref v, const std::string& pointer) {
  expect_kind(v, Kind::String, pointer);
  return v.text();
}

std::string_view get_id(Ref v, const std::string& pointer) {
  if (!v.is(Kind::String)) throw FieldError(pointer, "a sensor id must be a string");
  std::string_view id = v.text();
  if (id.empty() || id.size() > 64) throw FieldError(pointer, "a sensor id must have 1 to 64 bytes (§1.3)");
  return id;
}

Rat get_rational(Ref v, const std::string& pointer) {
  std::string text;
  if (v.is_number()) text = v.number_text();
  else if (v.is(Kind::String)) text = std::string(v.text());
  else throw FieldError(pointer, std::string("expected an exact number, found ") + json::kind_name(v.kind()));
  Rat q;
  std::string why = parse_rational(text, q);
  if (!why.empty()) throw FieldError(pointer, why + " (§1.1)");
  return q;
}

Int get_integer(Ref v, const std::string& pointer) {
  if (!v.is(Kind::String)) throw FieldError(pointer, "expected a decimal integer string (§1.2)");
  Int n;
  std::string why = parse_integer(v.text(), n);
  if (!why.empty()) throw FieldError(pointer, why + " (§1.2)");
  return n;
}

}  // namespace sweepcheck
