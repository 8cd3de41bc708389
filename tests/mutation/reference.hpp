// A slow, independent reference verifier for sweepcert certificates, written from
// schema/README.md alone for the mutation campaign. It shares no code with the checker or the
// prover: numbers are GMP rationals, chains are dense vectors over every 1-cell of the stack,
// and each rule is re-derived in the plainest form we could think of (see the per-kind files).
// It exists to judge mutants that sweepcheck accepts: a mutant the checker accepts and this
// reference refuses is a checker bug (or a reference bug) that the campaign reports.
#pragma once
#include <cstddef>
#include <string>

namespace mutref {

struct Verdict {
  bool ok = false;
  std::string why;  // empty when ok; otherwise the first refused rule, with the item
};

struct Options {
  int route_samples = 1000;  // rational samples per route piece (on top of the exact check)
};

// Verifies `cert_text` against `input_text` (§1, §2 shapes assumed valid for the input; §4 in
// full for the certificate). Deterministic and side-effect free apart from an internal cache of
// parsed inputs and stack complexes keyed by their texts.
Verdict verify(const std::string& input_text, const std::string& cert_text, const Options& opt = {});

}  // namespace mutref
