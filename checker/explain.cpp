#include "explain.hpp"

namespace sweepcheck {
namespace {

std::string ring_words(Ring r) { return r == Ring::Z ? "z (the integers)" : "z2 (the integers mod 2)"; }

bool positional(const Input& in) { return in.kind == InputKind::Scenario; }

void claim(const Account& a, std::ostream& out) {
  const Certificate* c = a.cert;
  const Input& in = a.input;
  out << "What is claimed\n";
  if (!c) {
    out << "  nothing established: the certificate's header (format, claim, method, keys, hash, input format,\n"
           "  margin) was rejected; see the last line.\n";
    return;
  }
  const std::string span = c->frames.empty() ? std::string()
                                             : "[" + to_text(c->frames.front()) + ", " + to_text(c->frames.back()) + "]";
  out << "  claim: " << c->claim << ", by the method \"" << c->method << "\"";
  if (c->method == "sheet" || c->method == "cocycle") out << " over the ring " << ring_words(c->ring);
  out << ".\n";
  if (c->claim == "no-evasion") {
    out << "  In words, it asserts: nobody can move continuously inside the fenced area from the start to the\n"
           "  end of the time covered while staying outside every sensor's disk at every moment";
    if (c->method == "sheet" && positional(in))
      out << " (covered: the frames " << span << ", hence the whole horizon)";
    else if (c->method == "sheet")
      out << " (covered: the log frames " << span << ")";
    else
      out << " (covered: the slabs, see the last line, hence the whole horizon)";
    out << ".\n";
  } else if (c->claim == "no-sheet") {
    out << "  In words, it asserts: the coverage recorded on the " << c->frames.size() << " frames " << span
        << " cannot be assembled into a sheet over this ring.\n"
           "  This is not a statement that an intruder can evade: only that this kind of proof is impossible on\n"
           "  these frames. An evasion path may or may not exist.\n";
  } else {
    out << "  In words, it asserts: an evasion path exists; the route in the certificate starts strictly inside\n"
           "  the fence polygon and stays strictly outside every sensor's disk over the whole horizon ["
        << to_text(in.horizon_start) << ", " << to_text(in.horizon_end) << "].\n"
           "  The sweep does not guarantee detection.\n";
  }
  if (c->method == "sheet")
    out << "  How: a sheet, a chain of covered triangles and prisms in space-time whose boundary runs around the\n"
           "  fence; any intruder's path through time would have to cross it, inside a sensor's disk.\n";
  else if (c->method == "cocycle")
    out << "  How: a cocycle, integer labels on contacts that sum to zero around every covered triangle and prism\n"
           "  but not around the fence loop, which no sheet could allow.\n";
  else if (c->method == "chambers")
    out << "  How: time-ordered chambers: each slab of time is tiled by square cells marked covered, outside or\n"
           "  open; the open cells an intruder could still be in die out slab by slab.\n";
  else
    out << "  How: the route itself, an intruder's path given row by row, checked exactly against every disk.\n";

  const std::string m = to_text(c->margin);
  if (c->method == "cocycle")
    out << "  margin: not applicable (a cocycle certificate carries none).\n";
  else if (!positional(in))
    out << "  margin: not applicable to a contact log (it has no positions); contacts are taken as logged.\n";
  else if (c->margin == 0)
    out << "  margin: 0. Positions and radii are taken exactly as stated: the result gives no protection against\n"
           "  any error in where the sensors were.\n";
  else if (c->claim == "no-evasion")
    out << "  margin: " << m << ". Checked with every radius shrunk to r - " << m << ", so the conclusion still holds\n"
        << "  if each sensor's true centre is anywhere within " << m << " of its stated centre at every moment (the\n"
        << "  shrunk disk then lies inside the true one).\n";
  else
    out << "  margin: " << m << ". Checked with every radius grown to r + " << m << ", so the route keeps clear of\n"
        << "  every true disk even if each sensor's true centre is anywhere within " << m << " of its stated centre.\n";
}

void input(const Account& a, std::ostream& out) {
  const Input& in = a.input;
  out << "About which input\n"
      << "  file: " << a.input_name << " (" << a.input_bytes << " bytes)\n"
      << "  title: " << (in.title.empty() ? "(none)" : "\"" + in.title + "\"") << "\n"
      << "  format: " << in.format << "\n"
      << "  SHA-256: " << a.sha256 << "\n"
      << "  sensors: " << in.fence.size() << " fence, " << in.vertex_count() - in.fence.size() << " mobile\n";
  if (positional(in))
    out << "  horizon: [" << to_text(in.horizon_start) << ", " << to_text(in.horizon_end) << "]\n";
  else
    out << "  log frames: " << in.times.size() << ", t=" << to_text(in.times.front()) << ".."
        << to_text(in.times.back()) << "\n";
}

void assumptions(const Account& a, std::ostream& out) {
  const Input& in = a.input;
  out << "Under which assumptions\n";
  if (positional(in)) {
    out << "  - each sensor detects everything in the closed disk of its stated radius around its centre\n"
           "    (the radius adjusted by the margin, if any);\n"
           "  - each mobile sensor moves in a straight line at constant speed between consecutive waypoints and\n"
           "    stands still before its first and after its last waypoint; fence sensors stand still;\n"
           "  - the guarded area is the polygon through the fence centres in the listed order; consecutive\n"
           "    fence disks overlap, so nobody crosses the fence unseen;\n";
  } else {
    out << "  - the log is a true record: at each logged time the listed pairs of sensors are in contact, and ";
    if (in.listed)
      out << "the\n    listed triples share a covered point;\n";
    else
      out << "any\n    three sensors pairwise in contact share a covered point (3 R_s^2 >= R_c^2, Jung's theorem);\n";
    out << "  - a contact or triple present at two consecutive frames holds throughout the time between them\n"
           "    (an assumption, not checked: it holds for linear motion);\n"
           "  - the fence ids, in the listed cyclic order, are in contact at every frame and enclose the guarded area;\n";
  }
  out << "  - an intruder is a point that moves continuously, at any speed.\n"
         "  Not covered: sensor faults or blind spots, occlusion, wrong positions (beyond the margin,\n"
         "  if any), wrong tracks or logs, tampering.\n"
         "  The certificate proves a statement about this model; whether the model matches the site is a matter\n"
         "  for site-specific security practice.\n";
}

void checks(const Account& a, std::ostream& out) {
  const Input& in = a.input;
  const Tally& t = a.tally;
  const Certificate* c = a.cert;
  out << "Which checks ran (items verified";
  if (!a.accepted) out << "; the check stopped at the failing item named on the last line";
  out << ")\n";
  if (positional(in))
    out << "  input (§2): " << in.vertex_count() << " sensors valid; " << in.fence.size()
        << " fence links (consecutive fence disks meet); fence polygon simple\n";
  else
    out << "  input (§2): " << in.times.size() << " frames, " << in.frame_pairs.size() << " pair listings, "
        << in.frame_triples.size() << " triple listings valid; " << in.fence.size() << " fence links in every frame\n";
  if (!t.header) return;
  out << "  hash binding: 1 file (" << a.input_bytes << " bytes) has the SHA-256 the certificate names\n";
  if (!c) return;
  if (t.radii_adjusted > 0) {
    out << "  margin: " << t.radii_adjusted << " radii " << (c->claim == "evasion" ? "grown" : "shrunk") << " by "
        << to_text(c->margin);
    if (c->claim == "no-evasion") out << " and found > 0; " << t.fence_links_rechecked << " fence links re-checked";
    out << "\n";
  }
  if (c->method == "sheet" || c->method == "cocycle") {
    if (t.frames_checked == 0) return;
    if (positional(in))
      out << "  frames: " << t.frames_checked << " checked within the horizon; " << t.waypoints_checked
          << " waypoint times between the first and last frame found among them\n";
    else
      out << "  frames: " << t.frames_checked << " matched to log frames " << c->log_start << ".."
          << c->log_start + t.frames_checked - 1 << "\n";
  }
  if (c->method == "sheet") {
    out << "  cells exist: " << t.triangles << " triangles (";
    if (positional(in))
      out << "exact witness for " << t.witnesses << " triples";
    else
      out << (in.listed ? "listed triples of the log" : "three pairwise contacts in the log");
    out << "), " << t.prisms << " prisms (edge present at both ends: " << t.prism_end_tests << " tests)\n";
    if (t.cells_distinct) out << "  distinct cells, nonzero coefficients: " << t.triangles + t.prisms << " rows\n";
    if (t.on_cylinder)
      out << "  boundary: " << t.faces_summed << " faces summed into " << t.boundary_cells << " cells; the "
          << t.cylinder_cells << " nonzero ones all lie on the fence cylinder\n";
    if (t.fence_edges_wound == in.fence.size())
      out << "  winding: winding number " << c->members.need("winding").text() << " along each of the "
          << t.fence_edges_wound << " fence edges (the boundary goes around the fence loop)\n";
  } else if (c->method == "cocycle") {
    out << "  cochain: " << t.edge_values << " edge values, " << t.vertical_values
        << " vertical values, each on a cell that exists\n";
    if (t.coboundary_zero)
      out << "  coboundary: zero on " << t.cocycle_triangles << " triangles and " << t.cocycle_prisms
          << " prisms (every 2-cell touching a labelled cell, enumerated from the input)\n";
    if (t.fence_loop)
      out << "  fence loop: the labels sum to " << c->members.need("fence_value").text() << " != 0 over the "
          << in.fence.size() << " fence edges\n";
  } else if (c->method == "chambers") {
    out << "  square: holds " << t.fence_in_square << " fence centres; sensor table: " << t.table
        << " ids; slabs: " << t.slabs << " consecutive within the horizon\n";
    if (t.slab_times) {
      out << "  cells: " << t.cells << " in " << t.slabs_done << " slabs\n"
          << "  covered cells: " << t.covered << " checked over " << t.slabs_done << " slabs (" << t.corner_tests
          << " exact corner-in-disk tests)\n"
          << "  outside cells: " << t.outside << " checked (" << t.outside_boxes
          << " distinct boxes tested against the fence polygon)\n"
          << "  open cells: " << t.open << "; live set: " << t.live_cells << " live cells over the slabs, at most "
          << t.live_peak << " in one";
      if (t.live_empty) out << ", empty from slab " << t.empty_from;
      out << "\n";
    }
  } else {
    out << "  route: " << t.route_rows << " rows";
    if (t.route_starts_inside) out << "; the start lies strictly inside the fence polygon";
    out << "\n";
    if (t.route_starts_inside)
      out << "  clearance: " << t.pieces_exact << " pieces checked exactly, " << t.pieces_filtered
          << " cleared by integer bounding boxes (farther apart than the radius); " << t.route_sensors << " of " << in.vertex_count()
          << " sensors kept clear on every piece\n";
  }
}

}  // namespace

void explain(const Account& a, std::ostream& out) {
  out << "== sweepcheck --explain: an account for an auditor ==\n";
  claim(a, out);
  input(a, out);
  assumptions(a, out);
  checks(a, out);
  out << "== findings follow; the last line gives the verdict ==\n";
}

}  // namespace sweepcheck
