#include "solver/magnets.hpp"

#include <cmath>
#include <numbers>

#include "solver/p1.hpp"
#include "solver/materials.hpp"

namespace tf::solver {

MagnetLayout magnet_layout(const mesh::RotorGeometry& r) {
  return {r.magnets.n_poles, r.magnets.direction, 0.0};
}

Eigen::Vector2d remanence(const MagnetLayout& layout, double b_r, int pole, const Eigen::Vector2d& centroid) {
  const double sign = pole % 2 == 1 ? 1.0 : -1.0;
  if (layout.direction == mesh::Magnetization::radial) return sign * b_r * centroid.normalized();
  const double centre = layout.first_pole_angle + 2 * std::numbers::pi * (pole - 1) / layout.n_poles;
  return sign * b_r * Eigen::Vector2d(std::cos(centre), std::sin(centre));
}

Eigen::VectorXd magnet_load(const mesh::Mesh& m, const DofMap& d, const Materials& mat, const MagnetLayout& layout) {
  const double nu = 1.0 / (kMu0 * mat.magnet_mu_rec);
  Eigen::VectorXd f = Eigen::VectorXd::Zero(d.n_dofs);
  for (int t = 0; t < m.n_triangles(); ++t) {
    const mesh::Region& region = m.regions[m.triangle_region(t)];
    if (region.kind != mesh::RegionKind::magnet) continue;
    TriangleXY xy;
    for (int i = 0; i < 3; ++i) xy.row(i) = m.nodes.row(m.triangles(t, i));
    double twice_area = 0.0;
    const Eigen::Matrix<double, 3, 2> g = p1_gradients(xy, twice_area);
    const Eigen::Vector2d centroid = xy.colwise().mean().transpose();
    const Eigen::Vector2d b = remanence(layout, mat.magnet_remanence, region.slot, centroid);
    // int_e nu (B_rem,x dphi_i/dy - B_rem,y dphi_i/dx): the integrand is constant on the triangle.
    for (int i = 0; i < 3; ++i) {
      const int di = d.dof_of_node[m.triangles(t, i)];
      if (di >= 0) f(di) += d.sign(m.triangles(t, i)) * nu * 0.5 * twice_area * (b(0) * g(i, 1) - b(1) * g(i, 0));
    }
  }
  return f;
}

}  // namespace tf::solver
