#pragma once
// Balanced sinusoidal phase currents (../shared/DESIGN.md §5):
//   i_k(t) = I_peak cos(omega t - k * shift),  shift = 360°/m for odd m, 180°/m for even m
// so phase k lags phase 0 by k * shift in time while its axis leads by k * shift in space,
// and a balanced supply turns the field counter-clockwise.

#include <cmath>
#include <numbers>
#include <vector>

namespace tf::solver {

struct Supply {
  double peak_current = 0.0;  ///< [A], terminal current of each phase
  double frequency = 50.0;    ///< [Hz]
};

/// Phase shift between neighbouring phases [rad], in time and (electrically) in space.
inline double phase_shift(int n_phases) {
  const double pi = std::numbers::pi;
  if (n_phases <= 1) return 0.0;
  return (n_phases % 2 == 1) ? 2.0 * pi / n_phases : pi / n_phases;
}

/// Phase currents [A] at electrical angle omega_t [rad]; one entry per phase.
inline std::vector<double> phase_currents(const Supply& s, int n_phases, double omega_t) {
  std::vector<double> i(n_phases);
  for (int k = 0; k < n_phases; ++k)
    i[k] = s.peak_current * std::cos(omega_t - k * phase_shift(n_phases));
  return i;
}

}  // namespace tf::solver
