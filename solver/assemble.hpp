#pragma once
// Global matrices and loads of the 2D A-formulation, all through one loop over triangles.
// Signs (sector models, solver/dofs.hpp): a node's potential is s x(dof) with s = +-1, so every
// element contributes K_ij += s_i s_j k_e(i, j) and f_i += s_i f_e(i); fixed nodes (dof -1) drop out.

#include <vector>

#include <Eigen/Core>
#include <Eigen/SparseCore>

#include "mesh/mesh.hpp"
#include "mesh/winding.hpp"
#include "solver/dofs.hpp"
#include "solver/p1.hpp"

namespace tf::solver {

/// Vertex coordinates of triangle t, 3 by 2 [m].
TriangleXY triangle_xy(const mesh::Mesh& m, int t);

/// The unknowns of one triangle's vertices: A at vertex i = signs(i) * x(dofs(i)); dofs(i) = -1 where A = 0.
struct ElementDofs {
  Eigen::Vector3i dofs;
  Eigen::Vector3d signs;
};
ElementDofs element_dofs(const mesh::Mesh& m, const DofMap& d, int t);

/// The element's nodal potentials (3) from unknowns x (#dofs): signs(i) * x(dofs(i)), 0 where fixed.
inline Eigen::Vector3d element_values(const ElementDofs& e, const Eigen::VectorXd& x) {
  Eigen::Vector3d ae;
  for (int i = 0; i < 3; ++i) ae(i) = e.dofs(i) >= 0 ? e.signs(i) * x(e.dofs(i)) : 0.0;
  return ae;
}

/// An element kernel of solver/p1.hpp: (vertices [m], coefficient) -> 3 by 3 element matrix.
using ElementKernel = Eigen::Matrix3d (*)(const TriangleXY&, double);

/// Sum over triangles of s_i s_j kernel(xy_t, coefficient[region of t]), #dofs by #dofs.
/// coefficient: indexed like m.regions; triangles whose coefficient is 0 are skipped. Triplets are
/// collected once and summed by setFromTriplets. E.g. (nu, p1_stiffness), (sigma, p1_mass).
Eigen::SparseMatrix<double> assemble_matrix(const mesh::Mesh& m, const DofMap& d,
                                            const std::vector<double>& coefficient, ElementKernel kernel);

/// Stiffness matrix of -div(nu grad a), #dofs by #dofs, symmetric positive definite when some node
/// has A = 0. nu: reluctivity [m/H] per region (RegionCoefficients::nu, solver/coefficients.hpp).
Eigen::SparseMatrix<double> assemble_stiffness(const mesh::Mesh& m, const DofMap& d, const std::vector<double>& nu);

/// Load vectors, #dofs by #phases: column k is f for 1 A of terminal current in phase k alone.
/// Coil sides carry J = turns * sign * i / (parallel paths * coil-side area) [A/m^2], uniform.
/// A sector model (m.symmetry) takes the sides in its own slots; mesh::choose_sector has checked
/// that the others are their (anti-)periodic images.
Eigen::MatrixXd phase_loads(const mesh::Mesh& m, const DofMap& d, const mesh::Winding& w);

/// Load vector of a current density given per region [A/m^2], uniform in each region.
Eigen::VectorXd region_current_load(const mesh::Mesh& m, const DofMap& d, const std::vector<double>& j);

}  // namespace tf::solver
