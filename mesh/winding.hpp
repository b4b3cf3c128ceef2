#pragma once
// Winding layout: which slot-layer carries which phase, in which direction, with how many turns.
// It lives in mesh/ because it is tied to slot numbering: slot s is centred at mechanical angle
// 2*pi*(s - 1)/Q, counter-clockwise from the +x axis.

#include <optional>
#include <string>
#include <vector>

#include "mesh/geometry.hpp"
#include "mesh/winding_spec.hpp"

namespace tf::mesh {

enum class LayoutRule {
  phase_belts,     ///< integral slot: belts of q = Q/(2pm) slots
  star_of_slots,   ///< fractional slot and tooth coils: coil phasors sorted into 2m sectors
  pole_coils,      ///< salient poles: one coil round each pole, by the star of slots
  table,           ///< the user's slot table
};

struct Winding {
  WindingSpec spec;
  int n_positions = 0;  ///< winding positions round the bore: slots Q, salient poles P or conductor sectors
  LayoutRule rule = LayoutRule::phase_belts;
  std::vector<CoilSide> sides;
  /// Electrical angle [rad] of phase A's magnetic axis (where its B_r fundamental peaks, pointing
  /// outwards); phase k's axis leads it by k times the phase shift.
  double phase_a_axis = 0.0;

  /// q = Q/(2pm); a fraction for fractional-slot windings.
  double slots_per_pole_per_phase() const {
    return static_cast<double>(n_positions) / (spec.n_poles * spec.n_phases);
  }
  /// Series turns of one phase: its conductors / 2 / parallel paths.
  double series_turns() const;
  /// Winding periodicity t = gcd(Q, p): the layout repeats t times round the bore.
  int periodicity() const;
};

/// Why this winding cannot be laid out on this stator, or nothing if it can.
std::optional<std::string> layout_problem(const WindingSpec& spec, const StatorGeometry& stator);

/// Lays out the winding: the user's table if given; one coil per pole on a salient-pole stator;
/// phase belts for integral-slot windings (single layer full pitch, or double layer, where layer 2
/// of slot s holds the return side of the coil whose go side lies in layer 1 of slot s - y);
/// otherwise the star of slots. Throws MeshError when layout_problem() has a reason.
Winding lay_out(const WindingSpec& spec, const StatorGeometry& stator);

/// Winding factor of phase `phase` for mechanical space order n, by the star of slots:
/// k_w(n) = |sum_i s_i N_i e^{j n theta_i}| / sum_i N_i over the phase's coil sides.
double layout_winding_factor(const Winding& w, int phase, int mechanical_order);

/// Closed-form factors for electrical space order nu of integral-slot windings (J. Pyrhönen,
/// T. Jokinen, V. Hrabovcová, Design of Rotating Electrical Machines, Wiley 2008, ch. 2):
/// distribution k_d = sin(nu q alpha/2) / (q sin(nu alpha/2)), alpha = 2 pi p / Q, pitch
/// k_p = sin(nu (y/tau_p) pi/2), y the coil pitch and tau_p = Q/(2p) the pole pitch in slots.
/// For other layouts the closed-form fields are NaN and only from_layout is meaningful.
struct WindingFactor {
  int order = 1;  ///< electrical space order nu (mechanical order nu*p)
  double distribution = 0.0;
  double pitch = 0.0;
  double total = 0.0;  ///< distribution * pitch for odd orders; 0 for even orders
  double from_layout = 0.0;  ///< star-of-slots value of the laid-out winding, phase A
};
std::vector<WindingFactor> winding_factors(const Winding& w, int max_order);

/// Every mechanical space order n = 1 .. max_order that phase A's layout carries (k_w > 1e-9),
/// sub-harmonics (n < p) included: pairs of (n, k_w(n)).
std::vector<std::pair<int, double>> space_orders(const Winding& w, int max_order);

}  // namespace tf::mesh
