#include "solver/split_phase.hpp"

#include <cmath>
#include <numbers>

#include <Eigen/Dense>

namespace tf::solver {

std::complex<double> element_impedance(SeriesElement e, double value, double omega) {
  switch (e) {
    case SeriesElement::resistor: return {value, 0.0};
    case SeriesElement::inductor: return {0.0, omega * value};
    case SeriesElement::capacitor: return {0.0, -1.0 / (omega * value)};
  }
  return 0.0;
}

std::vector<std::complex<double>> split_phase_currents(const SplitPhase& s, double frequency,
                                                       const Eigen::Matrix2d& inductance, double element_value) {
  const double omega = 2 * std::numbers::pi * frequency;
  const std::complex<double> j(0.0, 1.0);
  Eigen::Matrix2cd z = j * omega * inductance.cast<std::complex<double>>();
  for (int k = 0; k < 2; ++k) z(k, k) += s.resistance[k];
  z(s.element_phase, s.element_phase) += element_impedance(s.element, element_value, omega);
  const double v_peak = std::sqrt(2.0) * s.voltage_rms;
  const Eigen::Vector2cd current = z.partialPivLu().solve(Eigen::Vector2cd(v_peak, v_peak));
  return {current(0), current(1)};
}

}  // namespace tf::solver
