// sweepcert: thin entry point; errors become messages and exit codes here.
#include <cstdio>
#include <cstring>
#include <exception>

#include "app/commands.hpp"
#include "io/input_error.hpp"

int main(int argc, char** argv) {
  using namespace sweepcert;
  if (argc >= 2 && (!std::strcmp(argv[1], "--help") || !std::strcmp(argv[1], "-h") ||
                    !std::strcmp(argv[1], "help"))) {
    std::fputs(help_text(argc >= 3 ? argv[2] : "").c_str(), stdout);
    return kOk;
  }
  if (argc >= 2 && !std::strcmp(argv[1], "--version")) {
    std::puts("sweepcert 0.1.0");
    return kOk;
  }
  for (int i = 2; i < argc; ++i)
    if (!std::strcmp(argv[i], "--help") || !std::strcmp(argv[i], "-h")) {
      std::fputs(help_text(argv[1]).c_str(), stdout);
      return kOk;
    }
  try {
    ParsedArgs args = parse_args(argc, argv);
    if (args.command == "prove") return run_prove(args);
    if (args.command == "contacts") return run_contacts(args);
    if (args.command == "import") return run_import(args);
    if (args.command == "report") return run_report(args);
  } catch (const UsageError& e) {
    std::fprintf(stderr, "sweepcert: %s\nTry 'sweepcert --help'.\n", e.what());
    return kBadInput;
  } catch (const InputError& e) {
    std::fprintf(stderr, "sweepcert: invalid input: %s: %s\n", e.where.c_str(), e.what());
    return kBadInput;
  } catch (const std::exception& e) {
    std::fprintf(stderr, "sweepcert: failed: %s\n", e.what());
    return kInternal;
  }
  return kInternal;
}
