// Symmetrical components and the rotating waves of phasor currents.

#include <doctest/doctest.h>

#include <cmath>
#include <complex>
#include <numbers>

#include "post/sequence.hpp"

using namespace tf;
using C = std::complex<double>;

namespace {
constexpr double kDeg = std::numbers::pi / 180;
}

TEST_CASE("three-phase symmetrical components (C. L. Fortescue, Trans. AIEE 37, 1918)") {
  // A balanced set, B lagging A by 120°: all positive sequence.
  auto s = post::sequence_components({std::polar(10.0, 0.0), std::polar(10.0, -120 * kDeg), std::polar(10.0, -240 * kDeg)});
  CHECK(std::abs(s.positive) == doctest::Approx(10.0).scale(0));
  CHECK(std::abs(s.negative) < 1e-12);
  CHECK(std::abs(s.zero) < 1e-12);
  // Phases B and C swapped: all negative sequence.
  s = post::sequence_components({std::polar(10.0, 0.0), std::polar(10.0, 120 * kDeg), std::polar(10.0, 240 * kDeg)});
  CHECK(std::abs(s.negative) == doctest::Approx(10.0).scale(0));
  CHECK(std::abs(s.positive) < 1e-12);
  // Phase A alone: a third of it in each sequence.
  s = post::sequence_components({C(9.0, 0.0), C(0.0, 0.0), C(0.0, 0.0)});
  CHECK(std::abs(s.positive) == doctest::Approx(3.0).scale(0));
  CHECK(std::abs(s.negative) == doctest::Approx(3.0).scale(0));
  CHECK(std::abs(s.zero) == doctest::Approx(3.0).scale(0));
}

TEST_CASE("two-phase currents 60 degrees apart: backward/forward = tan 15 degrees, by hand") {
  // I_f = (I_A + j I_B)/2, I_b = (I_A - j I_B)/2 with I_B = I e^{-j60°}: |1 + e^{j30°}| = 2 cos 15°,
  // |1 - e^{j30°}| = 2 sin 15°, so the ratio is tan 15° = 0.267949.
  const std::vector<C> currents = {C(1.0, 0.0), std::polar(1.0, -60 * kDeg)};
  const auto s = post::sequence_components(currents);
  CHECK(std::abs(s.negative) / std::abs(s.positive) == doctest::Approx(0.267949).epsilon(1e-5).scale(0));
  // Through unit fields of a balanced two-phase winding (B's wave turned 90° ahead of A's):
  const auto w = post::rotating_waves(currents, {C(0.1, 0.0), C(0.0, 0.1)});
  CHECK(w.backward / w.forward == doctest::Approx(0.267949).epsilon(1e-5).scale(0));
}
