#pragma once
// The slip-frequency method over a study's rotor speeds (solver/slip.hpp, post/slip_quantities.hpp):
// per speed, the forward component solved at slip s and the backward one at 2 - s, superposed.
// The eddy-current study uses it for rotors with bars; it runs on any rotor, and on a smooth one
// (rotationally invariant) it is as exact as the motion term.

#include <functional>
#include <vector>

#include <Eigen/Core>

#include "input/case.hpp"
#include "mesh/mesh.hpp"
#include "mesh/winding.hpp"
#include "post/eddy_quantities.hpp"
#include "post/slip_quantities.hpp"
#include "solver/slip.hpp"
#include "solver/time_harmonic.hpp"

namespace tf::study {

struct SlipStudy {
  std::vector<post::SpeedResult> rows;       ///< one per rotor speed
  std::vector<Eigen::VectorXcd> forward;     ///< per speed: the forward component's A [Wb/m], rotor frame
  std::vector<Eigen::VectorXcd> backward;    ///< per speed: the backward component's A
  post::RotatingComponents components;       ///< the supply's split
  solver::Materials materials;               ///< as solved: bar conductivity with the end-ring factor applied
  double end_ring_factor = 1.0;              ///< 1 for ideal rings (none given)
};

/// The cage as the end-ring correction sees it: bars of the rotor geometry (area width * depth),
/// the case's bar conductivity, stack length and pole pairs. Precondition: a slotted rotor.
solver::Cage cage_of(const input::Case& c);

/// Solves every rotor speed of c.study by the slip-frequency method on the mesh and winding of c.
/// Applies c.end_rings (slotted rotors) to the bar conductivity. Precondition: >= 2 phases.
/// `solved(k, n)`, if given, is told after each of the n field solutions (two per speed when the
/// supply has a backward component).
SlipStudy solve_slip_study(const input::Case& c, const mesh::Mesh& m, const mesh::Winding& w, solver::TimeHarmonicStats& stats,
                           const std::function<void(int, int)>& solved = {});

}  // namespace tf::study
