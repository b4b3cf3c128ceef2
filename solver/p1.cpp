#include "solver/p1.hpp"

#include <cmath>

namespace tf::solver {

Eigen::Matrix<double, 3, 2> p1_gradients(const TriangleXY& xy, double& twice_area) {
  twice_area = (xy(1, 0) - xy(0, 0)) * (xy(2, 1) - xy(0, 1)) - (xy(2, 0) - xy(0, 0)) * (xy(1, 1) - xy(0, 1));
  Eigen::Matrix<double, 3, 2> g;
  for (int i = 0; i < 3; ++i) {
    const int j = (i + 1) % 3, k = (i + 2) % 3;
    g(i, 0) = (xy(j, 1) - xy(k, 1)) / twice_area;
    g(i, 1) = (xy(k, 0) - xy(j, 0)) / twice_area;
  }
  return g;
}

Eigen::Matrix3d p1_stiffness(const TriangleXY& xy, double nu) {
  double twice_area = 0.0;
  const auto g = p1_gradients(xy, twice_area);
  return (0.5 * twice_area * nu) * (g * g.transpose());
}

double p1_energy_rate(const TriangleXY& xy, const Eigen::Vector3d& a, const TriangleXY& v, double nu) {
  double twice_area = 0.0;
  const auto g = p1_gradients(xy, twice_area);
  const Eigen::Vector2d grad = g.transpose() * a;
  const Eigen::Matrix2d velocity_gradient = v.transpose() * g;  // (j, k): d v_j / d x_k
  return nu * 0.5 * std::abs(twice_area) *
         (0.5 * grad.squaredNorm() * velocity_gradient.trace() - grad.dot(velocity_gradient * grad));
}

Eigen::Matrix3d p1_mass(const TriangleXY& xy, double sigma) {
  double twice_area = 0.0;
  p1_gradients(xy, twice_area);
  const double area = 0.5 * twice_area;
  Eigen::Matrix3d mass;
  for (int i = 0; i < 3; ++i)
    for (int j = 0; j < 3; ++j) mass(i, j) = sigma * (area / 12 * (i == j ? 2.0 : 1.0));
  return mass;
}

Eigen::Matrix3d p1_motion(const TriangleXY& xy, double sigma) {
  double twice_area = 0.0;
  const auto g = p1_gradients(xy, twice_area);
  const double area = 0.5 * twice_area;
  const Eigen::Vector2d sum = xy.colwise().sum().transpose();
  Eigen::Matrix3d motion;
  for (int i = 0; i < 3; ++i) {
    const double x_int = area / 12 * (sum(0) + xy(i, 0)), y_int = area / 12 * (sum(1) + xy(i, 1));
    for (int j = 0; j < 3; ++j) motion(i, j) = sigma * (x_int * g(j, 1) - y_int * g(j, 0));
  }
  return motion;
}

Eigen::Vector2d p1_flux_density(const TriangleXY& xy, const Eigen::Vector3d& a) {
  double twice_area = 0.0;
  const Eigen::Vector2d grad = p1_gradients(xy, twice_area).transpose() * a;
  return {grad(1), -grad(0)};
}

}  // namespace tf::solver
