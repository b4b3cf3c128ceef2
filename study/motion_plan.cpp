#include "study/motion_plan.hpp"

#include <cmath>
#include <complex>
#include <functional>
#include <map>
#include <numbers>
#include <numeric>
#include <string_view>

#include "solver/dofs.hpp"
#include "solver/motion.hpp"
#include "solver/supply.hpp"

namespace tf::study {
namespace {

constexpr double kPi = std::numbers::pi;

/// Mechanical angle [rad] the rotor covers over the steps.
double motion_span(const input::Case& c) {
  if (c.study.kind == input::StudyKind::synchronous || c.study.kind == input::StudyKind::phase_angles)
    return 2 * kPi / c.winding.pole_pairs();
  return c.study.rotor_span;
}

/// Wraps an angle [rad] into (-pi, pi].
double wrap(double a) { return std::remainder(a, 2 * kPi); }

}  // namespace

int sliding_multiple(const input::Case& c) {
  if (!input::rotor_turns(c.study.kind)) return 1;
  // K steps over the span must each be a whole number of pitches: 2*pi/pitch = K * 2*pi/span.
  return static_cast<int>(std::lround(c.study.n_steps * 2 * kPi / motion_span(c)));
}

double field_axis(const mesh::Winding& w, const std::vector<double>& currents) {
  std::complex<double> v = 0.0;
  const double shift = solver::phase_shift(w.spec.n_phases);
  for (std::size_t k = 0; k < currents.size(); ++k)
    v += currents[k] * std::polar(1.0, w.phase_a_axis + static_cast<double>(k) * shift);
  return std::arg(v);
}

MotionSchedule plan_motion(const input::Case& c, const mesh::Mesh& m, const mesh::Winding& w) {
  MotionSchedule s;
  s.span = motion_span(c);
  const int n = c.study.n_steps, n_phases = c.winding.n_phases, p = c.winding.pole_pairs();
  // The rotor's d axis at rest: the centre of magnet pole 1, which mesh::build puts on the +x axis
  // (mesh/geometry.hpp); the +x axis for rotors without magnets too.
  s.rotor_d_axis = 0.0;
  // The rotor turns with the field: its d axis stays load_angle (electrical) behind the field's
  // axis, in the direction the field turns.
  double axis0 = 0.0, turn = 1.0;
  if (c.study.kind == input::StudyKind::synchronous) {
    axis0 = field_axis(w, solver::phase_currents(c.supply, n_phases, 0.0));
    const double next = field_axis(w, solver::phase_currents(c.supply, n_phases, 2 * kPi / n));
    turn = wrap(next - axis0) >= 0.0 ? 1.0 : -1.0;
  }
  for (int k = 0; k < n; ++k) {
    double angle = 0.0, rotor = 0.0;
    std::vector<double> currents(n_phases, 0.0);
    switch (c.study.kind) {
      case input::StudyKind::synchronous:
        angle = 2 * kPi * k / n;
        currents = solver::phase_currents(c.supply, n_phases, angle);
        rotor = (axis0 + turn * (angle - c.study.load_angle)) / p - s.rotor_d_axis;
        break;
      case input::StudyKind::rotor_sweep:
        angle = c.study.current_angle;
        currents = solver::phase_currents(c.supply, n_phases, angle);
        rotor = s.span * k / n;
        break;
      case input::StudyKind::phase_angles:  // saturated iron: the currents advance, the rotor stands
        angle = 2 * kPi * k / n;
        currents = solver::step_currents(c.supply, n_phases, n)[k];
        break;
      default:  // cogging: no current
        rotor = s.span * k / n;
        break;
    }
    const int shift = solver::rotor_shift(m, rotor);
    s.electrical_angle.push_back(angle);
    s.currents.push_back(currents);
    s.shift.push_back(shift);
    s.rotor_angle.push_back(shift * solver::sliding_pitch(m));
  }
  // The rotor stands on whole pitches of the sliding circle, so the load angle is what that allows.
  if (c.study.kind == input::StudyKind::synchronous)
    s.load_angle = wrap(turn * (axis0 - p * (s.rotor_angle[0] + s.rotor_d_axis)));
  return s;
}

std::vector<StepOrigin> step_origins(const MotionSchedule& s, const mesh::Mesh& m, bool magnets) {
  const std::vector<bool> rotor_side = mesh::rotor_side_nodes(m);
  // One numbering per rotor shift, and a hash of its unknowns to pass over pairs that cannot agree.
  std::map<int, std::pair<solver::DofMap, std::size_t>> numbering;
  for (int shift : s.shift)
    if (!numbering.count(shift)) {
      solver::DofMap d = solver::number_dofs(m, shift);
      const std::string_view bytes(reinterpret_cast<const char*>(d.dof_of_node.data()), d.dof_of_node.size() * sizeof(int));
      const std::size_t hash = std::hash<std::string_view>{}(bytes);
      numbering.emplace(shift, std::make_pair(std::move(d), hash));
    }
  std::vector<StepOrigin> origin(s.shift.size());
  std::vector<int> solved;
  for (std::size_t k = 0; k < s.shift.size(); ++k) {
    const auto& [dofs_k, hash_k] = numbering.at(s.shift[k]);
    for (int j : solved) {
      const auto& [dofs_j, hash_j] = numbering.at(s.shift[static_cast<std::size_t>(j)]);
      if (hash_j != hash_k) continue;
      const auto signs = solver::field_symmetry(rotor_side, magnets, {dofs_j, s.currents[static_cast<std::size_t>(j)]},
                                                {dofs_k, s.currents[k]});
      if (!signs) continue;
      origin[k] = {j, *signs};
      break;
    }
    if (origin[k].source < 0) solved.push_back(static_cast<int>(k));
  }
  return origin;
}

}  // namespace tf::study
