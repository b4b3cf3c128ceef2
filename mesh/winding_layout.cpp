// Laying out windings: phase belts (integral slot), the star of slots (fractional slot, tooth
// coils, salient poles) and the user's own slot table.

#include <cmath>
#include <complex>
#include <numbers>
#include <numeric>
#include <string>

#include "mesh/mesh.hpp"
#include "mesh/salient_outline.hpp"
#include "mesh/winding.hpp"

namespace tf::mesh {
namespace {

constexpr double kPi = std::numbers::pi;

double phase_shift(int m) { return m % 2 ? 2 * kPi / m : kPi / m; }

double slot_angle(int slot, int n_positions) { return 2 * kPi * (slot - 1) / n_positions; }

int wrap_slot(int slot, int n_positions) { return ((slot - 1) % n_positions + n_positions) % n_positions + 1; }

/// Belt i of 2m (each 180°/m electrical wide, counter-clockwise): its phase and direction.
/// Odd m: +A, -C, +B, -A, +C, -B for m = 3; even m: +A, +B, -A, -B for m = 2.
std::pair<int, int> belt_phase(int belt, int m) {
  if (m % 2 == 0) return {belt % m, belt < m ? 1 : -1};
  for (int phase = 0; phase < m; ++phase) {
    if ((2 * phase) % (2 * m) == belt) return {phase, 1};
    if ((2 * phase + m) % (2 * m) == belt) return {phase, -1};
  }
  return {0, 1};
}

/// The phasor sum of each phase, sum over its sides of s N e^{j p theta}.
std::vector<std::complex<double>> phase_phasors(const std::vector<CoilSide>& sides, int m, int p) {
  std::vector<std::complex<double>> sum(m, 0.0);
  for (const auto& s : sides) sum[s.phase] += double(s.direction * s.turns) * std::polar(1.0, p * s.angle);
  return sum;
}

/// Equal conductors in every phase, as many go as return.
bool balanced_in_turns(const std::vector<CoilSide>& sides, int m) {
  // 64-bit sums: a phase may hold thousands of sides of up to 1e5 turns each.
  std::vector<long long> conductors(m, 0), net(m, 0);
  for (const auto& s : sides) {
    conductors[s.phase] += s.turns;
    net[s.phase] += s.direction * s.turns;
  }
  for (int k = 0; k < m; ++k)
    if (conductors[k] != conductors[0] || net[k] != 0) return false;
  return conductors[0] > 0;
}

/// Balanced in turns, with fundamentals of equal size whose axes lie a phase shift apart.
bool balanced(const std::vector<CoilSide>& sides, int m, int p) {
  if (!balanced_in_turns(sides, m)) return false;
  double conductors = 0.0;
  for (const auto& s : sides) conductors += s.phase == 0 ? s.turns : 0;
  const auto sum = phase_phasors(sides, m, p);
  if (std::abs(sum[0]) < 1e-9 * conductors) return false;
  for (int k = 0; k < m; ++k) {
    if (std::abs(std::abs(sum[k]) - std::abs(sum[0])) > 1e-9 * std::abs(sum[0])) return false;
    if (std::abs(std::remainder(std::arg(sum[k] / sum[0]) - k * phase_shift(m), 2 * kPi)) > 1e-6) return false;
  }
  return true;
}

/// A coil before it has a phase: its go and return sides and the electrical angle of its go side.
struct Coil {
  CoilSide go, back;
  double phasor;
};

/// The star of slots: coil phasors sorted into 2m sectors of 180°/m; of all sector positions,
/// the balanced one with the largest fundamental. Empty if no position balances the phases.
std::vector<CoilSide> star_of_slots(const std::vector<Coil>& coils, int m, int p) {
  const double w = kPi / m;
  std::vector<CoilSide> best;
  double best_score = -1.0;
  for (const Coil& c : coils)
    for (double offset : {c.phasor - 1e-7, c.phasor - 0.5 * w}) {
      std::vector<CoilSide> sides;
      for (const Coil& k : coils) {
        double a = std::fmod(k.phasor - offset, 2 * kPi);
        if (a < 0) a += 2 * kPi;
        const auto [phase, direction] = belt_phase(static_cast<int>(a / w) % (2 * m), m);
        sides.push_back({k.go.slot, k.go.layer, phase, direction, k.go.turns, k.go.angle});
        sides.push_back({k.back.slot, k.back.layer, phase, -direction, k.back.turns, k.back.angle});
      }
      if (!balanced(sides, m, p)) continue;
      const double score = std::abs(phase_phasors(sides, m, p)[0]);
      if (score > best_score + 1e-9) {
        best_score = score;
        best = sides;
      }
    }
  return best;
}

std::vector<CoilSide> phase_belts(const WindingSpec& spec, int n_positions) {
  const int m = spec.n_phases, q = n_positions / (spec.n_poles * m);
  std::vector<CoilSide> sides;
  for (int s = 1; s <= n_positions; ++s) {
    const auto [phase, direction] = belt_phase(((s - 1) / q) % (2 * m), m);
    sides.push_back({s, 1, phase, direction, spec.turns_per_coil, slot_angle(s, n_positions)});
  }
  if (spec.n_layers == 2)
    for (int s = 1; s <= n_positions; ++s) {
      const CoilSide& go = sides[wrap_slot(s - spec.coil_pitch, n_positions) - 1];
      sides.push_back({s, 2, go.phase, -go.direction, spec.turns_per_coil, slot_angle(s, n_positions)});
    }
  return sides;
}

/// Coils of a slotted stator for the star of slots: every slot starts a coil in a double layer;
/// every other slot in a single layer (so each slot holds one side).
std::vector<Coil> slot_coils(const WindingSpec& spec, int n_positions) {
  std::vector<Coil> coils;
  const int step = spec.n_layers == 2 ? 1 : 2;
  const int back_layer = spec.n_layers == 2 ? 2 : 1;
  for (int s = 1; s <= n_positions; s += step) {
    const int r = wrap_slot(s + spec.coil_pitch, n_positions);
    coils.push_back({{s, 1, 0, 1, spec.turns_per_coil, slot_angle(s, n_positions)},
                     {r, back_layer, 0, -1, spec.turns_per_coil, slot_angle(r, n_positions)},
                     spec.pole_pairs() * slot_angle(s, n_positions)});
  }
  return coils;
}

/// One coil round each pole body: layer 1 (counter-clockwise of the body) carries the go side,
/// placed for the winding factors at the centre of its rectangle.
std::vector<Coil> pole_coils(const WindingSpec& spec, const StatorGeometry& st) {
  const PoleOutline o = pole_outline(st);
  const double half = std::atan2(0.5 * (o.body_half_width + o.coil_outer_y), 0.5 * (o.coil_floor + o.coil_top));
  std::vector<Coil> coils;
  for (int k = 1; k <= st.n_positions; ++k) {
    const double centre = slot_angle(k, st.n_positions);
    coils.push_back({{k, 1, 0, 1, spec.turns_per_coil, centre + half},
                     {k, 2, 0, -1, spec.turns_per_coil, centre - half},
                     spec.pole_pairs() * centre});
  }
  return coils;
}

std::vector<CoilSide> table_sides(const WindingSpec& spec, const StatorGeometry& st) {
  std::vector<CoilSide> sides = spec.explicit_sides;
  for (auto& s : sides) s.angle = slot_angle(s.slot, st.n_positions);
  return sides;
}

bool integral_slot(const WindingSpec& spec, const StatorGeometry& st) {
  return st.kind != StatorKind::salient && st.n_positions % (spec.n_poles * spec.n_phases) == 0;
}

/// The layout by the rule that applies; sides are empty when the star finds no balanced layout.
Winding by_rule(const WindingSpec& spec, const StatorGeometry& st) {
  Winding w{spec, st.n_positions, LayoutRule::table, {}, 0.0};
  if (!spec.explicit_sides.empty()) {
    w.sides = table_sides(spec, st);
  } else if (st.kind == StatorKind::salient) {
    w.rule = LayoutRule::pole_coils;
    w.sides = star_of_slots(pole_coils(spec, st), spec.n_phases, spec.pole_pairs());
  } else if (integral_slot(spec, st)) {
    w.rule = LayoutRule::phase_belts;
    w.sides = phase_belts(spec, st.n_positions);
  } else {
    w.rule = LayoutRule::star_of_slots;
    w.sides = star_of_slots(slot_coils(spec, st.n_positions), spec.n_phases, spec.pole_pairs());
  }
  return w;
}

}  // namespace

double Winding::series_turns() const {
  double conductors = 0.0;
  for (const CoilSide& s : sides)
    if (s.phase == 0) conductors += s.turns;
  return conductors / 2.0 / spec.parallel_paths;
}

int Winding::periodicity() const { return std::gcd(n_positions, spec.pole_pairs()); }

std::optional<std::string> layout_problem(const WindingSpec& spec, const StatorGeometry& st) {
  const int Q = st.n_positions;
  if (spec.explicit_sides.empty() && st.kind == StatorKind::slotted) {
    if (spec.coil_pitch < 1 || spec.coil_pitch > Q / 2)
      return "a coil pitch from 1 to Q/2 = " + std::to_string(Q / 2) + " slots";
    if (integral_slot(spec, st) && spec.coil_pitch > Q / spec.n_poles)
      return "integral-slot windings here have a coil pitch of at most the pole pitch, " +
             std::to_string(Q / spec.n_poles) + " slots";
    if (integral_slot(spec, st) && spec.n_layers == 1 && spec.coil_pitch != Q / spec.n_poles)
      return "single-layer integral-slot windings are laid out full pitch, coil pitch " +
             std::to_string(Q / spec.n_poles) + " slots (or use two layers)";
    if (!integral_slot(spec, st) && spec.n_layers == 1 && (Q % 2 || spec.coil_pitch % 2 == 0))
      return "a single-layer fractional-slot winding needs an even number of slots and an odd coil pitch";
  }
  if (!spec.explicit_sides.empty()) {
    if (!balanced_in_turns(table_sides(spec, st), spec.n_phases))
      return "every phase of the slot table needs the same number of conductors, as many go (+) as return (-)";
    return std::nullopt;
  }
  if (by_rule(spec, st).sides.empty())
    return "no balanced layout of " + std::to_string(spec.n_phases) + " phases and " + std::to_string(spec.n_poles) +
           " poles exists on " + std::to_string(Q) + (st.kind == StatorKind::salient ? " salient poles" : " slots") +
           " (the star of slots cannot share the coils equally among the phases)";
  const Winding w = by_rule(spec, st);
  if (!balanced(w.sides, spec.n_phases, spec.pole_pairs()))
    return "the phases are not balanced: every phase needs the same conductors, as many go as return, "
           "and a fundamental of equal size a phase shift apart";
  return std::nullopt;
}

Winding lay_out(const WindingSpec& spec, const StatorGeometry& st) {
  if (const auto problem = layout_problem(spec, st)) throw MeshError("winding: " + *problem);
  Winding w = by_rule(spec, st);
  // Phase A's axis: its current-density fundamental peaks at arg(S_A); B_r lags that by 90°
  // (a current sheet cos(p theta) gives B_r ~ -sin(p theta)).
  w.phase_a_axis = std::arg(phase_phasors(w.sides, spec.n_phases, spec.pole_pairs())[0]) - 0.5 * kPi;
  return w;
}

}  // namespace tf::mesh
