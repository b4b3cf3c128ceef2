#pragma once
// The gap-band integral of Arkkio's method, shared by the magnetostatic (real) and time-harmonic
// (complex phasor) torques: one loop over the gap triangles, templated on the scalar of A.

#include <complex>
#include <numbers>

#include <Eigen/Core>

#include "mesh/mesh.hpp"
#include "solver/p1.hpp"
#include "solver/materials.hpp"

namespace tf::post::detail {

/// The Maxwell-stress product B_r B_theta of a real field [T^2].
inline double stress_product(double br, double bt) { return br * bt; }

/// Its time average for peak phasors, 1/2 Re(B_r conj(B_theta)) [T^2].
inline double stress_product(std::complex<double> br, std::complex<double> bt) {
  return 0.5 * std::real(br * std::conj(bt));
}

/// Arkkio's torque [N m], counter-clockwise positive: the Maxwell stress averaged over the whole gap
/// band r_i..r_o (A. Arkkio, Analysis of induction motors based on the numerical solution of the
/// magnetic field and circuit equations, Helsinki University of Technology, 1987),
///   T = L / (mu0 (r_o - r_i)) * integral over the band of r B_r B_theta dS,
/// over every triangle of RegionKind::gap (both sides of the sliding circle). B is constant on a
/// first-order triangle; it is split into polar components in the frame of the centroid. Rotor-side
/// triangles hold B in the rotor's frame, but polar components are the same in either frame.
/// a: #nodes nodal A_z [Wb/m] (real, or complex peak phasors). Returns the whole machine's torque
/// (a sector model's band times its copies).
template <class Scalar>
double arkkio_band_torque(const mesh::Mesh& m, const Eigen::Matrix<Scalar, Eigen::Dynamic, 1>& a,
                          double stack_length) {
  constexpr double mu0 = solver::kMu0;
  double sum = 0.0;
  for (int t = 0; t < m.n_triangles(); ++t) {
    if (m.regions[m.triangle_region(t)].kind != mesh::RegionKind::gap) continue;
    solver::TriangleXY xy;
    Eigen::Matrix<Scalar, 3, 1> at;
    for (int i = 0; i < 3; ++i) {
      xy.row(i) = m.nodes.row(m.triangles(t, i));
      at(i) = a(m.triangles(t, i));
    }
    double twice_area = 0.0;
    const Eigen::Matrix<double, 3, 2> g = solver::p1_gradients(xy, twice_area);
    const Eigen::Matrix<Scalar, 2, 1> grad = g.transpose().template cast<Scalar>() * at;  // (dA/dx, dA/dy)
    const Eigen::Vector2d c = xy.colwise().mean().transpose();
    const double r = c.norm(), cos_t = c(0) / r, sin_t = c(1) / r;
    const Scalar bx = grad(1), by = -grad(0);
    const Scalar br = cos_t * bx + sin_t * by, bt = -sin_t * bx + cos_t * by;
    sum += 0.5 * twice_area * r * stress_product(br, bt);
  }
  // A sector model's band is 1/copies of the whole; its images carry the same stress (B_r B_theta
  // is even in the sign of A), so the whole machine's torque is copies times the sector's.
  return m.symmetry.copies * stack_length * sum / (mu0 * (m.gap_outer_radius - m.gap_inner_radius));
}

}  // namespace tf::post::detail
