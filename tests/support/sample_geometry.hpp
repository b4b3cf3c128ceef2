#pragma once
// Small invented stator geometries for tests (made-up numbers, no real machine).

#include <numbers>

#include "mesh/geometry.hpp"

namespace tf::testing {

/// 36 slots, open rectangular slots, iron rotor: bore 60 mm, outer 100 mm, 0.5 mm gap.
inline mesh::Geometry open_slot_stator() {
  mesh::Geometry g;
  g.stator.bore_radius = 0.060;
  g.stator.outer_radius = 0.100;
  g.stator.n_positions = 36;
  g.stator.slot = {mesh::SlotShape::open, 0.005, 0.018, 0.0, 0.0, 0.0};
  g.rotor.outer_radius = 0.0595;
  g.rotor.shaft_radius = 0.020;
  return g;
}

/// 24 slots, semi-closed slots with tips and a wedge: bore 50 mm, outer 85 mm, 0.4 mm gap.
inline mesh::Geometry semi_closed_stator() {
  mesh::Geometry g;
  g.stator.bore_radius = 0.050;
  g.stator.outer_radius = 0.085;
  g.stator.n_positions = 24;
  g.stator.slot = {mesh::SlotShape::semi_closed, 0.007, 0.016, 0.0025, 0.0008, 0.0007};
  g.rotor.outer_radius = 0.0496;
  g.rotor.shaft_radius = 0.016;
  return g;
}

/// 4 salient poles (the stator of cases/salient4_two_phase.toml): bore 30 mm, outer 60 mm, shoes
/// spanning 60° and 3 mm thick, bodies 14 mm wide and 18 mm long (a 9 mm yoke), coil sides 8 mm by
/// 14 mm, on an iron rotor with a 0.5 mm gap.
inline mesh::Geometry salient_stator() {
  mesh::Geometry g;
  g.stator.kind = mesh::StatorKind::salient;
  g.stator.bore_radius = 0.030;
  g.stator.outer_radius = 0.060;
  g.stator.n_positions = 4;
  g.stator.poles = {.shoe_arc = std::numbers::pi / 3,
                    .shoe_height = 0.003,
                    .body_width = 0.014,
                    .body_height = 0.018,
                    .coil_width = 0.008,
                    .coil_height = 0.014};
  g.rotor.outer_radius = 0.0295;
  g.rotor.shaft_radius = 0.008;
  return g;
}

}  // namespace tf::testing
