// One table of command-line options; parsing and --help are both generated from it.
#pragma once
#include <map>
#include <stdexcept>
#include <string>
#include <vector>

namespace sweepcert {

struct OptionSpec {
  const char* name;         // "--ring"
  const char* value;        // "z|z2", or nullptr for a flag
  const char* fallback;     // default value text, or nullptr
  const char* commands;     // space-separated commands it applies to
  const char* help;
};

struct CommandSpec {
  const char* name;
  const char* usage;
  const char* summary;
};

const std::vector<OptionSpec>& option_table();
const std::vector<CommandSpec>& command_table();

struct ParsedArgs {
  std::string command;
  std::vector<std::string> positional;
  std::map<std::string, std::string> options;  // flags map to "1"; defaults filled in
  bool has(const std::string& name) const { return options.count(name) > 0; }
  const std::string& get(const std::string& name) const { return options.at(name); }
};

struct UsageError : std::runtime_error {
  using std::runtime_error::runtime_error;
};

// Throws UsageError naming the offending argument.
ParsedArgs parse_args(int argc, char** argv);
std::string help_text(const std::string& command);

}  // namespace sweepcert
