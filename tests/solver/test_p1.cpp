// First-order triangle kernel: exact values, properties, and the patch test.

#include <doctest/doctest.h>

#include <Eigen/Eigenvalues>
#include <Eigen/SparseCholesky>
#include <cmath>
#include <numbers>

#include "solver/assemble.hpp"
#include "solver/dofs.hpp"
#include "solver/p1.hpp"
#include "support/polar_mesh.hpp"

using namespace tf;

namespace {

solver::TriangleXY reference_triangle() {
  solver::TriangleXY xy;
  xy << 0, 0, 1, 0, 0, 1;
  return xy;
}

}  // namespace

TEST_CASE("p1 stiffness on the reference triangle has the textbook entries") {
  // Exact: K = nu/2 [[2,-1,-1],[-1,1,0],[-1,0,1]] for (0,0),(1,0),(0,1).
  const Eigen::Matrix3d k = solver::p1_stiffness(reference_triangle(), 2.0);
  Eigen::Matrix3d expected;
  expected << 2, -1, -1, -1, 1, 0, -1, 0, 1;
  CHECK((k - expected).norm() < 1e-14);
}

TEST_CASE("p1 stiffness is symmetric, has zero row sums, and ignores rotation and scale") {
  solver::TriangleXY xy;
  xy << 0.013, -0.002, 0.021, 0.004, 0.009, 0.011;
  const Eigen::Matrix3d k = solver::p1_stiffness(xy, 795774.7);
  CHECK((k - k.transpose()).norm() < 1e-12 * k.norm());
  CHECK(k.rowwise().sum().norm() < 1e-12 * k.norm());
  CHECK(Eigen::SelfAdjointEigenSolver<Eigen::Matrix3d>(k).eigenvalues().minCoeff() > -1e-9 * k.norm());
  // In 2D the Laplacian stiffness is dimensionless: scaling the triangle changes nothing.
  CHECK((solver::p1_stiffness(7.5 * xy, 795774.7) - k).norm() < 1e-12 * k.norm());
  const double c = std::cos(0.7), s = std::sin(0.7);
  Eigen::Matrix2d rot;
  rot << c, -s, s, c;
  const solver::TriangleXY turned = (rot * xy.transpose()).transpose();
  CHECK((solver::p1_stiffness(turned, 795774.7) - k).norm() < 1e-12 * k.norm());
}

TEST_CASE("p1 flux density of a linear potential is exact") {
  // a = 3 + 2x - 5y  ->  B = (da/dy, -da/dx) = (-5, -2).
  solver::TriangleXY xy;
  xy << 0.1, 0.2, 0.4, 0.25, 0.2, 0.6;
  Eigen::Vector3d a;
  for (int i = 0; i < 3; ++i) a(i) = 3 + 2 * xy(i, 0) - 5 * xy(i, 1);
  const Eigen::Vector2d b = solver::p1_flux_density(xy, a);
  CHECK(b(0) == doctest::Approx(-5.0).epsilon(1e-12).scale(0));
  CHECK(b(1) == doctest::Approx(-2.0).epsilon(1e-12).scale(0));
}

TEST_CASE("patch test: a linear potential is reproduced to 1e-12 on a mesh of a ring") {
  // Interior nodes of any mesh see zero residual for a linear field when nu is uniform.
  const mesh::Mesh m = testing::polar_mesh(0.01, {{0.02, 3, mesh::RegionKind::gap, "a"},
                                                  {0.05, 7, mesh::RegionKind::gap, "b"}}, 37);
  const auto linear = [](double x, double y) { return 0.3 + 11.0 * x - 4.0 * y; };
  std::vector<char> boundary(m.n_nodes(), 0);
  for (int j = 0; j < 37; ++j) boundary[j] = 1;  // the inner ring
  for (int node : m.outer_nodes) boundary[node] = 1;
  solver::DofMap all;
  for (int i = 0; i < m.n_nodes(); ++i) all.dof_of_node.push_back(all.n_dofs++);
  const auto K = solver::assemble_stiffness(m, all, std::vector<double>(m.regions.size(), 1.0));
  Eigen::VectorXd exact(m.n_nodes());
  for (int i = 0; i < m.n_nodes(); ++i) exact(i) = linear(m.nodes(i, 0), m.nodes(i, 1));
  const Eigen::VectorXd residual = K * exact;
  double worst = 0.0;
  for (int i = 0; i < m.n_nodes(); ++i)
    if (!boundary[i]) worst = std::max(worst, std::abs(residual(i)));
  CHECK(worst < 1e-12);

  // And solved: interior unknowns from the boundary values reproduce the linear field.
  std::vector<int> interior;
  for (int i = 0; i < m.n_nodes(); ++i)
    if (!boundary[i]) interior.push_back(i);
  const int n = static_cast<int>(interior.size());
  Eigen::SparseMatrix<double> kii(n, n);
  Eigen::VectorXd rhs = Eigen::VectorXd::Zero(n);
  std::vector<int> position(m.n_nodes(), -1);
  for (int i = 0; i < n; ++i) position[interior[i]] = i;
  std::vector<Eigen::Triplet<double>> t;
  for (int col = 0; col < K.outerSize(); ++col)
    for (Eigen::SparseMatrix<double>::InnerIterator it(K, col); it; ++it) {
      const int r = position[it.row()];
      if (r < 0) continue;
      if (position[it.col()] >= 0) t.emplace_back(r, position[it.col()], it.value());
      else rhs(r) -= it.value() * exact(it.col());
    }
  kii.setFromTriplets(t.begin(), t.end());
  const Eigen::VectorXd x = Eigen::SimplicialLDLT<Eigen::SparseMatrix<double>>(kii).solve(rhs);
  double error = 0.0;
  for (int i = 0; i < n; ++i) error = std::max(error, std::abs(x(i) - exact(interior[i])));
  CHECK(error < 1e-12);
}
