// Writing an output file so that a failed run leaves nothing half-written.
#pragma once
#include <string>

namespace sweepcert {

// Writes `bytes` to PATH.partial and renames it to PATH; throws std::runtime_error on failure
// (and removes the partial file).
void write_file_atomically(const std::string& path, const std::string& bytes);

}  // namespace sweepcert
