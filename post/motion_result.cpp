#include "post/motion_result.hpp"

#include "post/flux_quantities.hpp"

#include <algorithm>
#include <cmath>
#include <complex>
#include <limits>
#include <numbers>
#include <numeric>

namespace tf::post {

TorqueStats torque_stats(const std::vector<double>& torque) {
  TorqueStats s;
  if (torque.empty()) return s;
  const auto [lo, hi] = std::minmax_element(torque.begin(), torque.end());
  s.min = *lo;
  s.max = *hi;
  s.mean = std::accumulate(torque.begin(), torque.end(), 0.0) / static_cast<double>(torque.size());
  s.peak_to_peak = s.max - s.min;
  // Ripple relative to a mean that is (next to) zero, as in a cogging study, says nothing.
  s.ripple = std::abs(s.mean) > 1e-3 * s.peak_to_peak ? s.peak_to_peak / std::abs(s.mean)
                                                      : std::numeric_limits<double>::quiet_NaN();
  return s;
}

double dominant_period(const std::vector<double>& samples, double span) {
  const int n = static_cast<int>(samples.size());
  double best = 0.0, scale = 0.0;
  int order = 0;
  for (double v : samples) scale = std::max(scale, std::abs(v));
  for (int h = 1; h <= n / 2; ++h) {
    std::complex<double> c = 0.0;
    for (int k = 0; k < n; ++k) c += samples[k] * std::polar(1.0, -2 * std::numbers::pi * h * k / n);
    if (std::abs(c) > best) best = std::abs(c), order = h;
  }
  // Below round-off of the samples themselves the spectrum says nothing.
  if (order == 0 || best / n < 1e-9 * scale) return 0.0;
  return span / order;
}

void derive_flux_quantities(MotionResult& r, const StepSpan& x) {
  const int p = x.pole_pairs;
  const int n_phases = static_cast<int>(r.steps.front().flux_linkage.size());
  for (PositionStep& step : r.steps) {
    const double d_axis = p * (step.rotor_angle + x.rotor_d_axis) - x.phase_a_axis;
    const Eigen::Map<const Eigen::VectorXd> psi(step.flux_linkage.data(), n_phases);
    const DqPair dq = park_transform(psi, d_axis);
    step.flux_d = dq.d;
    step.flux_q = dq.q;
    if (n_phases >= 2 && step.inductance_frozen.rows() == n_phases) {
      step.inductance_dq_apparent = dq_inductances(step.inductance_frozen, d_axis);
      step.inductance_dq_incremental = dq_inductances(step.inductance_incremental, d_axis);
    }
  }
  const double periods = x.span * p / (2 * std::numbers::pi);
  const bool periodic = std::abs(periods - std::round(periods)) < 1e-9 && periods >= 1.0;
  const int n = static_cast<int>(r.steps.size());
  for (int ph = 0; ph < n_phases; ++ph) {
    Eigen::VectorXd psi(n);
    for (int k = 0; k < n; ++k) psi(k) = r.steps[k].flux_linkage[ph];
    const Eigen::VectorXd e = periodic ? back_emf_periodic(psi, x.span, r.speed) : back_emf_sampled(psi, x.span / n, r.speed);
    for (int k = 0; k < n; ++k) r.steps[k].back_emf.push_back(e(k));
  }
}

void summarise_torque(MotionResult& r, int n_slots, int n_poles, double span, bool virtual_work, int n_solves,
                      int n_iterations) {
  std::vector<double> arkkio, circle, work;
  for (const auto& s : r.steps) {
    arkkio.push_back(s.torque_arkkio);
    circle.push_back(s.torque_circle);
    work.push_back(s.torque_virtual_work);
  }
  r.arkkio = torque_stats(arkkio);
  r.circle = torque_stats(circle);
  r.has_virtual_work = virtual_work;
  if (virtual_work) r.virtual_work = torque_stats(work);
  r.cogging_period_expected = 2 * std::numbers::pi / std::lcm(n_slots, n_poles);
  r.cogging_period_measured = dominant_period(arkkio, span);
  r.mean_newton_iterations = static_cast<double>(n_iterations) / std::max(1, n_solves);
  r.n_solved = n_solves;
}

}  // namespace tf::post
