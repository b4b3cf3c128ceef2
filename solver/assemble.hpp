#pragma once
// Global system of the 2D A-formulation: K a = f, K_ij = sum_e int_e nu grad(phi_i) . grad(phi_j).

#include <vector>

#include <Eigen/Core>
#include <Eigen/SparseCore>

#include "mesh/mesh.hpp"
#include "mesh/winding.hpp"
#include "solver/dofs.hpp"
#include "solver/materials.hpp"

namespace tf::solver {

/// Reluctivity nu = 1/(mu0 mu_r) [m/H] of each region, indexed like m.regions.
std::vector<double> region_reluctivity(const mesh::Mesh& m, const Materials& materials);

/// Stiffness matrix, #dofs by #dofs, symmetric positive definite when some node has A = 0.
/// Triplets are collected once and summed by setFromTriplets.
Eigen::SparseMatrix<double> assemble_stiffness(const mesh::Mesh& m, const DofMap& d, const std::vector<double>& nu);

/// Load vectors, #dofs by #phases: column k is f for 1 A of terminal current in phase k alone.
/// Coil sides carry J = turns * sign * i / (parallel paths * coil-side area) [A/m^2], uniform.
/// A sector model (m.symmetry) takes the sides in its own slots; mesh::choose_sector has checked
/// that the others are their (anti-)periodic images. Every assembly here honours d.sign_of_node.
Eigen::MatrixXd phase_loads(const mesh::Mesh& m, const DofMap& d, const mesh::Winding& w);

/// Load vector of a current density given per region [A/m^2], uniform in each region.
Eigen::VectorXd region_current_load(const mesh::Mesh& m, const DofMap& d, const std::vector<double>& j);

}  // namespace tf::solver
