#include "mesh/winding.hpp"

#include <cassert>
#include <cmath>
#include <numbers>

namespace tf::mesh {
namespace {

constexpr double kPi = std::numbers::pi;

/// Belt i of 2m (each 180°/m electrical wide, counter-clockwise from slot 1's belt) holds
/// this phase and direction. Odd m: +A, -C, +B, -A, +C, -B for m = 3; even m: +A, +B, -A, -B for m = 2.
std::pair<int, int> belt_phase(int belt, int m) {
  if (m % 2 == 0) return {belt % m, belt < m ? 1 : -1};
  for (int phase = 0; phase < m; ++phase) {
    if ((2 * phase) % (2 * m) == belt) return {phase, 1};
    if ((2 * phase + m) % (2 * m) == belt) return {phase, -1};
  }
  assert(false);
  return {0, 1};
}

}  // namespace

double Winding::series_turns() const {
  double conductors = 0.0;
  for (const CoilSide& s : sides)
    if (s.phase == 0) conductors += s.turns;
  return conductors / 2.0 / spec.parallel_paths;
}

Winding lay_out(const WindingSpec& spec, int n_slots) {
  const int m = spec.n_phases, p = spec.pole_pairs();
  assert(n_slots % (2 * p * m) == 0);
  Winding w{spec, n_slots, {}, 0.0};
  const int q = n_slots / (2 * p * m);
  // Slots 1..q form the +A belt; with its go sides centred there, A's axis lies 90° behind
  // (a current sheet cos(p theta) gives B_r ~ -sin(p theta)).
  const double slot_angle = 2 * kPi * p / n_slots;
  // A short-pitched second layer is the first shifted back by (pole pitch - coil pitch) slots.
  const double shortening = (spec.n_layers == 2) ? (n_slots / (2.0 * p) - spec.coil_pitch) : 0.0;
  w.phase_a_axis = 0.5 * (q - 1 - shortening) * slot_angle - 0.5 * kPi;
  std::vector<std::pair<int, int>> top(n_slots);
  for (int s = 0; s < n_slots; ++s) {
    const int belt = (s / q) % (2 * m);
    top[s] = belt_phase(belt, m);
    w.sides.push_back({s + 1, 1, top[s].first, top[s].second, spec.turns_per_coil});
  }
  if (spec.n_layers == 2) {
    for (int s = 0; s < n_slots; ++s) {
      const auto& go = top[((s - spec.coil_pitch) % n_slots + n_slots) % n_slots];
      w.sides.push_back({s + 1, 2, go.first, -go.second, spec.turns_per_coil});
    }
  }
  return w;
}

double layout_winding_factor(const Winding& w, int phase, int mechanical_order) {
  std::complex<double> sum = 0.0;
  double conductors = 0.0;
  for (const CoilSide& s : w.sides) {
    if (s.phase != phase) continue;
    const double theta = 2 * kPi * (s.slot - 1) / w.n_slots;
    sum += static_cast<double>(s.direction * s.turns) * std::polar(1.0, mechanical_order * theta);
    conductors += s.turns;
  }
  return conductors > 0.0 ? std::abs(sum) / conductors : 0.0;
}

std::vector<WindingFactor> winding_factors(const Winding& w, int max_order) {
  const int p = w.spec.pole_pairs();
  const double q = w.slots_per_pole_per_phase();
  const double alpha = 2 * kPi * p / w.n_slots;
  const double pitch_ratio = w.spec.coil_pitch / (static_cast<double>(w.n_slots) / w.spec.n_poles);
  std::vector<WindingFactor> factors;
  for (int nu = 1; nu <= max_order; ++nu) {
    WindingFactor f;
    f.order = nu;
    const double den = q * std::sin(nu * alpha / 2);
    // Slot harmonics where sin(nu alpha/2) = 0 carry the fundamental's distribution factor in magnitude.
    f.distribution = std::abs(den) < 1e-12 ? 1.0 : std::abs(std::sin(nu * q * alpha / 2) / den);
    f.pitch = std::abs(std::sin(nu * pitch_ratio * kPi / 2));
    // Even orders cancel between the north and south poles of a winding of alternating polarity.
    f.total = (nu % 2 == 1) ? f.distribution * f.pitch : 0.0;
    f.from_layout = layout_winding_factor(w, 0, nu * p);
    factors.push_back(f);
  }
  return factors;
}

}  // namespace tf::mesh
