// A nonlinear iron cylinder in a uniform transverse field magnetizes uniformly; its interior state
// lies where the B-H curve meets B_in + mu0 H_in = 2 B0 (docs/references.md §5, derived from the
// classical linear solution, e.g. Binns, Lawrenson, Trowbridge 1992, from memory).

#include <doctest/doctest.h>

#include <algorithm>
#include <cmath>
#include <numbers>

#include "solver/assemble.hpp"
#include "solver/bh_curve.hpp"
#include "solver/dofs.hpp"
#include "solver/nonlinear.hpp"
#include "solver/p1.hpp"
#include "support/polar_mesh.hpp"

using namespace tf;

namespace {

constexpr double kMu0 = 4e-7 * std::numbers::pi;

// Mean B_x [T] over the cylinder (region 0) for an outer field B0 along x, imposed as A = B0 y on the
// boundary circle at 40 radii. A on the boundary is not zero, so it is lifted: g holds B0 y on the
// boundary nodes, and the unknowns carry a - g, loaded with f = -K g. Only air elements touch the
// boundary, so K g does not depend on the iron. A finite boundary at R = 40 a lowers B_in by
// 0.06 % at most for this law (the same exact solution with A = B0 R sin(theta) imposed at R).
double cylinder_b_in(double b0, const solver::BhCurve& iron, solver::NewtonReport& report) {
  const double a = 0.01;
  const mesh::Mesh m = testing::polar_mesh(0.0, {{a, 12, mesh::RegionKind::rotor_iron, "cylinder"},
                                                 {2 * a, 10, mesh::RegionKind::gap, "near air"},
                                                 {5 * a, 12, mesh::RegionKind::gap, "air"},
                                                 {12 * a, 10, mesh::RegionKind::outer_air, "far air"},
                                                 {40 * a, 14, mesh::RegionKind::outer_air, "farthest air"}}, 128);
  const solver::DofMap d = solver::number_dofs(m);
  Eigen::VectorXd g = Eigen::VectorXd::Zero(m.n_nodes());
  for (int node : m.outer_nodes) g(node) = b0 * m.nodes(node, 1);  // B_x = dA/dy = B0
  solver::DofMap every_node;
  for (int node = 0; node < m.n_nodes(); ++node) every_node.dof_of_node.push_back(node);
  every_node.n_dofs = m.n_nodes();
  const Eigen::VectorXd kg =
      solver::assemble_stiffness(m, every_node, std::vector<double>(m.regions.size(), 1 / kMu0)) * g;
  Eigen::VectorXd f = Eigen::VectorXd::Zero(d.n_dofs);
  for (int node = 0; node < m.n_nodes(); ++node)
    if (d.dof_of_node[node] >= 0) f(d.dof_of_node[node]) -= kg(node);

  std::vector<solver::RegionLaw> laws(m.regions.size(), {1 / kMu0, nullptr});
  laws[0] = {0, &iron};
  solver::NonlinearSolver s(m, d, laws);
  Eigen::VectorXd x;
  report = s.solve(f, x);
  const Eigen::VectorXd nodal = solver::to_nodes(d, x) + g;

  double area = 0, bx = 0, worst_by = 0;
  for (int t = 0; t < m.n_triangles(); ++t) {
    if (m.triangle_region(t) != 0) continue;
    solver::TriangleXY xy;
    Eigen::Vector3d at;
    for (int i = 0; i < 3; ++i) {
      xy.row(i) = m.nodes.row(m.triangles(t, i));
      at(i) = nodal(m.triangles(t, i));
    }
    const Eigen::Vector2d b = solver::p1_flux_density(xy, at);
    area += mesh::triangle_area(m, t);
    bx += mesh::triangle_area(m, t) * b(0);
    worst_by = std::max(worst_by, std::abs(b(1)));
  }
  CHECK(worst_by < 0.01 * bx / area);  // uniform along x inside, as the closed form says
  return bx / area;
}

}  // namespace

TEST_CASE("nonlinear cylinder in a uniform field: B_in where B + mu0 H = 2 B0 meets the curve (docs/references.md §5)") {
  const solver::BhCurve iron = solver::sampled_arctan_law(2.0, 5000.0, 150, 1e6);
  solver::NewtonReport report;
  const double b_half = cylinder_b_in(0.5, iron, report);
  MESSAGE("B0 = 0.5 T: B_in " << b_half << " T after " << report.iterations << " Newton steps");
  CHECK(report.converged);
  CHECK(b_half == doctest::Approx(0.999746).epsilon(0.005).scale(0));
  const double b_one = cylinder_b_in(1.0, iron, report);
  MESSAGE("B0 = 1.0 T: B_in " << b_one << " T after " << report.iterations << " Newton steps");
  CHECK(report.converged);
  CHECK(b_one == doctest::Approx(1.987267).epsilon(0.005).scale(0));
}
