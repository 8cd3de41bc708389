// The two ways a check can stop early. They map onto the exit codes of schema/README.md §5.
#pragma once
#include <stdexcept>
#include <string>
#include <utility>

namespace sweepcheck {

// A file that cannot be used at all: missing, bad JSON, a §1.5 limit, or an input (scenario or
// contact log) that breaks §2. Exit code 2. `what()` names the file, the JSON pointer and the
// rule.
struct Unreadable : std::runtime_error {
  using std::runtime_error::runtime_error;
};

// A certificate that is valid JSON but breaks a rule of §4. Exit code 1. The three parts are
// printed as "REJECTED: <pointer> <item>: <rule>".
struct Rejected : std::exception {
  std::string pointer;  // RFC 6901 pointer into the certificate ("" is the whole document)
  std::string item;     // the cell, sensor or time concerned (may be empty)
  std::string rule;     // what is wrong and which rule says so
  std::string line;
  Rejected(std::string p, std::string i, std::string r)
      : pointer(std::move(p)), item(std::move(i)), rule(std::move(r)) {
    line = "REJECTED: " + (pointer.empty() ? std::string("(root)") : pointer);
    if (!item.empty()) line += " " + item;
    line += ": " + rule;
  }
  const char* what() const noexcept override { return line.c_str(); }
};

}  // namespace sweepcheck
