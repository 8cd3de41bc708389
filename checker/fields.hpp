// Typed access to DOM values for the validators. Every failure names the JSON pointer of the
// offending value; the input loader turns it into an exit-2 message, the certificate checks
// into a REJECTED line.
#pragma once
#include <initializer_list>
#include <optional>
#include <string>
#include <string_view>
#include <vector>

#include "json_reader.hpp"
#include "numbers.hpp"

namespace sweepcheck {

struct FieldError : std::exception {
  std::string pointer, message;
  FieldError(std::string p, std::string m) : pointer(std::move(p)), message(std::move(m)) {}
  const char* what() const noexcept override { return message.c_str(); }
};

// The members of one object, checked against a list of allowed keys: an unknown or duplicated
// key is an error (§1.4), reported at the first offending member in document order.
class Members {
 public:
  Members(json::Ref object, std::string pointer, std::initializer_list<std::string_view> allowed);
  std::optional<json::Ref> get(std::string_view key) const;
  json::Ref need(std::string_view key) const;  // missing key: error at the key's pointer
  std::string at(std::string_view key) const { return pointer_ + "/" + json::pointer_token(key); }
  const std::string& pointer() const { return pointer_; }

 private:
  json::Ref object_;
  std::string pointer_;
  std::vector<std::pair<std::string_view, json::Ref>> members_;
};

inline std::string at(const std::string& pointer, std::size_t i) { return pointer + "/" + std::to_string(i); }

void expect_kind(json::Ref v, json::Kind k, const std::string& pointer);
// An array with size in [min, max].
void expect_array(json::Ref v, const std::string& pointer, std::size_t min, std::size_t max = ~std::size_t(0));
std::string_view get_string(json::Ref v, const std::string& pointer);
// A sensor id: a string of 1 to 64 bytes (§1.3).
std::string_view get_id(json::Ref v, const std::string& pointer);
// An exact number (§1.1), given as a JSON number (raw text) or a string.
Rat get_rational(json::Ref v, const std::string& pointer);
// A decimal integer string (§1.2).
Int get_integer(json::Ref v, const std::string& pointer);

}  // namespace sweepcheck
