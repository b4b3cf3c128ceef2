#pragma once
// The currents of a study: given by the supply, or found from a circuit (split phase) with the
// inductances of the solved field.

#include <complex>
#include <vector>

#include <Eigen/Core>

#include "app/case.hpp"
#include "mesh/mesh.hpp"
#include "mesh/winding.hpp"
#include "solver/phase_fields.hpp"

namespace tf::app {

struct DriveReport {
  Eigen::MatrixXd inductance;   ///< [H], #phases by #phases (2D field, no end windings)
  double element_value = 0.0;   ///< split phase: the series element used [ohm, H or F]
  bool element_sized = false;   ///< split phase: the capacitor was sized here for the best field
};

/// The supply with every sinusoidal current known as a phasor: a split-phase supply is solved as a
/// circuit (with a capacitor of no given value sized so that the smaller of the forward and
/// backward waves is least, relative to the larger).
solver::Supply resolve_supply(const Case& c, const mesh::Mesh& m, const mesh::Winding& w,
                              const solver::PhaseFields& fields, DriveReport& report);

}  // namespace tf::app
