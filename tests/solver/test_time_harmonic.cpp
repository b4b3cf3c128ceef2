// The one time-harmonic system (solver/time_harmonic.hpp): what K, M and C hold, what the choices
// of omega and omega_r reduce to, and the refusal of sector meshes.

#include <doctest/doctest.h>

#include <complex>
#include <vector>

#include <Eigen/SparseCholesky>

#include "mesh/winding.hpp"
#include "solver/assemble.hpp"
#include "solver/coefficients.hpp"
#include "solver/errors.hpp"
#include "solver/time_harmonic.hpp"
#include "support/polar_mesh.hpp"

using namespace tf;
using Complex = std::complex<double>;

namespace {

/// A conducting sleeve on the rotor (moves), a conducting stator ring (does not), air between.
struct Disc {
  mesh::Mesh m = testing::polar_mesh(0.0, {{0.02, 4, mesh::RegionKind::rotor_sleeve, "sleeve"},
                                          {0.03, 3, mesh::RegionKind::gap, "gap"},
                                          {0.05, 4, mesh::RegionKind::stator_iron, "stator"},
                                          {0.2, 6, mesh::RegionKind::outer_air, "air"}},
                                      48);
  solver::Materials materials;
  Disc() {
    materials.sleeve_sigma = 3e7;
    materials.stator_iron_sigma = 2e6;
    materials.stator_iron_mu_r = 1.0;
  }
};

mesh::Winding no_winding() {
  mesh::Winding none;
  none.spec.n_phases = 1;
  return none;
}

}  // namespace

TEST_CASE("time-harmonic system: M integrates sigma, C lives on the moving conductors only") {
  const Disc d;
  const std::vector<double> area = mesh::region_areas(d.m);
  for (solver::EddyModel model : {solver::EddyModel::motion_term, solver::EddyModel::slip_frequency}) {
    const solver::RegionCoefficients c = solver::region_coefficients(d.m, d.materials, model);
    const solver::TimeHarmonicSystem s = solver::assemble_time_harmonic(d.m, no_winding(), c);
    // Over the unknowns only (A = 0 on the outer ring, which is in the air): 1^T M 1 = int sigma.
    const Eigen::VectorXd one = Eigen::VectorXd::Ones(s.dofs.n_dofs);
    const double stator = model == solver::EddyModel::motion_term ? 2e6 * area[2] : 0.0;  // slip: no stator currents
    CHECK(one.dot(s.mass * one) == doctest::Approx(3e7 * area[0] + stator).epsilon(1e-12).scale(0));
    CHECK(s.motion.nonZeros() > 0);
    // C 1 = 0 (a constant does not change along theta); the motion matrix of the stator is empty.
    CHECK((s.motion * one).norm() < 1e-9 * one.dot(s.mass * one));
    const solver::RegionCoefficients only_stator = [&] {
      solver::RegionCoefficients x = c;
      x.sigma[0] = 0.0;
      return x;
    }();
    CHECK(solver::assemble_time_harmonic(d.m, no_winding(), only_stator).motion.nonZeros() == 0);
  }
}

TEST_CASE("time-harmonic solve: omega = omega_r = 0 is the magnetostatic solution; one analysis for all problems") {
  const Disc d;
  const solver::RegionCoefficients c = solver::region_coefficients(d.m, d.materials);
  solver::TimeHarmonicSystem s = solver::assemble_time_harmonic(d.m, no_winding(), c);
  s.unit_loads = solver::region_current_load(d.m, s.dofs, {0.0, 0.0, 0.0, 1e6}).replicate(1, 1);
  const Eigen::VectorXd statics =
      solver::to_nodes(s.dofs, Eigen::SimplicialLDLT<Eigen::SparseMatrix<double>>(s.stiffness).solve(s.unit_loads)).col(0);
  solver::TimeHarmonicStats stats;
  const auto a = solver::solve_time_harmonic(d.m, s, {{{Complex(2.0, 0.0)}, 0.0, 0.0}, {{Complex(0.0, 1.0)}, 0.0, 0.0},
                                                      {{Complex(1.0, 0.0)}, 314.0, 100.0}}, stats);
  REQUIRE(a.size() == 3);
  CHECK((a[0] - Complex(2.0, 0.0) * statics.cast<Complex>()).norm() < 1e-10 * 2 * statics.norm());
  CHECK((a[1] - Complex(0.0, 1.0) * statics.cast<Complex>()).norm() < 1e-10 * statics.norm());
  // Eddy currents in the conductors change the field.
  CHECK((a[2] - statics.cast<Complex>()).norm() > 1e-3 * statics.norm());
  CHECK(stats.n_dofs == s.dofs.n_dofs);
}

TEST_CASE("time-harmonic system: a sector mesh is refused with a SolveError, in assembly and in the solve") {
  const Disc d;
  const solver::RegionCoefficients c = solver::region_coefficients(d.m, d.materials);
  const solver::TimeHarmonicSystem full = solver::assemble_time_harmonic(d.m, no_winding(), c);
  mesh::Mesh sector = d.m;
  sector.symmetry.copies = 4;  // as a sector model of a quarter of the machine says of itself
  CHECK_THROWS_AS(solver::assemble_time_harmonic(sector, no_winding(), c), solver::SolveError);
  solver::TimeHarmonicStats stats;
  CHECK_THROWS_AS(solver::solve_time_harmonic(sector, full, {{{Complex(1.0, 0.0)}, 314.0, 0.0}}, stats),
                  solver::SolveError);
}
