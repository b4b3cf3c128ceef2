#include "post/waveform.hpp"

#include <algorithm>
#include <cmath>
#include <complex>
#include <limits>
#include <numbers>

namespace tf::post {
namespace {

/// |DFT bin k| of the samples.
double bin_magnitude(const std::vector<double>& x, int k) {
  std::complex<double> c = 0.0;
  const double n = static_cast<double>(x.size());
  for (std::size_t j = 0; j < x.size(); ++j) c += x[j] * std::polar(1.0, -2 * std::numbers::pi * k * static_cast<double>(j) / n);
  return std::abs(c);
}

}  // namespace

double rms(const std::vector<double>& samples) {
  if (samples.empty()) return 0.0;
  double sum = 0.0;
  for (double v : samples) sum += v * v;
  return std::sqrt(sum / static_cast<double>(samples.size()));
}

int highest_harmonic(int n_samples, int periods, int max_order) {
  if (periods < 1) return 0;
  // Bin h * periods must lie strictly below the Nyquist bin n / 2.
  return std::min(max_order, (n_samples - 1) / (2 * periods));
}

double total_harmonic_distortion(const std::vector<double>& samples, int periods, int max_order) {
  const double nan = std::numeric_limits<double>::quiet_NaN();
  const int top = highest_harmonic(static_cast<int>(samples.size()), periods, max_order);
  if (top < 1) return nan;
  const double fundamental = bin_magnitude(samples, periods);
  // Round-off of the samples themselves: nothing to compare the harmonics with.
  double largest = 0.0;
  for (double v : samples) largest = std::max(largest, std::abs(v));
  if (fundamental <= 1e-9 * largest * static_cast<double>(samples.size())) return nan;
  double harmonics = 0.0;
  for (int h = 2; h <= top; ++h) harmonics += std::pow(bin_magnitude(samples, h * periods), 2);
  return std::sqrt(harmonics) / fundamental;
}

}  // namespace tf::post
