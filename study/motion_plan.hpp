#pragma once
// Where the rotor stands and which currents flow at each step of a rotor-motion study.

#include <vector>

#include "input/case.hpp"
#include "mesh/mesh.hpp"
#include "mesh/winding.hpp"
#include "solver/field_symmetry.hpp"

namespace tf::study {

struct MotionSchedule {
  std::vector<double> electrical_angle;         ///< ωt [rad] per step
  std::vector<std::vector<double>> currents;    ///< [A] per step and phase
  std::vector<int> shift;                       ///< sliding pitches the rotor is turned by, per step
  std::vector<double> rotor_angle;              ///< the same as a mechanical angle [rad]
  double span = 0.0;                            ///< mechanical angle [rad] the steps cover, periodically
  double rotor_d_axis = 0.0;                    ///< mechanical angle [rad] of the rotor's d axis at rest
  double load_angle = 0.0;                      ///< synchronous: the electrical load angle [rad] as placed
};

/// The sliding circle must carry a whole number of nodes per rotor step: its node count must be a
/// multiple of this (mesh::MeshControls::sliding_multiple).
int sliding_multiple(const input::Case& c);

/// The schedule of the case's motion study on its mesh (whose sliding circle is fine enough).
MotionSchedule plan_motion(const input::Case& c, const mesh::Mesh& m, const mesh::Winding& w);

/// Where a step's field comes from: its own solve (source -1), or the field of the earlier step
/// `source` with each side's sign (solver/field_symmetry.hpp).
struct StepOrigin {
  int source = -1;
  solver::SideSigns signs;
};

/// Per step of the schedule: solved, or derived from the first solved step it mirrors. magnets:
/// whether the rotor carries magnets (they do not reverse with the currents).
std::vector<StepOrigin> step_origins(const MotionSchedule& s, const mesh::Mesh& m, bool magnets);

/// Electrical angle [rad] of the stator field's axis for the phase currents [A]: the argument of
/// the space vector sum_k i_k e^{j theta_k}, theta_k the electrical axis of phase k.
double field_axis(const mesh::Winding& w, const std::vector<double>& currents);

}  // namespace tf::study
