#pragma once
// Slotless machine with two sinusoidal current sheets for torque and inductance checks, on a
// structured polar mesh (no Gmsh): rotor iron 0..R_r, gap R_r..R_s split by the sliding circle at
// mid-gap, stator iron R_s..R_o with A = 0 at R_o. The rotor sheet lies on the rotor surface (r_i)
// and the stator sheet on the bore (r_o), i.e. on the edges of the gap band, as nodal line loads.

#include <cmath>
#include <functional>
#include <numbers>
#include <vector>

#include "mesh/mesh.hpp"
#include "solver/assemble.hpp"
#include "solver/dofs.hpp"
#include "solver/spd_solver.hpp"
#include "support/polar_mesh.hpp"
#include "support/sheet_load.hpp"

namespace tf::testing {

struct TwoSheetMachine {
  int p = 2;
  double r_rotor = 0.049, r_stator = 0.050, r_outer = 0.080;  // [m]
  /// Both irons. 1e6 leaves an offset of 6e-5 in the torque (the closed form's 1/(1 - x^{2p}) = 13
  /// amplifies 1/mu_r); 1e9 lets the second-order convergence show down to 1e-5.
  double mu_iron = 1e9;
  int level = 0;  ///< refinement: each level halves every element size
};

/// The mesh of a TwoSheetMachine, with gap_inner_radius and gap_outer_radius set.
inline mesh::Mesh two_sheet_mesh(const TwoSheetMachine& s) {
  const int k = 1 << s.level;
  const double r_mid = 0.5 * (s.r_rotor + s.r_stator);
  mesh::Mesh m = polar_mesh(0.0,
                            {{0.6 * s.r_rotor, 3 * k, mesh::RegionKind::rotor_iron, "rotor core"},
                             {s.r_rotor, 6 * k, mesh::RegionKind::rotor_iron, "rotor rim"},
                             {r_mid, k, mesh::RegionKind::gap, "gap rotor side"},
                             {s.r_stator, k, mesh::RegionKind::gap, "gap stator side"},
                             {s.r_outer, 8 * k, mesh::RegionKind::stator_iron, "stator"}},
                            240 * k, 2);
  m.gap_inner_radius = s.r_rotor;
  m.gap_outer_radius = s.r_stator;
  return m;
}

/// Nodes on the circle of radius r (the structured mesh puts one ring there), in angular order.
inline std::vector<int> ring_at(const mesh::Mesh& m, double r) {
  std::vector<int> ring;
  for (int node = 0; node < m.n_nodes(); ++node)
    if (std::abs(m.nodes.row(node).norm() - r) < 1e-12) ring.push_back(node);
  return ring;
}

/// One linear solve: the dof map, the load [A] and the solution [Wb/m] (dofs and nodes).
struct SheetSolution {
  solver::DofMap dofs;
  Eigen::VectorXd load, solution, a_nodes;
};

/// Solves with surface currents k_rotor(theta') on the rotor surface (theta' in the rotor's own
/// frame) and k_stator(theta) on the bore, the rotor turned by rotor_shift node pitches.
inline SheetSolution solve_sheets(const TwoSheetMachine& s, const mesh::Mesh& m,
                                  const std::function<double(double)>& k_rotor,
                                  const std::function<double(double)>& k_stator, int rotor_shift = 0) {
  const double mu0 = 4e-7 * std::numbers::pi;
  std::vector<double> nu;
  for (const auto& r : m.regions) nu.push_back(r.kind == mesh::RegionKind::gap ? 1 / mu0 : 1 / (mu0 * s.mu_iron));
  SheetSolution out;
  out.dofs = solver::number_dofs(m, rotor_shift);
  const auto K = solver::assemble_stiffness(m, out.dofs, nu);
  out.load = sheet_load(m, out.dofs, ring_at(m, s.r_rotor), k_rotor) +
             sheet_load(m, out.dofs, ring_at(m, s.r_stator), k_stator);
  solver::SpdSolver solver;
  solver.analyse(K);
  solver.factorize(K);
  out.solution = solver.solve(out.load);
  out.a_nodes = solver::to_nodes(out.dofs, out.solution);
  return out;
}

}  // namespace tf::testing
