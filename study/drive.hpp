#pragma once
// The currents of a study: given by the supply, or found from a circuit (split phase) with the
// inductances of the solved field.

#include <complex>
#include <string>
#include <vector>

#include <Eigen/Core>

#include "input/case.hpp"
#include "mesh/mesh.hpp"
#include "mesh/winding.hpp"
#include "solver/phase_fields.hpp"

namespace tf::study {

struct DriveReport {
  Eigen::MatrixXd inductance;   ///< [H], #phases by #phases (2D field, no end windings)
  double element_value = 0.0;   ///< split phase: the series element used [ohm, H or F]
  bool element_sized = false;   ///< split phase: the capacitor was sized here for the best field
};

/// The supply with every sinusoidal current known as a phasor: a split-phase supply is solved as a
/// circuit (with a capacitor of no given value sized so that the smaller of the forward and
/// backward waves is least, relative to the larger).
solver::Supply resolve_supply(const input::Case& c, const mesh::Mesh& m, const mesh::Winding& w,
                              const solver::PhaseFields& fields, DriveReport& report);

/// The currents as used (phasors, sequence components, a sized series element) and the
/// inductance matrix of the field, as a JSON object.
std::string drive_to_json(const solver::Supply& resolved, int n_phases, const DriveReport& report);

/// Lines for the terminal on currents that are not a plain balanced set: the states of stepped DC,
/// a split-phase circuit's element and phase lead, the sequence components.
std::vector<std::string> drive_notes(const solver::Supply& resolved, int n_phases, const DriveReport& report);

}  // namespace tf::study
