// Walks a solved stack and reports the certificate items to a sink.
#pragma once
#include "cert/sink.hpp"
#include "sheet/solve.hpp"

namespace sweepcert {

// `header.frames` must already hold the frames the certificate names (0..outcome.last_frame).
void emit_certificate(const Stack& stack, const SheetOutcome& outcome,
                      const CertificateHeader& header, CertificateSink& sink);

// A sink that only counts, for summaries and tests.
struct CountingSink : CertificateSink {
  std::size_t triangles = 0, prisms = 0, edges = 0, verticals = 0;
  void begin(const CertificateHeader&) override {}
  void winding(const Integer&) override {}
  void triangle(std::uint32_t, const std::string&, const std::string&, const std::string&,
                const Integer&, const Point*) override { ++triangles; }
  void prism(std::uint32_t, const std::string&, const std::string&, const Integer&) override { ++prisms; }
  void fence_value(const Integer&) override {}
  void edge_value(std::uint32_t, const std::string&, const std::string&, const Integer&) override { ++edges; }
  void vertical_value(std::uint32_t, const std::string&, const Integer&) override { ++verticals; }
  void end() override {}
};

}  // namespace sweepcert
