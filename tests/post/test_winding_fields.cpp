// Fields of the windings designers compare: a full-pitch coil against Ampère's law, switched DC
// states, unbalanced two-phase currents.

#include <doctest/doctest.h>

#include <cmath>
#include <numbers>

#include "mesh/build.hpp"
#include "mesh/winding.hpp"
#include "post/gap_field.hpp"
#include "post/sequence.hpp"
#include "post/study.hpp"
#include "solver/phase_fields.hpp"
#include "support/sample_geometry.hpp"
#include "support/winding_spec.hpp"

using namespace tf;

namespace {

constexpr double kPi = std::numbers::pi;

struct Solved {
  mesh::Mesh mesh;
  mesh::Winding winding;
  solver::PhaseFields fields;
};

Solved solve(const mesh::Geometry& g, const mesh::WindingSpec& spec, double mu_iron, double fineness) {
  Solved s{mesh::build(g, mesh::slot_layers(spec), {fineness}), mesh::lay_out(spec, g.stator), {}};
  s.fields = solver::solve_phase_fields(s.mesh, s.winding, {mu_iron, mu_iron, mu_iron});
  return s;
}

}  // namespace

TEST_CASE("a full-pitch coil in a very permeable core: the gap field's harmonics are those of the stepped MMF") {
  // Ampère's law round a path crossing the gap twice: with iron of negligible reluctance the gap
  // field is mu0 F(theta) / g_eff, F the stepped MMF of the coil. One coil of N conductors in slots
  // 1 and 19 of 36 (2 poles, full pitch): F is a square wave whose odd harmonics fall as 1/n; the
  // step spread over the slot opening's angle 2b adds the factor sin(n b)/(n b). (Standard MMF
  // theory, e.g. Pyrhönen et al., Design of Rotating Electrical Machines, 2008, ch. 2; from memory.)
  // Slot openings as narrow as the gap keep the slot-permeance harmonics, which fold order 36 - n
  // of F onto order n, near 1 % of the mean; the narrow gap keeps the curvature correction of the
  // layered solution below 0.03 % up to the 13th.
  mesh::Geometry g = testing::semi_closed_stator();
  g.stator.n_positions = 36;
  g.stator.slot.width = 0.004;
  g.stator.slot.opening_width = 0.0003;
  g.rotor.outer_radius = g.stator.bore_radius - 0.0003;
  mesh::WindingSpec spec;
  spec.n_phases = 1;
  spec.n_poles = 2;
  spec.n_layers = 1;
  spec.explicit_sides = {{1, 1, 0, 1, 20, 0.0}, {19, 1, 0, -1, 20, 0.0}};
  const Solved s = solve(g, spec, 1e5, 1.0);
  const post::GapOperators ops = post::gap_operators(s.mesh, 720, 15);
  const Eigen::MatrixXcd c = post::gap_harmonics(ops, s.fields.potential);
  const double b = std::asin(0.5 * g.stator.slot.opening_width / g.stator.bore_radius);  // half the opening's angle
  auto mmf = [b](int n) { return std::sin(n * b) / (n * b) / n; };
  for (int n : {3, 5, 7, 9, 11, 13}) {
    const double fe = std::abs(c(n, 0)) / std::abs(c(1, 0));
    const double ampere = mmf(n) / mmf(1);
    MESSAGE("order " << n << ": FE " << fe << ", stepped MMF " << ampere);
    CHECK(fe == doctest::Approx(ampere).epsilon(n <= 7 ? 0.01 : 0.02).scale(0));
  }
  for (int n : {2, 4, 6}) CHECK(std::abs(c(n, 0)) < 1e-3 * std::abs(c(1, 0)));  // half-wave symmetry
}

TEST_CASE("two coil pairs switched through four DC states: the axis steps a quarter turn each time") {
  // Common practice for switched-DC stepping fields: with two coil pairs at right angles energised
  // A, B, -A, -B in turn, the field axis of a 2-pole field moves 90° per state, at constant amplitude.
  const mesh::Geometry g = testing::salient_stator();
  const Solved s = solve(g, testing::winding_spec(2, 2, 2, 1, 50), 2000.0, 0.5);
  solver::Supply dc;
  dc.kind = solver::SupplyKind::stepped_dc;
  dc.states = {{1.0, 0.0}, {0.0, 1.0}, {-1.0, 0.0}, {0.0, -1.0}};
  const auto r = post::phase_sweep(s.mesh, s.winding, s.fields, dc, 4, {720, 9});
  REQUIRE(r.steps.size() == 4);
  for (int k = 0; k < 4; ++k) {
    const double step = std::arg(r.steps[(k + 1) % 4].fundamental / r.steps[k].fundamental) * 180 / kPi;
    CHECK(step == doctest::Approx(90.0).epsilon(0.005).scale(0));
  }
  CHECK(r.metrics.amplitude_ripple < 0.005);
  CHECK(r.metrics.peak_ripple < 0.005);
}

TEST_CASE("two-phase winding, currents 90 and 60 degrees apart: backward/forward against symmetrical components") {
  // Balanced (90°): a circular field. 60°: I_f = (I_A + j I_B)/2 and I_b = (I_A - j I_B)/2 give
  // |I_b|/|I_f| = tan 15° = 0.267949, computed by hand from the currents (Fortescue's method).
  const Solved s = solve(testing::semi_closed_stator(), testing::winding_spec(2, 4, 2, 6, 10), 1000.0, 0.5);
  solver::Supply supply;
  supply.kind = solver::SupplyKind::phasors;
  supply.phasors = {std::polar(5.0, 0.0), std::polar(5.0, -kPi / 2)};
  const auto balanced = post::phase_sweep(s.mesh, s.winding, s.fields, supply, 36, {720, 9});
  CHECK(balanced.metrics.backward_forward_ratio < 1e-3);
  CHECK(balanced.metrics.amplitude_ripple < 0.01);
  supply.phasors[1] = std::polar(5.0, -kPi / 3);
  const auto elliptic = post::phase_sweep(s.mesh, s.winding, s.fields, supply, 36, {720, 9});
  CHECK(elliptic.metrics.backward_forward_ratio == doctest::Approx(std::tan(kPi / 12)).epsilon(2e-3).scale(0));
  // The amplitude swings between (f + b) and (f - b): ripple 2b / mean.
  CHECK(elliptic.metrics.amplitude_ripple > 0.4);
}
