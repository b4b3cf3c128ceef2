#pragma once
// Phase currents. Sinusoidal supplies are sets of phasors: i_k(t) = Re(I_k e^{j omega t}) with
// peak-valued I_k. A balanced set (DEVELOPERS.md, "Conventions") is I_k = I e^{-j k shift}, shift =
// 360°/m for odd m and 180°/m for even m, so phase k lags phase 0 by k * shift in time while its
// axis leads by k * shift in space, and the field turns counter-clockwise.

#include <cmath>
#include <complex>
#include <numbers>
#include <vector>

namespace tf::solver {

enum class SupplyKind {
  balanced,     ///< equal peaks, phases a phase shift apart
  phasors,      ///< a peak and a phase angle per phase (unbalanced sets, any phase shift)
  stepped_dc,   ///< a sequence of DC states, one step each
  split_phase,  ///< one voltage feeding two windings, one through an added series element
};

enum class SeriesElement { resistor, inductor, capacitor };

/// One sinusoidal voltage across two windings in parallel; phase `element_phase` (the auxiliary
/// winding, A by default) has the element in series. A capacitor or resistor makes its current
/// lead, and with phase B's axis 90° ahead of A's the field then turns counter-clockwise.
/// The winding currents follow from the FE inductances (see split_phase.hpp).
struct SplitPhase {
  double voltage_rms = 0.0;              ///< [V]
  std::vector<double> resistance;        ///< per phase [ohm], the whole winding's
  SeriesElement element = SeriesElement::capacitor;
  double element_value = 0.0;            ///< [ohm], [H] or [F]; 0 with a capacitor: sized for the best field
  int element_phase = 0;                 ///< 0-based
};

struct Supply {
  SupplyKind kind = SupplyKind::balanced;
  double peak_current = 0.0;  ///< [A], balanced supplies
  double frequency = 50.0;    ///< [Hz]; for stepped DC, state sequences per second
  std::vector<std::complex<double>> phasors;   ///< [A] peak, per phase (phasors, split phase once solved)
  std::vector<std::vector<double>> states;     ///< [A] per state and phase (stepped DC)
  SplitPhase split;
};

/// Phase shift between neighbouring phases [rad], in time and (electrically) in space.
inline double phase_shift(int n_phases) {
  const double pi = std::numbers::pi;
  if (n_phases <= 1) return 0.0;
  return (n_phases % 2 == 1) ? 2.0 * pi / n_phases : pi / n_phases;
}

/// The peak phasors of a sinusoidal supply, one per phase; balanced sets are expanded.
inline std::vector<std::complex<double>> supply_phasors(const Supply& s, int n_phases) {
  if (s.kind != SupplyKind::balanced) return s.phasors;
  std::vector<std::complex<double>> p;
  for (int k = 0; k < n_phases; ++k) p.push_back(std::polar(s.peak_current, -k * phase_shift(n_phases)));
  return p;
}

/// Phase currents [A] at electrical angle omega_t [rad] of a sinusoidal supply.
inline std::vector<double> phase_currents(const Supply& s, int n_phases, double omega_t) {
  std::vector<double> i;
  for (const auto& phasor : supply_phasors(s, n_phases)) i.push_back(std::real(phasor * std::polar(1.0, omega_t)));
  return i;
}

/// Currents [A] of each step of a study: K steps over one period, or the DC states in turn.
inline std::vector<std::vector<double>> step_currents(const Supply& s, int n_phases, int n_steps) {
  if (s.kind == SupplyKind::stepped_dc) return s.states;
  std::vector<std::vector<double>> steps;
  for (int k = 0; k < n_steps; ++k) steps.push_back(phase_currents(s, n_phases, 2 * std::numbers::pi * k / n_steps));
  return steps;
}

}  // namespace tf::solver
