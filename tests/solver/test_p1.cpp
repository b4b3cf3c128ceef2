// First-order triangle kernels (stiffness, mass, motion): exact values, properties, the patch test,
// and the sign-aware assembly loop.

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

/// A scalene triangle away from the origin, counter-clockwise.
solver::TriangleXY skew_triangle() {
  solver::TriangleXY xy;
  xy << 0.013, -0.002, 0.021, 0.004, 0.009, 0.011;
  return xy;
}

solver::TriangleXY rotated(const solver::TriangleXY& xy, double angle) {
  Eigen::Matrix2d rot;
  rot << std::cos(angle), -std::sin(angle), std::sin(angle), std::cos(angle);
  return (rot * xy.transpose()).transpose();
}

double area(const solver::TriangleXY& xy) {
  double twice_area = 0.0;
  solver::p1_gradients(xy, twice_area);
  return 0.5 * twice_area;
}

/// One unknown per node, every sign +1.
solver::DofMap every_node(const mesh::Mesh& m) {
  solver::DofMap d;
  for (int i = 0; i < m.n_nodes(); ++i) d.dof_of_node.push_back(d.n_dofs++);
  return d;
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

TEST_CASE("p1 energy rate: the derivative of the element energy as the vertices move, nothing for a rigid motion") {
  // Against the central difference of (1/2) a^T K(xy + t v) a, K = p1_stiffness: the definition
  // that J. L. Coulomb's local virtual work (IEEE Trans. Magn. 19(6), 1983) differentiates.
  const solver::TriangleXY xy = skew_triangle();
  const Eigen::Vector3d a(0.0031, -0.0012, 0.0020);
  const double nu = 795774.7;
  auto energy = [&](const solver::TriangleXY& at) { return 0.5 * a.dot(solver::p1_stiffness(at, nu) * a); };
  solver::TriangleXY v;
  v << 0.3, -1.1, 0.0, 0.0, 0.8, 0.4;  // one vertex still, two moving: a deformation
  const double h = 1e-7;
  const double difference = (energy(xy + h * v) - energy(xy - h * v)) / (2 * h);
  CHECK(solver::p1_energy_rate(xy, a, v, nu) == doctest::Approx(difference).epsilon(1e-6));
  // The same with the vertices listed clockwise: the rate does not depend on the orientation.
  solver::TriangleXY xy_cw = xy, v_cw = v;
  xy_cw.row(1).swap(xy_cw.row(2));
  v_cw.row(1).swap(v_cw.row(2));
  const Eigen::Vector3d a_cw(a(0), a(2), a(1));
  CHECK(solver::p1_energy_rate(xy_cw, a_cw, v_cw, nu) == doctest::Approx(difference).epsilon(1e-6));
  // A rigid rotation about the origin, v_i = (-y_i, x_i), and a translation change no energy.
  solver::TriangleXY spin, shift;
  for (int i = 0; i < 3; ++i) {
    spin.row(i) << -xy(i, 1), xy(i, 0);
    shift.row(i) << 0.7, -0.2;
  }
  const double scale = energy(xy) / 0.01;  // the energy per unit of motion of a 1 cm triangle
  CHECK(std::abs(solver::p1_energy_rate(xy, a, spin, nu)) < 1e-12 * scale);
  CHECK(std::abs(solver::p1_energy_rate(xy, a, shift, nu)) < 1e-12 * scale);
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
  const solver::DofMap all = every_node(m);
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

TEST_CASE("p1 mass on the reference triangle has the textbook entries") {
  // Exact: int phi_i phi_j = area/12 (1 + delta_ij), area 1/2: 1/12 on the diagonal, 1/24 off it.
  const Eigen::Matrix3d mass = solver::p1_mass(reference_triangle(), 3.0);
  Eigen::Matrix3d expected;
  expected << 2, 1, 1, 1, 2, 1, 1, 1, 2;
  expected *= 3.0 / 24;
  CHECK((mass - expected).norm() < 1e-15);
}

TEST_CASE("p1 mass is symmetric, positive definite, integrates the coefficient, and scales with the area") {
  const solver::TriangleXY xy = skew_triangle();
  const double sigma = 5.8e7;
  const Eigen::Matrix3d mass = solver::p1_mass(xy, sigma);
  CHECK((mass - mass.transpose()).norm() < 1e-15 * mass.norm());
  CHECK(Eigen::SelfAdjointEigenSolver<Eigen::Matrix3d>(mass).eigenvalues().minCoeff() > 0.0);
  // 1^T M 1 = sigma int 1 = sigma * area (the shape functions sum to one).
  CHECK(mass.sum() == doctest::Approx(sigma * area(xy)).epsilon(1e-14).scale(0));
  CHECK((solver::p1_mass(rotated(xy, 0.7), sigma) - mass).norm() < 1e-12 * mass.norm());
  CHECK((solver::p1_mass(7.5 * xy, sigma) - 7.5 * 7.5 * mass).norm() < 1e-12 * 56.25 * mass.norm());
  // The mass matrix integrates products of linear functions exactly: int x y over the reference
  // triangle is 1/24.
  const solver::TriangleXY ref = reference_triangle();
  CHECK(ref.col(0).dot(solver::p1_mass(ref, 1.0) * ref.col(1)) == doctest::Approx(1.0 / 24).epsilon(1e-14).scale(0));
}

TEST_CASE("p1 motion on the reference triangle has the exact entries") {
  // C_ij = int phi_i dphi_j/dtheta, dphi_j/dtheta = x dphi_j/dy - y dphi_j/dx. On (0,0),(1,0),(0,1):
  // grad phi = (-1,-1), (1,0), (0,1); int phi_i x = (1 + x_i)/24, int phi_i y = (1 + y_i)/24, so
  // C_ij = int phi_i x * dphi_j/dy - int phi_i y * dphi_j/dx.
  const Eigen::Matrix3d c = solver::p1_motion(reference_triangle(), 2.0);
  Eigen::Matrix3d expected;
  expected << 0, -1, 1,   // i = 0: x-moment 1/24, y-moment 1/24
      -1, -1, 2,          // i = 1: 2/24, 1/24
      1, -2, 1;           // i = 2: 1/24, 2/24
  expected *= 2.0 / 24;
  CHECK((c - expected).norm() < 1e-15);
}

TEST_CASE("p1 motion: rows sum to zero, linear functions are differentiated exactly, rotation is invisible") {
  const solver::TriangleXY xy = skew_triangle();
  const double sigma = 3.7e7;
  const Eigen::Matrix3d c = solver::p1_motion(xy, sigma);
  const double a = area(xy);
  // A constant does not change along theta.
  CHECK(c.rowwise().sum().norm() < 1e-12 * c.norm());
  // d x/dtheta = -y and d y/dtheta = x, both linear: C x_nodes = sigma int phi_i (-y)
  // = -sigma area/12 (sum y + y_i), and C y_nodes = sigma area/12 (sum x + x_i), exactly.
  const Eigen::Vector3d x = xy.col(0), y = xy.col(1);
  for (int i = 0; i < 3; ++i) {
    CHECK((c * x)(i) == doctest::Approx(-sigma * a / 12 * (y.sum() + y(i))).epsilon(1e-12).scale(0));
    CHECK((c * y)(i) == doctest::Approx(sigma * a / 12 * (x.sum() + x(i))).epsilon(1e-12).scale(0));
  }
  // About the origin, turning the triangle turns theta with it: C is unchanged.
  CHECK((solver::p1_motion(rotated(xy, 0.7), sigma) - c).norm() < 1e-12 * c.norm());
  // Scaling by s: the moments grow by s^3 and the gradients shrink by s, so C grows by s^2.
  CHECK((solver::p1_motion(7.5 * xy, sigma) - 56.25 * c).norm() < 1e-12 * 56.25 * c.norm());
  // 1^T C a = int d(a)/dtheta is, for a linear a, the integral of a linear function: for a = x,
  // -sigma int y = -sigma area * mean(y).
  CHECK(Eigen::Vector3d::Ones().dot(c * x) == doctest::Approx(-sigma * a * y.mean()).epsilon(1e-12).scale(0));
}

TEST_CASE("p1 motion: a rotationally symmetric r^2 is nearly still, the remainder first order in the element size") {
  // d(r^2)/dtheta = 0, but the interpolant of r^2 is not symmetric: its gradient errs by O(h), so
  // C r^2 / C x^2 (d(x^2)/dtheta = -2xy, of order r^2) falls like h / r. Triangles of size h at r ~ 1.1.
  solver::TriangleXY shape;
  shape << 0, 0, 1, 0.2, 0.3, 0.9;
  auto ratio = [&](double h) {
    solver::TriangleXY xy = h * shape;
    xy.col(0).array() += 1.0;
    xy.col(1).array() += 0.5;
    const Eigen::Matrix3d c = solver::p1_motion(xy, 1.0);
    const Eigen::Vector3d x2 = xy.col(0).cwiseProduct(xy.col(0));
    const Eigen::Vector3d r2 = x2 + xy.col(1).cwiseProduct(xy.col(1));
    return (c * r2).norm() / (c * x2).norm();
  };
  CHECK(ratio(0.1) < 0.03);
  for (double h : {0.1, 0.05, 0.025}) {
    INFO("h = " << h << ": " << ratio(h) << " then " << ratio(h / 2));
    CHECK(ratio(h / 2) / ratio(h) == doctest::Approx(0.5).epsilon(0.06).scale(0));  // measured 0.524, 0.512, 0.506
  }
}

TEST_CASE("the assembly loop: sum of sigma over an assembled mass is the integral of sigma") {
  const mesh::Mesh m = testing::polar_mesh(0.0, {{0.02, 4, mesh::RegionKind::rotor_sleeve, "inner"},
                                                 {0.05, 6, mesh::RegionKind::gap, "outer"}}, 32);
  const solver::DofMap all = every_node(m);
  const std::vector<double> sigma{2.0e7, 0.0};
  const auto M = solver::assemble_matrix(m, all, sigma, solver::p1_mass);
  const std::vector<double> areas = mesh::region_areas(m);
  CHECK(Eigen::VectorXd::Ones(all.n_dofs).dot(M * Eigen::VectorXd::Ones(all.n_dofs)) ==
        doctest::Approx(sigma[0] * areas[0]).epsilon(1e-12).scale(0));
  // The motion matrix of the whole disc maps constants to zero (each element's rows sum to zero).
  const auto C = solver::assemble_matrix(m, all, sigma, solver::p1_motion);
  CHECK((C * Eigen::VectorXd::Ones(all.n_dofs)).norm() < 1e-12 * sigma[0] * areas[0]);
}

TEST_CASE("the assembly loop honours the signs: K_ij += s_i s_j k_e") {
  // One triangle, vertex 1 carried with sign -1 and vertex 2 fixed: the 2 by 2 result is
  // [[k00, -k01], [-k10, k11]] for the unknowns of vertices 0 and 1.
  mesh::Mesh m;
  m.nodes.resize(3, 2);
  m.nodes << 0, 0, 1, 0, 0, 1;
  m.triangles.resize(1, 3);
  m.triangles << 0, 1, 2;
  m.regions.push_back({"only", mesh::RegionKind::gap, 0, 0});
  m.triangle_region.resize(1);
  m.triangle_region << 0;
  solver::DofMap d;
  d.dof_of_node = {0, 1, -1};
  d.sign_of_node = {1, -1, 1};
  d.n_dofs = 2;
  const Eigen::Matrix3d k = solver::p1_stiffness(solver::TriangleXY(m.nodes), 1.0);
  const Eigen::MatrixXd K = Eigen::MatrixXd(solver::assemble_matrix(m, d, {1.0}, solver::p1_stiffness));
  Eigen::Matrix2d expected;
  expected << k(0, 0), -k(0, 1), -k(1, 0), k(1, 1);
  CHECK((K - expected).norm() < 1e-15);
  // And loads: f_i += s_i f_e; J = 6 on area 1/2 gives 1 per vertex, -1 at the sign -1 vertex.
  const Eigen::VectorXd f = solver::region_current_load(m, d, {6.0});
  CHECK(f(0) == doctest::Approx(1.0).epsilon(1e-15).scale(0));
  CHECK(f(1) == doctest::Approx(-1.0).epsilon(1e-15).scale(0));
}
