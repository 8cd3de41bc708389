// Reading and validating input files (schema/README.md §2). Every rule broken raises
// InputError naming the JSON pointer, so the caller can exit 2 without writing anything.
#pragma once
#include <string>
#include <variant>

#include "model/sweep.hpp"

namespace sweepcert {

struct Input {
  std::string path;
  std::string format;  // "sweepcert-scenario-1" or "sweepcert-contacts-1"
  std::string sha256;  // hex digest of the file's bytes
  std::variant<Sweep, ContactLog> content;
};

// Reads a file whole; throws InputError if it is missing, unreadable or over 1 GiB.
std::string read_bytes(const std::string& path);

Input read_input(const std::string& path);

// Exposed for tests: parse from bytes already in memory.
Sweep parse_scenario(const std::string& bytes);
ContactLog parse_contacts(const std::string& bytes);

std::string sha256_hex(const std::string& bytes);

// The rules of §2.1 that depend on the radii, on a sweep already built (the reader's own, or an
// adjusted one, §4.1.1): every radius > 0, and every two cyclically consecutive fence disks
// share a point. Returns "" or what is broken, naming the sensor or the pair; `*at` receives
// the offending sensor's index (for a fence gap, the second disk of the pair).
std::string radius_problem(const Sweep& s, std::size_t* at = nullptr);

}  // namespace sweepcert
