#include "post/rotation_metrics.hpp"

#include <algorithm>
#include <cmath>
#include <numbers>
#include <numeric>

namespace tf::post {
namespace {

constexpr double kPi = std::numbers::pi;

double mean(const std::vector<double>& v) { return std::accumulate(v.begin(), v.end(), 0.0) / v.size(); }

double ripple(const std::vector<double>& v) {
  const auto [lo, hi] = std::minmax_element(v.begin(), v.end());
  const double m = mean(v);
  return m > 0.0 ? (*hi - *lo) / m : 0.0;
}

}  // namespace

double axis_angle(std::complex<double> c, int pole_pairs) { return std::arg(c) / pole_pairs; }

RotationMetrics rotation_metrics(const std::vector<std::complex<double>>& fundamental, const std::vector<double>& peak,
                                 const std::vector<double>& distortion, int pole_pairs) {
  RotationMetrics r;
  const int K = static_cast<int>(fundamental.size());
  std::vector<double> amplitude;
  for (const auto& c : fundamental) amplitude.push_back(std::abs(c));
  r.mean_fundamental = mean(amplitude);
  r.amplitude_ripple = ripple(amplitude);
  r.mean_peak = mean(peak);
  r.min_peak = *std::min_element(peak.begin(), peak.end());
  r.max_peak = *std::max_element(peak.begin(), peak.end());
  r.peak_ripple = ripple(peak);
  r.mean_distortion = mean(distortion);

  std::complex<double> fwd = 0.0, bwd = 0.0;
  for (int k = 0; k < K; ++k) {
    const double wt = 2 * kPi * k / K;
    fwd += fundamental[k] * std::polar(1.0, -wt);
    bwd += fundamental[k] * std::polar(1.0, wt);
  }
  r.forward = std::abs(fwd) / K;
  r.backward = std::abs(bwd) / K;
  r.backward_forward_ratio = r.forward > 0.0 ? r.backward / r.forward : 0.0;

  // Axis steps, electrical angle differences wrapped to (-180°, 180°], then mechanical; the ideal
  // step turns the way the stronger wave turns.
  r.expected_step_deg = (r.forward >= r.backward ? 1.0 : -1.0) * 360.0 / (pole_pairs * K);
  for (int k = 0; k < K; ++k) {
    const double step = std::arg(fundamental[(k + 1) % K] / fundamental[k]) / pole_pairs;
    r.rotation_uniformity_deg = std::max(r.rotation_uniformity_deg, std::abs(step * 180.0 / kPi - r.expected_step_deg));
  }
  return r;
}

}  // namespace tf::post
