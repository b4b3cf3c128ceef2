// Winding factors: closed forms for integral-slot windings, the star of slots for any layout.

#include <cmath>
#include <complex>
#include <limits>
#include <numbers>

#include "mesh/winding.hpp"

namespace tf::mesh {
namespace {

constexpr double kPi = std::numbers::pi;

}  // namespace

double layout_winding_factor(const Winding& w, int phase, int mechanical_order) {
  std::complex<double> sum = 0.0;
  double conductors = 0.0;
  for (const CoilSide& s : w.sides) {
    if (s.phase != phase) continue;
    sum += static_cast<double>(s.direction * s.turns) * std::polar(1.0, mechanical_order * s.angle);
    conductors += s.turns;
  }
  return conductors > 0.0 ? std::abs(sum) / conductors : 0.0;
}

std::vector<WindingFactor> winding_factors(const Winding& w, int max_order) {
  const int p = w.spec.pole_pairs();
  const bool closed_form = w.rule == LayoutRule::phase_belts;
  const double q = w.slots_per_pole_per_phase();
  const double alpha = 2 * kPi * p / w.n_positions;
  const double pitch_ratio = w.spec.coil_pitch / (static_cast<double>(w.n_positions) / w.spec.n_poles);
  const double none = std::numeric_limits<double>::quiet_NaN();
  std::vector<WindingFactor> factors;
  for (int nu = 1; nu <= max_order; ++nu) {
    WindingFactor f{nu, none, none, none, layout_winding_factor(w, 0, nu * p)};
    if (closed_form) {
      const double den = q * std::sin(nu * alpha / 2);
      // Slot harmonics, where sin(nu alpha/2) = 0, carry the fundamental's distribution factor.
      f.distribution = std::abs(den) < 1e-12 ? 1.0 : std::abs(std::sin(nu * q * alpha / 2) / den);
      f.pitch = std::abs(std::sin(nu * pitch_ratio * kPi / 2));
      // Even orders cancel between the north and south poles of a winding of alternating polarity.
      f.total = (nu % 2 == 1) ? f.distribution * f.pitch : 0.0;
    }
    factors.push_back(f);
  }
  return factors;
}

std::vector<std::pair<int, double>> space_orders(const Winding& w, int max_order) {
  std::vector<std::pair<int, double>> orders;
  for (int n = 1; n <= max_order; ++n) {
    const double k = layout_winding_factor(w, 0, n);
    if (k > 1e-9) orders.push_back({n, k});
  }
  return orders;
}

}  // namespace tf::mesh
