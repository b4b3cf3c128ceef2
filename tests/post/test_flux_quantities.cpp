// d-q components and back-EMF from phase flux linkages: exactness on band-limited signals,
// balanced sets in d-q, and the second-order fallback for sequences that are not one period.

#include <doctest/doctest.h>

#include <cmath>
#include <numbers>

#include "post/flux_quantities.hpp"
#include "solver/supply.hpp"
#include "support/convergence.hpp"

using namespace tf;

namespace {

constexpr double kPi = std::numbers::pi;

/// A balanced m-phase set: x_k = amplitude cos(angle - k delta), delta = solver::phase_shift(m).
Eigen::VectorXd balanced_set(int m, double amplitude, double angle) {
  Eigen::VectorXd x(m);
  for (int k = 0; k < m; ++k) x(k) = amplitude * std::cos(angle - k * solver::phase_shift(m));
  return x;
}

}  // namespace

TEST_CASE("Park transform: a balanced set aligned with d gives constant d and zero q, for 2, 3 and 5 phases") {
  // The amplitude-invariant transform (R. H. Park, AIEE Trans. 48, 1929, from memory) maps a balanced set of
  // amplitude X whose vector lies on the d axis to d = X, q = 0 at every rotor angle.
  for (int m : {2, 3, 5}) {
    for (double theta : {0.0, 0.4, 1.3, 2.9, 5.5}) {
      const post::DqPair dq = post::park_transform(balanced_set(m, 0.8, theta), theta);
      CHECK(dq.d == doctest::Approx(0.8).epsilon(1e-12).scale(0));
      CHECK(std::abs(dq.q) < 1e-12);
    }
  }
}

TEST_CASE("Park transform: q leads d by 90° electrical, and the inverse restores the phases") {
  const double gamma = 0.7, theta = 2.1;
  for (int m : {2, 3, 4, 6}) {
    const Eigen::VectorXd x = balanced_set(m, 1.5, theta + gamma);
    const post::DqPair dq = post::park_transform(x, theta);
    CHECK(dq.d == doctest::Approx(1.5 * std::cos(gamma)).epsilon(1e-12).scale(0));
    CHECK(dq.q == doctest::Approx(1.5 * std::sin(gamma)).epsilon(1e-12).scale(0));
    CHECK((post::inverse_park_transform(dq, m, theta) - x).cwiseAbs().maxCoeff() < 1e-12);
  }
  // A zero-sequence part (equal values in all three phases) does not reach d or q.
  const post::DqPair zero = post::park_transform(Eigen::VectorXd::Constant(3, 2.0), 0.9);
  CHECK(std::abs(zero.d) < 1e-12);
  CHECK(std::abs(zero.q) < 1e-12);
}

TEST_CASE("back-EMF of psi = Psi cos(p theta): amplitude speed p Psi, lagging psi by 90° electrical") {
  // e = -dpsi/dt = -speed dpsi/dtheta = speed p Psi sin(p theta) (Faraday's law).
  const int p = 2, n = 24;
  const double psi_peak = 0.05, speed = 150.0, period = 2 * kPi / p;
  Eigen::VectorXd psi(n), expected(n);
  for (int j = 0; j < n; ++j) {
    const double theta = period * j / n;
    psi(j) = psi_peak * std::cos(p * theta);
    expected(j) = speed * p * psi_peak * std::sin(p * theta);
  }
  const Eigen::VectorXd e = post::back_emf_periodic(psi, period, speed);
  CHECK((e - expected).cwiseAbs().maxCoeff() < 1e-10 * speed * p * psi_peak);
  CHECK(e.maxCoeff() == doctest::Approx(speed * p * psi_peak).epsilon(1e-12).scale(0));  // sample at p theta = 90°
}

TEST_CASE("back-EMF: a 5th harmonic is differentiated exactly by the spectral route, and the central differences are second order") {
  const int p = 3;
  const double speed = 100.0, period = 2 * kPi / p, phase5 = 0.3;
  auto psi_at = [&](double th) { return 0.04 * std::cos(p * th) + 0.006 * std::cos(5 * p * th + phase5); };
  auto emf_at = [&](double th) {
    return speed * (0.04 * p * std::sin(p * th) + 0.006 * 5 * p * std::sin(5 * p * th + phase5));
  };
  std::vector<double> errors;
  for (int n : {24, 48, 96}) {
    Eigen::VectorXd psi(n), expected(n);
    for (int j = 0; j < n; ++j) {
      psi(j) = psi_at(period * j / n);
      expected(j) = emf_at(period * j / n);
    }
    CHECK((post::back_emf_periodic(psi, period, speed) - expected).cwiseAbs().maxCoeff() < 1e-10 * expected.cwiseAbs().maxCoeff());
    // The fallback on the same samples as an open sequence (its ends one-sided).
    errors.push_back((post::back_emf_sampled(psi, period / n, speed) - expected).cwiseAbs().maxCoeff());
    MESSAGE(n << " samples: central-difference error " << errors.back() << " V");
  }
  // O(h^2): fourfold per halving of the step (rate 2); asked: 3.5-fold.
  for (double rate : testing::convergence_rates(errors)) CHECK(rate > std::log2(3.5));
}
