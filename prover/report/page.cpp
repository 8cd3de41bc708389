#include "report/page.hpp"

#include <nlohmann/json.hpp>

#include "report/draw.hpp"

namespace sweepcert {
namespace {

// Installed before anything else runs, so even a failure while loading is recorded.
const char* const kErrorTrap = R"(<script>
(function () {
  var early = [];
  function note(msg) {
    var box = document.getElementById('script-errors');
    if (!box) { early.push(msg); return; }
    while (early.length) box.textContent += early.shift() + '\n';
    box.textContent += msg + '\n';
  }
  window.onerror = function (msg, src, line, col) { note('error: ' + msg + ' (line ' + line + ':' + col + ')'); };
  window.addEventListener('unhandledrejection', function (e) {
    note('unhandled rejection: ' + (e.reason && e.reason.message ? e.reason.message : String(e.reason)));
  });
  document.addEventListener('DOMContentLoaded', function () { if (early.length) note('(recorded while loading)'); });
})();
</script>
)";

const char* const kPageCss = R"(
body { font: 14px/1.45 system-ui, sans-serif; margin: 0; color: #1d1d1d; background: #fbfaf7; }
header { padding: 14px 22px 6px; border-bottom: 1px solid #ddd6c4; }
h1 { font-size: 21px; margin: 0 0 6px; }
h2 { font-size: 14px; margin: 14px 0 4px; }
.claim { font-size: 15px; margin: 4px 0; padding: 6px 10px; border-left: 5px solid #2e5d8f; background: #eef2f7; }
.claim.evasion { border-color: #d8472a; background: #fbeeea; }
.meta { color: #555; margin: 3px 0; }
main { display: flex; gap: 18px; padding: 12px 22px; align-items: flex-start; }
.stage { flex: 3; min-width: 0; }
aside { flex: 1.3; min-width: 260px; max-width: 440px; }
#scene { width: 100%; max-height: 62vh; background: #ffffff; border: 1px solid #ddd6c4; }
.controls { display: flex; gap: 10px; align-items: center; margin: 8px 0 2px; }
#slider { flex: 1; }
#clock { font-variant-numeric: tabular-nums; min-width: 110px; }
#timeline { width: 100%; height: auto; }
#status { color: #333; margin: 4px 0; font-variant-numeric: tabular-nums; }
.legend { list-style: none; padding: 0; margin: 0; }
.legend li { display: flex; gap: 8px; align-items: flex-start; margin: 3px 0; }
.legend svg { flex: none; margin-top: 2px; }
.charts { display: flex; flex-wrap: wrap; gap: 10px; margin-top: 8px; }
figure { margin: 0; flex: 1; min-width: 240px; background: #fff; border: 1px solid #ddd6c4; padding: 6px; }
figcaption { font-weight: 600; }
figure svg { width: 100%; height: auto; max-height: 190px; }
.axis { stroke: #8d8d8d; stroke-width: 1px; }
.label { font-size: 11px; fill: #555; }
#script-errors { color: #a00; margin: 0; padding: 6px 22px; background: #fee; }
#script-errors:empty { display: none; }
)";

const char* const kMainScript = R"(<script>
(function () {
  'use strict';
  var D = JSON.parse(document.getElementById('report-data').textContent);
  var NS = 'http://www.w3.org/2000/svg';
  var t0 = D.horizon[0], t1 = D.horizon[1];
  function el(tag, attrs, parent) {
    var e = document.createElementNS(NS, tag);
    for (var k in attrs) e.setAttribute(k, attrs[k]);
    if (parent) parent.appendChild(e);
    return e;
  }
  function clamp(t) { return Math.min(t1, Math.max(t0, t)); }
  function num(v) { return Math.abs(v) >= 1000 ? v.toFixed(0) : String(+v.toPrecision(4)); }
  // Index of the last row whose time is <= t (rows sorted by time), or -1.
  function before(times, t) {
    var lo = -1, hi = times.length;
    while (hi - lo > 1) { var m = (lo + hi) >> 1; if (times[m] <= t) lo = m; else hi = m; }
    return lo;
  }
  // A track of [t, x, y] rows: straight between rows, held before the first and after the last.
  function along(rows, t) {
    var k = before(rows.map(function (r) { return r[0]; }), t);
    if (k < 0) return [rows[0][1], rows[0][2]];
    if (k === rows.length - 1) return [rows[k][1], rows[k][2]];
    var a = rows[k], b = rows[k + 1], s = (t - a[0]) / (b[0] - a[0]);
    return [a[1] + s * (b[1] - a[1]), a[2] + s * (b[2] - a[2])];
  }

  var layer = document.getElementById('sensor-layer');
  var disks = D.sensors.map(function (s) {
    return el('circle', {'class': 'sensor', r: s.r, 'data-id': s.id}, layer);
  });
  var intruder = document.getElementById('intruder');
  var liveLayer = document.getElementById('live-layer');
  var slabs = D.chambers ? D.chambers.slabs : [];
  var slabStarts = slabs.map(function (s) { return s.t[0]; });
  function slabAt(t) {  // [a, b); the last slab also holds its end
    var j = before(slabStarts, t);
    if (j < 0 || t > slabs[slabs.length - 1].t[1]) return -1;
    return j;
  }
  var shown = -2;
  function showSlab(j) {
    if (j === shown) return;
    shown = j;
    while (liveLayer.firstChild) liveLayer.removeChild(liveLayer.firstChild);
    if (j < 0) return;
    var r = slabs[j].rects, frag = document.createDocumentFragment();
    for (var i = 0; i < r.length; i += 4)
      el('rect', {'class': 'live', x: r[i], y: r[i + 1], width: r[i + 2], height: r[i + 3]}, frag);
    liveLayer.appendChild(frag);
  }

  // Charts over the horizon, each with a cursor at t.
  var H = 150, L = 50, R = 12, T = 10, B = 26;
  function scaleX(width) { return function (t) { return L + (t - t0) / (t1 - t0) * (width - L - R); }; }
  function label(svg, x, y, text, anchor) {
    el('text', {'class': 'label', x: x, y: y, 'text-anchor': anchor}, svg).textContent = text;
  }
  function chart(id, cls, pts) {
    var svg = document.getElementById(id);
    if (!svg) return null;
    var W = svg.viewBox.baseVal.width, xOf = scaleX(W), vmax = 0;
    pts.forEach(function (p) { vmax = Math.max(vmax, p[1]); });
    if (!(vmax > 0)) vmax = 1;
    function yOf(v) { return H - B - v / vmax * (H - T - B); }
    el('line', {'class': 'axis', x1: L, y1: H - B, x2: W - R, y2: H - B}, svg);
    el('line', {'class': 'axis', x1: L, y1: T, x2: L, y2: H - B}, svg);
    label(svg, L - 5, yOf(vmax) + 4, num(vmax), 'end');
    label(svg, L - 5, H - B + 4, '0', 'end');
    label(svg, L, H - 8, 't = ' + num(t0), 'start');
    label(svg, W - R, H - 8, 't = ' + num(t1), 'end');
    el('polyline', {'class': cls, points: pts.map(function (p) {
      return xOf(p[0]).toFixed(2) + ',' + yOf(p[1]).toFixed(2); }).join(' ')}, svg);
    return [el('line', {'class': 'cursor', y1: T, y2: H - B}, svg), xOf];
  }
  function steps(key) {  // a value per slab as a step line
    var pts = [];
    slabs.forEach(function (s) { pts.push([s.t[0], s[key]], [s.t[1], s[key]]); });
    return pts;
  }
  var A = D.area;
  var cursors = [chart('chart-uncovered', 'series', A.t.map(function (t, i) { return [t, A.uncovered[i]]; }))];
  if (slabs.length) {
    cursors.push(chart('chart-live-area', 'series-live', steps('area')));
    cursors.push(chart('chart-live-regions', 'series-regions', steps('regions')));
  }
  var timeline = document.getElementById('timeline'), W = 640, xOf = scaleX(W);
  el('line', {'class': 'axis', x1: L, y1: 14, x2: W - R, y2: 14}, timeline);
  (D.frames || []).forEach(function (f) {
    el('line', {'class': 'frame-tick', x1: xOf(f), y1: 5, x2: xOf(f), y2: 23}, timeline);
  });
  label(timeline, L, 36, 't = ' + num(t0), 'start');
  label(timeline, W - R, 36, 't = ' + num(t1), 'end');
  label(timeline, L - 5, 18, 'time', 'end');
  cursors.push([el('line', {'class': 'cursor', y1: 2, y2: 26}, timeline), xOf]);

  var slider = document.getElementById('slider'), clock = document.getElementById('clock');
  var status = document.getElementById('status');
  var t = t0;
  function render(at) {
    t = clamp(at);
    D.sensors.forEach(function (s, i) {
      var p = along(s.track, t);
      disks[i].setAttribute('cx', p[0]);
      disks[i].setAttribute('cy', p[1]);
    });
    var words = [];
    if (intruder) {
      var q = along(D.route, t);
      intruder.setAttribute('cx', q[0]);
      intruder.setAttribute('cy', q[1]);
      words.push('intruder at (' + num(q[0]) + ', ' + num(q[1]) + ')');
    }
    var k = before(A.t, t), area;
    if (k >= 0 && A.t[k] === t) area = 'uncovered area ' + num(A.uncovered[k]);
    else {
      var k1 = Math.min(k + 1, A.t.length - 1), k0 = Math.max(k, 0);
      var s = A.t[k1] > A.t[k0] ? (t - A.t[k0]) / (A.t[k1] - A.t[k0]) : 0;
      area = 'uncovered area \u2248 ' + num(A.uncovered[k0] + s * (A.uncovered[k1] - A.uncovered[k0])) +
             ' (between samples)';
    }
    words.push(area + ' of ' + num(A.region_area));
    if (slabs.length) {
      var j = slabAt(t);
      showSlab(j);
      if (j < 0) words.push(t < slabs[0].t[0] ? 'before the first slab' : 'after the last slab: live set empty');
      else words.push('slab ' + (j + 1) + ' of ' + slabs.length + ' [' + num(slabs[j].t[0]) + ', ' +
                      num(slabs[j].t[1]) + ']: ' + slabs[j].cells + ' live cells in ' + slabs[j].regions +
                      ' region' + (slabs[j].regions === 1 ? '' : 's') + ', live area ' + num(slabs[j].area));
    }
    if (D.frames) words.push(D.frames.length + ' frames, from t = ' + num(D.frames[0]) + ' to ' +
                             num(D.frames[D.frames.length - 1]));
    status.textContent = words.join(' \u00b7 ');
    clock.textContent = 't = ' + t.toFixed(3);
    slider.value = t;
    cursors.forEach(function (c) {
      if (!c) return;
      var x = c[1](t);
      c[0].setAttribute('x1', x);
      c[0].setAttribute('x2', x);
    });
  }

  function fromFragment() {
    var m = /(?:^#|&)t=([^&]+)/.exec(location.hash);
    var v = m ? parseFloat(decodeURIComponent(m[1])) : NaN;
    return isFinite(v) ? v : t0;
  }
  var playing = false, last = 0, button = document.getElementById('play');
  function tick(now) {
    if (!playing) return;
    var next = t + (now - last) / 1000 * (t1 - t0) / 20;  // the whole horizon in 20 s
    last = now;
    if (next >= t1) { playing = false; button.textContent = 'Play'; }
    render(next);
    if (playing) requestAnimationFrame(tick);
  }
  button.addEventListener('click', function () {
    playing = !playing;
    button.textContent = playing ? 'Pause' : 'Play';
    if (!playing) return;
    if (t >= t1) t = t0;
    last = performance.now();
    requestAnimationFrame(tick);
  });
  slider.addEventListener('input', function () { render(parseFloat(slider.value)); });
  window.addEventListener('hashchange', function () { render(fromFragment()); });
  render(fromFragment());
  document.body.dataset.ready = '1';
})();
</script>
)";

double r7(double v) { return std::stod(fmt(v)); }

nlohmann::json data_of(const Scene& s) {
  using nlohmann::json;
  json d = {{"title", s.title}, {"method", s.cert->method}, {"claim", s.cert->claim},
            {"horizon", {s.t0, s.t1}}};
  json sensors = json::array();
  for (const MobileTrack& m : s.mobile) {
    json track = json::array();
    for (const auto& w : m.track) track.push_back({r7(w[0]), r7(w[1]), r7(w[2])});
    sensors.push_back({{"id", m.id}, {"r", r7(m.r)}, {"track", track}});
  }
  d["sensors"] = sensors;
  json exact = json::array();
  for (const Rational& t : s.sample_times) exact.push_back(to_text(t));
  std::vector<double> times;
  for (const Rational& t : s.sample_times) times.push_back(approx(t));
  d["area"] = {{"t_exact", exact}, {"t", times}, {"uncovered", s.uncovered},
               {"region_area", s.region_area}, {"tolerance_rel", kAreaRelTolerance},
               {"tolerance", kAreaRelTolerance * s.region_area}};
  if (!s.frames.empty()) d["frames"] = s.frames;
  if (!s.route.empty()) {
    json route = json::array();
    for (const auto& r : s.route) route.push_back({r[0], r[1], r[2]});
    d["route"] = route;
  }
  if (s.cert->method == "chambers") {
    json slabs = json::array();
    for (const SlabPicture& p : s.slabs)
      slabs.push_back({{"t", {p.a, p.b}}, {"cells", p.cells}, {"regions", p.regions},
                       {"area", r7(p.area)}, {"rects", p.rects}});
    d["chambers"] = {{"square", {s.qx, s.qy, s.qside}}, {"grid", 1 << s.grid_log2}, {"slabs", slabs}};
  }
  return d;
}

}  // namespace

std::string html_page(const Scene& s) {
  const View v = scene_view(s);
  std::string data = data_of(s).dump(-1, ' ', false, nlohmann::json::error_handler_t::replace);
  for (std::size_t p = data.find("</"); p != std::string::npos; p = data.find("</", p + 3))
    data.replace(p, 2, "<\\/");  // the block must not close its own script element
  const std::string title = html_escape(s.title);
  const bool chambers = s.cert->method == "chambers";

  std::string h = "<!DOCTYPE html>\n<html lang=\"en\"><head><meta charset=\"utf-8\">\n"
                  "<meta name=\"viewport\" content=\"width=device-width, initial-scale=1\">\n"
                  "<title>Sweep report: " + title + "</title>\n";
  h += kErrorTrap;
  h += std::string("<style>") + kSceneCss + kPageCss + "</style>\n</head>\n<body>\n";
  h += "<pre id=\"script-errors\"></pre>\n<header>\n<h1>Sweep report: " + title + "</h1>\n";
  h += "<p class=\"claim " + s.cert->claim + "\"><strong>" + html_escape(s.headline) + ".</strong> " +
       html_escape(s.claim_words) + "</p>\n";
  h += "<p class=\"meta\">Certificate: claim <code>" + html_escape(s.cert->claim) + "</code>, method <code>" +
       html_escape(s.cert->method) + "</code>." +
       (s.prover_note.empty() ? "" : " Prover's summary: " + html_escape(s.prover_note) + ".") + "</p>\n";
  h += "<p class=\"meta\">This page displays the certificate; it does not check it. "
       "<code>sweepcheck INPUT CERT</code> verifies it independently.</p>\n</header>\n";

  h += "<main>\n<section class=\"stage\">\n<svg id=\"scene\" xmlns=\"http://www.w3.org/2000/svg\" viewBox=\"" +
       v.viewbox() + "\">\n<g transform=\"scale(1,-1)\">\n" + static_layer(s);
  if (chambers)
    h += "<g clip-path=\"url(#region-clip)\"><g id=\"live-layer\" transform=\"translate(" + fmt(s.qx) + "," +
         fmt(s.qy) + ") scale(" + fmt(s.qside / double(1 << s.grid_log2)) + ")\"></g></g>\n";
  h += route_layer(s) + "<g id=\"sensor-layer\"></g>\n";
  if (!s.route.empty()) h += "<circle class=\"intruder\" id=\"intruder\" r=\"" + fmt(v.marker()) + "\"/>\n";
  h += "</g>\n</svg>\n";
  h += "<div class=\"controls\"><button id=\"play\" type=\"button\">Play</button>"
       "<input type=\"range\" id=\"slider\" min=\"" + fmt(s.t0) + "\" max=\"" + fmt(s.t1) +
       "\" step=\"any\" value=\"" + fmt(s.t0) + "\"><span id=\"clock\"></span></div>\n";
  h += "<svg id=\"timeline\" viewBox=\"0 0 640 40\"></svg>\n<p id=\"status\"></p>\n";
  h += "<div class=\"charts\">\n<figure><figcaption>Uncovered area inside P</figcaption>"
       "<svg id=\"chart-uncovered\" viewBox=\"0 0 400 150\"></svg></figure>\n";
  if (chambers)
    h += "<figure><figcaption>Live area</figcaption><svg id=\"chart-live-area\" viewBox=\"0 0 400 150\"></svg></figure>\n"
         "<figure><figcaption>Live regions</figcaption><svg id=\"chart-live-regions\" viewBox=\"0 0 400 150\"></svg></figure>\n";
  h += "</div>\n</section>\n";

  h += "<aside>\n<h2>Legend</h2>\n<ul class=\"legend\">\n";
  for (const LegendItem& it : legend(s))
    h += "<li><svg width=\"22\" height=\"14\">" + swatch(it, 0, 0) + "</svg><span>" + html_escape(it.text) +
         "</span></li>\n";
  if (chambers)
    h += "<li><svg width=\"22\" height=\"14\"><polyline class=\"series-live swatch\" points=\"1,10 21,4\"/></svg>"
         "<span>Live area (area of the live cells) per slab</span></li>\n"
         "<li><svg width=\"22\" height=\"14\"><polyline class=\"series-regions swatch\" points=\"1,10 21,4\"/></svg>"
         "<span>Live regions (connected components of the live cells under touching) per slab</span></li>\n";
  h += "<li><svg width=\"22\" height=\"14\"><polyline class=\"series swatch\" points=\"1,10 21,4\"/></svg>"
       "<span>Uncovered area: area inside P covered by no disk</span></li>\n</ul>\n";
  h += "<h2>What this certificate covers</h2>\n<p>" + html_escape(kScopeCovers) + "</p>\n";
  h += "<h2>What it does not cover</h2>\n<p>" + html_escape(kScopeExcludes) + "</p>\n";
  h += "<h2>About the numbers</h2>\n<p>Area of P: " + fmt(s.region_area) + ". The uncovered area is computed at " +
       std::to_string(s.sample_times.size()) + " sample times (" + std::to_string(kAreaSteps + 1) +
       " even steps over the horizon plus every waypoint time inside it) by Green's theorem on the boundary "
       "of the uncovered part (pieces of fence-polygon edges and circular arcs), in double precision; "
       "tolerance " + fmt(kAreaRelTolerance) + " \u00d7 area(P) = " + fmt(kAreaRelTolerance * s.region_area) +
       " per sample. The chart joins samples by straight lines.";
  if (chambers)
    h += " Live cells, regions and areas are computed on the certificate's cells exactly as schema \u00a74.5 "
         "defines live sets; only the drawing uses a " + std::to_string(1 << s.grid_log2) + " \u00d7 " +
         std::to_string(1 << s.grid_log2) + " grid.";
  h += " Positions on this page are drawn in floating point; the certificate itself is exact.</p>\n</aside>\n</main>\n";

  h += "<script type=\"application/json\" id=\"report-data\">" + data + "</script>\n";
  h += kMainScript;
  h += "</body>\n</html>\n";
  return h;
}

}  // namespace sweepcert
