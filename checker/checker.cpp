#include "checker.hpp"

#include <future>
#include <new>

#include "certificate.hpp"
#include "errors.hpp"
#include "input.hpp"
#include "json_reader.hpp"
#include "positional.hpp"
#include "sha256.hpp"
#include "stack.hpp"

namespace sweepcheck {

int check_texts(std::string input_bytes, std::string cert_bytes, std::ostream& out, std::ostream& err,
                const std::string& input_name, const std::string& cert_name) {
  try {
    // Everything that makes a file unreadable (exit 2) is found before any certificate rule:
    // the input's errors first. The certificate is parsed on a second thread meanwhile (or
    // later on this one, if no thread can be made); the input's DOM is dropped once validated.
    const std::string hash = sha256_hex(input_bytes);
    auto cert_parse = std::async(std::launch::async | std::launch::deferred, [&cert_bytes, &cert_name] {
      json::Document doc = json::parse(cert_bytes, cert_name);
      std::string().swap(cert_bytes);
      return doc;
    });
    std::unique_ptr<Input> in;
    {
      const json::Document input_doc = json::parse(input_bytes, input_name);
      std::string().swap(input_bytes);
      in = load_input(input_doc);
    }
    const json::Document cert_doc = cert_parse.get();

    out << "input: " << in->format << ", sha256 " << hash << ", " << in->fence.size() << " fence sensors, "
        << in->vertex_count() << " sensors in all";
    if (in->kind == InputKind::ContactLog)
      out << ", " << in->times.size() << " log frames, " << in->frame_pairs.size() << " pairs, triples "
          << (in->listed ? "listed" : "from pairs");
    out << "; valid (§2)\n";

    try {
      Certificate cert = read_header(cert_doc.root(), *in, hash, out);
      std::string summary;
      if (cert.method == "chambers" || cert.method == "route") {
        summary = cert.method == "chambers" ? check_chambers(cert, *in, out) : check_route(cert, *in, out);
      } else {
        Stack stack(*in, cert.frames, cert.log_start);
        summary = cert.method == "sheet" ? check_sheet(cert, stack, out) : check_cocycle(cert, stack, out);
      }
      if (in->kind == InputKind::ContactLog && cert.method == "sheet")
        summary += "; assumes every contact present at two consecutive log frames holds in between (§2.2)";
      out << "ACCEPTED: " << summary << "\n";
      return 0;
    } catch (const Rejected& r) {
      out << r.line << "\n";
      return 1;
    }
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

int check_files(const std::string& input_path, const std::string& cert_path, std::ostream& out, std::ostream& err) {
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
  return check_texts(std::move(input_bytes), std::move(cert_bytes), out, err, "INPUT " + input_path,
                     "CERT " + cert_path);
}

}  // namespace sweepcheck
