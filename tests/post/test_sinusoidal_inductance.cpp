// Inductance of a slotless sinusoidal winding against its closed form, docs/references.md §4
// (derived from the classical slotless-gap solution in K. J. Binns, P. J. Lawrenson,
// C. W. Trowbridge, The Analytical and Numerical Solution of Electric and Magnetic Fields, Wiley
// 1992 — from memory): N_s series turns distributed as n(theta) = (N_s/2) sin(p theta) turns per
// radian on the bore R_s, infinitely permeable irons, stack L_a:
//   L = pi mu0 L_a N_s^2 (1 + x^{2p}) / (4 p (1 - x^{2p})),  x = R_r / R_s.
// The production flux_linkage() integrates A over coil sides; a sinusoidal winding has none, so its
// flux linkage is computed here: psi = L_a * integral_0^{2 pi} A(R_s, theta) n(theta) dtheta.

#include <doctest/doctest.h>

#include <cmath>
#include <numbers>

#include "support/two_sheets.hpp"
#include "support/convergence.hpp"

using namespace tf;

namespace {

constexpr double kPi = std::numbers::pi;
constexpr double kTurns = 100;        // N_s
constexpr double kStack = 0.1;        // L_a [m]
constexpr double kCurrent = 1.0;      // [A]

double closed_form(const testing::TwoSheetMachine& s) {
  const double x2p = std::pow(s.r_rotor / s.r_stator, 2 * s.p);
  return kPi * 4e-7 * kPi * kStack * kTurns * kTurns * (1 + x2p) / (4 * s.p * (1 - x2p));
}

/// psi = L_a * integral of A n dtheta on the bore ring: A linear along each chord, two-point Gauss.
double flux_linkage(const testing::TwoSheetMachine& s, const mesh::Mesh& m, const Eigen::VectorXd& a) {
  const std::vector<int> ring = testing::ring_at(m, s.r_stator);
  const double g = 0.5 / std::sqrt(3.0);
  double integral = 0.0;
  for (std::size_t i = 0; i < ring.size(); ++i) {
    const int na = ring[i], nb = ring[(i + 1) % ring.size()];
    const double theta_a = std::atan2(m.nodes(na, 1), m.nodes(na, 0));
    double theta_b = std::atan2(m.nodes(nb, 1), m.nodes(nb, 0));
    if (theta_b < theta_a) theta_b += 2 * kPi;
    for (double u : {0.5 - g, 0.5 + g}) {
      const double theta = (1 - u) * theta_a + u * theta_b;
      integral += 0.5 * (theta_b - theta_a) * ((1 - u) * a(na) + u * a(nb)) * 0.5 * kTurns * std::sin(s.p * theta);
    }
  }
  return kStack * integral;
}

}  // namespace

TEST_CASE("slotless sinusoidal winding: inductance within 0.5 % of the closed form, converging") {
  testing::TwoSheetMachine s;
  const double exact = closed_form(s);
  CHECK(exact == doctest::Approx(12.21987e-3).epsilon(1e-6).scale(0));  // docs/references.md §4
  std::vector<double> errors;
  for (int level = 0; level < 3; ++level) {
    s.level = level;
    const mesh::Mesh m = testing::two_sheet_mesh(s);
    // Sheet current K = i n(theta) / R_s [A/m]: n turns per radian over R_s metres per radian.
    const testing::SheetSolution x = testing::solve_sheets(
        s, m, [](double) { return 0.0; },
        [&](double th) { return kCurrent * 0.5 * kTurns * std::sin(s.p * th) / s.r_stator; });
    const double inductance = flux_linkage(s, m, x.a_nodes) / kCurrent;
    // With current sources in a linear field, psi i = f . a L_a (W = 1/2 L i^2 = 1/2 f . a L_a): the
    // same integral as the load, except that the load runs along the chords (ds) and this one along
    // the arc (R dtheta): they differ by chord/arc = 1 - (pi/n)^2/6, 2.9e-5 at n = 240 nodes round.
    const double chord_over_arc = 1 - std::pow(kPi / static_cast<double>(m.sliding.stator_nodes.size()), 2) / 6;
    CHECK(inductance * chord_over_arc ==
          doctest::Approx(kStack * x.load.dot(x.solution) / (kCurrent * kCurrent)).epsilon(1e-6).scale(0));
    errors.push_back(std::abs(inductance / exact - 1));
    MESSAGE("level " << level << ": L = " << inductance * 1e3 << " mH, relative error " << errors.back());
    CHECK(inductance == doctest::Approx(exact).epsilon(0.005).scale(0));
  }
  // Second order: the error falls about fourfold per halving (rate 2); asked: 3.5-fold.
  for (double rate : testing::convergence_rates(errors)) CHECK(rate > std::log2(3.5));
}
