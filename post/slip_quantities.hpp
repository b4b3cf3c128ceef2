#pragma once
// Results of the slip-frequency method (solver/slip.hpp): the supply split into its forward and
// backward rotating components, each solved in the rotor frame at its own slip, and the two
// superposed. Peak phasors; time averages carry the factor 1/2.

#include <complex>
#include <vector>

#include <Eigen/Core>

#include "mesh/mesh.hpp"
#include "mesh/winding.hpp"
#include "post/eddy_quantities.hpp"

namespace tf::post {

/// The stator currents I_k (m >= 2 phases, peak phasors [A]) as forward and backward sets.
/// Phase k's axis lies k delta ahead in space (delta = solver::phase_shift(m)), so the stator
/// current space vector's fundamental turns forward with F = (1/m) sum I_k e^{+jk delta} and
/// backward with B = (1/m) sum I_k e^{-jk delta} (the positive and negative sequences of
/// post/sequence.hpp); the sets are I_k^f = F e^{-jk delta}, I_k^b = B e^{+jk delta}.
/// What is left (I_k - I_k^f - I_k^b: the zero sequence of three phases, higher sequences of
/// m >= 4) makes no rotating fundamental and is not in the model; two-phase sets leave nothing.
/// A component below 1e-12 of the largest phase current (round-off) is set to exactly zero.
struct RotatingComponents {
  std::vector<std::complex<double>> forward, backward, rest;
};
RotatingComponents rotating_components(const std::vector<std::complex<double>>& phasors);

struct SlipInputs {
  const mesh::Mesh* mesh;
  const mesh::Winding* winding;
  std::vector<double> sigma;   ///< per region [S/m]: RegionCoefficients::sigma of EddyModel::slip_frequency
  std::vector<bool> on_rotor;  ///< per region: RegionCoefficients::moves_with_rotor
  double frequency;            ///< supply [Hz]
  double stack_length;         ///< [m]
};

/// Slip s = 1 - p omega_r / omega of the forward wave; the backward wave's is 2 - s.
double forward_slip(int pole_pairs, double frequency, double rotor_speed);

/// One component: `slip` its own (s or 2 - s), `direction` +1 forward, -1 backward, `currents` its
/// set, `a` its rotor-frame solution at angular frequency slip * omega.
SlipComponentResult evaluate_component(const SlipInputs& in, double slip, int direction,
                                       const std::vector<std::complex<double>>& currents, const Eigen::VectorXcd& a);

/// The superposition at one rotor speed. Torques and rotor losses add: the cross terms of the
/// two components pulsate at twice the supply frequency and average to zero. Flux linkages add
/// as phasors at the supply frequency (both components induce at omega in the stator). Input
/// power from the summed EMFs and the modelled currents (forward + backward); rotor_loss_balance =
/// input - T omega_r. No stator conductors: stator_loss = 0. torque_lorentz holds the sum of the
/// energy torques (SlipComponentResult::torque_energy).
SpeedResult evaluate_slip_speed(const SlipInputs& in, double rotor_speed, const RotatingComponents& c,
                                const Eigen::VectorXcd& a_forward, const Eigen::VectorXcd& a_backward);

}  // namespace tf::post
