// Everything the page and the snapshot draw, prepared once: the fence and region, the tracks,
// the uncovered-area samples, the certificate's frames, route or live sets, and the words.
// Doubles from here on: this is for display only.
#pragma once
#include <array>
#include <string>
#include <vector>

#include "report/area.hpp"
#include "report/certificate.hpp"
#include "report/live.hpp"

namespace sweepcert {

struct MobileTrack {
  std::string id;
  double r = 0;
  std::vector<std::array<double, 3>> track;  // [t, x, y]
};

struct SlabPicture {
  double a = 0, b = 0;
  std::size_t cells = 0, regions = 0;
  double area = 0;
  std::vector<int> rects;  // [x, y, w, h] in pixels of the square's 2^grid_log2 grid
};

// Uncovered area is sampled at kAreaSteps + 1 even steps over the horizon and at every
// waypoint time inside it.
constexpr int kAreaSteps = 200;
// The live-set pictures of all slabs together hold at most this many rectangles (the pixel grid
// is coarsened until they do), so a large certificate still makes a page of a few MB.
constexpr std::size_t kMaxLiveRects = 100000;
constexpr int kMaxGridLog2 = 9;

struct Scene {
  std::string title, headline, claim_words, prover_note;
  const CertView* cert = nullptr;
  double t0 = 0, t1 = 0;
  std::vector<Vec2> region;    // fence centres in order: the polygon P
  std::vector<Circle> fence;
  std::vector<MobileTrack> mobile;
  double region_area = 0;
  std::vector<Rational> sample_times;
  std::vector<double> uncovered;  // at sample_times
  std::vector<double> frames;     // sheet, cocycle
  std::vector<std::array<double, 3>> route;
  double qx = 0, qy = 0, qside = 0;  // chambers square
  int grid_log2 = 0;
  std::vector<SlabPicture> slabs;
};

Scene build_scene(const Sweep& sweep, const CertView& cert);

// All disks (fence first) at time t, from the exact positions.
std::vector<Circle> disks_at(const Sweep& sweep, const Rational& t);

// The slab whose [a, b) holds t (the last slab also holds its b); -1 if none.
int slab_at(const CertView& cert, const Rational& t);

}  // namespace sweepcert
