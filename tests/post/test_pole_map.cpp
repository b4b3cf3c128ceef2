// The pole map on waves whose poles are known by construction.

#include <doctest/doctest.h>

#include <cmath>
#include <functional>
#include <numbers>

#include "post/pole_map.hpp"

using namespace tf;

namespace {

constexpr double kPi = std::numbers::pi;

Eigen::VectorXd wave(int m, const std::function<double(double)>& f) {
  Eigen::VectorXd b(m);
  for (int j = 0; j < m; ++j) b(j) = f(2 * kPi * j / m);
  return b;
}

}  // namespace

TEST_CASE("a p-pole-pair cosine has p north and p south poles where B_r is most negative and positive") {
  // B_r = B cos(p (theta - phi)): south poles (flux into the stator, B_r > 0) at phi + 2 pi k / p,
  // north poles half a pole pitch on; each pole passes r * 2B/p of flux (per metre).
  const int p = 3;
  const double phi = 0.3, r = 0.05, b = 0.8;
  const auto poles = post::pole_map(wave(1440, [&](double t) { return b * std::cos(p * (t - phi)); }), r);
  REQUIRE(poles.size() == 2 * p);
  int north = 0;
  for (const auto& pole : poles) {
    north += pole.north;
    const double expected = phi + (pole.north ? kPi / p : 0.0);
    CHECK(std::abs(std::remainder(pole.angle - expected, 2 * kPi / p)) < 2 * kPi / 1440 + 1e-12);
    CHECK(pole.flux == doctest::Approx(r * 2 * b / p).epsilon(1e-4).scale(0));
  }
  CHECK(north == p);
}

TEST_CASE("slot ripple that crosses zero does not make extra poles, but real unequal poles stay") {
  // A 2-pole wave with a narrow dip of the other sign near its crest: one pole pair.
  const auto dipped = post::pole_map(wave(1440, [](double t) {
                                       const double dip = std::abs(std::remainder(t - 0.2, 2 * kPi)) < 0.01 ? -2.0 : 0.0;
                                       return std::cos(t) + dip;
                                     }),
                                     0.05);
  CHECK(dipped.size() == 2);
  // Ten runs of alternating sign with fluxes 2:1 (a tooth-coil field): ten poles.
  const auto uneven = post::pole_map(wave(1440, [](double t) {
                                       const int k = static_cast<int>(std::floor(t / (2 * kPi) * 10)) % 10;
                                       return (k % 2 ? -1.0 : 1.0) * (k % 4 < 2 ? 2.0 : 1.0);
                                     }),
                                     0.05);
  CHECK(uneven.size() == 10);
}
