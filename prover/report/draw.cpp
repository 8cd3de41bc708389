#include "report/draw.hpp"

#include <algorithm>
#include <cstdio>

namespace sweepcert {

const char* const kSceneCss = R"(
.region { fill: #f5efdc; stroke: #8a7a52; stroke-width: 1.5px; vector-effect: non-scaling-stroke; }
.fence { fill: #4e6a8c; fill-opacity: 0.30; stroke: #2f4a6b; stroke-width: 1px; vector-effect: non-scaling-stroke; }
.sensor { fill: #1d9a86; fill-opacity: 0.38; stroke: #0f6b5c; stroke-width: 1.2px; vector-effect: non-scaling-stroke; }
.live { fill: #d8472a; fill-opacity: 0.55; stroke: none; shape-rendering: crispEdges; }
.route { fill: none; stroke: #6f45a8; stroke-width: 2px; stroke-dasharray: 6 4; vector-effect: non-scaling-stroke; }
.intruder { fill: #ffcc29; stroke: #151515; stroke-width: 2.5px; vector-effect: non-scaling-stroke; }
.frame-tick { stroke: #6f45a8; stroke-width: 1.5px; }
.cursor { stroke: #151515; stroke-width: 1.5px; }
.series { fill: none; stroke: #2e5d8f; stroke-width: 1.6px; }
.series-live { fill: none; stroke: #d8472a; stroke-width: 1.6px; }
.series-regions { fill: none; stroke: #8b5a24; stroke-width: 1.6px; }
)";

const char* const kScopeCovers =
    "The model as given: closed disks of the stated radii, the fence disks as listed (the "
    "protected region is the polygon through their centres), and the sensor tracks as given "
    "(straight between waypoints, held still before the first and after the last).";
const char* const kScopeExcludes =
    "Sensor faults or outages, occlusion and blind spots, positions or tracks that were logged "
    "wrongly, intruders that can pass through a sensing disk, and anything outside the horizon. "
    "Such matters belong to site-specific security practice; this report does not replace it.";

const char* const kScopeShort =
    "Covers the model as given (disks, fence, tracks); not sensor faults, occlusion or wrong logs. "
    "Follow site-specific security practice.";

std::string html_escape(std::string_view text) {
  std::string out;
  for (char c : text) {
    switch (c) {
      case '&': out += "&amp;"; break;
      case '<': out += "&lt;"; break;
      case '>': out += "&gt;"; break;
      case '"': out += "&quot;"; break;
      default: out += c;
    }
  }
  return out;
}

std::string fmt(double v) {
  char buf[32];
  std::snprintf(buf, sizeof buf, "%.7g", v);
  return buf;
}

std::string View::viewbox() const {
  return fmt(x0) + " " + fmt(-(y0 + h)) + " " + fmt(w) + " " + fmt(h);
}

double View::marker() const { return 0.012 * std::max(w, h); }

View scene_view(const Scene& s) {
  double x0 = 1e300, y0 = 1e300, x1 = -1e300, y1 = -1e300;
  auto take = [&](double x, double y, double r) {
    x0 = std::min(x0, x - r), x1 = std::max(x1, x + r);
    y0 = std::min(y0, y - r), y1 = std::max(y1, y + r);
  };
  for (const Circle& c : s.fence) take(c.c.x, c.c.y, c.r);
  for (const MobileTrack& m : s.mobile)
    for (const auto& w : m.track) take(w[1], w[2], m.r);
  double pad = 0.03 * std::max(x1 - x0, y1 - y0);
  return {x0 - pad, y0 - pad, x1 - x0 + 2 * pad, y1 - y0 + 2 * pad};
}

std::string static_layer(const Scene& s) {
  std::string pts;
  for (const Vec2& v : s.region) pts += fmt(v.x) + "," + fmt(v.y) + " ";
  std::string out = "<clipPath id=\"region-clip\"><polygon points=\"" + pts + "\"/></clipPath>\n";
  out += "<polygon class=\"region\" points=\"" + pts + "\"/>\n<g id=\"fence-layer\">";
  for (const Circle& c : s.fence)
    out += "<circle class=\"fence\" cx=\"" + fmt(c.c.x) + "\" cy=\"" + fmt(c.c.y) + "\" r=\"" + fmt(c.r) + "\"/>";
  return out + "</g>\n";
}

std::string route_layer(const Scene& s) {
  if (s.route.empty()) return "";
  std::string out = "<polyline class=\"route\" points=\"";
  for (const auto& r : s.route) out += fmt(r[1]) + "," + fmt(r[2]) + " ";
  return out + "\"/>\n";
}

std::vector<LegendItem> legend(const Scene& s) {
  const std::string& m = s.cert->method;
  std::vector<LegendItem> out = {
      {"region", "area", "Protected region P: inside the polygon through the fence centres"},
      {"fence", "disk", "Fence sensors (fixed disks); consecutive ones overlap, so the fence line is covered"},
      {"sensor", "disk", "Mobile sensors at time t (closed disks of their sensing radius)"}};
  if (m == "chambers") {
    std::string g = std::to_string(1 << s.grid_log2);
    out.push_back({"live", "area",
                   "Live set at t: cells of the current slab where an intruder could still be (drawn on a " +
                       g + " x " + g + " grid of the certificate's square: a pixel is marked when a live "
                       "cell covers it or lies in it; clipped to P)"});
  }
  if (m == "route") {
    out.push_back({"route", "dash", "Intruder route from the certificate (straight between its waypoints)"});
    out.push_back({"intruder", "marker", "Intruder at time t: outside every disk, inside P"});
  }
  if (m == "sheet" || m == "cocycle")
    out.push_back({"frame-tick", "tick", "Frames the certificate uses, marked on the time axis"});
  out.push_back({"cursor", "tick", "Current time t in the time axis and the charts"});
  return out;
}

std::string swatch(const LegendItem& it, double x, double y) {
  const std::string cls = "<" + std::string(it.shape == "area" ? "rect" : it.shape == "dash" ? "polyline"
                                           : it.shape == "tick" ? "line" : "circle") +
                          " class=\"" + it.cls + " swatch\" ";
  const std::string cx = fmt(x + 11), cy = fmt(y + 7);
  if (it.shape == "disk") return cls + "cx=\"" + cx + "\" cy=\"" + cy + "\" r=\"6\"/>";
  if (it.shape == "marker") return cls + "cx=\"" + cx + "\" cy=\"" + cy + "\" r=\"4.5\"/>";
  if (it.shape == "area")
    return cls + "x=\"" + fmt(x + 2) + "\" y=\"" + fmt(y + 2) + "\" width=\"18\" height=\"10\"/>";
  if (it.shape == "dash")
    return cls + "points=\"" + fmt(x + 1) + "," + fmt(y + 11) + " " + fmt(x + 21) + "," + fmt(y + 3) + "\"/>";
  return cls + "x1=\"" + cx + "\" y1=\"" + fmt(y + 1) + "\" x2=\"" + cx + "\" y2=\"" + fmt(y + 13) + "\"/>";
}

}  // namespace sweepcert
