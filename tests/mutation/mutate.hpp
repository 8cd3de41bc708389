// Structured mutations of a certificate. Each operator picks a site of the right kind (a
// coefficient, a rational, an id, a frame index, a quadtree token, a row list, a field) with a
// seeded generator and returns the mutant's text, or nothing when the certificate has no such
// site. Some operators are meant to keep the certificate valid (reorder a commutative list,
// rewrite a number in an equal form, reorient a row and negate its coefficient); the campaign
// then learns from the reference whether the checker was right to accept.
#pragma once
#include <cstdint>
#include <optional>
#include <random>
#include <string>
#include <vector>

#include <nlohmann/json.hpp>

namespace mutation {

struct Mutant {
  std::string text;
  std::string what;  // operator, site and change, for the log
};

struct Context {
  std::vector<std::string> input_ids;  // every sensor id of the input
  const std::string* input_text = nullptr;
};

using Rng = std::mt19937_64;
using Operator = std::optional<Mutant> (*)(const nlohmann::json& cert, const Context& ctx, Rng& rng);

struct NamedOperator {
  const char* name;
  Operator apply;
};

// The operator table, in a fixed order (it indexes the result table).
const std::vector<NamedOperator>& operators();

}  // namespace mutation
