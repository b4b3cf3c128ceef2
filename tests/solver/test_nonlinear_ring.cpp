// Nonlinear iron ring round a line current: Ampère's law gives H_theta = I/(2 pi r) whatever the
// material, so B(r) = B(H(r)) and the flux per metre is the integral of B over the ring's width
// (docs/references.md §5, derived). Also: Newton's convergence from a = 0.

#include <doctest/doctest.h>

#include <cmath>
#include <numbers>
#include <sstream>
#include <string>

#include "solver/assemble.hpp"
#include "solver/bh_curve.hpp"
#include "solver/dofs.hpp"
#include "solver/nonlinear.hpp"
#include "solver/p1.hpp"
#include "support/polar_mesh.hpp"

using namespace tf;

namespace {

constexpr double kMu0 = 4e-7 * std::numbers::pi;

struct LayerField {
  double radius;  ///< area-weighted mean centroid radius [m]
  double b;       ///< area-weighted mean |B| [T]
};

// Mean over the triangles whose centroid lies between r_lo and r_hi (one layer of the polar mesh).
LayerField layer_field(const mesh::Mesh& m, const Eigen::VectorXd& a_nodes, double r_lo, double r_hi) {
  double area = 0, r_sum = 0, b_sum = 0;
  for (int t = 0; t < m.n_triangles(); ++t) {
    solver::TriangleXY xy;
    Eigen::Vector3d at;
    for (int i = 0; i < 3; ++i) {
      xy.row(i) = m.nodes.row(m.triangles(t, i));
      at(i) = a_nodes(m.triangles(t, i));
    }
    const double r = xy.colwise().mean().norm();
    if (r < r_lo || r > r_hi) continue;
    const double w = mesh::triangle_area(m, t);
    area += w;
    r_sum += w * r;
    b_sum += w * solver::p1_flux_density(xy, at).norm();
  }
  return {r_sum / area, b_sum / area};
}

// Linear extrapolation to radius r0 from the two element layers next to it.
double b_at(const LayerField& near, const LayerField& far, double r0) {
  return near.b + (far.b - near.b) * (r0 - near.radius) / (far.radius - near.radius);
}

double ring_mean(const mesh::Mesh& m, const Eigen::VectorXd& a_nodes, double r) {
  double sum = 0;
  int n = 0;
  for (int node = 0; node < m.n_nodes(); ++node)
    if (std::abs(m.nodes.row(node).norm() - r) < 1e-9) sum += a_nodes(node), ++n;
  REQUIRE(n > 0);
  return sum / n;
}

struct RingResult {
  double b_inner, b_outer, flux;
  solver::NewtonReport report;
};

/// watch_flux: Newton may also stop once the ring's flux (over flux_scale [Wb/m]) settled.
RingResult solve_ring(double current, const solver::BhCurve& iron, double flux_scale = 0.0) {
  const double dr = 0.25e-3;  // 80 element layers across the 20 mm ring
  const mesh::Mesh m = testing::polar_mesh(0.0, {{0.005, 6, mesh::RegionKind::coil, "copper"},
                                                 {0.020, 15, mesh::RegionKind::gap, "air"},
                                                 {0.040, 80, mesh::RegionKind::stator_iron, "iron"},
                                                 {0.060, 20, mesh::RegionKind::outer_air, "outer air"}}, 128);
  const solver::DofMap d = solver::number_dofs(m);
  const std::vector<solver::RegionLaw> laws{{1 / kMu0, nullptr}, {1 / kMu0, nullptr}, {0, &iron}, {1 / kMu0, nullptr}};
  solver::NonlinearSolver s(m, d, laws);
  const Eigen::VectorXd f = solver::region_current_load(m, d, {current / mesh::region_areas(m)[0], 0, 0, 0});
  Eigen::VectorXd a = Eigen::VectorXd::Zero(d.n_dofs);
  solver::QuantityWatch watch;
  if (flux_scale > 0.0)
    watch = [&](const Eigen::VectorXd& x) {
      const Eigen::VectorXd nodal = solver::to_nodes(d, x);
      return Eigen::VectorXd::Constant(1, (ring_mean(m, nodal, 0.020) - ring_mean(m, nodal, 0.040)) / flux_scale);
    };
  RingResult out{0, 0, 0, s.solve(f, a, watch)};
  const Eigen::VectorXd nodal = solver::to_nodes(d, a);
  out.b_inner = b_at(layer_field(m, nodal, 0.020, 0.020 + dr), layer_field(m, nodal, 0.020 + dr, 0.020 + 2 * dr), 0.020);
  out.b_outer = b_at(layer_field(m, nodal, 0.040 - dr, 0.040), layer_field(m, nodal, 0.040 - 2 * dr, 0.040 - dr), 0.040);
  out.flux = ring_mean(m, nodal, 0.020) - ring_mean(m, nodal, 0.040);  // B_theta = -dA/dr
  return out;
}

std::string history(const solver::NewtonReport& r) {
  std::ostringstream s;
  s.precision(3);
  for (std::size_t k = 0; k < r.residuals.size(); ++k) {
    s << " " << r.residuals[k];
    if (k < r.step_lengths.size()) s << " [step " << r.step_lengths[k] << "]";
  }
  return s.str();
}

void check_newton(const solver::NewtonReport& r) {
  REQUIRE(r.converged);
  CHECK(r.iterations <= 15);
  // Quadratic convergence near the end (Newton with the consistent Jacobian): over the last two
  // steps the residual falls at least as fast as the square of the previous one, relative to the
  // first residual, with a generous constant 100.
  const std::size_t n = r.residuals.size();
  REQUIRE(n >= 4);
  const double r0 = r.residuals[0];
  for (std::size_t k = n - 3; k + 1 < n; ++k) {
    const double now = r.residuals[k] / r0, next = r.residuals[k + 1] / r0;
    INFO("step " << k << ": relative residual " << now << " -> " << next);
    CHECK(next <= 100 * now * now + 1e-13);
  }
  CHECK(r.step_lengths.back() == 1.0);
}

}  // namespace

TEST_CASE("nonlinear ring round a line current, I = 100 A: B and flux against Ampère's law (docs/references.md §5)") {
  const solver::BhCurve iron = solver::sampled_arctan_law(2.0, 5000.0, 150, 1e6);
  const RingResult r = solve_ring(100.0, iron);
  MESSAGE("iterations " << r.report.iterations << ", residuals" << history(r.report));
  MESSAGE("B(20 mm) " << r.b_inner << " T, B(40 mm) " << r.b_outer << " T, flux " << r.flux << " Wb/m");
  check_newton(r.report);
  CHECK(r.b_inner == doctest::Approx(1.683459).epsilon(0.002).scale(0));
  CHECK(r.b_outer == doctest::Approx(1.400629).epsilon(0.002).scale(0));
  CHECK(r.flux == doctest::Approx(3.076065e-2).epsilon(0.002).scale(0));
}

TEST_CASE("nonlinear ring round a line current, I = 10000 A: deep saturation (docs/references.md §5)") {
  const solver::BhCurve iron = solver::sampled_arctan_law(2.0, 5000.0, 150, 1e6);
  const RingResult r = solve_ring(10000.0, iron);
  MESSAGE("iterations " << r.report.iterations << ", residuals" << history(r.report));
  MESSAGE("B(20 mm) " << r.b_inner << " T, B(40 mm) " << r.b_outer << " T, flux " << r.flux << " Wb/m");
  check_newton(r.report);
  CHECK(r.b_inner == doctest::Approx(2.096757).epsilon(0.002).scale(0));
  CHECK(r.b_outer == doctest::Approx(2.043514).epsilon(0.002).scale(0));
  CHECK(r.flux == doctest::Approx(4.128901e-2).epsilon(0.002).scale(0));
}

TEST_CASE("Newton stopping on the reported quantity: fewer iterations, the flux within the stated tolerance") {
  // The flux of the deeply saturated ring (docs/references.md §5, Ampère's law) watched: Newton stops
  // once a step moved it by at most 1e-4 of its scale (solver::NewtonControls::quantity_tolerance).
  const solver::BhCurve iron = solver::sampled_arctan_law(2.0, 5000.0, 150, 1e6);
  const RingResult full = solve_ring(10000.0, iron);
  const RingResult watched = solve_ring(10000.0, iron, 4.128901e-2);
  MESSAGE("iterations " << watched.report.iterations << " against " << full.report.iterations << "; flux "
                        << watched.flux << " against " << full.flux << " Wb/m");
  REQUIRE(watched.report.converged);
  CHECK(watched.report.iterations < full.report.iterations);
  // Newton converges at least linearly here, so the error is below the last step's change.
  CHECK(std::abs(watched.flux / full.flux - 1) < 1e-4);
  CHECK(watched.flux == doctest::Approx(4.128901e-2).epsilon(0.002).scale(0));
}
