#include "cert/emit.hpp"

namespace sweepcert {

void emit_certificate(const Stack& stack, const SheetOutcome& o, const CertificateHeader& header,
                      CertificateSink& sink) {
  const auto& id = stack.ids;
  sink.begin(header);
  if (o.sheet) {
    sink.winding(o.winding);
    for (const auto& c : o.cells) {
      if (c.cell.kind != TwoCell::Triangle) continue;
      const auto& cells = stack.frames[c.cell.frame];
      const Triple& t = cells.triangles[c.cell.index];
      const Point* w = stack.positional ? &cells.witnesses[c.cell.index] : nullptr;
      sink.triangle(c.cell.frame, id[t[0]], id[t[1]], id[t[2]], c.coef, w);
    }
    for (const auto& c : o.cells) {
      if (c.cell.kind != TwoCell::Prism) continue;
      const Pair& p = stack.frames[c.cell.frame].edges[c.cell.index];
      sink.prism(c.cell.frame, id[p.first], id[p.second], c.coef);
    }
  } else {
    sink.fence_value(o.fence_value);
    for (const auto& v : o.cochain) {
      if (v.cell.kind != OneCell::Edge) continue;
      const Pair& p = stack.frames[v.cell.frame].edges[v.cell.index];
      sink.edge_value(v.cell.frame, id[p.first], id[p.second], v.value);
    }
    for (const auto& v : o.cochain)
      if (v.cell.kind == OneCell::Vertical) sink.vertical_value(v.cell.frame, id[v.cell.index], v.value);
  }
  sink.end();
}

void emit_chambers(const Sweep& sweep, const ChamberResult& r, const CertificateHeader& header,
                   CertificateSink& sink) {
  // The sensor table lists the sensors that cover some cell, in first-use order.
  std::vector<int> table_index(sweep.sensors.size(), -1);
  std::vector<std::string> table;
  for (const auto& slab : r.slabs)
    slab.tree.preorder([&](const Cell& c) {
      if (c.kind == CellKind::Covered && table_index[c.sensor] < 0) {
        table_index[c.sensor] = static_cast<int>(table.size());
        table.push_back(sweep.sensors[c.sensor].id);
      }
    });
  sink.begin(header);
  sink.chamber_square(Rational(r.square.x0), Rational(r.square.y0), Rational(r.square.side), table);
  std::vector<int> tokens;
  for (const auto& slab : r.slabs) {
    tokens.clear();
    slab.tree.preorder([&](const Cell& c) {
      switch (c.kind) {
        case CellKind::Split: tokens.push_back(-1); break;
        case CellKind::Open: tokens.push_back(-2); break;
        case CellKind::Outside: tokens.push_back(-3); break;
        case CellKind::Covered: tokens.push_back(table_index[c.sensor]); break;
      }
    });
    sink.chamber_slab(slab.a, slab.b, tokens);
  }
  sink.end();
}

void emit_route(const ChamberResult& r, const CertificateHeader& header, CertificateSink& sink) {
  sink.begin(header);
  for (const auto& p : r.route) sink.route_point(p[0], p[1], p[2]);
  sink.end();
}

}  // namespace sweepcert
