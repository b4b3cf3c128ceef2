#include "post/sequence.hpp"

#include <algorithm>
#include <cmath>

#include "solver/supply.hpp"

namespace tf::post {
namespace {

/// Smaller over larger of the two rotating waves: 0 for a circular field, 1 for a pulsating one,
/// whichever way it turns.
double ellipticity(const std::vector<std::complex<double>>& currents, const std::vector<std::complex<double>>& unit) {
  const Waves w = rotating_waves(currents, unit);
  const double big = std::max(w.forward, w.backward);
  return big > 0.0 ? std::min(w.forward, w.backward) / big : 1.0;
}

}  // namespace


SequenceComponents sequence_components(const std::vector<std::complex<double>>& phasors) {
  const int m = static_cast<int>(phasors.size());
  const double delta = solver::phase_shift(m);
  SequenceComponents s{0.0, 0.0, 0.0};
  for (int k = 0; k < m; ++k) {
    s.positive += phasors[k] * std::polar(1.0, k * delta);
    s.negative += phasors[k] * std::polar(1.0, -k * delta);
    s.zero += phasors[k];
  }
  s.positive /= double(m);
  s.negative /= double(m);
  s.zero /= double(m);
  return s;
}

Waves rotating_waves(const std::vector<std::complex<double>>& phasors,
                     const std::vector<std::complex<double>>& unit_fundamentals) {
  std::complex<double> f = 0.0, b = 0.0;
  for (std::size_t k = 0; k < phasors.size(); ++k) {
    f += phasors[k] * unit_fundamentals[k];
    b += std::conj(phasors[k]) * unit_fundamentals[k];
  }
  return {0.5 * std::abs(f), 0.5 * std::abs(b)};
}

/// The capacitance [F] between 1 nF and 10 mF with the most nearly circular field: a scan on a
/// logarithmic grid, then golden-section refinement around the best grid point.
double best_series_capacitance(const solver::SplitPhase& s, double frequency, const Eigen::Matrix2d& L,
                        const std::vector<std::complex<double>>& unit) {
  auto cost = [&](double log_c) {
    return ellipticity(solver::split_phase_currents(s, frequency, L, std::pow(10.0, log_c)), unit);
  };
  const double lo = -9.0, hi = -2.0;
  const int n = 700;
  int best = 0;
  for (int i = 1; i <= n; ++i)
    if (cost(lo + (hi - lo) * i / n) < cost(lo + (hi - lo) * best / n)) best = i;
  double a = lo + (hi - lo) * std::max(0, best - 1) / n, b = lo + (hi - lo) * std::min(n, best + 1) / n;
  const double g = 0.5 * (std::sqrt(5.0) - 1.0);
  for (int it = 0; it < 60; ++it) {
    const double x1 = b - g * (b - a), x2 = a + g * (b - a);
    if (cost(x1) < cost(x2))
      b = x2;
    else
      a = x1;
  }
  return std::pow(10.0, 0.5 * (a + b));
}


}  // namespace tf::post
