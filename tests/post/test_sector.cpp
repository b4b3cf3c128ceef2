// A sector model against the full model with saturating iron: Newton's solution, the rotor-position
// solver (MotionSolver, the one the application runs) and the whole-machine co-energy. The
// reference is the full model plus the symmetry argument (tests/post/test_sector_field.cpp): the
// sector's copies are the full mesh's triangles, so the discrete problems agree to the Newton
// tolerance. The issue asks for 0.5 %; the checks ask for 1e-4 (Newton stops at a relative 1e-5
// residual and update, not at rounding).

#include <doctest/doctest.h>

#include <algorithm>
#include <cmath>

#include "mesh/build.hpp"
#include "mesh/symmetry.hpp"
#include "solver/assemble.hpp"
#include "solver/bh_curve.hpp"
#include "solver/dofs.hpp"
#include "solver/field_symmetry.hpp"
#include "solver/magnets.hpp"
#include "solver/motion.hpp"
#include "solver/nonlinear.hpp"
#include "support/sector_compare.hpp"
#include "support/sector_machine.hpp"

using namespace tf;

namespace {

/// The analytic arctan law B(H) = mu0 H + (2 J_s/pi) arctan(pi (mu_ri - 1) mu0 H / (2 J_s)) (J_s = 2 T,
/// mu_ri = 5000), sampled.
const solver::BhCurve& iron_curve() {
  static const solver::BhCurve curve = solver::sampled_arctan_law(2.0, 5000, 60, 1e6);
  return curve;
}

struct NonlinearField {
  Eigen::VectorXd a;       ///< nodal [Wb/m]
  double coenergy = 0.0;   ///< whole machine [J/m]
  double peak_b_stator = 0.0;  ///< largest |B| in the stator iron [T]
  int iterations = 0;
};

NonlinearField nonlinear_field(const mesh::Mesh& m, const mesh::Geometry& g, const mesh::Winding& w,
                               const std::vector<double>& currents, int shift) {
  const solver::Materials mat{};
  const solver::DofMap d = solver::number_dofs(m, shift);
  const std::vector<double> nu = solver::region_coefficients(m, mat).nu;
  std::vector<solver::RegionLaw> laws;
  for (std::size_t r = 0; r < m.regions.size(); ++r) {
    const mesh::RegionKind k = m.regions[r].kind;
    const bool iron = k == mesh::RegionKind::stator_iron || k == mesh::RegionKind::rotor_iron;
    laws.push_back({nu[r], iron ? &iron_curve() : nullptr});
  }
  solver::NonlinearSolver newton(m, d, laws);
  const Eigen::Map<const Eigen::VectorXd> i(currents.data(), 3);
  const Eigen::VectorXd f =
      solver::phase_loads(m, d, w) * i + solver::magnet_load(m, d, mat, solver::magnet_layout(g.rotor));
  Eigen::VectorXd x;
  const solver::NewtonReport report = newton.solve(f, x);
  REQUIRE(report.converged);
  NonlinearField out{solver::to_nodes(d, x).col(0), newton.coenergy(x), 0.0, report.iterations};
  const std::vector<double> b2 = newton.triangle_b_squared(x);
  for (int t = 0; t < m.n_triangles(); ++t)
    if (m.regions[m.triangle_region(t)].kind == mesh::RegionKind::stator_iron)
      out.peak_b_stator = std::max(out.peak_b_stator, std::sqrt(b2[static_cast<std::size_t>(t)]));
  return out;
}

struct Models {
  mesh::Geometry g = testing::magnet_machine();
  mesh::Winding w = testing::magnet_machine_winding(g);
  testing::FullAndSector meshes = testing::full_and_sector(g, w);
  mesh::Mesh& full = meshes.full;
  mesh::Mesh& sector = meshes.sector;
};

const Models& models() {
  static const Models m;
  return m;
}

void check_close(const testing::MachineQuantities& sector, const testing::MachineQuantities& full, double tolerance) {
  const testing::Differences d = testing::differences(sector, full);
  MESSAGE("full |c_2| " << std::abs(full.fundamental) << " T, torque " << full.torque << " N m/m, psi_A "
                        << full.psi(0) << " Wb/m; sector relative differences: B_r " << d.br << ", c_2 "
                        << d.fundamental << ", torque " << d.torque << ", psi " << d.psi);
  CHECK(std::abs(full.torque) > 0.1);
  CHECK(d.br < tolerance);
  CHECK(d.fundamental < tolerance);
  CHECK(d.torque < tolerance);
  CHECK(d.psi < tolerance);
}

}  // namespace

TEST_CASE("sector model, saturated iron (Newton): the full machine's field, torque, flux linkage and co-energy") {
  const Models& s = models();
  const int n_sector = static_cast<int>(s.sector.sliding.stator_nodes.size());
  // 400 A peak in 10-conductor coil sides on top of the magnets drives the teeth well into saturation.
  const std::vector<double> currents = testing::three_phase_currents(400.0, std::numbers::pi / 3);
  for (int shift : {0, n_sector + 7}) {
    const NonlinearField full = nonlinear_field(s.full, s.g, s.w, currents, shift);
    const NonlinearField sector = nonlinear_field(s.sector, s.g, s.w, currents, shift);
    MESSAGE("shift " << shift << ": peak stator |B| " << full.peak_b_stator << " T (sector " << sector.peak_b_stator
                     << "), Newton iterations " << full.iterations << " / " << sector.iterations << ", co-energy "
                     << full.coenergy << " / " << sector.coenergy << " J/m");
    CHECK(full.peak_b_stator > 2.0);  // past the knee of the 2 T law: saturated
    CHECK(sector.peak_b_stator == doctest::Approx(full.peak_b_stator).epsilon(1e-4).scale(0));
    CHECK(sector.coenergy == doctest::Approx(full.coenergy).epsilon(1e-4).scale(0));
    check_close(testing::machine_quantities(s.sector, s.w, sector.a, shift),
                testing::machine_quantities(s.full, s.w, full.a, shift), 1e-4);
  }
}

TEST_CASE("sector model in the rotor-position solver: torque, fundamental, flux linkage and virtual work") {
  const Models& s = models();
  const solver::BhCurve& c = iron_curve();
  const solver::BhTable table{c.table_h(), c.table_b(), "arctan law of docs/references.md §5, sampled", 1.0};
  const solver::Materials mat{.stator_iron_bh = table, .rotor_iron_bh = table};
  const solver::MagnetLayout layout = solver::magnet_layout(s.g.rotor);
  solver::MotionSolver full(s.full, s.w, mat, layout);
  solver::MotionSolver sector(s.sector, s.w, mat, layout);
  CHECK(solver::sliding_pitch(s.sector) == doctest::Approx(solver::sliding_pitch(s.full)).epsilon(1e-12).scale(0));
  const int n_sector = static_cast<int>(s.sector.sliding.stator_nodes.size());
  // Rotor positions as a study steps them: warm starts across turns, one of them past a whole sector.
  for (int shift : {0, 4, n_sector + 9}) {
    const std::vector<double> currents = testing::three_phase_currents(300.0, 0.2 * shift);
    const solver::PositionField f = full.solve(shift, currents);
    const solver::PositionField p = sector.solve(shift, currents);
    MESSAGE("shift " << shift << ": co-energy " << f.coenergy << " / " << p.coenergy << " J/m");
    CHECK(p.coenergy == doctest::Approx(f.coenergy).epsilon(1e-4).scale(0));
    check_close(testing::machine_quantities(s.sector, s.w, p.a, shift),
                testing::machine_quantities(s.full, s.w, f.a, shift), 1e-4);
    // Virtual work from the whole-machine co-energy matches between the models too.
    const double pitch = solver::sliding_pitch(s.full);
    const double t_full = (full.coenergy(shift + 1, currents) - full.coenergy(shift - 1, currents)) / (2 * pitch);
    const double t_sector = (sector.coenergy(shift + 1, currents) - sector.coenergy(shift - 1, currents)) / (2 * pitch);
    MESSAGE("virtual work " << t_full << " / " << t_sector << " N m/m");
    CHECK(t_sector == doctest::Approx(t_full).epsilon(1e-2).scale(0));
    // And it is the whole machine's torque, as Arkkio's is: the two routes agree (a common-practice
    // cross-check of the two methods, cf. post/torque.hpp) only if both scale the sector alike.
    CHECK(t_sector == doctest::Approx(post::arkkio_torque_static(s.sector, p.a, 1.0)).epsilon(1e-2).scale(0));
    // The local virtual work (J. L. Coulomb 1983) differentiates the same co-energy without the two
    // extra solves: it meets the difference of the solved neighbours, in saturated iron too.
    const double local_full = post::local_virtual_work_torque(s.full, f.a, 1.0);
    const double local_sector = post::local_virtual_work_torque(s.sector, p.a, 1.0);
    MESSAGE("local virtual work " << local_full << " / " << local_sector << " N m/m");
    CHECK(local_full == doctest::Approx(t_full).epsilon(2e-3).scale(0));  // measured: within 5.4e-4
    CHECK(local_sector == doctest::Approx(local_full).epsilon(1e-3).scale(0));
  }
  // The linearised unit fields (inductances) fold the same way.
  // The linearised fields belong to the last solve (virtual work's neighbours are not solves).
  full.solve(0, testing::three_phase_currents(300.0, 0.0));
  sector.solve(0, testing::three_phase_currents(300.0, 0.0));
  const Eigen::MatrixXd psi_full = solver::flux_linkage(s.full, s.w, full.frozen_unit_fields(), 1.0);
  const Eigen::MatrixXd psi_sector = solver::flux_linkage(s.sector, s.w, sector.frozen_unit_fields(), 1.0);
  MESSAGE("frozen-permeability inductances [H/m]: full\n" << psi_full << "\nsector\n" << psi_sector);
  CHECK((psi_sector - psi_full).cwiseAbs().maxCoeff() < 1e-4 * psi_full.cwiseAbs().maxCoeff());
}

TEST_CASE("steps that mirror another: the field derived by the side signs is the field Newton finds there") {
  // B-H curves are odd, so the field with one side's sources reversed is that side's field reversed
  // (solver/field_symmetry.hpp). Checked against a solve of each mirrored step, in saturated iron.
  const Models& s = models();
  const solver::BhCurve& c = iron_curve();
  const solver::BhTable table{c.table_h(), c.table_b(), "arctan law of docs/references.md §5, sampled", 1.0};
  const solver::Materials mat{.stator_iron_bh = table, .rotor_iron_bh = table};
  const int n = static_cast<int>(s.sector.sliding.stator_nodes.size());
  const std::vector<double> i = testing::three_phase_currents(300.0, 0.3);
  const std::vector<double> minus_i = testing::three_phase_currents(-300.0, 0.3);
  const std::vector<bool> rotor_side = mesh::rotor_side_nodes(s.sector);
  auto symmetry = [&](const mesh::Mesh& m, bool magnets, int shift_a, const std::vector<double>& ia, int shift_b,
                      const std::vector<double>& ib) {
    const solver::DofMap a = solver::number_dofs(m, shift_a), b = solver::number_dofs(m, shift_b);
    return solver::field_symmetry(mesh::rotor_side_nodes(m), magnets, {a, ia}, {b, ib});
  };
  auto check_mirror = [&](const solver::MagnetLayout& layout, int shift_b, solver::SideSigns expected) {
    solver::MotionSolver solver(s.sector, s.w, mat, layout);
    const Eigen::VectorXd from = solver.solve(5, i).a;
    const Eigen::VectorXd to = solver.solve(shift_b, minus_i, false).a;
    const auto signs = symmetry(s.sector, layout.n_poles > 0, 5, i, shift_b, minus_i);
    REQUIRE(signs.has_value());
    CHECK(signs->stator == expected.stator);
    CHECK(signs->rotor == expected.rotor);
    const double error = (solver::with_side_signs(rotor_side, from, *signs) - to).norm() / to.norm();
    MESSAGE("mirrored against solved: relative difference " << error);
    // Both Newton runs start from A = 0, so their iterates mirror each other to the last bit (measured:
    // 0); a wrong sign on either side would be off by the field itself.
    CHECK(error < 1e-9);
  };
  SUBCASE("magnets, a sector (a pole pitch) on, currents reversed: the stator's field reversed, the rotor's kept") {
    check_mirror(solver::magnet_layout(s.g.rotor), 5 + n, {-1.0, 1.0});
  }
  SUBCASE("no magnet source, at rest, currents reversed: the whole field reversed") {
    check_mirror(solver::MagnetLayout{}, 5, {-1.0, -1.0});
  }
  SUBCASE("no mirror where the physics gives none") {
    // Magnets do not reverse: at rest with the currents reversed is another field.
    CHECK_FALSE(symmetry(s.sector, true, 5, i, 5, minus_i).has_value());
    // Half a sector on, the ties across the circle match nothing of the first numbering.
    CHECK_FALSE(symmetry(s.sector, true, 5, i, 5 + n / 2, minus_i).has_value());
    // The whole mesh turned by a pole pitch: its nodes are not the first position's images.
    const int n_full = static_cast<int>(s.full.sliding.stator_nodes.size());
    CHECK_FALSE(symmetry(s.full, true, 5, i, 5 + n_full / 4, minus_i).has_value());
    // Currents that are neither the same nor reversed.
    CHECK_FALSE(symmetry(s.sector, true, 5, i, 5 + n, testing::three_phase_currents(300.0, 0.4)).has_value());
  }
}
