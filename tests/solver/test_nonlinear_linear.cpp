// The nonlinear solver on linear materials: one factorization and one solve that reproduce the
// linear phase-field solve, and the energy identities of a linear system.

#include <doctest/doctest.h>

#include <numbers>

#include "solver/assemble.hpp"
#include "solver/dofs.hpp"
#include "solver/nonlinear.hpp"
#include "solver/phase_fields.hpp"
#include "support/polar_mesh.hpp"

using namespace tf;

namespace {

// Two phases on concentric coil bands between rotor and stator iron, with a sliding circle.
mesh::Mesh two_coil_mesh() {
  mesh::Mesh m = testing::polar_mesh(0.0, {{0.010, 6, mesh::RegionKind::rotor_iron, "rotor"},
                                           {0.012, 3, mesh::RegionKind::gap, "gap rotor side"},
                                           {0.014, 3, mesh::RegionKind::gap, "gap stator side"},
                                           {0.018, 4, mesh::RegionKind::coil, "inner coil"},
                                           {0.022, 4, mesh::RegionKind::coil, "outer coil"},
                                           {0.035, 8, mesh::RegionKind::stator_iron, "stator"}}, 48, 1);
  m.regions[3].slot = 1, m.regions[3].layer = 1;
  m.regions[4].slot = 1, m.regions[4].layer = 2;
  return m;
}

mesh::Winding two_phase_winding() {
  mesh::Winding w;
  w.spec.n_phases = 2;
  w.spec.parallel_paths = 1;
  w.n_positions = 1;
  w.sides = {{1, 1, 0, 1, 20, 0.0}, {1, 2, 1, -1, 30, 0.0}};
  return w;
}

}  // namespace

TEST_CASE("nonlinear solver without B-H curves reproduces the linear solve to 1e-10") {
  const mesh::Mesh m = two_coil_mesh();
  const mesh::Winding w = two_phase_winding();
  solver::Materials mat;
  mat.rotor_iron_mu_r = 700.0;
  mat.stator_iron_mu_r = 2500.0;
  const solver::PhaseFields linear = solver::solve_phase_fields(m, w, mat);
  const std::vector<double> currents{3.0, -1.5};
  const Eigen::VectorXd expected = solver::superpose(linear, currents);

  const solver::DofMap d = solver::number_dofs(m);
  const solver::RegionCoefficients coefficients = solver::region_coefficients(m, mat);
  solver::NonlinearSolver s(m, d, solver::region_laws(coefficients));
  const Eigen::VectorXd f = solver::phase_loads(m, d, w) * Eigen::Vector2d(currents[0], currents[1]);
  Eigen::VectorXd a;
  const solver::NewtonReport report = s.solve(f, a);
  CHECK(report.converged);
  CHECK(report.iterations == 1);
  const Eigen::VectorXd got = solver::to_nodes(d, a);
  CHECK((got - expected).lpNorm<Eigen::Infinity>() <= 1e-10 * expected.lpNorm<Eigen::Infinity>());
  CHECK(report.residual <= 1e-8 * f.norm());  // sums of terms up to nu_air |grad a| cancel in K a - f

  // Linear: energy = co-energy = a.f / 2; the incremental and frozen matrices are K itself.
  CHECK(s.coenergy(a) == doctest::Approx(0.5 * a.dot(f)).epsilon(1e-10).scale(0));
  CHECK((s.solve_incremental(f) - a).norm() <= 1e-12 * a.norm());
  CHECK((s.solve_frozen(f) - a).norm() <= 1e-12 * a.norm());
}

TEST_CASE("nonlinear solver: a turned rotor (new pattern, same unknowns) reuses the ordering and solves right") {
  const mesh::Mesh m = two_coil_mesh();
  const mesh::Winding w = two_phase_winding();
  solver::Materials mat;
  const solver::RegionCoefficients coefficients = solver::region_coefficients(m, mat);
  const std::vector<solver::RegionLaw> laws = solver::region_laws(coefficients);
  const solver::DofMap d0 = solver::number_dofs(m, 0), d5 = solver::number_dofs(m, 5);
  solver::NonlinearSolver s(m, d0, laws);
  s.set_dofs(d5);  // reanalyse_same_ordering
  const Eigen::VectorXd f = solver::phase_loads(m, d5, w).col(0);
  Eigen::VectorXd a;
  CHECK(s.solve(f, a).converged);
  // Reference: a fresh solver, full analysis of the turned pattern.
  solver::NonlinearSolver fresh(m, d5, laws);
  Eigen::VectorXd b;
  fresh.solve(f, b);
  CHECK((a - b).norm() <= 1e-12 * b.norm());
  const auto K5 = solver::assemble_stiffness(m, d5, coefficients.nu);
  CHECK((K5 * a - f).norm() <= 1e-10 * f.norm());
}
