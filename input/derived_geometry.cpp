#include "input/derived_geometry.hpp"

#include <algorithm>
#include <cmath>
#include <vector>
#include <numbers>
#include <numeric>

#include "input/case_validation.hpp"

namespace tf::input {

double carter_factor(double tau, double b, double g) {
  const double x = b / (2.0 * g);
  const double gamma = 4.0 / std::numbers::pi * (x * std::atan(x) - std::log(std::sqrt(1.0 + x * x)));
  return tau / (tau - gamma * g);
}

double bore_sliver(double r, double w) {
  // The integral over |y| < w/2 of r - sqrt(r^2 - y^2).
  const double a = 0.5 * w;
  return 2.0 * a * r - a * std::sqrt(r * r - a * a) - r * r * std::asin(a / r);
}

namespace {

/// Areas, teeth and Carter's factor of a slotted stator (parallel-sided slots; mesh/sector_shapes.cpp).
void slotted(const mesh::StatorGeometry& s, DerivedGeometry& d) {
  const mesh::Slot& slot = s.slot;
  const double r = s.bore_radius;
  const int n = s.n_positions;
  if (slot.shape == mesh::SlotShape::open) {
    d.tooth_at_bore = tooth_width(r, slot.width, n);
    d.tooth_narrowest = d.tooth_at_bore;
    d.slot_area = slot.width * slot.depth + bore_sliver(r, slot.width);
    d.coil_area = *d.slot_area;
  } else {
    d.tooth_at_bore = tooth_width(r, slot.opening_width, n);
    d.tooth_narrowest = tooth_width(r + slot.tip_height, slot.width, n);
    d.slot_area = slot.opening_width * slot.tip_height + bore_sliver(r, slot.opening_width) +
                  slot.width * (slot.depth - slot.tip_height);
    d.coil_area = slot.width * (slot.depth - slot.tip_height - slot.wedge_height);
  }
  const double opening = slot.shape == mesh::SlotShape::open ? slot.width : slot.opening_width;
  if (d.air_gap) d.carter_factor = carter_factor(d.slot_pitch, opening, *d.air_gap);
}

/// Laid out by rule every slot (pole, belt) holds its layers' coil sides of turns_per_coil
/// conductors; a slot table gives each side's turns.
int conductors_in_fullest_slot(const Case& c) {
  const mesh::WindingSpec& w = c.winding;
  if (w.explicit_sides.empty())
    return (c.geometry.stator.kind == mesh::StatorKind::salient ? 2 : w.n_layers) * w.turns_per_coil;
  std::vector<int> per_slot(c.geometry.stator.n_positions + 1, 0);
  for (const mesh::CoilSide& side : w.explicit_sides) per_slot.at(side.slot) += side.turns;
  return *std::max_element(per_slot.begin(), per_slot.end());
}

}  // namespace

DerivedGeometry derive_geometry(const Case& c) {
  const mesh::StatorGeometry& s = c.geometry.stator;
  const mesh::WindingSpec& w = c.winding;
  DerivedGeometry d;
  if (c.geometry.rotor.kind != mesh::RotorKind::none) d.air_gap = s.bore_radius - c.geometry.rotor.outer_radius;
  d.slot_pitch = 2.0 * std::numbers::pi * s.bore_radius / s.n_positions;
  d.pole_pitch = 2.0 * std::numbers::pi * s.bore_radius / w.n_poles;
  if (s.kind == mesh::StatorKind::slotted) slotted(s, d);
  else if (s.kind == mesh::StatorKind::salient) d.coil_area = 2.0 * s.poles.coil_width * s.poles.coil_height;
  else d.coil_area = 0.5 * s.belts.span * (s.belts.outer_radius * s.belts.outer_radius - s.bore_radius * s.bore_radius);
  d.conductors = conductors_in_fullest_slot(c);
  const int q_den = w.n_poles * w.n_phases;
  const int common = std::gcd(s.n_positions, q_den);
  d.q_numerator = s.n_positions / common;
  d.q_denominator = q_den / common;
  if (c.supply.kind != solver::SupplyKind::stepped_dc) d.synchronous_rpm = 60.0 * c.supply.frequency / w.pole_pairs();
  return d;
}

}  // namespace tf::input
