#pragma once
// An invented surface-magnet machine for comparing sector models with the full model: the 24-slot
// semi-closed stator of sample_geometry.hpp with a 4-pole three-phase double-layer winding of
// 5/6 pitch, and a 4-pole surface-magnet rotor (no real machine).

#include <numbers>
#include <vector>

#include <Eigen/Core>

#include <doctest/doctest.h>

#include "mesh/build.hpp"
#include "mesh/geometry.hpp"
#include "mesh/symmetry.hpp"
#include "mesh/winding.hpp"
#include "solver/assemble.hpp"
#include "solver/coefficients.hpp"
#include "solver/dofs.hpp"
#include "solver/magnets.hpp"
#include "solver/spd_solver.hpp"
#include "support/sample_geometry.hpp"
#include "support/winding_spec.hpp"

namespace tf::testing {

/// semi_closed_stator() with 3 mm radial magnets over 80 % of each pole pitch; the magnets'
/// surface stays at the rotor radius 49.6 mm, so the gap is 0.4 mm.
inline mesh::Geometry magnet_machine() {
  mesh::Geometry g = semi_closed_stator();
  g.rotor.kind = mesh::RotorKind::surface_magnet;
  g.rotor.magnets = {.n_poles = 4,
                     .thickness = 0.003,
                     .arc = 0.8 * std::numbers::pi / 2,
                     .direction = mesh::Magnetization::radial};
  return g;
}

/// 24 slots, 4 poles, double layer, coil pitch 5 of 6 slots, 10 conductors per coil side.
inline mesh::Winding magnet_machine_winding(const mesh::Geometry& g) {
  return mesh::lay_out(winding_spec(3, 4, 2, 5, 10), g.stator);
}

/// The magnet machine meshed whole and as the sector choose_sector picks (a quarter, anti-periodic).
struct FullAndSector {
  mesh::Mesh full, sector;
};
inline FullAndSector full_and_sector(const mesh::Geometry& g, const mesh::Winding& w) {
  const auto choice = mesh::choose_sector(g, w);
  REQUIRE(choice.has_value());
  return {mesh::build(g, {2, false}, {}), mesh::build(g, {2, false}, mesh::with_sector({}, *choice))};
}

/// Balanced three-phase currents [A] at electrical angle wt: i_k = peak cos(wt - 2 pi k / 3).
inline std::vector<double> three_phase_currents(double peak, double wt) {
  std::vector<double> i;
  for (int k = 0; k < 3; ++k) i.push_back(peak * std::cos(wt - 2 * std::numbers::pi * k / 3));
  return i;
}

/// Nodal A [Wb/m] of the linear field (iron mu_r 2000) of magnets and phase currents [A] with the
/// rotor turned by `shift` sliding-circle pitches.
inline Eigen::VectorXd linear_field(const mesh::Mesh& m, const mesh::Geometry& g, const mesh::Winding& w,
                                    const std::vector<double>& currents, int shift) {
  const solver::Materials mat{.stator_iron_mu_r = 2000, .rotor_iron_mu_r = 2000};
  const solver::DofMap d = solver::number_dofs(m, shift);
  const auto K = solver::assemble_stiffness(m, d, solver::region_coefficients(m, mat).nu);
  const Eigen::Map<const Eigen::VectorXd> i(currents.data(), static_cast<Eigen::Index>(currents.size()));
  const Eigen::VectorXd f =
      solver::phase_loads(m, d, w) * i + solver::magnet_load(m, d, mat, solver::magnet_layout(g.rotor));
  solver::SpdSolver spd;
  spd.analyse(K);
  spd.factorize(K);
  return solver::to_nodes(d, spd.solve(f)).col(0);
}

}  // namespace tf::testing
