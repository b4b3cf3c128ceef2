#pragma once
// Winding layout: which slot-layer carries which phase, in which direction, with how many turns.
// It lives in mesh/ because it is tied to slot numbering: slot s is centred at mechanical angle
// 2*pi*(s - 1)/Q, counter-clockwise from the +x axis.

#include <complex>
#include <vector>

#include "mesh/winding_spec.hpp"

namespace tf::mesh {

/// One coil side: direction +1 means that a positive phase current flows along +z in it.
struct CoilSide {
  int slot = 0;   ///< 1-based
  int layer = 0;  ///< 1-based, 1 nearest the gap
  int phase = 0;  ///< 0-based: 0 is phase A
  int direction = 1;
  int turns = 1;  ///< conductors in this coil side
};

struct Winding {
  WindingSpec spec;
  int n_slots = 0;
  std::vector<CoilSide> sides;
  /// Electrical angle [rad] of phase A's magnetic axis (where its B_r peaks, pointing outwards);
  /// phase k's axis leads it by k times the phase shift.
  double phase_a_axis = 0.0;

  int slots_per_pole_per_phase() const { return n_slots / (spec.n_poles * spec.n_phases); }
  /// Series turns of one phase: its conductors / 2 / parallel paths.
  double series_turns() const;
};

/// Integral-slot distributed winding in phase belts (q = Q/(2pm) slots each), single layer
/// full pitch or double layer with any coil pitch. Layer 2 of slot s carries the return side of
/// the coil whose go side lies in layer 1 of slot s - coil_pitch.
/// Precondition: Q divisible by 2p*m (the case reader checks it).
Winding lay_out(const WindingSpec& spec, int n_slots);

/// Winding factor of phase `phase` for mechanical space order n, by the star of slots:
/// k_w(n) = |sum_i s_i N_i e^{j n theta_i}| / sum_i N_i over the phase's coil sides.
double layout_winding_factor(const Winding& w, int phase, int mechanical_order);

/// Closed-form factors for electrical space order nu (J. Pyrhönen, T. Jokinen, V. Hrabovcová,
/// Design of Rotating Electrical Machines, Wiley 2008, ch. 2): distribution
/// k_d = sin(nu q alpha/2) / (q sin(nu alpha/2)), alpha = 2 pi p / Q, and pitch
/// k_p = sin(nu (y/tau_p) pi/2), y the coil pitch and tau_p = Q/(2p) the pole pitch in slots.
struct WindingFactor {
  int order = 1;  ///< electrical space order nu (mechanical order nu*p)
  double distribution = 0.0;
  double pitch = 0.0;
  double total = 0.0;  ///< distribution * pitch for odd orders; 0 for even orders
  double from_layout = 0.0;  ///< star-of-slots value of the laid-out winding, phase A
};
std::vector<WindingFactor> winding_factors(const Winding& w, int max_order);

}  // namespace tf::mesh
