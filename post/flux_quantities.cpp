#include "post/flux_quantities.hpp"

#include <cassert>
#include <cmath>
#include <complex>
#include <numbers>
#include <vector>

#include "solver/supply.hpp"

namespace tf::post {

DqPair park_transform(const Eigen::VectorXd& values, double theta_e) {
  const int m = static_cast<int>(values.size());
  assert(m >= 2);
  const double delta = solver::phase_shift(m);
  DqPair out;
  for (int k = 0; k < m; ++k) {
    out.d += values(k) * std::cos(theta_e - k * delta);
    out.q -= values(k) * std::sin(theta_e - k * delta);
  }
  out.d *= 2.0 / m;
  out.q *= 2.0 / m;
  return out;
}

Eigen::VectorXd inverse_park_transform(const DqPair& dq, int n_phases, double theta_e) {
  assert(n_phases >= 2);
  const double delta = solver::phase_shift(n_phases);
  Eigen::VectorXd x(n_phases);
  for (int k = 0; k < n_phases; ++k) x(k) = dq.d * std::cos(theta_e - k * delta) - dq.q * std::sin(theta_e - k * delta);
  return x;
}

DqPair dq_inductances(const Eigen::MatrixXd& l, double theta_e) {
  const int m = static_cast<int>(l.rows());
  const Eigen::VectorXd d = l * inverse_park_transform({1.0, 0.0}, m, theta_e);
  const Eigen::VectorXd q = l * inverse_park_transform({0.0, 1.0}, m, theta_e);
  return {park_transform(d, theta_e).d, park_transform(q, theta_e).q};
}

Eigen::VectorXd periodic_derivative(const Eigen::VectorXd& samples, double period) {
  // Direct DFT: flux-linkage sequences are a few hundred samples at most, O(N^2) is nothing.
  const Eigen::Index n = samples.size();
  const double two_pi = 2 * std::numbers::pi;
  std::vector<std::complex<double>> slope(static_cast<std::size_t>(n));
  for (Eigen::Index k = 0; k < n; ++k) {
    std::complex<double> c = 0.0;
    for (Eigen::Index j = 0; j < n; ++j) c += samples(j) * std::polar(1.0, -two_pi * double(k * j) / double(n));
    // Wavenumber of term k: k below N/2, k - N above; the Nyquist term (2k == N) gets none.
    const Eigen::Index wave = 2 * k < n ? k : (2 * k == n ? 0 : k - n);
    slope[static_cast<std::size_t>(k)] = std::complex<double>(0.0, two_pi * double(wave) / period) * c;
  }
  Eigen::VectorXd out(n);
  for (Eigen::Index j = 0; j < n; ++j) {
    std::complex<double> s = 0.0;
    for (Eigen::Index k = 0; k < n; ++k) s += slope[static_cast<std::size_t>(k)] * std::polar(1.0, two_pi * double(k * j) / double(n));
    out(j) = s.real() / double(n);
  }
  return out;
}

Eigen::VectorXd back_emf_periodic(const Eigen::VectorXd& psi, double period, double speed) {
  return -speed * periodic_derivative(psi, period);
}

Eigen::VectorXd back_emf_sampled(const Eigen::VectorXd& psi, double angle_step, double speed) {
  const Eigen::Index n = psi.size();
  assert(n >= 3);
  Eigen::VectorXd slope(n);
  for (Eigen::Index j = 1; j + 1 < n; ++j) slope(j) = (psi(j + 1) - psi(j - 1)) / (2 * angle_step);
  // Second-order one-sided differences: (-3 f0 + 4 f1 - f2) / (2h) and its mirror.
  slope(0) = (-3 * psi(0) + 4 * psi(1) - psi(2)) / (2 * angle_step);
  slope(n - 1) = (3 * psi(n - 1) - 4 * psi(n - 2) + psi(n - 3)) / (2 * angle_step);
  return -speed * slope;
}

}  // namespace tf::post
