// B-H curve: monotone cubic interpolation of H(B), reluctivity and its derivative, energy densities,
// table checks, and the sampled arctan law of docs/references.md §5.

#include <doctest/doctest.h>

#include <algorithm>
#include <cmath>
#include <numbers>
#include <stdexcept>

#include "solver/bh_curve.hpp"

using namespace tf;

namespace {

constexpr double kMu0 = 4e-7 * std::numbers::pi;

// A table with a sharp knee: the secant dH/dB jumps from 1e3 to 4.85e4 A/(m T) at B = 1.6 T.
const std::vector<double> kneeH{0, 100, 200, 300, 10000, 20000};
const std::vector<double> kneeB{0, 1.0, 1.5, 1.6, 1.8, 1.82};

double arctan_law(double h, double js, double mu_ri) {
  return kMu0 * h + 2 * js / std::numbers::pi * std::atan(std::numbers::pi * (mu_ri - 1) * kMu0 * h / (2 * js));
}

}  // namespace

TEST_CASE("B-H curve: passes through the table points and its inverse agrees") {
  const solver::BhCurve c(kneeH, kneeB);
  for (std::size_t i = 1; i < kneeH.size(); ++i) {
    CHECK(c.h_of_b(kneeB[i]) == doctest::Approx(kneeH[i]).epsilon(1e-12).scale(0));
    CHECK(c.b_of_h(kneeH[i]) == doctest::Approx(kneeB[i]).epsilon(1e-12).scale(0));
  }
  for (double b : {0.3, 1.23, 1.55, 1.7, 1.81, 2.5}) CHECK(c.b_of_h(c.h_of_b(b)) == doctest::Approx(b).epsilon(1e-12).scale(0));
  CHECK(c.h_of_b(-1.7) == doctest::Approx(-c.h_of_b(1.7)).epsilon(1e-15).scale(0));
}

TEST_CASE("B-H curve: monotone between the points where an unlimited cubic overshoots (Fritsch-Carlson 1980)") {
  // The cubic Hermite through (1.5, 200) and (1.6, 300) with the three-point slopes 866.7 and
  // 16833 A/(m T) (the unlimited starting point of Fritsch and Carlson) dips below 200 A/m:
  const double dx = 0.1, s0 = (0.1 * 200 + 0.5 * 1000) / 0.6, s1 = (0.2 * 1000 + 0.1 * 48500) / 0.3;
  double unlimited_min = 1e300;
  for (int i = 1; i < 100; ++i) {
    const double t = i / 100.0;
    const double h = (2 * t * t * t - 3 * t * t + 1) * 200 + (t * t * t - 2 * t * t + t) * dx * s0 +
                     (-2 * t * t * t + 3 * t * t) * 300 + (t * t * t - t * t) * dx * s1;
    unlimited_min = std::min(unlimited_min, h);
  }
  CHECK(unlimited_min < 190.0);

  const solver::BhCurve c(kneeH, kneeB);
  double previous = -1.0;
  int n_decreasing = 0, n_outside = 0;
  for (int i = 0; i <= 18200; ++i) {
    const double b = 1e-4 * i, h = c.h_of_b(b);
    if (h < previous) ++n_decreasing;
    const auto k = static_cast<std::size_t>(std::upper_bound(kneeB.begin(), kneeB.end(), b) - kneeB.begin()) - 1;
    if (k + 1 < kneeB.size() && (h < kneeH[k] - 1e-9 || h > kneeH[k + 1] + 1e-9)) ++n_outside;
    previous = h;
  }
  CHECK(n_decreasing == 0);
  CHECK(n_outside == 0);
}

TEST_CASE("B-H curve: beyond the last point H grows with the slope of free space") {
  const solver::BhCurve c(kneeH, kneeB);
  CHECK((c.h_of_b(2.3) - c.h_of_b(2.0)) / 0.3 == doctest::Approx(1 / kMu0).epsilon(1e-10).scale(0));
  CHECK((c.b_of_h(1e6) - c.b_of_h(5e5)) / 5e5 == doctest::Approx(kMu0).epsilon(1e-10).scale(0));
}

TEST_CASE("B-H curve: reluctivity positive and finite at B = 0, derivative matches a finite difference") {
  const solver::BhCurve c(kneeH, kneeB);
  const double nu0 = c.reluctivity(0.0).nu;
  CHECK(nu0 > 0);
  CHECK(std::isfinite(nu0));
  CHECK(nu0 == doctest::Approx(c.h_of_b(1e-9) / 1e-9).epsilon(1e-6).scale(0));  // the initial slope
  for (double b : {0.05, 0.4, 1.2, 1.52, 1.65, 1.79, 1.9, 3.0}) {
    const auto r = c.reluctivity(b * b);
    CHECK(r.nu > 0);
    CHECK(r.nu == doctest::Approx(c.h_of_b(b) / b).epsilon(1e-12).scale(0));
    const double e = 1e-6 * b * b;  // central difference in B^2, inside one cubic piece
    const double fd = (c.reluctivity(b * b + e).nu - c.reluctivity(b * b - e).nu) / (2 * e);
    CHECK(r.dnu_db2 == doctest::Approx(fd).epsilon(1e-5).scale(0));
  }
}

TEST_CASE("B-H curve: energy is the integral of H dB, and energy + co-energy = B H") {
  const solver::BhCurve c(kneeH, kneeB);
  for (double b : {0.7, 1.58, 1.75, 2.4}) {
    // Composite Simpson rule with 20000 panels as an independent quadrature of H dB.
    const int n = 20000;
    double sum = c.h_of_b(0) + c.h_of_b(b);
    for (int i = 1; i < n; ++i) sum += (i % 2 ? 4 : 2) * c.h_of_b(b * i / n);
    CHECK(c.energy_density(b) == doctest::Approx(sum * b / (3 * n)).epsilon(1e-7).scale(0));
    CHECK(c.energy_density(b) + c.coenergy_density(b) == doctest::Approx(b * c.h_of_b(b)).epsilon(1e-12).scale(0));
    CHECK(c.energy_density(-b) == doctest::Approx(c.energy_density(b)).epsilon(1e-15).scale(0));
  }
}

TEST_CASE("B-H curve: stacking factor mixes the iron with free space at every table point") {
  const double k = 0.95;
  const solver::BhCurve c(kneeH, kneeB, k);
  for (std::size_t i = 1; i < kneeH.size(); ++i)
    CHECK(c.b_of_h(kneeH[i]) == doctest::Approx(k * kneeB[i] + (1 - k) * kMu0 * kneeH[i]).epsilon(1e-12).scale(0));
  CHECK_THROWS_AS(solver::BhCurve(kneeH, kneeB, 0.0), std::invalid_argument);
  CHECK_THROWS_AS(solver::BhCurve(kneeH, kneeB, 1.2), std::invalid_argument);
}

TEST_CASE("B-H curve: a table without (0, 0) gets it; bad tables are named by their 1-based point") {
  const solver::BhCurve c({100, 200, 300}, {1.0, 1.5, 1.6});
  CHECK(c.table_h().size() == 4);
  CHECK(c.h_of_b(0.0) == 0.0);
  CHECK(c.b_of_h(100) == doctest::Approx(1.0).epsilon(1e-12).scale(0));

  CHECK_FALSE(solver::BhCurve::table_problem(kneeH, kneeB).has_value());
  const auto short_table = solver::BhCurve::table_problem({0, 100}, {0, 1});
  REQUIRE(short_table.has_value());
  CHECK(short_table->find("at least 3") != std::string::npos);
  const auto not_monotone = solver::BhCurve::table_problem({0, 100, 200, 300}, {0, 1.0, 1.5, 1.4});
  REQUIRE(not_monotone.has_value());
  CHECK(not_monotone->find("point 4") != std::string::npos);
  const auto h_repeats = solver::BhCurve::table_problem({0, 100, 100, 300}, {0, 1.0, 1.5, 1.6});
  REQUIRE(h_repeats.has_value());
  CHECK(h_repeats->find("point 3") != std::string::npos);
  const auto below_mu0 = solver::BhCurve::table_problem({0, 100, 2e6}, {0, 1.0, 1.5});
  REQUIRE(below_mu0.has_value());
  CHECK(below_mu0->find("point 3") != std::string::npos);
  CHECK(solver::BhCurve::table_problem({0, 100, 200}, {0.1, 1.0, 1.5}).has_value());
  CHECK_THROWS_AS(solver::BhCurve({0, 100, 200, 300}, {0, 1.0, 1.5, 1.4}), std::invalid_argument);
}

TEST_CASE("sampled arctan law (docs/references.md §5): interpolation within 0.05 % of the law from 1 A/m to 1e6 A/m") {
  const double js = 2.0, mu_ri = 5000.0;
  const solver::BhCurve c = solver::sampled_arctan_law(js, mu_ri, 150, 1e6);
  double worst = 0.0;
  for (int i = 0; i <= 6000; ++i) {
    const double h = std::pow(10.0, i / 1000.0);  // 6000 points, between and on the table points
    worst = std::max(worst, std::abs(c.b_of_h(h) / arctan_law(h, js, mu_ri) - 1));
  }
  MESSAGE("largest relative error of the sampled law: " << worst);
  CHECK(worst < 5e-4);
  // docs/references.md §5 (derived from Ampère's law): H = 100 A / (2 pi 20 mm) gives B = 1.683459 T.
  CHECK(c.b_of_h(100 / (2 * std::numbers::pi * 0.02)) == doctest::Approx(1.683459).epsilon(5e-4).scale(0));
}
