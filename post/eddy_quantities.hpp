#pragma once
// What follows from a time-harmonic solution (peak phasors; time averages carry the factor 1/2).

#include <complex>
#include <string>
#include <vector>

#include <Eigen/Core>

#include "mesh/mesh.hpp"
#include "mesh/winding.hpp"

namespace tf::post {

/// Time-averaged torque [N m] on the rotor by Arkkio's method: the Maxwell stress averaged over the
/// whole gap band r_i..r_o, T = L / (mu0 (r_o - r_i)) * integral of r 1/2 Re(B_r conj(B_theta)) dS
/// (A. Arkkio, Analysis of induction motors based on the numerical solution of the magnetic field
/// and circuit equations, Helsinki University of Technology, 1987). Counter-clockwise positive.
double arkkio_torque(const mesh::Mesh& m, const Eigen::VectorXcd& a, double stack_length);

/// Time-averaged Joule loss [W] per region of the induced current density
/// J = -sigma (j omega A + omega_r dA/dtheta) (omega_r only in rotor regions): 1/2 int |J|^2 / sigma.
std::vector<double> region_losses(const mesh::Mesh& m, const Eigen::VectorXcd& a, const std::vector<double>& sigma,
                                  const std::vector<bool>& on_rotor, double omega, double rotor_speed,
                                  double stack_length);

/// Time-averaged torque [N m] of the Lorentz force on the induced currents of the rotor:
/// T = -1/2 Re int sigma E conj(dA/dtheta) dS with E = j omega A + omega_r dA/dtheta (from
/// P_mech = integral of v . (J x B)). A cross-check of arkkio_torque that the power balance uses.
double lorentz_torque(const mesh::Mesh& m, const Eigen::VectorXcd& a, const std::vector<double>& sigma,
                      const std::vector<bool>& on_rotor, double omega, double rotor_speed, double stack_length);

/// Flux linkage phasor [Wb] of each phase: (L/a) sum over coil sides s N mean(A).
std::vector<std::complex<double>> flux_linkages(const mesh::Mesh& m, const mesh::Winding& w, const Eigen::VectorXcd& a,
                                                double stack_length);

}  // namespace tf::post

namespace tf::post {

/// One rotating component of the slip-frequency method (post/slip_quantities.hpp).
struct SlipComponentResult {
  double slip = 0.0;           ///< s for the forward component, 2 - s for the backward one
  double torque = 0.0;         ///< Arkkio [N m]
  /// [N m]: +-p input_power / omega, the torque of this wave's air-gap power as the energy
  /// balance gives it (rotor loss / slip = input power, exact for the discrete equations). The
  /// Lorentz force on the bar currents is no cross-check in a cage: most of the torque acts on
  /// the teeth, where the flux passes the bars.
  double torque_energy = 0.0;
  double rotor_loss = 0.0;     ///< [W], from J = -j s omega sigma A in the rotor frame
  double gap_power = 0.0;      ///< T omega_sync [W], omega_sync = +omega/p (forward), -omega/p (backward)
  double input_power = 0.0;    ///< 1/2 Re sum_k j omega psi_k conj(I_k) of this component alone [W]
};

/// Everything reported for one rotor speed.
struct SpeedResult {
  double rotor_speed = 0.0;     ///< [rad/s]
  double slip = 0.0;            ///< 1 - p omega_r / omega
  double torque = 0.0;          ///< Arkkio [N m]
  double torque_lorentz = 0.0;  ///< cross-check [N m]; slip method: sum of SlipComponentResult::torque_energy
  double rotor_loss = 0.0;      ///< [W], all rotor conductors, integrated from the induced currents
  /// [W]: input power less stator loss and mechanical power by Arkkio's torque. Input power and
  /// Arkkio's torque converge faster than local current densities, so near synchronism this is
  /// the better estimate of the total (measured on TEAM 30a: 0.3 % against 13 % on a coarse mesh).
  double rotor_loss_balance = 0.0;
  double stator_loss = 0.0;     ///< [W], conducting stator iron
  std::vector<double> region_loss;  ///< [W] per region
  double input_power = 0.0;     ///< 1/2 Re sum_k V_k conj(I_k), V_k = j omega psi_k [W]
  std::vector<std::complex<double>> flux_linkage;  ///< per phase [Wb], peak phasors
  std::vector<double> emf_rms;                     ///< per phase [V]
  /// Slip-frequency method only: forward then backward component; empty with the motion term.
  std::vector<SlipComponentResult> components;
};

struct SpeedInputs {
  const mesh::Mesh* mesh;
  const mesh::Winding* winding;
  std::vector<double> sigma;   ///< per region [S/m]: solver::RegionCoefficients::sigma (EddyModel::motion_term)
  std::vector<bool> on_rotor;  ///< per region: solver::RegionCoefficients::moves_with_rotor
  std::vector<std::complex<double>> currents;  ///< per phase, peak phasors [A]
  double frequency;            ///< [Hz]
  double stack_length;         ///< [m]
};

SpeedResult evaluate_speed(const SpeedInputs& in, double rotor_speed, const Eigen::VectorXcd& a);

}  // namespace tf::post

namespace tf::post {

/// Skin depth of one conducting region against its largest elements.
struct SkinDepth {
  std::string region;
  double depth = 0.0;         ///< delta = sqrt(2 / (omega mu sigma)) [m] at the highest frequency it sees
  double frequency = 0.0;     ///< that frequency [Hz]: the supply's, or the slip frequency in the rotor
  double element_size = 0.0;  ///< longest element edge within one skin depth of the face toward the gap [m]
  bool too_coarse = false;    ///< fewer than three elements per skin depth there
};

/// Skin depth delta = sqrt(2 / (omega mu0 mu_r sigma)) [m] of a conductor at angular frequency
/// omega [rad/s] (R. L. Stoll, The Analysis of Eddy Currents, 1974); infinite where omega sigma = 0.
double skin_depth(double omega, double mu_r, double sigma);

/// delta per conducting region (R. L. Stoll, The Analysis of Eddy Currents, 1974): rotor regions see
/// the fundamental at |omega - p omega_r| for the fastest slip among the speeds, stator regions omega.
std::vector<SkinDepth> skin_depths(const mesh::Mesh& m, const std::vector<double>& sigma,
                                   const std::vector<double>& mu_r, const std::vector<bool>& on_rotor,
                                   double frequency, const std::vector<double>& rotor_speeds, int pole_pairs);

}  // namespace tf::post
