// Walks a solved stack and reports the certificate items to a sink.
#pragma once
#include "cert/sink.hpp"
#include "chambers/engine.hpp"
#include "sheet/solve.hpp"

namespace sweepcert {

// `header.frames` must already hold the frames the certificate names (0..outcome.last_frame).
void emit_certificate(const Stack& stack, const SheetOutcome& outcome,
                      const CertificateHeader& header, CertificateSink& sink);

// Chamber certificates (schema §4.5) and routes (§4.6).
void emit_chambers(const Sweep& sweep, const ChamberResult& result, const CertificateHeader& header,
                   CertificateSink& sink);
void emit_route(const ChamberResult& result, const CertificateHeader& header, CertificateSink& sink);

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
  std::size_t slabs = 0, cells = 0, route_points = 0;
  void chamber_slab(const Rational&, const Rational&, const std::vector<int>& tree) override {
    ++slabs;
    for (int t : tree) cells += t != -1;
  }
  void route_point(const Rational&, const Rational&, const Rational&) override { ++route_points; }
  void end() override {}
};

}  // namespace sweepcert
