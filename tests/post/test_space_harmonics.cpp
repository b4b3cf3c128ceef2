// The space-harmonic table: waves built by hand come back with their amplitude, direction and
// speed (the decomposition is exact for sampled sinusoids), and a winding's orders turn the way the
// standard theory says.

#include <doctest/doctest.h>

#include <cmath>
#include <complex>
#include <numbers>

#include "mesh/winding.hpp"
#include "post/space_harmonics.hpp"
#include "support/sample_geometry.hpp"

using namespace tf;

namespace {

constexpr double kPi = std::numbers::pi;

/// A 4-pole winding of the sample stator (only its layout and pole pairs are used here).
mesh::Winding sample_winding(int phases) {
  mesh::WindingSpec spec;
  spec.n_phases = phases;
  spec.n_poles = 4;
  spec.n_layers = 2;
  spec.coil_pitch = 5;
  spec.turns_per_coil = 10;
  return mesh::lay_out(spec, testing::semi_closed_stator().stator);
}

}  // namespace

TEST_CASE("space harmonics: forward, backward and pulsating waves built by hand come back exactly") {
  // c_n(t) = F e^{j(wt + a)} + B e^{-j(wt + b)}: the forward wave F cos(n theta - wt - a) and the
  // backward one B cos(n theta + wt + b) (post/gap_field.hpp's phasor convention).
  const mesh::Winding w = sample_winding(3);  // p = 2
  post::StudyResult r;
  const int k_steps = 36, n_max = 12;
  for (int k = 0; k < k_steps; ++k) {
    post::StepResult s;
    s.electrical_angle = 2 * kPi * k / k_steps;
    s.harmonics = Eigen::VectorXcd::Zero(n_max + 1);
    const auto wave = [&](double f, double b) {
      return f * std::polar(1.0, s.electrical_angle + 0.3) + b * std::polar(1.0, -(s.electrical_angle + 1.1));
    };
    s.harmonics(2) = wave(0.8, 0.0);     // the fundamental, forward
    s.harmonics(6) = wave(0.0, 0.1);     // 3rd electrical, backward
    s.harmonics(10) = wave(0.03, 0.03);  // 5th electrical, pulsating
    r.steps.push_back(s);
  }
  r.metrics.mean_fundamental = 0.8;
  const double f = 50.0;
  const auto table = post::space_harmonics(r, w, f);
  REQUIRE(table.size() == static_cast<std::size_t>(n_max));
  const auto& h2 = table[1];
  CHECK(h2.electrical_order == 1.0);
  CHECK(h2.forward == doctest::Approx(0.8).epsilon(1e-12).scale(0));
  CHECK(h2.backward < 1e-12);
  CHECK(post::direction(h2) == "forward");
  CHECK(h2.speed_rpm == doctest::Approx(1500.0).epsilon(1e-12).scale(0));  // 60 f / n = 120 f / (2p)
  const auto& h6 = table[5];
  CHECK(h6.backward == doctest::Approx(0.1).epsilon(1e-12).scale(0));
  CHECK(post::direction(h6) == "backward");
  CHECK(h6.speed_rpm == doctest::Approx(-500.0).epsilon(1e-12).scale(0));  // n_s / 3, backward
  CHECK(h6.relative == doctest::Approx(0.1 / 0.8).epsilon(1e-12).scale(0));
  CHECK(post::direction(table[9]) == "pulsating");
  CHECK(table[9].forward == doctest::Approx(0.03).epsilon(1e-12).scale(0));
  CHECK(post::direction(table[3]) == "none");
  CHECK(h2.winding_factor == doctest::Approx(mesh::layout_winding_factor(w, 0, 2)).epsilon(1e-12).scale(0));
}
