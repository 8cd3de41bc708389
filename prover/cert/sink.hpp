// Where certificates go. The emitter walks a result and reports every item to a sink; the JSON
// writer is one sink, a counter another, and tests replay certificates through a third.
// Sinks receive sensor ids, never the prover's internal indices (schema §1.3).
#pragma once
#include <string>
#include <vector>

#include "exact/number.hpp"
#include "model/sweep.hpp"

namespace sweepcert {

struct CertificateHeader {
  std::string claim, method, input_sha256, input_format, ring;
  std::vector<Rational> frames;
  Rational margin;         // schema §4.1.1; written only when nonzero
  std::string notes_json;  // a JSON object, written as the "notes" value
};

class CertificateSink {
 public:
  virtual ~CertificateSink() = default;
  virtual void begin(const CertificateHeader& header) = 0;
  // Sheets: winding first, then all triangles, then all prisms.
  virtual void winding(const Integer& m) = 0;
  virtual void triangle(std::uint32_t frame, const std::string& a, const std::string& b,
                        const std::string& c, const Integer& coef, const Point* witness) = 0;
  virtual void prism(std::uint32_t slab, const std::string& a, const std::string& b,
                     const Integer& coef) = 0;
  // Cocycles: fence value first, then all edges, then all verticals.
  virtual void fence_value(const Integer& v) = 0;
  virtual void edge_value(std::uint32_t frame, const std::string& a, const std::string& b,
                          const Integer& value) = 0;
  virtual void vertical_value(std::uint32_t slab, const std::string& v, const Integer& value) = 0;
  // Chambers: the square and the sensor table first, then each slab's quadtree tokens.
  virtual void chamber_square(const Rational&, const Rational&, const Rational&,
                              const std::vector<std::string>&) {}
  virtual void chamber_slab(const Rational&, const Rational&, const std::vector<int>&) {}
  // Routes: the points in time order.
  virtual void route_point(const Rational&, const Rational&, const Rational&) {}
  virtual void end() = 0;
};

// Streams a certificate to `path` through a temporary file, renamed into place by commit():
// a failed run leaves nothing half-written.
class JsonCertificateWriter : public CertificateSink {
 public:
  explicit JsonCertificateWriter(std::string path);
  ~JsonCertificateWriter() override;
  void begin(const CertificateHeader& header) override;
  void winding(const Integer& m) override;
  void triangle(std::uint32_t frame, const std::string& a, const std::string& b,
                const std::string& c, const Integer& coef, const Point* witness) override;
  void prism(std::uint32_t slab, const std::string& a, const std::string& b,
             const Integer& coef) override;
  void fence_value(const Integer& v) override;
  void edge_value(std::uint32_t frame, const std::string& a, const std::string& b,
                  const Integer& value) override;
  void vertical_value(std::uint32_t slab, const std::string& v, const Integer& value) override;
  void chamber_square(const Rational& x0, const Rational& y0, const Rational& side,
                      const std::vector<std::string>& sensors) override;
  void chamber_slab(const Rational& a, const Rational& b, const std::vector<int>& tree) override;
  void route_point(const Rational& t, const Rational& x, const Rational& y) override;
  void end() override;
  // Moves the finished file into place; throws on I/O failure.
  void commit();
  std::size_t bytes_written() const { return written_; }

 private:
  void open_array(const char* key);
  void row_start();
  void flush(bool force);
  std::string path_, tmp_;
  std::FILE* file_ = nullptr;
  std::string buf_;
  std::string section_;
  bool first_row_ = true;
  bool committed_ = false;
  std::size_t written_ = 0;
};

// Appends s as a JSON string literal.
void append_json_string(std::string& out, const std::string& s);

}  // namespace sweepcert
