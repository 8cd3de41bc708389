#include "app/options.hpp"

#include <sstream>
#include <stdexcept>

namespace sweepcert {

const std::vector<CommandSpec>& command_table() {
  static const std::vector<CommandSpec> table = {
      {"prove", "sweepcert prove INPUT -o CERT [options]",
       "Decide whether an evasion path exists and write a certificate: a separating sheet or\n"
       "  time-ordered chambers (claim no-evasion), an explicit intruder route (claim evasion),\n"
       "  or, when only contacts are known and they cannot prove coverage, a cocycle (claim\n"
       "  no-sheet). INPUT is a positional scenario (sweepcert-scenario-1) or a contact log\n"
       "  (sweepcert-contacts-1); see schema/README.md."},
      {"contacts", "sweepcert contacts SCENARIO --every DT -o LOG [--pairs-only --contact-range R]",
       "Write the contact log that these sensors would record: frames at START + k*DT, at every\n"
       "  waypoint time inside the horizon and at END; pairs and triples decided exactly.\n"
       "  With --pairs-only --contact-range R: pairs within distance R, no triples (schema 2.2)."},
      {"import", "sweepcert import TRACKS.csv --fence FENCE.csv --horizon START:END -o SCENARIO",
       "Write a positional scenario from CSV tables: TRACKS with columns sensor,t,x,y,radius\n"
       "  (one row per waypoint, any order), FENCE with sensor,x,y,radius (rows in cyclic\n"
       "  order). Numbers are exact (schema 1.1); the scenario is validated before it is written."},
      {"report", "sweepcert report INPUT CERT -o FILE.html [--svg T]",
       "Draw a certificate over its positional scenario as one self-contained HTML page (sensors\n"
       "  over time, live set or intruder route, uncovered area); with --svg T, instead a\n"
       "  standalone SVG snapshot at time T. Displays only: sweepcheck verifies."},
  };
  return table;
}

const std::vector<OptionSpec>& option_table() {
  static const std::vector<OptionSpec> table = {
      {"-o", "FILE", nullptr, "prove contacts import report",
       "where to write the certificate / log / scenario / page or snapshot (required)"},
      {"--method", "auto|sheet|chambers|route", "auto", "prove",
       "auto: a separating sheet if one exists, else (positional input)\n"
       "time-ordered chambers, else an evasion route; or force one method"},
      {"--ring", "z|z2", "z", "prove",
       "coefficients of the sheet or cocycle: integers (z) or integers mod 2 (z2, faster)"},
      {"--max-frames", "N", "20000", "prove",
       "positional input: at most this many frames when refining time"},
      {"--margin", "M", "0", "prove",
       "positional input: prove no-evasion with every radius reduced by M, or a route\n"
       "clear of every radius increased by M, so that the answer holds even if each\n"
       "sensor is up to M away from its stated position (exact number >= 0)"},
      {"--rounds", "N", "4", "prove",
       "chambers/route: refinement rounds (halving slabs, finer cells) before giving up"},
      {"--every", "DT", nullptr, "contacts", "spacing of regular frames (an exact number > 0)"},
      {"--pairs-only", nullptr, nullptr, "contacts",
       "log pairs only; triangles come from pairs (needs --contact-range)"},
      {"--contact-range", "R", nullptr, "contacts",
       "with --pairs-only: a pair is in contact when its centres are at most R apart"},
      {"--fence", "FILE", nullptr, "import", "the fence table, sensor,x,y,radius (required)"},
      {"--horizon", "START:END", nullptr, "import", "the horizon, exact numbers (required)"},
      {"--title", "TEXT", nullptr, "import", "title of the scenario"},
      {"--quiet", nullptr, nullptr, "prove contacts import", "print nothing but errors"},
      {"--svg", "T", nullptr, "report",
       "write an SVG snapshot at time T (exact number in the horizon) instead of the page"},
  };
  return table;
}

namespace {
bool applies(const OptionSpec& o, const std::string& cmd) {
  std::istringstream in(o.commands);
  std::string c;
  while (in >> c)
    if (c == cmd) return true;
  return false;
}
}  // namespace

ParsedArgs parse_args(int argc, char** argv) {
  ParsedArgs out;
  if (argc < 2) throw UsageError("no command given");
  out.command = argv[1];
  bool known = false;
  for (const auto& c : command_table()) known = known || out.command == c.name;
  if (!known) throw UsageError("unknown command '" + out.command + "'");
  for (int i = 2; i < argc; ++i) {
    std::string arg = argv[i];
    if (arg.size() > 1 && arg[0] == '-') {
      const OptionSpec* spec = nullptr;
      for (const auto& o : option_table())
        if (arg == o.name && applies(o, out.command)) spec = &o;
      if (!spec) throw UsageError("unknown option '" + arg + "' for '" + out.command + "'");
      if (spec->value) {
        if (i + 1 >= argc) throw UsageError("option " + arg + " needs a value (" + spec->value + ")");
        out.options[arg] = argv[++i];
      } else {
        out.options[arg] = "1";
      }
    } else {
      out.positional.push_back(arg);
    }
  }
  for (const auto& o : option_table())
    if (o.fallback && applies(o, out.command) && !out.has(o.name)) out.options[o.name] = o.fallback;
  return out;
}

std::string help_text(const std::string& command) {
  std::ostringstream h;
  if (command.empty()) {
    h << "sweepcert - certify that a sweep by moving sensors left no evasion path\n\n"
         "Commands:\n";
    for (const auto& c : command_table()) h << "  " << c.usage << "\n  " << c.summary << "\n\n";
  } else {
    for (const auto& c : command_table())
      if (command == c.name) h << "Usage: " << c.usage << "\n\n  " << c.summary << "\n\n";
  }
  h << "Options:\n";
  for (const auto& o : option_table()) {
    if (!command.empty() && !applies(o, command)) continue;
    std::string left = std::string("  ") + o.name + (o.value ? std::string(" ") + o.value : "");
    const std::string indent(24, ' ');
    std::string help = o.help;
    for (auto p = help.find('\n'); p != std::string::npos; p = help.find('\n', p + 1))
      help.insert(p + 1, indent);
    if (left.size() < 24) h << left << std::string(24 - left.size(), ' ') << help;
    else h << left << "\n" << indent << help;
    if (o.fallback) h << " (default " << o.fallback << ")";
    h << "\n";
  }
  h << "\nExit codes: 0 certificate (or log) written; 2 invalid input or usage, nothing written;\n"
       "3 undecided (no method could certify an answer; the message names where), nothing\n"
       "written; 4 internal failure, nothing written.\n"
       "A certificate covers the model as given (disks, fence, tracks or log) and nothing else:\n"
       "not sensor faults, occlusion or wrong logs. Follow site-specific security practice.\n";
  return h.str();
}

}  // namespace sweepcert
