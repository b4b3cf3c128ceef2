#pragma once
// First-order triangle kernels for -div(nu grad a) + sigma (j omega a + omega_r da/dtheta) = j,
// with a = A_z and B = curl(a e_z). Every kernel has the same shape, (vertices, coefficient) ->
// 3 by 3 element matrix, so one assembly loop (solver/assemble.hpp) serves them all.

#include <Eigen/Core>

namespace tf::solver {

using TriangleXY = Eigen::Matrix<double, 3, 2>;  ///< 3 by 2 vertex coordinates [m], counter-clockwise

/// Gradients of the three barycentric shape functions, 3 by 2 [1/m], and twice the area [m^2].
Eigen::Matrix<double, 3, 2> p1_gradients(const TriangleXY& xy, double& twice_area);

/// Element stiffness of -div(nu grad a): K_ij = nu * area * grad(phi_i) . grad(phi_j).
/// nu: reluctivity [m/H]. Symmetric, rows sum to zero; unchanged by rotation and scaling.
Eigen::Matrix3d p1_stiffness(const TriangleXY& xy, double nu);

/// Element mass M_ij = sigma int phi_i phi_j = sigma area/12 (1 + delta_ij).
/// sigma: conductivity [S/m] (any coefficient). Symmetric; all entries sum to sigma * area.
Eigen::Matrix3d p1_mass(const TriangleXY& xy, double sigma);

/// Element motion matrix C_ij = sigma int phi_i dphi_j/dtheta, with d/dtheta = x d/dy - y d/dx
/// (counter-clockwise about the origin) and int phi_i x = area/12 (x_1 + x_2 + x_3 + x_i).
/// sigma: conductivity [S/m]. Rows sum to zero (a constant does not change along theta).
Eigen::Matrix3d p1_motion(const TriangleXY& xy, double sigma);

/// Rate of change of the element energy (nu/2) |grad a|^2 area as its vertices move with velocities
/// v (3 by 2, any unit per unit of the parameter), the nodal potentials a held: the local virtual
/// work of J. L. Coulomb (IEEE Trans. Magn. 19(6), 1983, from memory). With G = d(v)/d(x, y), the
/// velocity's gradient on the triangle, the gradient of a changes by -G^T grad a and the area by
/// area tr G, so the rate is nu area (|grad a|^2 tr G / 2 - grad a^T G grad a); 0 for a rigid motion.
double p1_energy_rate(const TriangleXY& xy, const Eigen::Vector3d& a, const TriangleXY& v, double nu);

/// Flux density (B_x, B_y) = (da/dy, -da/dx) [T] of nodal potentials a [Wb/m] on one triangle.
Eigen::Vector2d p1_flux_density(const TriangleXY& xy, const Eigen::Vector3d& a);

}  // namespace tf::solver
