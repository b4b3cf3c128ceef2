#pragma once
// TEAM Workshop Problem 30a (K. R. Davey, "TEAM Problem 30a: Induction Motor Analyses",
// International Compumag Society TEAM problem set) built in code, with the values of
// cases/team30a_three_phase.toml, for tests below the app layer: rotor steel 0-20 mm in an
// aluminium sleeve 20-30 mm, gap 30-32 mm, six 45° conductor sectors 32-52 mm, stator steel
// 52-57 mm, air to 0.1 m and an open boundary beyond it; 2892.317 A peak at 60 Hz.

#include <numbers>

#include "mesh/geometry.hpp"
#include "mesh/winding_spec.hpp"
#include "solver/materials.hpp"
#include "solver/supply.hpp"

namespace tf::testing {

struct Team30aModel {
  mesh::Geometry geometry;
  mesh::WindingSpec winding;
  solver::Materials materials;
  solver::Supply supply;
  double stack_length = 1.0;  ///< [m]: results per metre, as the benchmark states them
};

inline Team30aModel team30a_model() {
  Team30aModel c;
  mesh::StatorGeometry& s = c.geometry.stator;
  s.kind = mesh::StatorKind::slotless;
  s.bore_radius = 0.032;
  s.outer_radius = 0.057;
  s.boundary_radius = 0.1;
  s.open_boundary = true;
  s.n_positions = 6;  // conductor sectors centred at 0, 60, ..., 300 degrees
  s.belts.span = 45.0 * std::numbers::pi / 180.0;
  s.belts.outer_radius = 0.052;
  c.geometry.rotor.kind = mesh::RotorKind::iron;
  c.geometry.rotor.outer_radius = 0.030;
  c.geometry.rotor.sleeve_thickness = 0.010;
  c.winding.n_phases = 3;
  c.winding.n_poles = 2;
  c.winding.n_layers = 1;
  c.winding.coil_pitch = 3;  // full pitch: sector k returns in sector k + 3
  c.winding.turns_per_coil = 1;
  c.materials.stator_iron_mu_r = 30.0;
  c.materials.stator_iron_sigma = 0.0;  // laminated
  c.materials.rotor_iron_mu_r = 30.0;
  c.materials.rotor_iron_sigma = 1.6e6;  // solid steel
  c.materials.sleeve_mu_r = 1.0;
  c.materials.sleeve_sigma = 3.72e7;  // aluminium
  c.supply.kind = solver::SupplyKind::balanced;
  c.supply.peak_current = 2892.317;
  c.supply.frequency = 60.0;
  return c;
}

}  // namespace tf::testing
