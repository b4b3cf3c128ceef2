// A conducting cylinder in a uniform rotating field: the eddy-current formulation (j omega and
// motion terms) and Arkkio's torque against the closed form.

#include <doctest/doctest.h>

#include <cmath>
#include <complex>
#include <numbers>

#include "post/eddy_quantities.hpp"
#include "solver/time_harmonic.hpp"
#include "support/polar_mesh.hpp"
#include "support/sheet_load.hpp"

using namespace tf;
using Complex = std::complex<double>;

namespace {

constexpr double kPi = std::numbers::pi;
constexpr double kMu0 = 4e-7 * kPi;

/// Modified Bessel I1(z) and its derivative by their power series (|z| of a few units here).
std::pair<Complex, Complex> bessel_i1(Complex z) {
  Complex term = z / 2.0, sum = term, dsum = 0.5;
  for (int k = 1; k < 60; ++k) {
    term *= (z / 2.0) * (z / 2.0) / double(k * (k + 1));
    sum += term;
    dsum += term * double(2 * k + 1) / z;  // d/dz (z/2)^{2k+1} / (k!(k+1)!) = (2k+1)/z * term
  }
  return {sum, dsum};
}

/// Closed form (derived; cf. Woodson & Melcher, Electromechanical Dynamics,
/// 1968, from memory): T = -(2 pi a^2 B0^2 / mu0) Im rho, rho = (1 - kappa)/(1 + kappa),
/// kappa = z I1'(z)/I1(z), z = a sqrt(j omega_s mu0 sigma).
double cylinder_torque(double a, double sigma, double b0, double slip_omega) {
  const Complex z = a * std::sqrt(Complex(0.0, slip_omega * kMu0 * sigma));
  const auto [i1, di1] = bessel_i1(z);
  const Complex kappa = z * di1 / i1;
  const Complex rho = (1.0 - kappa) / (1.0 + kappa);
  return -2 * kPi * a * a * b0 * b0 / kMu0 * std::imag(rho);
}

/// FE torque [N m/m] on the cylinder in a field of amplitude b0 [T] turning at omega [rad/s],
/// the cylinder turning at rotor_speed [rad/s].
double fe_torque(double a, double sigma, double b0, double omega, double rotor_speed) {
  // Cylinder, a thin gap band for Arkkio, air out to a sheet at 0.1 m, more air to 1 m (A = 0).
  const double r_sheet = 0.1, gap = 0.002;
  mesh::Mesh m = testing::polar_mesh(0.0, {{0.5 * a, 12, mesh::RegionKind::rotor_sleeve, "core"},
                                          {a, 24, mesh::RegionKind::rotor_sleeve, "skin"},
                                          {a + 0.5 * gap, 2, mesh::RegionKind::gap, "gap rotor side"},
                                          {a + gap, 2, mesh::RegionKind::gap, "gap stator side"},
                                          {r_sheet, 60, mesh::RegionKind::slot_air, "air"},
                                          {0.3, 40, mesh::RegionKind::outer_air, "far air"},
                                          {1.0, 40, mesh::RegionKind::outer_air, "farther air"}},
                                      256, 2);
  m.gap_inner_radius = a;
  m.gap_outer_radius = a + gap;
  solver::Materials mat;
  mat.sleeve_sigma = sigma;
  mesh::Winding none;
  none.spec.n_phases = 1;
  const solver::RegionCoefficients coefficients = solver::region_coefficients(m, mat);
  solver::TimeHarmonicSystem s = solver::assemble_time_harmonic(m, none, coefficients);
  // A sheet K cos(theta - omega t) = Re(K e^{-j theta} e^{j omega t}) at r_sheet makes the uniform field
  // mu0 K / 2 inside (air-cored sheet, p = 1: classical, e.g.
  // Binns, Lawrenson, Trowbridge 1992, from memory), less (r_sheet/1 m)^2 for the far boundary.
  const double k = 2 * b0 / kMu0 / (1 - std::pow(r_sheet / 1.0, 2));
  std::vector<int> ring;
  for (int node = 0; node < m.n_nodes(); ++node)
    if (std::abs(m.nodes.row(node).norm() - r_sheet) < 1e-12) ring.push_back(node);
  s.unit_loads.resize(s.dofs.n_dofs, 2);
  s.unit_loads.col(0) = testing::sheet_load(m, s.dofs, ring, [&](double th) { return k * std::cos(th); });
  s.unit_loads.col(1) = testing::sheet_load(m, s.dofs, ring, [&](double th) { return k * std::sin(th); });
  solver::TimeHarmonicStats stats;
  const auto sol = solver::solve_time_harmonic(m, s, {{{Complex(1, 0), Complex(0, -1)}, omega, rotor_speed}}, stats);
  return post::arkkio_torque(m, sol[0], 1.0);
}

}  // namespace

TEST_CASE("the closed form reproduces the published cylinder torques") {
  // The closed form above, derived here: aluminium, a = 30 mm, sigma = 3.72e7 S/m, B0 = 0.1 T.
  CHECK(cylinder_torque(0.03, 3.72e7, 0.1, 2 * kPi * 1) == doctest::Approx(1.483984).epsilon(1e-5).scale(0));
  CHECK(cylinder_torque(0.03, 3.72e7, 0.1, 2 * kPi * 10) == doctest::Approx(12.40679).epsilon(1e-5).scale(0));
}

TEST_CASE("conducting cylinder in a rotating field: torque at standstill and in motion within 0.5 %") {
  // At rest in a field turning at 1 Hz; and turning at 40 Hz in a 50 Hz field, the same 10 Hz slip
  // as a 10 Hz field on a cylinder at rest: the motion term must give the same torque.
  const double t1 = fe_torque(0.03, 3.72e7, 0.1, 2 * kPi * 1, 0.0);
  CHECK(t1 == doctest::Approx(1.483984).epsilon(0.005).scale(0));
  const double t10 = fe_torque(0.03, 3.72e7, 0.1, 2 * kPi * 10, 0.0);
  const double t10_moving = fe_torque(0.03, 3.72e7, 0.1, 2 * kPi * 50, 2 * kPi * 40);
  MESSAGE("FE torques: " << t1 << " (1 Hz), " << t10 << " (10 Hz at rest), " << t10_moving << " (10 Hz slip, moving)");
  CHECK(t10 == doctest::Approx(12.40679).epsilon(0.005).scale(0));
  CHECK(t10_moving == doctest::Approx(12.40679).epsilon(0.005).scale(0));
  CHECK(t10_moving == doctest::Approx(t10).epsilon(1e-9).scale(0));  // exact for a smooth cylinder
}
