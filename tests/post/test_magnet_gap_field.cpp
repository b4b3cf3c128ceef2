// Permanent magnets: the open-circuit air-gap field of a slotless surface-magnet machine against
// the exact 2D Fourier-series solution and the 1D magnetic-circuit estimate, read through the
// gap operators of post/gap_field.hpp. (The magnet load itself: tests/solver/test_magnets.cpp.)

#include <doctest/doctest.h>

#include <cmath>
#include <complex>
#include <numbers>
#include <vector>

#include <Eigen/Dense>

#include "mesh/build.hpp"
#include "post/gap_field.hpp"
#include "solver/assemble.hpp"
#include "solver/coefficients.hpp"
#include "solver/dofs.hpp"
#include "solver/magnets.hpp"
#include "solver/spd_solver.hpp"
#include "support/sample_geometry.hpp"

using namespace tf;

namespace {

constexpr double kPi = std::numbers::pi;

/// Fundamental-order field of a slotless surface-magnet machine, exact in 2D (derived here; the
/// method of Z. Q. Zhu, D. Howe et al., IEEE Trans. Magn. 29(1), 1993, from memory). Rotor iron
/// r < R_r and stator iron r > R_s infinitely permeable; radially magnetized magnets R_r < r < R_m
/// with B = mu0 mu_rec H + M(theta) e_r; air R_m < r < R_s.
///   M(theta) = sum_n M_n cos(n theta), n = k p (k odd), M_n = (4 B_r / (k pi)) sin(k pi alpha / 2),
///   alpha = magnet arc / pole pitch (a square wave of +-B_r under the magnets, 0 between).
/// With curl H = 0 and H = nu (B - B_rem): laplacian A = -(curl B_rem)_z = M'(theta)/r in the
/// magnet, 0 in air. A = a(r) sin(n theta) turns each order into an Euler-type ODE
///   a'' + a'/r - n^2 a / r^2 = -n M_n / r (magnet), = 0 (air);
/// particular solution C r with C = n M_n / (n^2 - 1) (n >= 2), homogeneous r^n, r^-n. With
/// rho = r / R_m: a_m = P rho^n + Q rho^-n + C r, a_a = S rho^n + T rho^-n. Conditions: H_theta = 0
/// at both iron surfaces (a_m'(R_r) = 0, a_a'(R_s) = 0: the magnet has no tangential B_rem);
/// B_r continuous (a_m(R_m) = a_a(R_m)) and H_theta continuous (a_m'(R_m) / mu_rec = a_a'(R_m)) at
/// the magnet surface. Then B_r = (n / r) a_a(r) cos(n theta) in the air.
struct SlotlessMagnetMachine {
  double r_rotor, r_magnet, r_stator, b_r, mu_rec, alpha;
  int p;
  /// Amplitude [T] of the space order n = k p of B_r at radius r in the air (n >= 2).
  double radial_field(int k, double r) const {
    const int n = k * p;
    const double m_n = 4 * b_r / (k * kPi) * std::sin(k * kPi * alpha / 2);
    const double c = n * m_n / (n * n - 1.0);
    const double rr = r_rotor / r_magnet, rs = r_stator / r_magnet;
    Eigen::Matrix4d lhs;
    Eigen::Vector4d rhs;
    // Unknowns (P, Q, S, T); rows: a_m'(R_r) = 0, a_a'(R_s) = 0, continuity of A and of H_theta.
    lhs << n / r_rotor * std::pow(rr, n), -n / r_rotor * std::pow(rr, -n), 0, 0,  //
        0, 0, n / r_stator * std::pow(rs, n), -n / r_stator * std::pow(rs, -n),   //
        1, 1, -1, -1,                                                             //
        n / (r_magnet * mu_rec), -n / (r_magnet * mu_rec), -n / r_magnet, n / r_magnet;
    rhs << -c, 0, -c * r_magnet, -c / mu_rec;
    const Eigen::Vector4d x = lhs.fullPivLu().solve(rhs);
    const double rho = r / r_magnet;
    return n / r * (x(2) * std::pow(rho, n) + x(3) * std::pow(rho, -n));
  }
};

}  // namespace

TEST_CASE("slotless surface-magnet machine, open circuit: the gap field's fundamental against the 2D and 1D solutions") {
  // Invented machine: 4 poles, radially magnetized magnets over the full pole pitch, 4 mm thick on an
  // iron rotor of radius 36 mm; 1 mm mechanical gap to a slotless stator whose winding annulus
  // (41-43 mm) carries no current, so the field sees 3 mm of air up to the stator iron at 43 mm.
  // Iron mu_r = 1e4 stands in for infinitely permeable iron.
  mesh::Geometry g;
  g.stator.kind = mesh::StatorKind::slotless;
  g.stator.bore_radius = 0.041;
  g.stator.outer_radius = 0.060;
  g.stator.n_positions = 12;
  g.stator.belts = {.outer_radius = 0.043, .span = 0.8 * 2 * kPi / 12};
  g.rotor.kind = mesh::RotorKind::surface_magnet;
  g.rotor.outer_radius = 0.040;
  g.rotor.magnets = {.n_poles = 4, .thickness = 0.004, .arc = kPi / 2, .direction = mesh::Magnetization::radial};
  solver::Materials mat{.stator_iron_mu_r = 1e4, .rotor_iron_mu_r = 1e4};
  const mesh::Mesh m = mesh::build(g, {1}, {.fineness = 1.0});
  const solver::DofMap d = solver::number_dofs(m);
  const auto K = solver::assemble_stiffness(m, d, solver::region_coefficients(m, mat).nu);
  solver::SpdSolver spd;
  spd.analyse(K);
  spd.factorize(K);
  const Eigen::VectorXd f = solver::magnet_load(m, d, mat, solver::magnet_layout(g.rotor));
  const Eigen::MatrixXd a = solver::to_nodes(d, spd.solve(f));
  const Eigen::MatrixXcd c = post::gap_harmonics(post::gap_operators(m, 720, 10), a);

  const SlotlessMagnetMachine exact{0.036, 0.040, 0.043, mat.magnet_remanence, mat.magnet_mu_rec, 1.0, 2};
  const double r = m.sliding.radius;
  const double fundamental = exact.radial_field(1, r);
  MESSAGE("mid-gap B_r fundamental: FE " << c(2, 0) << " T, exact 2D " << fundamental << " T, order 6: FE "
                                         << c(6, 0) << ", exact " << exact.radial_field(3, r));
  // Pole 1 (north, at 0°) drives flux outwards there: the phasor is real and positive.
  CHECK(c(2, 0).real() == doctest::Approx(fundamental).epsilon(0.005).scale(0));
  CHECK(std::abs(c(2, 0).imag()) < 1e-3 * fundamental);
  // The third harmonic of the square wave (negative: sin(3 pi/2) = -1), steeper in r, so coarser.
  CHECK(c(6, 0).real() == doctest::Approx(exact.radial_field(3, r)).epsilon(0.02).scale(0));
  // Four poles, half-wave symmetric: no even multiple of the pole-pair order.
  CHECK(std::abs(c(4, 0)) < 1e-3 * fundamental);

  // 1D magnetic circuit (common practice; e.g. J. R. Hendershot, T. J. E. Miller, Design of
  // Brushless Permanent-Magnet Motors, 1994, from memory): B_g = B_r h_m / (h_m + mu_rec g) under
  // a magnet, a square wave whose fundamental is 4/pi of it. It ignores curvature (flux spreading
  // outwards over a larger radius) and the leakage between poles across the gap; with
  // (g + h_m) / (pole pitch) = 7 mm / 63 mm these cost several per cent: tolerance 6 %.
  const double h_m = 0.004, gap = 0.003;
  const double one_d = mat.magnet_remanence * h_m / (h_m + mat.magnet_mu_rec * gap) * 4 / kPi;
  MESSAGE("1D estimate " << one_d << " T");
  CHECK(c(2, 0).real() == doctest::Approx(one_d).epsilon(0.06).scale(0));

  // The rotor turned by 37 node pitches (delta counter-clockwise): the same load in the rotor's
  // frame, new sliding-circle ties; the field turns with it, c_2 -> c_2 e^{+j 2 delta} (gap_field.hpp).
  const int shift = 37;
  const double delta = 2 * kPi * shift / static_cast<double>(m.sliding.rotor_nodes.size());
  const solver::DofMap turned = solver::number_dofs(m, shift);
  const auto K_turned = solver::assemble_stiffness(m, turned, solver::region_coefficients(m, mat).nu);
  solver::SpdSolver spd_turned;
  spd_turned.analyse(K_turned);
  spd_turned.factorize(K_turned);
  const Eigen::VectorXd f_turned = solver::magnet_load(m, turned, mat, solver::magnet_layout(g.rotor));
  const Eigen::MatrixXd a_turned = solver::to_nodes(turned, spd_turned.solve(f_turned));
  const std::complex<double> c_turned = post::gap_harmonics(post::gap_operators(m, 720, 2), a_turned)(2, 0);
  MESSAGE("turned by " << delta * 180 / kPi << " deg: c_2 = " << c_turned);
  CHECK(std::abs(c_turned) == doctest::Approx(std::abs(c(2, 0))).epsilon(1e-3).scale(0));
  CHECK(std::arg(c_turned / c(2, 0)) == doctest::Approx(2 * delta).epsilon(1e-3).scale(0));
}
