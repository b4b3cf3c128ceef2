#include "mesh/symmetry.hpp"

#include <algorithm>
#include <map>
#include <tuple>
#include <vector>

namespace tf::mesh {
namespace {

/// What one slot layer carries: (phase, direction, turns) of each coil side, sorted.
using Carried = std::vector<std::tuple<int, int, int>>;
using SlotTable = std::map<std::pair<int, int>, Carried>;  // (slot, layer) -> sides

SlotTable slot_table(const Winding& w) {
  SlotTable t;
  for (const CoilSide& s : w.sides) t[{s.slot, s.layer}].push_back({s.phase, s.direction, s.turns});
  for (auto& [key, sides] : t) std::sort(sides.begin(), sides.end());
  return t;
}

Carried flipped(Carried c) {
  for (auto& [phase, direction, turns] : c) direction = -direction;
  std::sort(c.begin(), c.end());
  return c;
}

/// True when every slot layer s + shift carries what slot layer s does, times `sign`.
bool repeats(const SlotTable& t, int n_positions, int shift, int sign) {
  SlotTable moved;
  for (const auto& [key, sides] : t)
    moved[{(key.first - 1 + shift) % n_positions + 1, key.second}] = sign > 0 ? sides : flipped(sides);
  return moved == t;
}

/// Whether the rotor repeats over `slots` pitches, and with which sign: +1 periodic, -1 anti-periodic,
/// 0 either (no rotor source), nothing when it does not repeat.
std::optional<int> rotor_sign(const RotorGeometry& r, int n_positions, int slots) {
  if (r.kind == RotorKind::surface_magnet) {
    if ((r.magnets.n_poles * slots) % n_positions != 0) return std::nullopt;
    return (r.magnets.n_poles * slots / n_positions) % 2 == 0 ? 1 : -1;
  }
  if (r.kind == RotorKind::slotted && (r.bars.count * slots) % n_positions != 0) return std::nullopt;
  return 0;
}

}  // namespace

std::optional<SectorChoice> choose_sector(const Geometry& g, const Winding& w) {
  const int n_positions = g.stator.n_positions;
  if (w.n_positions != n_positions || n_positions < 2) return std::nullopt;
  const SlotTable table = slot_table(w);
  for (int slots = 1; slots < n_positions; ++slots) {
    if (n_positions % slots != 0) continue;
    const std::optional<int> rotor = rotor_sign(g.rotor, n_positions, slots);
    if (!rotor) continue;
    const int copies = n_positions / slots;
    for (int sign : {1, -1}) {
      if (*rotor != 0 && sign != *rotor) continue;
      if (sign < 0 && copies % 2 != 0) continue;  // the images must close up round the machine
      if (repeats(table, n_positions, slots, sign)) return SectorChoice{slots, copies, sign < 0};
    }
  }
  return std::nullopt;
}

MeshControls with_sector(MeshControls c, const SectorChoice& s) {
  c.sector_slots = s.slots;
  c.anti_periodic = s.anti_periodic;
  return c;
}

}  // namespace tf::mesh
