#pragma once
// First-order triangle kernels for -div(nu grad a) = j, with a = A_z and B = curl(a e_z).

#include <Eigen/Core>

namespace tf::solver {

using TriangleXY = Eigen::Matrix<double, 3, 2>;  ///< 3 by 2 vertex coordinates [m], counter-clockwise

/// Gradients of the three barycentric shape functions, 3 by 2 [1/m], and twice the area [m^2].
Eigen::Matrix<double, 3, 2> p1_gradients(const TriangleXY& xy, double& twice_area);

/// Element stiffness of -div(nu grad a): K_ij = nu * area * grad(phi_i) . grad(phi_j).
/// nu: reluctivity [m/H]. Symmetric, rows sum to zero.
Eigen::Matrix3d p1_stiffness(const TriangleXY& xy, double nu);

/// Flux density (B_x, B_y) = (da/dy, -da/dx) [T] of nodal potentials a [Wb/m] on one triangle.
Eigen::Vector2d p1_flux_density(const TriangleXY& xy, const Eigen::Vector3d& a);

}  // namespace tf::solver
