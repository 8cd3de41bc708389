// The whole check: read both files, validate INPUT (§2), verify the certificate (§4), and
// report per §5.
#pragma once
#include <ostream>
#include <string>
#include <string_view>

namespace sweepcheck {

// Findings and the final ACCEPTED/REJECTED line go to `out`; exit-2 messages go to `err`.
// Returns the exit code: 0 accepted, 1 rejected, 2 unreadable. The names label the two texts
// in syntax-error messages (check_files passes "INPUT <path>" and "CERT <path>").
int check_texts(std::string input_bytes, std::string cert_bytes, std::ostream& out, std::ostream& err,
                const std::string& input_name = "INPUT", const std::string& cert_name = "CERT");
int check_files(const std::string& input_path, const std::string& cert_path, std::ostream& out, std::ostream& err);

}  // namespace sweepcheck
