#include "report/certificate.hpp"

#include "io/json_doc.hpp"

namespace sweepcert {
namespace {

long long whole(const Ref& r, const char* what) {
  Rational q = r.number();
  if (q.get_den() != 1 || !q.get_num().fits_slong_p()) r.fail(std::string("expected ") + what);
  return q.get_num().get_si();
}

// Preorder tokens (schema §4.5) into a quadtree: a stack of the nodes still to be filled.
Quadtree decode_tree(const Ref& tree, std::size_t table_size) {
  tree.expect_array(1);
  Quadtree q;
  std::vector<std::uint32_t> todo{0};
  tree.for_each([&](const Ref& tok) {
    if (todo.empty()) tok.fail("the quadtree is already complete; extra token");
    std::uint32_t node = todo.back();
    todo.pop_back();
    long long k = whole(tok, "a quadtree token (an integer)");
    if (k == -1) {
      if (q.at(node).depth >= kReportMaxDepth)
        tok.fail("quadtree deeper than " + std::to_string(kReportMaxDepth) +
                 ", which the report cannot draw");
      std::uint32_t first = q.split(node);
      for (std::uint32_t c = 4; c-- > 0;) todo.push_back(first + c);
    } else if (k == -2) {
      q.at(node).kind = CellKind::Open;
    } else if (k == -3) {
      q.at(node).kind = CellKind::Outside;
    } else if (k >= 0 && static_cast<std::size_t>(k) < table_size) {
      q.at(node).kind = CellKind::Covered;
      q.at(node).sensor = static_cast<std::uint32_t>(k);
    } else {
      tok.fail("token " + std::to_string(k) + " is neither -1, -2, -3 nor a sensor table index");
    }
  });
  if (!todo.empty()) tree.fail("incomplete quadtree: " + std::to_string(todo.size()) + " nodes missing");
  return q;
}

}  // namespace

CertView read_certificate(const std::string& bytes, const Input& input) {
  JsonDoc doc = JsonDoc::parse(bytes);
  Ref root(doc);
  root.expect_object({"format", "claim", "method", "input_sha256", "input_format", "notes", "ring",
                      "frames", "winding", "triangles", "prisms", "fence_value", "edges",
                      "verticals", "square", "sensors", "slabs", "route"},
                     {"format", "claim", "method", "input_sha256", "input_format"});
  Ref format = root.at("format");
  if (format.string() != "sweepcert-certificate-1")
    format.fail("expected \"sweepcert-certificate-1\"");
  CertView v;
  v.claim = std::string(root.at("claim").string());
  v.method = std::string(root.at("method").string());
  const bool known = (v.method == "sheet" && v.claim == "no-evasion") ||
                     (v.method == "cocycle" && v.claim == "no-sheet") ||
                     (v.method == "chambers" && v.claim == "no-evasion") ||
                     (v.method == "route" && v.claim == "evasion");
  if (!known) root.at("method").fail("method \"" + v.method + "\" with claim \"" + v.claim +
                                     "\" is not a certificate kind of schema §4");
  Ref sha = root.at("input_sha256");
  if (sha.string() != input.sha256)
    sha.fail("does not match the SHA-256 of " + input.path + " (" + input.sha256 +
             "): this certificate is for another input");
  Ref fmt = root.at("input_format");
  if (fmt.string() != input.format)
    fmt.fail("is \"" + std::string(fmt.string()) + "\" but " + input.path + " is " + input.format);
  if (auto notes = root.find("notes"); notes && notes->kind() == JKind::Object)
    if (auto s = notes->find("summary"); s && s->kind() == JKind::String)
      v.summary = std::string(s->string());

  if (v.method == "sheet" || v.method == "cocycle") {
    v.ring = std::string(root.at("ring").string());
    Ref frames = root.at("frames");
    frames.expect_array(1);
    frames.for_each([&](const Ref& f) {
      v.frames.push_back(f.number());
      if (v.frames.size() > 1 && v.frames.back() <= v.frames[v.frames.size() - 2])
        f.fail("frames must increase strictly");
    });
    if (v.method == "sheet") v.winding = std::string(root.at("winding").string());
  } else if (v.method == "route") {
    Ref route = root.at("route");
    route.expect_array(2);
    route.for_each([&](const Ref& row) {
      row.expect_array(3, 3);
      v.route.push_back({row.item(0).number(), row.item(1).number(), row.item(2).number()});
      if (v.route.size() > 1 && v.route.back()[0] <= v.route[v.route.size() - 2][0])
        row.item(0).fail("route times must increase strictly");
    });
  } else {
    Ref square = root.at("square");
    square.expect_object({"origin", "side"}, {"origin", "side"});
    Ref origin = square.at("origin");
    origin.expect_array(2, 2);
    v.x0 = origin.item(0).number();
    v.y0 = origin.item(1).number();
    v.side = square.at("side").number();
    if (v.side <= 0) square.at("side").fail("side must be > 0");
    Ref table = root.at("sensors");
    table.expect_array(0);
    table.for_each([&](const Ref& id) { v.table.push_back(id.id()); });
    Ref slabs = root.at("slabs");
    v.slabs.reserve(slabs.expect_array(1));  // slabs hold quadtrees: grow once, never copy
    slabs.for_each([&](const Ref& s) {
      s.expect_object({"t", "tree"}, {"t", "tree"});
      Ref t = s.at("t");
      t.expect_array(2, 2);
      Slab slab;
      slab.a = t.item(0).number();
      slab.b = t.item(1).number();
      if (slab.a >= slab.b) t.fail("a slab must have a < b");
      if (!v.slabs.empty() && slab.a != v.slabs.back().b)
        t.item(0).fail("a slab must start where the previous one ends");
      slab.tree = decode_tree(s.at("tree"), v.table.size());
      v.slabs.push_back(std::move(slab));
    });
  }
  return v;
}

}  // namespace sweepcert
