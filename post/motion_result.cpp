#include "post/motion_result.hpp"

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

}  // namespace tf::post
