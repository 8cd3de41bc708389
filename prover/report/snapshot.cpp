#include "report/snapshot.hpp"

#include <algorithm>

#include "report/draw.hpp"

namespace sweepcert {
namespace {

// Route position at t, exactly (straight between rows).
Point route_at(const CertView& c, const Rational& t) {
  const auto& r = c.route;
  if (t <= r.front()[0]) return {r.front()[1], r.front()[2]};
  for (std::size_t k = 0; k + 1 < r.size(); ++k)
    if (t <= r[k + 1][0]) {
      Rational s = (t - r[k][0]) / (r[k + 1][0] - r[k][0]);
      return {r[k][1] + s * (r[k + 1][1] - r[k][1]), r[k][2] + s * (r[k + 1][2] - r[k][2])};
    }
  return {r.back()[1], r.back()[2]};
}

// Greedy line breaking for SVG text, which does not wrap by itself.
std::vector<std::string> wrap(const std::string& text, std::size_t width) {
  std::vector<std::string> lines{""};
  std::size_t p = 0;
  while (p < text.size()) {
    std::size_t q = text.find(' ', p);
    if (q == std::string::npos) q = text.size();
    std::string word = text.substr(p, q - p);
    if (!lines.back().empty() && lines.back().size() + 1 + word.size() > width) lines.push_back("");
    lines.back() += (lines.back().empty() ? "" : " ") + word;
    p = q + 1;
  }
  return lines;
}

}  // namespace

std::string svg_snapshot(const Scene& s, const Sweep& sweep, const Rational& t) {
  const View v = scene_view(s);
  const double W = 900, SH = W * v.h / v.w;  // scene area in px, aspect kept
  std::vector<std::string> claim = wrap(s.headline + ". " + s.claim_words, 130);
  for (const std::string& line : wrap(kScopeShort, 130)) claim.push_back(line);
  std::vector<LegendItem> items = legend(s);
  items.erase(std::remove_if(items.begin(), items.end(), [](const LegendItem& i) { return i.cls == "cursor" || i.cls == "frame-tick"; }),
              items.end());
  const double top = 40, claim_y = top + SH + 24, legend_y = claim_y + 18 * claim.size() + 8;
  const double H = legend_y + 20 * items.size() + 16;

  std::string o = "<?xml version=\"1.0\" encoding=\"UTF-8\"?>\n<svg xmlns=\"http://www.w3.org/2000/svg\" width=\"" +
                  fmt(W + 20) + "\" height=\"" + fmt(H) + "\" viewBox=\"0 0 " + fmt(W + 20) + " " + fmt(H) +
                  "\" font-family=\"sans-serif\" font-size=\"13\">\n<style>" + kSceneCss + "</style>\n";
  o += "<rect width=\"100%\" height=\"100%\" fill=\"#ffffff\"/>\n";
  o += "<text class=\"caption\" x=\"10\" y=\"26\" font-size=\"17\" font-weight=\"bold\">" + html_escape(s.title) +
       " \u2014 t = " + html_escape(to_text(t)) + "</text>\n";
  o += "<svg x=\"10\" y=\"" + fmt(top) + "\" width=\"" + fmt(W) + "\" height=\"" + fmt(SH) + "\" viewBox=\"" +
       v.viewbox() + "\">\n<g transform=\"scale(1,-1)\">\n" + static_layer(s);
  if (int j = s.cert->method == "chambers" ? slab_at(*s.cert, t) : -1; j >= 0) {
    o += "<g clip-path=\"url(#region-clip)\"><g transform=\"translate(" + fmt(s.qx) + "," + fmt(s.qy) + ") scale(" +
         fmt(s.qside / double(1 << s.grid_log2)) + ")\">";
    const std::vector<int>& r = s.slabs[j].rects;
    for (std::size_t i = 0; i < r.size(); i += 4)
      o += "<rect class=\"live\" x=\"" + std::to_string(r[i]) + "\" y=\"" + std::to_string(r[i + 1]) +
           "\" width=\"" + std::to_string(r[i + 2]) + "\" height=\"" + std::to_string(r[i + 3]) + "\"/>";
    o += "</g></g>\n";
  }
  o += route_layer(s);
  std::vector<Circle> disks = disks_at(sweep, t);
  for (std::size_t i = sweep.fence_count; i < disks.size(); ++i)
    o += "<circle class=\"sensor\" cx=\"" + fmt(disks[i].c.x) + "\" cy=\"" + fmt(disks[i].c.y) + "\" r=\"" +
         fmt(disks[i].r) + "\"/>";
  o += "\n";
  if (!s.cert->route.empty()) {
    Point p = route_at(*s.cert, t);
    o += "<circle class=\"intruder\" cx=\"" + fmt(approx(p.x)) + "\" cy=\"" + fmt(approx(p.y)) + "\" r=\"" +
         fmt(v.marker()) + "\"/>\n";
  }
  o += "</g>\n</svg>\n";
  for (std::size_t i = 0; i < claim.size(); ++i)
    o += "<text class=\"caption\" x=\"10\" y=\"" + fmt(claim_y + 18 * i) + "\">" + html_escape(claim[i]) + "</text>\n";
  for (std::size_t i = 0; i < items.size(); ++i) {
    double y = legend_y + 20 * i;
    o += "<g class=\"legend-item\">" + swatch(items[i], 10, y) + "<text x=\"40\" y=\"" + fmt(y + 11) + "\">" +
         html_escape(items[i].text) + "</text></g>\n";
  }
  return o + "</svg>\n";
}

}  // namespace sweepcert
