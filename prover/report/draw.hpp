// What the page and the snapshot draw alike: one stylesheet for the scene's classes, the view
// box, the static layer (region and fence), the legend and the scope text.
//
// The scene is drawn in model coordinates inside a group flipped by scale(1, -1), so every
// element's cx/cy (or points) are the model's x and y: tests read positions straight off.
// Classes: polygon.region, circle.fence, circle.sensor, rect.live, polyline.route,
// circle.intruder.
#pragma once
#include <string>
#include <string_view>
#include <vector>

#include "report/scene.hpp"

namespace sweepcert {

extern const char* const kSceneCss;
extern const char* const kScopeCovers;
extern const char* const kScopeExcludes;
extern const char* const kScopeShort;  // one line, for the snapshot's caption

std::string html_escape(std::string_view text);
std::string fmt(double v);  // compact decimal for drawing (7 significant digits)

struct View {
  double x0, y0, w, h;            // model box shown, margin included
  std::string viewbox() const;    // for the flipped group: "x0 -(y0+h) w h"
  double marker() const;          // radius of the intruder marker, model units
};
View scene_view(const Scene& s);

// polygon.region, a clipPath #region-clip for live cells, and circle.fence.
std::string static_layer(const Scene& s);
// polyline.route (route certificates; empty otherwise).
std::string route_layer(const Scene& s);

struct LegendItem {
  std::string cls;    // class of the element it explains
  std::string shape;  // "area", "disk", "line", "dash", "marker", "tick"
  std::string text;
};
std::vector<LegendItem> legend(const Scene& s);
// A swatch 22 x 14 px with its top-left corner at (x, y), in plain (unflipped) SVG units. It
// carries the class it explains plus "swatch", so counts of drawn elements can leave it out.
std::string swatch(const LegendItem& item, double x, double y);

}  // namespace sweepcert
