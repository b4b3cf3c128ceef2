// Whole phase-angle studies on meshed stators: the rotating field of balanced windings.

#include <doctest/doctest.h>

#include <cmath>
#include <numbers>

#include "mesh/build.hpp"
#include "mesh/winding.hpp"
#include "post/study.hpp"
#include "solver/phase_fields.hpp"
#include "support/sample_geometry.hpp"

using namespace tf;

namespace {

constexpr double kPi = std::numbers::pi;
constexpr double kMu0 = 4e-7 * kPi;

struct Study {
  mesh::Winding winding;
  post::StudyResult result;
};

Study run(const mesh::Geometry& g, int phases, int layers, int pitch, double mu_iron, double fineness = 0.5) {
  mesh::WindingSpec spec;
  spec.n_phases = phases;
  spec.n_poles = 4;
  spec.n_layers = layers;
  spec.coil_pitch = pitch;
  spec.turns_per_coil = 10;
  const mesh::Mesh m = mesh::build(g, {layers}, {fineness});
  const mesh::Winding w = mesh::lay_out(spec, g.stator);
  const solver::PhaseFields f = solver::solve_phase_fields(m, w, {mu_iron, mu_iron, mu_iron});
  solver::Supply supply;
  supply.peak_current = 5.0;
  return {w, post::phase_sweep(m, w, f, supply, 36, {720, 25})};
}

double harmonic_ratio(const post::StepResult& s, int order) { return std::abs(s.harmonics(order)) / std::abs(s.fundamental); }

}  // namespace

TEST_CASE("balanced three-phase distributed winding: a field of constant amplitude turning 360/p per period") {
  // Standard theory (A. E. Fitzgerald, C. Kingsley, S. Umans, Electric Machinery, ch. 4; from memory):
  // balanced currents in a balanced winding make a fundamental of constant amplitude that turns
  // counter-clockwise by 360°/p mechanical per electrical period, with space orders 6k -+ 1 only.
  const auto s = run(testing::open_slot_stator(), 3, 2, 8, 1000.0);
  const auto& r = s.result;
  const int p = 2;
  CHECK(r.metrics.amplitude_ripple < 0.01);
  CHECK(r.metrics.expected_step_deg == doctest::Approx(5.0).scale(0));
  CHECK(r.metrics.rotation_uniformity_deg < 0.05);
  double turned = 0.0;
  for (std::size_t k = 0; k < r.steps.size(); ++k)
    turned += std::arg(r.steps[(k + 1) % r.steps.size()].fundamental / r.steps[k].fundamental) / p;
  CHECK(turned * 180 / kPi == doctest::Approx(360.0 / p).epsilon(1e-6).scale(0));
  CHECK(r.metrics.backward_forward_ratio < 0.005);
  // At wt = 0 phase A carries the peak current: the field axis is phase A's axis.
  CHECK(std::remainder(r.steps[0].axis - s.winding.phase_a_axis / p, kPi) == doctest::Approx(0.0).epsilon(0.005));
  // Even and triplen orders cancel; 5th and 7th remain, near the MMF ratio k_w,nu / (nu k_w1) of the
  // smooth-gap theory (same sources). Slotting is not in that theory: we accept -20 % .. +40 %.
  for (int nu : {2, 3, 4, 6, 9}) CHECK(harmonic_ratio(r.steps[0], nu * p) < 0.005);
  const auto k = mesh::winding_factors(s.winding, 7);
  for (int nu : {5, 7}) {
    const double mmf_ratio = k[nu - 1].total / (nu * k[0].total);
    CHECK(harmonic_ratio(r.steps[0], nu * p) / mmf_ratio == doctest::Approx(1.1).epsilon(0.28).scale(0));
  }
}

TEST_CASE("balanced two-phase winding: constant amplitude, and the third space harmonic is not cancelled") {
  // Standard theory (docs/references.md §3): two-phase windings carry all odd orders.
  const auto s = run(testing::semi_closed_stator(), 2, 2, 6, 1000.0);
  const auto& r = s.result;
  CHECK(r.metrics.amplitude_ripple < 0.01);
  CHECK(r.metrics.backward_forward_ratio < 0.005);
  CHECK(r.metrics.rotation_uniformity_deg < 0.05);
  CHECK(harmonic_ratio(r.steps[0], 3 * 2) > 0.02);
  CHECK(harmonic_ratio(r.steps[0], 2 * 2) < 0.005);
}

TEST_CASE("fundamental against the magnetic-circuit estimate with Carter's coefficient") {
  // B_1 = mu0 F_1 / (k_C g), F_1 = (m/2)(4/pi) k_w1 N_ph I / (2p) (Pyrhönen, Jokinen, Hrabovcová,
  // Design of Rotating Electrical Machines, 2008, ch. 2 and 3; from memory). Very permeable iron.
  // Carter: k_C = tau_s / (tau_s - gamma g), gamma = (4/pi)(u atan u - ln sqrt(1 + u^2)), u = b0/(2g).
  // The estimate ignores the slot-opening modulation of the fundamental; we accept 2 %.
  const mesh::Geometry g = testing::semi_closed_stator();
  const auto s = run(g, 3, 2, 6, 1e5, 1.0);
  const double gap = g.gap_length(), b0 = g.stator.slot.opening_width;
  const double tau = 2 * kPi * g.stator.bore_radius / g.stator.n_positions;
  const double u = b0 / (2 * gap);
  const double gamma = 4 / kPi * (u * std::atan(u) - std::log(std::sqrt(1 + u * u)));
  const double carter = tau / (tau - gamma * gap);
  const double kw1 = mesh::winding_factors(s.winding, 1)[0].total;
  const double mmf = 1.5 * 4 / kPi * kw1 * s.winding.series_turns() * 5.0 / 4;
  const double estimate = kMu0 * mmf / (carter * gap);
  MESSAGE("FE " << s.result.metrics.mean_fundamental << " T, estimate " << estimate << " T, Carter " << carter);
  CHECK(s.result.metrics.mean_fundamental == doctest::Approx(estimate).epsilon(0.02).scale(0));
}
