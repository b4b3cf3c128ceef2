#pragma once
// What a rotor-motion study (synchronous, cogging, rotor sweep) reports per step and in all.

#include <string>
#include <vector>

#include <Eigen/Core>

#include "post/flux_quantities.hpp"
#include "post/study.hpp"

namespace tf::post {

/// One rotor position. Angles in radians; torque [N m] and flux linkage [Wb] over the stack length.
struct PositionStep {
  double rotor_angle = 0.0;       ///< mechanical, counter-clockwise from the rotor's starting position
  double torque_arkkio = 0.0;     ///< the main value: Maxwell stress averaged over the gap band
  double torque_circle = 0.0;     ///< cross-check: Maxwell stress on the mid-gap circle
  double torque_virtual_work = 0.0;  ///< cross-check: local virtual work (post/torque.hpp; NaN if off)
  std::vector<double> flux_linkage;  ///< per phase
  double flux_d = 0.0, flux_q = 0.0;  ///< dq-axis flux linkages (amplitude-invariant), d on the rotor's d axis
  std::vector<double> back_emf;       ///< per phase [V] at the study's speed: -dψ/dt
  Eigen::MatrixXd inductance_frozen;       ///< #phases by #phases [H], secant (frozen) permeability
  Eigen::MatrixXd inductance_incremental;  ///< #phases by #phases [H], differential permeability
  DqPair inductance_dq_apparent;     ///< L_d, L_q [H] of inductance_frozen on the rotor's d axis (m >= 2)
  DqPair inductance_dq_incremental;  ///< the same of inductance_incremental
  int newton_iterations = 0;
  double newton_residual = 0.0;  ///< relative
};

/// Mean, extremes and ripple of a torque sequence.
struct TorqueStats {
  double mean = 0.0, min = 0.0, max = 0.0;
  double peak_to_peak = 0.0;
  double ripple = 0.0;  ///< peak_to_peak / |mean| (NaN when |mean| < 0.1 % of peak_to_peak, e.g. cogging)
};
TorqueStats torque_stats(const std::vector<double>& torque);

struct MotionResult {
  StudyResult gap;                   ///< air-gap field per step (currents and electrical angle filled in)
  std::vector<PositionStep> steps;
  TorqueStats arkkio, circle, virtual_work;
  bool has_virtual_work = false;     ///< virtual_work was computed
  double speed = 0.0;                ///< mechanical [rad/s] of the back-EMF
  double cogging_period_expected = 0.0;  ///< 2π / LCM(Q, 2p) [rad] (common practice)
  double cogging_period_measured = 0.0;  ///< [rad]: the longest period the torque's spectrum shows; 0 if flat
  double mean_newton_iterations = 0.0;  ///< per solved step
  int n_solved = 0;  ///< steps solved by Newton; the others mirror one of them (solver/field_symmetry.hpp)
  std::vector<std::pair<std::string, double>> iron_loss;  ///< per iron region [W]; empty if not estimated
};

/// Period [rad] of the strongest non-constant harmonic of a sequence sampled at equal steps over
/// `span` [rad], taken as span / (its order); 0 when the sequence is constant to round-off.
double dominant_period(const std::vector<double>& samples, double span);

}  // namespace tf::post

namespace tf::post {

/// Where a step-by-step study's steps sit: what the dq transform and the EMF need.
struct StepSpan {
  int pole_pairs = 1;
  double span = 0.0;          ///< mechanical angle [rad] the steps cover, periodically
  double phase_a_axis = 0.0;  ///< electrical angle [rad] of phase A's axis (mesh::Winding::phase_a_axis)
  double rotor_d_axis = 0.0;  ///< mechanical angle [rad] of the rotor's d axis at rest
};

/// Fills flux_d, flux_q (Park transform on the rotor's d axis), the dq inductances and back_emf (-dψ/dt at r.speed) of
/// every step from its flux linkages: spectral differentiation when the steps cover whole
/// electrical periods (ψ is then periodic over the span), central differences otherwise.
void derive_flux_quantities(MotionResult& r, const StepSpan& s);

/// Fills the torque statistics (Arkkio, circle, virtual work when `virtual_work`), the cogging
/// period expected, 2π/LCM(Q, 2p) (common practice), and as measured in the Arkkio torque, and the
/// mean Newton iterations per solve.
void summarise_torque(MotionResult& r, int n_slots, int n_poles, double span, bool virtual_work, int n_solves,
                      int n_iterations);

}  // namespace tf::post
