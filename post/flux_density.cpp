#include "post/flux_density.hpp"

#include "solver/p1.hpp"

namespace tf::post {

Eigen::MatrixX2d flux_density(const mesh::Mesh& m, const Eigen::VectorXd& a) {
  Eigen::MatrixX2d b(m.n_triangles(), 2);
  for (int t = 0; t < m.n_triangles(); ++t) {
    solver::TriangleXY xy;
    Eigen::Vector3d at;
    for (int i = 0; i < 3; ++i) {
      xy.row(i) = m.nodes.row(m.triangles(t, i));
      at(i) = a(m.triangles(t, i));
    }
    b.row(t) = solver::p1_flux_density(xy, at).transpose();
  }
  return b;
}

}  // namespace tf::post
