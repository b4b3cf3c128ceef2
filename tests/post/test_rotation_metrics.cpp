// The field-rotation metrics on waves whose answers are known by construction (README.md, "Field-rotation metrics").

#include <doctest/doctest.h>

#include <cmath>
#include <complex>
#include <numbers>

#include "post/rotation_metrics.hpp"

using namespace tf;

namespace {

constexpr double kPi = std::numbers::pi;

/// c(t_k) of B_f cos(p theta - wt) + B_b cos(p theta + wt): c = B_f e^{jwt} + B_b e^{-jwt}.
std::vector<std::complex<double>> two_waves(double forward, double backward, int steps) {
  std::vector<std::complex<double>> c;
  for (int k = 0; k < steps; ++k) {
    const double wt = 2 * kPi * k / steps;
    c.push_back(forward * std::polar(1.0, wt) + backward * std::polar(1.0, -wt));
  }
  return c;
}

}  // namespace

TEST_CASE("a perfect rotating field: no ripple, uniform steps, no backward wave") {
  const int p = 2, K = 36;
  const auto c = two_waves(0.8, 0.0, K);
  const auto r = post::rotation_metrics(c, std::vector<double>(K, 0.9), std::vector<double>(K, 0.1), p);
  CHECK(r.mean_fundamental == doctest::Approx(0.8).scale(0));
  CHECK(r.amplitude_ripple == doctest::Approx(0.0).epsilon(1e-12));
  CHECK(r.expected_step_deg == doctest::Approx(5.0).scale(0));
  CHECK(r.rotation_uniformity_deg < 1e-9);
  CHECK(r.forward == doctest::Approx(0.8).scale(0));
  CHECK(r.backward < 1e-12);
  CHECK(r.backward_forward_ratio < 1e-12);
}

TEST_CASE("a pulsating field is half forward and half backward: ratio 1") {
  // Single-phase: B cos(p theta) cos(wt) = B/2 [cos(p theta - wt) + cos(p theta + wt)] (standard theory).
  const auto c = two_waves(0.5, 0.5, 24);
  const auto r = post::rotation_metrics(c, std::vector<double>(24, 1.0), std::vector<double>(24, 0.0), 1);
  CHECK(r.forward == doctest::Approx(0.5).scale(0));
  CHECK(r.backward == doctest::Approx(0.5).scale(0));
  CHECK(r.backward_forward_ratio == doctest::Approx(1.0).scale(0));
  // |c| = |cos wt| swings between 0 and 1 about its mean (2/pi in the continuous limit).
  double mean = 0.0;
  for (const auto& x : c) mean += std::abs(x) / 24;
  CHECK(r.amplitude_ripple == doctest::Approx(1.0 / mean).epsilon(1e-12).scale(0));
  CHECK(mean == doctest::Approx(2 / kPi).epsilon(0.01).scale(0));
}

TEST_CASE("an elliptic field: ripple and axis steps follow from the two waves") {
  // |c| = |F e^{jwt} + B e^{-jwt}| runs between F - B and F + B.
  const double F = 1.0, B = 0.2;
  const int K = 360;
  const auto c = two_waves(F, B, K);
  const auto r = post::rotation_metrics(c, std::vector<double>(K, 1.0), std::vector<double>(K, 0.0), 1);
  double mean = 0.0;
  for (const auto& x : c) mean += std::abs(x) / K;
  CHECK(r.amplitude_ripple == doctest::Approx(2 * B / mean).epsilon(1e-9).scale(0));
  CHECK(r.backward_forward_ratio == doctest::Approx(0.2).epsilon(1e-12).scale(0));
  // The axis moves fastest along the major axis: d(arg c)/d(wt) = (F^2 - B^2)/|c|^2 peaks at (F + B)/(F - B).
  const double fastest = (F + B) / (F - B) * 1.0;  // degrees per step, since K = 360 and p = 1
  CHECK(r.rotation_uniformity_deg == doctest::Approx(fastest - 1.0).epsilon(2e-3).scale(0));
}
