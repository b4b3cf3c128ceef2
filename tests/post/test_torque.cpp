// Torque between two sinusoidal current sheets in a slotless gap by Arkkio's method, by the Maxwell
// stress on the sliding circle and by virtual work, against the closed form of docs/references.md §4
// ("Torque between two sinusoidal sheets", derived from the classical solutions in K. J. Binns,
// P. J. Lawrenson, C. W. Trowbridge, The Analytical and Numerical Solution of Electric and Magnetic
// Fields, Wiley 1992 — from memory).
//
// Sign, checked here from the Lorentz force: with the stator sheet K_s cos(p theta) and the rotor
// sheet K_r cos(p theta - delta) (the rotor wave ahead by delta electrical, counter-clockwise), the
// stator field at the rotor surface is B_r = -2 p C R_r^{p-1} sin(p theta), the tangential force per
// area K_r B_r, so T = -2 pi mu0 R_r^2 K_s K_r x^{p-1} sin(delta) / (1 - x^{2p}), x = R_r / R_s:
// negative (clockwise) for 0 < delta < 180°, pulling the rotor wave back onto the stator wave.

#include <doctest/doctest.h>

#include <cmath>
#include <functional>
#include <numbers>

#include "post/gap_field.hpp"
#include "post/torque.hpp"
#include "support/two_sheets.hpp"
#include "support/convergence.hpp"

using namespace tf;

namespace {

constexpr double kMu0 = 4e-7 * std::numbers::pi;
constexpr double kPi = std::numbers::pi;
constexpr double kStatorSheet = 1e4;  // K_s [A/m]
constexpr double kRotorSheet = 5e3;   // K_r [A/m]

/// The closed form above [N m/m].
double sheet_torque(const testing::TwoSheetMachine& s, double delta) {
  const double x = s.r_rotor / s.r_stator;
  return -2 * kPi * kMu0 * s.r_rotor * s.r_rotor * kStatorSheet * kRotorSheet * std::pow(x, s.p - 1) *
         std::sin(delta) / (1 - std::pow(x, 2 * s.p));
}

/// Solves the two-sheet machine with the rotor wave ahead by delta [rad electrical], the rotor turned
/// by rotor_shift node pitches (the rotor sheet turns with it: it is fixed in the rotor's frame).
testing::SheetSolution solve(const testing::TwoSheetMachine& s, const mesh::Mesh& m, double delta,
                             int rotor_shift = 0) {
  return testing::solve_sheets(
      s, m, [&](double th) { return kRotorSheet * std::cos(s.p * th - delta); },
      [&](double th) { return kStatorSheet * std::cos(s.p * th); }, rotor_shift);
}

/// A torque method's relative errors against the closed form at delta = 90°, on the meshes of
/// refinement levels 0, 1, 2; each level's torque and error printed under `name`.
std::vector<double> level_errors(const char* name,
                                 const std::function<double(const mesh::Mesh&, const Eigen::VectorXd&)>& torque) {
  testing::TwoSheetMachine s;
  const double exact = sheet_torque(s, kPi / 2);
  std::vector<double> errors;
  for (int level = 0; level < 3; ++level) {
    s.level = level;
    const mesh::Mesh m = testing::two_sheet_mesh(s);
    const double t = torque(m, solve(s, m, kPi / 2).a_nodes);
    errors.push_back(std::abs(t / exact - 1));
    MESSAGE("level " << level << ": " << name << " " << t << " N m/m, relative error " << errors.back());
  }
  return errors;
}

}  // namespace

TEST_CASE("two-sheet torque: the closed form gives the published value") {
  // docs/references.md §4: p = 2, R_r = 49 mm, R_s = 50 mm, K_s = 1e4, K_r = 5e3 A/m, delta = 90°.
  const testing::TwoSheetMachine s;
  CHECK(sheet_torque(s, kPi / 2) == doctest::Approx(-11.96570).epsilon(1e-6).scale(0));
}

TEST_CASE("Arkkio's torque of two sinusoidal sheets: within 0.5 % and converging under refinement") {
  const std::vector<double> errors = level_errors("Arkkio", [](const mesh::Mesh& m, const Eigen::VectorXd& a) {
    return post::arkkio_torque_static(m, a, 1.0);
  });
  for (double e : errors) CHECK(e < 0.005);  // docs/references.md §4 tolerance
  // Second order: the error falls about fourfold per halving (rate 2); asked: 3.5-fold.
  for (double rate : testing::convergence_rates(errors)) CHECK(rate > std::log2(3.5));
}

TEST_CASE("Maxwell stress on the sliding circle: second order, but 17 times Arkkio's error") {
  // Measured (mu_iron = 1e9, gap one element per side at level 0, 240 nodes round): relative errors
  // 1.5 %, 0.38 %, 0.094 % at levels 0, 1, 2 against Arkkio's 0.087 %, 0.022 %, 0.0054 %. B_theta on
  // the circle is the mean of the two elements beside it, a difference of A across the circle over
  // one element each side: second order, but its error is not averaged out the way the whole band
  // averages it in Arkkio's method. Tolerance: 2 % on the coarsest mesh, then the fourfold fall.
  const std::vector<double> errors = level_errors("circle", [](const mesh::Mesh& m, const Eigen::VectorXd& a) {
    return post::circle_torque(post::gap_operators(m, 720, 4), a, 1.0);
  });
  CHECK(errors.front() < 0.02);
  for (double rate : testing::convergence_rates(errors)) CHECK(rate > std::log2(3.5));
}

TEST_CASE("local virtual work: the energy of the deformed gap layer gives the torque, converging under refinement") {
  // J. L. Coulomb, IEEE Trans. Magn. 19(6), 1983 (from memory): no extra solve. One layer of gap
  // elements deforms on the rotor side; the torque is second order like the others (measured
  // relative errors 0.49 %, 0.12 %, 0.030 % at levels 0, 1, 2).
  const std::vector<double> errors = level_errors("local virtual work", [](const mesh::Mesh& m, const Eigen::VectorXd& a) {
    return post::local_virtual_work_torque(m, a, 1.0);
  });
  for (double e : errors) CHECK(e < 0.01);
  for (double rate : testing::convergence_rates(errors)) CHECK(rate > std::log2(3.5));
  // At level 1, the co-energy difference of the rotor turned a pitch either way (the same discrete
  // field's derivative by another route) within 1 % of it.
  testing::TwoSheetMachine s;
  s.level = 1;
  const mesh::Mesh m = testing::two_sheet_mesh(s);
  const double t = post::local_virtual_work_torque(m, solve(s, m, kPi / 2).a_nodes, 1.0);
  const double pitch = 2 * kPi / static_cast<double>(m.sliding.stator_nodes.size());
  auto coenergy = [&](int shift) {
    const testing::SheetSolution y = solve(s, m, kPi / 2, shift);
    return post::linear_coenergy(y.load, y.solution, 1.0);
  };
  CHECK(t == doctest::Approx(post::virtual_work_torque(coenergy(-1), coenergy(1), pitch)).epsilon(0.01).scale(0));
}

TEST_CASE("virtual work: the co-energy difference of a turned rotor sheet gives the torque within 1 %") {
  // Linear materials, current sources: W' = W = 1/2 a^T K a = 1/2 f . a. The rotor sheet turns with
  // the rotor, the stator sheet stays: T = dW'/dtheta at constant currents.
  testing::TwoSheetMachine s;
  s.level = 1;
  const mesh::Mesh m = testing::two_sheet_mesh(s);
  const double exact = sheet_torque(s, kPi / 2);
  const double pitch = 2 * kPi / static_cast<double>(m.sliding.stator_nodes.size());
  auto coenergy = [&](double delta, int shift) {
    const testing::SheetSolution x = solve(s, m, delta, shift);
    return post::linear_coenergy(x.load, x.solution, 1.0);
  };

  SUBCASE("turning the rotor sheet's phase by -/+ one node pitch in the fixed mesh") {
    // A rotor turned by +d carries its wave to cos(p (theta - d) - delta): delta grows by p d.
    const double t = post::virtual_work_torque(coenergy(kPi / 2 - s.p * pitch, 0), coenergy(kPi / 2 + s.p * pitch, 0), pitch);
    MESSAGE("virtual work (phase turn) " << t << " N m/m");
    CHECK(t == doctest::Approx(exact).epsilon(0.01).scale(0));
  }
  SUBCASE("turning the rotor by -/+ one node pitch through the sliding circle") {
    const double t = post::virtual_work_torque(coenergy(kPi / 2, -1), coenergy(kPi / 2, +1), pitch);
    MESSAGE("virtual work (sliding circle) " << t << " N m/m");
    CHECK(t == doctest::Approx(exact).epsilon(0.01).scale(0));
  }
}

TEST_CASE("a rotor turned through the sliding circle: Arkkio and circle torque read B in the rotor's frame correctly") {
  // Turning the rotor by k pitches with its sheet fixed in its own frame is, physically, the rotor
  // wave ahead by delta + p k pitch: both torques must follow the closed form at that angle.
  testing::TwoSheetMachine s;
  s.level = 1;
  const mesh::Mesh m = testing::two_sheet_mesh(s);
  const int n = static_cast<int>(m.sliding.stator_nodes.size());
  const int shift = n / 24;  // 15 degrees mechanical, 30 electrical
  const double delta = kPi / 3 + s.p * 2 * kPi * shift / n;  // 60° + 30° electrical
  const double exact = sheet_torque(s, delta);
  const Eigen::VectorXd a = solve(s, m, kPi / 3, shift).a_nodes;
  // Measured at level 1: Arkkio -11.9631, circle -12.0108 against -11.9657 N m/m; the circle with
  // operators built for an unturned rotor read -12.3459 (3.2 % off): the shift matters.
  CHECK(post::arkkio_torque_static(m, a, 1.0) == doctest::Approx(exact).epsilon(0.005).scale(0));
  CHECK(post::circle_torque(post::gap_operators(m, 720, 4, shift), a, 1.0) ==
        doctest::Approx(exact).epsilon(0.005).scale(0));
}
