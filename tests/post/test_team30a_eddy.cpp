// TEAM Workshop Problem 30a, three-phase, below the app layer: the model of
// cases/team30a_three_phase.toml (built in code, tests/support/team30a_model.hpp; an open boundary
// by the Kelvin transformation) through the one time-harmonic system of solver/time_harmonic.hpp,
// as the stator-frame study with the motion term and as the slip-frequency method, against the
// published torque, EMF and rotor losses at seven rotor speeds (K. R. Davey, "TEAM Problem 30a:
// Induction Motor Analyses", International Compumag Society TEAM problem set; tests/support/team30a.hpp).

#include <doctest/doctest.h>

#include <algorithm>
#include <cmath>
#include <complex>
#include <numbers>
#include <vector>

#include "mesh/build.hpp"
#include "mesh/winding.hpp"
#include "post/eddy_quantities.hpp"
#include "post/slip_quantities.hpp"
#include "solver/coefficients.hpp"
#include "solver/time_harmonic.hpp"
#include "support/team30a.hpp"
#include "support/team30a_model.hpp"

using namespace tf;

namespace {

constexpr double kPi = std::numbers::pi;

struct Model {
  testing::Team30aModel c = testing::team30a_model();
  mesh::Mesh m;
  mesh::Winding w;
  std::vector<std::complex<double>> currents;
};

Model team30a(double fineness) {
  Model t;
  t.m = mesh::build(t.c.geometry, mesh::slot_layers(t.c.winding), {fineness});
  t.w = mesh::lay_out(t.c.winding, t.c.geometry.stator);
  t.currents = solver::supply_phasors(t.c.supply, t.c.winding.n_phases);
  return t;
}

/// The stator-frame study: omega the supply's on M, each speed on C.
std::vector<post::SpeedResult> by_motion_term(double fineness) {
  const Model t = team30a(fineness);
  const solver::RegionCoefficients coefficients = solver::region_coefficients(t.m, t.c.materials);
  const solver::TimeHarmonicSystem s = solver::assemble_time_harmonic(t.m, t.w, coefficients);
  const double omega = 2 * kPi * t.c.supply.frequency;
  std::vector<solver::TimeHarmonicProblem> problems;
  for (const auto& ref : testing::kTeam30a) problems.push_back({t.currents, omega, ref.speed});
  solver::TimeHarmonicStats stats;
  const auto solutions = solver::solve_time_harmonic(t.m, s, problems, stats);
  const post::SpeedInputs in{&t.m, &t.w, coefficients.sigma, coefficients.moves_with_rotor, t.currents,
                             t.c.supply.frequency, t.c.stack_length};
  std::vector<post::SpeedResult> rows;
  for (std::size_t k = 0; k < solutions.size(); ++k)
    rows.push_back(post::evaluate_speed(in, testing::kTeam30a[k].speed, solutions[k]));
  return rows;
}

/// The slip-frequency method: the (all forward) balanced supply in the rotor frame at s omega, no motion term.
std::vector<post::SpeedResult> by_slip(double fineness) {
  const Model t = team30a(fineness);
  const solver::RegionCoefficients coefficients =
      solver::region_coefficients(t.m, t.c.materials, solver::EddyModel::slip_frequency);
  const solver::TimeHarmonicSystem s = solver::assemble_time_harmonic(t.m, t.w, coefficients);
  const post::RotatingComponents waves = post::rotating_components(t.currents);
  const int p = t.w.spec.pole_pairs();
  std::vector<solver::TimeHarmonicProblem> problems;
  for (const auto& ref : testing::kTeam30a)
    problems.push_back({waves.forward, post::forward_slip(p, t.c.supply.frequency, ref.speed) * 2 * kPi *
                                           t.c.supply.frequency, 0.0});
  solver::TimeHarmonicStats stats;
  const auto forward = solver::solve_time_harmonic(t.m, s, problems, stats);
  const post::SlipInputs in{&t.m, &t.w, coefficients.sigma, coefficients.moves_with_rotor, t.c.supply.frequency,
                            t.c.stack_length};
  const Eigen::VectorXcd none = Eigen::VectorXcd::Zero(t.m.n_nodes());
  std::vector<post::SpeedResult> rows;
  for (std::size_t k = 0; k < forward.size(); ++k)
    rows.push_back(post::evaluate_slip_speed(in, testing::kTeam30a[k].speed, waves, forward[k], none));
  return rows;
}

double error(double value, double reference) { return std::abs(value / reference - 1.0); }

}  // namespace

TEST_CASE("TEAM 30a, motion term: torque, EMF and rotor loss at seven speeds, converging under refinement") {
  const auto coarse = by_motion_term(1.0);
  const auto fine = by_motion_term(2.0);
  REQUIRE(coarse.size() == testing::kTeam30a.size());
  for (std::size_t k = 0; k < coarse.size(); ++k) {
    const auto& ref = testing::kTeam30a[k];
    const auto& r = coarse[k];
    INFO("speed " << ref.speed << " rad/s: torque " << r.torque << ", EMF " << r.emf_rms[0] << ", rotor loss "
                  << r.rotor_loss << " (by power balance " << r.rotor_loss_balance << ")");
    // Tolerances as in the published comparison of first-order elements (torque 1.5 %, EMF 0.5 %,
    // losses 1 %), tightened where measured: 0.17 % torque at worst on this mesh, 0.064 % on the finer one.
    CHECK(error(r.torque, ref.torque) < 0.005);
    CHECK(error(fine[k].torque, ref.torque) < 0.001);
    CHECK(error(r.emf_rms[0], ref.emf) < 0.005);
    // Losses by power balance (input less Arkkio's mechanical power) within 1 % at every speed;
    // integrated from the current density within 1 % where the rotor is slow.
    CHECK(error(r.rotor_loss_balance, ref.rotor_loss) < 0.01);
    if (ref.speed <= 200) CHECK(error(r.rotor_loss, ref.rotor_loss) < 0.01);
    // Power balance, exact for the discrete equations: input = Joule losses + Lorentz mechanical power.
    const double balance = r.input_power - r.rotor_loss - r.stator_loss - r.torque_lorentz * r.rotor_speed;
    CHECK(std::abs(balance) < 1e-6 * std::max(std::abs(r.input_power), r.rotor_loss));
    CHECK(error(r.torque_lorentz, r.torque) < 0.02);
    // Halving the elements brings every value closer.
    CHECK(error(fine[k].torque, ref.torque) < error(r.torque, ref.torque));
    CHECK(error(fine[k].emf_rms[0], ref.emf) < error(r.emf_rms[0], ref.emf));
    // The integrated loss of a moving conductor converges about linearly here (measured: the error
    // falls by 1.9-2.8 times per halving), so we ask for at least a 40 % fall.
    if (ref.speed >= 400) CHECK(error(fine[k].rotor_loss, ref.rotor_loss) < 0.6 * error(r.rotor_loss, ref.rotor_loss));
  }
}

TEST_CASE("TEAM 30a, slip method: the same system at s omega without the motion term") {
  // The smooth rotor is rotationally invariant, so the slip method is exact for the fundamental,
  // but not for the six-sector winding's space harmonics (each is solved at the fundamental's slip),
  // so the error grows with speed: measured 0.68 % at 200 rad/s, 1.5-2.0 % at 400-600, 2.8, 4.0,
  // 5.0 % at 800, 1000, 1200 rad/s.
  const auto rows = by_slip(1.0);
  double previous = 0.0;
  for (std::size_t k = 0; k < rows.size(); ++k) {
    const auto& ref = testing::kTeam30a[k];
    const auto& r = rows[k];
    const double e = error(r.torque, ref.torque);
    INFO("speed " << ref.speed << ": torque " << r.torque << " (" << e << "), EMF " << r.emf_rms[0] << ", rotor loss "
                  << r.rotor_loss);
    if (ref.speed == 0.0) {
      CHECK(e < 0.005);  // all harmonics at omega: as good as the motion term
      CHECK(error(r.rotor_loss, ref.rotor_loss) < 0.01);
    } else if (ref.speed <= 600.0) {
      CHECK(e < 0.02);
    } else {
      CHECK(e < 0.06);
      CHECK(e > previous);
    }
    previous = e;
    CHECK(error(r.emf_rms[0], ref.emf) < 0.005);
    // Discrete energy identity in the rotor frame: input power at omega = rotor loss / s.
    const auto& f = r.components[0];
    CHECK(std::abs(f.input_power * f.slip - f.rotor_loss) < 1e-9 * f.rotor_loss);
  }
}
