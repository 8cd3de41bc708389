// sweepcheck [--explain] INPUT CERT: re-verifies a sweepcert certificate against its input.
#include <cstring>
#include <iostream>
#include <string>

#include "checker.hpp"

namespace {

// The options, one table: parsing and --help both read it.
struct Flag {
  const char* name;
  const char* help;
};
const Flag kFlags[] = {
    {"--explain", "first print a plain-language account for an auditor: what is claimed, about which\n"
                  "input, under which assumptions, and which checks ran over how many items"},
    {"--help", "print this help and exit"},
};

std::string usage() {
  std::string s =
      "usage: sweepcheck [--explain] INPUT CERT\n"
      "       sweepcheck --help\n"
      "\n"
      "Verifies a sweepcert-certificate-1 (CERT) against the scenario or contact log it speaks\n"
      "about (INPUT), following schema/README.md. Prints its findings and a final line that\n"
      "begins with ACCEPTED or REJECTED; a rejection names the JSON pointer, the item and the rule.\n"
      "A certificate's margin M (schema §4.1.1) is applied before every check: radii r - M for\n"
      "no-evasion, r + M for evasion.\n"
      "\n"
      "options:\n";
  for (const Flag& f : kFlags) {
    std::string help = f.help;
    for (std::size_t p = help.find('\n'); p != std::string::npos; p = help.find('\n', p + 1)) help.insert(p + 1, 14, ' ');
    std::string name = f.name;
    s += "  " + name + std::string(name.size() < 12 ? 12 - name.size() : 1, ' ') + help + "\n";
  }
  s += "\n"
       "exit status: 0 accepted, 1 rejected, 2 unreadable (missing file, bad JSON, a size or depth\n"
       "limit, or an invalid INPUT). --explain does not change it.\n";
  return s;
}

}  // namespace

int main(int argc, char** argv) {
  sweepcheck::Options options;
  const char* files[2] = {nullptr, nullptr};
  int file_count = 0;
  bool help = false, misuse = false;
  for (int i = 1; i < argc; ++i) {
    const char* arg = argv[i];
    if (std::strcmp(arg, "--help") == 0 || std::strcmp(arg, "-h") == 0) help = true;
    else if (std::strcmp(arg, kFlags[0].name) == 0) options.explain = true;
    else if (arg[0] == '-' && arg[1] == '-') misuse = true;  // an unknown option
    else if (file_count < 2) files[file_count++] = arg;
    else misuse = true;
  }
  if (help && argc == 2) {
    std::cout << usage();
    return 0;
  }
  if (help || misuse || file_count != 2) {
    std::cerr << usage();
    return 2;
  }
  std::ios::sync_with_stdio(false);
  return sweepcheck::check_files(files[0], files[1], std::cout, std::cerr, options);
}
