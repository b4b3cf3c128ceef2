#pragma once
// What follows from phase flux linkages: the d-q components of an m-phase set and the back-EMF of
// flux linkage sampled over rotor angle.

#include <Eigen/Core>

namespace tf::post {

/// d and q components of one m-phase set (flux linkages [Wb], or currents [A]).
struct DqPair {
  double d = 0.0;
  double q = 0.0;
};

/// Amplitude-invariant Park transform generalised to m >= 2 phases (R. H. Park, "Two-reaction
/// theory of synchronous machines", AIEE Trans. 48, 1929 (from memory), for three phases; the m-phase form is the
/// same projection): with phase k's axis at k delta electrical (delta = solver::phase_shift(m):
/// 360°/m for odd m, 180°/m for even m, so 90° for two-phase; DEVELOPERS.md, "Conventions"),
///   d =  (2/m) sum_k x_k cos(theta_e - k delta),   q = -(2/m) sum_k x_k sin(theta_e - k delta).
/// theta_e: electrical angle of the d axis [rad], counter-clockwise from phase A's axis. q leads d by
/// 90° electrical: the set x_k = X cos(theta_e + gamma - k delta) (a vector gamma ahead of d) gives
/// d = X cos(gamma), q = X sin(gamma). A zero-sequence part (equal x_k) is dropped for m >= 3.
/// values: m phase values, k = 0 for phase A.
DqPair park_transform(const Eigen::VectorXd& values, double theta_e);

/// The inverse for a set without zero sequence: x_k = d cos(theta_e - k delta) - q sin(theta_e - k delta).
Eigen::VectorXd inverse_park_transform(const DqPair& dq, int n_phases, double theta_e);

/// d- and q-axis inductances [H] of the phase inductance matrix l (#phases by #phases [H]) with the
/// d axis at theta_e [rad electrical]: L_d is psi_d of the unit d-axis current set (d = 1, q = 0
/// through inverse_park_transform), L_q psi_q of the unit q-axis set. For a machine whose matrix is
/// L_kj = (2/m) [L_d cos(theta_e - k delta) cos(theta_e - j delta) + L_q sin(..k..) sin(..j..)] it
/// returns L_d and L_q exactly.
DqPair dq_inductances(const Eigen::MatrixXd& l, double theta_e);

/// d/dtheta of N equally spaced samples of a periodic function over one period [rad]
/// (samples at theta_0 + j period / N, j = 0..N-1), by spectral differentiation (discrete Fourier
/// series differentiated term by term): exact for band-limited data of orders below N/2 per period.
/// For even N the Nyquist term's derivative is set to zero (it cannot be told from cos vs sin).
Eigen::VectorXd periodic_derivative(const Eigen::VectorXd& samples, double period);

/// Back-EMF [V] at the samples of flux linkage psi [Wb] over one period of rotor angle `period`
/// [rad mechanical], the rotor turning at `speed` [rad/s mechanical, counter-clockwise]:
/// e = -dpsi/dt = -speed dpsi/dtheta (generator convention: the EMF induced in the winding; for
/// psi = Psi cos(p theta), e = speed p Psi sin(p theta), lagging psi by 90° electrical).
Eigen::VectorXd back_emf_periodic(const Eigen::VectorXd& psi, double period, double speed);

/// The same for a sequence that is not one whole period, samples angle_step [rad] apart: central
/// differences inside, second-order one-sided differences at both ends (error O(angle_step^2)).
/// Needs at least 3 samples.
Eigen::VectorXd back_emf_sampled(const Eigen::VectorXd& psi, double angle_step, double speed);

}  // namespace tf::post
