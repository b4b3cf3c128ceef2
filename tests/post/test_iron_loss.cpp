// Iron loss by the per-harmonic, per-component Steinmetz-type rule (C. P. Steinmetz, "On the law of
// hysteresis", AIEE Trans. 9, 1892, from memory, for the hysteresis term; the classical eddy term and the
// summation over harmonics and components are common engineering practice). The coefficients are
// invented, of the order of a 0.35 mm non-oriented steel.

#include <doctest/doctest.h>

#include <cmath>
#include <functional>
#include <numbers>

#include "post/iron_loss.hpp"
#include "solver/coefficients.hpp"
#include "support/polar_mesh.hpp"

using namespace tf;

namespace {

constexpr double kPi = std::numbers::pi;
const solver::IronLossData kSteel{0.02, 1.9, 6e-5, 7650.0, "invented"};

/// The formula for one sinusoid of amplitude b [T] at frequency f [Hz], in W/kg.
double steinmetz(const solver::IronLossData& c, double b, double f) {
  return c.hysteresis * f * std::pow(b, c.exponent) + c.eddy * f * f * b * b;
}

Eigen::VectorXd samples(int k_steps, const std::function<double(double)>& of_phase) {
  Eigen::VectorXd s(k_steps);
  for (int k = 0; k < k_steps; ++k) s(k) = of_phase(2 * kPi * k / k_steps);
  return s;
}

mesh::Mesh small_machine() {
  return testing::polar_mesh(0.0,
                             {{0.02, 2, mesh::RegionKind::rotor_iron, "rotor"},
                              {0.025, 1, mesh::RegionKind::gap, "gap"},
                              {0.04, 2, mesh::RegionKind::stator_iron, "stator"}},
                             12);
}

}  // namespace

TEST_CASE("iron loss of a pure sinusoid is the Steinmetz formula; a DC field loses nothing") {
  const double f = 50.0;
  for (double b : {0.3, 1.2, 1.7}) {
    const Eigen::VectorXd s = samples(16, [&](double wt) { return b * std::cos(wt + 0.4); });
    CHECK(post::specific_loss(kSteel, s, f) == doctest::Approx(steinmetz(kSteel, b, f)).epsilon(1e-12).scale(0));
  }
  // Each harmonic at its own frequency n f, the mean ignored: 1.2 T DC + 1.0 T at f + 0.2 T at 3 f.
  const Eigen::VectorXd mixed =
      samples(24, [](double wt) { return 1.2 + std::cos(wt) + 0.2 * std::sin(3 * wt + 1.0); });
  CHECK(post::specific_loss(kSteel, mixed, f) ==
        doctest::Approx(steinmetz(kSteel, 1.0, f) + steinmetz(kSteel, 0.2, 3 * f)).epsilon(1e-12).scale(0));
  // A constant field: only the rounding of the transform remains (about 1e-16 T per harmonic).
  CHECK(std::abs(post::specific_loss(kSteel, Eigen::VectorXd::Constant(16, 1.5), f)) < 1e-20);
  // The Nyquist term (n = K/2) alternates +-B at the samples: amplitude B, not 2B.
  const Eigen::VectorXd nyquist = samples(8, [](double wt) { return 0.5 * std::cos(4 * wt); });
  CHECK(post::specific_loss(kSteel, nyquist, f) == doctest::Approx(steinmetz(kSteel, 0.5, 4 * f)).epsilon(1e-12).scale(0));
}

TEST_CASE("iron loss: a rotating field loses twice one alternating component; totals add up by region") {
  const mesh::Mesh m = small_machine();
  const int k_steps = 20;
  const double f = 60.0, stack = 0.08;
  post::FluxHistory b{Eigen::MatrixXd(m.n_triangles(), k_steps), Eigen::MatrixXd(m.n_triangles(), k_steps), f};
  post::FluxHistory alternating = b;
  for (int t = 0; t < m.n_triangles(); ++t) {
    const double amplitude = 0.5 + 0.01 * t;  // differs per triangle, so the sums are not trivial
    for (int k = 0; k < k_steps; ++k) {
      const double wt = 2 * kPi * k / k_steps + 0.1 * t;
      b.bx(t, k) = amplitude * std::cos(wt);
      b.by(t, k) = amplitude * std::sin(wt);
      alternating.bx(t, k) = b.bx(t, k);
      alternating.by(t, k) = 0.0;
    }
  }
  // The rotor's steel in rotor iron, another steel in the stator's, none in the gap.
  solver::Materials mat;
  mat.rotor_iron_loss = kSteel;
  mat.stator_iron_loss = solver::IronLossData{0.03, 1.8, 5e-5, 7600.0, "invented"};
  const std::vector<solver::IronLossData> per_region = solver::region_coefficients(m, mat).iron_loss;
  REQUIRE(per_region[0].hysteresis == kSteel.hysteresis);
  REQUIRE(per_region[2].hysteresis == 0.03);
  const post::IronLoss rotating = post::iron_loss(m, b, per_region, stack);
  const post::IronLoss single = post::iron_loss(m, alternating, per_region, stack);

  double sum[3] = {0.0, 0.0, 0.0};
  for (int t = 0; t < m.n_triangles(); ++t) {
    const int r = m.triangle_region(t);
    const double amplitude = 0.5 + 0.01 * t;
    if (r == 1) {
      CHECK(rotating.density(t) == 0.0);  // the gap has no coefficients
    } else {
      const double expected = per_region[r].density * 2 * steinmetz(per_region[r], amplitude, f);
      CHECK(rotating.density(t) == doctest::Approx(expected).epsilon(1e-12).scale(0));
      CHECK(rotating.density(t) == doctest::Approx(2 * single.density(t)).epsilon(1e-12).scale(0));
    }
    sum[r] += rotating.density(t) * mesh::triangle_area(m, t) * stack;
  }
  CHECK(rotating.region_loss[1] == 0.0);
  for (int r : {0, 2}) {
    CHECK(rotating.region_loss[r] > 0.0);
    CHECK(rotating.region_loss[r] == doctest::Approx(sum[r]).epsilon(1e-12).scale(0));
  }
  CHECK(rotating.total == doctest::Approx(sum[0] + sum[2]).epsilon(1e-12).scale(0));
}
