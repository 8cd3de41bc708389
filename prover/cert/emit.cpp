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

}  // namespace sweepcert
