// sweepcheck INPUT CERT: re-verifies a sweepcert certificate against its input.
#include <cstring>
#include <iostream>

#include "checker.hpp"

namespace {

const char* kUsage =
    "usage: sweepcheck INPUT CERT\n"
    "       sweepcheck --help\n"
    "\n"
    "Verifies a sweepcert-certificate-1 (CERT) against the scenario or contact log it speaks\n"
    "about (INPUT), following schema/README.md. Prints its findings and a final line that\n"
    "begins with ACCEPTED or REJECTED; a rejection names the JSON pointer, the item and the rule.\n"
    "\n"
    "exit status: 0 accepted, 1 rejected, 2 unreadable (missing file, bad JSON, a size or depth\n"
    "limit, or an invalid INPUT).\n";

}  // namespace

int main(int argc, char** argv) {
  if (argc == 2 && (std::strcmp(argv[1], "--help") == 0 || std::strcmp(argv[1], "-h") == 0)) {
    std::cout << kUsage;
    return 0;
  }
  if (argc != 3) {
    std::cerr << kUsage;
    return 2;
  }
  std::ios::sync_with_stdio(false);
  return sweepcheck::check_files(argv[1], argv[2], std::cout, std::cerr);
}
