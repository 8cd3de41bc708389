#include "checker.hpp"

#include <future>
#include <new>
#include <optional>
#include <sstream>

#include "certificate.hpp"
#include "errors.hpp"
#include "explain.hpp"
#include "input.hpp"
#include "json_reader.hpp"
#include "positional.hpp"
#include "sha256.hpp"
#include "stack.hpp"

namespace sweepcheck {

int check_texts(std::string input_bytes, std::string cert_bytes, std::ostream& out, std::ostream& err,
                const Options& options) {
  try {
    // Everything that makes a file unreadable (exit 2) is found before any certificate rule:
    // the input's errors first. The certificate is parsed on a second thread meanwhile (or
    // later on this one, if no thread can be made); the input's DOM is dropped once validated.
    const std::string hash = sha256_hex(input_bytes);
    const std::size_t input_size = input_bytes.size();
    // Syntax errors name the file: "INPUT <path>" / "CERT <path>" (just the role for bare texts).
    auto label = [](const char* role, const std::string& name) {
      return name == role ? name : std::string(role) + " " + name;
    };
    const std::string input_label = label("INPUT", options.input_name);
    const std::string cert_label = label("CERT", options.cert_name);
    auto cert_parse = std::async(std::launch::async | std::launch::deferred, [&cert_bytes, &cert_label] {
      json::Document doc = json::parse(cert_bytes, cert_label);
      std::string().swap(cert_bytes);
      return doc;
    });
    std::unique_ptr<Input> in;
    {
      const json::Document input_doc = json::parse(input_bytes, input_label);
      std::string().swap(input_bytes);
      in = load_input(input_doc);
    }
    const json::Document cert_doc = cert_parse.get();

    // With --explain the findings are held back, so that the account (which reports what the
    // checks counted) comes first.
    std::ostringstream held;
    std::ostream& findings = options.explain ? held : out;
    findings << "input: " << in->format << ", sha256 " << hash << ", " << in->fence.size() << " fence sensors, "
             << in->vertex_count() << " sensors in all";
    if (in->kind == InputKind::ContactLog)
      findings << ", " << in->times.size() << " log frames, " << in->frame_pairs.size() << " pairs, triples "
               << (in->listed ? "listed" : "from pairs");
    findings << "; valid (§2)\n";

    Tally tally;
    std::optional<Certificate> cert;
    std::string last;
    int code = 0;
    try {
      cert.emplace(read_header(cert_doc.root(), *in, hash, findings, tally));
      apply_margin(*cert, *in, findings, tally);
      std::string summary;
      if (cert->method == "chambers" || cert->method == "route") {
        summary = cert->method == "chambers" ? check_chambers(*cert, *in, findings, tally)
                                             : check_route(*cert, *in, findings, tally);
      } else {
        Stack stack(*in, cert->frames, cert->log_start);
        summary = cert->method == "sheet" ? check_sheet(*cert, stack, findings, tally)
                                          : check_cocycle(*cert, stack, findings, tally);
      }
      if (in->kind == InputKind::ContactLog && cert->method == "sheet")
        summary += "; assumes every contact present at two consecutive log frames holds in between (§2.2)";
      if (cert->has_margin && cert->margin != 0)
        summary += cert->claim == "evasion"
                       ? "; with margin " + to_text(cert->margin) + ": the route keeps clear of every disk even if " +
                             "each sensor's centre is anywhere within " + to_text(cert->margin) + " of its stated centre"
                       : "; with margin " + to_text(cert->margin) + ": this holds even if each sensor's centre is " +
                             "anywhere within " + to_text(cert->margin) + " of its stated centre";
      last = "ACCEPTED: " + summary;
    } catch (const Rejected& r) {
      last = r.line;
      code = 1;
    }
    if (options.explain) {
      explain(Account{options.input_name, input_size, hash, *in, cert ? &*cert : nullptr, tally, code == 0}, out);
      out << held.str();
    }
    out << last << "\n";
    return code;
  } catch (const Unreadable& e) {
    err << "sweepcheck: " << e.what() << "\n";
    return 2;
  } catch (const std::bad_alloc&) {
    err << "sweepcheck: out of memory\n";
    return 2;
  } catch (const std::exception& e) {
    // Not expected on any input; never let it look like acceptance.
    err << "sweepcheck: internal error: " << e.what() << "\n";
    return 2;
  }
}

int check_files(const std::string& input_path, const std::string& cert_path, std::ostream& out, std::ostream& err,
                const Options& options) {
  std::string input_bytes, cert_bytes;
  try {
    input_bytes = json::read_file(input_path, "INPUT");
    cert_bytes = json::read_file(cert_path, "CERT");
  } catch (const Unreadable& e) {
    err << "sweepcheck: " << e.what() << "\n";
    return 2;
  } catch (const std::bad_alloc&) {
    err << "sweepcheck: out of memory reading the files\n";
    return 2;
  }
  Options named = options;
  named.input_name = input_path;
  named.cert_name = cert_path;
  return check_texts(std::move(input_bytes), std::move(cert_bytes), out, err, named);
}

}  // namespace sweepcheck
