// The whole check: read both files, validate INPUT (§2), verify the certificate (§4), and
// report per §5.
#pragma once
#include <ostream>
#include <string>
#include <string_view>

namespace sweepcheck {

struct Options {
  // Print the auditor's account (explain.hpp) before the findings. Exit codes are unchanged.
  bool explain = false;
  // How the account names the two files.
  std::string input_name = "INPUT";
  std::string cert_name = "CERT";
};

// Findings and the final ACCEPTED/REJECTED line go to `out`; exit-2 messages go to `err`.
// Returns the exit code: 0 accepted, 1 rejected, 2 unreadable.
int check_texts(std::string input_bytes, std::string cert_bytes, std::ostream& out, std::ostream& err,
                const Options& options = {});
int check_files(const std::string& input_path, const std::string& cert_path, std::ostream& out, std::ostream& err,
                const Options& options = {});

}  // namespace sweepcheck
