// Deciding whether a separating sheet exists, and producing the sheet or the cocycle.
//
// A sheet over a field exists iff the fence loop L_0 is a boundary in the stack complex (the
// fence cylinder's cycles are multiples of L_0 up to boundaries of fence prisms). We eliminate
// the boundary matrix in time order and reduce L_0 after each frame: the first frame at which
// it vanishes is the earliest frame by which a sheet closes. Otherwise the reduced matrix
// yields a cochain φ vanishing on every boundary with φ(L_0) ≠ 0.
// Over Z we eliminate over F_p (p = 2^61 - 1), lift by rational reconstruction, clear
// denominators, and verify the integer result exactly; a lift that fails verification is an
// error, never a certificate.
#pragma once
#include <functional>
#include <string>
#include <vector>

#include "exact/number.hpp"
#include "sheet/boundary.hpp"
#include "stack/stack.hpp"

namespace sweepcert {

enum class Ring { Z, Z2 };
inline const char* ring_name(Ring r) { return r == Ring::Z ? "z" : "z2"; }

struct SheetCell {
  TwoCell cell;
  Integer coef;
};
struct CochainValue {
  OneCell cell;
  Integer value;
};

struct SheetOutcome {
  bool sheet = false;
  std::uint32_t last_frame = 0;  // sheet: the frame by which it closes; cocycle: the last frame
  Integer winding;               // sheet
  std::vector<SheetCell> cells;  // sheet
  Integer fence_value;           // cocycle: φ(L_0)
  std::vector<CochainValue> cochain;
  // Statistics.
  std::size_t columns = 0, rows = 0;
  std::uint64_t additions = 0, reduced_entries = 0;
};

// Progress: (columns done, columns in all), called now and then.
using Progress = std::function<void(std::size_t, std::size_t)>;

// Throws std::runtime_error if the integer lift cannot be verified.
SheetOutcome solve_sheet(const Stack& stack, Ring ring, const Progress& progress = {});

}  // namespace sweepcert
