// The one error type for bad input: where (JSON pointer, or file:line:column) and what.
#pragma once
#include <stdexcept>
#include <string>

namespace sweepcert {

struct InputError : std::runtime_error {
  InputError(std::string where, const std::string& what)
      : std::runtime_error(what), where(std::move(where)) {}
  std::string where;
};

}  // namespace sweepcert
