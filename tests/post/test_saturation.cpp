// Saturation honesty (post/saturation.hpp): the area fraction of a region above 2 T and an
// area-weighted percentile of |B|, on a structured ring whose triangles' areas are known exactly,
// and which regions the check watches.

#include <doctest/doctest.h>

#include <cmath>
#include <numbers>

#include "post/saturation.hpp"
#include "solver/materials.hpp"
#include "support/polar_mesh.hpp"

using namespace tf;

namespace {

constexpr int kTheta = 40, kRings = 4;

/// A ring 10 .. 20 mm (4 element layers, 40 nodes round) named rotor_iron inside a thin air ring.
mesh::Mesh ring_mesh() {
  return testing::polar_mesh(0.010, {{0.020, kRings, mesh::RegionKind::rotor_iron, "rotor_iron"},
                                     {0.021, 1, mesh::RegionKind::gap, "gap"}},
                             kTheta);
}

/// Angular column (0 .. kTheta-1) and ring (0 .. kRings-1) of a triangle, from its centroid.
std::pair<int, int> column_and_ring(const mesh::Mesh& m, int t) {
  Eigen::Vector2d c = Eigen::Vector2d::Zero();
  for (int k = 0; k < 3; ++k) c += m.nodes.row(m.triangles(t, k)).transpose() / 3.0;
  double angle = std::atan2(c.y(), c.x());
  if (angle < 0) angle += 2 * std::numbers::pi;
  const int column = static_cast<int>(angle / (2 * std::numbers::pi / kTheta));
  const int ring = static_cast<int>((c.norm() - 0.010) / 0.0025);
  return {column, ring};
}

/// |B| = 3 T in the first quarter of the columns, 1.0 + 0.1 ring elsewhere; the air at 0.5 T.
Eigen::VectorXd quarter_saturated(const mesh::Mesh& m) {
  Eigen::VectorXd b(m.n_triangles());
  for (int t = 0; t < m.n_triangles(); ++t) {
    if (m.triangle_region(t) != 0) {
      b(t) = 0.5;
      continue;
    }
    const auto [column, ring] = column_and_ring(m, t);
    b(t) = column < kTheta / 4 ? 3.0 : 1.0 + 0.1 * ring;
  }
  return b;
}

}  // namespace

TEST_CASE("a quarter of a ring above 2 T is 25 % of its area, and the percentile weighs triangles by area") {
  const mesh::Mesh m = ring_mesh();
  const Eigen::VectorXd b = quarter_saturated(m);
  // Exact: every angular column of a ring of equal polygons holds the same area, so 10 of 40
  // columns are a quarter of it; the air region's triangles are not counted.
  CHECK(post::area_fraction_above(m, b, 0, 2.0) == doctest::Approx(0.25).epsilon(1e-12).scale(0));
  CHECK(post::area_fraction_above(m, b, 1, 2.0) == 0.0);
  // Ring k between polygons of radii r_k and r_k+1 holds an area proportional to r_k+1^2 - r_k^2:
  // 0.1875, 0.2292, 0.2708, 0.3125 of the whole (plane geometry). Below 3 T lie three quarters of
  // each: 1.0 T on 14.06 %, 1.1 T up to 31.25 %, 1.2 T up to 51.56 %. So the 35th area percentile
  // is 1.2 T; by triangle count (each ring a quarter of the triangles) it would be 1.1 T.
  CHECK(post::area_percentile(m, b, 0, 0.35) == doctest::Approx(1.2).epsilon(1e-12).scale(0));
  CHECK(post::area_percentile(m, b, 0, 0.30) == doctest::Approx(1.1).epsilon(1e-12).scale(0));
  CHECK(post::area_percentile(m, b, 0, 0.99) == doctest::Approx(3.0).epsilon(1e-12).scale(0));
  CHECK(post::area_percentile(m, b, 1, 0.99) == doctest::Approx(0.5).epsilon(1e-12).scale(0));
}

TEST_CASE("the watch warns for a region above 2 T over more than 1 % of its area, naming region, share and step") {
  const mesh::Mesh m = ring_mesh();
  post::SaturationWatch watch(m, {true, false});
  Eigen::VectorXd calm = Eigen::VectorXd::Constant(m.n_triangles(), 1.5);
  watch.add_step(calm, "step 0");
  watch.add_step(quarter_saturated(m), "step 1");
  watch.add_step(calm, "step 2");
  REQUIRE(watch.worst().size() == 1);
  CHECK(watch.worst()[0].when == "step 1");
  const auto w = watch.warnings("all 3 steps");
  REQUIRE(w.size() == 1);
  CHECK(w[0].find("rotor_iron: 25 % of its area above 2 T in linear iron") == 0);
  CHECK(w[0].find("up to 3 T at the 99th percentile, step 1; all 3 steps checked") != std::string::npos);
  CHECK(w[0].find("B-H curve") != std::string::npos);
}

TEST_CASE("single corner triangles at 15 T (under 1 % of the area) are no warning") {
  const mesh::Mesh m = ring_mesh();
  // Two of the 320 iron triangles, both in the innermost ring: 2/80 of its 18.75 % of the area,
  // 0.47 % of the region, under the 1 % (common practice for "more than a corner").
  Eigen::VectorXd b = Eigen::VectorXd::Constant(m.n_triangles(), 1.2);
  int marked = 0;
  for (int t = 0; t < m.n_triangles() && marked < 2; ++t)
    if (column_and_ring(m, t).second == 0) b(t) = 15.0, ++marked;
  post::SaturationWatch watch(m, {true, false});
  watch.add_step(b, "step 0");
  CHECK(watch.worst()[0].fraction_above == doctest::Approx(2.0 / 80 * 0.1875).epsilon(1e-9).scale(0));
  CHECK(watch.warnings("all steps").empty());
}

TEST_CASE("only iron with a constant permeability is watched: not iron with a B-H curve, not magnets or air") {
  const mesh::Mesh m = ring_mesh();
  solver::RegionCoefficients k;
  const auto nu = [](double mu_r) { return 1.0 / (solver::kMu0 * mu_r); };
  k.nu = {nu(3000.0), nu(3000.0), nu(1.05), nu(1.0)};
  k.curve = {std::nullopt, solver::BhCurve({0.0, 100.0, 1000.0, 10000.0}, {0.0, 1.0, 1.6, 1.9}, 1.0), std::nullopt,
             std::nullopt};
  CHECK(post::linear_iron_regions(k) == std::vector<bool>{true, false, false, false});
  // Nothing watched: the study need not feed any step.
  CHECK(post::SaturationWatch(m, {false, false}).idle());
}
