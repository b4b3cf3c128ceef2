// Split-phase supply: winding currents from the voltage, the resistances and the FE inductances.

#include <doctest/doctest.h>

#include <cmath>
#include <complex>
#include <numbers>

#include "mesh/build.hpp"
#include "mesh/winding.hpp"
#include "post/sequence.hpp"
#include "post/study.hpp"
#include "solver/flux_linkage.hpp"
#include "solver/phase_fields.hpp"
#include "solver/split_phase.hpp"
#include "support/sample_geometry.hpp"
#include "support/winding_spec.hpp"

using namespace tf;

namespace {

struct TwoPhase {
  mesh::Mesh mesh;
  mesh::Winding winding;
  solver::PhaseFields fields;
  Eigen::Matrix2d inductance;
};

TwoPhase two_phase_stator() {
  const mesh::Geometry g = testing::semi_closed_stator();
  TwoPhase t{mesh::build(g, {2}, {0.5}), mesh::lay_out(testing::winding_spec(2, 4, 2, 6, 12), g.stator), {}, {}};
  t.fields = solver::solve_phase_fields(t.mesh, t.winding, {3000, 3000, 3000});
  t.inductance = solver::inductance_matrix(t.mesh, t.winding, t.fields, 0.06);
  return t;
}

/// V - Z I for each winding, with Z built independently of the solver.
std::complex<double> residual(const solver::SplitPhase& s, const Eigen::Matrix2d& L, double f, double element,
                              const std::vector<std::complex<double>>& i, int k) {
  const double w = 2 * std::numbers::pi * f;
  const std::complex<double> j(0, 1);
  std::complex<double> z_self = s.resistance[k] + j * w * L(k, k);
  if (k == s.element_phase) z_self += solver::element_impedance(s.element, element, w);
  return std::sqrt(2.0) * s.voltage_rms - z_self * i[k] - j * w * L(k, 1 - k) * i[1 - k];
}

}  // namespace

TEST_CASE("inductances: symmetric by reciprocity, and the two balanced windings alike") {
  const TwoPhase t = two_phase_stator();
  CHECK(t.inductance(0, 0) > 0.0);
  CHECK(std::abs(t.inductance(0, 1) - t.inductance(1, 0)) < 1e-9 * t.inductance(0, 0));
  CHECK(t.inductance(1, 1) == doctest::Approx(t.inductance(0, 0)).epsilon(1e-9).scale(0));
  // Axes 90° apart (electrical): the fundamentals do not link; what is left is slot leakage asymmetry.
  CHECK(std::abs(t.inductance(0, 1)) < 1e-6 * t.inductance(0, 0));
}

TEST_CASE("split phase with a resistor: currents satisfy the circuit, lead by less than 90 degrees, field elliptic") {
  // Circuit: V = (R_k + Z_k + j w L_kk) I_k + j w L_kl I_l for both windings (Kirchhoff's voltage law).
  const TwoPhase t = two_phase_stator();
  solver::SplitPhase s;
  s.voltage_rms = 48.0;
  s.resistance = {14.0, 3.0};
  s.element = solver::SeriesElement::resistor;
  s.element_phase = 0;
  const auto i = solver::split_phase_currents(s, 50.0, t.inductance, 10.0);
  const double scale = std::abs(std::sqrt(2.0) * s.voltage_rms);
  for (int k = 0; k < 2; ++k) CHECK(std::abs(residual(s, t.inductance, 50.0, 10.0, i, k)) < 1e-9 * scale);
  const double lead = std::arg(i[0] / i[1]) * 180 / std::numbers::pi;
  CHECK(lead > 0.0);
  CHECK(lead < 90.0);
  const auto unit = post::unit_fundamentals(t.mesh, t.fields, 2);
  const auto waves = post::rotating_waves(i, unit);
  CHECK(waves.backward / waves.forward > 0.1);  // elliptic, not circular
  CHECK(waves.backward / waves.forward < 1.0);  // but turning counter-clockwise
}

TEST_CASE("split phase with a capacitor: the circuit holds, and a capacitor can make the field nearly circular") {
  // With R_aux near the main reactance, I_aux ⟂ I_main at equal size is reachable: Z_aux must be
  // Z_main turned by -90° (|Z_aux| = |Z_main|), i.e. R_aux = X_main and X_aux - X_C = -R_main.
  const TwoPhase t = two_phase_stator();
  const double w = 2 * std::numbers::pi * 50.0;
  const double x_main = w * t.inductance(1, 1);
  solver::SplitPhase s;
  s.voltage_rms = 48.0;
  s.resistance = {x_main, 3.0};
  s.element = solver::SeriesElement::capacitor;
  s.element_phase = 0;
  const double x_c = w * t.inductance(0, 0) + 3.0;  // X_aux - X_C = -R_main
  const double c = 1.0 / (w * x_c);
  const auto i = solver::split_phase_currents(s, 50.0, t.inductance, c);
  for (int k = 0; k < 2; ++k) CHECK(std::abs(residual(s, t.inductance, 50.0, c, i, k)) < 1e-9 * std::sqrt(2.0) * 48.0);
  CHECK(std::abs(i[0]) == doctest::Approx(std::abs(i[1])).epsilon(1e-6).scale(0));
  CHECK(std::arg(i[0] / i[1]) * 180 / std::numbers::pi == doctest::Approx(90.0).epsilon(1e-6).scale(0));
  const auto waves = post::rotating_waves(i, post::unit_fundamentals(t.mesh, t.fields, 2));
  CHECK(waves.backward / waves.forward < 1e-3);
}
