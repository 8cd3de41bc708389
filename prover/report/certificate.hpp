// What the report draws from a certificate (schema §4), read with the prover's JSON reader.
//
// The report displays a certificate; it does not check the proof (sweepcheck does). So only the
// fields that are drawn are read, each for its shape, and every error names the JSON pointer.
// The certificate must belong to the input: its input_sha256 and input_format must match.
#pragma once
#include <array>
#include <string>
#include <vector>

#include "chambers/engine.hpp"
#include "io/read_input.hpp"

namespace sweepcert {

struct CertView {
  std::string claim, method, ring, summary;  // summary: notes.summary when it is a string
  std::string winding;                       // sheet: the winding m
  std::vector<Rational> frames;              // sheet, cocycle
  std::vector<std::array<Rational, 3>> route;  // route rows [t, x, y]
  Rational x0, y0, side;                     // chambers: the square Q
  std::vector<std::string> table;            // chambers: sensor table
  std::vector<Slab> slabs;                   // chambers: trees decoded into quadtrees
};

// Cells deeper than this do not fit the prover's quadtree indices (32-bit cell positions).
constexpr int kReportMaxDepth = 32;

// Throws InputError (where = JSON pointer) for a malformed certificate or one that belongs to
// another input.
CertView read_certificate(const std::string& bytes, const Input& input);

}  // namespace sweepcert
