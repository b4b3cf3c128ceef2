#pragma once
// Symmetrical components of a set of phase currents, and the rotating waves they make.

#include <complex>
#include <vector>

#include <Eigen/Core>

#include "solver/split_phase.hpp"

namespace tf::post {

/// Sequence components [A, peak phasors] of m phasors with phase shift delta (360°/m odd m,
/// 180°/m even m): positive (1/m) Σ I_k e^{+jkδ}, negative (1/m) Σ I_k e^{-jkδ}, zero (1/m) Σ I_k.
/// For three phases these are the classical symmetrical components (C. L. Fortescue, 1918);
/// for two phases the positive and negative parts are the forward and backward components
/// (I_A ± j I_B)/2. A balanced set is all positive sequence.
struct SequenceComponents {
  std::complex<double> positive, negative, zero;
};
SequenceComponents sequence_components(const std::vector<std::complex<double>>& phasors);

/// Forward and backward fundamental waves [T] of phasor currents I_k [A] through unit fields c_k
/// [T/A]: c(t) = Σ Re(I_k e^{jωt}) c_k = e^{jωt} Σ I_k c_k / 2 + e^{-jωt} Σ conj(I_k) c_k / 2.
struct Waves {
  double forward, backward;
};
Waves rotating_waves(const std::vector<std::complex<double>>& phasors,
                     const std::vector<std::complex<double>>& unit_fundamentals);

/// The series capacitance [F] of a split-phase circuit, between 1 nF and 10 mF, whose currents
/// make the most nearly circular field: the least ratio of the smaller to the larger rotating
/// wave, for the unit fundamentals c_p [T/A] of each phase (a logarithmic scan, then
/// golden-section refinement). L: the two phases' inductance matrix [H].
double best_series_capacitance(const solver::SplitPhase& s, double frequency, const Eigen::Matrix2d& L,
                               const std::vector<std::complex<double>>& unit);

}  // namespace tf::post
