// Slotless stator with a sinusoidal current sheet: the air-gap field against the layered closed form,
// and its convergence under mesh refinement.

#include <doctest/doctest.h>

#include <cmath>
#include <numbers>

#include "post/gap_field.hpp"
#include "solver/assemble.hpp"
#include "solver/dofs.hpp"
#include "solver/spd_solver.hpp"
#include "support/layered_sheet.hpp"
#include "support/polar_mesh.hpp"
#include "support/sheet_load.hpp"
#include "support/convergence.hpp"

using namespace tf;

namespace {

constexpr double kMu0 = 4e-7 * std::numbers::pi;

/// Fundamental |B_r| [T] on the sliding circle (mid-gap) from the FE solution on a polar mesh
/// refined `level` times (each level halves every element size).
double fe_mid_gap_field(const testing::LayeredSheet& s, int level) {
  const int k = 1 << level;
  const double r_mid = 0.5 * (s.r_rotor + s.r_stator);
  const mesh::Mesh m = testing::polar_mesh(
      0.0,
      {{0.6 * s.r_rotor, 4 * k, mesh::RegionKind::rotor_iron, "rotor core"},
       {s.r_rotor, 8 * k, mesh::RegionKind::rotor_iron, "rotor rim"},
       {r_mid, 2 * k, mesh::RegionKind::gap, "gap rotor side"},
       {s.r_stator, 2 * k, mesh::RegionKind::gap, "gap stator side"},
       {s.r_outer, 12 * k, mesh::RegionKind::stator_iron, "stator"}},
      180 * k, 2);
  std::vector<double> nu;
  for (const auto& r : m.regions)
    nu.push_back(r.kind == mesh::RegionKind::gap ? 1 / kMu0
                 : r.kind == mesh::RegionKind::rotor_iron ? 1 / (kMu0 * s.mu_rotor)
                                                          : 1 / (kMu0 * s.mu_stator));
  const solver::DofMap d = solver::number_dofs(m);
  const auto K = solver::assemble_stiffness(m, d, nu);
  // The ring at R_s: the first ring of the stator band shares its nodes with the gap's last ring.
  std::vector<int> bore;
  for (int node = 0; node < m.n_nodes(); ++node)
    if (std::abs(m.nodes.row(node).norm() - s.r_stator) < 1e-12) bore.push_back(node);
  const Eigen::VectorXd f =
      testing::sheet_load(m, d, bore, [&](double th) { return s.sheet * std::cos(s.p * th); });
  solver::SpdSolver solver;
  solver.analyse(K);
  solver.factorize(K);
  const Eigen::MatrixXd a = solver::to_nodes(d, solver.solve(f));
  const post::GapOperators g = post::gap_operators(m, 720, 2 * s.p);
  return std::abs(post::gap_harmonics(g, a)(s.p, 0));
}

}  // namespace

TEST_CASE("the layered closed form reproduces the published slotless-gap values") {
  // The classical layered solution (derived; cf. K. J. Binns, P. J. Lawrenson, C. W. Trowbridge, The
  // Analytical and Numerical Solution of Electric and Magnetic Fields, Wiley 1992, from memory): p = 2, R_r = 49 mm, R_s = 50 mm, K = 1e4 A/m; infinitely permeable
  // irons: 0.317268 T at R_r, 0.314128 T at mid-gap, 0.311176 T at R_s; mu = 1000: 0.299311 T at mid-gap.
  const testing::LayeredSheet ideal{2, 0.049, 0.050, 1e3, 1e12, 1e12, 1e4};
  CHECK(ideal.gap_radial_flux_density(0.049) == doctest::Approx(0.317268).epsilon(2e-6).scale(0));
  CHECK(ideal.gap_radial_flux_density(0.0495) == doctest::Approx(0.314128).epsilon(2e-6).scale(0));
  CHECK(ideal.gap_radial_flux_density(0.050) == doctest::Approx(0.311176).epsilon(2e-6).scale(0));
  const testing::LayeredSheet real_iron{2, 0.049, 0.050, 1e3, 1000, 1000, 1e4};
  CHECK(real_iron.gap_radial_flux_density(0.0495) == doctest::Approx(0.299311).epsilon(2e-6).scale(0));
}

TEST_CASE("slotless gap field: FE fundamental within 0.3 % of the closed form, error falling with refinement") {
  // Published value with very permeable irons: 0.314128 T at mid-gap (the layered
  // solution above).
  const testing::LayeredSheet ideal{2, 0.049, 0.050, 0.08, 1e6, 1e6, 1e4};
  const double exact_ideal = ideal.gap_radial_flux_density(0.0495);
  CHECK(exact_ideal == doctest::Approx(0.314128).epsilon(1e-4).scale(0));
  CHECK(fe_mid_gap_field(ideal, 1) == doctest::Approx(exact_ideal).epsilon(0.003).scale(0));

  // Iron of mu_r = 1000, outer boundary at 80 mm: reference from the layered solution itself.
  const testing::LayeredSheet iron{2, 0.049, 0.050, 0.08, 1000, 1000, 1e4};
  const double exact = iron.gap_radial_flux_density(0.0495);
  std::vector<double> errors;
  for (int level = 0; level < 3; ++level) {
    errors.push_back(std::abs(fe_mid_gap_field(iron, level) / exact - 1.0));
    MESSAGE("level " << level << ": relative error " << errors.back());
  }
  // Second order: the error falls about fourfold per halving (rate 2); asked: 2.5-fold.
  for (double rate : testing::convergence_rates(errors)) CHECK(rate > std::log2(2.5));
  CHECK(errors.back() < 0.003);
}
