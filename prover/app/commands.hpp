// The commands behind `sweepcert`. Each returns the process exit code.
#pragma once
#include "app/options.hpp"

namespace sweepcert {

enum ExitCode { kOk = 0, kBadInput = 2, kUndecided = 3, kInternal = 4 };

int run_prove(const ParsedArgs& args);
int run_contacts(const ParsedArgs& args);
int run_import(const ParsedArgs& args);
int run_report(const ParsedArgs& args);

}  // namespace sweepcert
