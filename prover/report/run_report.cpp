// `sweepcert report`: draw a certificate over its input, as an HTML page or an SVG snapshot.
#include <chrono>
#include <cstdio>
#include <fstream>
#include <optional>
#include <unistd.h>

#include "app/commands.hpp"
#include "io/input_error.hpp"
#include "io/read_input.hpp"
#include "report/page.hpp"
#include "report/snapshot.hpp"

namespace sweepcert {
namespace {

// Errors from either file name the file, then the JSON pointer.
template <class F> auto in_file(const std::string& path, F&& read) {
  try {
    return read();
  } catch (const InputError& e) {
    if (e.where == path) throw;
    throw InputError(path + ": " + e.where, e.what());
  }
}

void write_atomically(const std::string& path, const std::string& text) {
  const std::string tmp = path + ".partial-" + std::to_string(::getpid());
  {
    std::ofstream f(tmp, std::ios::binary);
    f << text;
    if (!f) {
      std::remove(tmp.c_str());
      throw std::runtime_error("cannot write " + tmp);
    }
  }
  if (std::rename(tmp.c_str(), path.c_str()) != 0) {
    std::remove(tmp.c_str());
    throw std::runtime_error("cannot move the report into place at " + path);
  }
}

}  // namespace

int run_report(const ParsedArgs& args) {
  auto start = std::chrono::steady_clock::now();
  if (args.positional.size() != 2) throw UsageError("report takes exactly two files: INPUT and CERT");
  if (!args.has("-o")) throw UsageError("report needs -o FILE");
  const std::string &in_path = args.positional[0], &cert_path = args.positional[1];
  Input input = in_file(in_path, [&] { return read_input(in_path); });
  const Sweep* sweep = std::get_if<Sweep>(&input.content);
  if (!sweep)
    throw InputError(in_path, "is a contact log (sweepcert-contacts-1), which has no positions to draw; "
                              "report needs a positional scenario (sweepcert-scenario-1)");
  std::optional<Rational> at;
  if (args.has("--svg")) {
    std::string why;
    at = parse_exact(args.get("--svg"), &why);
    if (!at) throw UsageError("--svg T needs an exact number (e.g. 12.5 or 25/2): " + why);
    if (*at < sweep->t_start || *at > sweep->t_end)
      throw UsageError("--svg " + args.get("--svg") + " lies outside the horizon [" + to_text(sweep->t_start) +
                       ", " + to_text(sweep->t_end) + "] of " + in_path);
  }
  CertView cert = in_file(cert_path, [&] { return read_certificate(read_bytes(cert_path), input); });
  Scene scene = build_scene(*sweep, cert);
  std::string out = at ? svg_snapshot(scene, *sweep, *at) : html_page(scene);
  write_atomically(args.get("-o"), out);
  double secs = std::chrono::duration<double>(std::chrono::steady_clock::now() - start).count();
  std::printf("wrote %s: %s of a %s certificate (%s), %.1f KB, %.2f s\n", args.get("-o").c_str(),
              at ? "SVG snapshot" : "HTML report", cert.method.c_str(), cert.claim.c_str(), out.size() / 1024.0,
              secs);
  return kOk;
}

}  // namespace sweepcert
