// The field of one straight conductor in air against Ampère's law.

#include <doctest/doctest.h>

#include <cmath>
#include <numbers>

#include "solver/assemble.hpp"
#include "solver/dofs.hpp"
#include "solver/p1.hpp"
#include "solver/spd_solver.hpp"
#include "support/polar_mesh.hpp"

using namespace tf;

TEST_CASE("one conductor in air: B_theta = mu0 I / (2 pi r), 100 A at 10 mm gives 2.000 mT") {
  // Source: Ampère's circuital law; value from docs/references.md §4 (line current).
  const double current = 100.0, r_wire = 0.002, mu0 = 4e-7 * std::numbers::pi;
  const mesh::Mesh m = testing::polar_mesh(0.0, {{r_wire, 8, mesh::RegionKind::coil, "wire"},
                                                 {0.012, 40, mesh::RegionKind::gap, "air"},
                                                 {0.05, 38, mesh::RegionKind::gap, "far air"}}, 256);
  const solver::DofMap d = solver::number_dofs(m);
  const auto K = solver::assemble_stiffness(m, d, std::vector<double>(m.regions.size(), 1.0 / mu0));
  const double area = mesh::region_areas(m)[0];  // the polygon actually meshed
  const Eigen::VectorXd f = solver::region_current_load(m, d, {current / area, 0.0, 0.0});
  solver::SpdSolver s;
  s.analyse(K);
  s.factorize(K);
  const Eigen::VectorXd a = solver::to_nodes(d, s.solve(f));

  // Every triangle whose centroid lies at 10 mm +- 0.25 mm: B_theta against the law at its radius.
  int n_checked = 0;
  double worst = 0.0;
  for (int t = 0; t < m.n_triangles(); ++t) {
    solver::TriangleXY xy;
    Eigen::Vector3d at;
    for (int i = 0; i < 3; ++i) {
      xy.row(i) = m.nodes.row(m.triangles(t, i));
      at(i) = a(m.triangles(t, i));
    }
    const Eigen::Vector2d c = xy.colwise().mean();
    const double r = c.norm();
    if (std::abs(r - 0.010) > 0.00025) continue;
    const Eigen::Vector2d b = solver::p1_flux_density(xy, at);
    const double b_theta = (-c(1) * b(0) + c(0) * b(1)) / r;
    worst = std::max(worst, std::abs(b_theta / (mu0 * current / (2 * std::numbers::pi * r)) - 1.0));
    ++n_checked;
  }
  CHECK(n_checked > 100);
  CHECK(worst < 0.005);
  CHECK(mu0 * current / (2 * std::numbers::pi * 0.010) == doctest::Approx(2.000e-3).epsilon(1e-9).scale(0));
}
