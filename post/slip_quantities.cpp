#include "post/slip_quantities.hpp"

#include <algorithm>
#include <cassert>
#include <cmath>
#include <numbers>

#include "post/sequence.hpp"
#include "solver/supply.hpp"

namespace tf::post {
namespace {

using Complex = std::complex<double>;

/// 1/2 Re sum_k j omega psi_k conj(I_k) [W].
double input_power(double omega, const std::vector<Complex>& psi, const std::vector<Complex>& currents) {
  double p = 0.0;
  for (std::size_t k = 0; k < psi.size(); ++k) p += 0.5 * std::real(Complex(0.0, omega) * psi[k] * std::conj(currents[k]));
  return p;
}

}  // namespace

RotatingComponents rotating_components(const std::vector<Complex>& phasors) {
  const int m = static_cast<int>(phasors.size());
  assert(m >= 2 && "a single-phase winding's pulsating field cannot be split into phase-current sets");
  const double delta = solver::phase_shift(m);
  SequenceComponents s = sequence_components(phasors);
  // Round-off of a balanced set is no backward wave: such a component is set to exactly zero,
  // so that it need not be solved.
  double largest = 0.0;
  for (const Complex& i : phasors) largest = std::max(largest, std::abs(i));
  for (Complex* x : {&s.positive, &s.negative})
    if (std::abs(*x) < 1e-12 * largest) *x = 0.0;
  RotatingComponents c;
  for (int k = 0; k < m; ++k) {
    c.forward.push_back(s.positive * std::polar(1.0, -k * delta));
    c.backward.push_back(s.negative * std::polar(1.0, k * delta));
    c.rest.push_back(phasors[k] - c.forward.back() - c.backward.back());
  }
  return c;
}

double forward_slip(int pole_pairs, double frequency, double rotor_speed) {
  return 1.0 - pole_pairs * rotor_speed / (2 * std::numbers::pi * frequency);
}

SlipComponentResult evaluate_component(const SlipInputs& in, double slip, int direction,
                                       const std::vector<Complex>& currents, const Eigen::VectorXcd& a) {
  const mesh::Mesh& m = *in.mesh;
  const double omega = 2 * std::numbers::pi * in.frequency;
  const double rotor_omega = slip * omega;  // what the rotor sees; no motion term in its own frame
  SlipComponentResult r;
  r.slip = slip;
  r.torque = arkkio_torque(m, a, in.stack_length);
  for (double l : region_losses(m, a, in.sigma, in.on_rotor, rotor_omega, 0.0, in.stack_length)) r.rotor_loss += l;
  r.gap_power = r.torque * direction * omega / in.winding->spec.pole_pairs();
  r.input_power = input_power(omega, flux_linkages(m, *in.winding, a, in.stack_length), currents);
  r.torque_energy = direction * in.winding->spec.pole_pairs() * r.input_power / omega;
  return r;
}

SpeedResult evaluate_slip_speed(const SlipInputs& in, double rotor_speed, const RotatingComponents& c,
                                const Eigen::VectorXcd& a_forward, const Eigen::VectorXcd& a_backward) {
  const mesh::Mesh& m = *in.mesh;
  const double omega = 2 * std::numbers::pi * in.frequency;
  const double s = forward_slip(in.winding->spec.pole_pairs(), in.frequency, rotor_speed);
  SpeedResult r;
  r.rotor_speed = rotor_speed;
  r.slip = s;
  r.components = {evaluate_component(in, s, +1, c.forward, a_forward),
                  evaluate_component(in, 2.0 - s, -1, c.backward, a_backward)};
  r.region_loss.assign(m.regions.size(), 0.0);
  for (const auto& [slip, a] : {std::pair{s, &a_forward}, std::pair{2.0 - s, &a_backward}}) {
    const auto loss = region_losses(m, *a, in.sigma, in.on_rotor, slip * omega, 0.0, in.stack_length);
    for (std::size_t k = 0; k < loss.size(); ++k) r.region_loss[k] += loss[k];
  }
  for (const auto& x : r.components) {
    r.torque += x.torque;
    r.torque_lorentz += x.torque_energy;
    r.rotor_loss += x.rotor_loss;
  }
  r.flux_linkage = flux_linkages(m, *in.winding, a_forward + a_backward, in.stack_length);
  std::vector<Complex> currents;
  for (std::size_t k = 0; k < c.forward.size(); ++k) currents.push_back(c.forward[k] + c.backward[k]);
  for (const Complex& psi : r.flux_linkage) r.emf_rms.push_back(std::abs(Complex(0.0, omega) * psi) / std::sqrt(2.0));
  r.input_power = input_power(omega, r.flux_linkage, currents);
  r.rotor_loss_balance = r.input_power - r.torque * rotor_speed;
  return r;
}

}  // namespace tf::post
