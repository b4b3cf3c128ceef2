#pragma once
// Which space orders the m phases of a winding make together, and how they turn, from the layout
// and the currents alone (no field solved). Phase k's conductors carry, for mechanical space order
// n, the phasor W_k(n) = Σ_i s_i N_i e^{j n θ_i} over its coil sides (the star of slots; its MMF
// wave of order n is W_k(n) times a constant common to all phases). With currents
// i_k(t) = Re(I_k e^{jωt}) the resultant wave of order n is, up to that constant,
//   c_n(t) = ½ (Σ_k I_k W_k(n)) e^{+jωt} + ½ (Σ_k conj(I_k) W_k(n)) e^{-jωt},
// a wave turning forward (counter-clockwise) at ω/n and one turning backward at ω/n
// (post/gap_field.hpp's phasor convention). An order cancels where both sums vanish.

#include <complex>
#include <optional>
#include <string>
#include <vector>

#include "mesh/winding.hpp"
#include "solver/supply.hpp"

namespace tf::post {

struct ResultantWave {
  int order = 0;                 ///< mechanical n
  double electrical_order = 0;   ///< nu = n / p
  double carried = 0.0;          ///< Σ_k |I_k| |W_k(n)| / Σ_k |I_k| N_k: the phases' own content (0: absent)
  double forward = 0.0;          ///< |Σ_k I_k W_k(n)| / Σ_k |I_k| |W_k(n)|: 1 when every phase adds in step
  double backward = 0.0;         ///< |Σ_k conj(I_k) W_k(n)| / Σ_k |I_k| |W_k(n)|
  std::string field = {};        ///< "forward", "backward", "elliptic", "pulsating", "cancels" or "absent"
  double speed_rpm = 0.0;        ///< of the stronger wave, signed (counter-clockwise positive): ±60 f / n = n_s/ν
  std::string reason = {};       ///< why, from the phases' contributions
};

/// The resultant wave of each mechanical order in `orders` for peak current phasors `currents`
/// (one per phase) at `frequency` [Hz]. Thresholds: below 1e-9 carried is absent, both sums below
/// 1e-6 cancel (round-off); otherwise forward or backward where one wave is over 10 times the other
/// (as post::direction), pulsating where the two are equal (to 1e-6) and elliptic in between.
std::vector<ResultantWave> resultant_waves(const mesh::Winding& w, const std::vector<std::complex<double>>& currents,
                                           double frequency, const std::vector<int>& orders);

/// Current phasors [A peak] of a supply's fundamental: sinusoidal supplies as given (balanced sets
/// expanded); stepped DC by the DFT of its states over one sequence, I_k = (2/K) Σ_s i_k(s) e^{-j2πs/K};
/// nothing for a split-phase supply, whose currents follow from the solved field.
std::optional<std::vector<std::complex<double>>> fundamental_currents(const solver::Supply& s, int n_phases);

}  // namespace tf::post
