// `sweepcheck --explain`: a plain-language account for an auditor, printed before the findings
// and the final ACCEPTED/REJECTED line. It says what was claimed, about which input, under
// which assumptions, and which checks ran over how many items. The counts are those the checks
// made as they verified (tally.hpp); nothing is recounted here.
#pragma once
#include <cstddef>
#include <ostream>
#include <string>

#include "certificate.hpp"
#include "input.hpp"
#include "tally.hpp"

namespace sweepcheck {

struct Account {
  const std::string& input_name;  // the INPUT file as named on the command line
  std::size_t input_bytes;
  const std::string& sha256;      // of the input's bytes
  const Input& input;
  const Certificate* cert;        // null when the certificate's header was rejected
  const Tally& tally;
  bool accepted;
};

void explain(const Account& a, std::ostream& out);

}  // namespace sweepcheck
