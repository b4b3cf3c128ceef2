#pragma once
// Joule loss of induced currents from the solver's own mass matrix, for solver-level tests.

#include <complex>
#include <vector>

#include <Eigen/Core>

#include "mesh/mesh.hpp"
#include "solver/assemble.hpp"
#include "solver/dofs.hpp"
#include "solver/p1.hpp"

namespace tf::testing {

/// Time-averaged loss per metre [W/m] in each region (indexed like m.regions) of the current density
/// J = -j omega sigma A of nodal peak phasors a (#nodes): 1/2 int |J|^2 / sigma = 1/2 omega^2 a^H M_r a,
/// with M_r the sigma-weighted mass matrix of region r alone (exact: A is linear on each triangle).
inline std::vector<double> region_joule_losses(const mesh::Mesh& m, const Eigen::VectorXcd& a,
                                               const std::vector<double>& sigma, double omega) {
  solver::DofMap every_node;
  for (int i = 0; i < m.n_nodes(); ++i) every_node.dof_of_node.push_back(every_node.n_dofs++);
  std::vector<double> loss(m.regions.size(), 0.0);
  for (std::size_t r = 0; r < m.regions.size(); ++r) {
    if (sigma[r] == 0.0) continue;
    std::vector<double> only(m.regions.size(), 0.0);
    only[r] = sigma[r];
    const Eigen::SparseMatrix<double> mass = solver::assemble_matrix(m, every_node, only, solver::p1_mass);
    const Eigen::VectorXcd ma = mass.cast<std::complex<double>>() * a;
    loss[r] = 0.5 * omega * omega * std::real(a.dot(ma));  // a.dot(b) = a^H b
  }
  return loss;
}

}  // namespace tf::testing
