#pragma once
// What a case asks its study to be: the kind, the steps and the sampling, as the [study] table of
// a case file gives them (study/ decides how to solve it).

#include <vector>

namespace tf::input {

enum class StudyKind {
  phase_angles,   ///< magnetostatic: the currents advance through one period in K steps
  eddy_currents,  ///< time-harmonic with eddy currents, one solution per rotor speed
  synchronous,    ///< magnetostatic: the rotor turns with the field, a load angle behind it
  cogging,        ///< magnetostatic: no current, the rotor turns (magnets against slots)
  rotor_sweep,    ///< magnetostatic: currents held at one instant, the rotor turns
};

/// The study's name as case files spell it.
inline const char* study_kind_name(StudyKind k) {
  switch (k) {
    case StudyKind::phase_angles: return "phase_angles";
    case StudyKind::eddy_currents: return "eddy_currents";
    case StudyKind::synchronous: return "synchronous";
    case StudyKind::cogging: return "cogging";
    case StudyKind::rotor_sweep: return "rotor_sweep";
  }
  return "?";
}

/// True for the studies whose rotor turns between steps (the sliding circle reconnects).
inline bool rotor_turns(StudyKind k) {
  return k == StudyKind::synchronous || k == StudyKind::cogging || k == StudyKind::rotor_sweep;
}

/// True for the studies whose stator currents advance through a period, so that the stator field
/// turns over the steps and rotation metrics apply: phase angles and synchronous.
inline bool stator_field_turns(StudyKind k) { return k == StudyKind::phase_angles || k == StudyKind::synchronous; }

struct StudyPlan {
  StudyKind kind = StudyKind::phase_angles;
  std::vector<double> rotor_speeds;  ///< eddy currents: mechanical speeds [rad/s], counter-clockwise
  int n_steps = 36;        ///< steps over one electrical period, ωt_k = 360°·k/K
  int n_field_files = 36;  ///< steps that get a VTU file, evenly spaced
  int n_gap_points = 720;  ///< samples on the mid-gap circle
  int max_harmonic = 25;   ///< highest electrical space order reported
  // Rotor-motion studies (rotor_turns(kind)):
  double load_angle = 0.0;     ///< synchronous: electrical angle [rad] by which the field axis leads the rotor's d axis
  double rotor_span = 0.0;     ///< cogging and rotor sweep: mechanical angle [rad] the rotor turns over the steps
  double current_angle = 0.0;  ///< rotor sweep: ωt [rad] at which the currents are held
  double speed = 0.0;          ///< mechanical speed [rad/s] for the back-EMF; 0: synchronous speed
  bool virtual_work = true;    ///< also the co-energy torque (two extra solves per step)
};

}  // namespace tf::input
