#pragma once
// The textbook rule of the resultant waves of symmetric m-phase windings with balanced currents.

#include <string>

namespace tf::testing {

/// For electrical order nu: windings of alternating polarity carry no even order ("absent"); of the
/// odd ones nu = 2km + 1 turn forward, nu = 2km - 1 backward, and the rest cancel (the multiples of
/// 3 for m = 3; none for m = 2). J. Pyrhönen, T. Jokinen, V. Hrabovcová, Design of Rotating
/// Electrical Machines, Wiley 2008, ch. 2 (the m-phase resultant MMF; equation number not
/// recalled); docs/references.md §3. Derived too: the phases' forward parts go as
/// e^{j(nu-1)k delta}, the backward ones as e^{j(nu+1)k delta}, delta = 360°/m (odd m) or 180°/m
/// (even m), and a geometric sum over k = 0 .. m-1 vanishes unless its angle step is a whole turn.
inline std::string symmetric_winding_wave(int nu, int m) {
  if (nu % 2 == 0) return "absent";
  if (nu % (2 * m) == 1) return "forward";
  if (nu % (2 * m) == 2 * m - 1) return "backward";
  return "cancels";
}

}  // namespace tf::testing
